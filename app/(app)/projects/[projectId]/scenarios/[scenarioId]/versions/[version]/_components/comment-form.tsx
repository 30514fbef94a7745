"use client";

import { useActionState, useEffect, useRef } from "react";
import { FormMessage, submitKeepingFields, type ActionState } from "@/components/forms/action-form";
import { commentAction } from "../../actions";

export function CommentForm({ projectId, versionId }: { projectId: string; versionId: string }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(commentAction.bind(null, projectId, versionId), null);
  const ref = useRef<HTMLFormElement>(null);
  useEffect(() => {
    if (state?.ok) ref.current?.reset();
  }, [state]);
  const errors = state && !state.ok ? state.fieldErrors?.body : undefined;
  return (
    <form method="post" ref={ref} onSubmit={submitKeepingFields(action)} className="space-y-3" data-testid="comment-form">
      <label htmlFor="comment-body" className="block text-sm font-medium">
        Add a comment for the consultant
      </label>
      <textarea
        id="comment-body"
        name="body"
        rows={3}
        maxLength={4000}
        required
        aria-invalid={errors?.length ? true : undefined}
        aria-describedby={errors?.length ? "comment-body-error" : undefined}
        className="w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-sm"
      />
      {errors?.length ? (
        <p id="comment-body-error" className="text-xs text-danger-700">
          {errors.join(" ")}
        </p>
      ) : null}
      <FormMessage state={state} testId="comment-message" success="Comment posted. The consultants have been notified." />
      <button
        type="submit"
        disabled={pending}
        className="rounded-md bg-basin-600 px-3.5 py-2 text-sm font-medium text-white hover:bg-basin-700 disabled:bg-basin-300"
      >
        {pending ? "Posting…" : "Post comment"}
      </button>
    </form>
  );
}
