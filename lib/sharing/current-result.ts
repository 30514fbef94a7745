import type { Executor } from "@/db/schema";
import type { ScenarioResult } from "@/lib/engine";
import { loadScenarioContext, buildEngineInput } from "@/lib/scenarios/store";
import { storedFor } from "@/lib/scenarios/analysis";
import type { ScenarioDocument } from "@/lib/scenarios/mappers";


export interface DraftForIssue {
  id: string;
  projectId: string;
  name: string;
  climateDatasetId: string | null;
  input: unknown;
  inputVersion: number;
  revision: number;
}

export interface CurrentResult {
  engineVersion: string;
  inputsHash: string;
  /** The complete engine input the result was computed from (climate and site included): what gets frozen. */
  input: unknown;
  result: unknown;
}

/** Finds the finished result computed from the draft's current inputs by the current engine, or null. */
export type CurrentResultResolver = (db: Executor, draft: DraftForIssue) => Promise<CurrentResult | null>;

/**
 * The draft's stored document + its climate dataset + the project's site, as the scenario pages build it
 * (lib/scenarios/store.ts), looked up in the result store under (current engine version, hash of that input).
 * Nothing is computed here: issuing freezes what the consultant has seen. A finished Monte Carlo run for
 * the same key is frozen with it.
 */
export const currentStoredResult: CurrentResultResolver = async (db, draft) => {
  const ctx = await loadScenarioContext(db, draft.id);
  if (!ctx || ctx.row.projectId !== draft.projectId) return null;
  const built = buildEngineInput(ctx.dto.document as ScenarioDocument, ctx.dataset, ctx.project);
  if (!built.ok) return null;
  const stored = await storedFor(db, draft.id, built.input);
  if (!stored.result) return null;
  const mc = stored.monteCarlo?.status === "done" ? stored.monteCarlo.result : null;
  const result: ScenarioResult = mc ? { ...stored.result, economics: { ...stored.result.economics, monteCarlo: mc } } : stored.result;
  return { engineVersion: stored.engineVersion, inputsHash: stored.inputsHash, input: built.input, result };
};
