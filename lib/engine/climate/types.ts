/**
 * Climate shapes of the LoopLedger engine. SI: °C, Pa, hours.
 *
 * Hour convention everywhere in the engine: `hour` 0…23 is the clock hour that STARTS at that hour,
 * i.e. the interval [hour, hour + 1). EPW files count 1…24 for the hour ENDING at that time, so EPW
 * hour h becomes hour h − 1 here. Months are 1…12, days 1…31; years are never used (a typical year
 * is stitched from different calendar years).
 */

/** A typical year as hourly records, in calendar order (8760 h, or 8784 h with 29 February). */
export interface HourlyClimateYear {
  kind: "hourly";
  label?: string;
  month: number[];
  day: number[];
  /** 0…23, the hour starting at that time. */
  hour: number[];
  dryBulbC: number[];
  /** Thermodynamic wet-bulb at the pressure the file was resolved at. */
  wetBulbC: number[];
  /** Present when the source carried a dew point or relative humidity. */
  dewPointC?: number[];
  /** Pressure each wet-bulb was computed at, Pa (station pressure, or the site pressure repeated). */
  pressurePa?: number[];
}

/**
 * One bin of a binned year. For wet-bulb bins `wetBulbC` is the bin's (mean) wet-bulb and
 * `meanCoincidentDryBulbC` the mean dry-bulb of its hours; dry-bulb bins are carried in the same
 * shape (their mean coincident wet-bulb in `wetBulbC`, their dry-bulb in `meanCoincidentDryBulbC`).
 */
export interface ClimateBin {
  wetBulbC: number;
  meanCoincidentDryBulbC: number;
  hours: number;
  /** 1…12 when the table is split by month. */
  month?: number;
}

export interface BinnedClimateYear {
  kind: "bins";
  label?: string;
  /** Which temperature the source table was binned on (informational; the engine uses every bin as is). */
  binnedOn?: "wetBulb" | "dryBulb";
  bins: ClimateBin[];
}

export type ClimateYear = HourlyClimateYear | BinnedClimateYear;

/** The LOCATION header of an EPW file (or the equivalent entered for a CSV). */
export interface ClimateLocation {
  name: string;
  region?: string;
  country?: string;
  dataSource?: string;
  stationId?: string;
  latitudeDeg?: number;
  longitudeDeg?: number;
  /** Hours from UTC, e.g. −5. */
  timeZoneH?: number;
  elevationM?: number;
}

/** Counts of what a parser found and repaired, for the import summary. */
export interface ClimateParseStats {
  /** Data rows read from the file. */
  recordsRead: number;
  /** Records per hour found in the data (1 for hourly, 4 for 15-minute data). */
  recordsPerHour: number;
  /** Hours in the resolved year (8760 or 8784). */
  hours: number;
  hasLeapDay: boolean;
  /** Values that were missing (sentinel, blank, out of range, or whole hours absent), per quantity. */
  missingValues: Record<string, number>;
  /** Hours whose value was filled by linear interpolation, per quantity. */
  interpolatedHours: Record<string, number>;
  /** Hours absent from the file altogether (all quantities interpolated). */
  absentHours: number;
  /** Where the wet-bulb pressure came from. */
  pressureSource: "station" | "site";
  sitePressurePa: number;
}

/**
 * The design conditions a weather file states for itself (an EPW's DESIGN CONDITIONS line), shown beside
 * the percentiles LoopLedger computes from the hours. Annual cooling values at 0.4, 1 and 2 % exceedance.
 */
export interface FileDesignConditions {
  /** Where the file says they come from, e.g. "Climate Design Data 2009 ASHRAE Handbook". */
  source: string;
  /** Evaporation design wet-bulb with its mean coincident dry-bulb, °C. */
  coolingWetBulbC: { exceedancePercent: number; wetBulbC: number; meanCoincidentDryBulbC: number }[];
  /** Cooling design dry-bulb with its mean coincident wet-bulb, °C. */
  coolingDryBulbC: { exceedancePercent: number; dryBulbC: number; meanCoincidentWetBulbC: number }[];
}

export interface ParsedClimate {
  location?: ClimateLocation;
  /** Design conditions stated in the file itself (EPW), when present and readable. */
  fileDesignConditions?: FileDesignConditions;
  year: HourlyClimateYear;
  stats: ClimateParseStats;
}

/** One problem in an input file: 1-based line number (0 when it concerns the whole file). */
export interface ClimateIssue {
  line: number;
  field: string;
  message: string;
}

export type ParseResult<T> =
  { ok: true; value: T; warnings: ClimateIssue[] } | { ok: false; errors: ClimateIssue[] };

/**
 * A problem that stops a parser, with the 1-based line (0 = the whole file) and the field it concerns.
 * Parsers throw it internally and return it as `{ ok: false, errors: [toIssue()] }`; they never let it out.
 */
export class ClimateParseError extends Error {
  readonly line: number;
  readonly field: string;
  readonly detail: string;
  constructor(line: number, field: string, detail: string) {
    super(line > 0 ? `line ${line}, ${field}: ${detail}` : `${field}: ${detail}`);
    this.name = "ClimateParseError";
    this.line = line;
    this.field = field;
    this.detail = detail;
  }
  toIssue(): ClimateIssue {
    return { line: this.line, field: this.field, message: this.detail };
  }
}

/** Run a parser body, turning a ClimateParseError (or, from a bug, anything else) into an error result. */
export function catchParseErrors<T>(body: () => ParseResult<T>): ParseResult<T> {
  try {
    return body();
  } catch (e) {
    if (e instanceof ClimateParseError) return { ok: false, errors: [e.toIssue()] };
    return {
      ok: false,
      errors: [{ line: 0, field: "file", message: `could not read the file: ${String(e)}` }],
    };
  }
}

// ---- The scenario's `climate` key, as the engine receives it (the zod schema in
// ---- lib/scenarios/schema-climate.ts produces values assignable to these).

export interface HourlyClimateInput {
  source: "hourly";
  /** The stored climate dataset these arrays came from, if any. */
  datasetId?: string;
  label: string;
  month: number[];
  day: number[];
  /** 0…23, hour starting. */
  hour: number[];
  dryBulbC: number[];
  wetBulbC: number[];
}

export interface WetBulbBinInput {
  wetBulbC: number;
  meanCoincidentDryBulbC: number;
  hours: number;
  month?: number;
}

export interface DryBulbBinInput {
  dryBulbC: number;
  meanCoincidentWetBulbC: number;
  hours: number;
  month?: number;
}

export interface WetBulbBinsClimateInput {
  source: "wetBulbBins";
  datasetId?: string;
  label?: string;
  bins: WetBulbBinInput[];
}

export interface DryBulbBinsClimateInput {
  source: "dryBulbBins";
  datasetId?: string;
  label?: string;
  bins: DryBulbBinInput[];
}

export type ClimateInput = HourlyClimateInput | WetBulbBinsClimateInput | DryBulbBinsClimateInput;
