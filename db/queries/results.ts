import { sql } from "kysely";
import type { ResultStatus, Executor } from "../schema";

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
  "heartbeat_at as heartbeatAt",
  "finished_at as finishedAt",
  "attempts",
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

/**
 * Queue a job for this key. An existing queued/running/done row is left as it is (the work is under
 * way or done); a failed one is queued again. Returns the row as it stands after the call.
 */
export async function enqueueJob(db: Executor, j: { scenarioId: string; engineVersion: string; inputsHash: string; kind: ResultKind }) {
  await db
    .insertInto("scenario_results")
    .values({ scenario_id: j.scenarioId, engine_version: j.engineVersion, inputs_hash: j.inputsHash, kind: j.kind, status: "queued" })
    .onConflict((oc) =>
      oc
        .constraint("scenario_results_key")
        .doUpdateSet({ status: "queued", progress: 0, error: null, result: null, finished_at: null, started_at: null, heartbeat_at: null })
        .where("scenario_results.status", "=", "failed"),
    )
    .execute();
  return findResult(db, j.scenarioId, j.engineVersion, j.inputsHash, j.kind);
}

/** Claim the oldest queued job (SKIP LOCKED: two workers never take the same row). */
export async function claimNextJob(db: Executor, kind: ResultKind) {
  const row = await sql<{ id: string }>`
    update scenario_results set status = 'running', started_at = now(), heartbeat_at = now(), attempts = attempts + 1, progress = 0
    where id = (
      select id from scenario_results where status = 'queued' and kind = ${kind}
      order by created_at for update skip locked limit 1
    )
    returning id`.execute(db);
  const id = row.rows[0]?.id;
  if (!id) return undefined;
  return db.selectFrom("scenario_results").select(resultColumns).where("id", "=", id).executeTakeFirst();
}

export async function reportJobProgress(db: Executor, id: string, progress: number) {
  await db
    .updateTable("scenario_results")
    .set({ progress: Math.max(0, Math.min(1, progress)), heartbeat_at: sql`now()` })
    .where("id", "=", id)
    .where("status", "=", "running")
    .execute();
}

export async function finishJob(db: Executor, id: string, outcome: { status: Extract<ResultStatus, "done" | "failed">; result?: unknown; error?: string }) {
  await db
    .updateTable("scenario_results")
    .set({
      status: outcome.status,
      progress: outcome.status === "done" ? 1 : sql`progress`,
      result: outcome.result === undefined ? null : JSON.stringify(outcome.result),
      error: outcome.error ?? null,
      finished_at: sql`now()`,
    })
    .where("id", "=", id)
    .execute();
}

/**
 * Re-queue 'running' rows whose worker stopped reporting (a restarted server, a crash) for longer than
 * `staleMinutes`; after `maxAttempts` tries such a row is marked failed instead. Returns how many were re-queued.
 */
export async function requeueStaleJobs(db: Executor, staleMinutes: number, maxAttempts = 3) {
  await db
    .updateTable("scenario_results")
    .set({ status: "failed", error: "The run stopped responding several times; start it again.", finished_at: sql`now()` })
    .where("status", "=", "running")
    .where(sql<boolean>`coalesce(heartbeat_at, started_at, created_at) < now() - make_interval(mins => ${staleMinutes})`)
    .where("attempts", ">=", maxAttempts)
    .execute();
  const r = await db
    .updateTable("scenario_results")
    .set({ status: "queued", progress: 0, started_at: null, heartbeat_at: null })
    .where("status", "=", "running")
    .where(sql<boolean>`coalesce(heartbeat_at, started_at, created_at) < now() - make_interval(mins => ${staleMinutes})`)
    .executeTakeFirst();
  return Number(r.numUpdatedRows);
}
