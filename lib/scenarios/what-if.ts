/**
 * The what-if recompute: the stored physics re-priced with the panel's overrides through the economics'
 * `whatIf` (cycles by the exact water balance B = E/(C − 1) − D, no physics re-run), nothing saved.
 * The body is validated with pieces of the scenario schema.
 */
import { z } from "zod";
import type { ScenarioResult } from "@/lib/engine";
import { economicsOptionsOf } from "@/lib/engine/condenser-plan";
import { whatIf, type StoredEconomicsInputs, type WhatIfOverrides } from "@/lib/engine/economics";
import type { ScenarioInput } from "@/lib/engine/input";
import type { UnitSystem } from "@/lib/units";
import { buildHeadline, type Headline } from "@/components/comparison/headline";
import { waterObjectSchema } from "./schema";
import { economicsSchema } from "./schema-economics";

const factor = z.number().finite().min(0, "a factor cannot be negative").max(10, "at most ×10");

export const whatIfBodySchema = z
  .object({
    waterAndSewerPriceFactor: factor.optional(),
    electricityPriceFactor: factor.optional(),
    cyclesOfConcentration: waterObjectSchema.shape.cyclesOfConcentration,
    discountRate: economicsSchema.shape.realDiscountRate.unwrap().optional(),
    firstCostPremiumFactor: factor.optional(),
  })
  .strict();
export type WhatIfBody = z.infer<typeof whatIfBodySchema>;

/** Largest what-if body accepted (five numbers need a few hundred bytes). */
export const WHAT_IF_MAX_BYTES = 4096;

export interface WhatIfResponse {
  headline: Headline;
  lowestLccOptionId: string;
  discountRate: number;
  options: { optionId: string; label: string; lcc: number; annualisedCost: number; firstCost: number; firstYearOperatingCost: number }[];
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

export function computeWhatIf(input: ScenarioInput, result: ScenarioResult, body: WhatIfBody, system: UnitSystem, currency: string): WhatIfResponse {
  const t0 = performance.now();
  const overrides: WhatIfOverrides = {};
  if (body.waterAndSewerPriceFactor !== undefined) overrides.waterAndSewerPriceFactor = body.waterAndSewerPriceFactor;
  if (body.electricityPriceFactor !== undefined) overrides.electricityPriceFactor = body.electricityPriceFactor;
  if (body.cyclesOfConcentration !== undefined) overrides.cyclesOfConcentration = body.cyclesOfConcentration;
  if (body.discountRate !== undefined) overrides.discountRate = body.discountRate;
  if (body.firstCostPremiumFactor !== undefined) overrides.firstCostPremiumFactor = body.firstCostPremiumFactor;
  const e = whatIf(storedEconomicsInputs(input, result), overrides);
  const headline = buildHeadline(e, system, currency);
  return {
    headline,
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
 * cycles slider replaces; loops with their own cycles follow in proportion), the discount rate.
 */
export function whatIfBaseline(input: ScenarioInput, result: ScenarioResult) {
  const wet = result.physics.filter((p) => p.waterM3.makeup > 0);
  const scenarioCycles = wet.find((p) => p.scenarioCyclesOfConcentration !== undefined)?.scenarioCyclesOfConcentration;
  return {
    waterAndSewerPricePerM3: input.tariffs.water.pricePerM3 + input.tariffs.sewer.pricePerM3,
    electricityPricePerKWh: input.tariffs.electricity.energyPricePerKWh,
    cyclesOfConcentration:
      scenarioCycles ?? (wet.length > 0 ? wet.reduce((s, p) => s + p.cyclesOfConcentration, 0) / wet.length : 3),
    discountRate: result.economics.discountRate,
    analysis: result.economics.analysis,
  };
}
export type WhatIfBaseline = ReturnType<typeof whatIfBaseline>;
