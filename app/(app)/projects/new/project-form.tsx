"use client";

import { useState } from "react";
import { useRouter } from "next/navigation";
import { useForm, useWatch, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import {
  applyFieldErrors,
  FormErrorSummary,
  NumberField,
  SelectField,
  TextField,
  UnitsProvider,
} from "@/components/forms";
import { Button, ButtonLink } from "@/components/ui/button";
import { PROJECT_FIELD_LABELS, projectCreateSchema, projectSchema, type ProjectCreateFields } from "@/lib/projects/schema";
import { createProjectAction } from "./actions";
import { updateProjectAction } from "../[projectId]/edit/actions";

/** The form's values: elevation may be empty until the consultant enters it. */
type FormValues = Omit<ProjectCreateFields, "elevationM"> & { elevationM: number | undefined };

const UNIT_OPTIONS = [
  { value: "SI", label: "SI — °C, L/s, kW, m³, kPa" },
  { value: "IP", label: "IP — °F, gpm, Btu/h and tons, kgal, psi" },
] as const;

const COMMON_CURRENCIES = ["USD", "CAD", "EUR", "GBP", "AUD", "NZD", "MXN", "BRL", "JPY", "CNY", "INR", "ZAR", "CHF", "SEK", "NOK", "DKK", "SGD", "AED", "SAR"];

export interface ProjectFormProps {
  mode: "create" | "edit";
  projectId?: string;
  /** The project's revision when the edit form was opened: a stale edit is refused, not applied. */
  revision?: number;
  firms: { firmId: string; firmName: string }[];
  initial: FormValues;
  cancelHref: string;
}

/** Create or edit a project: the same fields, the same schema as the server, every error at its field. */
export function ProjectForm({ mode, projectId, revision, firms, initial, cancelHref }: ProjectFormProps) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const schema = mode === "create" ? projectCreateSchema : projectSchema;
  const form = useForm<FormValues>({
    // The schema's input type has elevation required; the form allows it empty until validated.
    resolver: zodResolver(schema) as unknown as Resolver<FormValues>,
    defaultValues: initial,
    mode: "onTouched",
  });
  const { control, handleSubmit, setError, formState } = form;
  const unitSystem = useWatch({ control, name: "unitSystem" });
  const currency = useWatch({ control, name: "currency" });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setSaved(null);
    const result = mode === "create" ? await createProjectAction(values) : await updateProjectAction(projectId ?? "", { ...values, revision });
    if (!result.ok) {
      const formLevel = applyFieldErrors(setError, result.fieldErrors ?? {});
      setFormError(formLevel[0] ?? (result.status === 422 ? null : result.error));
      return;
    }
    if (mode === "create" && "projectId" in result.value) {
      router.push(`/projects/${result.value.projectId}`);
    } else {
      setSaved("Saved.");
      router.push(cancelHref);
    }
    router.refresh();
  });

  return (
    <UnitsProvider system={unitSystem === "IP" ? "IP" : "SI"} currency={currency || "USD"}>
      <form method="post" onSubmit={onSubmit} noValidate className="space-y-6" data-testid="project-form" aria-label={mode === "create" ? "New project" : "Edit project"}>
        <FormErrorSummary
          errors={formState.errors}
          formError={formError}
          labels={PROJECT_FIELD_LABELS}
          focusKey={formState.submitCount}
        />
        <fieldset className="grid gap-4 md:grid-cols-2">
          <legend className="mb-2 text-sm font-semibold text-ink-soft">Who and what</legend>
          {mode === "create" && firms.length > 1 ? (
            <SelectField<FormValues>
              name="firmId"
              control={control}
              label="Consulting firm"
              options={firms.map((f) => ({ value: f.firmId, label: f.firmName }))}
              required
            />
          ) : null}
          <TextField<FormValues> name="clientName" control={control} label="Client" required placeholder="The plant owner's company" maxLength={200} />
          <TextField<FormValues> name="name" control={control} label="Project name" required placeholder="e.g. Cold store — condenser loop replacement" maxLength={200} />
        </fieldset>
        <fieldset className="grid gap-4 md:grid-cols-2">
          <legend className="mb-2 text-sm font-semibold text-ink-soft">Site</legend>
          <TextField<FormValues> name="siteName" control={control} label="Site name" required placeholder="The plant or building" maxLength={200} />
          <TextField<FormValues>
            name="locationLabel"
            control={control}
            label="Location"
            placeholder="Town, region, country"
            description="Shown on reports; the climate comes from the weather data you import."
            maxLength={200}
          />
          <NumberField<FormValues>
            name="elevationM"
            control={control}
            kind="elevationM"
            label="Site elevation"
            required
            description="Sets the air pressure for wet-bulb and tower calculations (standard atmosphere, ASHRAE Fundamentals 2017 ch.1 eq. 3)."
          />
        </fieldset>
        <fieldset className="grid gap-4 md:grid-cols-2">
          <legend className="mb-2 text-sm font-semibold text-ink-soft">How numbers are shown</legend>
          <SelectField<FormValues>
            name="unitSystem"
            control={control}
            label="Units"
            options={UNIT_OPTIONS}
            description="Everyone viewing this project sees its values in these units; they are stored in SI."
          />
          <TextField<FormValues>
            name="currency"
            control={control}
            label="Currency (ISO 4217)"
            uppercase
            maxLength={3}
            required
            description={`Three letters, e.g. ${COMMON_CURRENCIES.slice(0, 5).join(", ")}. Amounts are not converted between currencies.`}
          />
        </fieldset>
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" disabled={formState.isSubmitting} data-testid="project-submit">
            {formState.isSubmitting ? "Saving…" : mode === "create" ? "Create project" : "Save changes"}
          </Button>
          <ButtonLink href={cancelHref} variant="secondary">
            Cancel
          </ButtonLink>
          <span aria-live="polite" className="text-sm text-ok-600">
            {saved}
          </span>
        </div>
      </form>
    </UnitsProvider>
  );
}
