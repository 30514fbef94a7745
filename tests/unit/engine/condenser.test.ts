import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  calibrateCondenserCleanUaKWPerK,
  condenserGlycolUFactor,
  condensingTemperatureC,
  fouledUaKWPerK,
  requiredEnteringWaterC,
} from "@/lib/engine/condenser";
import {
  carnotEfficiency,
  carnotFractionCop,
  compressorPenaltyKW,
  compressorPowerKW,
  refrigerationLoadFromRejectionKW,
} from "@/lib/engine/compressor";
import { isothermalStreamEffectiveness } from "@/lib/engine/heat-exchanger";

describe("condenser ε-NTU", () => {
  // Source: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer §11.3–11.4: with one isothermal
  // stream ε = 1 − e^(−UA/C), and the LMTD method Q = UA·ΔTlm must give the same heat.
  it("agrees with the LMTD method", () => {
    fc.assert(
      fc.property(fc.double({ min: 50, max: 2000, noNaN: true }), fc.double({ min: 250, max: 1000, noNaN: true }), fc.double({ min: 10, max: 35, noNaN: true }), fc.double({ min: 100, max: 3000, noNaN: true }), (ua, cw, tIn, q) => {
        const tc = condensingTemperatureC(tIn, q, ua, cw);
        const tOut = tIn + q / cw;
        const lmtd = (tc - tIn - (tc - tOut)) / Math.log((tc - tIn) / (tc - tOut));
        expect((ua * lmtd) / q).toBeCloseTo(1, 6);
      }),
    );
  });

  it("calibrates the clean UA from the design point and inverts", () => {
    const ua = calibrateCondenserCleanUaKWPerK(35, 28.3, 1500, 72 * 4.186, 1100, 0);
    expect(condensingTemperatureC(28.3, 1500, ua, 72 * 4.186)).toBeCloseTo(35, 10);
    expect(requiredEnteringWaterC(35, 1500, ua, 72 * 4.186)).toBeCloseTo(28.3, 10);
    expect(isothermalStreamEffectiveness(ua, 72 * 4.186)).toBeCloseTo(1500 / (72 * 4.186 * 6.7), 10);
    expect(Number.isNaN(calibrateCondenserCleanUaKWPerK(33, 28.3, 1500, 72 * 4.186, 1100, 0))).toBe(true);
  });

  // Series resistances 1/(UA) = 1/(Uclean·A) + Rf/A (TEMA RGP-T-2.4 fouling in series).
  it("adds fouling in series and removes a design allowance", () => {
    const uc = 1100;
    const area = 400;
    const uaClean = (uc * area) / 1000;
    const rf = 0.000176;
    expect(fouledUaKWPerK(uaClean, uc, rf)).toBeCloseTo(area / (1 / uc + rf) / 1000, 10);
    const withAllowance = calibrateCondenserCleanUaKWPerK(35, 28.3, 1500, 301, uc, rf);
    const without = calibrateCondenserCleanUaKWPerK(35, 28.3, 1500, 301, uc, 0);
    expect(fouledUaKWPerK(withAllowance, uc, rf)).toBeCloseTo(without, 10);
  });

  it("a fouled condenser condenses warmer", () => {
    const ua = calibrateCondenserCleanUaKWPerK(35, 28.3, 1500, 301, 1100, 0);
    expect(condensingTemperatureC(28.3, 1500, fouledUaKWPerK(ua, 1100, 0.000176), 301)).toBeGreaterThan(35.2);
  });
});

describe("compressor penalty", () => {
  // Source: reversed Carnot cycle; COP = η·Te/(Tc − Te) gives dW/dTc = W/(Tc − Te) per K
  // (Methods §5).
  it("the Carnot-fraction sensitivity is W/(Tc − Te) per kelvin", () => {
    const model = { kind: "carnotFraction" as const, carnotEfficiency: carnotEfficiency(2, 35, -32), evaporatingK: 241.15 };
    expect(carnotFractionCop(model, 35)).toBeCloseTo(2, 12);
    const w = compressorPowerKW(model, 1000, 35);
    expect(w).toBeCloseTo(500, 9);
    expect(compressorPenaltyKW(model, 1000, 36, 35)).toBeCloseTo(w / (35 + 32), 9);
    expect(compressorPowerKW(model, 1000, 36) - w).toBeCloseTo(compressorPenaltyKW(model, 1000, 36, 35), 9);
  });

  // First law: heat rejected = Qe·(1 + 1/COP).
  it("refrigeration load and heat rejection are consistent", () => {
    expect(refrigerationLoadFromRejectionKW(1500, 2)).toBeCloseTo(1000, 9);
  });
});

describe("glycol on the condenser's water side", () => {
  // Resistances in series (Incropera & DeWitt, overall coefficient): a water-side film that is 40 % of
  // the clean resistance, its coefficient halved by glycol (r = 0.5): 1/U' = 0.4/0.5 + 0.6 = 1.4 → U'/U = 0.7143.
  it("derates only the water-side share of the clean resistance", () => {
    expect(condenserGlycolUFactor(0.4, 0.5)).toBeCloseTo(1 / 1.4, 12);
    expect(condenserGlycolUFactor(0.4, 1)).toBeCloseTo(1, 12);
  });
});
