/**
 * Parser for the open EnergyPlus weather format (EPW), as specified in the EnergyPlus
 * "Auxiliary Programs" documentation, section "Weather Converter Program → EnergyPlus Weather File
 * (EPW) Data Dictionary": 8 header lines (LOCATION, DESIGN CONDITIONS, TYPICAL/EXTREME PERIODS,
 * GROUND TEMPERATURES, HOLIDAYS/DAYLIGHT SAVINGS, COMMENTS 1, COMMENTS 2, DATA PERIODS), then one
 * comma-separated row per record: year, month, day, hour (1…24, hour ending), minute, data-source
 * flags, dry-bulb °C, dew point °C, RH %, station pressure Pa, … (35 fields in all).
 * Missing values use sentinels (dry-bulb and dew point 99.9, RH 999, pressure 999999); values outside
 * the dictionary's ranges are treated as missing too, as EnergyPlus does.
 */
import {
  dewPointFromHumidityRatioC,
  humidityRatioFromVaporPressure,
  pressureFromElevationPa,
  saturationVaporPressurePa,
} from "../psychrometrics";
import { assembleHourlyYear, DEFAULT_MAX_GAP_HOURS, type WeatherRecord } from "./assemble";
import { isValidMonthDay } from "./calendar";
import {
  catchParseErrors,
  ClimateParseError,
  type ClimateIssue,
  type ClimateLocation,
  type FileDesignConditions,
  type ParsedClimate,
  type ParseResult,
} from "./types";

export const EPW_HEADER_LINES = 8;
export const EPW_FIELDS_PER_ROW = 35;
/** The fields the engine reads (up to station pressure, field 10). */
const EPW_REQUIRED_FIELDS = 10;
/** Stop collecting row errors after this many: a wrong file would report every row. */
const MAX_ERRORS = 50;

const HEADER_KEYWORDS = [
  "LOCATION",
  "DESIGN CONDITIONS",
  "TYPICAL/EXTREME PERIODS",
  "GROUND TEMPERATURES",
  "HOLIDAYS/DAYLIGHT SAVINGS",
  "COMMENTS 1",
  "COMMENTS 2",
  "DATA PERIODS",
];

/** Data fields read: 0-based column (the data dictionary numbers it index + 1), sentinel, valid range. */
const FIELD = {
  dryBulb: {
    index: 6,
    name: "dryBulbC",
    label: "dry-bulb temperature, °C",
    missing: 99.9,
    min: -70,
    max: 70,
  },
  dewPoint: {
    index: 7,
    name: "dewPointC",
    label: "dew-point temperature, °C",
    missing: 99.9,
    min: -70,
    max: 70,
  },
  relHum: {
    index: 8,
    name: "relativeHumidity",
    label: "relative humidity, %",
    missing: 999,
    min: 0,
    max: 110,
  },
  pressure: {
    index: 9,
    name: "pressurePa",
    label: "atmospheric station pressure, Pa",
    missing: 999999,
    min: 31000,
    max: 120000,
  },
} as const;

export interface EpwOptions {
  /**
   * Pressure for the wet-bulb: "station" (each hour's station pressure, the site pressure where it is
   * missing; the default) or "site" (the standard-atmosphere pressure at the file's elevation, or
   * `sitePressurePa` when given).
   */
  pressure?: "station" | "site";
  sitePressurePa?: number;
  maxGapHours?: number;
}

type FieldSpec = (typeof FIELD)[keyof typeof FIELD];

function parseLocation(line: string, errors: ClimateIssue[]): ClimateLocation | undefined {
  const f = line.split(",").map((s) => s.trim());
  const num = (i: number, field: string, min: number, max: number): number | undefined => {
    const raw = f[i];
    if (raw === undefined || raw === "") {
      errors.push({ line: 1, field, message: `LOCATION field ${i + 1} (${field}) is missing` });
      return undefined;
    }
    const v = Number(raw);
    if (!Number.isFinite(v) || v < min || v > max) {
      errors.push({
        line: 1,
        field,
        message: `LOCATION field ${i + 1} (${field}) is "${raw}", not a number in ${min}…${max}`,
      });
      return undefined;
    }
    return v;
  };
  const latitudeDeg = num(6, "latitude", -90, 90);
  const longitudeDeg = num(7, "longitude", -180, 180);
  const timeZoneH = num(8, "timeZone", -12, 14);
  const elevationM = num(9, "elevation", -1000, 9999.9);
  if (
    latitudeDeg === undefined ||
    longitudeDeg === undefined ||
    timeZoneH === undefined ||
    elevationM === undefined
  ) {
    return undefined;
  }
  const opt = (i: number) => {
    const s = f[i];
    return s && s !== "-" ? s : undefined;
  };
  const region = opt(2);
  const country = opt(3);
  const dataSource = opt(4);
  const stationId = opt(5);
  return {
    name: opt(1) ?? "unnamed location",
    ...(region ? { region } : {}),
    ...(country ? { country } : {}),
    ...(dataSource ? { dataSource } : {}),
    ...(stationId ? { stationId } : {}),
    latitudeDeg,
    longitudeDeg,
    timeZoneH,
    elevationM,
  };
}

/** Parse a number field; NaN for missing (sentinel, blank or out of range), null for garbage. */
function readValue(raw: string | undefined, spec: FieldSpec, outOfRange: { n: number }): number | null {
  const s = raw?.trim() ?? "";
  if (s === "") return NaN;
  const v = Number(s);
  if (!Number.isFinite(v)) return null;
  if (v >= spec.missing) return NaN;
  if (v < spec.min || v > spec.max) {
    outOfRange.n++;
    return NaN;
  }
  return v;
}

/**
 * Parse an EPW weather file into an hourly typical year.
 * Records are keyed by month/day/hour (the year column is ignored: typical years mix years);
 * EPW hour h (1…24, hour ending) becomes hour h − 1 (hour starting). Several records per hour are
 * averaged. 29 February, when present, gives an 8784-hour year. Missing values are interpolated
 * linearly over gaps of at most `maxGapHours` (default 6). Wet-bulb from dry-bulb and dew point (or RH
 * where the dew point is missing) by ASHRAE 2017 ch.1 eqs. 33/35 at the station or site pressure.
 * Never throws: malformed input gives `{ ok: false, errors }` with line numbers and field names.
 */
/**
 * The file's own DESIGN CONDITIONS line: undefined when it states none ("DESIGN CONDITIONS,0"), null when
 * it cannot be read. EnergyPlus weather files carry the ASHRAE Handbook—Fundamentals climatic design table of
 * their station; after the "Cooling" keyword come the hottest month, its mean daily range, then the 0.4, 1
 * and 2 % dry-bulb each with its mean coincident wet-bulb, then the 0.4, 1 and 2 % evaporation wet-bulb each
 * with its mean coincident dry-bulb [memory: the 2009 table's column order as written into EPW files].
 */
export function parseDesignConditions(line: string): FileDesignConditions | undefined | null {
  const f = line.split(",").map((s) => s.trim());
  const count = Number(f[1]);
  if (!Number.isFinite(count) || count < 1) return undefined;
  const source = f[2] ?? "";
  const c = f.findIndex((x) => x.toLowerCase() === "cooling");
  if (c < 0) return null;
  const n = (k: number) => {
    const raw = f[c + k];
    const v = raw === undefined || raw === "" ? NaN : Number(raw);
    return Number.isFinite(v) ? v : NaN;
  };
  const pcts = [0.4, 1, 2];
  const dry = pcts.map((p, i) => ({ exceedancePercent: p, dryBulbC: n(3 + 2 * i), meanCoincidentWetBulbC: n(4 + 2 * i) }));
  const wet = pcts.map((p, i) => ({ exceedancePercent: p, wetBulbC: n(9 + 2 * i), meanCoincidentDryBulbC: n(10 + 2 * i) }));
  const plausible = (t: number) => Number.isFinite(t) && t > -60 && t < 60;
  const ok =
    wet.every((w) => plausible(w.wetBulbC) && plausible(w.meanCoincidentDryBulbC) && w.wetBulbC <= w.meanCoincidentDryBulbC + 0.05) &&
    dry.every((d) => plausible(d.dryBulbC) && plausible(d.meanCoincidentWetBulbC));
  if (!ok) return null;
  return { source, coolingWetBulbC: wet, coolingDryBulbC: dry };
}

export function parseEpw(text: string, options: EpwOptions = {}): ParseResult<ParsedClimate> {
  return catchParseErrors(() => parseEpwUnsafe(text, options));
}

function parseEpwUnsafe(text: string, options: EpwOptions): ParseResult<ParsedClimate> {
  const lines = text.replace(/^\uFEFF/, "").split(/\r\n|\n|\r/);
  while (lines.length > 0 && lines[lines.length - 1]!.trim() === "") lines.pop();
  const errors: ClimateIssue[] = [];
  const warnings: ClimateIssue[] = [];
  if (lines.length < EPW_HEADER_LINES) {
    throw new ClimateParseError(
      lines.length,
      "header",
      `the file has ${lines.length} lines; an EPW file starts with ${EPW_HEADER_LINES} header lines (LOCATION … DATA PERIODS)`,
    );
  }
  for (let i = 0; i < EPW_HEADER_LINES; i++) {
    const keyword = HEADER_KEYWORDS[i]!;
    if (!lines[i]!.trim().toUpperCase().startsWith(keyword)) {
      errors.push({
        line: i + 1,
        field: keyword,
        message: `header line ${i + 1} should start with "${keyword}"; found "${lines[i]!.slice(0, 40)}"`,
      });
    }
  }
  if (errors.length > 0) return { ok: false, errors };

  const location = parseLocation(lines[0]!, errors);
  if (!location) return { ok: false, errors };
  const designConditions = parseDesignConditions(lines[1]!);
  if (designConditions === null) {
    warnings.push({ line: 2, field: "DESIGN CONDITIONS", message: "the file's design conditions could not be read; only the computed percentiles are shown" });
  }

  const periods = lines[7]!.split(",").map((s) => s.trim());
  const declared = Number(periods[2]);
  const declaredRecordsPerHour =
    Number.isInteger(declared) && declared >= 1 && declared <= 60 ? declared : undefined;
  if (declaredRecordsPerHour === undefined) {
    warnings.push({
      line: 8,
      field: "DATA PERIODS",
      message: `records per hour "${periods[2] ?? ""}" is not a whole number 1…60; taken from the data`,
    });
  }
  const nPeriods = Number(periods[1]);
  if (Number.isInteger(nPeriods) && nPeriods > 1) {
    warnings.push({
      line: 8,
      field: "DATA PERIODS",
      message: `${nPeriods} data periods declared; all rows are read as one year`,
    });
  }

  const sitePressurePa = options.sitePressurePa ?? pressureFromElevationPa(location.elevationM ?? 0);
  const records: WeatherRecord[] = [];
  const outOfRange = { n: 0 };
  let shortRows = 0;
  let rhFallback = 0;
  for (let li = EPW_HEADER_LINES; li < lines.length && errors.length < MAX_ERRORS; li++) {
    const lineNo = li + 1;
    const raw = lines[li]!;
    if (raw.trim() === "") {
      errors.push({ line: lineNo, field: "data", message: "empty line inside the data" });
      continue;
    }
    const f = raw.split(",");
    if (f.length < EPW_REQUIRED_FIELDS || f.length > EPW_FIELDS_PER_ROW) {
      const missingField =
        f.length < EPW_REQUIRED_FIELDS
          ? ` (field ${f.length + 1}, ${describeField(f.length + 1)}, is absent)`
          : "";
      errors.push({
        line: lineNo,
        field: f.length < EPW_REQUIRED_FIELDS ? fieldName(f.length + 1) : "data",
        message: `the row has ${f.length} fields, expected ${EPW_FIELDS_PER_ROW}${missingField}`,
      });
      continue;
    }
    if (f.length < EPW_FIELDS_PER_ROW) shortRows++;
    const month = Number(f[1]);
    const day = Number(f[2]);
    const hourEnding = Number(f[3]);
    if (!Number.isInteger(month) || month < 1 || month > 12) {
      errors.push({ line: lineNo, field: "month", message: `field 2 (month) is "${f[1]}", not 1…12` });
      continue;
    }
    if (!isValidMonthDay(month, day)) {
      errors.push({
        line: lineNo,
        field: "day",
        message: `field 3 (day) is "${f[2]}", not a day of month ${month}`,
      });
      continue;
    }
    if (!Number.isInteger(hourEnding) || hourEnding < 1 || hourEnding > 24) {
      errors.push({ line: lineNo, field: "hour", message: `field 4 (hour) is "${f[3]}", not 1…24` });
      continue;
    }
    const values: number[] = [];
    let bad = false;
    for (const spec of [FIELD.dryBulb, FIELD.dewPoint, FIELD.relHum, FIELD.pressure]) {
      const v = readValue(f[spec.index], spec, outOfRange);
      if (v === null) {
        errors.push({
          line: lineNo,
          field: spec.name,
          message: `field ${spec.index + 1} (${spec.label}) is "${f[spec.index]?.trim()}", not a number`,
        });
        bad = true;
        break;
      }
      values.push(v);
    }
    if (bad) continue;
    const [t, tdRaw, rhPct, p] = values as [number, number, number, number];
    let td = tdRaw;
    if (Number.isNaN(td) && !Number.isNaN(rhPct) && !Number.isNaN(t)) {
      // The dew point follows from RH and dry-bulb; pressure cancels out of pw → W → pw.
      const pPa = Number.isNaN(p) ? sitePressurePa : p;
      const pw = (Math.min(rhPct, 100) / 100) * saturationVaporPressurePa(t);
      td = dewPointFromHumidityRatioC(t, humidityRatioFromVaporPressure(pw, pPa), pPa);
      rhFallback++;
    }
    records.push({
      line: lineNo,
      month,
      day,
      hour: hourEnding - 1,
      dryBulbC: t,
      humidity: td,
      pressurePa: p,
    });
  }
  if (errors.length > 0) {
    if (errors.length >= MAX_ERRORS) {
      errors.push({ line: 0, field: "data", message: `stopped after ${MAX_ERRORS} errors` });
    }
    return { ok: false, errors };
  }
  if (shortRows > 0) {
    warnings.push({
      line: 0,
      field: "data",
      message: `${shortRows} rows have fewer than ${EPW_FIELDS_PER_ROW} fields; the fields LoopLedger reads (through station pressure) are present`,
    });
  }
  if (outOfRange.n > 0) {
    warnings.push({
      line: 0,
      field: "data",
      message: `${outOfRange.n} values outside the EPW format's ranges were treated as missing`,
    });
  }
  if (rhFallback > 0) {
    warnings.push({
      line: 0,
      field: "dewPointC",
      message: `${rhFallback} records had no dew point; it was derived from RH and dry-bulb`,
    });
  }

  const assembled = assembleHourlyYear(records, {
    humidityKind: "dewPoint",
    sitePressurePa,
    useStationPressure: (options.pressure ?? "station") === "station",
    maxGapHours: options.maxGapHours ?? DEFAULT_MAX_GAP_HOURS,
    label: location.name,
    ...(declaredRecordsPerHour !== undefined ? { declaredRecordsPerHour } : {}),
  });
  if (!assembled.ok) return assembled;
  return {
    ok: true,
    value: {
      location,
      ...(designConditions ? { fileDesignConditions: designConditions } : {}),
      year: assembled.value.year,
      stats: assembled.value.stats,
    },
    warnings: [...warnings, ...assembled.warnings],
  };
}

const FIELD_NAMES: Record<number, [string, string]> = {
  1: ["year", "year"],
  2: ["month", "month"],
  3: ["day", "day"],
  4: ["hour", "hour"],
  5: ["minute", "minute"],
  6: ["dataSource", "data source and uncertainty flags"],
  7: [FIELD.dryBulb.name, FIELD.dryBulb.label],
  8: [FIELD.dewPoint.name, FIELD.dewPoint.label],
  9: [FIELD.relHum.name, FIELD.relHum.label],
  10: [FIELD.pressure.name, FIELD.pressure.label],
};

function fieldName(n1: number): string {
  return FIELD_NAMES[n1]?.[0] ?? `field${n1}`;
}

function describeField(n1: number): string {
  return FIELD_NAMES[n1]?.[1] ?? `field ${n1}`;
}
