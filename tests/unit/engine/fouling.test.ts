import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  type FoulingGrowth,
  cleaningCostRatePerMonth,
  foulingResistanceM2KPerW,
  integratedFoulingM2KPerWMonths,
  monthlyFoulingM2KPerW,
  optimalCleaningIntervalMonths,
} from "@/lib/engine/fouling";

function bruteForceOptimum(growth: FoulingGrowth, k: number, s: number): number {
  let best = 0;
  let bestRate = Number.POSITIVE_INFINITY;
  for (let t = 0.01; t <= 400; t += 0.01) {
    const r = cleaningCostRatePerMonth(growth, k, s, t);
    if (r < bestRate) {
      bestRate = r;
      best = t;
    }
  }
  return best;
}

describe("fouling growth", () => {
  // Source: Kern & Seaton (1959): Rf(t) = Rf∞·(1 − e^(−t/τ)).
  it("asymptotic growth reaches 63 % of the asymptote in one time constant", () => {
    const g: FoulingGrowth = { model: "asymptotic", asymptoticM2KPerW: 0.000176, timeConstantMonths: 3 };
    expect(foulingResistanceM2KPerW(g, 3) / 0.000176).toBeCloseTo(1 - Math.exp(-1), 12);
    expect(foulingResistanceM2KPerW(g, 0)).toBe(0);
  });

  it("the monthly schedule resets at each cleaning and averages the growth over each month", () => {
    const g: FoulingGrowth = { model: "linear", rateM2KPerWPerMonth: 1e-5 };
    const m = monthlyFoulingM2KPerW(g, 12);
    expect(m[0]).toBeCloseTo(0.5e-5, 15);
    expect(m[11]).toBeCloseTo(11.5e-5, 15);
    const m6 = monthlyFoulingM2KPerW(g, 6);
    expect(m6[6]).toBeCloseTo(m6[0] ?? NaN, 15);
    // a 24-month interval: each calendar month is the average of its two years
    const m24 = monthlyFoulingM2KPerW(g, 24);
    expect(m24[0]).toBeCloseTo(0.5 * (0.5e-5 + 12.5e-5), 15);
    // long-run mean over the year = ∫₀ᵀ Rf/T for intervals that divide the year or are multiples of it
    const mean = m24.reduce((a, b) => a + b, 0) / 12;
    expect(mean).toBeCloseTo(integratedFoulingM2KPerWMonths(g, 24) / 24, 15);
  });
});

describe("cost-minimising cleaning interval", () => {
  // Source: renewal-cost minimisation — A(T) = [K + ∫₀ᵀ p]/T is least where A(T*) = p(T*); with a
  // linear penalty p = a·t, T* = √(2K/a). Checked against brute-force minimisation of A(T).
  it("T* = √(2K/a) for linear growth, equal to the brute-force minimum", () => {
    fc.assert(
      fc.property(fc.double({ min: 500, max: 20000, noNaN: true }), fc.double({ min: 1e6, max: 1e8, noNaN: true }), fc.double({ min: 5e-6, max: 3e-5, noNaN: true }), (k, s, rate) => {
        const g: FoulingGrowth = { model: "linear", rateM2KPerWPerMonth: rate };
        const t = optimalCleaningIntervalMonths(g, k, s);
        expect(t).not.toBeNull();
        expect(t).toBeCloseTo(Math.sqrt((2 * k) / (s * rate)), 9);
        fc.pre((t ?? 0) < 300);
        expect(Math.abs((t ?? 0) - bruteForceOptimum(g, k, s))).toBeLessThan(0.02);
      }),
      { numRuns: 20 },
    );
  });

  it("asymptotic growth: the root of A(T) = p(T) is the brute-force minimum, or none when cleaning never pays", () => {
    const g: FoulingGrowth = { model: "asymptotic", asymptoticM2KPerW: 0.000176, timeConstantMonths: 6 };
    const s = 2e7;
    const k = 5000;
    const t = optimalCleaningIntervalMonths(g, k, s);
    expect(t).not.toBeNull();
    expect(Math.abs((t ?? 0) - bruteForceOptimum(g, k, s))).toBeLessThan(0.02);
    // K ≥ s·Rf∞·τ: the average cost rate falls for ever
    expect(optimalCleaningIntervalMonths(g, s * 0.000176 * 6 * 1.01, s)).toBeNull();
    expect(optimalCleaningIntervalMonths(g, 0, s)).toBeNull();
  });
});
