"use client";

import { useState, type ReactNode } from "react";
import { get, useFormState } from "react-hook-form";
import type { EditorValues } from "@/lib/scenarios/editor-values";

/**
 * A long group of the editor (tornado ranges, Monte Carlo distributions) rendered only when opened: the page
 * stays small, and a group holding an error opens by itself so its fields can be reached from the summary.
 */
export function OnDemand({
  prefixes,
  summary,
  testId,
  children,
}: {
  /** Field paths whose errors open the group. */
  prefixes: string[];
  /** What the group holds, e.g. "the 10 tornado ranges (7 varied)". */
  summary: string;
  testId: string;
  children: () => ReactNode;
}) {
  const [open, setOpen] = useState(false);
  const { errors } = useFormState<EditorValues>();
  const hasError = prefixes.some((p) => get(errors, p) !== undefined);
  const shown = open || hasError;
  return (
    <div className="space-y-3" data-testid={testId}>
      <button
        type="button"
        aria-expanded={shown}
        onClick={() => setOpen((o) => !o)}
        disabled={hasError}
        className="rounded-md border border-line-strong px-3 py-1.5 text-sm hover:bg-paper-sunk"
      >
        {shown ? "Hide" : "Show"} {summary}
        {hasError ? " — holds errors" : ""}
      </button>
      {shown ? children() : null}
    </div>
  );
}
