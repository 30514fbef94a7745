"use client";

import { useActionState } from "react";
import { failureText, type ActionState } from "@/components/forms/action-form";

/** A one-button form for a destructive action, with a confirmation and the refusal shown beside it. */
export function ConfirmButton({
  action,
  label,
  confirm,
  testId,
}: {
  action: (prev: ActionState, form: FormData) => Promise<ActionState>;
  label: string;
  confirm: string;
  testId: string;
}) {
  const [state, run, pending] = useActionState(action, null);
  return (
    <form
      action={run}
      onSubmit={(e) => {
        if (!window.confirm(confirm)) e.preventDefault();
      }}
      className="inline-flex items-center gap-2"
    >
      <button
        type="submit"
        disabled={pending}
        data-testid={testId}
        className="rounded-md border border-danger-600 px-2.5 py-1 text-xs font-medium text-danger-700 hover:bg-danger-50 disabled:opacity-50"
      >
        {pending ? "…" : label}
      </button>
      {state && !state.ok && (
        <span role="status" className="text-xs text-danger-700">
          {failureText(state)}
        </span>
      )}
    </form>
  );
}
