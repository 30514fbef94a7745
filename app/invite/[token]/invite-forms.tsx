"use client";

import { useActionState, useEffect, useRef, useState } from "react";
import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { Field, FormMessage, submitKeepingFields, type ActionState } from "@/components/forms/action-form";
import { acceptNewAccountAction, acceptSignedInAction } from "./actions";

export function NewAccountForm({ token, email }: { token: string; email: string }) {
  const router = useRouter();
  // The chosen password stays in this page's memory only, so the browser can sign in once the account exists.
  const password = useRef("");
  const [state, action, pending] = useActionState(async (prev: ActionState, form: FormData) => {
    password.current = String(form.get("password") ?? "");
    return acceptNewAccountAction(token, prev, form);
  }, null);
  const [signInError, setSignInError] = useState<string | null>(null);

  useEffect(() => {
    if (!state?.ok) return;
    const { projectId, email: address } = state.value;
    void signIn("credentials", { email: address, password: password.current, redirect: false }).then((res) => {
      if (!res || res.error) {
        setSignInError("Your account is ready, but signing in failed. Sign in with your e-mail and the password you chose.");
        return;
      }
      router.push(`/projects/${projectId}`);
      router.refresh();
    });
  }, [state, router]);

  return (
    <form method="post" onSubmit={submitKeepingFields(action)} className="space-y-4" data-testid="invite-new-account" noValidate>
      <Field id="invite-email" name="email" label="E-mail" state={state} defaultValue={email} readOnly />
      <Field id="invite-name" name="name" label="Your name" autoComplete="name" state={state} required />
      <Field
        id="invite-password"
        name="password"
        label="Password"
        type="password"
        autoComplete="new-password"
        state={state}
        hint="At least 12 characters, not your e-mail address."
        required
      />
      <Field id="invite-confirm" name="confirmPassword" label="Password again" type="password" autoComplete="new-password" state={state} required />
      <FormMessage state={state} testId="invite-message" success="Account created. Signing you in…" />
      {signInError && (
        <p role="alert" className="rounded-md bg-danger-50 px-3 py-2 text-sm text-danger-700">
          {signInError}
        </p>
      )}
      <button
        type="submit"
        disabled={pending || Boolean(state?.ok)}
        className="w-full rounded-md bg-basin-600 px-3 py-2 font-medium text-white hover:bg-basin-700 disabled:bg-basin-300"
      >
        {pending ? "Creating your account…" : "Accept and create my account"}
      </button>
    </form>
  );
}

export function AcceptSignedInForm({ token }: { token: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(acceptSignedInAction.bind(null, token), null);
  return (
    <form action={action} className="space-y-3" data-testid="invite-accept">
      <FormMessage state={state} testId="invite-message" />
      <button
        type="submit"
        disabled={pending}
        className="w-full rounded-md bg-basin-600 px-3 py-2 font-medium text-white hover:bg-basin-700 disabled:bg-basin-300"
      >
        {pending ? "Accepting…" : "Accept and open the project"}
      </button>
    </form>
  );
}
