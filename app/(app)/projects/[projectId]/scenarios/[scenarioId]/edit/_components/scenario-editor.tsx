"use client";

import {
  useCallback,
  useEffect,
  useMemo,
  useRef,
  useState,
  useSyncExternalStore,
  useTransition,
} from "react";
import Link from "next/link";
import {
  FormProvider,
  useFieldArray,
  useForm,
  useFormState,
  useWatch,
  type Control,
  type Resolver,
} from "react-hook-form";
import { SelectField, TextField, UnitsProvider, fieldId } from "@/components/forms";
import {
  EDITOR_SECTIONS,
  editorPlaceQuery,
  optionIndexOfSection,
  optionSectionId,
  parsePart,
  parseSection,
  partOfPath,
  partsOfSection,
  sectionOrder,
  type EconomicsPartId,
  type EditorValues,
  type OptionPartId,
  type PartId,
  type SectionId,
} from "@/lib/scenarios/editor-values";
import {
  statusByPart,
  statusBySection,
  validateEditorValues,
  type EditorProblem,
  type SectionStatus,
} from "@/lib/scenarios/editor-validation";
import { placeOf, placeText, type MessageContext } from "@/lib/scenarios/field-messages";
import { OPTION_KIND_LABELS } from "@/lib/engine/types";
import type { UnitSystem } from "@/lib/units";
import { cloneScenarioAction, saveScenarioAction } from "../../actions";
import { toFormErrors } from "./form-errors";
import { RatingFitsContext, type RatingFits } from "./rating-points";
import {
  DutySection,
  EconomicsSection,
  OptionSection,
  OptionsList,
  Section,
  TariffsSection,
  UpkeepSection,
  WaterSection,
} from "./sections";

type V = EditorValues;

/** The editor's current problems (all sections), for the section list and the summary. */
function createProblemStore(initial: EditorProblem[]) {
  let current = initial;
  const listeners = new Set<() => void>();
  return {
    get: () => current,
    set(next: EditorProblem[]) {
      current = next;
      listeners.forEach((l) => l());
    },
    subscribe(l: () => void) {
      listeners.add(l);
      return () => listeners.delete(l);
    },
  };
}
type ProblemStore = ReturnType<typeof createProblemStore>;

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
  initialSection: string | null;
  initialPart: string | null;
  initialProblems: EditorProblem[];
  initialRatingFits: RatingFits;
}) {
  const { projectId, scenarioId } = props;
  const ctx: MessageContext = useMemo(
    () => ({ system: props.unitSystem, currency: props.currency }),
    [props.unitSystem, props.currency],
  );
  const [store] = useState(() => createProblemStore(props.initialProblems));
  // The one scenario schema, run on the editor's values on every change and on save; its problems in the
  // project's units go onto the fields and into the store the section list reads.
  const resolver = useMemo<Resolver<V>>(
    () => async (values) => {
      const problems = validateEditorValues(values, ctx);
      store.set(problems);
      return problems.length === 0 ? { values, errors: {} } : { values: {}, errors: toFormErrors(problems) };
    },
    [ctx, store],
  );
  const form = useForm<V>({
    defaultValues: props.initial,
    resolver,
    mode: "onChange",
    reValidateMode: "onChange",
    shouldUnregister: false,
  });
  const options = useFieldArray<V, "options">({ control: form.control, name: "options" });
  const optionCount = options.fields.length;
  const [active, setActive] = useState<SectionId>(() => parseSection(props.initialSection, optionCount));
  const [activePart, setActivePart] = useState<PartId | null>(() =>
    parsePart(parseSection(props.initialSection, optionCount), props.initialPart),
  );
  const [revision, setRevision] = useState(props.revision);
  const [banner, setBanner] = useState<Banner>(null);
  const [formMessages, setFormMessages] = useState<string[]>([]);
  const [showSummary, setShowSummary] = useState(false);
  const [summaryFocus, setSummaryFocus] = useState(0);
  const [pending, startTransition] = useTransition();
  const [copied, setCopied] = useState<string | null>(null);
  const [ratingFits, setRatingFits] = useState<RatingFits>(props.initialRatingFits);
  const dirtyRef = useRef(false);
  const focusAfterRender = useRef<string | null>(null);
  const base = `/projects/${projectId}/scenarios/${scenarioId}`;
  const order = sectionOrder(optionCount);
  const current = order.includes(active) ? active : "general";
  const currentPart = parsePart(current, activePart);

  /**
   * Open a step (and one of its parts: its first when none is named) and put it in the address. Focus goes to
   * `focus` (a field), else to the step's title; `focus: null` leaves it where it is (a part's own link).
   */
  const select = useCallback((id: SectionId, opts: { part?: PartId | null; focus?: string | null } = {}) => {
    const part = parsePart(id, opts.part);
    setActive(id);
    setActivePart(part);
    focusAfterRender.current = opts.focus === null ? null : (opts.focus ?? `${id}-title`);
    const url = new URL(window.location.href);
    url.searchParams.set("section", id);
    if (part) url.searchParams.set("part", part);
    else url.searchParams.delete("part");
    url.hash = "";
    window.history.pushState(null, "", url.toString());
  }, []);

  useEffect(() => {
    const id = focusAfterRender.current;
    if (!id) return;
    focusAfterRender.current = null;
    const el = document.getElementById(id);
    if (el) {
      el.focus({ preventScroll: true });
      el.scrollIntoView({ block: "center" });
    }
  });

  // Back and forward move between sections as they were opened.
  useEffect(() => {
    const onPop = () => {
      const params = new URL(window.location.href).searchParams;
      const section = parseSection(params.get("section"), options.fields.length);
      setActive(section);
      setActivePart(parsePart(section, params.get("part")));
    };
    window.addEventListener("popstate", onPop);
    return () => window.removeEventListener("popstate", onPop);
  }, [options.fields.length]);

  // A warning before leaving with unsaved changes: closing or reloading the tab, and links in the app.
  useEffect(() => {
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      if (!dirtyRef.current) return;
      e.preventDefault();
      e.returnValue = "";
    };
    const onClick = (e: MouseEvent) => {
      if (!dirtyRef.current || e.defaultPrevented || e.button !== 0 || e.metaKey || e.ctrlKey || e.shiftKey)
        return;
      const a = (e.target as HTMLElement | null)?.closest?.("a[href]") as HTMLAnchorElement | null;
      if (
        !a ||
        a.target === "_blank" ||
        a.hasAttribute("download") ||
        a.hasAttribute("data-section-link") ||
        a.getAttribute("href")?.startsWith("#")
      )
        return;
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
      setShowSummary(false);
      startTransition(async () => {
        const { climateDatasetId, ...document } = values;
        let r: Awaited<ReturnType<typeof saveScenarioAction>>;
        try {
          r = await saveScenarioAction(projectId, scenarioId, {
            revision,
            name: values.name ?? "",
            climateDatasetId: climateDatasetId || null,
            document,
          });
        } catch {
          setBanner({
            kind: "error",
            text: "The server could not be reached. Nothing was saved; your edits are still here — try again.",
          });
          return;
        }
        if (r.ok) {
          const v = r.value;
          setRevision(v.revision);
          setRatingFits(v.ratingFits ?? {});
          setFormMessages([]);
          form.reset(form.getValues(), { keepValues: true });
          setBanner({
            kind: "saved",
            text:
              `Saved as revision ${v.revision}. ` +
              (v.reusedResult
                ? "The stored result for these inputs was reused."
                : v.analysis === "done"
                  ? `Analysed in ${(v.analysisMs / 1000).toFixed(1)} s.`
                  : v.analysis === "failed"
                    ? `The analysis failed: ${v.analysisError ?? "unknown error"}`
                    : "The analysis is still running; the comparison shows it when it is ready.") +
              (v.firstCostsMissing.length > 0
                ? ` First costs are still missing for ${v.firstCostsMissing.join(", ")}: the life-cycle cost waits for them.`
                : "") +
              (v.monteCarlo === "queued" || v.monteCarlo === "running"
                ? " Monte Carlo runs in the background."
                : ""),
          });
          return;
        }
        const problems = r.detail?.problems;
        if (problems) {
          // Field problems go onto their fields and into the summary; only form-level ones stay as text.
          const fieldProblems: EditorProblem[] = [];
          const formLevel: string[] = [];
          for (const p of problems) {
            if (!p.path) formLevel.push(p.message);
            else fieldProblems.push(p);
          }
          for (const p of fieldProblems)
            form.setError(p.path as Parameters<typeof form.setError>[0], {
              type: "server",
              message: p.message,
            });
          const merged = [...store.get()];
          for (const p of fieldProblems)
            if (!merged.some((m) => m.path === p.path && m.message === p.message)) merged.push(p);
          store.set(merged);
          setFormMessages(formLevel);
          setShowSummary(true);
          setSummaryFocus((n) => n + 1);
          setBanner({ kind: "error", text: r.error });
          return;
        }
        const conflict = r.detail?.conflict;
        if (conflict) {
          setBanner({ kind: "conflict", text: r.error, currentRevision: conflict.currentRevision });
          return;
        }
        setBanner({
          kind: "error",
          text:
            r.status === 401
              ? "Your session has ended: sign in again (your edits stay in this tab)."
              : r.error,
        });
      });
    },
    [form, projectId, revision, scenarioId, store],
  );

  const onInvalid = useCallback(() => {
    setShowSummary(true);
    setSummaryFocus((n) => n + 1);
    setBanner({ kind: "error", text: "Not saved: fix the fields listed at the top first." });
  }, []);

  const copyInputs = useCallback(async () => {
    const text = JSON.stringify(form.getValues(), null, 2);
    try {
      await navigator.clipboard.writeText(text);
      setCopied("Your inputs are on the clipboard as JSON.");
    } catch {
      setCopied(text);
    }
  }, [form]);

  const datasetOptions = useMemo(
    () => props.datasets.map((d) => ({ value: d.id, label: d.name })),
    [props.datasets],
  );
  // Previous and next walk the parts of a step, then the steps (entering a step at its first part).
  const places = order.flatMap((id) => {
    const parts = partsOfSection(id);
    return parts.length === 0
      ? [{ id, part: null }]
      : parts.map((p) => ({ id, part: p.id as PartId | null }));
  });
  const index = places.findIndex((p) => p.id === current && p.part === currentPart);
  const prev = index > 0 ? places[index - 1]! : null;
  const next = index >= 0 && index < places.length - 1 ? places[index + 1]! : null;
  const optionIndex = optionIndexOfSection(current);
  // From one option's part to another option: the same part (first costs option after option).
  const navPart = (id: SectionId): PartId | null =>
    optionIndex !== null && optionIndexOfSection(id) !== null && id !== current ? currentPart : null;
  const partNav = (
    <PartNav
      control={form.control}
      store={store}
      section={current}
      active={currentPart}
      onSelect={(part) => select(current, { part, focus: null })}
    />
  );

  return (
    <UnitsProvider system={props.unitSystem} currency={props.currency}>
      <RatingFitsProvider control={form.control} fits={ratingFits}>
        <FormProvider {...form}>
          <form
            method="post"
            noValidate
            onSubmit={form.handleSubmit(save, onInvalid)}
            className="grid gap-6 lg:grid-cols-[15rem_1fr]"
            data-testid="scenario-editor"
            aria-label="Scenario inputs"
          >
            <SectionNav
              control={form.control}
              store={store}
              order={order}
              active={current}
              partOf={navPart}
              onSelect={(id) => select(id, { part: navPart(id) })}
            />
            <div className="min-w-0 space-y-6">
              {showSummary ? (
                <ProblemSummary
                  control={form.control}
                  store={store}
                  formMessages={formMessages}
                  focusKey={summaryFocus}
                  onGo={(path) =>
                    select(sectionOfProblem(store, path), { part: partOfPath(path), focus: fieldId(path) })
                  }
                />
              ) : null}
              <div id="editor-panel" aria-live="off">
                {current === "general" ? (
                  <Section
                    id="general"
                    title="General"
                    intro="Name the scenario, choose the climate it runs on and the options it compares."
                  >
                    <div className="grid gap-4 sm:grid-cols-2">
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
                    <GeneralOptions
                      control={form.control}
                      onAdd={(o) => options.append(o)}
                      onOpen={(i) => select(optionSectionId(i))}
                    />
                  </Section>
                ) : null}
                {current === "duty" ? <DutySection /> : null}
                {optionIndex !== null && options.fields[optionIndex] ? (
                  <OptionSection
                    key={options.fields[optionIndex].id}
                    i={optionIndex}
                    part={(currentPart ?? "selection") as OptionPartId}
                    partNav={partNav}
                    canRemove={optionCount > 2}
                    onRemove={() => {
                      if (!window.confirm(`Remove option ${optionIndex + 1} and everything entered for it?`))
                        return;
                      options.remove(optionIndex);
                      select("general");
                    }}
                  />
                ) : null}
                {current === "water" ? <WaterSection /> : null}
                {current === "upkeep" ? <UpkeepSection /> : null}
                {current === "tariffs" ? <TariffsSection /> : null}
                {current === "economics" ? (
                  <EconomicsSection part={(currentPart ?? "study") as EconomicsPartId} partNav={partNav} />
                ) : null}
              </div>
              <div className="flex flex-wrap justify-between gap-2" data-testid="section-steps">
                {prev ? (
                  <a
                    href={editorPlaceQuery(prev.id, prev.part)}
                    data-section-link
                    data-testid="step-prev"
                    className="rounded-md border border-line-strong px-3 py-1.5 text-sm hover:bg-paper-sunk"
                    onClick={(e) => (e.preventDefault(), select(prev.id, { part: prev.part }))}
                  >
                    ← <PlaceTitle control={form.control} id={prev.id} part={prev.part} current={current} />
                  </a>
                ) : (
                  <span />
                )}
                {next ? (
                  <a
                    href={editorPlaceQuery(next.id, next.part)}
                    data-section-link
                    data-testid="step-next"
                    className="rounded-md border border-line-strong px-3 py-1.5 text-sm hover:bg-paper-sunk"
                    onClick={(e) => (e.preventDefault(), select(next.id, { part: next.part }))}
                  >
                    <PlaceTitle control={form.control} id={next.id} part={next.part} current={current} /> →
                  </a>
                ) : null}
              </div>
              <div
                className="sticky bottom-0 z-10 -mx-2 rounded-panel border border-line bg-paper-raised/95 px-4 py-3 shadow-panel backdrop-blur"
                data-testid="save-bar"
              >
                {banner ? (
                  <div
                    role={banner.kind === "saved" ? "status" : "alert"}
                    data-testid={`banner-${banner.kind}`}
                    className={`mb-3 rounded-md border px-3 py-2 text-sm ${
                      banner.kind === "saved"
                        ? "border-ok-600 bg-ok-50 text-ok-600"
                        : banner.kind === "conflict"
                          ? "border-caution-600 bg-caution-50 text-caution-800"
                          : "border-danger-600 bg-danger-50 text-danger-700"
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
                        <button
                          type="button"
                          onClick={copyInputs}
                          className="rounded-md border border-caution-600 bg-paper-raised px-3 py-1.5 text-sm"
                        >
                          Copy my inputs (JSON)
                        </button>
                        <button
                          type="button"
                          onClick={() => {
                            if (
                              window.confirm(
                                `Load revision ${banner.currentRevision}? Your unsaved edits in this tab will be replaced (copy them first).`,
                              )
                            ) {
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
                        <textarea
                          readOnly
                          aria-label="Your inputs as JSON"
                          className="mt-2 h-40 w-full rounded border border-line p-2 font-mono text-xs"
                          value={copied}
                        />
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
                      const note = dirtyRef.current
                        ? "The copy is made from the saved revision: your unsaved edits here are not in it. Clone anyway?"
                        : "Make a copy of this scenario and open it?";
                      if (!window.confirm(note)) return;
                      dirtyRef.current = false;
                      startTransition(async () => {
                        const r = await cloneScenarioAction(projectId, scenarioId);
                        if (!r.ok) setBanner({ kind: "error", text: r.error });
                      });
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
      </RatingFitsProvider>
    </UnitsProvider>
  );
}

/** The last analysis's fits for the rating-point groups; "stale" once the form has unsaved changes. */
function RatingFitsProvider({
  control,
  fits,
  children,
}: {
  control: Control<V>;
  fits: RatingFits;
  children: React.ReactNode;
}) {
  const { isDirty } = useFormState({ control });
  const value = useMemo(() => ({ fits, stale: isDirty }), [fits, isDirty]);
  return <RatingFitsContext.Provider value={value}>{children}</RatingFitsContext.Provider>;
}

function sectionOfProblem(store: ProblemStore, path: string): SectionId {
  return store.get().find((p) => p.path === path)?.section ?? "general";
}

function useProblems(store: ProblemStore) {
  return useSyncExternalStore(store.subscribe, store.get, store.get);
}

/** A section's title: the option's own label for an option section. */
function SectionTitle({ control, id }: { control: Control<V>; id: SectionId }) {
  const i = optionIndexOfSection(id);
  const labels = useWatch({ control, name: "options" });
  if (i === null) return <>{EDITOR_SECTIONS.find((s) => s.id === id)?.title ?? id}</>;
  const o = labels?.[i];
  return <>{`Option ${i + 1}: ${o?.label || (o?.kind ? OPTION_KIND_LABELS[o.kind] : "")}`}</>;
}

/** A prev/next link's text: the part's name within the open step, else the step's (and part's) name. */
function PlaceTitle({
  control,
  id,
  part,
  current,
}: {
  control: Control<V>;
  id: SectionId;
  part: PartId | null;
  current: SectionId;
}) {
  const partTitle = part ? partsOfSection(id).find((p) => p.id === part)?.title : undefined;
  if (partTitle && id === current) return <>{partTitle}</>;
  return (
    <>
      <SectionTitle control={control} id={id} />
      {partTitle ? `: ${partTitle}` : null}
    </>
  );
}

/** A count's words: "2 errors · 1 to fill", or "✓" when there is nothing to do. */
function statusBadge(s: SectionStatus | undefined, firstCostDue = false) {
  const state = s && s.invalid > 0 ? "errors" : s || firstCostDue ? "incomplete" : "complete";
  const badge =
    state === "complete"
      ? "✓"
      : [
          s && s.invalid > 0 ? `${s.invalid} ${s.invalid === 1 ? "error" : "errors"}` : null,
          s && s.missing > 0 ? `${s.missing} to fill` : null,
          firstCostDue ? "first cost" : null,
        ]
          .filter(Boolean)
          .join(" · ");
  return { state, badge } as const;
}

/**
 * The parts of the open step, one shown at a time, each with its own count (the step's count in the list of
 * steps is their sum). Plain links (?section=…&part=…): reachable with Tab, opened with Enter.
 */
function PartNav({
  control,
  store,
  section,
  active,
  onSelect,
}: {
  control: Control<V>;
  store: ProblemStore;
  section: SectionId;
  active: PartId | null;
  onSelect: (part: PartId) => void;
}) {
  const problems = useProblems(store);
  const status = statusByPart(problems, section);
  const i = optionIndexOfSection(section);
  const firstCost = useWatch({ control, name: `options.${i ?? 0}.costs.firstCost` });
  const firstCostDue =
    i !== null &&
    !(firstCost && Object.values(firstCost).some((v) => typeof v === "number" && Number.isFinite(v)));
  const parts = partsOfSection(section);
  if (parts.length === 0) return null;
  return (
    <nav aria-label="Parts of this step" className="mt-3" data-testid="part-nav">
      <ol className="flex flex-wrap gap-1 border-b border-line text-sm">
        {parts.map((p, n) => {
          const { state, badge } = statusBadge(status.get(p.id), p.id === "costs" && firstCostDue);
          const isActive = p.id === active;
          return (
            <li key={p.id}>
              <a
                href={editorPlaceQuery(section, p.id)}
                data-section-link
                data-state={state}
                data-testid={`part-${p.id}`}
                aria-current={isActive ? "step" : undefined}
                onClick={(e) => {
                  e.preventDefault();
                  onSelect(p.id);
                }}
                className={`-mb-px flex items-baseline gap-2 rounded-t-md border px-3 py-1.5 ${isActive ? "border-line border-b-paper-raised bg-paper-raised font-medium text-ink" : "border-transparent text-ink-soft hover:bg-paper-sunk hover:text-ink"}`}
              >
                <span>
                  <span className="mr-1 text-xs text-ink-faint">{String.fromCharCode(97 + n)}.</span>
                  {p.title}
                </span>
                <span
                  className={`shrink-0 text-xs ${state === "complete" ? "text-ok-600" : state === "errors" ? "text-danger-700" : "text-caution-800"}`}
                  aria-label={state === "complete" ? "complete" : badge}
                >
                  {badge}
                </span>
              </a>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}

/**
 * The sections as steps, each with its state: complete, fields to fill, errors. Plain links (?section=…), so
 * they are reachable with Tab, open with Enter, and work before the page's script has loaded.
 */
function SectionNav({
  control,
  store,
  order,
  active,
  partOf,
  onSelect,
}: {
  control: Control<V>;
  store: ProblemStore;
  order: SectionId[];
  active: SectionId;
  /** The part a step's link opens (null: its first). */
  partOf: (id: SectionId) => PartId | null;
  onSelect: (id: SectionId) => void;
}) {
  const problems = useProblems(store);
  const status = statusBySection(problems);
  const options = useWatch({ control, name: "options" });
  // An option without any first-cost item saves and analyses, but its life-cycle cost waits: say so here.
  const noFirstCost = (id: SectionId) => {
    const i = optionIndexOfSection(id);
    const fc = i === null ? undefined : options?.[i]?.costs?.firstCost;
    return i !== null && !(fc && Object.values(fc).some((v) => typeof v === "number" && Number.isFinite(v)));
  };
  return (
    <nav
      aria-label="Sections of the scenario"
      className="lg:sticky lg:top-4 lg:self-start"
      data-testid="section-nav"
    >
      <ol className="flex flex-wrap gap-1 text-sm lg:flex-col">
        {order.map((id, n) => {
          const s = status.get(id);
          const isActive = id === active;
          const firstCostDue = noFirstCost(id);
          const { state, badge } = statusBadge(s, firstCostDue);
          return (
            <li key={id}>
              <a
                href={editorPlaceQuery(id, partOf(id))}
                data-section-link
                data-state={state}
                data-testid={`nav-${id}`}
                aria-current={isActive ? "step" : undefined}
                onClick={(e) => {
                  e.preventDefault();
                  onSelect(id);
                }}
                className={`flex items-baseline justify-between gap-2 rounded-md border px-2 py-1.5 ${isActive ? "border-basin-600 bg-basin-50 font-medium text-ink" : "border-transparent text-ink-soft hover:bg-paper-sunk hover:text-ink"}`}
              >
                <span>
                  <span className="mr-1 text-xs text-ink-faint">{n + 1}.</span>
                  <SectionTitle control={control} id={id} />
                </span>
                <span
                  className={`shrink-0 text-xs ${state === "complete" ? "text-ok-600" : state === "errors" ? "text-danger-700" : "text-caution-800"}`}
                  aria-label={state === "complete" ? "complete" : badge}
                >
                  {badge}
                </span>
              </a>
            </li>
          );
        })}
      </ol>
      <p className="mt-4 hidden text-xs text-ink-faint lg:block">
        ✓ complete · “to fill”: empty fields without a default · “first cost”: the option analyses, its
        life-cycle cost waits for it · errors: values to correct. Values are saved in SI whatever the units
        shown.
      </p>
    </nav>
  );
}

/** Every problem at the top, each named by section, group and label and linked to its field. */
function ProblemSummary({
  control,
  store,
  formMessages,
  focusKey,
  onGo,
}: {
  control: Control<V>;
  store: ProblemStore;
  formMessages: string[];
  focusKey: number;
  onGo: (path: string) => void;
}) {
  const problems = useProblems(store);
  const labels = useWatch({ control, name: "options" });
  const optionLabels = (labels ?? []).map((o) => o?.label ?? "");
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (focusKey) ref.current?.focus();
  }, [focusKey]);
  const count = problems.length + formMessages.length;
  if (count === 0) return <div aria-live="polite" />;
  return (
    <div
      ref={ref}
      tabIndex={-1}
      role="alert"
      data-testid="form-error-summary"
      className="rounded-panel border border-danger-600 bg-danger-50 px-4 py-3 text-sm text-danger-700"
    >
      <p className="font-semibold">
        {count === 1 ? "Fix this problem to save:" : `Fix these ${count} problems to save:`}
      </p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5">
        {formMessages.map((m) => (
          <li key={m}>{m}</li>
        ))}
        {problems.map((p) => (
          <li key={`${p.path}:${p.message}`}>
            <a
              className="underline"
              href={`${editorPlaceQuery(p.section, partOfPath(p.path))}#${fieldId(p.path)}`}
              data-section-link
              onClick={(e) => {
                e.preventDefault();
                onGo(p.path);
              }}
            >
              {placeText(placeOf(p.path, optionLabels))}
            </a>
            : {p.message}
          </li>
        ))}
      </ul>
    </div>
  );
}

function GeneralOptions({
  control,
  onAdd,
  onOpen,
}: {
  control: Control<V>;
  onAdd: Parameters<typeof OptionsList>[0]["onAdd"];
  onOpen: (i: number) => void;
}) {
  const list = useWatch({ control, name: "options" }) ?? [];
  return (
    <OptionsList
      options={list.map((o, i) => ({ key: `${i}-${o.id}`, label: o.label ?? "", kind: o.kind }))}
      onAdd={onAdd}
      onOpen={onOpen}
    />
  );
}

function DirtyNote({
  control,
  revision,
  dirtyRef,
}: {
  control: Control<V>;
  revision: number;
  dirtyRef: React.MutableRefObject<boolean>;
}) {
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
