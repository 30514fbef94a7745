"use client";

import { useActionState } from "react";
import { failureText, type ActionState } from "@/components/forms/action-form";
import { createScenarioAction } from "../actions";

/** Name + climate dataset → a new scenario from the defaults, opened in the editor. */
export function NewScenarioForm({ projectId, datasets }: { projectId: string; datasets: { id: string; name: string; detail: string }[] }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(createScenarioAction.bind(null, projectId), null);
  const err = (k: string) => (state && !state.ok ? state.fieldErrors?.[k]?.join(" ") : undefined);
  const formError = state && !state.ok && !state.fieldErrors ? failureText(state) : null;
  return (
    <form action={action} className="grid gap-3 md:grid-cols-[1fr_1fr_auto] md:items-end" data-testid="new-scenario-form">
      <div>
        <label htmlFor="new-scenario-name" className="block text-sm font-medium">
          Scenario name
        </label>
        <input
          id="new-scenario-name"
          name="name"
          required
          maxLength={200}
          defaultValue="Open tower or closed-circuit cooler"
          aria-invalid={err("name") ? true : undefined}
          aria-describedby="new-scenario-name-error"
          className="mt-1 w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-sm"
        />
        <p id="new-scenario-name-error" aria-live="polite" className="mt-1 text-xs text-danger-700">
          {err("name")}
        </p>
      </div>
      <div>
        <label htmlFor="new-scenario-climate" className="block text-sm font-medium">
          Climate dataset
        </label>
        <select
          id="new-scenario-climate"
          name="climateDatasetId"
          required
          aria-describedby="new-scenario-climate-error"
          className="mt-1 w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-sm"
        >
          {datasets.map((d) => (
            <option key={d.id} value={d.id}>
              {d.name} — {d.detail}
            </option>
          ))}
        </select>
        <p id="new-scenario-climate-error" aria-live="polite" className="mt-1 text-xs text-danger-700">
          {err("climateDatasetId")}
        </p>
      </div>
      <div className="pb-5">
        <button
          type="submit"
          disabled={pending}
          className="inline-flex items-center justify-center gap-2 rounded-md bg-basin-600 px-3.5 py-2 text-sm font-medium text-white hover:bg-basin-700 disabled:bg-basin-300"
        >
          {pending ? "Creating…" : "New scenario"}
        </button>
      </div>
      {formError ? (
        <p role="alert" className="text-sm text-danger-700 md:col-span-3">
          {formError}
        </p>
      ) : null}
    </form>
  );
}
