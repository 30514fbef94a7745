import "server-only";
import { db } from "@/db";
import { findClimateDatasetData, findClimateDatasetSummary, listClimateDatasetsOfProject } from "@/db/queries/climate";
import { writeAudit } from "@/db/queries/audit";
import { isUuid, type ProjectAccess } from "@/lib/auth/session";
import { importClimateFile, type ClimateUploadForm, type ImportTarget } from "./import";
import type { ClimateInput } from "@/lib/engine/climate";
import { climateInputFromStored, type ClimateProvenance, type ClimateSourceKind, type StoredClimateData, type StoredClimateSummary } from "./build";

/** A dataset in a list: no arrays, no provenance details. */
export interface ClimateDatasetListItem {
  id: string;
  name: string;
  sourceKind: ClimateSourceKind;
  fileName: string | null;
  recordCount: number;
  missingCount: number;
  hoursTotal: number;
  /** Wet-bulb exceeded 0.4 % of the hours, °C (null when it could not be computed). */
  designWetBulb04C: number | null;
  createdAt: Date;
  createdByName: string | null;
}

export interface ClimateDatasetDTO extends ClimateDatasetListItem {
  summary: StoredClimateSummary;
  provenance: ClimateProvenance;
}

function design04(value: unknown): number | null {
  if (!Array.isArray(value)) return null;
  const row = value.find((d) => d && typeof d === "object" && (d as { exceedancePercent?: unknown }).exceedancePercent === 0.4) as
    | { wetBulbC?: unknown }
    | undefined;
  return typeof row?.wetBulbC === "number" ? row.wetBulbC : null;
}

function listItem(r: Awaited<ReturnType<typeof listClimateDatasetsOfProject>>[number]): ClimateDatasetListItem {
  return {
    id: r.id,
    name: r.name,
    sourceKind: r.sourceKind,
    fileName: r.fileName,
    recordCount: r.recordCount,
    missingCount: r.missingCount,
    hoursTotal: r.hoursTotal,
    designWetBulb04C: design04(r.designWetBulbC),
    createdAt: r.createdAt,
    createdByName: r.createdByName,
  };
}

/** The project's climate datasets, for anyone who may view the project (client viewers included). */
export async function listClimateDatasets(access: ProjectAccess): Promise<ClimateDatasetListItem[]> {
  if (!access.can("project.view")) return [];
  const rows = await listClimateDatasetsOfProject(db, access.project.id);
  return rows.map(listItem);
}

/** One dataset's summary and provenance (no hourly arrays), or null when it is not this project's. A client viewer's view is audited. */
export async function getClimateDataset(access: ProjectAccess, datasetId: string): Promise<ClimateDatasetDTO | null> {
  if (!access.can("project.view") || !isUuid(datasetId)) return null;
  const r = await findClimateDatasetSummary(db, access.project.id, datasetId);
  if (!r) return null;
  // Client viewers' views are the ones worth a trail entry ("the owner looked at the climate"); the firm's own
  // page loads would bury the changes in the project's audit list.
  if (!access.can("climate.manage")) await writeAudit(db, {
    actorId: access.viewer.id,
    firmId: access.project.firmId,
    projectId: access.project.id,
    action: "climate.view",
    targetType: "climate_dataset",
    targetId: r.id,
  });
  return {
    ...listItem({ ...r, designWetBulbC: (r.summary as StoredClimateSummary).designWetBulbC }),
    summary: r.summary as StoredClimateSummary,
    provenance: r.provenance as unknown as ClimateProvenance,
  };
}

/**
 * A dataset as the scenario's `climate` input (hourly arrays or the entered bins, SI), for the scenario
 * editor and the analysis; null when it is not this project's. Needs scenario.edit or scenario.run.
 */
export async function getClimateInput(access: ProjectAccess, datasetId: string): Promise<ClimateInput | null> {
  if (!(access.can("scenario.edit") || access.can("scenario.run")) || !isUuid(datasetId)) return null;
  const r = await findClimateDatasetData(db, access.project.id, datasetId);
  if (!r) return null;
  return climateInputFromStored(r.id, r.name, r.data as StoredClimateData);
}

/** Store an uploaded weather file for a project (the caller has authorized climate.manage). */
export function importClimateUpload(target: ImportTarget, form: ClimateUploadForm) {
  return importClimateFile(db, target, form);
}
