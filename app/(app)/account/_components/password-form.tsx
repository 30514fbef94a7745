"use client";

import { useActionState, useEffect, useRef, useState } from "react";
import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { Field, FormMessage, submitKeepingFields, type ActionState } from "@/components/forms/action-form";
import { changePasswordAction } from "../actions";

export function PasswordForm() {
  const router = useRouter();
  const formRef = useRef<HTMLFormElement>(null);
  // The change voids this session too; the browser signs in again with the new password it just sent.
  const next = useRef("");
  const [state, action, pending] = useActionState(async (prev: ActionState, form: FormData) => {
    next.current = String(form.get("newPassword") ?? "");
    return changePasswordAction(prev, form);
  }, null);
  const [note, setNote] = useState<string | null>(null);
  useEffect(() => {
    if (!state?.ok) return;
    formRef.current?.reset();
    void signIn("credentials", { email: state.value.email, password: next.current, redirect: false }).then((res) => {
      next.current = "";
      if (!res || res.error) {
        router.push("/signin");
        return;
      }
      setNote("You stay signed in here with the new password.");
      router.refresh();
    });
  }, [state, router]);
  return (
    <form method="post" ref={formRef} onSubmit={submitKeepingFields(action)} className="max-w-md space-y-4" data-testid="password-form" noValidate>
      <Field id="pw-current" name="currentPassword" label="Current password" type="password" autoComplete="current-password" state={state} required />
      <Field
        id="pw-new"
        name="newPassword"
        label="New password"
        type="password"
        autoComplete="new-password"
        state={state}
        hint="At least 12 characters, not your e-mail address."
        required
      />
      <Field id="pw-confirm" name="confirmPassword" label="New password again" type="password" autoComplete="new-password" state={state} required />
      <FormMessage state={state} testId="password-message" success="Password changed. Every other session is signed out." />
      {note && <p className="text-sm text-ink-soft">{note}</p>}
      <button
        type="submit"
        disabled={pending}
        className="rounded-md bg-basin-600 px-3.5 py-2 text-sm font-medium text-white hover:bg-basin-700 disabled:bg-basin-300"
      >
        {pending ? "Changing…" : "Change password"}
      </button>
    </form>
  );
}
