"use client";

import { useCallback, useEffect, useMemo, useRef, useState, useTransition } from "react";
import Link from "next/link";
import { FormProvider, useForm, useFormState, type Control, type FieldErrors, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { FormErrorSummary, SelectField, TextField, UnitsProvider, applyFieldErrors, type FieldErrorMap } from "@/components/forms";
import { scenarioSchema } from "@/lib/scenarios/schema";
import { withPlaceholders } from "@/lib/scenarios/validate";
import type { UnitSystem } from "@/lib/units";
import { cloneScenarioAction, saveScenarioAction, type SaveScenarioResult } from "../../actions";
import { DutySection, EconomicsSection, OptionsSection, TariffsSection, UpkeepSection, WaterSection } from "./sections";

type V = Record<string, unknown>;

const SECTIONS = [
  ["general", "General"],
  ["duty", "Duty"],
  ["options", "Options"],
  ["water", "Water"],
  ["upkeep", "Upkeep and fouling"],
  ["tariffs", "Tariffs"],
  ["economics", "Economics"],
] as const;

const schemaResolver = zodResolver(scenarioSchema as never) as unknown as Resolver<V>;

/**
 * The one scenario schema in the browser: the editor's values with a placeholder climate and site (the
 * dataset is checked on the server), so the same rules run on every change and on save.
 */
const resolver: Resolver<V> = async (values, context, options) => {
  const r = await schemaResolver(withPlaceholders(values), context, options);
  const errors = { ...(r.errors as FieldErrors<V>) } as Record<string, unknown>;
  delete errors.climate;
  delete errors.site;
  if (Object.keys(errors).length > 0) return { values: {}, errors: errors as FieldErrors<V> };
  return { values, errors: {} };
};

type Banner =
  | { kind: "saved"; text: string }
  | { kind: "conflict"; text: string; currentRevision: number }
  | { kind: "error"; text: string }
  | null;

export function ScenarioEditor(props: {
  projectId: string;
  scenarioId: string;
  revision: number;
  unitSystem: UnitSystem;
  currency: string;
  datasets: { id: string; name: string }[];
  initial: V;
}) {
  const { projectId, scenarioId } = props;
  const form = useForm<V>({ defaultValues: props.initial, resolver, mode: "onChange", reValidateMode: "onChange", shouldUnregister: false });
  const [revision, setRevision] = useState(props.revision);
  const [banner, setBanner] = useState<Banner>(null);
  const [serverErrors, setServerErrors] = useState<FieldErrorMap>({});
  const [pending, startTransition] = useTransition();
  const [copied, setCopied] = useState<string | null>(null);
  // Read through child components (useFormState) so that a keystroke re-renders them, not the whole form.
  const dirtyRef = useRef(false);
  const base = `/projects/${projectId}/scenarios/${scenarioId}`;

  // A warning before leaving with unsaved changes: closing or reloading the tab, and links in the app.
  useEffect(() => {
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      if (!dirtyRef.current) return;
      e.preventDefault();
      e.returnValue = "";
    };
    const onClick = (e: MouseEvent) => {
      if (!dirtyRef.current || e.defaultPrevented || e.button !== 0 || e.metaKey || e.ctrlKey || e.shiftKey) return;
      const a = (e.target as HTMLElement | null)?.closest?.("a[href]") as HTMLAnchorElement | null;
      if (!a || a.target === "_blank" || a.hasAttribute("download") || a.getAttribute("href")?.startsWith("#")) return;
      if (!window.confirm("You have unsaved changes in this scenario. Leave without saving?")) {
        e.preventDefault();
        e.stopPropagation();
      }
    };
    window.addEventListener("beforeunload", onBeforeUnload);
    document.addEventListener("click", onClick, true);
    return () => {
      window.removeEventListener("beforeunload", onBeforeUnload);
      document.removeEventListener("click", onClick, true);
    };
  }, []);

  const save = useCallback(
    (values: V) => {
      setBanner(null);
      startTransition(async () => {
        const { climateDatasetId, ...document } = values;
        let r: SaveScenarioResult;
        try {
          r = await saveScenarioAction(projectId, scenarioId, {
            revision,
            name: String(values.name ?? ""),
            climateDatasetId: typeof climateDatasetId === "string" && climateDatasetId ? climateDatasetId : null,
            document,
          });
        } catch {
          setBanner({ kind: "error", text: "The server could not be reached. Nothing was saved; your edits are still here — try again." });
          return;
        }
        if (r.ok) {
          setRevision(r.revision);
          setServerErrors({});
          form.reset(form.getValues(), { keepValues: true });
          setBanner({
            kind: "saved",
            text:
              `Saved as revision ${r.revision}. ` +
              (r.reusedResult ? "The stored result for these inputs was reused." : `Analysed in ${(r.analysisMs / 1000).toFixed(1)} s.`) +
              (r.monteCarlo === "queued" || r.monteCarlo === "running" ? " Monte Carlo runs in the background." : ""),
          });
          return;
        }
        if (r.kind === "invalid") {
          // Field errors go onto their fields (and from there into the summary); only form-level ones stay here.
          const formLevel = applyFieldErrors(form.setError, r.fieldErrors);
          setServerErrors(formLevel.length > 0 ? { "": formLevel } : {});
          setBanner({ kind: "error", text: r.message });
          return;
        }
        if (r.kind === "conflict") {
          setBanner({ kind: "conflict", text: r.message, currentRevision: r.currentRevision });
          return;
        }
        setBanner({ kind: "error", text: r.message });
      });
    },
    [form, projectId, revision, scenarioId],
  );

  const onInvalid = useCallback(() => setBanner({ kind: "error", text: "Not saved: fix the fields listed above first." }), []);

  const copyInputs = useCallback(async () => {
    const text = JSON.stringify(form.getValues(), null, 2);
    try {
      await navigator.clipboard.writeText(text);
      setCopied("Your inputs are on the clipboard as JSON.");
    } catch {
      setCopied(text);
    }
  }, [form]);

  const datasetOptions = useMemo(() => props.datasets.map((d) => ({ value: d.id, label: d.name })), [props.datasets]);

  return (
    <UnitsProvider system={props.unitSystem} currency={props.currency}>
      <FormProvider {...form}>
        <form noValidate onSubmit={form.handleSubmit(save, onInvalid)} className="grid gap-6 lg:grid-cols-[12rem_1fr]" data-testid="scenario-editor" aria-label="Scenario inputs">
          <nav aria-label="Sections" className="lg:sticky lg:top-4 lg:self-start">
            <ul className="flex flex-wrap gap-1 text-sm lg:flex-col">
              {SECTIONS.map(([id, label]) => (
                <li key={id}>
                  <a href={`#${id}`} className="block rounded-md px-2 py-1 text-ink-soft hover:bg-paper-sunk hover:text-ink">
                    {label}
                  </a>
                </li>
              ))}
            </ul>
            <p className="mt-4 hidden text-xs text-ink-faint lg:block">
              Units: {props.unitSystem === "IP" ? "IP (°F, gpm, kgal…)" : "SI (°C, L/s, m³…)"}; stored in SI. Empty optional fields let the engine derive the value.
            </p>
          </nav>
          <div className="min-w-0 space-y-6">
            <ErrorSummary control={form.control} serverErrors={serverErrors} />
            <section id="general" aria-labelledby="general-title" className="scroll-mt-24 rounded-panel border border-line bg-paper-raised p-panel shadow-panel">
              <h2 id="general-title" className="text-lg font-semibold">
                General
              </h2>
              <div className="mt-4 grid gap-4 sm:grid-cols-2">
                <TextField<V> name="name" label="Scenario name" maxLength={200} required />
                <SelectField<V>
                  name="climateDatasetId"
                  label="Climate dataset"
                  options={datasetOptions}
                  placeholder="Choose a dataset"
                  emptyValue=""
                  required
                  description="Stored typical-year weather of this project (hourly or bins)."
                />
              </div>
            </section>
            <DutySection />
            <OptionsSection />
            <WaterSection />
            <UpkeepSection />
            <TariffsSection />
            <EconomicsSection />
            <div className="sticky bottom-0 z-10 -mx-2 rounded-panel border border-line bg-paper-raised/95 px-4 py-3 shadow-panel backdrop-blur" data-testid="save-bar">
              {banner ? (
                <div
                  role={banner.kind === "saved" ? "status" : "alert"}
                  data-testid={`banner-${banner.kind}`}
                  className={`mb-3 rounded-md border px-3 py-2 text-sm ${
                    banner.kind === "saved" ? "border-ok-600 bg-ok-50 text-ok-600" : banner.kind === "conflict" ? "border-caution-600 bg-caution-50 text-caution-800" : "border-danger-600 bg-danger-50 text-danger-700"
                  }`}
                >
                  <p>{banner.text}</p>
                  {banner.kind === "saved" ? (
                    <Link href={base} className="mt-1 inline-block font-medium underline">
                      See the comparison
                    </Link>
                  ) : null}
                  {banner.kind === "conflict" ? (
                    <div className="mt-2 flex flex-wrap gap-2">
                      <button type="button" onClick={copyInputs} className="rounded-md border border-caution-600 bg-paper-raised px-3 py-1.5 text-sm">
                        Copy my inputs (JSON)
                      </button>
                      <button
                        type="button"
                        onClick={() => {
                          if (window.confirm(`Load revision ${banner.currentRevision}? Your unsaved edits in this tab will be replaced (copy them first).`)) {
                            dirtyRef.current = false;
                            window.location.reload();
                          }
                        }}
                        className="rounded-md border border-caution-600 bg-paper-raised px-3 py-1.5 text-sm"
                      >
                        Load the newer revision
                      </button>
                    </div>
                  ) : null}
                  {copied ? (
                    copied.startsWith("{") ? (
                      <textarea readOnly aria-label="Your inputs as JSON" className="mt-2 h-40 w-full rounded border border-line p-2 font-mono text-xs" value={copied} />
                    ) : (
                      <p className="mt-1 text-xs">{copied}</p>
                    )
                  ) : null}
                </div>
              ) : null}
              <div className="flex flex-wrap items-center gap-3">
                <button
                  type="submit"
                  disabled={pending}
                  data-testid="save-scenario"
                  className="inline-flex items-center justify-center gap-2 rounded-md bg-basin-600 px-4 py-2 text-sm font-medium text-white hover:bg-basin-700 disabled:bg-basin-300"
                >
                  {pending ? "Saving and analysing…" : "Save and analyse"}
                </button>
                <DirtyNote control={form.control} revision={revision} dirtyRef={dirtyRef} />
                <button
                  type="button"
                  className="ml-auto rounded-md border border-line-strong bg-paper-raised px-3 py-1.5 text-sm hover:bg-paper-sunk"
                  onClick={() => {
                    const note = dirtyRef.current ? "The copy is made from the saved revision: your unsaved edits here are not in it. Clone anyway?" : "Make a copy of this scenario and open it?";
                    if (!window.confirm(note)) return;
                    dirtyRef.current = false;
                    startTransition(() => cloneScenarioAction(projectId, scenarioId));
                  }}
                >
                  Clone
                </button>
                <Link href={base} className="text-sm text-basin-700 hover:underline">
                  Comparison
                </Link>
              </div>
            </div>
          </div>
        </form>
      </FormProvider>
    </UnitsProvider>
  );
}

function ErrorSummary({ control, serverErrors }: { control: Control<V>; serverErrors: FieldErrorMap }) {
  const { errors, submitCount } = useFormState({ control });
  return <FormErrorSummary errors={errors} serverErrors={serverErrors} focusKey={submitCount} />;
}

function DirtyNote({ control, revision, dirtyRef }: { control: Control<V>; revision: number; dirtyRef: React.MutableRefObject<boolean> }) {
  const { isDirty } = useFormState({ control });
  // After every commit (no deps on purpose): the guards read it in event handlers, and a handler that
  // cleared it before leaving is overridden again by the next render, as when it was set during render.
  useEffect(() => {
    dirtyRef.current = isDirty;
  });
  return (
    <span className="text-xs text-ink-soft" aria-live="polite" data-testid="dirty-note">
      Revision {revision}
      {isDirty ? " · unsaved changes" : " · no unsaved changes"}
    </span>
  );
}
