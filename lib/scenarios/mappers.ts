/**
 * Row ⇄ DTO ⇄ engine input for scenarios.
 *
 * A stored scenario (`scenarios.input`) is the validated scenario document WITHOUT the bulky climate and
 * without the site: its `climate` key only names the stored climate dataset (`{ datasetId }`), and the
 * site (elevation, location) is always the project's. `toEngineInput` puts both back, so that the engine
 * input — and therefore the inputs hash — changes whenever the dataset or the project's site changes.
 * The export document is that full engine input: posting it to /api/v1/analyses reproduces the result.
 */
import type { ClimateInput } from "@/lib/engine/climate/types";
import type { ScenarioInput } from "@/lib/engine/input";
import { climateInputFromStored, type StoredClimateData } from "@/lib/climate/build";
import type { ScenarioDocument as SchemaDocument } from "./schema";

/** Where a stored scenario takes its climate from. */
export type StoredClimateRef = { datasetId: string };

/**
 * The scenario document as stored and edited: everything but the site and the climate. A saved scenario
 * holds the schema's parsed output (every default written out); a new one holds `defaultScenario`'s draft
 * (first costs not yet entered).
 */
export type ScenarioDocument = Omit<SchemaDocument, "climate" | "site">;
export type StoredScenarioInput = ScenarioDocument & { climate: StoredClimateRef };

export interface ScenarioDTO {
  id: string;
  projectId: string;
  name: string;
  climateDatasetId: string | null;
  revision: number;
  inputVersion: number;
  updatedAt: string;
  archivedAt: string | null;
  document: ScenarioDocument;
}

export interface ScenarioRowLike {
  id: string;
  projectId: string;
  name: string;
  climateDatasetId: string | null;
  input: unknown;
  inputVersion: number;
  revision: number;
  updatedAt: Date | string;
  archivedAt: Date | string | null;
}

export interface ClimateDatasetLike {
  id: string;
  name: string;
  source_kind?: string;
  sourceKind?: string;
  data: unknown;
}

export interface ProjectSiteLike {
  elevationM: number;
  locationLabel: string;
  siteName?: string;
}

const iso = (d: Date | string) => (typeof d === "string" ? new Date(d).toISOString() : d.toISOString());

/** The stored document (a jsonb value) with the climate reference and the site removed. */
export function documentFromStored(input: unknown): ScenarioDocument {
  const raw = (typeof input === "string" ? JSON.parse(input) : input) as Record<string, unknown>;
  const { climate: _c, site: _s, ...rest } = raw ?? {};
  void _c;
  void _s;
  return rest as unknown as ScenarioDocument;
}

/** Row → DTO: what pages and client components receive (no user ids, no bulky climate). */
export function toScenarioDTO(row: ScenarioRowLike): ScenarioDTO {
  return {
    id: row.id,
    projectId: row.projectId,
    name: row.name,
    climateDatasetId: row.climateDatasetId,
    revision: row.revision,
    inputVersion: row.inputVersion,
    updatedAt: iso(row.updatedAt),
    archivedAt: row.archivedAt ? iso(row.archivedAt) : null,
    document: documentFromStored(row.input),
  };
}

/** A validated engine input → what is stored: the climate becomes a reference, the site is dropped. */
export function toStoredInput(input: ScenarioInput | ScenarioDocument | Record<string, unknown>, datasetId: string): StoredScenarioInput {
  const { climate: _c, site: _s, ...rest } = input as Record<string, unknown>;
  void _c;
  void _s;
  return { ...(rest as unknown as ScenarioDocument), climate: { datasetId } };
}

const isNumArray = (v: unknown): v is number[] => Array.isArray(v) && v.every((x) => typeof x === "number");

/**
 * The scenario's `climate` key from a stored climate dataset. Accepts the dataset's `data` as the
 * scenario's own climate shape (`{ source: "hourly" | "wetBulbBins" | "dryBulbBins", … }`), or as the
 * engine's ClimateYear (`{ kind: "hourly" | "bins", … }`), or with the arrays under `hourly`.
 */
export function climateInputFromDataset(ds: ClimateDatasetLike): ClimateInput {
  const data = (typeof ds.data === "string" ? JSON.parse(ds.data) : ds.data) as Record<string, unknown> | null;
  if (!data || typeof data !== "object") throw new Error(`climate dataset ${ds.id} holds no data`);
  // The climate import's own format (lib/climate/build.ts) first; older or hand-made shapes below.
  if (typeof data.version === "number" && (data.kind === "hourly" || data.kind === "bins")) {
    return climateInputFromStored(ds.id, ds.name, data as unknown as StoredClimateData);
  }
  const kind = ds.source_kind ?? ds.sourceKind;
  const label = typeof data.label === "string" && data.label ? data.label : ds.name;
  const hourly = (data.hourly && typeof data.hourly === "object" ? data.hourly : data) as Record<string, unknown>;
  if (data.source === "hourly" || data.kind === "hourly" || (isNumArray(hourly.dryBulbC) && isNumArray(hourly.wetBulbC))) {
    const { month, day, hour, dryBulbC, wetBulbC } = hourly;
    if (!isNumArray(month) || !isNumArray(day) || !isNumArray(hour) || !isNumArray(dryBulbC) || !isNumArray(wetBulbC)) {
      throw new Error(`climate dataset ${ds.id}: hourly arrays month, day, hour, dryBulbC, wetBulbC are required`);
    }
    return { source: "hourly", datasetId: ds.id, label, month, day, hour, dryBulbC, wetBulbC };
  }
  const bins = data.bins;
  if (!Array.isArray(bins)) throw new Error(`climate dataset ${ds.id}: neither hourly arrays nor bins`);
  const dryBased = data.source === "dryBulbBins" || kind === "dryBulbBins" || data.binnedOn === "dryBulb";
  const month = (b: Record<string, unknown>) => (typeof b.month === "number" ? { month: b.month } : {});
  if (dryBased) {
    return {
      source: "dryBulbBins",
      datasetId: ds.id,
      label,
      bins: (bins as Record<string, unknown>[]).map((b) => ({
        dryBulbC: Number(b.dryBulbC ?? b.meanCoincidentDryBulbC),
        meanCoincidentWetBulbC: Number(b.meanCoincidentWetBulbC ?? b.wetBulbC),
        hours: Number(b.hours),
        ...month(b),
      })),
    };
  }
  return {
    source: "wetBulbBins",
    datasetId: ds.id,
    label,
    bins: (bins as Record<string, unknown>[]).map((b) => ({
      wetBulbC: Number(b.wetBulbC),
      meanCoincidentDryBulbC: Number(b.meanCoincidentDryBulbC ?? b.dryBulbC),
      hours: Number(b.hours),
      ...month(b),
    })),
  };
}

/**
 * The engine input of a stored scenario: the document, the project's site and the dataset's climate.
 * Not yet validated: pass it through `scenarioSchema` (parseScenario) before the engine sees it.
 */
export function toEngineInputDraft(document: ScenarioDocument, climate: ClimateInput, site: ProjectSiteLike): Record<string, unknown> {
  return {
    ...document,
    site: { elevationM: site.elevationM, locationLabel: site.locationLabel || site.siteName || "" },
    climate,
  };
}

/** Dotted path of a zod issue path, e.g. ["options", 1, "fan", "designPowerKW"] → "options.1.fan.designPowerKW". */
export function issuePath(path: readonly PropertyKey[]): string {
  return path.map((p) => String(p)).join(".");
}
