import { sql } from "kysely";
import type { Executor } from "../schema";

export type ResultKind = "full" | "monteCarlo";

const resultColumns = [
  "id",
  "scenario_id as scenarioId",
  "engine_version as engineVersion",
  "inputs_hash as inputsHash",
  "kind",
  "status",
  "progress",
  "result",
  "error",
  "created_at as createdAt",
  "started_at as startedAt",
  "finished_at as finishedAt",
  "requested_by as requestedBy",
  "draws",
] as const;

export type ResultRow = NonNullable<Awaited<ReturnType<typeof findResult>>>;

export async function findResult(db: Executor, scenarioId: string, engineVersion: string, inputsHash: string, kind: ResultKind) {
  return db
    .selectFrom("scenario_results")
    .select(resultColumns)
    .where("scenario_id", "=", scenarioId)
    .where("engine_version", "=", engineVersion)
    .where("inputs_hash", "=", inputsHash)
    .where("kind", "=", kind)
    .executeTakeFirst();
}

/** The newest row of a kind for a scenario, whatever its key (for the project list's headline). */
export async function latestResultsOfKind(db: Executor, scenarioIds: string[], kind: ResultKind) {
  if (scenarioIds.length === 0) return [];
  return db
    .selectFrom("scenario_results")
    .select(resultColumns)
    .distinctOn("scenario_id")
    .where("scenario_id", "in", scenarioIds)
    .where("kind", "=", kind)
    .where("status", "=", "done")
    .orderBy("scenario_id")
    .orderBy("finished_at", "desc")
    .execute();
}

/** Store a finished result under its key (a recompute of the same key replaces the old row). */
export async function upsertDoneResult(
  db: Executor,
  r: { scenarioId: string; engineVersion: string; inputsHash: string; kind: ResultKind; result: unknown },
) {
  return db
    .insertInto("scenario_results")
    .values({
      scenario_id: r.scenarioId,
      engine_version: r.engineVersion,
      inputs_hash: r.inputsHash,
      kind: r.kind,
      status: "done",
      progress: 1,
      result: JSON.stringify(r.result),
      finished_at: sql`now()`,
    })
    .onConflict((oc) =>
      oc.constraint("scenario_results_key").doUpdateSet({
        status: "done",
        progress: 1,
        result: JSON.stringify(r.result),
        error: null,
        finished_at: sql`now()`,
      }),
    )
    .returning(["id"])
    .executeTakeFirstOrThrow();
}

export async function findResultById(db: Executor, id: string) {
  return db.selectFrom("scenario_results").select(resultColumns).where("id", "=", id).executeTakeFirst();
}

/**
 * A queued row for this key. A failed row is queued again; a queued, running or done row is left as it
 * is. `queuedNow` says whether this call queued it (and so must send its job, in the same transaction).
 */
export async function queueResultRow(
  db: Executor,
  j: { scenarioId: string; engineVersion: string; inputsHash: string; kind: ResultKind; requestedBy: string | null; draws: number; status?: "queued" | "failed"; error?: string },
): Promise<{ row: ResultRow; queuedNow: boolean }> {
  const status = j.status ?? "queued";
  const queued = await db
    .insertInto("scenario_results")
    .values({
      scenario_id: j.scenarioId,
      engine_version: j.engineVersion,
      inputs_hash: j.inputsHash,
      kind: j.kind,
      status,
      requested_by: j.requestedBy,
      draws: j.draws,
      error: j.error ?? null,
      finished_at: status === "failed" ? sql`now()` : null,
    })
    .onConflict((oc) =>
      oc
        .constraint("scenario_results_key")
        .doUpdateSet({ status, progress: 0, error: j.error ?? null, result: null, finished_at: status === "failed" ? sql`now()` : null, started_at: null, requested_by: j.requestedBy, draws: j.draws })
        .where("scenario_results.status", "=", "failed"),
    )
    .returning("id")
    .executeTakeFirst();
  const row = await findResult(db, j.scenarioId, j.engineVersion, j.inputsHash, j.kind);
  if (!row) throw new Error("scenario_results: the queued row vanished");
  return { row, queuedNow: Boolean(queued) && status === "queued" };
}

/**
 * Queued rows of a scenario computed from inputs that a newer save replaced: nobody will look at them,
 * so they are not run (a running one finishes; its hash check happens before it starts computing).
 */
export async function supersedeQueuedResults(db: Executor, scenarioId: string, keepInputsHash: string) {
  await db
    .updateTable("scenario_results")
    .set({ status: "failed", error: "Superseded by a newer save before it ran.", finished_at: sql`now()` })
    .where("scenario_id", "=", scenarioId)
    .where("status", "=", "queued")
    .where("inputs_hash", "<>", keepInputsHash)
    .execute();
}

/** A worker starts on the row (unless it is finished already): returns false when there is nothing to do. */
export async function markResultRunning(db: Executor, id: string): Promise<boolean> {
  const r = await db
    .updateTable("scenario_results")
    .set({ status: "running", started_at: sql`now()`, progress: 0.02 })
    .where("id", "=", id)
    .where("status", "in", ["queued", "running"])
    .returning("id")
    .executeTakeFirst();
  return Boolean(r);
}

export async function setResultProgress(db: Executor, id: string, progress: number) {
  await db
    .updateTable("scenario_results")
    .set({ progress: Math.max(0, Math.min(1, progress)) })
    .where("id", "=", id)
    .where("status", "=", "running")
    .execute();
}

/**
 * Store a finished result once: only a row that is not done yet is written, so a job that ran twice (a
 * worker killed after computing, a retry racing a slow first try) leaves exactly one stored result.
 * Returns whether this call stored it.
 */
export async function storeResultOnce(db: Executor, id: string, result: unknown): Promise<boolean> {
  const r = await db
    .updateTable("scenario_results")
    .set({ status: "done", progress: 1, result: JSON.stringify(result), error: null, finished_at: sql`now()` })
    .where("id", "=", id)
    .where("status", "<>", "done")
    .returning("id")
    .executeTakeFirst();
  return Boolean(r);
}

export async function failResult(db: Executor, id: string, error: string) {
  await db
    .updateTable("scenario_results")
    .set({ status: "failed", error: error.slice(0, 1000), finished_at: sql`now()` })
    .where("id", "=", id)
    .where("status", "<>", "done")
    .execute();
}

/** Rows waiting for a worker (queued or running), oldest first: re-submitted when a worker starts. */
export async function openResultRows(db: Executor, limit = 500) {
  return db
    .selectFrom("scenario_results")
    .select(["id", "kind", "created_at as createdAt"])
    .where("status", "in", ["queued", "running"])
    .orderBy("created_at")
    .limit(limit)
    .execute();
}
