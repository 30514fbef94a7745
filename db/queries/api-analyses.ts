import { sql } from "kysely";
import type { Executor } from "../schema";

/** Store an analysis API request that a worker will run. */
export async function insertApiAnalysis(
  ex: Executor,
  row: { userId: string; draws: number; inputsHash: string; input: unknown },
): Promise<{ id: string; status: string; createdAt: Date }> {
  return ex
    .insertInto("api_analyses")
    .values({ user_id: row.userId, draws: row.draws, inputs_hash: row.inputsHash, input: JSON.stringify(row.input) })
    .returning(["id", "status", "created_at as createdAt"])
    .executeTakeFirstOrThrow();
}

/** One analysis API request of one user (undefined for anyone else's id). */
export async function findApiAnalysisOfUser(ex: Executor, analysisId: string, userId: string) {
  return ex
    .selectFrom("api_analyses")
    .select(["id", "status", "result", "error", "created_at as createdAt", "started_at as startedAt", "finished_at as finishedAt"])
    .where("id", "=", analysisId)
    .where("user_id", "=", userId)
    .executeTakeFirst();
}

/** The row a worker runs (any user's: the worker acts for the queue, not for a viewer). */
export function findApiAnalysisForJob(ex: Executor, analysisId: string) {
  return ex.selectFrom("api_analyses").select(["id", "status", "input"]).where("id", "=", analysisId).executeTakeFirst();
}

/** Mark a request failed with its reason and drop its input, unless it already finished. */
export async function failApiAnalysis(ex: Executor, analysisId: string, error: string): Promise<void> {
  await ex
    .updateTable("api_analyses")
    .set({ status: "failed", error, input: null, finished_at: sql`now()` })
    .where("id", "=", analysisId)
    .where("status", "<>", "done")
    .execute();
}

/** Claim a queued (or retried running) request; false when it is no longer open. */
export async function markApiAnalysisRunning(ex: Executor, analysisId: string): Promise<boolean> {
  const row = await ex
    .updateTable("api_analyses")
    .set({ status: "running", started_at: sql`now()` })
    .where("id", "=", analysisId)
    .where("status", "in", ["queued", "running"])
    .returning("id")
    .executeTakeFirst();
  return row !== undefined;
}

/** Store the answer once (false when another run stored it first) and drop the input. */
export async function storeApiAnalysisResultOnce(ex: Executor, analysisId: string, result: unknown): Promise<boolean> {
  const row = await ex
    .updateTable("api_analyses")
    .set({ status: "done", result: JSON.stringify(result), input: null, error: null, finished_at: sql`now()` })
    .where("id", "=", analysisId)
    .where("status", "<>", "done")
    .returning("id")
    .executeTakeFirst();
  return row !== undefined;
}

/** Delete requests older than the retention; returns how many. */
export async function deleteApiAnalysesOlderThan(ex: Executor, hours: number): Promise<number> {
  const r = await ex
    .deleteFrom("api_analyses")
    .where("created_at", "<", sql<Date>`now() - make_interval(hours => ${hours})`)
    .executeTakeFirst();
  return Number(r.numDeletedRows);
}
