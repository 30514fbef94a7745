"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { after } from "next/server";
import type { EditorProblem } from "@/lib/scenarios/editor-validation";
import { sectionOfPath } from "@/lib/scenarios/editor-values";
import { currentViewer } from "@/lib/auth/session";
import { archiveScenarioFor, authorizeScenario, cloneScenarioFor, saveAndAnalyse } from "@/lib/scenarios/data";

export type SaveScenarioResult =
  | {
      ok: true;
      revision: number;
      inputsHash: string;
      reusedResult: boolean;
      analysisMs: number;
      monteCarlo: "queued" | "running" | "done" | "failed" | null;
      warnings: number;
      /** Labels of the options whose first costs are not entered yet (their life-cycle figures wait). */
      firstCostsMissing: string[];
    }
  | { ok: false; kind: "invalid"; problems: EditorProblem[]; message: string }
  | { ok: false; kind: "conflict"; message: string; currentRevision: number; savedBy: string | null; savedAt: string }
  | { ok: false; kind: "refused"; message: string };

export interface SaveScenarioPayload {
  revision: number;
  name: string;
  climateDatasetId: string | null;
  document: unknown;
}

async function authorized(projectId: string, scenarioId: string, action: "scenario.edit") {
  const r = await authorizeScenario(await currentViewer(), scenarioId, action);
  if (!r.ok) return { ok: false as const, message: r.status === 401 ? "Your session has ended: sign in again (your edits stay in this tab)." : r.status === 403 ? "You may not edit this scenario." : "This scenario does not exist." };
  if (r.ctx.row.projectId !== projectId) return { ok: false as const, message: "This scenario does not exist." };
  return r;
}

/**
 * Validate with the scenario schema, store when the revision still matches, analyse (stored by engine
 * version + inputs hash), queue the Monte Carlo. Nothing is stored when validation fails or the save is stale.
 */
export async function saveScenarioAction(projectId: string, scenarioId: string, payload: SaveScenarioPayload): Promise<SaveScenarioResult> {
  const sa = await authorized(projectId, scenarioId, "scenario.edit");
  if (!sa.ok) return { ok: false, kind: "refused", message: sa.message };
  if (!payload || typeof payload !== "object" || !Number.isInteger(payload.revision)) {
    return { ok: false, kind: "refused", message: "The save was malformed; reload the page." };
  }
  const r = await saveAndAnalyse(
    sa,
    {
      expectedRevision: payload.revision,
      name: typeof payload.name === "string" ? payload.name : "",
      climateDatasetId: typeof payload.climateDatasetId === "string" ? payload.climateDatasetId : null,
      document: payload.document,
    },
    (task) => after(task),
  );
  if (!r.ok) {
    if (r.kind === "invalid") {
      const problems: EditorProblem[] = Object.entries(r.fieldErrors).flatMap(([path, messages]) =>
        messages.map((message) => ({ path, section: sectionOfPath(path), kind: /^Enter a value/.test(message) ? ("missing" as const) : ("invalid" as const), message })),
      );
      const n = problems.length;
      return { ok: false, kind: "invalid", problems, message: `Not saved: ${n} ${n === 1 ? "problem" : "problems"} to fix (listed at the top).` };
    }
    if (r.kind === "conflict") return { ok: false, kind: "conflict", message: r.message, currentRevision: r.currentRevision, savedBy: r.savedBy, savedAt: r.savedAt };
    if (r.kind === "archived") return { ok: false, kind: "refused", message: r.message };
    return { ok: false, kind: "refused", message: "This scenario does not exist." };
  }
  revalidatePath(`/projects/${projectId}/scenarios/${scenarioId}`);
  revalidatePath(`/projects/${projectId}`);
  return {
    ok: true,
    revision: r.revision,
    inputsHash: r.analysis.inputsHash,
    reusedResult: r.analysis.reused,
    analysisMs: Math.round(r.analysis.elapsedMs),
    monteCarlo: r.analysis.monteCarlo?.status ?? null,
    warnings: r.analysis.result.warnings.length,
    firstCostsMissing: r.input.options.filter((o) => o.costs.firstCost === undefined).map((o) => o.label),
  };
}

/** Clone and open the copy's editor. */
export async function cloneScenarioAction(projectId: string, scenarioId: string): Promise<void> {
  const sa = await authorized(projectId, scenarioId, "scenario.edit");
  if (!sa.ok) throw new Error(sa.message);
  const copy = await cloneScenarioFor(sa);
  if (!copy) throw new Error("This scenario does not exist.");
  revalidatePath(`/projects/${projectId}`);
  redirect(`/projects/${projectId}/scenarios/${copy.id}/edit`);
}

export async function archiveScenarioAction(projectId: string, scenarioId: string, archived: boolean): Promise<void> {
  const sa = await authorized(projectId, scenarioId, "scenario.edit");
  if (!sa.ok) throw new Error(sa.message);
  await archiveScenarioFor(sa, archived);
  revalidatePath(`/projects/${projectId}`);
  redirect(archived ? `/projects/${projectId}` : `/projects/${projectId}/scenarios/${scenarioId}`);
}
