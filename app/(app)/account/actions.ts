"use server";

import { db } from "@/db";
import { currentViewer } from "@/lib/auth/session";
import { changePassword } from "@/lib/auth/account";
import { formStateOf, type FormState } from "@/lib/sharing/form-state";

/** Change the password (current one required). Every older session, this one included, stops counting. */
export async function changePasswordAction(_prev: FormState, form: FormData): Promise<FormState> {
  const viewer = await currentViewer();
  const outcome = await changePassword(db, viewer, {
    currentPassword: String(form.get("currentPassword") ?? ""),
    newPassword: String(form.get("newPassword") ?? ""),
    confirmPassword: String(form.get("confirmPassword") ?? ""),
  });
  return formStateOf(
    outcome,
    () => "Password changed. Every other session is signed out.",
    () => ({ email: viewer?.email ?? "" }),
  );
}
