/**
 * The priced model shared by the deterministic analysis, the tornado, the break-evens, the Monte Carlo
 * and the what-if: one `OptionBasis` per option plus a `Pricing`, evaluated as often as needed.
 */
import type { EngineWarning, OptionAnnualPhysics } from "../types";
import {
  analysisDiscountRate,
  basePricing,
  buildOptionBasis,
  evaluateOptionBasis,
  type OptionBasis,
  type Pricing,
} from "./cashflows";
import { nominalFromReal } from "./factors";
import { annualisedCost, compareOptions } from "./measures";
import type {
  EconomicsInput,
  EconomicsOptionInput,
  EconomicsResult,
  OptionEconomics,
  TariffsInput,
  UpkeepInput,
} from "./types";

export interface EconomicsModel {
  options: EconomicsOptionInput[];
  tariffs: TariffsInput;
  upkeep: UpkeepInput;
  economics: EconomicsInput;
  bases: OptionBasis[];
  baseIndex: number;
  pricing: Pricing;
}

/** Per-option pricing bases: physical quantities and cost items at base-date prices, ready to be re-priced (what-if, Monte Carlo) without re-running the physics. */
export function buildBases(
  physics: OptionAnnualPhysics[],
  options: EconomicsOptionInput[],
  tariffs: TariffsInput,
  upkeep: UpkeepInput,
  economics: EconomicsInput,
  warnings: EngineWarning[],
): OptionBasis[] {
  const byId = new Map(physics.map((p) => [p.optionId, p]));
  return options.map((o) => buildOptionBasis(byId.get(o.optionId), o, tariffs, upkeep, economics, warnings));
}

/** The deterministic economics model of a scenario: bases, base pricing and the base option (NIST Handbook 135 life-cycle cost). */
export function buildModel(
  physics: OptionAnnualPhysics[],
  options: EconomicsOptionInput[],
  tariffs: TariffsInput,
  upkeep: UpkeepInput,
  economics: EconomicsInput,
  baseOptionId: string | undefined,
  warnings: EngineWarning[],
): EconomicsModel {
  const wanted = baseOptionId ?? economics.baseOptionId;
  let baseIndex = 0;
  if (wanted !== undefined) {
    const i = options.findIndex((o) => o.optionId === wanted);
    if (i >= 0) baseIndex = i;
    else
      warnings.push({
        code: "economics.baseOptionUnknown",
        severity: "warning",
        message: `Base option "${wanted}" is not among the options; the first option is the base.`,
        path: "economics.baseOptionId",
      });
  }
  return {
    options,
    tariffs,
    upkeep,
    economics,
    bases: buildBases(physics, options, tariffs, upkeep, economics, warnings),
    baseIndex,
    pricing: basePricing(tariffs, economics),
  };
}

/** Same model with the bases rebuilt from other physics (warnings of the rebuild are dropped). */
export function withPhysics(model: EconomicsModel, physics: OptionAnnualPhysics[]): EconomicsModel {
  return {
    ...model,
    bases: buildBases(physics, model.options, model.tariffs, model.upkeep, model.economics, []),
  };
}

/**
 * First-cost scale per option for a premium factor k: each alternative's first cost becomes
 * F_base + k·(F_alt − F_base), i.e. it is scaled by that over F_alt (never below 0); the base keeps 1.
 */
export function premiumScales(bases: readonly OptionBasis[], baseIndex: number, k: number): number[] {
  const fb = bases[baseIndex]?.firstCost ?? 0;
  return bases.map((b, i) => {
    if (i === baseIndex || k === 1 || !(b.firstCost > 0)) return 1;
    return Math.max(0, fb + k * (b.firstCost - fb)) / b.firstCost;
  });
}

/** Present-value life-cycle cost of each option (money) under one pricing, optionally with per-option first-cost scales. */
export function lccsOf(
  bases: readonly OptionBasis[],
  pricing: Pricing,
  scales?: readonly number[],
): number[] {
  return bases.map((b, i) => evaluateOptionBasis(b, pricing, scales?.[i] ?? 1).lcc);
}

/** Net savings of option `altIndex` against the base: LCC_base − LCC_alt. */
export function netSavingsOf(lccs: readonly number[], baseIndex: number, altIndex: number): number {
  return (lccs[baseIndex] ?? 0) - (lccs[altIndex] ?? 0);
}

/** Full deterministic result (cash-flow tables, measures) for one pricing; no sensitivity, no Monte Carlo. */
export function deterministicResult(
  model: EconomicsModel,
  pricing: Pricing,
  scales: readonly number[] | undefined,
  warnings: EngineWarning[],
): EconomicsResult {
  const econ = model.economics;
  const n = econ.studyPeriodYears;
  const d = analysisDiscountRate(pricing);
  const options: OptionEconomics[] = model.bases.map((b, i) => {
    const ev = evaluateOptionBasis(b, pricing, scales?.[i] ?? 1, true, econ.baseYear);
    const scale = scales?.[i] ?? 1;
    const firstCostByItem = { ...b.firstCostByItem };
    if (scale !== 1)
      for (const k of Object.keys(firstCostByItem) as (keyof typeof firstCostByItem)[])
        firstCostByItem[k] *= scale;
    return {
      optionId: b.optionId,
      kind: b.kind,
      label: b.label,
      firstCost: b.firstCost * scale,
      firstCostByItem,
      firstCostMissing: b.firstCostMissing,
      cashFlows: ev.cashFlows ?? [],
      pvByCategory: ev.pvByCategory,
      lcc: ev.lcc,
      annualisedCost: annualisedCost(ev.lcc, d, n),
      firstYearOperatingCost: ev.firstYearOperatingCost,
    };
  });
  const base = options[model.baseIndex] ?? options[0];
  const comparisons = base ? options.filter((o) => o !== base).map((o) => compareOptions(base, o, d, n)) : [];
  let lowest = options[0];
  for (const o of options) if (lowest && o.lcc < lowest.lcc) lowest = o;
  return {
    analysis: pricing.analysis,
    discounting: pricing.discounting,
    baseYear: econ.baseYear,
    studyPeriodYears: n,
    discountRate: d,
    realDiscountRate: pricing.realDiscountRate,
    nominalDiscountRate: nominalFromReal(pricing.realDiscountRate, pricing.inflationRate),
    inflationRate: pricing.inflationRate,
    baseOptionId: base?.optionId ?? "",
    options,
    comparisons,
    lowestLccOptionId: lowest?.optionId ?? "",
    firstCostsMissing: options.filter((o) => o.firstCostMissing).map((o) => o.optionId),
    warnings,
  };
}
