/**
 * The Monte Carlo worker: job rows in scenario_results (kind 'monteCarlo', queued → running → done |
 * failed) processed in the server process after the response, one at a time per process. A 'running'
 * row whose heartbeat is older than STALE_MINUTES (a restarted or crashed server) is queued again.
 */
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { claimNextJob, finishJob, reportJobProgress, requeueStaleJobs, type ResultRow } from "@/db/queries/results";
import { analyzeScenario, ENGINE_VERSION } from "@/lib/engine";
import { monteCarloInput } from "./analysis";
import { inputsHash } from "./hash";
import { buildEngineInput, loadScenarioContext } from "./store";

export const STALE_MINUTES = 5;

const state = globalThis as unknown as { loopledgerJobs?: { running: boolean; again: boolean } };
const flags = (state.loopledgerJobs ??= { running: false, again: false });

/** Start draining the queue unless this process already is; a call during a drain makes it look once more. */
export function kickJobs(db: Kysely<Database>): void {
  if (flags.running) {
    flags.again = true;
    return;
  }
  flags.running = true;
  setImmediate(() => {
    drainJobs(db)
      .catch((err) => console.error("[jobs] drain failed:", err))
      .finally(() => {
        flags.running = false;
        if (flags.again) {
          flags.again = false;
          kickJobs(db);
        }
      });
  });
}

/** Run queued jobs until none is left; returns how many ran. */
export async function drainJobs(db: Kysely<Database>): Promise<number> {
  await requeueStaleJobs(db, STALE_MINUTES);
  let n = 0;
  for (;;) {
    const job = await claimNextJob(db, "monteCarlo");
    if (!job) return n;
    await runMonteCarloJob(db, job);
    n++;
  }
}

/** Run one claimed job: re-derive the input, check it still has the job's key, compute, store. */
export async function runMonteCarloJob(db: Kysely<Database>, job: ResultRow): Promise<void> {
  try {
    const ctx = await loadScenarioContext(db, job.scenarioId);
    if (!ctx) return finishJob(db, job.id, { status: "failed", error: "The scenario no longer exists." });
    const built = buildEngineInput(ctx.dto.document, ctx.dataset, ctx.project);
    if (!built.ok) return finishJob(db, job.id, { status: "failed", error: "The scenario no longer validates; save it again." });
    if (job.engineVersion !== ENGINE_VERSION || inputsHash(built.input) !== job.inputsHash) {
      return finishJob(db, job.id, { status: "failed", error: "The inputs changed after this run was queued; the newer save has its own run." });
    }
    await reportJobProgress(db, job.id, 0.05);
    // Let the heartbeat reach the database before the synchronous run takes the event loop.
    await new Promise((r) => setImmediate(r));
    const result = analyzeScenario(monteCarloInput(built.input));
    const mc = result.economics.monteCarlo;
    if (!mc) return finishJob(db, job.id, { status: "failed", error: "Monte Carlo is switched off for this scenario." });
    await finishJob(db, job.id, { status: "done", result: mc });
  } catch (err) {
    await finishJob(db, job.id, { status: "failed", error: `The run failed: ${(err as Error).message}` });
  }
}
