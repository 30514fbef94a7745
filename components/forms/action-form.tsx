"use client";

import { startTransition, useActionState, type FormEvent, type ReactNode } from "react";
import type { Result } from "@/lib/result";
import { errorIdOf, hintIdOf } from "./errors";

/**
 * Small form pieces of the forms that post to a server action through useActionState: a labelled input
 * whose errors are announced and tied to it, and the form-level message. The action's state is its
 * `Result` (null before the first submit).
 */
export type ActionState<T = unknown> = Result<T, unknown> | null;

/** The sentence over a refusal: a 401 tells the person their session has ended. */
export function failureText(state: ActionState): string | null {
  if (!state || state.ok) return null;
  return state.status === 401 ? "Your session has ended. Sign in again." : state.error;
}
export function Field({
  id,
  name,
  label,
  type = "text",
  state,
  hint,
  autoComplete,
  defaultValue,
  required,
  readOnly,
  children,
}: {
  id: string;
  name: string;
  label: string;
  type?: string;
  state: ActionState;
  hint?: ReactNode;
  autoComplete?: string;
  defaultValue?: string;
  required?: boolean;
  readOnly?: boolean;
  children?: ReactNode;
}) {
  const errors = state && !state.ok ? state.fieldErrors?.[name] : undefined;
  const errorId = errorIdOf(id);
  const hintId = hintIdOf(id);
  const describedBy = [hint ? hintId : null, errors?.length ? errorId : null].filter(Boolean).join(" ") || undefined;
  const cls = `mt-1 w-full rounded-md border bg-paper-raised px-3 py-2 text-sm ${errors?.length ? "border-danger-600" : "border-line-strong"} ${readOnly ? "bg-paper-sunk text-ink-soft" : ""}`;
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      {children ? (
        <select id={id} name={name} className={cls} aria-invalid={errors?.length ? true : undefined} aria-describedby={describedBy} defaultValue={defaultValue}>
          {children}
        </select>
      ) : (
        <input
          id={id}
          name={name}
          type={type}
          autoComplete={autoComplete}
          defaultValue={defaultValue}
          required={required}
          readOnly={readOnly}
          aria-invalid={errors?.length ? true : undefined}
          aria-describedby={describedBy}
          className={cls}
        />
      )}
      {hint && (
        <p id={hintId} className="mt-1 text-xs text-ink-faint">
          {hint}
        </p>
      )}
      {errors?.length ? (
        <ul id={errorId} className="mt-1 space-y-0.5 text-xs text-danger-700" data-testid={`${name}-error`}>
          {errors.map((e) => (
            <li key={e}>{e}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/** The form-level message: the refusal's sentence, or `success` (of the value) once the action succeeded. */
export function FormMessage<T>({
  state,
  success,
  testId = "form-message",
}: {
  state: ActionState<T>;
  success?: string | ((value: T) => string);
  testId?: string;
}) {
  const error = failureText(state);
  const done = state?.ok ? (typeof success === "function" ? success(state.value) : success) : null;
  return (
    <div aria-live="polite" role="status">
      {error && (
        <p data-testid={testId} className="rounded-md bg-danger-50 px-3 py-2 text-sm text-danger-700">
          {error}
        </p>
      )}
      {done && (
        <p data-testid={testId} className="rounded-md bg-ok-50 px-3 py-2 text-sm text-ok-600">
          {done}
        </p>
      )}
    </div>
  );
}

/**
 * Submit a form to a useActionState dispatcher without React's automatic reset of the fields: after a
 * refusal the person corrects what they typed instead of typing it all again.
 */
export function submitKeepingFields(dispatch: (form: FormData) => void) {
  return (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    startTransition(() => dispatch(form));
  };
}

/**
 * A one-button form for a server action that needs no fields (clone, archive): it works by keyboard, and a
 * refusal is shown beside the button instead of an error page.
 */
export function ActionButton({ action, children, className, title }: { action: () => Promise<ActionState>; children: ReactNode; className?: string; title?: string }) {
  const [state, run, pending] = useActionState<ActionState, FormData>(() => action(), null);
  const error = failureText(state);
  return (
    <form action={run} className="inline-flex items-center gap-2">
      <button type="submit" disabled={pending} className={className} title={title}>
        {children}
      </button>
      {error && (
        <span role="status" className="text-xs text-danger-700">
          {error}
        </span>
      )}
    </form>
  );
}
