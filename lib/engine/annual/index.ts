/**
 * Annual composition: every option's equipment model run over every hour (or bin) of the climate,
 * summed into `OptionAnnualPhysics`. The pipeline, one file per step:
 *
 * 1. climate.ts — climate preparation (entering-air state once per record);
 * 2. options.ts — option preparation and calibration (tower/cooler, condenser, exchanger, pumps);
 * 3. record.ts (+ record-tower.ts, record-cooler.ts) — one record per equipment kind: duty Q → required
 *    condenser entering water for the target condensing temperature (set-point, or the minimum under
 *    floating head pressure) through the option's (fouled) condenser and exchanger → the tower or cooler
 *    holds it with its fan control or floats at full speed → condensing temperature, fan, pump, spray and
 *    heater power, compressor penalty against the clean reference (clean condenser, no exchanger, same
 *    water from the tower/cooler), evaporation, drift;
 * 4. accumulate.ts — blowdown, makeup, sewer and the weighting into months; balances close per record:
 *    M − E − B − D = 0 and heat rejected = duty;
 * 5. cleaning.ts — the cleaning-interval optimum;
 * 6. finish.ts — warnings, water chemistry, the option's result.
 */
import type { FoulingInput, DutyInput, WaterInput } from "../input";
import { designHeatRejectionKW, designRefrigerationLoadKW } from "../duty";
import { type FoulingGrowth, optimalCleaningIntervalMonths, monthlyFoulingM2KPerW, peakFoulingM2KPerW, scaleGrowth } from "../fouling";
import type { EngineWarning, OptionAnnualPhysics } from "../types";
import { simulateOptionYear } from "./accumulate";
import { foulingCostPerMonthPerUnit } from "./cleaning";
import type { PreparedClimate } from "./climate";
import { type YearContext, compressorModelFromDuty, foulingGrowthFromInput, loopCycles, scenarioCycles } from "./context";
import { finishOption } from "./finish";
import type { PreparedOption } from "./options";
import { numericWarning, wv } from "../warnings";
import { designDayCheck } from "./design-day";

export { type PreparedClimate, prepareClimate } from "./climate";
export { type Device, type PreparedOption, prepareOption } from "./options";
export { type CompressorSummary, type YearContext, compressorModelFromDuty, foulingGrowthFromInput, loopCycles, scenarioCycles } from "./context";
export { type OptionYearTotals, simulateOptionYear } from "./accumulate";
export { WATER_DENSITY_KG_PER_M3 } from "./shared";

export interface AnnualOptions {
  cyclesOverride?: number;
  foulingRateFactor?: number;
  loadFactor?: number;
  /** Flat electricity price for the cleaning-interval optimum (0 or undefined: not computed). */
  electricityPricePerKWh?: number;
  /** Skip the design-hour check (re-runs for sensitivities, which report only quantities). */
  skipDesignDay?: boolean;
  /** Cache of the energy cost per unit fouling (per option id, per load factor) across re-runs. */
  foulingCostCache?: Map<string, number>;
  /** What else the cached slope depends on (climate, duty and option variants of a what-if). */
  foulingCostCacheKey?: string;
}

/**
 * All options over the year → OptionAnnualPhysics[]. Pure; the climate is prepared by the caller
 * (once per analysis) so what-if re-runs skip the psychrometrics of the weather.
 */
export function computeOptionsPhysics(
  prepared: PreparedOption[],
  climate: PreparedClimate,
  duty: DutyInput,
  water: WaterInput,
  fouling: FoulingInput,
  pPa: number,
  opts: AnnualOptions = {},
): OptionAnnualPhysics[] {
  const { cycles: baseCycles, limit } = scenarioCycles(water);
  const cycles = Math.max(opts.cyclesOverride ?? baseCycles, 1.05);
  const override = opts.cyclesOverride !== undefined ? cycles : undefined;
  const loadFactor = opts.loadFactor ?? 1;
  const ctx: YearContext = {
    pPa,
    climate,
    duty,
    designHeatKW: designHeatRejectionKW(duty),
    refrigerationPerRejection: designRefrigerationLoadKW(duty) / Math.max(designHeatRejectionKW(duty), 1e-9),
    compressor: compressorModelFromDuty(duty).model,
    water,
    cycles,
    loadFactor,
  };
  const baseGrowth = scaleGrowth(foulingGrowthFromInput(fouling), opts.foulingRateFactor ?? 1);
  return prepared.map((po) => {
    const o = po.input;
    const warnings: EngineWarning[] = [...po.warnings];
    const isDirect = o.kind === "openTowerDirect";
    const isPlate = o.kind === "openTowerPlateHx";
    const scaling = o.kind === "evaporativeCondenser" ? o.evaporativeCondenser.coilScaling : null;
    // The plate option's exchanger fouls at its own factor; the direct option's condenser at its
    // construction's multiplier on open-tower water (condenser-plan.ts). An evaporative condenser's coil
    // scales linearly to its derate before each cleaning (evaporative-condenser.ts), at the what-if
    // fouling-rate factor too; its monthly "fouling" is that capacity derate.
    const growth: FoulingGrowth = scaling
      ? { model: "linear", rateM2KPerWPerMonth: (Math.min(0.9, scaling.derateBeforeCleaning * (opts.foulingRateFactor ?? 1)) / Math.max(1, Math.round(scaling.cleaningIntervalMonths))) }
      : isPlate
        ? scaleGrowth(baseGrowth, o.plateExchanger.foulingGrowthFactor)
        : isDirect
          ? scaleGrowth(baseGrowth, o.condenser.foulingGrowthMultiplier ?? 1)
          : baseGrowth;
    const intervalMonths = isDirect
      ? fouling.condenserCleaningIntervalMonths
      : isPlate
        ? fouling.plateExchangerCleaningIntervalMonths
        : scaling
          ? Math.max(1, Math.round(scaling.cleaningIntervalMonths))
          : 0;
    const cleaned = isDirect || isPlate || scaling !== null;
    const monthlyRf = cleaned ? monthlyFoulingM2KPerW(growth, intervalMonths) : new Array<number>(12).fill(0);
    const optionCycles = loopCycles(o, baseCycles, override);
    const optionCtx: YearContext = { ...ctx, cycles: optionCycles };
    const totals = simulateOptionYear(po, optionCtx, monthlyRf);

    let optimal: number | null = null;
    if (cleaned && (opts.electricityPricePerKWh ?? 0) > 0) {
      const s = foulingCostPerMonthPerUnit(po, optionCtx, growth, intervalMonths, fouling, opts);
      optimal = optimalCleaningIntervalMonths(growth, o.costs.upkeep.cleaningCostPerEvent, s);
      if (optimal === null && o.costs.upkeep.cleaningCostPerEvent > 0 && s > 0) {
        warnings.push({
          code: "fouling.cleaningNeverPaysByEnergy",
          severity: "info",
          message: "With this asymptotic fouling the energy saved never repays a cleaning: clean on condition (inspection, eddy-current results) rather than on energy.",
          path: "fouling",
          optionId: o.id,
        });
      }
    }
    if ((isDirect || isPlate) && peakFoulingM2KPerW(growth, intervalMonths) > fouling.limitM2KPerW * (1 + 1e-6)) {
      warnings.push(
        numericWarning({
          code: "fouling.exceedsLimit",
          severity: "warning",
          template: "Fouling reaches {peak} before each cleaning, above the limit of {limit}: clean more often.",
          values: { peak: wv.fouling(peakFoulingM2KPerW(growth, intervalMonths)), limit: wv.fouling(fouling.limitM2KPerW) },
          path: isDirect ? "fouling.condenserCleaningIntervalMonths" : "fouling.plateExchangerCleaningIntervalMonths",
          optionId: o.id,
        }),
      );
    }
    if (totals.extrapolatedHours > 0 && ctx.compressor.kind === "manufacturer") {
      const x = ctx.compressor.kwPerKW.x;
      warnings.push(
        numericWarning({
          code: "compressor.dataExtrapolated",
          severity: "warning",
          template:
            "In {hours} the condensing temperature ({min} … {max}) lies outside the compressor data ({lo} … {hi}): the compressor power there is extrapolated along the end slope of the data — add points that cover it.",
          values: {
            hours: wv.hours(totals.extrapolatedHours),
            min: wv.tempC(totals.extrapolatedMinC),
            max: wv.tempC(totals.extrapolatedMaxC),
            lo: wv.tempC(x[0] ?? Number.NaN),
            hi: wv.tempC(x[x.length - 1] ?? Number.NaN),
          },
          path: "duty.compressorModel.curves",
          optionId: o.id,
        }),
      );
    }
    const physics = finishOption(po, totals, cycles, optionCycles, limit, water, intervalMonths, optimal, warnings, opts.cyclesOverride !== undefined);
    if (po.ratingFit) physics.ratingFit = po.ratingFit;
    if (!opts.skipDesignDay) {
      const dd = designDayCheck(po, ctx);
      if (dd) {
        physics.designDay = dd.check;
        physics.warnings.push(...dd.warnings);
      }
    }
    return physics;
  });
}
