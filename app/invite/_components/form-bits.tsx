"use client";

import { startTransition, type FormEvent, type ReactNode } from "react";
import type { FormState } from "@/lib/sharing/form-state";

/**
 * Small form pieces shared by LoopLedger's sharing and account forms (server actions + useActionState):
 * a labelled input whose errors are announced and tied to it, and the form-level message.
 */
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
  state: FormState;
  hint?: ReactNode;
  autoComplete?: string;
  defaultValue?: string;
  required?: boolean;
  readOnly?: boolean;
  children?: ReactNode;
}) {
  const errors = state.status === "error" ? state.fieldErrors?.[name] : undefined;
  const errorId = `${id}-error`;
  const hintId = `${id}-hint`;
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

export function FormMessage({ state, testId = "form-message" }: { state: FormState; testId?: string }) {
  return (
    <div aria-live="polite" role="status">
      {state.status === "error" && (
        <p data-testid={testId} className="rounded-md bg-danger-50 px-3 py-2 text-sm text-danger-700">
          {state.message}
        </p>
      )}
      {state.status === "ok" && (
        <p data-testid={testId} className="rounded-md bg-ok-50 px-3 py-2 text-sm text-ok-600">
          {state.message}
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
