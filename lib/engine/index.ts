/**
 * LoopLedger engine entry point: a scenario in, yearly physics and life-cycle economics out.
 * Pure and synchronous; no I/O. SI throughout.
 */
import {
  type CompressorSummary,
  type PreparedClimate,
  type PreparedOption,
  compressorModelFromDuty,
  computeOptionsPhysics,
  prepareClimate,
  prepareOption,
} from "./annual";
import { type ClimateCompression, compressHourlyYear, prepareCompressedClimate } from "./annual/compress";
import { optionVariant } from "./annual/variants";
import { physicsNear } from "./what-if";
import { climateYearWarnings, toClimateYear } from "./climate/input";
import { type CondenserPlan, condenserPlans, economicsOptionsOf, inventoryWarnings, optionsWithCondenserPlans } from "./condenser-plan";
import { type ScenarioFootprint, scenarioFootprint } from "./footprint";
import { type ClimateSummary, summarizeClimate } from "./climate/summary";
import type { ClimateYear } from "./climate/types";
import { analyzeEconomics } from "./economics";
import type { EconomicsResult, PhysicsOverrides } from "./economics/types";
import type { ScenarioInput } from "./input";
import { pressureFromElevationPa } from "./psychrometrics";
import type { EngineWarning, OptionAnnualPhysics } from "./types";
import { ENGINE_VERSION } from "./version";
import { UNLIMITED_BUDGET, type AnalysisBudget } from "./budget";

export { ENGINE_VERSION } from "./version";
export { AnalysisBudgetExceeded, AnalysisLimitExceeded, isBudgetExceeded, timeBudget, UNLIMITED_BUDGET, type AnalysisBudget } from "./budget";
export type { ScenarioInput } from "./input";
export type { PhysicsOverrides } from "./economics/types";
export type { CondenserPlan } from "./condenser-plan";
export type { OptionFootprint, ScenarioFootprint } from "./footprint";

export interface ScenarioResult {
  engineVersion: string;
  /** Set by the caller that stores the result (hash of the canonical input). */
  inputsHash?: string;
  physics: OptionAnnualPhysics[];
  economics: EconomicsResult;
  climateSummary: ClimateSummary & { sitePressurePa: number };
  /** The compressor model every option's compressor energy comes from. */
  compressor?: CompressorSummary;
  /** Each option's condenser as built and kept (absent from results stored before engine 2.1). */
  condensers?: CondenserPlan[];
  /** Each option's water and carbon footprint (absent from results stored before engine 2.1). */
  footprint?: ScenarioFootprint;
  warnings: EngineWarning[];
}

/** A scenario prepared once: climate psychrometrics and every option's calibration. */
export interface PreparedScenario {
  input: ScenarioInput;
  pressurePa: number;
  year: ClimateYear;
  climate: PreparedClimate;
  options: PreparedOption[];
  /** Each option's condenser plan (construction, inventory, upkeep), resolved once. */
  plans: CondenserPlan[];
  foulingCostCache: Map<string, number>;
  /** Climates prepared for what-if runs, by resolution and shift (built on first use). */
  climateCache: Map<string, PreparedClimate>;
  /** The hourly year's compression (built on first use; bins climates need none). */
  compression?: ClimateCompression;
  /** Physics of the compressed climate at the entered values (the what-if's reference, built on first use). */
  compressedBase?: OptionAnnualPhysics[];
}

/**
 * Resolution of a physics run: every record of the climate ("full": 8760 hours, or the bins as entered),
 * or the compressed climate ("compressed": the hourly year folded into month × wet-bulb × depression × load
 * records, lib/engine/annual/compress.ts; a bins climate is already compact and runs as entered).
 */
export type PhysicsResolution = "full" | "compressed";

/** Resolve the climate and calibrate every option (the part of an analysis no what-if changes). */
export function prepareScenario(input: ScenarioInput): PreparedScenario {
  const pressurePa = pressureFromElevationPa(input.site.elevationM);
  const year = toClimateYear(input.climate);
  const plans = condenserPlans(input);
  // Physics and economics read the options with their condenser plans folded in (cleaning cost,
  // inspection, wear part, fouling multiplier on open-tower water).
  const options = optionsWithCondenserPlans(input, plans);
  return {
    input,
    pressurePa,
    year,
    climate: prepareClimate(year, pressurePa),
    options: options.map((o, i) => prepareOption(o, i, input.duty, input.fouling, pressurePa)),
    plans,
    foulingCostCache: new Map(),
    climateCache: new Map(),
  };
}

/** The prepared climate of a resolution and a climate shift (cached on the prepared scenario). */
export function climateOf(prepared: PreparedScenario, resolution: PhysicsResolution, shiftK = 0): PreparedClimate {
  const compressed = resolution === "compressed" && prepared.year.kind === "hourly";
  if (shiftK === 0 && !compressed) return prepared.climate;
  const key = `${compressed ? "c" : "f"}|${shiftK}`;
  const hit = prepared.climateCache.get(key);
  if (hit) return hit;
  let climate: PreparedClimate;
  if (compressed && prepared.year.kind === "hourly") {
    prepared.compression ??= compressHourlyYear(prepared.year, prepared.input.duty.loadProfile);
    climate = prepareCompressedClimate(prepared.compression, prepared.year, prepared.input.duty.loadProfile, prepared.pressurePa, shiftK);
  } else {
    climate = prepareClimate(prepared.year, prepared.pressurePa, shiftK);
  }
  // A Monte Carlo draws a new shift per draw: keep the cache small.
  if (prepared.climateCache.size >= 8) prepared.climateCache.clear();
  prepared.climateCache.set(key, climate);
  return climate;
}

/** Flat price for the cleaning-interval optimum: the energy price, or the mean of the 288 time-of-use prices. */
function flatElectricityPrice(input: ScenarioInput): number {
  const e = input.tariffs.electricity;
  if (e.pricing === "monthHour" && e.energyPricePerKWhByMonthHour && e.energyPricePerKWhByMonthHour.length > 0) {
    const p = e.energyPricePerKWhByMonthHour;
    return p.reduce((a, b) => a + b, 0) / p.length;
  }
  return e.energyPricePerKWh;
}

/**
 * Yearly physics of every option of a prepared scenario, with what-if overrides: absolute cycles of
 * concentration for every wet loop, a factor on the fouling growth rate, a factor on the duty, a shift of
 * the climate, the minimum condensing temperature, the fan control, a selection size factor per option.
 * `resolution` "compressed" runs the compressed climate (for many re-runs: what-if, Monte Carlo);
 * `cleaningOptimum` false skips the cost-minimising cleaning interval (reported, never priced).
 */
export function physicsOf(
  prepared: PreparedScenario,
  overrides: PhysicsOverrides = {},
  resolution: PhysicsResolution = "full",
  cleaningOptimum = true,
): OptionAnnualPhysics[] {
  const input = prepared.input;
  const shiftK = overrides.climateShiftK ?? 0;
  const climate = climateOf(prepared, resolution, shiftK);
  const duty =
    overrides.minimumCondensingC !== undefined ? { ...input.duty, minimumCondensingC: overrides.minimumCondensingC } : input.duty;
  const sizes = overrides.sizeFactorByOptionId ?? {};
  const options = prepared.options.map((po) =>
    optionVariant(po, {
      ...(overrides.fanControl !== undefined ? { fanControl: overrides.fanControl } : {}),
      sizeFactor: sizes[po.input.id] ?? 1,
    }),
  );
  // The cleaning optimum's energy slope depends on everything but the cycles and the fouling rate.
  const cacheKey = [
    climate === prepared.climate ? "base" : `${resolution}|${shiftK}`,
    duty.minimumCondensingC,
    overrides.fanControl ?? "",
    options.map((po) => sizes[po.input.id] ?? 1).join(","),
  ].join("|");
  return computeOptionsPhysics(options, climate, duty, input.water, input.fouling, prepared.pressurePa, {
    ...(overrides.cyclesOfConcentration !== undefined ? { cyclesOverride: overrides.cyclesOfConcentration } : {}),
    ...(overrides.foulingRateFactor !== undefined ? { foulingRateFactor: overrides.foulingRateFactor } : {}),
    ...(overrides.loadFactor !== undefined ? { loadFactor: overrides.loadFactor } : {}),
    ...(Object.keys(overrides).length > 0 || resolution === "compressed" ? { skipDesignDay: true } : {}),
    electricityPricePerKWh: cleaningOptimum ? flatElectricityPrice(input) : 0,
    foulingCostCache: prepared.foulingCostCache,
    foulingCostCacheKey: cacheKey,
  });
}

/**
 * Re-run the physics of a scenario with overrides (a convenience for callers that hold only the input;
 * `analyzeScenario` passes a closure over its prepared scenario to the economics instead).
 */
export function rerunPhysics(input: ScenarioInput, overrides: PhysicsOverrides): OptionAnnualPhysics[] {
  return physicsOf(prepareScenario(input), overrides);
}

/**
 * Analyse a validated scenario: climate → per-option yearly physics (tower/cooler, condenser, fouling,
 * water) → life-cycle economics with sensitivity and Monte Carlo when enabled. The economics receive a
 * `rerunPhysics` closure over the prepared scenario for physics-dependent sensitivities. `budget` (none by
 * default) stops a run that takes longer than its time budget with AnalysisBudgetExceeded.
 */
export function analyzeScenario(
  input: ScenarioInput,
  onProgress?: (fraction: number) => void,
  budget: AnalysisBudget = UNLIMITED_BUDGET,
): ScenarioResult {
  const prepared = prepareScenario(input);
  budget.check("the climate preparation");
  const physics = physicsOf(prepared);
  budget.check("the yearly physics");
  const progress = (fraction: number) => {
    budget.check("the Monte Carlo draws");
    onProgress?.(fraction);
  };
  const economics = analyzeEconomics({
    physics,
    options: economicsOptionsOf(input, prepared.plans),
    tariffs: input.tariffs,
    upkeep: input.upkeep,
    economics: input.economics,
    ...(input.sensitivity ? { sensitivity: input.sensitivity } : {}),
    ...(input.monteCarlo ? { monteCarlo: input.monteCarlo } : {}),
    ...(input.economics.baseOptionId !== undefined ? { baseOptionId: input.economics.baseOptionId } : {}),
    rerunPhysics: (o: PhysicsOverrides) => {
      budget.check("a physics re-run for the sensitivity or Monte Carlo");
      return physicsOf(prepared, o);
    },
    drawPhysics: (o: PhysicsOverrides) => {
      budget.check("the Monte Carlo draws");
      return physicsNear(prepared, physics, o);
    },
    onProgress: progress,
  });
  budget.check("the economics");
  const compressor = compressorModelFromDuty(input.duty);
  const warnings: EngineWarning[] = [...climateYearWarnings(prepared.year), ...compressor.warnings];
  if (prepared.climate.monthsUnknown) {
    warnings.push({
      code: "climate.binsWithoutMonths",
      severity: "info",
      message:
        "The bins carry no month: energy and water are spread over the months by days, and each month's peak demand is estimated — halfway between the annual peak and a perfectly seasonal demand-duration curve, averaged over the twelve months (Methods §6). Bins with months, or hourly data, give each month its own peak.",
      path: "climate.bins",
    });
  }
  for (const p of physics) warnings.push(...p.warnings);
  for (const p of prepared.plans) warnings.push(...p.warnings);
  warnings.push(...inventoryWarnings(input, prepared.plans));
  warnings.push(...economics.warnings);
  return {
    engineVersion: ENGINE_VERSION,
    physics,
    economics,
    climateSummary: { ...summarizeClimate(prepared.year), sitePressurePa: prepared.pressurePa },
    compressor: compressor.summary,
    condensers: prepared.plans,
    footprint: scenarioFootprint(physics, prepared.plans, input.duty.refrigerant, input.footprint),
    warnings,
  };
}
