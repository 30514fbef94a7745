/**
 * Server-side analysis of stored scenarios: the deterministic part (physics, LCC, measures, tornado,
 * break-evens) is stored in scenario_results under (engine version, inputs hash, 'full'); a stored row
 * with the same key is reused. What takes long runs in a worker process (lib/jobs, scripts/worker.ts):
 * the deterministic part of an hourly year and every Monte Carlo.
 */
import type { Transaction } from "kysely";
import type { Database, Executor, ResultStatus } from "@/db/schema";
import { inTransaction } from "@/db/transaction";
import { findResult, findResultById, queueResultRow, supersedeQueuedResults, upsertDoneResult, type ResultRow } from "@/db/queries/results";
import { analyzeScenario, ENGINE_VERSION, UNLIMITED_BUDGET, type AnalysisBudget, type ScenarioResult } from "@/lib/engine";
import { sendJob } from "@/lib/jobs/boss";
import { fitsLimits, lockAndCountOpenWork } from "@/lib/jobs/limits";
import { QUEUES } from "@/lib/jobs/queues";
import type { MonteCarloResult } from "@/lib/engine/economics/types";
import type { ScenarioInput } from "@/lib/engine/input";
import { inputsHash } from "./hash";

/** The input with Monte Carlo switched off: what runs while the person waits. */
export function deterministicInput(input: ScenarioInput): ScenarioInput {
  return input.monteCarlo ? { ...input, monteCarlo: { ...input.monteCarlo, enabled: false } } : input;
}

/** The input for the Monte Carlo job: the tornado and break-evens are already in the stored result. */
export function monteCarloInput(input: ScenarioInput): ScenarioInput {
  return { ...input, ...(input.sensitivity ? { sensitivity: { ...input.sensitivity, enabled: false } } : {}) };
}

export function wantsMonteCarlo(input: ScenarioInput): boolean {
  // Without every option's first cost there is no life-cycle cost to draw a distribution of.
  return Boolean(input.monteCarlo?.enabled) && input.options.length > 1 && input.options.every((o) => o.costs.firstCost !== undefined);
}

/** Analyse the deterministic part and time it. */
export function runDeterministic(input: ScenarioInput): { result: ScenarioResult; elapsedMs: number } {
  const t0 = performance.now();
  const result = analyzeScenario(deterministicInput(input));
  return { result, elapsedMs: performance.now() - t0 };
}

export interface StoredAnalysis {
  engineVersion: string;
  inputsHash: string;
  /** Null while the deterministic result is queued or running in a worker (see `full`). */
  result: ScenarioResult | null;
  full: ResultState | null;
  /** True when a stored row with the same engine version and inputs hash was reused. */
  reused: boolean;
  elapsedMs: number;
  monteCarlo: MonteCarloStatus | null;
}

export interface MonteCarloStatus {
  id: string;
  status: "queued" | "running" | "done" | "failed";
  progress: number;
  result: MonteCarloResult | null;
  error: string | null;
}

export function monteCarloStatusOf(row: ResultRow | undefined): MonteCarloStatus | null {
  if (!row) return null;
  return {
    id: row.id,
    status: row.status,
    progress: row.progress,
    result: (row.status === "done" ? (row.result as MonteCarloResult | null) : null) ?? null,
    error: row.error,
  };
}

/** The state of a stored result row (what a page needs while it waits). */
export interface ResultState {
  id: string;
  status: ResultStatus;
  progress: number;
  error: string | null;
}

function stateOf(row: ResultRow): ResultState {
  return { id: row.id, status: row.status, progress: row.progress, error: row.error };
}

/**
 * Climate records (bins or hours) up to which an analysis is quick enough to run where it is asked for
 * (at most ~0.2 s on one core for four options with the tornado): bin tables. An hourly year goes to a
 * worker. The same size rule decides whether the analysis API answers at once or with 202.
 */
export const QUICK_ANALYSIS_MAX_RECORDS = 400;

export function climateRecordsOf(input: ScenarioInput): number {
  const c = input.climate;
  return c.source === "hourly" ? c.dryBulbC.length : c.bins.length;
}

/** True when the deterministic part of this input may run in the web process (see QUICK_ANALYSIS_MAX_RECORDS). */
export function isQuickAnalysis(input: ScenarioInput): boolean {
  return climateRecordsOf(input) <= QUICK_ANALYSIS_MAX_RECORDS;
}

/** Monte Carlo draws this input asks for (0 when it wants none). */
export function monteCarloDraws(input: ScenarioInput): number {
  return wantsMonteCarlo(input) ? (input.monteCarlo?.draws ?? 0) : 0;
}

/** The deterministic result of an input within a time budget (what the analysis job runs). */
export function computeDeterministic(input: ScenarioInput, budget: AnalysisBudget = UNLIMITED_BUDGET): ScenarioResult {
  return analyzeScenario(deterministicInput(input), undefined, budget);
}

/**
 * The Monte Carlo of an input: a function of the scenario input, the number of draws and the seed only
 * (what the Monte Carlo job runs; the same three give the same result). Null when the input has fewer
 * than two options or no distributions to draw from.
 */
export function computeMonteCarlo(
  input: ScenarioInput,
  run: { draws: number; seed: number },
  budget: AnalysisBudget = UNLIMITED_BUDGET,
  onProgress?: (fraction: number) => void,
): MonteCarloResult | null {
  if (!input.monteCarlo) return null;
  const mcInput: ScenarioInput = { ...monteCarloInput(input), monteCarlo: { ...input.monteCarlo, enabled: true, draws: run.draws, seed: run.seed } };
  return analyzeScenario(mcInput, onProgress, budget).economics.monteCarlo ?? null;
}

/**
 * The stored deterministic result of this input and its Monte Carlo, queueing what is missing.
 * The deterministic part runs here when it is quick (a bin table, or `inline` — the seed and test
 * fixtures), else it is queued for a worker; the Monte Carlo is always queued, within the requester's
 * limits (lib/jobs/limits.ts; a run over the limit is recorded as failed with the reason). Rows and
 * jobs are written in one transaction (the caller's, when it passes one: a save commits them with the
 * scenario). Queued rows of older inputs of the same scenario are superseded.
 */
export async function analyzeAndStore(
  db: Executor,
  scenarioId: string,
  input: ScenarioInput,
  opts: { requestedBy?: string | null; inline?: boolean } = {},
): Promise<StoredAnalysis> {
  return inTransaction(db, (trx) => analyzeIn(trx, scenarioId, input, opts));
}

async function analyzeIn(
  trx: Transaction<Database>,
  scenarioId: string,
  input: ScenarioInput,
  opts: { requestedBy?: string | null; inline?: boolean },
): Promise<StoredAnalysis> {
  const requestedBy = opts.requestedBy ?? null;
  const hash = inputsHash(input);
  await supersedeQueuedResults(trx, scenarioId, hash);
  const existing = await findResult(trx, scenarioId, ENGINE_VERSION, hash, "full");
  let result: ScenarioResult | null = null;
  let full: ResultState | null = null;
  let reused = false;
  let elapsedMs = 0;
  if (existing && existing.status === "done" && existing.result) {
    result = existing.result as ScenarioResult;
    full = stateOf(existing);
    reused = true;
  } else if (opts.inline || isQuickAnalysis(input)) {
    const run = runDeterministic(input);
    result = { ...run.result, inputsHash: hash };
    elapsedMs = run.elapsedMs;
    const stored = await upsertDoneResult(trx, { scenarioId, engineVersion: ENGINE_VERSION, inputsHash: hash, kind: "full", result });
    full = { id: stored.id, status: "done", progress: 1, error: null };
  } else {
    const q = await queueResultRow(trx, { scenarioId, engineVersion: ENGINE_VERSION, inputsHash: hash, kind: "full", requestedBy, draws: 0 });
    if (q.queuedNow) await sendJob(trx, QUEUES.scenarioAnalysis, { kind: "scenarioResult", resultId: q.row.id }, { singletonKey: q.row.id });
    full = stateOf(q.row);
  }

  let monteCarlo: MonteCarloStatus | null = null;
  const draws = monteCarloDraws(input);
  if (draws > 0) {
    const key = { scenarioId, engineVersion: ENGINE_VERSION, inputsHash: hash, kind: "monteCarlo" as const, requestedBy, draws };
    const mc = await findResult(trx, scenarioId, ENGINE_VERSION, hash, "monteCarlo");
    if (mc && mc.status !== "failed") {
      monteCarlo = monteCarloStatusOf(mc);
    } else {
      const room = requestedBy ? fitsLimits(await lockAndCountOpenWork(trx, requestedBy), draws) : ({ ok: true } as const);
      const q = await queueResultRow(trx, room.ok ? key : { ...key, status: "failed", error: `Not run: ${room.message}` });
      if (q.queuedNow) await sendJob(trx, QUEUES.monteCarlo, { kind: "scenarioResult", resultId: q.row.id }, { singletonKey: q.row.id });
      monteCarlo = monteCarloStatusOf(q.row);
    }
  }
  return { engineVersion: ENGINE_VERSION, inputsHash: hash, result, full, reused, elapsedMs, monteCarlo };
}

/**
 * Wait (without computing: the web process only reads) until a queued row is finished or `timeoutMs`
 * has passed; returns the row as it then stands.
 */
export async function awaitResult(db: Executor, id: string, timeoutMs: number, pollMs = 200): Promise<ResultRow | undefined> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const row = await findResultById(db, id);
    if (!row || row.status === "done" || row.status === "failed" || Date.now() + pollMs > until) return row;
    await new Promise((r) => setTimeout(r, pollMs));
  }
}

/** What is stored for this exact input (nothing is computed). */
export async function storedFor(db: Executor, scenarioId: string, input: ScenarioInput) {
  const hash = inputsHash(input);
  const [full, mc] = await Promise.all([
    findResult(db, scenarioId, ENGINE_VERSION, hash, "full"),
    findResult(db, scenarioId, ENGINE_VERSION, hash, "monteCarlo"),
  ]);
  return {
    inputsHash: hash,
    engineVersion: ENGINE_VERSION,
    result: full?.status === "done" ? ((full.result as ScenarioResult | null) ?? null) : null,
    monteCarlo: monteCarloStatusOf(mc),
  };
}

/** The Monte Carlo job of a scenario's inputs (by their hash), without reading the deterministic result. */
export async function storedMonteCarloFor(db: Executor, scenarioId: string, hash: string) {
  return monteCarloStatusOf(await findResult(db, scenarioId, ENGINE_VERSION, hash, "monteCarlo"));
}

/**
 * The complete result of a stateless analysis (the public API): deterministic part and, when enabled,
 * Monte Carlo, within `budget`.
 */
export function analyzeDocument(
  input: ScenarioInput,
  budget: AnalysisBudget = UNLIMITED_BUDGET,
): { engineVersion: string; inputsHash: string; result: ScenarioResult; monteCarlo: MonteCarloResult | null; elapsedMs: number } {
  const hash = inputsHash(input);
  const t0 = performance.now();
  const det = computeDeterministic(input, budget);
  const draws = monteCarloDraws(input);
  const mc = draws > 0 ? computeMonteCarlo(input, { draws, seed: input.monteCarlo?.seed ?? 1 }, budget) : null;
  return { engineVersion: ENGINE_VERSION, inputsHash: hash, result: { ...det, inputsHash: hash }, monteCarlo: mc, elapsedMs: performance.now() - t0 };
}
