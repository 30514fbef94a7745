"use server";

import { revalidatePath } from "next/cache";
import { formFields } from "@/lib/actions/define";
import { perform } from "@/lib/actions/request";
import { createInvitation, revokeInvitation } from "@/lib/sharing/invitations";
import { revokeViewerAccess } from "@/lib/sharing/access";
import type { ActionState } from "@/components/forms/action-form";

function refresh(projectId: string) {
  revalidatePath(`/projects/${projectId}/access`);
  revalidatePath(`/projects/${projectId}`);
}

/** Invite an address to the project (access.share); the e-mail goes out through the outbox. */
export async function inviteAction(projectId: string, _prev: ActionState, form: FormData) {
  const r = await perform(createInvitation, { ...formFields(form), projectId });
  if (r.ok) {
    refresh(projectId);
  }
  return r;
}

/** Take a client viewer's access away (access.revoke); their next request is refused. */
export async function revokeAccessAction(projectId: string, userId: string, _prev: ActionState, _form: FormData) {
  const r = await perform(revokeViewerAccess, { projectId, userId });
  if (r.ok) refresh(projectId);
  return r;
}

/** Withdraw an open invitation (access.revoke). */
export async function withdrawInvitationAction(projectId: string, invitationId: string, _prev: ActionState, _form: FormData) {
  const r = await perform(revokeInvitation, { projectId, invitationId });
  if (r.ok) refresh(projectId);
  return r;
}
