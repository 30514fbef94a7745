"use client";

import { useActionState, useEffect, useRef } from "react";
import { Field, FormMessage, submitKeepingFields } from "@/components/forms/action-form";
import { inviteAction } from "../actions";

export function InviteForm({ projectId }: { projectId: string }) {
  const [state, action, pending] = useActionState(inviteAction.bind(null, projectId), null);
  const formRef = useRef<HTMLFormElement>(null);
  useEffect(() => {
    if (state?.ok) formRef.current?.reset();
  }, [state]);
  return (
    <form method="post" ref={formRef} onSubmit={submitKeepingFields(action)} className="grid gap-4 md:grid-cols-[2fr_1fr_auto] md:items-start" data-testid="invite-form" noValidate>
      <Field id="invite-email" name="email" label="E-mail address" type="email" autoComplete="off" state={state} required />
      <Field
        id="invite-role"
        name="role"
        label="Role"
        state={state}
        defaultValue="owner"
        hint="Owner: issued comparisons, what-if, comments. Finance: the same plus cash flows, report and workbook."
      >
        <option value="owner">Owner (client viewer)</option>
        <option value="finance">Finance (client viewer)</option>
      </Field>
      <div className="md:pt-6">
        <button
          type="submit"
          disabled={pending}
          className="w-full rounded-md bg-basin-600 px-3.5 py-2 text-sm font-medium text-white hover:bg-basin-700 disabled:bg-basin-300"
        >
          {pending ? "Inviting…" : "Send invitation"}
        </button>
      </div>
      <div className="md:col-span-3">
        <FormMessage
          state={state}
          testId="invite-message"
          success={(v) => `Invitation for ${v.email} (${v.role}) saved; the e-mail is on its way. Its delivery shows below.`}
        />
      </div>
    </form>
  );
}
