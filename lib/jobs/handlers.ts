/**
 * What each job does. Every handler is about one row (a result, an API request, an e-mail) and is safe to
 * run twice: it works only on unfinished rows and stores its result only into a row that is not done yet.
 * An analysis that fails by itself (the inputs changed, over budget, an engine error) records the failure
 * and returns (no retry); a database or network error is thrown, so the queue retries the job.
 */
import type { Kysely } from "kysely";
import { deleteApiAnalysesOlderThan, failApiAnalysis, findApiAnalysisForJob, markApiAnalysisRunning, storeApiAnalysisResultOnce } from "@/db/queries/api-analyses";
import { deleteInvitationsExpiredBefore } from "@/db/queries/invitations";
import { deleteStaleSignInAttempts } from "@/db/queries/sign-in-attempts";
import type { Database } from "@/db/schema";
import { failResult, findResultById, markResultRunning, storeResultOnce } from "@/db/queries/results";
import { cancelStaleInvitationMail, clearFinishedMailBodies, markMailAttemptFailed } from "@/db/queries/outbox";
import { ENGINE_VERSION, isBudgetExceeded, timeBudget, type ScenarioResult } from "@/lib/engine";
import { computeDeterministic, computeMonteCarlo, analyzeDocument } from "@/lib/scenarios/analysis";
import { inputsHash } from "@/lib/scenarios/hash";
import { buildEngineInput, loadScenarioContext } from "@/lib/scenarios/store";
import { parseScenarioDocument } from "@/lib/scenarios/validate";
import { deliverOutboxMail, type DeliveryOutcome } from "@/lib/mail/outbox";
import type { MailTransport } from "@/lib/mail/transport";
import { analysisBudgetS } from "./queues";

export type AnalysisOutcome = "stored" | "alreadyDone" | "failed" | "gone";

function budget() {
  return timeBudget(analysisBudgetS() * 1000, () => performance.now());
}

function engineFailure(err: unknown): string {
  if (isBudgetExceeded(err)) return err.message;
  return `The analysis failed: ${err instanceof Error ? err.message : String(err)}`;
}

/** Yield to the event loop so that pending writes (the 'running' mark) leave before a long computation. */
const yieldNow = () => new Promise<void>((r) => setImmediate(r));

/**
 * A saved scenario's result row (deterministic or Monte Carlo): re-derive the engine input from what is
 * stored now, check it still has the row's key (engine version, inputs hash), compute, store once.
 */
export async function runScenarioResultJob(db: Kysely<Database>, resultId: string): Promise<AnalysisOutcome> {
  const row = await findResultById(db, resultId);
  if (!row) return "gone";
  if (row.status === "done") return "alreadyDone";
  if (row.status === "failed") return "failed";
  const ctx = await loadScenarioContext(db, row.scenarioId);
  if (!ctx) {
    await failResult(db, row.id, "The scenario no longer exists.");
    return "failed";
  }
  const built = buildEngineInput(ctx.dto.document, ctx.dataset, ctx.project);
  if (!built.ok) {
    await failResult(db, row.id, "The scenario no longer validates; save it again.");
    return "failed";
  }
  if (row.engineVersion !== ENGINE_VERSION || inputsHash(built.input) !== row.inputsHash) {
    await failResult(db, row.id, "The inputs changed after this run was queued; the newer save has its own run.");
    return "failed";
  }
  if (!(await markResultRunning(db, row.id))) return "alreadyDone";
  await yieldNow();
  let result: unknown;
  try {
    if (row.kind === "full") {
      const r: ScenarioResult = { ...computeDeterministic(built.input, budget()), inputsHash: row.inputsHash };
      result = r;
    } else {
      const mc = built.input.monteCarlo;
      result = mc ? computeMonteCarlo(built.input, { draws: mc.draws, seed: mc.seed }, budget()) : null;
      if (!result) {
        await failResult(db, row.id, "Monte Carlo is switched off for this scenario, or it has fewer than two options.");
        return "failed";
      }
    }
  } catch (err) {
    await failResult(db, row.id, engineFailure(err));
    return "failed";
  }
  return (await storeResultOnce(db, row.id, result)) ? "stored" : "alreadyDone";
}

/** A queued analysis API request: validate the stored document again, compute, store once, drop the input. */
export async function runApiAnalysisJob(db: Kysely<Database>, analysisId: string): Promise<AnalysisOutcome> {
  const row = await findApiAnalysisForJob(db, analysisId);
  if (!row) return "gone";
  if (row.status === "done") return "alreadyDone";
  if (row.status === "failed") return "failed";
  const fail = async (error: string) => {
    await failApiAnalysis(db, analysisId, error);
    return "failed" as const;
  };
  const parsed = parseScenarioDocument(row.input);
  if (!parsed.ok) return fail("The stored request no longer validates.");
  if (!(await markApiAnalysisRunning(db, analysisId))) return "alreadyDone";
  await yieldNow();
  let out;
  try {
    out = analyzeDocument(parsed.value, budget());
  } catch (err) {
    return fail(engineFailure(err));
  }
  return (await storeApiAnalysisResultOnce(db, analysisId, out)) ? "stored" : "alreadyDone";
}

/** One outbox message; the attempt numbers come from the job (pg-boss counts the retries). */
export function runMailJob(
  db: Kysely<Database>,
  transport: MailTransport,
  outboxId: string,
  attempt: { retryCount: number; retryLimit: number; retryDelayS: number },
): Promise<DeliveryOutcome> {
  return deliverOutboxMail(db, transport, outboxId, attempt);
}

/**
 * A job that failed every retry (its worker kept dying, the database kept failing) lands here: the row it
 * was about is marked failed with the reason, so nobody waits for it forever.
 */
export async function recordDeadJob(db: Kysely<Database>, data: unknown): Promise<void> {
  const d = (data ?? {}) as { kind?: string; resultId?: string; analysisId?: string; outboxId?: string };
  const reason = "The background run failed several times (its worker stopped or lost the database); start it again.";
  if (d.kind === "scenarioResult" && d.resultId) await failResult(db, d.resultId, reason);
  else if (d.kind === "apiAnalysis" && d.analysisId) {
    await failApiAnalysis(db, d.analysisId, reason);
  } else if (d.kind === "mail" && d.outboxId) {
    await cancelStaleInvitationMail(db, d.outboxId);
    await markMailAttemptFailed(db, d.outboxId, "Delivery failed on every attempt.", null);
  }
}

export interface CleanupReport {
  invitations: number;
  signInRows: number;
  apiAnalyses: number;
  mailBodies: number;
}

/** How long expired artefacts are kept before the cleanup removes them. */
export const RETENTION = {
  /** Invitations that expired unused (their token hash is the only secret they hold). */
  expiredInvitationDays: 30,
  /** The analysis API's results (the requester polls them within minutes). */
  apiAnalysisHours: 24,
} as const;

/**
 * Periodic cleanup: invitations that expired unused more than 30 days ago (with their token hashes; the
 * audit trail keeps the record), sign-in throttle rows whose window and block have both passed, analysis
 * API results older than a day, and any message body left on a message that is no longer pending.
 */
export async function runCleanup(db: Kysely<Database>): Promise<CleanupReport> {
  return {
    invitations: await deleteInvitationsExpiredBefore(db, RETENTION.expiredInvitationDays),
    signInRows: await deleteStaleSignInAttempts(db),
    apiAnalyses: await deleteApiAnalysesOlderThan(db, RETENTION.apiAnalysisHours),
    mailBodies: await clearFinishedMailBodies(db),
  };
}
