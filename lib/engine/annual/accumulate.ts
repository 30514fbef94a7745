/**
 * Pipeline step 4 — accumulation: one option over the year, each record weighted by its hours and spread
 * over the months (an hour or a monthly bin to its month; a bin without a month pro rata by days), with
 * the water balance closed per record: B from the cycles, M = E + B + D, the sewer volume billed.
 */
import { blankEnteringAir, enteringAirAt } from "../air-side";
import { monthlyPeakFromMonthlessRecordsKW } from "../demand";
import { binLoadFraction, hourLoadFraction } from "../duty";
import type { EnergyByComponentKWh, MonthlyPhysics, WaterByComponentM3 } from "../types";
import { blowdown, sewerBilled } from "../water";
import type { YearContext } from "./context";
import type { PreparedOption } from "./options";
import { evaluateRecord, newRecordRates } from "./record";
import { DAYS_IN_MONTH, WATER_DENSITY_KG_PER_M3 } from "./shared";
import { resetCoolerWarmStarts } from "../fluid-cooler";
import { resetTowerWarmStart } from "../tower";

interface Accumulator {
  monthly: MonthlyPhysics[];
  byMonthHour: Float64Array;
  heatKWh: number;
  runningHours: number;
  condSum: number;
  refSum: number;
  hottestSurfaceC: number;
  aboveCleanKWh: number;
  extrapolatedHours: number;
  /** Condensing-temperature range where the compressor model extrapolated, °C. */
  extrapolatedMinC: number;
  extrapolatedMaxC: number;
  peakRfM2KPerW: number;
  /** Hours of wet operation (water on the fill or coil) below 0 °C dry-bulb, and the year's lowest dry-bulb. */
  wetHoursBelowFreezing: number;
  minDryBulbC: number;
}

export function emptyEnergy(): EnergyByComponentKWh {
  return { fan: 0, condenserPump: 0, secondaryPump: 0, sprayPump: 0, basinHeater: 0, compressor: 0, total: 0 };
}
export function emptyWater(): WaterByComponentM3 {
  return { evaporation: 0, drift: 0, blowdown: 0, makeup: 0, sewerBilled: 0 };
}

/**
 * Run one option over the year with a given tower-side fouling per calendar month (m²·K/W; the
 * condenser tubes for the direct option, the exchanger plates for the plate option, unused by the cooler).
 */
export function simulateOptionYear(
  po: PreparedOption,
  ctx: YearContext,
  foulingByMonth: readonly number[],
  stride = 1,
): OptionYearTotals {
  const cl = ctx.climate;
  // One rates object for the whole year: each record fills it and is read before the next one.
  const scratch = newRecordRates();
  // One entering-air object for the whole year too: each record's state is read into it from the columns.
  const scratchAir = blankEnteringAir(cl.air.table);
  // The solvers' warm starts begin afresh for every year, so a run never depends on what ran before it.
  resetCoolerWarmStarts();
  resetTowerWarmStart();
  const acc: Accumulator = {
    monthly: Array.from({ length: 12 }, (_, i) => ({
      month: i + 1,
      hours: 0,
      heatRejectedKWh: 0,
      energyKWh: emptyEnergy(),
      waterM3: emptyWater(),
      peakDemandKW: 0,
      dryModeHours: 0,
      unmetHours: 0,
    })),
    byMonthHour: new Float64Array(288),
    heatKWh: 0,
    runningHours: 0,
    condSum: 0,
    refSum: 0,
    hottestSurfaceC: Number.NEGATIVE_INFINITY,
    aboveCleanKWh: 0,
    extrapolatedHours: 0,
    extrapolatedMinC: Number.POSITIVE_INFINITY,
    extrapolatedMaxC: Number.NEGATIVE_INFINITY,
    peakRfM2KPerW: 0,
    wetHoursBelowFreezing: 0,
    minDryBulbC: Number.POSITIVE_INFINITY,
  };
  const meanRf = foulingByMonth.reduce((a, b) => a + b, 0) / 12;
  const cycles = ctx.cycles;
  const sewerBasis = ctx.water.sewerBasis;
  const toM3PerH = 3600 / WATER_DENSITY_KG_PER_M3;
  const profile = ctx.duty.loadProfile;
  // Records without a month (bins without months): their demand sets an estimated monthly peak (demand.ts).
  const monthless: { kW: number; hours: number }[] = [];
  for (let i = 0; i < cl.count; i += stride) {
    const air = enteringAirAt(cl.air, i, scratchAir);
    if (!air) continue;
    const month = cl.month[i] ?? 0;
    const w = (cl.hours[i] ?? 0) * stride;
    const fraction = cl.loadFraction
      ? (cl.loadFraction[i] ?? 0)
      : cl.kind === "hourly"
        ? hourLoadFraction(profile, month, cl.hour[i] ?? 0, air.dryBulbC)
        : binLoadFraction(profile, i, month > 0 ? month : undefined, air.dryBulbC);
    const heatKW = ctx.designHeatKW * fraction * ctx.loadFactor;
    const rf = month > 0 ? (foulingByMonth[month - 1] ?? 0) : meanRf;
    const r = evaluateRecord(po, ctx, air, heatKW, rf, scratch);
    const e = r.evaporationKgPerS * toM3PerH * w;
    const d = r.driftKgPerS * toM3PerH * w;
    const b = blowdown(e, cycles, d);
    const m = e + b + d;
    const sewer = sewerBilled(sewerBasis, m, e, b);
    const totalKW = r.fanKW + r.condenserPumpKW + r.secondaryPumpKW + r.sprayPumpKW + r.heaterKW + r.compressorKW;
    if (r.running) {
      acc.runningHours += w;
      acc.condSum += r.condensingC * w;
      acc.refSum += r.referenceC * w;
      acc.aboveCleanKWh += r.aboveCleanKW * w;
      if (r.compressorExtrapolated) {
        acc.extrapolatedHours += w;
        if (r.condensingC < acc.extrapolatedMinC) acc.extrapolatedMinC = r.condensingC;
        if (r.condensingC > acc.extrapolatedMaxC) acc.extrapolatedMaxC = r.condensingC;
      }
      if (r.hottestSurfaceC > acc.hottestSurfaceC) acc.hottestSurfaceC = r.hottestSurfaceC;
    }
    acc.heatKWh += (r.running ? heatKW : 0) * w;
    if (w > 0 && air.dryBulbC < acc.minDryBulbC) acc.minDryBulbC = air.dryBulbC;
    if (r.running && !r.dry && air.dryBulbC < 0) acc.wetHoursBelowFreezing += w;
    // Spread over months: an hour or a monthly bin goes to its month; a bin without month pro rata by days
    // (its energy and water; its demand joins the monthly-peak estimate below).
    const shares = month > 0 ? null : DAYS_IN_MONTH;
    if (month <= 0) monthless.push({ kW: totalKW, hours: w });
    // A record with a month touches that month only (share 1); one without, every month by its days.
    const firstMonth = shares ? 0 : month - 1;
    const endMonth = shares ? 12 : month;
    for (let mi = firstMonth; mi < endMonth; mi++) {
      const share = shares ? (shares[mi] ?? 0) / 365 : 1;
      if (share === 0) continue;
      const mo = acc.monthly[mi];
      if (!mo) continue;
      const ws = w * share;
      mo.hours += ws;
      mo.heatRejectedKWh += (r.running ? heatKW : 0) * ws;
      const en = mo.energyKWh;
      en.fan += r.fanKW * ws;
      en.condenserPump += r.condenserPumpKW * ws;
      en.secondaryPump += r.secondaryPumpKW * ws;
      en.sprayPump += r.sprayPumpKW * ws;
      en.basinHeater += r.heaterKW * ws;
      en.compressor += r.compressorKW * ws;
      en.total += totalKW * ws;
      const wa = mo.waterM3;
      wa.evaporation += e * share;
      wa.drift += d * share;
      wa.blowdown += b * share;
      wa.makeup += m * share;
      wa.sewerBilled += sewer * share;
      if (month > 0 && totalKW > mo.peakDemandKW) mo.peakDemandKW = totalKW;
      if (r.dry && r.running) mo.dryModeHours += ws;
      if (r.unmet) mo.unmetHours += ws;
      if (cl.kind === "hourly") {
        const idx = (month - 1) * 24 + (cl.hour[i] ?? 0);
        acc.byMonthHour[idx] = (acc.byMonthHour[idx] ?? 0) + totalKW * w;
      } else if (cl.hourOfDayHours) {
        // A compressed record's hours fall on known hours of the day (stride is 1 on compressed climates).
        for (let h = 0; h < 24; h++) {
          const hh = cl.hourOfDayHours[24 * i + h] ?? 0;
          if (hh > 0) acc.byMonthHour[mi * 24 + h] = (acc.byMonthHour[mi * 24 + h] ?? 0) + totalKW * hh * share;
        }
      } else {
        const per = (totalKW * ws) / 24;
        for (let h = 0; h < 24; h++) acc.byMonthHour[mi * 24 + h] = (acc.byMonthHour[mi * 24 + h] ?? 0) + per;
      }
    }
  }
  if (monthless.length > 0) {
    const estimate = monthlyPeakFromMonthlessRecordsKW(monthless);
    for (const mo of acc.monthly) if (estimate > mo.peakDemandKW) mo.peakDemandKW = estimate;
  }
  return totalsFrom(acc);
}

/** Year totals of one option before the water chemistry and cleaning analysis are attached. */
export interface OptionYearTotals {
  monthly: MonthlyPhysics[];
  byMonthHour: number[];
  energyKWh: EnergyByComponentKWh;
  waterM3: WaterByComponentM3;
  heatRejectedKWh: number;
  hoursTotal: number;
  runningHours: number;
  dryModeHours: number;
  unmetHours: number;
  meanCondensingC: number;
  meanReferenceCondensingC: number;
  aboveCleanKWh: number;
  extrapolatedHours: number;
  extrapolatedMinC: number;
  extrapolatedMaxC: number;
  hottestSurfaceC: number;
  wetHoursBelowFreezing: number;
  minDryBulbC: number;
}

function totalsFrom(acc: Accumulator): OptionYearTotals {
  const energy = emptyEnergy();
  const water = emptyWater();
  let hours = 0;
  let dry = 0;
  let unmet = 0;
  for (const mo of acc.monthly) {
    hours += mo.hours;
    dry += mo.dryModeHours;
    unmet += mo.unmetHours;
    for (const k of Object.keys(energy) as (keyof EnergyByComponentKWh)[]) energy[k] += mo.energyKWh[k];
    for (const k of Object.keys(water) as (keyof WaterByComponentM3)[]) water[k] += mo.waterM3[k];
  }
  return {
    monthly: acc.monthly,
    byMonthHour: Array.from(acc.byMonthHour),
    energyKWh: energy,
    waterM3: water,
    heatRejectedKWh: acc.heatKWh,
    hoursTotal: hours,
    runningHours: acc.runningHours,
    dryModeHours: dry,
    unmetHours: unmet,
    meanCondensingC: acc.runningHours > 0 ? acc.condSum / acc.runningHours : Number.NaN,
    meanReferenceCondensingC: acc.runningHours > 0 ? acc.refSum / acc.runningHours : Number.NaN,
    aboveCleanKWh: acc.aboveCleanKWh,
    extrapolatedHours: acc.extrapolatedHours,
    extrapolatedMinC: acc.extrapolatedMinC,
    extrapolatedMaxC: acc.extrapolatedMaxC,
    hottestSurfaceC: acc.hottestSurfaceC,
    wetHoursBelowFreezing: acc.wetHoursBelowFreezing,
    minDryBulbC: acc.minDryBulbC,
  };
}
