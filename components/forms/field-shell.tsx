"use client";

import type { ReactNode } from "react";
import { FieldError } from "./field-error";

export const inputClass =
  "w-full rounded-md border bg-paper-raised px-3 py-2 text-sm text-ink placeholder:text-ink-faint disabled:bg-paper-sunk disabled:text-ink-faint";
export const inputBorder = (invalid: boolean) => (invalid ? "border-danger-600" : "border-line-strong");

/** Label above, control, then hint and error below: the layout every field shares. */
export function FieldShell({
  id,
  label,
  unit,
  hint,
  hintId,
  errorId,
  error,
  required,
  className = "",
  children,
}: {
  id: string;
  label: ReactNode;
  unit?: string | undefined;
  hint?: ReactNode;
  hintId: string;
  errorId: string;
  error?: string | undefined;
  required?: boolean | undefined;
  className?: string | undefined;
  children: ReactNode;
}) {
  return (
    <div className={className} data-field={id}>
      <label htmlFor={id} className="block text-sm font-medium text-ink">
        {label}
        {unit ? <span className="font-normal text-ink-faint">{`, ${unit}`}</span> : null}
        {required ? (
          <span className="text-danger-700" aria-hidden="true">
            {" *"}
          </span>
        ) : null}
      </label>
      <div className="mt-1">{children}</div>
      {hint ? (
        <div id={hintId} className="mt-1 text-xs text-ink-faint">
          {hint}
        </div>
      ) : null}
      <FieldError id={errorId} message={error} />
    </div>
  );
}

export function describedBy(...ids: (string | false | undefined | null)[]): string | undefined {
  const list = ids.filter((x): x is string => typeof x === "string" && x.length > 0);
  return list.length ? list.join(" ") : undefined;
}
