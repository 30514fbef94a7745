import { sql } from "kysely";
import type { Executor } from "../schema";


const scenarioColumns = [
  "scenarios.id",
  "scenarios.project_id as projectId",
  "scenarios.name",
  "scenarios.climate_dataset_id as climateDatasetId",
  "scenarios.input",
  "scenarios.input_version as inputVersion",
  "scenarios.revision",
  "scenarios.created_by as createdBy",
  "scenarios.updated_by as updatedBy",
  "scenarios.created_at as createdAt",
  "scenarios.updated_at as updatedAt",
  "scenarios.archived_at as archivedAt",
] as const;

export type ScenarioRow = NonNullable<Awaited<ReturnType<typeof findScenario>>>;

export async function findScenario(db: Executor, scenarioId: string) {
  return db.selectFrom("scenarios").select(scenarioColumns).where("scenarios.id", "=", scenarioId).executeTakeFirst();
}

/** Scenarios of a project (without their input documents), newest first. */
export async function listScenarioSummaries(db: Executor, projectId: string, opts: { includeArchived?: boolean } = {}) {
  let q = db
    .selectFrom("scenarios")
    .leftJoin("users", "users.id", "scenarios.updated_by")
    .leftJoin("climate_datasets", "climate_datasets.id", "scenarios.climate_dataset_id")
    .select([
      "scenarios.id",
      "scenarios.name",
      "scenarios.revision",
      "scenarios.updated_at as updatedAt",
      "scenarios.archived_at as archivedAt",
      "scenarios.climate_dataset_id as climateDatasetId",
      "climate_datasets.name as climateName",
      "users.name as updatedByName",
    ])
    .where("scenarios.project_id", "=", projectId);
  if (!opts.includeArchived) q = q.where("scenarios.archived_at", "is", null);
  return q.orderBy("scenarios.updated_at", "desc").orderBy("scenarios.id").execute();
}

export async function insertScenario(
  db: Executor,
  s: { projectId: string; name: string; climateDatasetId: string | null; input: unknown; inputVersion: number; userId: string | null },
) {
  return db
    .insertInto("scenarios")
    .values({
      project_id: s.projectId,
      name: s.name,
      climate_dataset_id: s.climateDatasetId,
      input: JSON.stringify(s.input),
      input_version: s.inputVersion,
      created_by: s.userId,
      updated_by: s.userId,
    })
    .returning(["id", "revision"])
    .executeTakeFirstOrThrow();
}

/**
 * Optimistic concurrency: the update applies only when the stored revision is still the one the editor
 * loaded, and bumps it. Returns the new revision, or undefined when someone saved in between (nothing
 * is written then).
 */
export async function updateScenarioAtRevision(
  db: Executor,
  scenarioId: string,
  expectedRevision: number,
  s: { name: string; climateDatasetId: string | null; input: unknown; inputVersion: number; userId: string | null },
) {
  return db
    .updateTable("scenarios")
    .set({
      name: s.name,
      climate_dataset_id: s.climateDatasetId,
      input: JSON.stringify(s.input),
      input_version: s.inputVersion,
      updated_by: s.userId,
      updated_at: sql`now()`,
      revision: sql`revision + 1`,
    })
    .where("id", "=", scenarioId)
    .where("revision", "=", expectedRevision)
    .where("archived_at", "is", null)
    .returning(["revision", "updated_at as updatedAt"])
    .executeTakeFirst();
}

export async function setScenarioArchived(db: Executor, scenarioId: string, archived: boolean, userId: string | null) {
  return db
    .updateTable("scenarios")
    .set({ archived_at: archived ? sql`now()` : null, updated_by: userId, updated_at: sql`now()`, revision: sql`revision + 1` })
    .where("id", "=", scenarioId)
    .returning(["revision"])
    .executeTakeFirst();
}

/** Who saved a scenario last, when, and at which revision (for a refused stale save). */
export function findScenarioLastSave(ex: Executor, scenarioId: string) {
  return ex
    .selectFrom("scenarios")
    .leftJoin("users", "users.id", "scenarios.updated_by")
    .select(["scenarios.revision", "scenarios.updated_at as updatedAt", "users.name as updatedByName"])
    .where("scenarios.id", "=", scenarioId)
    .executeTakeFirst();
}
