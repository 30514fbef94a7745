/**
 * Server-side analysis of stored scenarios: the deterministic part (physics, LCC, measures, tornado,
 * break-evens) runs on save and is stored in scenario_results under (engine version, inputs hash, 'full');
 * a stored row with the same key is reused. Monte Carlo is queued as a 'monteCarlo' job (lib/scenarios/jobs.ts).
 */
import type { Executor } from "@/db/schema";
import { enqueueJob, findResult, upsertDoneResult, type ResultRow } from "@/db/queries/results";
import { analyzeScenario, ENGINE_VERSION, type ScenarioResult } from "@/lib/engine";
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
  return Boolean(input.monteCarlo?.enabled) && input.options.length > 1;
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
  result: ScenarioResult;
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

/**
 * The stored deterministic result of this input, computing and storing it when the key (engine version,
 * inputs hash) has none; and the Monte Carlo job for the same key, queued when missing.
 */
export async function analyzeAndStore(db: Executor, scenarioId: string, input: ScenarioInput): Promise<StoredAnalysis> {
  const hash = inputsHash(input);
  const existing = await findResult(db, scenarioId, ENGINE_VERSION, hash, "full");
  let result: ScenarioResult;
  let reused = false;
  let elapsedMs = 0;
  if (existing && existing.status === "done" && existing.result) {
    result = existing.result as ScenarioResult;
    reused = true;
  } else {
    const run = runDeterministic(input);
    result = { ...run.result, inputsHash: hash };
    elapsedMs = run.elapsedMs;
    await upsertDoneResult(db, { scenarioId, engineVersion: ENGINE_VERSION, inputsHash: hash, kind: "full", result });
  }
  let monteCarlo: MonteCarloStatus | null = null;
  if (wantsMonteCarlo(input)) {
    monteCarlo = monteCarloStatusOf(await enqueueJob(db, { scenarioId, engineVersion: ENGINE_VERSION, inputsHash: hash, kind: "monteCarlo" }));
  }
  return { engineVersion: ENGINE_VERSION, inputsHash: hash, result, reused, elapsedMs, monteCarlo };
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

/** The complete result of a stateless analysis (the public API): deterministic part and, when enabled, Monte Carlo. */
export function analyzeDocument(input: ScenarioInput): { engineVersion: string; inputsHash: string; result: ScenarioResult; monteCarlo: MonteCarloResult | null; elapsedMs: number } {
  const hash = inputsHash(input);
  const t0 = performance.now();
  const det = analyzeScenario(deterministicInput(input));
  const mc = wantsMonteCarlo(input) ? (analyzeScenario(monteCarloInput(input)).economics.monteCarlo ?? null) : null;
  return { engineVersion: ENGINE_VERSION, inputsHash: hash, result: { ...det, inputsHash: hash }, monteCarlo: mc, elapsedMs: performance.now() - t0 };
}
