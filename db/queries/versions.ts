import { sql } from "kysely";
import type { Executor } from "../schema";


/** The draft as it stands, locked for the rest of the transaction so two issues cannot take one number. */
export async function lockScenarioDraft(db: Executor, scenarioId: string) {
  return db
    .selectFrom("scenarios")
    .select([
      "id",
      "project_id as projectId",
      "name",
      "climate_dataset_id as climateDatasetId",
      "input",
      "input_version as inputVersion",
      "revision",
      "archived_at as archivedAt",
    ])
    .where("id", "=", scenarioId)
    .forUpdate()
    .executeTakeFirst();
}

export async function findScenarioHeader(db: Executor, projectId: string, scenarioId: string) {
  return db
    .selectFrom("scenarios")
    .select(["id", "project_id as projectId", "name", "revision", "archived_at as archivedAt", "updated_at as updatedAt"])
    .where("id", "=", scenarioId)
    .where("project_id", "=", projectId)
    .executeTakeFirst();
}

export async function nextVersionNumber(db: Executor, scenarioId: string): Promise<number> {
  const r = await db
    .selectFrom("scenario_versions")
    .select(sql<number>`coalesce(max(version_number), 0) + 1`.as("n"))
    .where("scenario_id", "=", scenarioId)
    .executeTakeFirstOrThrow();
  return Number(r.n);
}

export async function insertVersionRow(
  db: Executor,
  v: {
    scenarioId: string;
    projectId: string;
    versionNumber: number;
    name: string;
    note: string;
    input: unknown;
    inputVersion: number;
    result: unknown;
    engineVersion: string;
    inputsHash: string;
    scenarioRevision: number;
    issuedBy: string;
  },
) {
  return db
    .insertInto("scenario_versions")
    .values({
      scenario_id: v.scenarioId,
      project_id: v.projectId,
      version_number: v.versionNumber,
      name: v.name,
      note: v.note,
      input: JSON.stringify(v.input),
      input_version: v.inputVersion,
      result: JSON.stringify(v.result),
      engine_version: v.engineVersion,
      inputs_hash: v.inputsHash,
      scenario_revision: v.scenarioRevision,
      issued_by: v.issuedBy,
    })
    .returning(["id", "version_number as versionNumber", "issued_at as issuedAt"])
    .executeTakeFirstOrThrow();
}

const summaryColumns = [
  "scenario_versions.id",
  "scenario_versions.scenario_id as scenarioId",
  "scenario_versions.version_number as versionNumber",
  "scenario_versions.name",
  "scenario_versions.note",
  "scenario_versions.engine_version as engineVersion",
  "scenario_versions.scenario_revision as scenarioRevision",
  "scenario_versions.issued_at as issuedAt",
  "issuer.name as issuedByName",
] as const;

/** Issued versions of a project (no inputs or results), newest first. */
export async function listProjectVersions(db: Executor, projectId: string) {
  return db
    .selectFrom("scenario_versions")
    .leftJoin("users as issuer", "issuer.id", "scenario_versions.issued_by")
    .select(summaryColumns)
    .where("scenario_versions.project_id", "=", projectId)
    .orderBy("scenario_versions.issued_at", "desc")
    .orderBy("scenario_versions.version_number", "desc")
    .execute();
}

export async function listScenarioVersions(db: Executor, projectId: string, scenarioId: string) {
  return db
    .selectFrom("scenario_versions")
    .leftJoin("users as issuer", "issuer.id", "scenario_versions.issued_by")
    .select(summaryColumns)
    .where("scenario_versions.project_id", "=", projectId)
    .where("scenario_versions.scenario_id", "=", scenarioId)
    .orderBy("scenario_versions.version_number", "desc")
    .execute();
}

/** One issued version with its frozen input and result; the project and scenario must both match. */
export async function findVersion(db: Executor, projectId: string, scenarioId: string, versionNumber: number) {
  return db
    .selectFrom("scenario_versions")
    .leftJoin("users as issuer", "issuer.id", "scenario_versions.issued_by")
    .select([
      ...summaryColumns,
      "scenario_versions.project_id as projectId",
      "scenario_versions.input",
      "scenario_versions.input_version as inputVersion",
      "scenario_versions.result",
      "scenario_versions.inputs_hash as inputsHash",
    ])
    .where("scenario_versions.project_id", "=", projectId)
    .where("scenario_versions.scenario_id", "=", scenarioId)
    .where("scenario_versions.version_number", "=", versionNumber)
    .executeTakeFirst();
}

/** A version's identity only (for comments), scoped to its project. */
export async function findVersionHeader(db: Executor, projectId: string, versionId: string) {
  return db
    .selectFrom("scenario_versions")
    .select([
      "id",
      "project_id as projectId",
      "scenario_id as scenarioId",
      "version_number as versionNumber",
      "name",
      "issued_by as issuedBy",
    ])
    .where("id", "=", versionId)
    .where("project_id", "=", projectId)
    .executeTakeFirst();
}

/** An issued version with its frozen input and result: the given number, or the latest when `versionNumber` is null. */
export async function findIssuedVersion(db: Executor, scenarioId: string, versionNumber: number | null) {
  let q = db
    .selectFrom("scenario_versions")
    .select([
      "id",
      "scenario_id as scenarioId",
      "project_id as projectId",
      "version_number as versionNumber",
      "name",
      "note",
      "input",
      "input_version as inputVersion",
      "result",
      "engine_version as engineVersion",
      "inputs_hash as inputsHash",
      "scenario_revision as scenarioRevision",
      "issued_at as issuedAt",
      "issued_by as issuedBy",
    ])
    .where("scenario_id", "=", scenarioId);
  q = versionNumber === null ? q.orderBy("version_number", "desc") : q.where("version_number", "=", versionNumber);
  return q.limit(1).executeTakeFirst();
}
