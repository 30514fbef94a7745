import type { Executor } from "../schema";


/** The scenario's project (for authorization) and what a draft report needs; undefined when no such scenario. */
export async function findReportScenario(db: Executor, scenarioId: string) {
  return db
    .selectFrom("scenarios")
    .select([
      "scenarios.id",
      "scenarios.project_id as projectId",
      "scenarios.name",
      "scenarios.input",
      "scenarios.updated_at as updatedAt",
      "scenarios.archived_at as archivedAt",
      "scenarios.created_by as createdBy",
      "scenarios.updated_by as updatedBy",
    ])
    .where("scenarios.id", "=", scenarioId)
    .executeTakeFirst();
}

/** The latest finished full analysis of the scenario, preferring the current engine version. */
export async function findLatestDoneResult(db: Executor, scenarioId: string, engineVersion: string) {
  return db
    .selectFrom("scenario_results")
    .select([
      "id",
      "result",
      "engine_version as engineVersion",
      "inputs_hash as inputsHash",
      "finished_at as finishedAt",
      "created_at as createdAt",
    ])
    .where("scenario_id", "=", scenarioId)
    .where("kind", "=", "full")
    .where("status", "=", "done")
    .where("result", "is not", null)
    .orderBy((eb) => eb.case().when("engine_version", "=", engineVersion).then(0).else(1).end())
    .orderBy("finished_at", "desc")
    .orderBy("created_at", "desc")
    .limit(1)
    .executeTakeFirst();
}

/** A finished Monte Carlo run stored apart from the full result (same engine version and inputs). */
export async function findMonteCarloResult(
  db: Executor,
  scenarioId: string,
  engineVersion: string,
  inputsHash: string,
) {
  return db
    .selectFrom("scenario_results")
    .select(["result"])
    .where("scenario_id", "=", scenarioId)
    .where("kind", "=", "monteCarlo")
    .where("status", "=", "done")
    .where("engine_version", "=", engineVersion)
    .where("inputs_hash", "=", inputsHash)
    .orderBy("finished_at", "desc")
    .limit(1)
    .executeTakeFirst();
}

/** The name of a member of the firm (the consultant who prepared the work), if that user still belongs to it. */
export async function findFirmMemberName(db: Executor, userId: string, firmId: string) {
  const row = await db
    .selectFrom("firm_members")
    .innerJoin("users", "users.id", "firm_members.user_id")
    .select(["users.name"])
    .where("firm_members.user_id", "=", userId)
    .where("firm_members.firm_id", "=", firmId)
    .executeTakeFirst();
  return row?.name ?? null;
}
