/**
 * The typical-year CSV layout of NREL's TMY3 data set (NREL/TP-581-43156, "Users Manual for TMY3 Data
 * Sets", 2008, section 3), recognised from its first two lines and read without a column mapping:
 *   line 1: station number, "station name", state, time zone (hours from UTC), latitude, longitude, elevation (m)
 *   line 2: the header, "Date (MM/DD/YYYY)", "Time (HH:MM)", … "Dry-bulb (C)", … "Dew-point (C)", …
 *           "RHum (%)", … "Pressure (mbar)", … (71 columns, each value followed by its source and uncertainty)
 *   then 8760 rows in local standard time, hour ending: 01:00 … 24:00.
 * Wet-bulb comes from dry-bulb and dew point at the station pressure of each hour (mbar = hPa); the
 * month/day/hour key drops the year, which differs from month to month in a typical year.
 */
import { parseHourlyCsv, type HourlyCsvMapping } from "./csv";
import { catchParseErrors, ClimateParseError, type ClimateLocation, type ParsedClimate, type ParseResult } from "./types";

/** Station data of a TMY3 file's first line. */
export interface Tmy3Station {
  stationId: string;
  name: string;
  state: string;
  timeZoneH: number;
  latitudeDeg: number;
  longitudeDeg: number;
  elevationM: number;
}

const HEADER_NAMES = {
  date: "date (mm/dd/yyyy)",
  time: "time (hh:mm)",
  dryBulb: "dry-bulb (c)",
  dewPoint: "dew-point (c)",
  relativeHumidity: "rhum (%)",
  pressure: "pressure (mbar)",
  pressureKPa: "pressure (kpa)",
} as const;

function splitCsvLine(line: string): string[] {
  const out: string[] = [];
  let cur = "";
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i]!;
    if (ch === '"') quoted = !quoted;
    else if (ch === "," && !quoted) {
      out.push(cur.trim());
      cur = "";
    } else cur += ch;
  }
  out.push(cur.trim());
  return out;
}

function firstLines(text: string, n: number): string[] {
  const body = text.replace(/^\uFEFF/, "");
  const out: string[] = [];
  let start = 0;
  while (out.length < n && start <= body.length) {
    let end = body.indexOf("\n", start);
    if (end < 0) end = body.length;
    out.push(body.slice(start, end).replace(/\r$/, ""));
    start = end + 1;
  }
  return out;
}

/** The station line, or null when the line does not have the TMY3 station layout. */
export function parseTmy3StationLine(line: string): Tmy3Station | null {
  const f = splitCsvLine(line);
  if (f.length < 7) return null;
  const [id, name, state, tz, lat, lon, elev] = f;
  const nums = [tz, lat, lon, elev].map((x) => Number(x));
  if (!/^\d{5,6}$/.test(id ?? "") || !name || nums.some((v) => !Number.isFinite(v))) return null;
  const [timeZoneH, latitudeDeg, longitudeDeg, elevationM] = nums as [number, number, number, number];
  if (Math.abs(timeZoneH) > 14 || Math.abs(latitudeDeg) > 90 || Math.abs(longitudeDeg) > 180 || elevationM < -500 || elevationM > 9000) return null;
  return { stationId: id!, name: name!, state: state ?? "", timeZoneH, latitudeDeg, longitudeDeg, elevationM };
}

/** True when the text starts like a TMY3 file: a station line, then a header naming the date and time columns. */
export function looksLikeTmy3(text: string): boolean {
  const [station, header] = firstLines(text, 2);
  if (!station || !header || !parseTmy3StationLine(station)) return false;
  const cols = splitCsvLine(header).map((h) => h.toLowerCase());
  return cols.includes(HEADER_NAMES.date) && cols.includes(HEADER_NAMES.time) && cols.includes(HEADER_NAMES.dryBulb);
}

/**
 * The column mapping of a TMY3 file (by header name): dew point when present, else RH; station pressure
 * when present, in mbar as the layout says — or in kPa where the values show it (a heading of "(kPa)", or
 * values below 200 under "(mbar)": no station sits where the pressure is under 200 mbar). Times are hour
 * ending as in the layout (01:00 … 24:00); a file that writes 00:00 and no 24:00 is read as hour starting.
 */
export function tmy3Mapping(text: string, station: Tmy3Station): HourlyCsvMapping & { notes: string[] } {
  const lines = firstLines(text, 26);
  const header = splitCsvLine(lines[1] ?? "").map((h) => h.toLowerCase());
  const has = (name: string) => header.includes(name);
  const notes: string[] = [];
  const pressureName = has(HEADER_NAMES.pressure) ? HEADER_NAMES.pressure : has(HEADER_NAMES.pressureKPa) ? HEADER_NAMES.pressureKPa : null;
  let pressureUnit: "mbar" | "kPa" = pressureName === HEADER_NAMES.pressureKPa ? "kPa" : "mbar";
  if (pressureName === HEADER_NAMES.pressure) {
    const at = header.indexOf(pressureName);
    const sample = lines
      .slice(2)
      .map((l) => Number(splitCsvLine(l)[at]))
      .filter((v) => Number.isFinite(v) && v > 0);
    const sorted = [...sample].sort((a, b) => a - b);
    const median = sorted[Math.floor(sorted.length / 2)];
    if (median !== undefined && median < 200) {
      pressureUnit = "kPa";
      notes.push(`the "Pressure (mbar)" column holds values near ${median}: read as kPa`);
    }
  }
  const hourEnding = /,\s*24:00\s*,/.test(text) || !/,\s*0?0:00\s*,/.test(text);
  if (!hourEnding) notes.push("the times run 00:00 … 23:00: read as hour starting, not the layout's hour ending");
  return {
    delimiter: ",",
    decimalSeparator: ".",
    skipLines: 1,
    hasHeader: true,
    temperatureUnit: "C",
    dryBulb: HEADER_NAMES.dryBulb,
    humidity: has(HEADER_NAMES.dewPoint)
      ? { kind: "dewPoint", column: HEADER_NAMES.dewPoint }
      : { kind: "relativeHumidity", column: HEADER_NAMES.relativeHumidity, unit: "percent" },
    time: { kind: "dateAndTime", date: HEADER_NAMES.date, time: HEADER_NAMES.time, format: "mdy", convention: hourEnding ? "end" : "start" },
    ...(pressureName ? { pressure: { column: pressureName, unit: pressureUnit } } : {}),
    elevationM: station.elevationM,
    label: station.state ? `${station.name}, ${station.state}` : station.name,
    notes,
  };
}

/**
 * Parse a TMY3-layout file into an hourly typical year, with the station's location (name, state, time
 * zone, latitude, longitude, elevation) from its first line. Never throws: a file that is not in the
 * layout, or rows that cannot be read, give `{ ok: false, errors }` with line numbers and column names.
 */
export function parseTmy3(text: string): ParseResult<ParsedClimate> {
  return catchParseErrors(() => {
    const [first] = firstLines(text, 1);
    const station = parseTmy3StationLine(first ?? "");
    if (!station) {
      throw new ClimateParseError(1, "station", "the first line is not a TMY3 station line (station number, name, state, time zone, latitude, longitude, elevation)");
    }
    if (!looksLikeTmy3(text)) {
      throw new ClimateParseError(2, "header", 'the second line is not a TMY3 header with "Date (MM/DD/YYYY)", "Time (HH:MM)" and "Dry-bulb (C)"');
    }
    const { notes, ...mapping } = tmy3Mapping(text, station);
    const parsed = parseHourlyCsv(text, mapping);
    if (!parsed.ok) return parsed;
    const location: ClimateLocation = {
      name: station.name,
      ...(station.state ? { region: station.state } : {}),
      dataSource: "TMY3 layout",
      stationId: station.stationId,
      latitudeDeg: station.latitudeDeg,
      longitudeDeg: station.longitudeDeg,
      timeZoneH: station.timeZoneH,
      elevationM: station.elevationM,
    };
    const layoutNotes = notes.map((message) => ({ line: 2, field: "layout", message }));
    return { ok: true, value: { ...parsed.value, location }, warnings: [...layoutNotes, ...parsed.warnings] };
  });
}
