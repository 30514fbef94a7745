"use server";

import { redirect } from "next/navigation";
import { formFields } from "@/lib/actions/define";
import { perform } from "@/lib/actions/request";
import { acceptAsNewAccount, acceptAsViewer } from "@/lib/sharing/acceptance";
import type { ActionState } from "@/components/forms/action-form";

/**
 * A new person accepts: account for the invited address, exactly the invited role, link spent. The browser
 * signs in next with the password it just chose; only the project id and address go back.
 */
export async function acceptNewAccountAction(token: string, _prev: ActionState, form: FormData) {
  const r = await perform(acceptAsNewAccount, { ...formFields(form), token });
  return r.ok ? { ok: true as const, value: { projectId: r.value.projectId, email: r.value.email } } : r;
}

/** A signed-in person with the invited address accepts. */
export async function acceptSignedInAction(token: string, _prev: ActionState, _form: FormData) {
  const r = await perform(acceptAsViewer, { token });
  if (r.ok) redirect(`/projects/${r.value.projectId}`);
  return r;
}
