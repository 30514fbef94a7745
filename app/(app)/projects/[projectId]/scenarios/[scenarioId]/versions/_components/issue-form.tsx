"use client";

import { useActionState } from "react";
import { FormMessage, submitKeepingFields, type ActionState } from "@/components/forms/action-form";
import { issueAction } from "../actions";

export function IssueForm({ projectId, scenarioId, nextNumber }: { projectId: string; scenarioId: string; nextNumber: number }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(issueAction.bind(null, projectId, scenarioId), null);
  return (
    <form method="post" onSubmit={submitKeepingFields(action)} className="space-y-3" data-testid="issue-form">
      <div>
        <label htmlFor="issue-note" className="block text-sm font-medium">
          Note to the client <span className="font-normal text-ink-faint">(optional)</span>
        </label>
        <textarea
          id="issue-note"
          name="note"
          rows={2}
          maxLength={2000}
          className="mt-1 w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-sm"
          placeholder="What changed since the last version, what to look at first"
        />
      </div>
      <FormMessage state={state} testId="issue-message" />
      <button
        type="submit"
        disabled={pending}
        className="rounded-md bg-basin-600 px-3.5 py-2 text-sm font-medium text-white hover:bg-basin-700 disabled:bg-basin-300"
      >
        {pending ? "Issuing…" : `Issue as version ${nextNumber}`}
      </button>
      <p className="text-xs text-ink-faint">
        Issuing freezes the current inputs and the stored result computed from them. Client viewers see issued versions only; later edits
        change the draft, never an issued version.
      </p>
    </form>
  );
}
