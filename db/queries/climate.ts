import { sql, type Insertable } from "kysely";
import type { ClimateDatasetsTable, Executor } from "../schema";


export type NewClimateDatasetRow = Insertable<ClimateDatasetsTable>;

const listColumns = [
  "climate_datasets.id",
  "climate_datasets.project_id as projectId",
  "climate_datasets.name",
  "climate_datasets.source_kind as sourceKind",
  "climate_datasets.file_name as fileName",
  "climate_datasets.record_count as recordCount",
  "climate_datasets.missing_count as missingCount",
  "climate_datasets.hours_total as hoursTotal",
  "climate_datasets.created_at as createdAt",
  "users.name as createdByName",
] as const;

export async function insertClimateDataset(db: Executor, row: NewClimateDatasetRow) {
  return db.insertInto("climate_datasets").values(row).returning(["id"]).executeTakeFirstOrThrow();
}

/** A project's datasets, newest first, without the hourly arrays; the design 0.4 % wet-bulb read from the summary. */
export async function listClimateDatasetsOfProject(db: Executor, projectId: string) {
  return db
    .selectFrom("climate_datasets")
    .leftJoin("users", "users.id", "climate_datasets.created_by")
    .select(listColumns)
    .select(sql<unknown>`climate_datasets.summary -> 'designWetBulbC'`.as("designWetBulbC"))
    .where("climate_datasets.project_id", "=", projectId)
    .orderBy("climate_datasets.created_at", "desc")
    .orderBy("climate_datasets.id", "desc")
    .execute();
}

/** One dataset of a project (never another project's, even with a valid id) with summary and provenance, no arrays. */
export async function findClimateDatasetSummary(db: Executor, projectId: string, datasetId: string) {
  return db
    .selectFrom("climate_datasets")
    .leftJoin("users", "users.id", "climate_datasets.created_by")
    .select(listColumns)
    .select(["climate_datasets.summary", "climate_datasets.provenance"])
    .where("climate_datasets.project_id", "=", projectId)
    .where("climate_datasets.id", "=", datasetId)
    .executeTakeFirst();
}

/** The stored data (hourly arrays or bins) of one dataset of a project. */
export async function findClimateDatasetData(db: Executor, projectId: string, datasetId: string) {
  return db
    .selectFrom("climate_datasets")
    .select(["id", "name", "source_kind as sourceKind", "data"])
    .where("project_id", "=", projectId)
    .where("id", "=", datasetId)
    .executeTakeFirst();
}

export async function countClimateDatasets(db: Executor, projectId: string): Promise<number> {
  const r = await db
    .selectFrom("climate_datasets")
    .select((eb) => eb.fn.countAll<number>().as("n"))
    .where("project_id", "=", projectId)
    .executeTakeFirstOrThrow();
  return Number(r.n);
}

/** A dataset of this project only (never another project's), with its stored data or without it. */
export function findProjectClimateDataset(ex: Executor, projectId: string, datasetId: string, withData: boolean) {
  return ex
    .selectFrom("climate_datasets")
    .select(["id", "name", "source_kind", "project_id as projectId"])
    .$if(withData, (q) => q.select("data"))
    .where("id", "=", datasetId)
    .where("project_id", "=", projectId)
    .executeTakeFirst();
}

/** The datasets a scenario may use (one project's), newest first: id, name, kind and size only. */
export function listClimateDatasetChoices(db: Executor, projectId: string) {
  return db
    .selectFrom("climate_datasets")
    .select(["id", "name", "source_kind as sourceKind", "hours_total as hoursTotal", "record_count as recordCount", "created_at as createdAt"])
    .where("project_id", "=", projectId)
    .orderBy("created_at", "desc")
    .execute();
}
