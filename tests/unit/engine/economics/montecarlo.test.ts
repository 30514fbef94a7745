import { describe, expect, it } from "vitest";
import { analyzeEconomics, mulberry32, sampleDistribution } from "@/lib/engine/economics";
import { averageRanks, histogram, percentileSorted, spearmanRankCorrelation } from "@/lib/engine/economics/montecarlo";
import { baseArgs, defaultMonteCarlo, physicsFor } from "./helpers";

describe("sampling", () => {
  it("mulberry32 is reproducible and uniform on [0, 1)", () => {
    const a = mulberry32(42);
    const b = mulberry32(42);
    const xs = Array.from({ length: 20000 }, () => a());
    expect(Array.from({ length: 20000 }, () => b())).toEqual(xs);
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...xs)).toBeLessThan(1);
    // Mean of U(0,1) = 1/2, standard error 1/√(12·20000) ≈ 0.002 (standard result).
    expect(xs.reduce((s, x) => s + x, 0) / xs.length).toBeCloseTo(0.5, 2);
  });

  it("triangular inverse CDF: mean (a + b + c)/3, bounds, zero width", () => {
    // Standard properties of the triangular distribution (mean = (a + b + c)/3).
    const r = mulberry32(7);
    const d = { type: "triangular" as const, min: 0.8, mode: 1, max: 1.5 };
    const xs = Array.from({ length: 50000 }, () => sampleDistribution(d, r()));
    expect(xs.reduce((s, x) => s + x, 0) / xs.length).toBeCloseTo((0.8 + 1 + 1.5) / 3, 2);
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(0.8);
    expect(Math.max(...xs)).toBeLessThanOrEqual(1.5);
    expect(sampleDistribution(d, 0)).toBe(0.8);
    // CDF at the mode = (c − a)/(b − a): the inverse maps that u back to the mode.
    expect(sampleDistribution(d, 0.2 / 0.7)).toBeCloseTo(1, 12);
    expect(sampleDistribution({ type: "uniform", min: 2, max: 2 }, 0.37)).toBe(2);
  });

  it("percentiles interpolate like numpy's default (linear)", () => {
    // numpy.percentile default ("linear"): percentile([1, 2, 3, 4], 10 %) = 1.3.
    expect(percentileSorted([1, 2, 3, 4], 0.1)).toBeCloseTo(1.3, 12);
    expect(percentileSorted([1, 2, 3, 4], 0.5)).toBeCloseTo(2.5, 12);
    const h = histogram([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10], 5);
    expect(h.map((b) => b.count)).toEqual([2, 2, 2, 2, 3]);
  });
});

describe("Monte Carlo", () => {
  const mc = defaultMonteCarlo({ draws: 4000 });

  it("a fixed seed gives identical results twice", () => {
    const r1 = analyzeEconomics(baseArgs({ monteCarlo: mc }));
    const r2 = analyzeEconomics(baseArgs({ monteCarlo: mc }));
    expect(r2.monteCarlo).toEqual(r1.monteCarlo);
    const r3 = analyzeEconomics(baseArgs({ monteCarlo: { ...mc, seed: mc.seed + 1 } }));
    expect(r3.monteCarlo?.netSavings[0]?.p50).not.toBe(r1.monteCarlo?.netSavings[0]?.p50);
  });

  it("P10 ≤ P50 ≤ P90, probabilities sum to 1, histogram counts every draw", () => {
    const r = analyzeEconomics(baseArgs({ monteCarlo: mc }));
    const m = r.monteCarlo;
    expect(m).toBeDefined();
    for (const ns of m?.netSavings ?? []) {
      expect(ns.p10).toBeLessThanOrEqual(ns.p50);
      expect(ns.p50).toBeLessThanOrEqual(ns.p90);
      expect(ns.histogram.reduce((s, b) => s + b.count, 0)).toBe(4000);
    }
    const total = Object.values(m?.probabilityLowest ?? {}).reduce((s, p) => s + p, 0);
    expect(total).toBeCloseTo(1, 12);
  });

  it("zero-width distributions reproduce the deterministic answer", () => {
    const point = (v: number) => ({ type: "triangular" as const, min: v, mode: v, max: v });
    const r = analyzeEconomics(
      baseArgs({
        monteCarlo: {
          ...mc,
          draws: 200,
          distributions: {
            waterPriceFactor: point(1),
            sewerPriceFactor: point(1),
            electricityPriceFactor: point(1),
            energyEscalationDelta: point(0),
            discountRateDelta: point(0),
            firstCostFactor: point(1),
            cyclesOfConcentration: point(4),
            foulingRateFactor: point(1),
          },
        },
        rerunPhysics: (o) => physicsFor(o),
      }),
    );
    r.comparisons.forEach((c, i) => {
      const ns = r.monteCarlo?.netSavings[i];
      expect(ns?.p10).toBeCloseTo(c.netSavings, 6);
      expect(ns?.p90).toBeCloseTo(c.netSavings, 6);
    });
    r.options.forEach((o, i) => expect(r.monteCarlo?.lccPercentiles[i]?.p50).toBeCloseTo(o.lcc, 6));
    const lowest = r.lowestLccOptionId;
    expect(r.monteCarlo?.probabilityLowest[lowest]).toBe(1);
  });

  it("fouling draws re-run the physics once per distinct node only", () => {
    let calls = 0;
    const r = analyzeEconomics(
      baseArgs({
        monteCarlo: {
          ...mc,
          draws: 1000,
          distributions: { foulingRateFactor: { type: "triangular", min: 0.5, mode: 1, max: 2 } },
        },
        rerunPhysics: (o) => {
          calls++;
          return physicsFor(o);
        },
      }),
    );
    expect(calls).toBe(3);
    expect(r.monteCarlo?.physicsReruns).toBe(3);
    expect(r.monteCarlo?.sampledInputs).toContain("foulingRateFactor");
  });

  it("without a physics re-run, fouling is reported as not sampled", () => {
    const r = analyzeEconomics(
      baseArgs({
        monteCarlo: {
          ...mc,
          draws: 200,
          distributions: { foulingRateFactor: { type: "uniform", min: 0.5, max: 2 } },
        },
      }),
    );
    expect(r.monteCarlo?.sampledInputs).not.toContain("foulingRateFactor");
    expect(r.monteCarlo?.notes.join(" ")).toMatch(/not sampled/);
  });

  it("reports progress up to 1", () => {
    const seen: number[] = [];
    analyzeEconomics({
      ...baseArgs({ monteCarlo: { ...mc, draws: 1000 } }),
      onProgress: (f) => seen.push(f),
    });
    expect(seen.at(-1)).toBe(1);
    expect([...seen].sort((a, b) => a - b)).toEqual(seen);
  });
});

describe("rank correlation (Spearman's ρ)", () => {
  it("reproduces the textbook example of IQ against hours of television: ρ = −29/165", () => {
    // Ten people, no ties: Σd² = 194, ρ = 1 − 6·194/(10·99) = −29/165 ≈ −0.175758 [memory: the worked example
    // of the Wikipedia article "Spearman's rank correlation coefficient"; the hand calculation is written out here].
    const iq = [106, 100, 86, 101, 99, 103, 97, 113, 112, 110];
    const tv = [7, 27, 2, 50, 28, 29, 20, 12, 6, 17];
    expect(spearmanRankCorrelation(iq, tv)).toBeCloseTo(-29 / 165, 12);
  });

  it("gives tied values their average rank; ±1 for monotone series", () => {
    // Hand ranking of [10, 20, 20, 30]: 1, (2 + 3)/2, (2 + 3)/2, 4.
    expect(Array.from(averageRanks([10, 20, 20, 30]))).toEqual([1, 2.5, 2.5, 4]);
    expect(spearmanRankCorrelation([1, 2, 3, 4], [1, 8, 27, 64])).toBeCloseTo(1, 12);
    expect(spearmanRankCorrelation([1, 2, 3, 4], [9, 4, 1, 0])).toBeCloseTo(-1, 12);
  });
});

describe("Monte Carlo with physics per draw", () => {
  const mc = defaultMonteCarlo({ draws: 2000 });
  const load = { type: "triangular" as const, min: 0.7, mode: 1, max: 1.3 };

  it("re-runs the physics of every draw of the load and names the load as the driver of the spread", () => {
    let draws = 0;
    const r = analyzeEconomics(
      baseArgs({
        monteCarlo: { ...mc, distributions: { loadFactor: load } },
        drawPhysics: (o) => {
          draws++;
          return physicsFor(o);
        },
      }),
    );
    expect(draws).toBe(2000);
    expect(r.monteCarlo?.sampledInputs).toEqual(["loadFactor"]);
    for (const ns of r.monteCarlo?.netSavings ?? []) {
      // Net savings here are linear in the load (synthetic physics ∝ load): |ρ| = 1 with the load.
      expect(ns.drivers?.[0]?.input).toBe("loadFactor");
      expect(Math.abs(ns.drivers?.[0]?.rankCorrelation ?? 0)).toBeGreaterThan(0.999);
    }
  });

  it("ranks a strong input above a weak one", () => {
    const r = analyzeEconomics(
      baseArgs({
        monteCarlo: {
          ...mc,
          distributions: { loadFactor: load, discountRateDelta: { type: "uniform", min: -0.0005, max: 0.0005 } },
        },
        drawPhysics: (o) => physicsFor(o),
      }),
    );
    for (const ns of r.monteCarlo?.netSavings ?? []) {
      expect(ns.drivers?.map((d) => d.input)).toEqual(["loadFactor", "discountRateDelta"]);
    }
  });

  it("a fouling distribution alone keeps its three node re-runs even when per-draw physics is available", () => {
    let draws = 0;
    let nodes = 0;
    analyzeEconomics(
      baseArgs({
        monteCarlo: { ...mc, draws: 500, distributions: { foulingRateFactor: { type: "triangular", min: 0.5, mode: 1, max: 2 } } },
        rerunPhysics: (o) => {
          nodes++;
          return physicsFor(o);
        },
        drawPhysics: (o) => {
          draws++;
          return physicsFor(o);
        },
      }),
    );
    expect([nodes, draws]).toEqual([3, 0]);
  });

  it("without per-draw physics the load and the climate shift are reported as not sampled", () => {
    const r = analyzeEconomics(
      baseArgs({ monteCarlo: { ...mc, draws: 200, distributions: { loadFactor: load, climateShiftK: { type: "uniform", min: 0, max: 2 } } } }),
    );
    expect(r.monteCarlo?.sampledInputs).toEqual([]);
    expect(r.monteCarlo?.notes.join(" ")).toMatch(/Load and climate shift not sampled/);
  });
});
