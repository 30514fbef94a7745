import {
  designWetBulbPercentilesC,
  monthHourMeanC,
  wetBulbHistogram,
  type DesignWetBulb,
  type HistogramBar,
} from "./binning";
import { climateYearHours } from "./input";
import type { ClimateLocation, ClimateParseStats, ClimateYear } from "./types";

export interface TemperatureStats {
  minC: number;
  meanC: number;
  maxC: number;
}

/** What the import screen and the result page show about a climate. */
export interface ClimateSummary {
  kind: ClimateYear["kind"];
  label?: string;
  location?: ClimateLocation;
  /** Hours the year represents (8760/8784 for a full year; the bins' sum for a bin table). */
  hours: number;
  /** Bins in a bin table; records read for a parsed file. */
  records: number;
  hasLeapDay?: boolean;
  recordsPerHour?: number;
  missingValues?: Record<string, number>;
  interpolatedHours?: Record<string, number>;
  /** Hour-weighted; for a bin table the extremes are those of the bins' values, not of single hours. */
  dryBulb: TemperatureStats;
  wetBulb: TemperatureStats;
  designWetBulbC: DesignWetBulb[];
  /** 1 K wet-bulb histogram. */
  wetBulbHistogram: HistogramBar[];
  /** Hour-weighted monthly means (NaN for a month without hours; bin tables without months give none). */
  monthlyMeanDryBulbC?: number[];
  monthlyMeanWetBulbC?: number[];
  /** 12 × 24 mean wet-bulb (hourly years only). */
  monthHourMeanWetBulbC?: number[][];
}

function weightedStats(values: ArrayLike<number>, weights?: ArrayLike<number>): TemperatureStats {
  let min = Infinity;
  let max = -Infinity;
  let sum = 0;
  let wsum = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    const w = weights ? weights[i]! : 1;
    if (w <= 0) continue;
    if (v < min) min = v;
    if (v > max) max = v;
    sum += v * w;
    wsum += w;
  }
  return wsum > 0 ? { minC: min, meanC: sum / wsum, maxC: max } : { minC: NaN, meanC: NaN, maxC: NaN };
}

function monthlyMeans(
  values: ArrayLike<number>,
  months: ArrayLike<number>,
  weights?: ArrayLike<number>,
): number[] {
  const sum = new Array<number>(12).fill(0);
  const w = new Array<number>(12).fill(0);
  for (let i = 0; i < values.length; i++) {
    const m = months[i]! - 1;
    const wi = weights ? weights[i]! : 1;
    sum[m]! += values[i]! * wi;
    w[m]! += wi;
  }
  return sum.map((s, m) => (w[m]! > 0 ? s / w[m]! : NaN));
}

/**
 * Summary of a climate year for the import screen and the result: hours, records, missing and
 * interpolated values (from the parser's stats when given), dry-/wet-bulb extremes and hour-weighted
 * means, the 0.4/1/2 % design wet-bulbs (ASHRAE 2017 ch.14 annual percentiles), a 1 K wet-bulb
 * histogram, monthly means and the month × hour wet-bulb matrix.
 */
export function summarizeClimate(
  year: ClimateYear,
  extra: { location?: ClimateLocation; stats?: ClimateParseStats } = {},
): ClimateSummary {
  const base = {
    kind: year.kind,
    ...(year.label !== undefined ? { label: year.label } : {}),
    ...(extra.location ? { location: extra.location } : {}),
    hours: climateYearHours(year),
    designWetBulbC: designWetBulbPercentilesC(year),
    wetBulbHistogram: wetBulbHistogram(year),
    ...(extra.stats
      ? {
          hasLeapDay: extra.stats.hasLeapDay,
          recordsPerHour: extra.stats.recordsPerHour,
          missingValues: extra.stats.missingValues,
          interpolatedHours: extra.stats.interpolatedHours,
        }
      : {}),
  };
  if (year.kind === "hourly") {
    return {
      ...base,
      records: extra.stats?.recordsRead ?? year.dryBulbC.length,
      dryBulb: weightedStats(year.dryBulbC),
      wetBulb: weightedStats(year.wetBulbC),
      monthlyMeanDryBulbC: monthlyMeans(year.dryBulbC, year.month),
      monthlyMeanWetBulbC: monthlyMeans(year.wetBulbC, year.month),
      monthHourMeanWetBulbC: monthHourMeanC(year, "wetBulbC"),
    };
  }
  const hours = year.bins.map((b) => b.hours);
  const withMonths = year.bins.length > 0 && year.bins.every((b) => b.month !== undefined);
  const months = year.bins.map((b) => b.month ?? 1);
  return {
    ...base,
    records: year.bins.length,
    dryBulb: weightedStats(
      year.bins.map((b) => b.meanCoincidentDryBulbC),
      hours,
    ),
    wetBulb: weightedStats(
      year.bins.map((b) => b.wetBulbC),
      hours,
    ),
    ...(withMonths
      ? {
          monthlyMeanDryBulbC: monthlyMeans(
            year.bins.map((b) => b.meanCoincidentDryBulbC),
            months,
            hours,
          ),
          monthlyMeanWetBulbC: monthlyMeans(
            year.bins.map((b) => b.wetBulbC),
            months,
            hours,
          ),
        }
      : {}),
  };
}
