"use client";

import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState, useSyncExternalStore, type FormEvent } from "react";

export const GENERIC_SIGN_IN_ERROR = "That e-mail and password did not match an account, or sign-in is paused for a while. Try again.";

const noSubscription = () => () => undefined;

/**
 * False on the server and while the page hydrates, true once this component's script runs: until then the
 * form cannot be submitted (a click would otherwise post the password as a plain form before the script
 * that signs in is ready).
 */
function useHydrated(): boolean {
  return useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
}

export function SignInForm({ callbackUrl, initialError }: { callbackUrl: string; initialError?: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(initialError ? GENERIC_SIGN_IN_ERROR : null);
  const [pending, setPending] = useState(false);
  const ready = useHydrated();

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setPending(true);
    setError(null);
    const res = await signIn("credentials", {
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
      redirect: false,
    });
    setPending(false);
    if (!res || res.error) {
      setError(GENERIC_SIGN_IN_ERROR);
      return;
    }
    router.push(callbackUrl);
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} method="post" className="space-y-4" noValidate data-ready={ready ? "true" : "false"}>
      <div>
        <label htmlFor="email" className="block text-sm font-medium">E-mail</label>
        <input id="email" name="email" type="email" autoComplete="username" required
          className="mt-1 w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2" />
      </div>
      <div>
        <label htmlFor="password" className="block text-sm font-medium">Password</label>
        <input id="password" name="password" type="password" autoComplete="current-password" required
          className="mt-1 w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2" />
      </div>
      <div aria-live="polite" role="status">
        {error && <p data-testid="signin-error" className="rounded-md bg-danger-50 px-3 py-2 text-sm text-danger-700">{error}</p>}
      </div>
      <button type="submit" disabled={pending || !ready} aria-disabled={pending || !ready}
        className="w-full rounded-md bg-basin-600 px-3 py-2 font-medium text-white hover:bg-basin-700 disabled:bg-basin-300">
        {pending ? "Signing in…" : ready ? "Sign in" : "Loading…"}
      </button>
    </form>
  );
}
