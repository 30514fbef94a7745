/**
 * Life-cycle economics of the LoopLedger engine: NIST Handbook 135 / ASTM E917 LCC per option,
 * savings measures against a base option, tornado, break-evens and Monte Carlo.
 */
import type { EngineWarning, OptionAnnualPhysics } from "../types";
import { basisAtCycles } from "./cashflows";
import { realFromNominal } from "./factors";
import { buildModel, deterministicResult, premiumScales, withPhysics } from "./model";
import { runMonteCarlo } from "./montecarlo";
import { PhysicsCache, runSensitivity } from "./sensitivity";
import type {
  AnalyzeEconomicsArgs,
  EconomicsInput,
  EconomicsOptionInput,
  EconomicsResult,
  RerunPhysics,
  TariffsInput,
  UpkeepInput,
  WhatIfOverrides,
} from "./types";

export * from "./types";
export {
  spv,
  upv,
  upvStar,
  spvMidYear,
  upvMidYear,
  upvStarMidYear,
  nominalFromReal,
  realFromNominal,
  crf,
  airrFromSir,
} from "./factors";
export { waterAtCycles } from "./cashflows";
export { sampleDistribution, spearmanRankCorrelation } from "./montecarlo";
export { mulberry32 } from "../random";
export { formatEconomicsSummary } from "./summary";

/**
 * Full economics of a scenario: per-option cash flows and present-value LCC by category (Handbook 135),
 * measures of every alternative against the base (`baseOptionId`, else `economics.baseOptionId`, else
 * the first option), and — when enabled — the tornado and break-evens (`sensitivity`) and the Monte
 * Carlo (`monteCarlo`). Physics-dependent sensitivities call `rerunPhysics`; prices reuse `physics`.
 */
export function analyzeEconomics(args: AnalyzeEconomicsArgs): EconomicsResult {
  const warnings: EngineWarning[] = [];
  const model = buildModel(
    args.physics,
    args.options,
    args.tariffs,
    args.upkeep,
    args.economics,
    args.baseOptionId,
    warnings,
  );
  const result = deterministicResult(model, model.pricing, undefined, warnings);
  if (result.firstCostsMissing.length > 0) {
    const names = model.bases.filter((b) => b.firstCostMissing).map((b) => b.label);
    warnings.push({
      code: "economics.firstCostsMissing",
      severity: "info",
      message: `First costs are missing for ${names.join(", ")}: water, energy and yearly operating costs are computed; the life-cycle cost, net savings, SIR, AIRR and paybacks wait for the first costs, and the tornado and Monte Carlo are not run.`,
    });
    return result;
  }
  const physics = new PhysicsCache(args.rerunPhysics);
  if (args.sensitivity?.enabled && model.bases.length > 1) {
    const baseId = model.bases[model.baseIndex]?.optionId;
    const kwh = args.physics.find((p) => p.optionId === baseId)?.energyKWh.total ?? 0;
    result.sensitivity = runSensitivity(model, args.sensitivity, physics, kwh);
  }
  if (args.monteCarlo?.enabled && model.bases.length > 0) {
    result.monteCarlo = runMonteCarlo(model, args.monteCarlo, physics, args.onProgress, args.drawPhysics);
  }
  return result;
}

export interface StoredEconomicsInputs {
  physics: OptionAnnualPhysics[];
  options: EconomicsOptionInput[];
  tariffs: TariffsInput;
  upkeep: UpkeepInput;
  economics: EconomicsInput;
  baseOptionId?: string;
}

/**
 * Light re-evaluation for the what-if panel: the stored physics re-priced with the overrides (water and
 * sewer price factor, electricity price factor, discount rate, first-cost premium factor, cycles), with
 * cash flows and measures but no sensitivity and no Monte Carlo. Cycles re-run the physics when
 * `rerunPhysics` is given, else use the exact water-balance recompute B = E/(C − 1) − D.
 * `discountRate` replaces the analysis' rate (real in a real analysis, nominal in a nominal one).
 */
export function whatIf(
  stored: StoredEconomicsInputs,
  overrides: WhatIfOverrides,
  rerunPhysics?: RerunPhysics,
): EconomicsResult {
  const warnings: EngineWarning[] = [];
  let model = buildModel(
    stored.physics,
    stored.options,
    stored.tariffs,
    stored.upkeep,
    stored.economics,
    stored.baseOptionId,
    warnings,
  );
  const c = overrides.cyclesOfConcentration;
  if (c !== undefined) {
    model = rerunPhysics
      ? withPhysics(model, rerunPhysics({ cyclesOfConcentration: c }))
      : { ...model, bases: model.bases.map((b) => basisAtCycles(b, c)) };
  }
  const pricing = { ...model.pricing };
  if (overrides.waterAndSewerPriceFactor !== undefined) {
    pricing.waterPriceFactor = overrides.waterAndSewerPriceFactor;
    pricing.sewerPriceFactor = overrides.waterAndSewerPriceFactor;
  }
  if (overrides.electricityPriceFactor !== undefined)
    pricing.electricityPriceFactor = overrides.electricityPriceFactor;
  if (overrides.discountRate !== undefined) {
    pricing.realDiscountRate =
      pricing.analysis === "nominal"
        ? realFromNominal(overrides.discountRate, pricing.inflationRate)
        : overrides.discountRate;
  }
  const scales =
    overrides.firstCostPremiumFactor !== undefined
      ? premiumScales(model.bases, model.baseIndex, overrides.firstCostPremiumFactor)
      : undefined;
  return deterministicResult(model, pricing, scales, warnings);
}
