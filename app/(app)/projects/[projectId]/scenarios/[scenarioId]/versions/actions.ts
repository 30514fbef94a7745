"use server";

import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { db } from "@/db";
import { env } from "@/lib/env";
import { currentViewer } from "@/lib/auth/session";
import { issueScenario } from "@/lib/sharing/versions";
import { addComment } from "@/lib/sharing/comments";
import { formStateOf, type FormState } from "@/lib/sharing/form-state";
import { kickMailer } from "@/lib/mail/worker";

/** Freeze the draft's inputs and current result as the next version (scenario.issue), then open it. */
export async function issueAction(projectId: string, scenarioId: string, _prev: FormState, form: FormData): Promise<FormState> {
  const outcome = await issueScenario(db, await currentViewer(), projectId, scenarioId, { note: String(form.get("note") ?? "") });
  if (!outcome.ok) return formStateOf(outcome, () => "");
  revalidatePath(`/projects/${projectId}`);
  redirect(`/projects/${projectId}/scenarios/${scenarioId}/versions/${outcome.value.versionNumber}`);
}

/** Comment on an issued version (scenario.comment); the firm is told by e-mail. */
export async function commentAction(projectId: string, versionId: string, _prev: FormState, form: FormData): Promise<FormState> {
  const outcome = await addComment(db, await currentViewer(), projectId, versionId, { body: String(form.get("body") ?? "") }, { appUrl: env().APP_URL });
  if (outcome.ok) {
    kickMailer();
    revalidatePath(`/projects/${projectId}`, "layout");
  }
  return formStateOf(outcome, () => "Comment posted. The consultants have been notified.");
}
