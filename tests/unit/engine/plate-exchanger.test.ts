import { describe, expect, it } from "vitest";
import {
  balancedCounterflowApproachK,
  calibratePlateExchangerUaKWPerK,
  plateExchangerApproachK,
} from "@/lib/engine/plate-exchanger";

// Capacity rate of 72 kg/s of water at cpw 4.186 kJ/(kg·K): 301.392 kW/K.
const C = 72 * 4.186;

/**
 * Independent check by the log-mean temperature difference method (Incropera & DeWitt, Fundamentals of
 * Heat and Mass Transfer, ch. 11, counterflow: Q = UA·ΔTlm, ΔTlm = (ΔT1 − ΔT2)/ln(ΔT1/ΔT2), ΔT1 at the hot
 * inlet end, ΔT2 at the hot outlet end). The engine uses ε-NTU; this test uses terminal temperatures only.
 */
function uaByLmtd(heatKW: number, approachK: number, hotKWPerK: number, coldKWPerK: number): number {
  const towerWaterInC = 20;
  const cleanLoopOutC = towerWaterInC + approachK; // hot outlet
  const cleanLoopInC = cleanLoopOutC + heatKW / hotKWPerK; // hot inlet
  const towerWaterOutC = towerWaterInC + heatKW / coldKWPerK; // cold outlet
  const dt1 = cleanLoopInC - towerWaterOutC;
  const dt2 = cleanLoopOutC - towerWaterInC;
  const lmtd = Math.abs(dt1 - dt2) < 1e-12 ? dt1 : (dt1 - dt2) / Math.log(dt1 / dt2);
  return heatKW / lmtd;
}

describe("plate exchanger approach", () => {
  // Hand calculation: balanced counterflow (equal capacity rates) has the same temperature difference
  // all along the plates, so ΔTlm = approach and UA = Q/approach = 1500/1.5 = 1000 kW/K.
  // With the range R = 1500/301.392 = 4.976907 K, ε = R/(R + approach) = 0.768408 and the formula
  // R·(1 − ε)/ε gives back 1.5 K.
  it("balanced flows: UA = Q/approach = 1000 kW/K (hand calculation) and the formula R·(1 − ε)/ε", () => {
    const ua = calibratePlateExchangerUaKWPerK(1500, 1.5, C, C);
    expect(ua).toBeCloseTo(1000, 6);
    expect(plateExchangerApproachK(1500, 1000, C, C)).toBeCloseTo(1.5, 9);
    expect(balancedCounterflowApproachK(4.976907, 0.768408)).toBeCloseTo(1.5, 4);
  });

  // Hand calculation: balanced counterflow with UA fixed at 1000 kW/K: approach = Q/UA, so 750 kW → 0.75 K.
  it("with constant flows the approach is proportional to the load (750 kW → 0.75 K)", () => {
    expect(plateExchangerApproachK(750, 1000, C, C)).toBeCloseTo(0.75, 9);
  });

  // Unequal flows, the clean loop (hot side) at 0.8·C = 241.114 kW/K, tower water 301.392 kW/K, 1500 kW,
  // approach 1.5 K, tower water entering at 20 °C: clean loop 21.5 → 27.7211 °C, tower water
  // 20 → 24.9769 °C; ΔT1 = 27.7211 − 24.9769 = 2.7442 K, ΔT2 = 1.5 K, ΔTlm = 1.2442/ln(1.82948) = 1.2442/0.60403 = 2.0599 K,
  // UA = 1500/2.0599 = 728.2 kW/K.
  it("unequal flows (hot side = clean loop) agree with the LMTD method", () => {
    const ua = calibratePlateExchangerUaKWPerK(1500, 1.5, 0.8 * C, C);
    expect(ua / uaByLmtd(1500, 1.5, 0.8 * C, C)).toBeCloseTo(1, 9);
    expect(Math.abs(ua - 728.2)).toBeLessThan(0.1);
    expect(plateExchangerApproachK(1500, ua, 0.8 * C, C)).toBeCloseTo(1.5, 9);
    // And a tower-water side smaller than the clean loop (approach 4 K: 2 K would cross the temperatures).
    const ua2 = calibratePlateExchangerUaKWPerK(1500, 4, C, 0.7 * C);
    expect(ua2 / uaByLmtd(1500, 4, C, 0.7 * C)).toBeCloseTo(1, 9);
  });
});
