/**
 * Monte Carlo view of the LCC comparison (Methods §7; ASTM E1369 treats uncertainty in
 * building-economics studies [memory]).
 *
 * Reproducible: a seeded 32-bit PRNG (mulberry32) drives every draw, one uniform per sampled input in a
 * fixed order (first-cost factors: one per option, independent), so the same seed gives the same result.
 *
 * Per draw:
 *  - prices, escalations, the discount rate and first costs re-price the yearly quantities;
 *  - cycles of concentration act on the water only through the mass balance B = E/(C − 1) − D with E and
 *    D unchanged, so makeup, billed sewer and treated outflow are recomputed exactly from E and D;
 *  - when the load or the climate shift is sampled, every draw re-runs the physics with its load, climate
 *    shift and fouling growth (`drawPhysics`: the compressed climate, applied as a difference to the
 *    full-resolution physics). Otherwise (or without `drawPhysics`) the load and climate are not sampled,
 *    and the fouling rate is re-run at the nodes of its distribution (min, mode, max) and interpolated
 *    linearly between them.
 * The result names the inputs that drive the spread: Spearman's rank correlation of each sampled input with
 * each alternative's net savings.
 */
import { mulberry32 } from "../random";
import { checkSteps, MAX_MONTE_CARLO_DRAWS } from "../budget";
import { basisAtCycles, evaluateOptionBasis, type OptionBasis, type Pricing } from "./cashflows";
import { withPhysics, type EconomicsModel } from "./model";
import type { PhysicsCache } from "./sensitivity";
import type { OptionAnnualPhysics } from "../types";
import {
  MONTE_CARLO_INPUTS,
  type Distribution,
  type HistogramBin,
  type MonteCarloInput,
  type MonteCarloInputKey,
  type MonteCarloResult,
  type NetSavingsDistribution,
  type PhysicsOverrides,
  type RerunPhysics,
} from "./types";

/** The inputs a draw re-runs the physics for. */
const PHYSICAL_INPUTS = ["loadFactor", "climateShiftK", "foulingRateFactor"] as const;

/**
 * Ranks of the values (1…n), ties given their average rank (the usual convention of Spearman's ρ).
 */
export function averageRanks(values: ArrayLike<number>): Float64Array {
  const n = values.length;
  const idx = Array.from({ length: n }, (_, i) => i);
  idx.sort((a, b) => (values[a] ?? 0) - (values[b] ?? 0));
  const ranks = new Float64Array(n);
  let i = 0;
  while (i < n) {
    let j = i;
    const v = values[idx[i] ?? 0] ?? 0;
    while (j + 1 < n && (values[idx[j + 1] ?? 0] ?? 0) === v) j++;
    const r = 0.5 * (i + j) + 1;
    for (let k = i; k <= j; k++) ranks[idx[k] ?? 0] = r;
    i = j + 1;
  }
  return ranks;
}

/** Pearson correlation of two equally long series (NaN when either is constant). */
function pearson(x: ArrayLike<number>, y: ArrayLike<number>): number {
  const n = x.length;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i] ?? 0;
    my += y[i] ?? 0;
  }
  mx /= n;
  my /= n;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = (x[i] ?? 0) - mx;
    const dy = (y[i] ?? 0) - my;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  return sxx > 0 && syy > 0 ? sxy / Math.sqrt(sxx * syy) : Number.NaN;
}

/**
 * Spearman's rank correlation coefficient: the Pearson correlation of the two series' average ranks.
 * Without ties it equals 1 − 6·Σd²/(n(n² − 1)). Source: Spearman (1904); e.g. Kendall & Gibbons, Rank
 * Correlation Methods. NaN when either series is constant.
 */
export function spearmanRankCorrelation(x: ArrayLike<number>, y: ArrayLike<number>): number {
  return pearson(averageRanks(x), averageRanks(y));
}

/**
 * Inverse CDF of a distribution at u ∈ [0, 1).
 * Triangular (a, c, b): x = a + √(u(b − a)(c − a)) for u < (c − a)/(b − a), else b − √((1 − u)(b − a)(b − c)).
 * Uniform: x = a + u(b − a). A zero-width distribution returns its single value.
 * Source: the standard inverse-transform results for these distributions (e.g. Law, Simulation Modeling and Analysis).
 */
export function sampleDistribution(d: Distribution, u: number): number {
  const a = d.min;
  const b = d.max;
  if (!(b > a)) return a;
  if (d.type === "uniform") return a + u * (b - a);
  const c = Math.min(Math.max(d.mode, a), b);
  const fc = (c - a) / (b - a);
  return u < fc ? a + Math.sqrt(u * (b - a) * (c - a)) : b - Math.sqrt((1 - u) * (b - a) * (b - c));
}

/** Percentile by linear interpolation between order statistics (type 7, as numpy's default). */
export function percentileSorted(sorted: ArrayLike<number>, q: number): number {
  const n = sorted.length;
  if (n === 0) return Number.NaN;
  const h = (n - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  const vlo = sorted[lo] ?? Number.NaN;
  const vhi = sorted[hi] ?? Number.NaN;
  return vlo + (h - lo) * (vhi - vlo);
}

/** Equal-width histogram of the values over [min, max] in `bins` bins (counts; for the Monte Carlo chart). */
export function histogram(values: ArrayLike<number>, bins: number): HistogramBin[] {
  const n = values.length;
  if (n === 0) return [];
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = values[i] ?? 0;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  if (!(max > min)) return [{ from: min, to: max, count: n }];
  const width = (max - min) / bins;
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < n; i++) {
    const k = Math.min(bins - 1, Math.floor(((values[i] ?? 0) - min) / width));
    counts[k] = (counts[k] ?? 0) + 1;
  }
  return counts.map((count, k) => ({
    from: min + k * width,
    to: k === bins - 1 ? max : min + (k + 1) * width,
    count,
  }));
}

/** Linear interpolation of the fouling-sensitive quantities of two bases (same option, same schedule). */
function lerpBasis(a: OptionBasis, b: OptionBasis, w: number): OptionBasis {
  const l = (x: number, y: number) => x + w * (y - x);
  return {
    ...a,
    energyCost: l(a.energyCost, b.energyCost),
    demandCost: l(a.demandCost, b.demandCost),
    upkeepPerYear: l(a.upkeepPerYear, b.upkeepPerYear),
    water: {
      ...a.water,
      evaporationM3: l(a.water.evaporationM3, b.water.evaporationM3),
      driftM3: l(a.water.driftM3, b.water.driftM3),
      blowdownM3: l(a.water.blowdownM3, b.water.blowdownM3),
      makeupM3: l(a.water.makeupM3, b.water.makeupM3),
      sewerBilledM3: l(a.water.sewerBilledM3, b.water.sewerBilledM3),
      sewerExemptM3: l(a.water.sewerExemptM3, b.water.sewerExemptM3),
      treatedOutflowM3: l(a.water.treatedOutflowM3, b.water.treatedOutflowM3),
      inhibitorKg: l(a.water.inhibitorKg, b.water.inhibitorKg),
      biocideKg: l(a.water.biocideKg, b.water.biocideKg),
      acidKg: l(a.water.acidKg, b.water.acidKg),
    },
  };
}

interface FoulingNodes {
  factors: number[];
  bases: OptionBasis[][];
}

function foulingNodes(model: EconomicsModel, d: Distribution, physics: PhysicsCache): FoulingNodes | null {
  if (!physics.available) return null;
  const raw = d.type === "triangular" ? [d.min, d.mode, d.max] : [d.min, 0.5 * (d.min + d.max), d.max];
  const factors = [...new Set(raw)].sort((a, b) => a - b);
  const bases = factors.map((f) => {
    const p = physics.get({ foulingRateFactor: f });
    return p ? withPhysics(model, p).bases : model.bases;
  });
  return { factors, bases };
}

function basesAtFouling(nodes: FoulingNodes, f: number): OptionBasis[] {
  const fs = nodes.factors;
  if (fs.length === 1 || f <= (fs[0] ?? f)) return nodes.bases[0] ?? [];
  for (let k = 1; k < fs.length; k++) {
    const f1 = fs[k] ?? f;
    if (f <= f1 || k === fs.length - 1) {
      const f0 = fs[k - 1] ?? f;
      const w = f1 > f0 ? (f - f0) / (f1 - f0) : 0;
      const lo = nodes.bases[k - 1] ?? [];
      const hi = nodes.bases[k] ?? [];
      return lo.map((b, i) => lerpBasis(b, hi[i] ?? b, w));
    }
  }
  return nodes.bases[0] ?? [];
}

/**
 * Run the Monte Carlo: for each draw, sample the uncertain inputs, re-price every option, and record
 * each LCC and each alternative's net savings against the base. Ties for the lowest LCC are split.
 */
export function runMonteCarlo(
  model: EconomicsModel,
  input: MonteCarloInput,
  physics: PhysicsCache,
  onProgress?: (fraction: number) => void,
  drawPhysics?: RerunPhysics,
): MonteCarloResult {
  const before = physics.reruns;
  const draws = Math.max(1, Math.floor(input.draws));
  checkSteps(`a Monte Carlo of ${input.draws} draws`, draws, MAX_MONTE_CARLO_DRAWS);
  checkSteps(`a histogram of ${input.histogramBins} bins`, input.histogramBins, 10_000);
  const rand = mulberry32(input.seed);
  const nOpt = model.bases.length;
  const dist = input.distributions;
  const sampled = MONTE_CARLO_INPUTS.filter((k) => dist[k] !== undefined);
  const physical = PHYSICAL_INPUTS.filter((k) => dist[k] !== undefined);
  // The fouling rate alone stays on its three interpolated nodes (it moves energy smoothly and cheaply);
  // the load and the climate shift need the physics of every draw.
  const perDrawPhysics = drawPhysics !== undefined && (dist.loadFactor !== undefined || dist.climateShiftK !== undefined);
  const notes: string[] = [
    "Prices, escalations, the discount rate and first costs re-price the same yearly quantities (no physics re-run).",
  ];

  let nodes: FoulingNodes | null = null;
  const foulingDist = dist.foulingRateFactor;
  if (perDrawPhysics) {
    notes.push(
      `The physics is re-run for every draw of ${physical.map((k) => PHYSICAL_LABELS[k]).join(", ")} on the compressed climate (hours folded into month × wet-bulb × load records), applied as a change to the full-resolution result.`,
    );
  } else {
    if (foulingDist) {
      nodes = foulingNodes(model, foulingDist, physics);
      notes.push(
        nodes
          ? `Fouling rate: physics re-run at factors ${nodes.factors.join(", ")} and interpolated linearly between them.`
          : "Fouling rate not sampled: it needs a physics re-run, which this analysis was not given.",
      );
    }
    if (dist.loadFactor || dist.climateShiftK) notes.push("Load and climate shift not sampled: they need a physics re-run per draw, which this analysis was not given.");
  }
  if (dist.firstCostFactor) {
    notes.push(
      "First-cost factors are drawn independently for each option (each quote has its own uncertainty).",
    );
  }
  if (dist.cyclesOfConcentration) {
    notes.push(
      "Cycles of concentration (the scenario's; loops with their own cycles in proportion): makeup, blowdown, billed sewer and acid feed recomputed exactly from evaporation and drift (B = E/(C − 1) − D) for every wet loop.",
    );
  }
  const used = sampled.filter((k) => perDrawPhysics || (k !== "loadFactor" && k !== "climateShiftK" && (k !== "foulingRateFactor" || nodes !== null)));

  const lcc = Array.from({ length: nOpt }, () => new Float64Array(draws));
  const lowestCount = new Float64Array(nOpt);
  const scales = new Array<number>(nOpt).fill(1);
  const p0 = model.pricing;
  const progressEvery = Math.max(1, Math.floor(draws / 20));
  // The drawn value of every used input per draw (first-cost factors per option), for the rank correlations.
  const drawn = new Map<string, Float64Array>();
  const series = (key: string): Float64Array => {
    let a = drawn.get(key);
    if (!a) drawn.set(key, (a = new Float64Array(draws)));
    return a;
  };

  for (let k = 0; k < draws; k++) {
    const s: Partial<Record<MonteCarloInputKey, number>> = {};
    for (const key of sampled) {
      const d = dist[key];
      if (!d) continue;
      if (key === "firstCostFactor") {
        for (let i = 0; i < nOpt; i++) {
          scales[i] = sampleDistribution(d, rand());
          series(`firstCostFactor|${model.bases[i]?.optionId ?? i}`)[k] = scales[i] ?? 1;
        }
      } else {
        s[key] = sampleDistribution(d, rand());
        series(key)[k] = s[key] ?? 0;
      }
    }
    const pricing: Pricing = {
      ...p0,
      waterPriceFactor: s.waterPriceFactor ?? 1,
      sewerPriceFactor: s.sewerPriceFactor ?? 1,
      electricityPriceFactor: s.electricityPriceFactor ?? 1,
      demandChargeFactor: s.demandChargeFactor ?? 1,
      chemicalsPriceFactor: s.chemicalsPriceFactor ?? 1,
      realDiscountRate: Math.max(-0.5, p0.realDiscountRate + (s.discountRateDelta ?? 0)),
      escalation: {
        ...p0.escalation,
        energy: p0.escalation.energy + (s.energyEscalationDelta ?? 0),
        demand: p0.escalation.demand + (s.energyEscalationDelta ?? 0),
        water: p0.escalation.water + (s.waterEscalationDelta ?? 0) + (s.waterAndSewerEscalationDelta ?? 0),
        sewer: p0.escalation.sewer + (s.sewerEscalationDelta ?? 0) + (s.waterAndSewerEscalationDelta ?? 0),
      },
    };
    let bases: OptionBasis[];
    if (perDrawPhysics && drawPhysics) {
      const o: PhysicsOverrides = {};
      if (s.loadFactor !== undefined) o.loadFactor = s.loadFactor;
      if (s.climateShiftK !== undefined) o.climateShiftK = s.climateShiftK;
      if (s.foulingRateFactor !== undefined) o.foulingRateFactor = s.foulingRateFactor;
      const p: OptionAnnualPhysics[] = drawPhysics(o);
      physics.reruns++;
      bases = withPhysics(model, p).bases;
    } else {
      bases = nodes && s.foulingRateFactor !== undefined ? basesAtFouling(nodes, s.foulingRateFactor) : model.bases;
    }
    const cycles = s.cyclesOfConcentration;
    if (cycles !== undefined) bases = bases.map((b) => basisAtCycles(b, cycles));

    let minL = Infinity;
    for (let i = 0; i < nOpt; i++) {
      const b = bases[i];
      const v = b ? evaluateOptionBasis(b, pricing, scales[i] ?? 1).lcc : Number.NaN;
      (lcc[i] as Float64Array)[k] = v;
      if (v < minL) minL = v;
    }
    let ties = 0;
    for (let i = 0; i < nOpt; i++) if ((lcc[i] as Float64Array)[k] === minL) ties++;
    for (let i = 0; i < nOpt; i++)
      if ((lcc[i] as Float64Array)[k] === minL) lowestCount[i] = (lowestCount[i] ?? 0) + 1 / ties;
    if (onProgress && (k + 1) % progressEvery === 0) onProgress((k + 1) / draws);
  }

  const probabilityLowest: Record<string, number> = {};
  model.bases.forEach((b, i) => (probabilityLowest[b.optionId] = (lowestCount[i] ?? 0) / draws));

  const summarise = (values: Float64Array) => {
    const sorted = Float64Array.from(values).sort();
    let sum = 0;
    for (const v of values) sum += v;
    return { sorted, mean: sum / values.length };
  };
  const lccPercentiles = model.bases.map((b, i) => {
    const { sorted, mean } = summarise(lcc[i] as Float64Array);
    return {
      optionId: b.optionId,
      p10: percentileSorted(sorted, 0.1),
      p50: percentileSorted(sorted, 0.5),
      p90: percentileSorted(sorted, 0.9),
      mean,
    };
  });

  const baseL = lcc[model.baseIndex] as Float64Array;
  const netSavings: NetSavingsDistribution[] = [];
  for (let i = 0; i < nOpt; i++) {
    if (i === model.baseIndex) continue;
    const li = lcc[i] as Float64Array;
    const ns = new Float64Array(draws);
    let positive = 0;
    for (let k = 0; k < draws; k++) {
      const v = (baseL[k] ?? 0) - (li[k] ?? 0);
      ns[k] = v;
      if (v > 0) positive++;
    }
    const { sorted, mean } = summarise(ns);
    netSavings.push({
      baseOptionId: model.bases[model.baseIndex]?.optionId ?? "",
      alternativeOptionId: model.bases[i]?.optionId ?? "",
      mean,
      p10: percentileSorted(sorted, 0.1),
      p50: percentileSorted(sorted, 0.5),
      p90: percentileSorted(sorted, 0.9),
      min: sorted[0] ?? Number.NaN,
      max: sorted[draws - 1] ?? Number.NaN,
      probabilityPositive: positive / draws,
      histogram: histogram(ns, input.histogramBins),
      drivers: driversOf(drawn, ns, used),
    });
  }
  onProgress?.(1);
  return {
    draws,
    seed: input.seed,
    probabilityLowest,
    lccPercentiles,
    netSavings,
    sampledInputs: used,
    notes,
    physicsReruns: physics.reruns - before,
  };
}

const PHYSICAL_LABELS: Record<(typeof PHYSICAL_INPUTS)[number], string> = {
  loadFactor: "the load",
  climateShiftK: "the climate shift",
  foulingRateFactor: "the fouling rate",
};

/** Rank correlation of every used, varying input with the net savings, strongest first. */
function driversOf(
  drawn: Map<string, Float64Array>,
  netSavings: Float64Array,
  used: readonly MonteCarloInputKey[],
): NonNullable<NetSavingsDistribution["drivers"]> {
  const out: NonNullable<NetSavingsDistribution["drivers"]> = [];
  for (const [key, values] of drawn) {
    const [input, optionId] = key.split("|") as [MonteCarloInputKey, string | undefined];
    if (!used.includes(input)) continue;
    const rho = spearmanRankCorrelation(values, netSavings);
    if (!Number.isFinite(rho)) continue;
    out.push({ input, ...(optionId !== undefined ? { optionId } : {}), rankCorrelation: rho });
  }
  return out.sort((a, b) => Math.abs(b.rankCorrelation) - Math.abs(a.rankCorrelation));
}
