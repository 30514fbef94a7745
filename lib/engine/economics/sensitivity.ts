/**
 * One-at-a-time sensitivity (tornado) and break-even values (Methods §7; NIST Handbook 135 ch. 7
 * on sensitivity analysis and break-even analysis).
 *
 * The tornado is drawn for every alternative against the base option: each input at its low and high
 * value, all others at base, bars ranked by the swing of that pair's net savings. Price inputs reuse the
 * yearly physics; cycles, fouling rate and load re-run the physics through `rerunPhysics` (cycles fall
 * back to the exact water-balance recompute when no re-run is available; fouling and load are skipped).
 */
import type { OptionAnnualPhysics } from "../types";
import { basisAtCycles, type OptionBasis, type Pricing } from "./cashflows";
import { lccsOf, netSavingsOf, premiumScales, withPhysics, type EconomicsModel } from "./model";
import {
  BREAK_EVEN_INPUTS,
  SENSITIVITY_INPUTS,
  SENSITIVITY_INPUT_MODES,
  type BreakEvenInputKey,
  type BreakEvenResult,
  type PhysicsOverrides,
  type RerunPhysics,
  type SensitivityInput,
  type SensitivityInputKey,
  type SensitivityResult,
  type TornadoBar,
  type TornadoForPair,
} from "./types";
import { enUsNumber } from "../en-us";

export const SENSITIVITY_LABELS: Record<SensitivityInputKey, string> = {
  waterPrice: "Water price",
  sewerPrice: "Sewer price",
  electricityPrice: "Electricity energy price",
  electricityEscalation: "Electricity escalation (energy and demand)",
  cyclesOfConcentration: "Cycles of concentration",
  discountRate: "Discount rate",
  firstCostPremium: "Extra first cost of the alternative",
  foulingRate: "Condenser fouling rate",
  load: "Heat-rejection load",
  waterAndSewerEscalation: "Water and sewer escalation",
};

/** Physics re-runs memoised by their overrides, so each distinct re-run happens once per analysis. */
export class PhysicsCache {
  private readonly cache = new Map<string, OptionAnnualPhysics[]>();
  reruns = 0;
  constructor(private readonly rerun?: RerunPhysics) {}
  get available(): boolean {
    return this.rerun !== undefined;
  }
  get(overrides: PhysicsOverrides): OptionAnnualPhysics[] | undefined {
    if (!this.rerun) return undefined;
    const key = JSON.stringify(overrides);
    let p = this.cache.get(key);
    if (!p) {
      p = this.rerun(overrides);
      this.reruns++;
      this.cache.set(key, p);
    }
    return p;
  }
}

/**
 * The scenario's cycles in the base case (what cycles overrides replace): from the base option's water
 * (or the first wet option's); loops with their own cycles follow at their ratio.
 */
export function baseCycles(model: EconomicsModel): number {
  const b = model.bases[model.baseIndex];
  if (b && b.water.cyclesOfConcentration > 1) return b.water.scenarioCycles;
  return model.bases.find((x) => x.water.cyclesOfConcentration > 1)?.water.scenarioCycles ?? 4;
}

function withDelta(
  p: Pricing,
  key: "electricityEscalation" | "discountRate" | "waterAndSewerEscalation",
  delta: number,
): Pricing {
  if (key === "discountRate") return { ...p, realDiscountRate: Math.max(-0.5, p.realDiscountRate + delta) };
  if (key === "waterAndSewerEscalation")
    return { ...p, escalation: { ...p.escalation, water: p.escalation.water + delta, sewer: p.escalation.sewer + delta } };
  return {
    ...p,
    escalation: { ...p.escalation, energy: p.escalation.energy + delta, demand: p.escalation.demand + delta },
  };
}

/** LCC of every option with one input moved, or the reason it cannot be moved. */
function lccsWithInput(
  model: EconomicsModel,
  key: SensitivityInputKey,
  value: number,
  physics: PhysicsCache,
): number[] | string {
  const p = model.pricing;
  const bases = model.bases;
  switch (key) {
    case "waterPrice":
      return lccsOf(bases, { ...p, waterPriceFactor: value });
    case "sewerPrice":
      return lccsOf(bases, { ...p, sewerPriceFactor: value });
    case "electricityPrice":
      return lccsOf(bases, { ...p, electricityPriceFactor: value });
    case "electricityEscalation":
    case "discountRate":
    case "waterAndSewerEscalation":
      return lccsOf(bases, withDelta(p, key, value));
    case "firstCostPremium":
      return lccsOf(bases, p, premiumScales(bases, model.baseIndex, value));
    case "cyclesOfConcentration": {
      const rerun = physics.get({ cyclesOfConcentration: value });
      if (rerun) return lccsOf(withPhysics(model, rerun).bases, p);
      return lccsOf(
        bases.map((b) => basisAtCycles(b, value)),
        p,
      );
    }
    case "foulingRate":
    case "load": {
      const rerun = physics.get(key === "foulingRate" ? { foulingRateFactor: value } : { loadFactor: value });
      if (!rerun) return "needs a physics re-run, which this analysis was not given";
      return lccsOf(withPhysics(model, rerun).bases, p);
    }
  }
}

/**
 * Tornado for every alternative against the base (each pair drawn separately), ranked by swing of
 * net savings, largest first; inputs that could not be varied come last with their reason.
 */
export function tornado(
  model: EconomicsModel,
  input: SensitivityInput,
  physics: PhysicsCache,
): TornadoForPair[] {
  const baseLccs = lccsOf(model.bases, model.pricing);
  const pairs: TornadoForPair[] = model.bases
    .map((_, i) => i)
    .filter((i) => i !== model.baseIndex)
    .map((i) => ({
      baseOptionId: model.bases[model.baseIndex]?.optionId ?? "",
      alternativeOptionId: model.bases[i]?.optionId ?? "",
      baseNetSavings: netSavingsOf(baseLccs, model.baseIndex, i),
      bars: [],
    }));
  const altIndices = model.bases.map((_, i) => i).filter((i) => i !== model.baseIndex);
  const c0 = baseCycles(model);

  for (const key of SENSITIVITY_INPUTS) {
    const range = input.tornado[key];
    if (!range.enabled) continue;
    const mode = SENSITIVITY_INPUT_MODES[key];
    let low = range.low;
    let high = range.high;
    if (key === "cyclesOfConcentration") {
      low ??= Math.max(1.5, 0.75 * c0);
      high ??= 1.25 * c0;
    }
    low ??= mode === "factor" ? 1 : 0;
    high ??= mode === "factor" ? 1 : 0;
    const atLow = lccsWithInput(model, key, low, physics);
    const atHigh = typeof atLow === "string" ? atLow : lccsWithInput(model, key, high, physics);
    altIndices.forEach((ai, pi) => {
      const pair = pairs[pi];
      if (!pair) return;
      const bar: TornadoBar = {
        input: key,
        label: SENSITIVITY_LABELS[key],
        mode,
        low,
        high,
        netSavingsAtLow: pair.baseNetSavings,
        netSavingsAtHigh: pair.baseNetSavings,
        swing: 0,
      };
      if (typeof atLow === "string" || typeof atHigh === "string") {
        bar.skippedReason = typeof atLow === "string" ? atLow : String(atHigh);
      } else {
        bar.netSavingsAtLow = netSavingsOf(atLow, model.baseIndex, ai);
        bar.netSavingsAtHigh = netSavingsOf(atHigh, model.baseIndex, ai);
        bar.swing = Math.abs(bar.netSavingsAtHigh - bar.netSavingsAtLow);
      }
      pair.bars.push(bar);
    });
  }
  for (const pair of pairs) {
    pair.bars.sort((a, b) => (a.skippedReason ? 1 : 0) - (b.skippedReason ? 1 : 0) || b.swing - a.swing);
  }
  return pairs;
}

// ---------------------------------------------------------------------------------------------------
// Break-even
// ---------------------------------------------------------------------------------------------------

/**
 * All roots of f on [a, b] found by scanning `segments` equal steps for a sign change and refining
 * each bracket by bisection to |Δx| ≤ 1e-10·(1 + |x|). Roots where f touches 0 without crossing are
 * only found when a scan point lands on them.
 */
export function findRoots(f: (x: number) => number, a: number, b: number, segments = 40): number[] {
  const roots: number[] = [];
  let x0 = a;
  let f0 = f(x0);
  if (f0 === 0) roots.push(x0);
  for (let i = 1; i <= segments; i++) {
    const x1 = a + ((b - a) * i) / segments;
    const f1 = f(x1);
    if (f1 === 0) roots.push(x1);
    else if (f0 !== 0 && Math.sign(f0) !== Math.sign(f1)) {
      let lo = x0;
      let hi = x1;
      let flo = f0;
      for (let k = 0; k < 200 && hi - lo > 1e-10 * (1 + Math.abs(lo)); k++) {
        const mid = 0.5 * (lo + hi);
        const fm = f(mid);
        if (fm === 0) {
          lo = hi = mid;
          break;
        }
        if (Math.sign(fm) === Math.sign(flo)) {
          lo = mid;
          flo = fm;
        } else hi = mid;
      }
      roots.push(0.5 * (lo + hi));
    }
    x0 = x1;
    f0 = f1;
  }
  return roots;
}

function fmt(x: number, digits = 3): string {
  return enUsNumber(Number(x.toPrecision(digits)));
}

/** Mean electricity price of an option: energy cost / kWh (flat price when the option uses no energy). */
function meanEnergyPricePerKWh(model: EconomicsModel, b: OptionBasis | undefined, kwh: number): number {
  if (b && kwh > 0) return b.energyCost / kwh;
  return model.tariffs.electricity.energyPricePerKWh;
}

/**
 * Break-even value of one input between the base and one alternative: the value at which their LCCs
 * tie (net savings = 0), by root finding over the user's range. Prices and the premium are factors on
 * the entered values; cycles are absolute and evaluated with the exact water balance B = E/(C − 1) − D
 * applied to every wet loop (no physics re-run, so the search can take many steps).
 */
export function breakEven(
  model: EconomicsModel,
  input: SensitivityInput,
  altIndex: number,
  energyKWhOfBase: number,
): BreakEvenResult[] {
  const out: BreakEvenResult[] = [];
  const base = model.bases[model.baseIndex];
  const alt = model.bases[altIndex];
  if (!base || !alt) return out;
  const p = model.pricing;
  const c0 = baseCycles(model);
  for (const key of BREAK_EVEN_INPUTS) {
    const range = input.breakEven[key];
    if (!range.enabled) continue;
    const pair = [base, alt];
    const ns = nsFunction(key, pair, p);
    const roots = findRoots(ns, range.min, range.max);
    const reference = key === "cyclesOfConcentration" ? c0 : 1;
    const value =
      roots.length > 0
        ? roots.reduce((best, r) => (Math.abs(r - reference) < Math.abs(best - reference) ? r : best))
        : null;
    const res: BreakEvenResult = {
      input: key,
      baseOptionId: base.optionId,
      alternativeOptionId: alt.optionId,
      value,
      absoluteValue: null,
      searchMin: range.min,
      searchMax: range.max,
      note: "",
    };
    const extraFirstCost = alt.firstCost - base.firstCost;
    if (key === "waterAndSewerPrice") res.absoluteUnit = "per m³, water and sewer together";
    else if (key === "electricityPrice") res.absoluteUnit = "per kWh, mean energy price";
    else if (key === "cyclesOfConcentration") res.absoluteUnit = "cycles";
    else res.absoluteUnit = "extra first cost";
    if (value !== null) {
      if (key === "waterAndSewerPrice")
        res.absoluteValue = value * (model.tariffs.water.pricePerM3 + model.tariffs.sewer.pricePerM3);
      else if (key === "electricityPrice")
        res.absoluteValue = value * meanEnergyPricePerKWh(model, base, energyKWhOfBase);
      else if (key === "cyclesOfConcentration") res.absoluteValue = value;
      else res.absoluteValue = value * extraFirstCost;
    }
    res.note = breakEvenNote(key, res, ns((range.min + range.max) / 2), roots.length, extraFirstCost);
    out.push(res);
  }
  return out;
}

function nsFunction(key: BreakEvenInputKey, pair: OptionBasis[], p: Pricing): (x: number) => number {
  switch (key) {
    case "waterAndSewerPrice":
      return (x) => netSavingsOf(lccsOf(pair, { ...p, waterPriceFactor: x, sewerPriceFactor: x }), 0, 1);
    case "electricityPrice":
      return (x) => netSavingsOf(lccsOf(pair, { ...p, electricityPriceFactor: x }), 0, 1);
    case "cyclesOfConcentration":
      return (x) =>
        netSavingsOf(
          lccsOf(
            pair.map((b) => basisAtCycles(b, x)),
            p,
          ),
          0,
          1,
        );
    case "firstCostPremium":
      return (x) => netSavingsOf(lccsOf(pair, p, premiumScales(pair, 0, x)), 0, 1);
  }
}

const BREAK_EVEN_WORDS: Record<BreakEvenInputKey, string> = {
  waterAndSewerPrice: "the entered water and sewer prices",
  electricityPrice: "the entered electricity prices",
  cyclesOfConcentration: "cycles of concentration",
  firstCostPremium: "the alternative's extra first cost",
};

function absoluteText(key: BreakEvenInputKey, v: number): string {
  if (key === "waterAndSewerPrice") return `${fmt(v, 4)} per m³ of water and sewer together`;
  if (key === "electricityPrice") return `a mean energy price of ${fmt(v, 4)} per kWh`;
  return `an extra first cost of ${enUsNumber(Math.round(v))}`;
}

function breakEvenNote(
  key: BreakEvenInputKey,
  r: BreakEvenResult,
  nsMid: number,
  rootCount: number,
  extraFirstCost: number,
): string {
  const what = BREAK_EVEN_WORDS[key];
  const range =
    key === "cyclesOfConcentration"
      ? `${fmt(r.searchMin)} … ${fmt(r.searchMax)} cycles`
      : `×${fmt(r.searchMin)} … ×${fmt(r.searchMax)} ${what}`;
  if (key === "firstCostPremium" && extraFirstCost === 0) {
    return "Both options have the same first cost, so scaling the extra first cost cannot make them tie.";
  }
  if (r.value === null) {
    const who = nsMid > 0 ? "the alternative stays cheaper" : "the base stays cheaper";
    return `No tie within range (${range}): ${who} throughout.`;
  }
  const at =
    key === "cyclesOfConcentration"
      ? `${fmt(r.value)} cycles (every wet loop; exact water balance, physics not re-run)`
      : `×${fmt(r.value)} ${what}` +
        (r.absoluteValue !== null ? ` (${absoluteText(key, r.absoluteValue)})` : "");
  const more =
    rootCount > 1
      ? ` There are ${rootCount} ties in the range; the one nearest the entered value is shown.`
      : "";
  return `The options tie at ${at}.${more}`;
}

/** Tornado and break-evens of every alternative against the base. */
export function runSensitivity(
  model: EconomicsModel,
  input: SensitivityInput,
  physics: PhysicsCache,
  energyKWhOfBase: number,
): SensitivityResult {
  const before = physics.reruns;
  const t = tornado(model, input, physics);
  const be = model.bases.flatMap((_, i) =>
    i === model.baseIndex ? [] : breakEven(model, input, i, energyKWhOfBase),
  );
  return { tornado: t, breakEven: be, physicsReruns: physics.reruns - before };
}
