/**
 * Parser for hourly (or sub-hourly) weather in a CSV table with a column mapping chosen by the user:
 * `,` `;` or tab delimiter, decimal point or decimal comma, °C or °F, humidity as RH (% or fraction),
 * dew point or wet-bulb, time as one timestamp column or as month/day/hour columns. Rows are keyed by
 * month/day/hour (the year only serves to shift hour-ending stamps) and share the EPW back end:
 * several records per hour averaged, short gaps interpolated, wet-bulb at the chosen pressure.
 */
import * as Papa from "papaparse";
import { pressureFromElevationPa, STANDARD_ATMOSPHERE_PA } from "../psychrometrics";
import { assembleHourlyYear, DEFAULT_MAX_GAP_HOURS, type HumidityKind, type WeatherRecord } from "./assemble";
import { isValidMonthDay } from "./calendar";
import {
  catchParseErrors,
  ClimateParseError,
  type ClimateIssue,
  type ParsedClimate,
  type ParseResult,
} from "./types";

/** A column by its header text (trimmed, case-insensitive) or by its 0-based position. */
export type ColumnRef = string | number;

export type CsvHumidityMapping =
  | { kind: "relativeHumidity"; column: ColumnRef; unit?: "percent" | "fraction" }
  | { kind: "dewPoint"; column: ColumnRef }
  | { kind: "wetBulb"; column: ColumnRef };

export type CsvTimeMapping =
  | {
      kind: "timestamp";
      column: ColumnRef;
      /** "iso" = 2023-07-01 14:00 (or with T); "dmy" = 01.07.2023 14:00 or 01/07/2023; "mdy" = 07/01/2023 14:00. */
      format?: "iso" | "dmy" | "mdy";
      /** Whether a stamp marks the start (default) or the end of the interval it describes. */
      convention?: "start" | "end";
    }
  | {
      /** The date in one column and the clock time in another (e.g. "07/01/1988" and "14:00"). */
      kind: "dateAndTime";
      date: ColumnRef;
      time: ColumnRef;
      format?: "iso" | "dmy" | "mdy";
      /** "end" for hour-ending clock times (01:00 … 24:00, as in typical-year files). */
      convention?: "start" | "end";
    }
  | {
      kind: "monthDayHour";
      month: ColumnRef;
      day: ColumnRef;
      hour: ColumnRef;
      /** "0-23" hour starting, "1-24" hour ending (as in EPW); "auto" (default) reads 0 or 24 in the data. */
      hourConvention?: "0-23" | "1-24" | "auto";
    };

export interface HourlyCsvMapping {
  delimiter?: "," | ";" | "\t" | "auto";
  /** "auto" (default) reads "12,5" as 12.5 wherever a cell has one comma and no point. */
  decimalSeparator?: "." | "," | "auto";
  /** Lines to skip before the header (a station preamble, say). */
  skipLines?: number;
  /** Default true; without a header, columns are referred to by position. */
  hasHeader?: boolean;
  temperatureUnit: "C" | "F";
  dryBulb: ColumnRef;
  humidity: CsvHumidityMapping;
  time: CsvTimeMapping;
  /** Optional station pressure column; otherwise `sitePressurePa`, or the pressure at `elevationM`. */
  pressure?: { column: ColumnRef; unit: "Pa" | "hPa" | "mbar" | "kPa" };
  sitePressurePa?: number;
  elevationM?: number;
  /** Cell texts meaning "missing", compared after trimming (case-insensitive). */
  missingValues?: string[];
  maxGapHours?: number;
  label?: string;
}

const DEFAULT_MISSING = ["", "na", "n/a", "nan", "null", "none", "-", "--", "m"];
const MAX_ERRORS = 50;
/** Pa per unit; 1 mbar = 1 hPa = 100 Pa (NIST SP 811 App. B.8). */
const PRESSURE_FACTOR = { Pa: 1, hPa: 100, mbar: 100, kPa: 1000 } as const;

interface ResolvedColumn {
  index: number;
  label: string;
}

function resolveColumn(
  ref: ColumnRef,
  header: string[] | undefined,
  what: string,
  headerLine: number,
  errors: ClimateIssue[],
): ResolvedColumn | undefined {
  if (typeof ref === "number") {
    if (!Number.isInteger(ref) || ref < 0) {
      errors.push({ line: 0, field: what, message: `column position ${ref} is not a whole number ≥ 0` });
      return undefined;
    }
    return { index: ref, label: header?.[ref]?.trim() || `column ${ref + 1}` };
  }
  if (!header) {
    errors.push({
      line: 0,
      field: what,
      message: `column "${ref}" is named, but the file has no header row`,
    });
    return undefined;
  }
  const want = ref.trim().toLowerCase();
  const index = header.findIndex((h) => h.trim().toLowerCase() === want);
  if (index < 0) {
    errors.push({
      line: headerLine,
      field: what,
      message: `no column "${ref}" in the header (found: ${header.map((h) => `"${h.trim()}"`).join(", ")})`,
    });
    return undefined;
  }
  return { index, label: ref };
}

type Cell = { kind: "value"; v: number } | { kind: "missing" } | { kind: "bad"; text: string };

function makeNumberReader(decimal: "." | "," | "auto", missing: Set<string>) {
  return (raw: string | undefined): Cell => {
    const s = (raw ?? "").trim();
    if (missing.has(s.toLowerCase())) return { kind: "missing" };
    let t = s;
    if (decimal === ",") t = s.replace(",", ".");
    else if (decimal === "auto" && !s.includes(".") && s.split(",").length === 2) t = s.replace(",", ".");
    const v = Number(t);
    return Number.isFinite(v) && t !== "" ? { kind: "value", v } : { kind: "bad", text: s };
  };
}

const TIMESTAMP_PATTERNS = {
  iso: /^(\d{4})-(\d{1,2})-(\d{1,2})(?:[T ]+(\d{1,2})(?::(\d{1,2}))?(?::\d{1,2}(?:\.\d*)?)?)?/,
  dmy: /^(\d{1,2})[./-](\d{1,2})[./-](\d{2,4})(?:[T ]+(\d{1,2})(?::(\d{1,2}))?(?::\d{1,2}(?:\.\d*)?)?)?/,
  mdy: /^(\d{1,2})[./-](\d{1,2})[./-](\d{2,4})(?:[T ]+(\d{1,2})(?::(\d{1,2}))?(?::\d{1,2}(?:\.\d*)?)?)?/,
} as const;

/** Month, day and hour-starting of a stamp; null when it cannot be read or names no real date. */
function readTimestamp(
  raw: string,
  format: "iso" | "dmy" | "mdy",
  convention: "start" | "end",
): { month: number; day: number; hour: number } | null {
  const m = TIMESTAMP_PATTERNS[format].exec(raw.trim());
  if (!m) return null;
  let y: number, mo: number, d: number;
  if (format === "iso") [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  else if (format === "dmy") [d, mo, y] = [Number(m[1]), Number(m[2]), Number(m[3])];
  else [mo, d, y] = [Number(m[1]), Number(m[2]), Number(m[3])];
  if (y < 100) y += 2000;
  const h = m[4] !== undefined ? Number(m[4]) : 0;
  const min = m[5] !== undefined ? Number(m[5]) : 0;
  if (mo < 1 || mo > 12 || h > 24 || min > 59 || (h === 24 && min > 0)) return null;
  const probe = new Date(Date.UTC(y, mo - 1, d));
  if (probe.getUTCMonth() !== mo - 1 || probe.getUTCDate() !== d) return null;
  // An hour-ending stamp (…14:00 for 13:00–14:00, …14:15 for 14:00–14:15) belongs to the hour one minute earlier.
  const ms = Date.UTC(y, mo - 1, d, h, min) - (convention === "end" ? 60_000 : 0);
  const t = new Date(ms);
  return { month: t.getUTCMonth() + 1, day: t.getUTCDate(), hour: t.getUTCHours() };
}

/**
 * Parse an hourly weather table with a column mapping into an hourly typical year.
 * Temperatures in °F are converted by t°C = (t°F − 32)·5/9; RH in % is divided by 100; pressure
 * columns in hPa/kPa are scaled to Pa. Wet-bulb from dry-bulb + RH or dew point at the station
 * pressure column, else at `sitePressurePa`, else at the standard-atmosphere pressure of `elevationM`
 * (ASHRAE 2017 ch.1 eq. 3), else at sea level (with a warning); wet-bulb columns are used as given.
 * Never throws: malformed input gives `{ ok: false, errors }` with line numbers and column names.
 */
export function parseHourlyCsv(text: string, mapping: HourlyCsvMapping): ParseResult<ParsedClimate> {
  return catchParseErrors(() => parseHourlyCsvUnsafe(text, mapping));
}

function parseHourlyCsvUnsafe(text: string, mapping: HourlyCsvMapping): ParseResult<ParsedClimate> {
  const errors: ClimateIssue[] = [];
  const warnings: ClimateIssue[] = [];
  const body = text.replace(/^\uFEFF/, "");
  const skip = mapping.skipLines ?? 0;
  const allLines = body.split(/\r\n|\n|\r/);
  const kept = allLines.slice(skip).join("\n");
  const delimiter = mapping.delimiter && mapping.delimiter !== "auto" ? mapping.delimiter : undefined;
  const decimal = mapping.decimalSeparator ?? "auto";
  if (delimiter === "," && decimal === ",") {
    throw new ClimateParseError(
      0,
      "decimalSeparator",
      "a decimal comma needs a delimiter other than the comma",
    );
  }
  const parsed = Papa.parse<string[]>(kept, {
    ...(delimiter ? { delimiter } : { delimitersToGuess: [",", ";", "\t"] }),
  });
  for (const e of parsed.errors) {
    // Papa's "UndetectableDelimiter" only means a one-column file; a mapping error will say more.
    if (e.code === "UndetectableDelimiter") continue;
    errors.push({ line: (e.row ?? 0) + 1 + skip, field: "file", message: e.message });
  }
  if (errors.length > 0) return { ok: false, errors };
  const rows = parsed.data;
  const usedDelimiter = parsed.meta.delimiter;
  if (usedDelimiter === "," && decimal === ",") {
    throw new ClimateParseError(
      0,
      "decimalSeparator",
      "the file is comma-delimited, so it cannot use decimal commas",
    );
  }

  const hasHeader = mapping.hasHeader ?? true;
  const headerLine = skip + 1;
  const header = hasHeader ? rows[0] : undefined;
  if (hasHeader && !header) throw new ClimateParseError(headerLine, "header", "the file has no header row");
  const col = (ref: ColumnRef, what: string) => resolveColumn(ref, header, what, headerLine, errors);
  const dryBulbCol = col(mapping.dryBulb, "dryBulb");
  const humidityCol = col(mapping.humidity.column, "humidity");
  const pressureCol = mapping.pressure ? col(mapping.pressure.column, "pressure") : undefined;
  const time = mapping.time;
  const timeCols =
    time.kind === "timestamp"
      ? { stamp: col(time.column, "timestamp") }
      : time.kind === "dateAndTime"
        ? { date: col(time.date, "date"), clock: col(time.time, "time") }
        : { month: col(time.month, "month"), day: col(time.day, "day"), hour: col(time.hour, "hour") };
  if (errors.length > 0) return { ok: false, errors };

  const toC = mapping.temperatureUnit === "F" ? (f: number) => ((f - 32) * 5) / 9 : (c: number) => c;
  const humidityKind: HumidityKind = mapping.humidity.kind;
  const rhScale =
    mapping.humidity.kind === "relativeHumidity" && mapping.humidity.unit === "fraction" ? 1 : 0.01;
  const readNumber = makeNumberReader(
    decimal,
    new Set([...DEFAULT_MISSING, ...(mapping.missingValues ?? []).map((s) => s.trim().toLowerCase())]),
  );

  const firstData = hasHeader ? 1 : 0;
  let hourConvention: "0-23" | "1-24" = "0-23";
  if (time.kind === "monthDayHour") {
    const hc = time.hourConvention ?? "auto";
    if (hc !== "auto") hourConvention = hc;
    else {
      let saw0 = false;
      let saw24 = false;
      const hi = timeCols.hour!.index;
      for (let r = firstData; r < rows.length; r++) {
        const c = readNumber(rows[r]![hi]);
        if (c.kind === "value") {
          if (c.v === 0) saw0 = true;
          if (c.v === 24) saw24 = true;
        }
      }
      hourConvention = saw24 && !saw0 ? "1-24" : "0-23";
    }
  }

  const neededFields =
    1 +
    Math.max(
      dryBulbCol!.index,
      humidityCol!.index,
      pressureCol?.index ?? 0,
      ...Object.values(timeCols).map((c) => c!.index),
    );
  const records: WeatherRecord[] = [];
  let outOfRange = 0;
  for (let r = firstData; r < rows.length && errors.length < MAX_ERRORS; r++) {
    const row = rows[r]!;
    const line = r + 1 + skip;
    if (row.length === 1 && row[0]!.trim() === "") continue;
    if (row.length < neededFields) {
      const absent = [dryBulbCol!, humidityCol!, pressureCol, ...Object.values(timeCols)].find(
        (c) => c && c.index >= row.length,
      );
      errors.push({
        line,
        field: absent?.label ?? "row",
        message: `the row has ${row.length} fields; column "${absent?.label}" (field ${(absent?.index ?? 0) + 1}) is absent`,
      });
      continue;
    }
    let month: number, day: number, hour: number;
    if (time.kind === "timestamp") {
      const c = timeCols.stamp!;
      const ts = readTimestamp(row[c.index]!, time.format ?? "iso", time.convention ?? "start");
      if (!ts) {
        errors.push({
          line,
          field: c.label,
          message: `"${row[c.index]}" is not a ${time.format ?? "iso"} timestamp of a real date and time`,
        });
        continue;
      }
      ({ month, day, hour } = ts);
    } else if (time.kind === "dateAndTime") {
      const dc = timeCols.date!;
      const tc = timeCols.clock!;
      const text = `${row[dc.index]!.trim()} ${row[tc.index]!.trim()}`;
      const ts = readTimestamp(text, time.format ?? "mdy", time.convention ?? "start");
      if (!ts) {
        errors.push({
          line,
          field: `${dc.label} + ${tc.label}`,
          message: `"${row[dc.index]}" and "${row[tc.index]}" are not a ${time.format ?? "mdy"} date and a clock time of a real date`,
        });
        continue;
      }
      ({ month, day, hour } = ts);
    } else {
      const mc = readNumber(row[timeCols.month!.index]);
      const dc = readNumber(row[timeCols.day!.index]);
      const hc = readNumber(row[timeCols.hour!.index]);
      month = mc.kind === "value" ? mc.v : NaN;
      day = dc.kind === "value" ? dc.v : NaN;
      const h = hc.kind === "value" ? hc.v : NaN;
      if (!Number.isInteger(month) || month < 1 || month > 12) {
        errors.push({
          line,
          field: timeCols.month!.label,
          message: `"${row[timeCols.month!.index]}" is not a month 1…12`,
        });
        continue;
      }
      if (!isValidMonthDay(month, day)) {
        errors.push({
          line,
          field: timeCols.day!.label,
          message: `"${row[timeCols.day!.index]}" is not a day of month ${month}`,
        });
        continue;
      }
      const lo = hourConvention === "1-24" ? 1 : 0;
      if (!Number.isInteger(h) || h < lo || h > lo + 23) {
        errors.push({
          line,
          field: timeCols.hour!.label,
          message: `"${row[timeCols.hour!.index]}" is not an hour ${lo}…${lo + 23}`,
        });
        continue;
      }
      hour = h - lo;
    }

    const read = (
      c: ResolvedColumn,
      convert: (v: number) => number,
      min: number,
      max: number,
    ): number | null => {
      const cell = readNumber(row[c.index]);
      if (cell.kind === "missing") return NaN;
      if (cell.kind === "bad") {
        errors.push({ line, field: c.label, message: `"${cell.text}" is not a number` });
        return null;
      }
      const v = convert(cell.v);
      if (v < min || v > max) {
        outOfRange++;
        return NaN;
      }
      return v;
    };
    const t = read(dryBulbCol!, toC, -70, 70);
    if (t === null) continue;
    const hum =
      humidityKind === "relativeHumidity"
        ? read(humidityCol!, (v) => v * rhScale, 0, 1.1)
        : read(humidityCol!, toC, -70, 70);
    if (hum === null) continue;
    let p = NaN;
    if (pressureCol && mapping.pressure) {
      const factor = PRESSURE_FACTOR[mapping.pressure.unit];
      const v = read(pressureCol, (x) => x * factor, 31000, 120000);
      if (v === null) continue;
      p = v;
    }
    records.push({ line, month, day, hour, dryBulbC: t, humidity: hum, pressurePa: p });
  }
  if (errors.length > 0) {
    if (errors.length >= MAX_ERRORS)
      errors.push({ line: 0, field: "data", message: `stopped after ${MAX_ERRORS} errors` });
    return { ok: false, errors };
  }
  if (outOfRange > 0) {
    warnings.push({
      line: 0,
      field: "data",
      message: `${outOfRange} values outside plausible ranges were treated as missing`,
    });
  }

  let sitePressurePa = mapping.sitePressurePa;
  if (sitePressurePa === undefined && mapping.elevationM !== undefined) {
    sitePressurePa = pressureFromElevationPa(mapping.elevationM);
  }
  if (sitePressurePa === undefined) {
    sitePressurePa = STANDARD_ATMOSPHERE_PA;
    if (humidityKind !== "wetBulb" && !pressureCol) {
      warnings.push({
        line: 0,
        field: "sitePressurePa",
        message: "no site pressure or elevation given: wet-bulb computed at sea-level pressure (101,325 Pa)",
      });
    }
  }

  const assembled = assembleHourlyYear(records, {
    humidityKind,
    sitePressurePa,
    useStationPressure: pressureCol !== undefined,
    maxGapHours: mapping.maxGapHours ?? DEFAULT_MAX_GAP_HOURS,
    ...(mapping.label !== undefined ? { label: mapping.label } : {}),
  });
  if (!assembled.ok) return assembled;
  return {
    ok: true,
    value: {
      ...(mapping.label !== undefined
        ? {
            location: {
              name: mapping.label,
              ...(mapping.elevationM !== undefined ? { elevationM: mapping.elevationM } : {}),
            },
          }
        : {}),
      year: assembled.value.year,
      stats: assembled.value.stats,
    },
    warnings: [...warnings, ...assembled.warnings],
  };
}
