"use server";

import { redirect } from "next/navigation";
import { db } from "@/db";
import { currentViewer } from "@/lib/auth/session";
import { acceptAsNewAccount, acceptAsViewer } from "@/lib/sharing/acceptance";
import { formStateOf, type FormState } from "@/lib/sharing/form-state";

/** A new person accepts: account for the invited address, exactly the invited role, link spent. */
export async function acceptNewAccountAction(token: string, _prev: FormState, form: FormData): Promise<FormState> {
  const outcome = await acceptAsNewAccount(db, token, {
    name: String(form.get("name") ?? ""),
    password: String(form.get("password") ?? ""),
    confirmPassword: String(form.get("confirmPassword") ?? ""),
  });
  // The browser signs in next with the password it just chose; only the project id and address go back.
  return formStateOf(
    outcome,
    () => "Account created. Signing you in…",
    (v) => ({ projectId: v.projectId, email: v.email }),
  );
}

/** A signed-in person with the invited address accepts. */
export async function acceptSignedInAction(token: string, _prev: FormState, _form: FormData): Promise<FormState> {
  const outcome = await acceptAsViewer(db, await currentViewer(), token);
  if (outcome.ok) redirect(`/projects/${outcome.value.projectId}`);
  return formStateOf(outcome, () => "");
}
