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
