"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { formFields } from "@/lib/actions/define";
import { perform } from "@/lib/actions/request";
import { createScenarioIn } from "@/lib/scenarios/data";
import type { ActionState } from "@/components/forms/action-form";

/** "New scenario": from the default scenario on a chosen climate dataset, then straight to its editor. */
export async function createScenarioAction(projectId: string, _prev: ActionState, form: FormData) {
  const r = await perform(createScenarioIn, { ...formFields(form), projectId });
  if (!r.ok) return r;
  revalidatePath(`/projects/${projectId}`);
  redirect(`/projects/${projectId}/scenarios/${r.value.id}/edit`);
}
