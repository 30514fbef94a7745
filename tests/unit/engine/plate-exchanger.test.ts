import { describe, expect, it } from "vitest";
import { counterflowEffectiveness } from "@/lib/engine/heat-exchanger";
import {
  balancedCounterflowApproachK,
  calibratePlateExchangerUaKWPerK,
  plateExchangerApproachK,
} from "@/lib/engine/plate-exchanger";

const C = 72 * 4.186;

describe("plate exchanger approach", () => {
  // Source: counterflow ε-NTU (Incropera & DeWitt); balanced counterflow approach = R·(1 − ε)/ε
  // (Methods §5).
  it("reproduces the design approach and the balanced-counterflow formula", () => {
    const ua = calibratePlateExchangerUaKWPerK(1500, 1.5, C, C);
    expect(plateExchangerApproachK(1500, ua, C, C)).toBeCloseTo(1.5, 9);
    const eps = counterflowEffectiveness(ua / C, 1);
    expect(balancedCounterflowApproachK(1500 / C, eps)).toBeCloseTo(1.5, 9);
    // balanced: NTU = R/approach
    expect(ua / C).toBeCloseTo(1500 / C / 1.5, 9);
  });

  it("with constant flows the approach is proportional to the load", () => {
    const ua = calibratePlateExchangerUaKWPerK(1500, 1.5, C, C);
    expect(plateExchangerApproachK(750, ua, C, C)).toBeCloseTo(0.75, 9);
  });

  it("handles unequal flows (hot side = clean loop)", () => {
    const ua = calibratePlateExchangerUaKWPerK(1500, 1.5, 0.8 * C, C);
    expect(plateExchangerApproachK(1500, ua, 0.8 * C, C)).toBeCloseTo(1.5, 9);
    // The clean loop leaves at tower water + approach; its inlet is higher by Q/Chot.
    const cmin = 0.8 * C;
    const eps = counterflowEffectiveness(ua / cmin, 0.8);
    const hotIn = 20 + 1500 / (eps * cmin);
    expect(hotIn - 1500 / (0.8 * C) - 20).toBeCloseTo(1.5, 9);
  });
});
