/**
 * Binning and statistics of a climate year: wet-bulb bins with mean coincident dry-bulb, dry-bulb bins
 * with mean coincident wet-bulb, design wet-bulb percentiles, a month × hour mean matrix and histograms.
 */
import type { BinnedClimateYear, ClimateBin, ClimateYear, HourlyClimateYear } from "./types";

export type BinBasis = "wetBulb" | "dryBulb";

export interface BinRow {
  /** Bin centre, °C: a whole multiple of the bin width; the bin is [centreC − w/2, centreC + w/2). */
  centerC: number;
  lowC: number;
  highC: number;
  hours: number;
  /** Mean of the binned temperature over the bin's hours, °C. */
  meanC: number;
  /** Mean of the other temperature over the same hours (dry-bulb for wet-bulb bins, and vice versa), °C. */
  meanCoincidentC: number;
  /** Hours in each month, index 0 = January. */
  hoursByMonth: number[];
}

export interface BinTable {
  basis: BinBasis;
  binWidthK: number;
  totalHours: number;
  /** Non-empty bins in ascending order. */
  rows: BinRow[];
}

export interface BinOptions {
  basis?: BinBasis;
  /** Default 1 K. */
  binWidthK?: number;
}

function binIndex(tC: number, widthK: number): number {
  return Math.floor(tC / widthK + 0.5);
}

interface Acc {
  hours: number;
  sum: number;
  sumOther: number;
  byMonth: number[];
}

function accumulate(year: HourlyClimateYear, basis: BinBasis, widthK: number, splitByMonth: boolean) {
  const binned = basis === "wetBulb" ? year.wetBulbC : year.dryBulbC;
  const other = basis === "wetBulb" ? year.dryBulbC : year.wetBulbC;
  const acc = new Map<number, Acc>();
  for (let i = 0; i < binned.length; i++) {
    const t = binned[i]!;
    const m = year.month[i] ?? 1;
    const b = binIndex(t, widthK);
    const key = splitByMonth ? b * 16 + m : b;
    let a = acc.get(key);
    if (!a) {
      a = { hours: 0, sum: 0, sumOther: 0, byMonth: new Array<number>(12).fill(0) };
      acc.set(key, a);
    }
    a.hours++;
    a.sum += t;
    a.sumOther += other[i]!;
    a.byMonth[m - 1]!++;
  }
  return acc;
}

/**
 * Bin an hourly year on wet-bulb (default) or dry-bulb, with the mean coincident value of the other
 * temperature, hours and hours per month per bin — the bin method of ASHRAE Fundamentals (2017) ch.14
 * (climatic design information) and of bin-based energy estimates. Each hour counts 1 h, so the
 * rows' hours sum to the year's hours exactly.
 */
export function binHourly(year: HourlyClimateYear, options: BinOptions = {}): BinTable {
  const basis = options.basis ?? "wetBulb";
  const w = options.binWidthK ?? 1;
  const acc = accumulate(year, basis, w, false);
  const rows: BinRow[] = [...acc.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([b, a]) => ({
      centerC: b * w,
      lowC: (b - 0.5) * w,
      highC: (b + 0.5) * w,
      hours: a.hours,
      meanC: a.sum / a.hours,
      meanCoincidentC: a.sumOther / a.hours,
      hoursByMonth: a.byMonth,
    }));
  return { basis, binWidthK: w, totalHours: year.dryBulbC.length, rows };
}

/**
 * A bin-method climate from an hourly year, for running the engine on bins: each bin carries the mean
 * wet-bulb and mean dry-bulb of its hours (which preserves both means over the year exactly), split by
 * month when `byMonth` is set.
 */
export function binnedClimateFromHourly(
  year: HourlyClimateYear,
  options: BinOptions & { byMonth?: boolean } = {},
): BinnedClimateYear {
  const basis = options.basis ?? "wetBulb";
  const w = options.binWidthK ?? 1;
  const byMonth = options.byMonth ?? false;
  const acc = accumulate(year, basis, w, byMonth);
  const bins: ClimateBin[] = [...acc.entries()]
    .sort((a, b) => (byMonth ? (a[0] & 15) - (b[0] & 15) || a[0] - b[0] : a[0] - b[0]))
    .map(([key, a]) => {
      const meanBinned = a.sum / a.hours;
      const meanOther = a.sumOther / a.hours;
      const bin: ClimateBin =
        basis === "wetBulb"
          ? { wetBulbC: meanBinned, meanCoincidentDryBulbC: meanOther, hours: a.hours }
          : { wetBulbC: meanOther, meanCoincidentDryBulbC: meanBinned, hours: a.hours };
      if (byMonth) bin.month = ((key % 16) + 16) % 16;
      return bin;
    });
  return { kind: "bins", ...(year.label !== undefined ? { label: year.label } : {}), binnedOn: basis, bins };
}

/**
 * Value exceeded by `exceedancePercent` % of the (weighted) observations — the annual-percentile
 * convention of ASHRAE Fundamentals (2017) ch.14 for design conditions (0.4 %, 1 %, 2 % of the 8760 h).
 * Unweighted: the (1 − p) sample quantile with linear interpolation between order statistics
 * (Hyndman & Fan 1996, definition 7). Weighted (bins): the value of the bin in which the cumulative
 * hours counted from the top reach p % of the total (bins carry no width to interpolate within).
 */
export function exceedanceValue(
  values: ArrayLike<number>,
  exceedancePercent: number,
  weights?: ArrayLike<number>,
): number {
  const n = values.length;
  if (n === 0) return NaN;
  const p = exceedancePercent / 100;
  if (!weights) {
    const sorted = Float64Array.from(values).sort();
    return exceedanceFromOrderStatistics(n, exceedancePercent, (i) => sorted[i]!);
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => values[b]! - values[a]!);
  let total = 0;
  for (let i = 0; i < n; i++) total += weights[i]!;
  const target = p * total;
  let cum = 0;
  for (const i of order) {
    cum += weights[i]!;
    if (cum >= target) return values[i]!;
  }
  return values[order[order.length - 1]!]!;
}

export const DESIGN_EXCEEDANCE_PERCENTS = [0.4, 1, 2] as const;

export interface DesignWetBulb {
  exceedancePercent: number;
  wetBulbC: number;
}

/**
 * `exceedanceValue` (unweighted) of n values from their order statistics (`sortedAt(i)`: the i-th smallest,
 * from 0): linear between the two around (n − 1)(1 − p).
 */
function exceedanceFromOrderStatistics(n: number, exceedancePercent: number, sortedAt: (i: number) => number): number {
  const h = (n - 1) * (1 - exceedancePercent / 100);
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  return sortedAt(lo) + (h - lo) * (sortedAt(hi) - sortedAt(lo));
}

/**
 * The k largest values sorted ascending — the last k entries of `Float64Array.from(values).sort()` —
 * without sorting the rest (one pass, insertion into a k-long buffer); null when a value is NaN (the
 * full sort decides where it goes).
 */
function largestAscending(values: ArrayLike<number>, k: number): Float64Array | null {
  const top = new Float64Array(k);
  let count = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (v !== v) return null;
    if (count < k) {
      let j = count++;
      while (j > 0 && top[j - 1]! > v) {
        top[j] = top[j - 1]!;
        j--;
      }
      top[j] = v;
    } else if (v > top[0]!) {
      let j = 0;
      while (j + 1 < k && top[j + 1]! < v) {
        top[j] = top[j + 1]!;
        j++;
      }
      top[j] = v;
    }
  }
  return top;
}

/**
 * Design wet-bulb temperatures: the wet-bulb exceeded by 0.4 %, 1 % and 2 % of the hours of the year
 * (annual percentiles, ASHRAE Fundamentals 2017 ch.14 convention), from an hourly year or a bin table.
 */
export function designWetBulbPercentilesC(
  year: ClimateYear,
  exceedancePercents: readonly number[] = DESIGN_EXCEEDANCE_PERCENTS,
): DesignWetBulb[] {
  if (year.kind === "hourly") {
    const n = year.wetBulbC.length;
    if (n === 0) return exceedancePercents.map((p) => ({ exceedancePercent: p, wetBulbC: NaN }));
    // The percentiles read only the order statistics near the top: keep the k largest, not a sorted year.
    const k = Math.max(...exceedancePercents.map((p) => n - Math.floor((n - 1) * (1 - p / 100))));
    const top = k <= 256 ? largestAscending(year.wetBulbC, k) : null;
    if (top) {
      const sortedAt = (i: number): number => top[i - (n - k)]!;
      return exceedancePercents.map((p) => ({ exceedancePercent: p, wetBulbC: exceedanceFromOrderStatistics(n, p, sortedAt) }));
    }
    const sorted = Float64Array.from(year.wetBulbC).sort();
    return exceedancePercents.map((p) => ({ exceedancePercent: p, wetBulbC: exceedanceFromOrderStatistics(n, p, (i) => sorted[i]!) }));
  }
  const values = year.bins.map((b) => b.wetBulbC);
  const weights = year.bins.map((b) => b.hours);
  return exceedancePercents.map((p) => ({
    exceedancePercent: p,
    wetBulbC: exceedanceValue(values, p, weights),
  }));
}

/**
 * Month × hour matrix of the mean of a quantity (12 rows of 24), for heat maps. Hours of the day are
 * 0…23 (hour starting). A cell with no hours is NaN.
 */
export function monthHourMeanC(
  year: HourlyClimateYear,
  quantity: "wetBulbC" | "dryBulbC" = "wetBulbC",
): number[][] {
  const sum = new Float64Array(288);
  const cnt = new Float64Array(288);
  const v = year[quantity];
  for (let i = 0; i < v.length; i++) {
    const k = ((year.month[i] ?? 1) - 1) * 24 + (year.hour[i] ?? 0);
    sum[k]! += v[i]!;
    cnt[k]!++;
  }
  const out: number[][] = [];
  for (let m = 0; m < 12; m++) {
    const row: number[] = [];
    for (let h = 0; h < 24; h++) {
      const k = m * 24 + h;
      row.push(cnt[k]! > 0 ? sum[k]! / cnt[k]! : NaN);
    }
    out.push(row);
  }
  return out;
}

export interface HistogramBar {
  centerC: number;
  lowC: number;
  highC: number;
  hours: number;
}

/**
 * Hours per temperature band of width `binWidthK` (bands centred on multiples of the width), with the
 * empty bands between the lowest and highest filled one included so a chart has no holes.
 */
export function histogram(
  values: ArrayLike<number>,
  binWidthK = 1,
  weights?: ArrayLike<number>,
): HistogramBar[] {
  if (values.length === 0) return [];
  const acc = new Map<number, number>();
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const b = binIndex(values[i]!, binWidthK);
    acc.set(b, (acc.get(b) ?? 0) + (weights ? weights[i]! : 1));
    if (b < lo) lo = b;
    if (b > hi) hi = b;
  }
  const bars: HistogramBar[] = [];
  for (let b = lo; b <= hi; b++) {
    bars.push({
      centerC: b * binWidthK,
      lowC: (b - 0.5) * binWidthK,
      highC: (b + 0.5) * binWidthK,
      hours: acc.get(b) ?? 0,
    });
  }
  return bars;
}

/** Wet-bulb histogram of an hourly year or a bin table. */
export function wetBulbHistogram(year: ClimateYear, binWidthK = 1): HistogramBar[] {
  if (year.kind === "hourly") return histogram(year.wetBulbC, binWidthK);
  return histogram(
    year.bins.map((b) => b.wetBulbC),
    binWidthK,
    year.bins.map((b) => b.hours),
  );
}
