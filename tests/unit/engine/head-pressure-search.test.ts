/**
 * The floating-head search (head-pressure.ts) against a hand-solved hour: a linear airflow requirement and a
 * constant compressor slope, whose optimum follows in closed form.
 */
import { describe, expect, it } from "vitest";
import type { FanModel } from "@/lib/engine/fans";
import { type FloatingHour, airflowAlong, airflowNear, optimalFloatingCondensing } from "@/lib/engine/head-pressure";

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

describe("floating-head search by Newton steps (airflow with slope and curvature)", () => {
  // f(Tc) = 1 − 0.1·x + 0.002·x², x = Tc − 20 (slope and curvature exact); W′(Tc) = 0.4 + 0.02·x kW/K
  // (W″ = 0.02 kW/K²). The marginal m = 10·3·f²·f′ + W′ has one root in 20…35 °C, found below by bisection
  // on that closed form (hand-written, independent of the engine's search).
  function curvedHour(): FloatingHour & { solves: number } {
    return {
      slopeIsExact: true,
      solves: 0,
      airflowAt(condensingC: number) {
        this.solves++;
        const x = condensingC - 20;
        return { fraction: 1 - 0.1 * x + 0.002 * x * x, slopePerK: -0.1 + 0.004 * x, curvaturePerK2: 0.004 };
      },
      compressorSlope: (condensingC: number) => 0.4 + 0.02 * (condensingC - 20),
      compressorCurvature: () => 0.02,
    };
  }
  function marginalRoot(): number {
    const m = (t: number) => {
      const x = t - 20;
      const f = 1 - 0.1 * x + 0.002 * x * x;
      return 10 * 3 * f * f * (-0.1 + 0.004 * x) + 0.4 + 0.02 * x;
    };
    let lo = 20;
    let hi = 35;
    for (let i = 0; i < 200; i++) {
      const mid = 0.5 * (lo + hi);
      if (m(mid) < 0) lo = mid;
      else hi = mid;
    }
    return 0.5 * (lo + hi);
  }

  it("lands within 0.005 K of the marginal's root in a few solves", () => {
    const hour = curvedHour();
    const r = optimalFloatingCondensing(fan, 20, 35, hour);
    const want = marginalRoot();
    expect(want).toBeGreaterThan(21);
    expect(want).toBeLessThan(34);
    expect(Math.abs(r.condensingC - want)).toBeLessThan(0.005);
    // The airflow returned is the requirement at the returned Tc (the carried step is exact on a parabola).
    const x = r.condensingC - 20;
    expect(r.airflow.fraction).toBeCloseTo(1 - 0.1 * x + 0.002 * x * x, 12);
    expect(hour.solves).toBeLessThanOrEqual(4);
  });

  it("stops at the fan's minimum speed when the marginal is still negative there", () => {
    // A weak compressor slope (0.05 kW/K): the fan would slow below its 0.2 minimum before the marginal turns.
    const hour = { ...curvedHour(), compressorSlope: () => 0.05, compressorCurvature: () => 0 };
    const r = optimalFloatingCondensing(fan, 20, 35, hour);
    // Hand: 1 − 0.1x + 0.002x² = 0.2 ⇒ x = (0.1 − √(0.01 − 0.0064))/0.004 = 10 ⇒ Tc = 30 °C.
    expect(Math.abs(r.condensingC - 30)).toBeLessThan(0.01);
    expect(r.airflow.fraction).toBeGreaterThanOrEqual(0.2);
  });

  it("airflowAlong: 0.6, slope −0.1 /K, curvature 0.004 /K², 0.05 K warmer → 0.595005 (hand: 0.6 − 0.005 + 0.002·0.0025)", () => {
    const n = airflowAlong({ fraction: 0.6, slopePerK: -0.1, curvaturePerK2: 0.004 }, 0.05);
    expect(n.fraction).toBeCloseTo(0.595005, 12);
    expect(n.slopePerK).toBeCloseTo(-0.0998, 12);
  });
});
