/**
 * Pipeline step 1 — climate preparation: the climate as the annual loop walks it, with the entering-air
 * state (enthalpy, humidity) computed once per record.
 */
import { type EnteringAirColumns, enteringAirColumns, setEnteringAir } from "../air-side";
import { designWetBulbPercentilesC } from "../climate/binning";
import type { ClimateYear } from "../climate/types";

/** The climate as the annual loop walks it, with the entering-air state computed once. */
export interface PreparedClimate {
  kind: "hourly" | "bins";
  count: number;
  /** 1…12, or 0 for a bin without a month. */
  month: Int8Array;
  /** 0…23, or −1 for a bin. */
  hour: Int8Array;
  hours: Float64Array;
  /** Entering-air state of each record (columns; `enteringAirAt` reads one). */
  air: EnteringAirColumns;
  totalHours: number;
  /** Bins carry no month: monthly results are spread pro rata by days. */
  monthsUnknown: boolean;
  /** The 0.4 % design hour: the annual 0.4 % wet-bulb and its mean coincident dry-bulb, °C. */
  design: { wetBulbC: number; dryBulbC: number };
  /** Load fraction of each record, replacing the duty's profile (the compressed climate, compress.ts). */
  loadFraction?: Float64Array;
  /** Hours of each record by hour of the day (count × 24; the compressed climate), for month × hour results. */
  hourOfDayHours?: Float64Array;
}

/**
 * The site's 0.4 % design wet-bulb (annual exceedance, as the climate summary computes it: ASHRAE
 * Fundamentals 2017 ch.14 percentile definition) and the hour-weighted mean dry-bulb of the records within
 * ±1 K of it (the mean coincident dry-bulb; dry-bulb = wet-bulb + 5 K when no record is that close).
 */
export function designHour(year: ClimateYear): { wetBulbC: number; dryBulbC: number } {
  // A what-if or Monte Carlo draw prepares a shifted climate per draw; the unshifted design hour of the same
  // year is computed once (the percentile sorts the year) and shifted by `shiftedDesign`.
  const cached = designHourCache.get(year);
  if (cached) return { ...cached };
  const d = computeDesignHour(year);
  designHourCache.set(year, d);
  return { ...d };
}

const designHourCache = new WeakMap<ClimateYear, { wetBulbC: number; dryBulbC: number }>();

function computeDesignHour(year: ClimateYear): { wetBulbC: number; dryBulbC: number } {
  const wb = designWetBulbPercentilesC(year, [0.4])[0]?.wetBulbC ?? Number.NaN;
  let sum = 0;
  let wsum = 0;
  if (year.kind === "hourly") {
    for (let i = 0; i < year.wetBulbC.length; i++) {
      const w = year.wetBulbC[i] ?? Number.NaN;
      if (Math.abs(w - wb) <= 1) {
        sum += year.dryBulbC[i] ?? 0;
        wsum += 1;
      }
    }
  } else {
    for (const b of year.bins) {
      if (Math.abs(b.wetBulbC - wb) <= 1 && b.hours > 0) {
        sum += b.meanCoincidentDryBulbC * b.hours;
        wsum += b.hours;
      }
    }
  }
  return { wetBulbC: wb, dryBulbC: wsum > 0 ? Math.max(sum / wsum, wb) : wb + 5 };
}

/**
 * Walk a ClimateYear once: entering-air enthalpy and humidity per record (one hs evaluation each).
 * `shiftK` moves every dry-bulb and wet-bulb by the same ΔT (a what-if on a warmer or cooler year).
 */
export function prepareClimate(year: ClimateYear, pPa: number, shiftK = 0): PreparedClimate {
  if (year.kind === "hourly") {
    const n = year.dryBulbC.length;
    const air = enteringAirColumns(n, pPa);
    const month = new Int8Array(n);
    const hour = new Int8Array(n);
    const hours = new Float64Array(n).fill(1);
    for (let i = 0; i < n; i++) {
      month[i] = year.month[i] ?? 1;
      hour[i] = year.hour[i] ?? 0;
      setEnteringAir(air, i, (year.dryBulbC[i] ?? 0) + shiftK, (year.wetBulbC[i] ?? 0) + shiftK, pPa);
    }
    return { kind: "hourly", count: n, month, hour, hours, air, totalHours: n, monthsUnknown: false, design: shiftedDesign(designHour(year), shiftK) };
  }
  const n = year.bins.length;
  const air = enteringAirColumns(n, pPa);
  const month = new Int8Array(n);
  const hour = new Int8Array(n).fill(-1);
  const hours = new Float64Array(n);
  let total = 0;
  let unknown = false;
  for (let i = 0; i < n; i++) {
    const b = year.bins[i];
    if (!b) continue;
    month[i] = b.month ?? 0;
    if (b.month === undefined) unknown = true;
    hours[i] = b.hours;
    total += b.hours;
    setEnteringAir(air, i, b.meanCoincidentDryBulbC + shiftK, b.wetBulbC + shiftK, pPa);
  }
  return { kind: "bins", count: n, month, hour, hours, air, totalHours: total, monthsUnknown: unknown, design: shiftedDesign(designHour(year), shiftK) };
}

/** The design hour of a year whose dry-bulbs and wet-bulbs all moved by `shiftK`. */
export function shiftedDesign(d: { wetBulbC: number; dryBulbC: number }, shiftK: number): { wetBulbC: number; dryBulbC: number } {
  return shiftK === 0 ? d : { wetBulbC: d.wetBulbC + shiftK, dryBulbC: d.dryBulbC + shiftK };
}
