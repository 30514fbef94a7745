"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { perform } from "@/lib/actions/request";
import { archiveScenarioIn, cloneScenarioIn, saveScenarioIn } from "@/lib/scenarios/data";

export interface SaveScenarioPayload {
  revision: number;
  name: string;
  climateDatasetId: string | null;
  document: unknown;
}

/**
 * Validate with the scenario schema, store when the revision still matches, analyse (stored by engine
 * version + inputs hash; an hourly year in a worker, awaited for a while), queue the Monte Carlo. Nothing
 * is stored when validation fails (422 with every problem by section) or the save is stale (409 with the newer revision).
 */
export async function saveScenarioAction(projectId: string, scenarioId: string, payload: SaveScenarioPayload) {
  const input = payload && typeof payload === "object" ? payload : {};
  const r = await perform(saveScenarioIn, { ...input, projectId, scenarioId });
  if (r.ok) {
    revalidatePath(`/projects/${projectId}/scenarios/${scenarioId}`);
    revalidatePath(`/projects/${projectId}`);
  }
  return r;
}

/** Clone and open the copy's editor. */
export async function cloneScenarioAction(projectId: string, scenarioId: string) {
  const r = await perform(cloneScenarioIn, { projectId, scenarioId });
  if (!r.ok) return r;
  revalidatePath(`/projects/${projectId}`);
  redirect(`/projects/${projectId}/scenarios/${r.value.id}/edit`);
}

/** Archive (back to the project) or restore (back to the scenario). */
export async function archiveScenarioAction(projectId: string, scenarioId: string, archived: boolean) {
  const r = await perform(archiveScenarioIn, { projectId, scenarioId, archived });
  if (!r.ok) return r;
  revalidatePath(`/projects/${projectId}`);
  redirect(archived ? `/projects/${projectId}` : `/projects/${projectId}/scenarios/${scenarioId}`);
}
