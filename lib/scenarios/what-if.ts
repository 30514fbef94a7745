/**
 * The what-if recompute, nothing saved. Prices, the discount rate, the first-cost premium and the cycles
 * re-price the stored physics (cycles by the exact water balance B = E/(C − 1) − D). Physical inputs — the
 * load, a climate shift, the fouling growth, the minimum condensing temperature, the fan control and each
 * option's selection size — re-run the physics on the compressed climate, applied as a change to the stored
 * hourly result (lib/engine/what-if.ts). The body is validated with pieces of the scenario schema.
 */
import { z } from "zod";
import { text } from "@/lib/validation/text";
import { prepareScenario, type PhysicsOverrides, type PreparedScenario, type ScenarioResult } from "@/lib/engine";
import { economicsOptionsOf } from "@/lib/engine/condenser-plan";
import type { StoredEconomicsInputs, WhatIfOverrides } from "@/lib/engine/economics";
import type { ScenarioInput } from "@/lib/engine/input";
import { needsPhysics, scenarioWhatIf } from "@/lib/engine/what-if";
import { Lru } from "./cache";
import type { UnitSystem } from "@/lib/units";
import { buildHeadline, type Headline } from "@/lib/comparison/headline";
import { waterObjectSchema } from "./schema";
import { economicsSchema } from "./schema-economics";

const factor = z.number().finite().min(0, "a factor cannot be negative").max(10, "at most ×10");

/** Physical ranges of the what-if's physical inputs (common practice, no source: a screening envelope). */
export const WHAT_IF_PHYSICAL_RANGES = {
  loadFactor: { min: 0.2, max: 2 },
  climateShiftK: { min: -5, max: 5 },
  foulingRateFactor: { min: 0, max: 10 },
  minimumCondensingC: { min: 5, max: 60 },
  sizeFactor: { min: 0.3, max: 3 },
} as const;

const ranged = (r: { min: number; max: number }, what: string) =>
  z.number().finite().min(r.min, `${what} cannot be below ${r.min}`).max(r.max, `${what} cannot exceed ${r.max}`);

export const whatIfBodySchema = z
  .object({
    waterAndSewerPriceFactor: factor.optional(),
    electricityPriceFactor: factor.optional(),
    cyclesOfConcentration: waterObjectSchema.shape.cyclesOfConcentration,
    discountRate: economicsSchema.shape.realDiscountRate.unwrap().optional(),
    firstCostPremiumFactor: factor.optional(),
    loadFactor: ranged(WHAT_IF_PHYSICAL_RANGES.loadFactor, "a load factor").optional(),
    climateShiftK: ranged(WHAT_IF_PHYSICAL_RANGES.climateShiftK, "a climate shift (K)").optional(),
    foulingRateFactor: ranged(WHAT_IF_PHYSICAL_RANGES.foulingRateFactor, "a fouling growth factor").optional(),
    minimumCondensingC: ranged(WHAT_IF_PHYSICAL_RANGES.minimumCondensingC, "a minimum condensing temperature (°C)").optional(),
    fanControl: z.enum(["variableSpeed", "twoSpeed", "cycling"]).optional(),
    sizeFactorByOptionId: z
      .record(text().min(1).max(100), ranged(WHAT_IF_PHYSICAL_RANGES.sizeFactor, "a selection size factor"))
      .refine((r) => Object.keys(r).length <= 8, "at most eight options")
      .optional(),
  })
  .strict();
export type WhatIfBody = z.infer<typeof whatIfBodySchema>;

/** Largest what-if body accepted (a dozen numbers and four option ids need well under 1 kB). */
export const WHAT_IF_MAX_BYTES = 4096;

/**
 * Checks of the body against the scenario it moves (field path → messages): the option ids of the size
 * factors exist; the minimum condensing temperature stays at or below the set-point and applies only under
 * floating head pressure; physical inputs need the scenario's climate.
 */
export function whatIfFieldErrors(body: WhatIfBody, input: ScenarioInput, physicsAvailable: boolean): Record<string, string[]> {
  const errors: Record<string, string[]> = {};
  const add = (path: string, message: string) => (errors[path] ??= []).push(message);
  const ids = new Set(input.options.map((o) => o.id));
  for (const id of Object.keys(body.sizeFactorByOptionId ?? {})) {
    if (!ids.has(id)) add(`sizeFactorByOptionId.${id}`, "no option of this scenario has this id");
  }
  const m = body.minimumCondensingC;
  if (m !== undefined) {
    if (input.duty.headPressureControl !== "floating") add("minimumCondensingC", "applies only under floating head pressure");
    else if (m > input.duty.condensingSetPointC) add("minimumCondensingC", `cannot exceed the condensing set-point of ${input.duty.condensingSetPointC} °C`);
  }
  if (!physicsAvailable && needsPhysics(physicalOverrides(body))) {
    for (const k of PHYSICAL_KEYS) if (body[k] !== undefined) add(k, "this version's climate is not stored with it: only prices can be moved");
  }
  return errors;
}

const PHYSICAL_KEYS = ["loadFactor", "climateShiftK", "foulingRateFactor", "minimumCondensingC", "fanControl", "sizeFactorByOptionId"] as const;

/** The physical part of a what-if body. */
export function physicalOverrides(body: WhatIfBody): PhysicsOverrides {
  const o: PhysicsOverrides = {};
  if (body.loadFactor !== undefined) o.loadFactor = body.loadFactor;
  if (body.climateShiftK !== undefined) o.climateShiftK = body.climateShiftK;
  if (body.foulingRateFactor !== undefined) o.foulingRateFactor = body.foulingRateFactor;
  if (body.minimumCondensingC !== undefined) o.minimumCondensingC = body.minimumCondensingC;
  if (body.fanControl !== undefined) o.fanControl = body.fanControl;
  if (body.sizeFactorByOptionId !== undefined) o.sizeFactorByOptionId = body.sizeFactorByOptionId;
  return o;
}

/**
 * Prepared scenarios (climate psychrometrics, calibrations, the compressed climate and its reference run)
 * kept in the process for the slider's next move, keyed by whatever identifies the input (scenario, inputs
 * hash). A miss costs one preparation (tens of milliseconds); correctness never depends on a hit.
 */
const g = globalThis as unknown as { loopledgerPreparedCache?: Lru<PreparedScenario | null> };
const preparedCache = (g.loopledgerPreparedCache ??= new Lru<PreparedScenario | null>(16));

/** The prepared scenario for a physical what-if, or null when the input cannot be prepared (no climate stored). */
export function preparedFor(key: string, input: ScenarioInput): PreparedScenario | null {
  const hit = preparedCache.get(key);
  if (hit !== undefined) return hit;
  let p: PreparedScenario | null;
  try {
    p = input.climate ? prepareScenario(input) : null;
  } catch {
    p = null;
  }
  preparedCache.set(key, p);
  return p;
}

export interface WhatIfResponse {
  headline: Headline;
  lowestLccOptionId: string;
  discountRate: number;
  options: {
    optionId: string;
    label: string;
    lcc: number;
    annualisedCost: number;
    firstCost: number;
    firstYearOperatingCost: number;
  }[];
  /** True when the physics was re-run (physical inputs moved). */
  physicsRerun: boolean;
  comparisons: {
    baseOptionId: string;
    alternativeOptionId: string;
    netSavings: number;
    sir: number | null;
    simplePaybackYears: number | null;
    discountedPaybackYears: number | null;
  }[];
  elapsedMs: number;
}

/** The economics inputs the what-if needs: the input's prices and costs, the stored result's physics. */
export function storedEconomicsInputs(input: ScenarioInput, result: ScenarioResult): StoredEconomicsInputs {
  return {
    physics: result.physics,
    options: economicsOptionsOf(input),
    tariffs: input.tariffs,
    upkeep: input.upkeep,
    economics: input.economics,
    ...(input.economics.baseOptionId !== undefined ? { baseOptionId: input.economics.baseOptionId } : {}),
  };
}

export function computeWhatIf(
  input: ScenarioInput,
  result: ScenarioResult,
  body: WhatIfBody,
  system: UnitSystem,
  currency: string,
  prepared: PreparedScenario | null = null,
): WhatIfResponse {
  const t0 = performance.now();
  const overrides: WhatIfOverrides = {};
  if (body.waterAndSewerPriceFactor !== undefined) overrides.waterAndSewerPriceFactor = body.waterAndSewerPriceFactor;
  if (body.electricityPriceFactor !== undefined) overrides.electricityPriceFactor = body.electricityPriceFactor;
  if (body.cyclesOfConcentration !== undefined) overrides.cyclesOfConcentration = body.cyclesOfConcentration;
  if (body.discountRate !== undefined) overrides.discountRate = body.discountRate;
  if (body.firstCostPremiumFactor !== undefined) overrides.firstCostPremiumFactor = body.firstCostPremiumFactor;
  const physical = physicalOverrides(body);
  const physicsRerun = prepared !== null && needsPhysics(physical);
  const e = scenarioWhatIf(prepared, storedEconomicsInputs(input, result), overrides, physical);
  const headline = buildHeadline(e, system, currency);
  return {
    headline,
    physicsRerun,
    lowestLccOptionId: e.lowestLccOptionId,
    discountRate: e.discountRate,
    options: e.options.map((o) => ({
      optionId: o.optionId,
      label: o.label,
      lcc: o.lcc,
      annualisedCost: o.annualisedCost,
      firstCost: o.firstCost,
      firstYearOperatingCost: o.firstYearOperatingCost,
    })),
    comparisons: e.comparisons.map((c) => ({
      baseOptionId: c.baseOptionId,
      alternativeOptionId: c.alternativeOptionId,
      netSavings: c.netSavings,
      sir: c.sir,
      simplePaybackYears: c.simplePaybackYears,
      discountedPaybackYears: c.discountedPaybackYears,
    })),
    elapsedMs: performance.now() - t0,
  };
}

/**
 * The panel's starting points, in SI: combined water + sewer price, the scenario's cycles (what the
 * cycles slider replaces; loops with their own cycles follow in proportion), the discount rate; the
 * head-pressure control and its temperatures, the options (for the size sliders) and whether the physics
 * can be re-run (the input carries its climate).
 */
export function whatIfBaseline(input: ScenarioInput, result: ScenarioResult) {
  const wet = result.physics.filter((p) => p.waterM3.makeup > 0);
  const scenarioCycles = wet.find((p) => p.scenarioCyclesOfConcentration !== undefined)?.scenarioCyclesOfConcentration;
  const controls = [...new Set(input.options.map((o) => o.fan.control))];
  return {
    waterAndSewerPricePerM3: input.tariffs.water.pricePerM3 + input.tariffs.sewer.pricePerM3,
    electricityPricePerKWh: input.tariffs.electricity.energyPricePerKWh,
    cyclesOfConcentration:
      scenarioCycles ?? (wet.length > 0 ? wet.reduce((s, p) => s + p.cyclesOfConcentration, 0) / wet.length : 3),
    discountRate: result.economics.discountRate,
    analysis: result.economics.analysis,
    physicsAvailable: Boolean(input.climate),
    headPressureControl: input.duty.headPressureControl,
    minimumCondensingC: input.duty.minimumCondensingC,
    condensingSetPointC: input.duty.condensingSetPointC,
    /** The fan control every option has, or null when they differ. */
    fanControl: controls.length === 1 ? (controls[0] ?? null) : null,
    options: input.options.map((o) => ({ optionId: o.id, label: o.label })),
  };
}
export type WhatIfBaseline = ReturnType<typeof whatIfBaseline>;
