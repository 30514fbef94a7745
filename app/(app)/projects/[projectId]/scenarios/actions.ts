"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import type { FieldErrorMap } from "@/components/forms/errors";
import { currentViewer } from "@/lib/auth/session";
import { loadProjectAccess } from "@/lib/auth/access";
import { db } from "@/db";
import { createScenarioFor } from "@/lib/scenarios/data";

export type CreateScenarioState = { fieldErrors: FieldErrorMap; formError?: string } | null;

/** "New scenario": from the default scenario on a chosen climate dataset, then straight to its editor. */
export async function createScenarioAction(projectId: string, _prev: CreateScenarioState, form: FormData): Promise<CreateScenarioState> {
  const viewer = await currentViewer();
  if (!viewer) return { fieldErrors: {}, formError: "Your session has ended: sign in again." };
  const access = await loadProjectAccess(db, viewer, projectId);
  if (!access || !access.can("scenario.edit")) return { fieldErrors: {}, formError: "You may not create scenarios in this project." };
  const name = String(form.get("name") ?? "");
  const datasetRaw = String(form.get("climateDatasetId") ?? "");
  const r = await createScenarioFor(access, { name, climateDatasetId: datasetRaw || null });
  if (!r.ok) return { fieldErrors: r.fieldErrors };
  revalidatePath(`/projects/${projectId}`);
  redirect(`/projects/${projectId}/scenarios/${r.id}/edit`);
}
