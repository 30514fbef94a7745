"use server";

import { revalidatePath } from "next/cache";
import { db } from "@/db";
import { env } from "@/lib/env";
import { currentViewer } from "@/lib/auth/session";
import { createInvitation, revokeInvitation } from "@/lib/sharing/invitations";
import { revokeViewerAccess } from "@/lib/sharing/access";
import { formStateOf, type FormState } from "@/lib/sharing/form-state";
import { kickMailer } from "@/lib/mail/worker";

function refresh(projectId: string) {
  revalidatePath(`/projects/${projectId}/access`);
  revalidatePath(`/projects/${projectId}`);
}

/** Invite an address to the project (access.share); the e-mail goes out through the outbox. */
export async function inviteAction(projectId: string, _prev: FormState, form: FormData): Promise<FormState> {
  const outcome = await createInvitation(
    db,
    await currentViewer(),
    projectId,
    { email: String(form.get("email") ?? ""), role: String(form.get("role") ?? "") },
    { appUrl: env().APP_URL },
  );
  if (outcome.ok) {
    kickMailer();
    refresh(projectId);
  }
  return formStateOf(outcome, (v) => `Invitation for ${v.email} (${v.role}) saved; the e-mail is on its way. Its delivery shows below.`);
}

/** Take a client viewer's access away (access.revoke); their next request is refused. */
export async function revokeAccessAction(projectId: string, userId: string, _prev: FormState, _form: FormData): Promise<FormState> {
  const outcome = await revokeViewerAccess(db, await currentViewer(), projectId, userId);
  if (outcome.ok) refresh(projectId);
  return formStateOf(outcome, () => "Access revoked.");
}

/** Withdraw an open invitation (access.revoke). */
export async function withdrawInvitationAction(projectId: string, invitationId: string, _prev: FormState, _form: FormData): Promise<FormState> {
  const outcome = await revokeInvitation(db, await currentViewer(), projectId, invitationId);
  if (outcome.ok) refresh(projectId);
  return formStateOf(outcome, (v) => `Invitation for ${v.email} withdrawn.`);
}
