/**
 * Shapes a parsed weather file or an entered bin table into a stored climate dataset (data + provenance +
 * summary), and a stored dataset back into the scenario's climate input. Pure: no database, no server-only
 * imports, so both the import route and tests use it.
 */
import {
  binnedClimateFromHourly,
  summarizeClimate,
  toClimateYear,
  type ClimateBin,
  type ClimateInput,
  type ClimateIssue,
  type ClimateLocation,
  type DryBulbBinInput,
  type HourlyCsvMapping,
  type FileDesignConditions,
  type ParsedClimate,
  type WetBulbBinInput,
} from "@/lib/engine/climate";
import type { NewClimateDatasetRow } from "@/db/queries/climate";

export const CLIMATE_DATA_VERSION = 1;

/** Station elevation differing from the site's by more than this deserves a warning [practice]. */
export const ELEVATION_MISMATCH_WARN_M = 150;

export type ClimateSourceKind = "epw" | "csv" | "wetBulbBins" | "dryBulbBins";

export interface StoredHourlyData {
  version: 1;
  kind: "hourly";
  label: string;
  month: number[];
  day: number[];
  /** 0…23, hour starting. */
  hour: number[];
  dryBulbC: number[];
  wetBulbC: number[];
  dewPointC?: number[];
  /** 1 K wet-bulb bins with mean coincident dry-bulb of the same hours (for bin-method runs and charts). */
  wetBulbBins: ClimateBin[];
}

export interface StoredBinData {
  version: 1;
  kind: "bins";
  source: "wetBulbBins" | "dryBulbBins";
  label: string;
  /** The table as entered (SI). */
  wetBulbBins?: WetBulbBinInput[];
  dryBulbBins?: DryBulbBinInput[];
  /** The same table keyed on wet-bulb, as the engine uses it. */
  bins: ClimateBin[];
}

export type StoredClimateData = StoredHourlyData | StoredBinData;

/** The import summary as stored (JSON: a NaN becomes null). */
export interface StoredClimateSummary {
  kind: "hourly" | "bins";
  hours: number;
  records: number;
  hasLeapDay?: boolean;
  recordsPerHour?: number;
  missingValues?: Record<string, number>;
  interpolatedHours?: Record<string, number>;
  dryBulb: { minC: number | null; meanC: number | null; maxC: number | null };
  wetBulb: { minC: number | null; meanC: number | null; maxC: number | null };
  designWetBulbC: { exceedancePercent: number; wetBulbC: number | null }[];
  wetBulbHistogram: { centerC: number; lowC: number; highC: number; hours: number }[];
  monthlyMeanDryBulbC?: (number | null)[];
  monthlyMeanWetBulbC?: (number | null)[];
  monthHourMeanWetBulbC?: (number | null)[][];
}

export interface ClimateProvenance {
  importedFrom: "epw" | "csv" | "entered";
  fileName?: string;
  byteSize?: number;
  sha256?: string;
  location?: ClimateLocation;
  stationElevationM?: number;
  siteElevationM: number;
  recordCount: number;
  recordsPerHour?: number;
  missingValues?: Record<string, number>;
  interpolatedHours?: Record<string, number>;
  absentHours?: number;
  pressureSource?: "station" | "site";
  sitePressurePa?: number;
  csvMapping?: HourlyCsvMapping;
  /** A known file layout read without a mapping (e.g. "TMY3"). */
  layout?: string;
  /** The design conditions the file states for itself (an EPW's DESIGN CONDITIONS line). */
  fileDesignConditions?: FileDesignConditions;
  warnings: ClimateIssue[];
}

export interface NewDataset {
  name: string;
  sourceKind: ClimateSourceKind;
  fileName: string | null;
  provenance: ClimateProvenance;
  recordCount: number;
  missingCount: number;
  hoursTotal: number;
  data: StoredClimateData;
  summary: StoredClimateSummary;
}

/** The climate_datasets row of a new dataset: the JSON parts serialized for their jsonb columns. */
export function climateDatasetRow(ds: NewDataset, owner: { projectId: string; createdBy: string }): NewClimateDatasetRow {
  return {
    project_id: owner.projectId,
    name: ds.name,
    source_kind: ds.sourceKind,
    file_name: ds.fileName,
    provenance: JSON.stringify(ds.provenance),
    record_count: ds.recordCount,
    missing_count: ds.missingCount,
    hours_total: ds.hoursTotal,
    data: JSON.stringify(ds.data),
    summary: JSON.stringify(ds.summary),
    created_by: owner.createdBy,
  };
}

/** Replace NaN/±Infinity by null throughout, as JSON would, so the stored and the returned shapes agree. */
export function jsonSafe<T>(value: T): T {
  return JSON.parse(JSON.stringify(value, (_k, v) => (typeof v === "number" && !Number.isFinite(v) ? null : v))) as T;
}

const round = (digits: number) => {
  const f = 10 ** digits;
  return (x: number) => Math.round(x * f) / f;
};
// 0.001 K keeps every figure a weather file carries (0.1 °C) and the wet-bulb solver's precision, at a third of the JSON size.
const r3 = round(3);

function elevationWarning(location: ClimateLocation | undefined, siteElevationM: number): ClimateIssue[] {
  const station = location?.elevationM;
  if (station === undefined || Math.abs(station - siteElevationM) <= ELEVATION_MISMATCH_WARN_M) return [];
  return [
    {
      line: 1,
      field: "elevation",
      message: `the weather station is at ${Math.round(station)} m but the site at ${Math.round(siteElevationM)} m: temperatures and wet-bulbs may not represent the site`,
    },
  ];
}

/** A parsed EPW or CSV year → the dataset to store. */
export function datasetFromParsedFile(
  parsed: ParsedClimate,
  parseWarnings: ClimateIssue[],
  meta: {
    sourceKind: "epw" | "csv";
    fileName: string;
    name?: string | undefined;
    byteSize: number;
    sha256: string;
    siteElevationM: number;
    csvMapping?: HourlyCsvMapping | undefined;
    layout?: string;
  },
): NewDataset {
  const { year, stats, location } = parsed;
  const label = meta.name?.trim() || location?.name || meta.fileName;
  const hourly: StoredHourlyData = {
    version: CLIMATE_DATA_VERSION,
    kind: "hourly",
    label,
    month: year.month.slice(),
    day: year.day.slice(),
    hour: year.hour.slice(),
    dryBulbC: year.dryBulbC.map(r3),
    wetBulbC: year.wetBulbC.map(r3),
    ...(year.dewPointC ? { dewPointC: year.dewPointC.map(r3) } : {}),
    wetBulbBins: binnedClimateFromHourly(year).bins.map((b) => ({
      wetBulbC: r3(b.wetBulbC),
      meanCoincidentDryBulbC: r3(b.meanCoincidentDryBulbC),
      hours: b.hours,
    })),
  };
  const summary = jsonSafe(summarizeClimate(year, { ...(location ? { location } : {}), stats })) as StoredClimateSummary & {
    location?: unknown;
    label?: unknown;
  };
  delete summary.location;
  delete summary.label;
  const humidityField = Object.keys(stats.missingValues).find((k) => k !== "dryBulbC" && k !== "pressurePa");
  const missingCount = (stats.missingValues.dryBulbC ?? 0) + (humidityField ? (stats.missingValues[humidityField] ?? 0) : 0);
  const warnings = [...parseWarnings, ...elevationWarning(location, meta.siteElevationM)];
  const provenance: ClimateProvenance = {
    importedFrom: meta.sourceKind,
    fileName: meta.fileName,
    byteSize: meta.byteSize,
    sha256: meta.sha256,
    ...(location ? { location } : {}),
    ...(location?.elevationM !== undefined ? { stationElevationM: location.elevationM } : {}),
    siteElevationM: meta.siteElevationM,
    recordCount: stats.recordsRead,
    recordsPerHour: stats.recordsPerHour,
    missingValues: stats.missingValues,
    interpolatedHours: stats.interpolatedHours,
    absentHours: stats.absentHours,
    pressureSource: stats.pressureSource,
    sitePressurePa: stats.sitePressurePa,
    ...(meta.csvMapping ? { csvMapping: meta.csvMapping } : {}),
    ...(meta.layout ? { layout: meta.layout } : {}),
    ...(parsed.fileDesignConditions ? { fileDesignConditions: parsed.fileDesignConditions } : {}),
    warnings,
  };
  return {
    name: label.slice(0, 200),
    sourceKind: meta.sourceKind,
    fileName: meta.fileName,
    provenance: jsonSafe(provenance),
    recordCount: stats.recordsRead,
    missingCount,
    hoursTotal: stats.hours,
    data: hourly,
    summary,
  };
}

export type BinTableInput =
  | { source: "wetBulbBins"; bins: WetBulbBinInput[] }
  | { source: "dryBulbBins"; bins: DryBulbBinInput[] };

/** An entered bin table (already validated, SI) → the dataset to store. */
export function datasetFromBins(table: BinTableInput, meta: { name: string; siteElevationM: number }): NewDataset {
  const label = meta.name.trim();
  const year = toClimateYear({ ...table, label } as ClimateInput);
  if (year.kind !== "bins") throw new Error("a bin table must give a binned year");
  const summary = jsonSafe(summarizeClimate(year)) as StoredClimateSummary & { label?: unknown };
  delete summary.label;
  const hoursTotal = year.bins.reduce((s, b) => s + b.hours, 0);
  const warnings: ClimateIssue[] = [];
  if (Math.abs(hoursTotal - 8760) > 0.5 && Math.abs(hoursTotal - 8784) > 0.5) {
    warnings.push({
      line: 0,
      field: "hours",
      message: `the bins hold ${Math.round(hoursTotal * 10) / 10} h, not a year (8760 h): yearly water and energy will cover only those hours`,
    });
  }
  const data: StoredBinData = {
    version: CLIMATE_DATA_VERSION,
    kind: "bins",
    source: table.source,
    label,
    ...(table.source === "wetBulbBins" ? { wetBulbBins: table.bins } : { dryBulbBins: table.bins }),
    bins: year.bins,
  };
  return {
    name: label.slice(0, 200),
    sourceKind: table.source,
    fileName: null,
    provenance: { importedFrom: "entered", siteElevationM: meta.siteElevationM, recordCount: table.bins.length, warnings },
    recordCount: table.bins.length,
    missingCount: 0,
    hoursTotal,
    data,
    summary,
  };
}

/** A stored dataset as the scenario's `climate` input (lib/scenarios/schema-climate.ts shape). */
export function climateInputFromStored(datasetId: string, name: string, data: StoredClimateData): ClimateInput {
  if (data.kind === "hourly") {
    return {
      source: "hourly",
      datasetId,
      label: data.label || name,
      month: data.month,
      day: data.day,
      hour: data.hour,
      dryBulbC: data.dryBulbC,
      wetBulbC: data.wetBulbC,
    };
  }
  if (data.source === "wetBulbBins") {
    return { source: "wetBulbBins", datasetId, label: data.label || name, bins: data.wetBulbBins ?? [] };
  }
  return { source: "dryBulbBins", datasetId, label: data.label || name, bins: data.dryBulbBins ?? [] };
}
