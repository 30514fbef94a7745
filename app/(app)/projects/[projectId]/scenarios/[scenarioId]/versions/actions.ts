"use server";

import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { formFields } from "@/lib/actions/define";
import { perform } from "@/lib/actions/request";
import { issueScenario } from "@/lib/sharing/versions";
import { addComment } from "@/lib/sharing/comments";
import type { ActionState } from "@/components/forms/action-form";

/** Freeze the draft's inputs and current result as the next version (scenario.issue), then open it. */
export async function issueAction(projectId: string, scenarioId: string, _prev: ActionState, form: FormData) {
  const r = await perform(issueScenario, { ...formFields(form), projectId, scenarioId });
  if (!r.ok) return r;
  revalidatePath(`/projects/${projectId}`);
  redirect(`/projects/${projectId}/scenarios/${scenarioId}/versions/${r.value.versionNumber}`);
}

/** Comment on an issued version (scenario.comment); the firm is told by e-mail. */
export async function commentAction(projectId: string, versionId: string, _prev: ActionState, form: FormData) {
  const r = await perform(addComment, { ...formFields(form), projectId, versionId });
  if (r.ok) {
    revalidatePath(`/projects/${projectId}`, "layout");
  }
  return r;
}
