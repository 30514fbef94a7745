/**
 * Shared back end of the weather parsers: records keyed by month/day/hour are averaged to clock hours,
 * laid on a full calendar year, short gaps filled by linear interpolation, and the wet-bulb computed
 * from dry-bulb and humidity at the chosen pressure.
 */
import {
  dewPointFromHumidityRatioC,
  humidityRatioFromVaporPressure,
  saturationVaporPressurePa,
  wetBulbFromDewPointC,
  wetBulbFromRelativeHumidityC,
} from "../psychrometrics";
import { calendarOfYear, describeHour, hourOfYear, monthStartHours } from "./calendar";
import type { ClimateIssue, ClimateParseStats, HourlyClimateYear, ParseResult } from "./types";

/** What the humidity channel of the records holds. */
export type HumidityKind = "dewPoint" | "relativeHumidity" | "wetBulb";

/** One parsed data row; NaN marks a missing value. */
export interface WeatherRecord {
  line: number;
  month: number;
  day: number;
  /** 0…23, hour starting. */
  hour: number;
  dryBulbC: number;
  /** °C for dew point / wet-bulb, fraction 0…1 for relative humidity. */
  humidity: number;
  pressurePa: number;
}

export interface AssembleOptions {
  humidityKind: HumidityKind;
  /** Pressure used where a record has none, and for every hour when `useStationPressure` is false. */
  sitePressurePa: number;
  useStationPressure: boolean;
  /** Longest run of missing hours filled by interpolation; longer runs are errors. */
  maxGapHours: number;
  label?: string;
  /** Records per hour the file declares, if it does (EPW DATA PERIODS). */
  declaredRecordsPerHour?: number;
}

/** Linear interpolation of a temperature over a few hours is common practice; over a diurnal cycle it is not. */
export const DEFAULT_MAX_GAP_HOURS = 6;

const HUMIDITY_FIELD: Record<HumidityKind, string> = {
  dewPoint: "dewPointC",
  relativeHumidity: "relativeHumidity",
  wetBulb: "wetBulbC",
};

interface Gap {
  start: number;
  length: number;
}

/** Runs of NaN, treating the year as cyclic (a gap over New Year is one gap). */
function findGaps(values: Float64Array): Gap[] {
  const n = values.length;
  let firstValid = -1;
  for (let i = 0; i < n; i++) {
    if (!Number.isNaN(values[i]!)) {
      firstValid = i;
      break;
    }
  }
  if (firstValid < 0) return [{ start: 0, length: n }];
  const gaps: Gap[] = [];
  let i = firstValid;
  let visited = 0;
  while (visited < n) {
    const idx = i % n;
    if (Number.isNaN(values[idx]!)) {
      let len = 0;
      while (len < n && Number.isNaN(values[(idx + len) % n]!)) len++;
      gaps.push({ start: idx, length: len });
      i += len;
      visited += len;
    } else {
      i++;
      visited++;
    }
  }
  return gaps;
}

function fillGap(values: Float64Array, gap: Gap): void {
  const n = values.length;
  const before = values[(gap.start - 1 + n) % n]!;
  const after = values[(gap.start + gap.length) % n]!;
  for (let k = 1; k <= gap.length; k++) {
    values[(gap.start + k - 1) % n] = before + ((after - before) * k) / (gap.length + 1);
  }
}

/**
 * Lay records on a calendar year, average several records per hour, interpolate gaps of at most
 * `maxGapHours`, and compute the wet-bulb (ASHRAE 2017 ch.1 via lib/engine/psychrometrics).
 * Returns errors (never throws) when a quantity is absent or a gap is too long to interpolate.
 */
export function assembleHourlyYear(
  records: WeatherRecord[],
  opts: AssembleOptions,
): ParseResult<{ year: HourlyClimateYear; stats: ClimateParseStats }> {
  const warnings: ClimateIssue[] = [];
  const errors: ClimateIssue[] = [];
  if (records.length === 0) {
    return { ok: false, errors: [{ line: 0, field: "data", message: "the file holds no data rows" }] };
  }
  const leap = records.some((r) => r.month === 2 && r.day === 29);
  const starts = monthStartHours(leap);
  const n = starts[12]!;
  const count = new Int32Array(n);
  const firstLine = new Int32Array(n);
  const sums = [new Float64Array(n), new Float64Array(n), new Float64Array(n)];
  const counts = [new Int32Array(n), new Int32Array(n), new Int32Array(n)];
  let lastLine = 0;
  let lastIndex = -1;
  for (const r of records) {
    const idx = hourOfYear(r.month, r.day, r.hour, starts);
    if (count[idx] === 0) firstLine[idx] = r.line;
    count[idx]!++;
    if (r.line > lastLine) {
      lastLine = r.line;
      lastIndex = idx;
    }
    const vals = [r.dryBulbC, r.humidity, r.pressurePa];
    for (let c = 0; c < 3; c++) {
      const v = vals[c]!;
      if (!Number.isNaN(v)) {
        sums[c]![idx]! += v;
        counts[c]![idx]!++;
      }
    }
  }

  // Records per hour: the most common count among the hours present.
  const tally = new Map<number, number>();
  let absentHours = 0;
  for (let i = 0; i < n; i++) {
    const c = count[i]!;
    if (c === 0) absentHours++;
    else tally.set(c, (tally.get(c) ?? 0) + 1);
  }
  let recordsPerHour = 1;
  let best = -1;
  for (const [c, k] of tally) {
    if (k > best) {
      best = k;
      recordsPerHour = c;
    }
  }
  if (tally.size > 1) {
    const uneven = n - absentHours - best;
    warnings.push({
      line: 0,
      field: "data",
      message: `${uneven} hours have a different number of records than the usual ${recordsPerHour} per hour; each hour is the mean of the records it has`,
    });
  }
  if (opts.declaredRecordsPerHour !== undefined && opts.declaredRecordsPerHour !== recordsPerHour) {
    warnings.push({
      line: 0,
      field: "recordsPerHour",
      message: `the header declares ${opts.declaredRecordsPerHour} records per hour but the data has ${recordsPerHour}; the data was used`,
    });
  }

  const channels = [new Float64Array(n), new Float64Array(n), new Float64Array(n)];
  for (let c = 0; c < 3; c++) {
    const ch = channels[c]!;
    for (let i = 0; i < n; i++) {
      const k = counts[c]![i]!;
      ch[i] = k > 0 ? sums[c]![i]! / k : NaN;
    }
  }

  const cal = calendarOfYear(leap);
  const where = (i: number) => describeHour(cal.month[i]!, cal.day[i]!, cal.hour[i]!);
  const names = ["dryBulbC", HUMIDITY_FIELD[opts.humidityKind], "pressurePa"];
  const missingValues: Record<string, number> = {};
  const interpolatedHours: Record<string, number> = {};

  // A file cut short leaves one long absent run up to the end of the year: say so plainly.
  if (absentHours > opts.maxGapHours && lastIndex >= 0 && lastIndex < n - 1) {
    let tailAbsent = 0;
    for (let i = lastIndex + 1; i < n && count[i] === 0; i++) tailAbsent++;
    if (lastIndex + 1 + tailAbsent === n && tailAbsent > opts.maxGapHours) {
      errors.push({
        line: lastLine,
        field: "data",
        message: `the data stops at line ${lastLine} (${where(lastIndex)}): ${tailAbsent} of ${n} hours after it are absent; is the file truncated?`,
      });
      return { ok: false, errors };
    }
  }

  let pressureSource: ClimateParseStats["pressureSource"] = opts.useStationPressure ? "station" : "site";
  for (let c = 0; c < 3; c++) {
    const ch = channels[c]!;
    const name = names[c]!;
    let missing = 0;
    for (let i = 0; i < n; i++) if (Number.isNaN(ch[i]!)) missing++;
    missingValues[name] = missing;
    interpolatedHours[name] = 0;
    if (c === 2 && !opts.useStationPressure) {
      ch.fill(opts.sitePressurePa);
      continue;
    }
    if (missing === 0) continue;
    if (c === 2) {
      // Pressure only refines the wet-bulb: without a station value the site pressure is the right fallback.
      if (missing === n) {
        pressureSource = "site";
        warnings.push({
          line: 0,
          field: "pressurePa",
          message: "no station pressure in the data: wet-bulb computed at the site pressure",
        });
        ch.fill(opts.sitePressurePa);
        continue;
      }
    }
    if (missing === n) {
      errors.push({ line: 0, field: name, message: `no valid ${name} value anywhere in the data` });
      continue;
    }
    for (const gap of findGaps(ch)) {
      if (gap.length > opts.maxGapHours) {
        const before = firstLine[(gap.start - 1 + n) % n] ?? 0;
        errors.push({
          line: before,
          field: name,
          message: `${name} is missing for ${gap.length} consecutive hours from ${where(gap.start)}: more than the ${opts.maxGapHours} h that are interpolated`,
        });
      } else {
        fillGap(ch, gap);
        interpolatedHours[name]! += gap.length;
      }
    }
  }
  if (errors.length > 0) return { ok: false, errors };

  for (const name of names) {
    const k = interpolatedHours[name] ?? 0;
    if (k > 0)
      warnings.push({
        line: 0,
        field: name,
        message: `${k} hours of ${name} filled by linear interpolation`,
      });
  }
  if (absentHours > 0) {
    warnings.push({
      line: 0,
      field: "data",
      message: `${absentHours} hours had no record at all and were interpolated`,
    });
  }

  const [db, hum, p] = channels as [Float64Array, Float64Array, Float64Array];
  const dryBulbC = Array.from(db);
  const wetBulbC = new Array<number>(n);
  const dewPointC = opts.humidityKind === "wetBulb" ? undefined : new Array<number>(n);
  let clamped = 0;
  for (let i = 0; i < n; i++) {
    const t = db[i]!;
    const pPa = p[i]!;
    if (opts.humidityKind === "dewPoint") {
      let td = hum[i]!;
      if (td > t) {
        td = t;
        clamped++;
      }
      dewPointC![i] = td;
      wetBulbC[i] = wetBulbFromDewPointC(t, td, pPa);
    } else if (opts.humidityKind === "relativeHumidity") {
      let rh = hum[i]!;
      if (rh > 1 || rh < 0) {
        rh = Math.min(1, Math.max(0, rh));
        clamped++;
      }
      wetBulbC[i] = wetBulbFromRelativeHumidityC(t, rh, pPa);
      const wKgPerKg = humidityRatioFromVaporPressure(rh * saturationVaporPressurePa(t), pPa);
      dewPointC![i] = dewPointFromHumidityRatioC(t, wKgPerKg, pPa);
    } else {
      let twb = hum[i]!;
      if (twb > t) {
        twb = t;
        clamped++;
      }
      wetBulbC[i] = twb;
    }
  }
  if (clamped > 0) {
    const what =
      opts.humidityKind === "relativeHumidity"
        ? "a relative humidity above 100 %"
        : `a ${opts.humidityKind === "dewPoint" ? "dew point" : "wet-bulb"} above the dry-bulb`;
    warnings.push({
      line: 0,
      field: names[1]!,
      message: `${clamped} hours had ${what} and were taken as saturated`,
    });
  }

  const year: HourlyClimateYear = {
    kind: "hourly",
    ...(opts.label !== undefined ? { label: opts.label } : {}),
    month: cal.month,
    day: cal.day,
    hour: cal.hour,
    dryBulbC,
    wetBulbC,
    ...(dewPointC ? { dewPointC } : {}),
    pressurePa: Array.from(p),
  };
  const stats: ClimateParseStats = {
    recordsRead: records.length,
    recordsPerHour,
    hours: n,
    hasLeapDay: leap,
    missingValues,
    interpolatedHours,
    absentHours,
    pressureSource,
    sitePressurePa: opts.sitePressurePa,
  };
  return { ok: true, value: { year, stats }, warnings };
}
