/**
 * The floating-head search (head-pressure.ts) against a hand-solved hour: a linear airflow requirement and a
 * constant compressor slope, whose optimum follows in closed form.
 */
import { describe, expect, it } from "vitest";
import type { FanModel } from "@/lib/engine/fans";
import { type FloatingHour, airflowNear, optimalFloatingCondensing } from "@/lib/engine/head-pressure";

const fan: FanModel = { designPowerKW: 10, control: "variableSpeed", minSpeedFraction: 0.2, powerFloorFraction: 0, lowSpeedFraction: 0.5, naturalDraftAirflowFraction: 0 };

/** f(Tc) = 1 − 0.1·(Tc − 20) (its slope −0.1 /K exact); dW/dTc = 0.5 kW/K; counts the airflow solves. */
function linearHour(slopeIsExact: boolean): FloatingHour & { solves: number } {
  return {
    slopeIsExact,
    solves: 0,
    airflowAt(condensingC: number) {
      this.solves++;
      return { fraction: 1 - 0.1 * (condensingC - 20), slopePerK: -0.1 };
    },
    compressorSlope: () => 0.5,
  };
}

describe("floating-head search on a hand-solved hour", () => {
  // Hand calculation: marginal m = Pd·3f²·df/dTc + dW/dTc = 10·3·f²·(−0.1) + 0.5 = 0 ⇒ f = √(1/6) = 0.408248,
  // Tc = 20 + (1 − 0.408248)/0.1 = 25.91752 °C.
  for (const exact of [true, false]) {
    it(`finds Tc = 25.9175 °C within the search's 0.05 K (slope ${exact ? "carried" : "re-solved"})`, () => {
      const hour = linearHour(exact);
      const r = optimalFloatingCondensing(fan, 20, 35, hour);
      expect(Math.abs(r.condensingC - 25.91752)).toBeLessThan(0.05);
      // The airflow returned is the requirement at the returned Tc (the carried step is exact on a line).
      expect(r.airflow.fraction).toBeCloseTo(1 - 0.1 * (r.condensingC - 20), 12);
    });
  }

  it("carrying the last solve along an exact slope saves an airflow solve and gives the same Tc", () => {
    const carried = linearHour(true);
    const solved = linearHour(false);
    const a = optimalFloatingCondensing(fan, 20, 35, carried);
    const b = optimalFloatingCondensing(fan, 20, 35, solved);
    expect(carried.solves).toBeLessThan(solved.solves);
    expect(Math.abs(a.condensingC - b.condensingC)).toBeLessThan(0.05);
  });

  it("airflowNear: 0.6 with slope −0.1 /K, 0.03 K warmer → 0.597 (hand: 0.6 − 0.1·0.03)", () => {
    const n = airflowNear({ fraction: 0.6, slopePerK: -0.1 }, 0.03);
    expect(n.fraction).toBeCloseTo(0.597, 12);
    expect(n.slopePerK).toBe(-0.1);
  });
});
