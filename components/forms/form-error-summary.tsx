"use client";

import { useEffect, useRef } from "react";
import type { FieldErrors, FieldValues } from "react-hook-form";
import { fieldId, type FieldErrorMap } from "./errors";

export interface FormErrorSummaryProps<T extends FieldValues = FieldValues> {
  /** react-hook-form's formState.errors (nested). */
  errors?: FieldErrors<T>;
  /** Field errors returned by a server action (dot paths → messages). */
  serverErrors?: FieldErrorMap;
  /** A message about the whole form (a stale save, a permission change). */
  formError?: string | null;
  /** Human names of fields by path, so the list says "Elevation: …" rather than a path. */
  labels?: Record<string, string>;
  /** Increment (pass formState.submitCount) to move focus to the summary after a failed submit. */
  focusKey?: number;
  /** Prefix of field ids when fields were given `id` props built with another prefix. */
  idPrefix?: string;
  title?: string;
}

/** Flatten react-hook-form's nested errors into dot paths → message. */
export function flattenFormErrors(errors: unknown, prefix = ""): [string, string][] {
  const out: [string, string][] = [];
  if (!errors || typeof errors !== "object") return out;
  const e = errors as Record<string, unknown>;
  if (typeof e.message === "string" && e.message && ("type" in e || "ref" in e)) {
    out.push([prefix, e.message]);
  }
  for (const [key, child] of Object.entries(e)) {
    if (key === "ref" || key === "message" || key === "type" || key === "types") continue;
    if (child && typeof child === "object") out.push(...flattenFormErrors(child, prefix ? `${prefix}.${key}` : key));
  }
  return out;
}

/**
 * Every problem of the form in one list at its top, each linked to its field; it takes focus after a failed
 * submit so keyboard and screen-reader users land on it (role="alert").
 */
export function FormErrorSummary<T extends FieldValues = FieldValues>(props: FormErrorSummaryProps<T>) {
  const ref = useRef<HTMLDivElement>(null);
  const items = new Map<string, string[]>();
  for (const [path, message] of flattenFormErrors(props.errors)) {
    const list = items.get(path) ?? [];
    if (!list.includes(message)) list.push(message);
    items.set(path, list);
  }
  for (const [path, messages] of Object.entries(props.serverErrors ?? {})) {
    const list = items.get(path) ?? [];
    for (const m of messages) if (!list.includes(m)) list.push(m);
    items.set(path, list);
  }
  const formMessages = [...(props.formError ? [props.formError] : []), ...(items.get("") ?? []), ...(items.get("root") ?? [])];
  items.delete("");
  items.delete("root");
  const count = [...items.values()].reduce((s, l) => s + l.length, 0);
  const show = count > 0 || formMessages.length > 0;

  useEffect(() => {
    if (show && props.focusKey) ref.current?.focus();
    // Focus only when a new submit fails, not on every keystroke that changes the list.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [props.focusKey]);

  if (!show) return <div aria-live="polite" />;
  return (
    <div
      ref={ref}
      tabIndex={-1}
      role="alert"
      data-testid="form-error-summary"
      className="rounded-panel border border-danger-600 bg-danger-50 px-4 py-3 text-sm text-danger-700"
    >
      <p className="font-semibold">
        {props.title ?? (count > 0 ? `Fix ${count === 1 ? "this problem" : `these ${count} problems`} to save:` : "The form was not saved.")}
      </p>
      {formMessages.length > 0 && (
        <ul className="mt-1 list-disc pl-5">
          {formMessages.map((m) => (
            <li key={m}>{m}</li>
          ))}
        </ul>
      )}
      {count > 0 && (
        <ul className="mt-1 list-disc pl-5">
          {[...items.entries()].flatMap(([path, messages]) =>
            messages.map((m) => (
              <li key={`${path}:${m}`}>
                <a className="underline" href={`#${fieldId(path, props.idPrefix)}`}>
                  {props.labels?.[path] ?? path}
                </a>
                : {m}
              </li>
            )),
          )}
        </ul>
      )}
    </div>
  );
}
