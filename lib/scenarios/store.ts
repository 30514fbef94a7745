/**
 * Executor-first core of the scenario data layer: load, validate, create, save with optimistic
 * concurrency, clone and archive. It does not authorize — lib/scenarios/data.ts does, for the request's
 * viewer, before calling here; tests call it with their own executor.
 */
import type { Executor } from "@/db/schema";
import { findScenario, findScenarioLastSave, insertScenario, setScenarioArchived, updateScenarioAtRevision, type ScenarioRow } from "@/db/queries/scenarios";
import { findProjectSite } from "@/db/queries/projects";
import { findProjectClimateDataset } from "@/db/queries/climate";
import type { FieldErrorMap } from "@/lib/result";
import { isUuid } from "@/lib/auth/access";
import type { ScenarioInput } from "@/lib/engine/input";
import { climateInputFromDataset, documentFromStored, toEngineInputDraft, toScenarioDTO, toStoredInput, type ClimateDatasetLike, type ProjectSiteLike, type ScenarioDocument, type ScenarioDTO } from "./mappers";
import { defaultScenario } from "./schema";
import { parseScenarioDocument, PLACEHOLDER_CLIMATE } from "./validate";


export const SCENARIO_INPUT_VERSION = 1;

export interface ScenarioContext {
  row: ScenarioRow;
  dto: ScenarioDTO;
  project: ProjectSiteLike & { id: string; unitSystem: "IP" | "SI"; currency: string; name: string };
  dataset: (ClimateDatasetLike & { projectId: string }) | null;
}

/**
 * A climate dataset of this project (never another project's), with its stored data — or without it
 * (`data: null`) where only its name is needed: the hourly arrays are the bulk of a scenario's reads.
 */
export async function loadDataset(db: Executor, projectId: string, datasetId: string | null, withData = true) {
  // A malformed id names no dataset (PostgreSQL would refuse it as a uuid).
  if (!datasetId || !isUuid(datasetId)) return null;
  const ds = await findProjectClimateDataset(db, projectId, datasetId, withData);
  return ds ? { data: null as unknown, ...ds } : null;
}

export async function loadScenarioContext(db: Executor, scenarioId: string, opts: { withClimateData?: boolean } = {}): Promise<ScenarioContext | null> {
  const row = await findScenario(db, scenarioId);
  if (!row) return null;
  const project = await findProjectSite(db, row.projectId);
  if (!project) return null;
  const dataset = await loadDataset(db, row.projectId, row.climateDatasetId, opts.withClimateData ?? true);
  return { row, dto: toScenarioDTO(row), project, dataset };
}

/** The context with the dataset's data, loading it when the context was read without. */
export async function withClimateData(db: Executor, ctx: ScenarioContext): Promise<ScenarioContext> {
  if (!ctx.dataset || ctx.dataset.data !== null) return ctx;
  return { ...ctx, dataset: await loadDataset(db, ctx.row.projectId, ctx.dataset.id, true) };
}

export type EngineInputOutcome =
  | { ok: true; input: ScenarioInput }
  | { ok: false; fieldErrors: FieldErrorMap };

const NO_CLIMATE: FieldErrorMap = {
  climateDatasetId: ["Choose the climate dataset this scenario runs on (import one on the project page first)."],
};

/** Document + the project's site + the dataset's climate → a validated engine input, or every field error. */
export function buildEngineInput(
  document: ScenarioDocument,
  dataset: ClimateDatasetLike | null,
  site: ProjectSiteLike & { unitSystem?: "IP" | "SI"; currency?: string },
): EngineInputOutcome {
  if (!dataset) return { ok: false, fieldErrors: NO_CLIMATE };
  let climate;
  try {
    climate = climateInputFromDataset(dataset);
  } catch (err) {
    return { ok: false, fieldErrors: { climateDatasetId: [(err as Error).message] } };
  }
  const units = site.unitSystem && site.currency ? { system: site.unitSystem, currency: site.currency } : undefined;
  const parsed = parseScenarioDocument(toEngineInputDraft(document, climate, site), units);
  if (parsed.ok) return { ok: true, input: parsed.value };
  // Problems inside the dataset's arrays belong to the dataset picker, not to a form field.
  const fieldErrors: FieldErrorMap = {};
  for (const [path, messages] of Object.entries(parsed.fieldErrors)) {
    const key = path === "climate" || path.startsWith("climate.") ? "climateDatasetId" : path.startsWith("site.") ? "" : path;
    (fieldErrors[key] ??= []).push(...messages);
  }
  return { ok: false, fieldErrors };
}

export async function engineInputOf(db: Executor, ctx: ScenarioContext): Promise<EngineInputOutcome> {
  void db;
  return buildEngineInput(ctx.dto.document, ctx.dataset, ctx.project);
}

/** A new scenario from `defaultScenario`, on a dataset of the project. */
export async function createScenario(
  db: Executor,
  a: { projectId: string; name: string; climateDatasetId: string | null; userId: string | null; document?: ScenarioDocument },
): Promise<{ ok: true; id: string; revision: number } | { ok: false; fieldErrors: FieldErrorMap }> {
  const name = a.name.trim();
  if (!name) return { ok: false, fieldErrors: { name: ["Give the scenario a name."] } };
  if (name.length > 200) return { ok: false, fieldErrors: { name: ["Keep the name under 200 characters."] } };
  const dataset = await loadDataset(db, a.projectId, a.climateDatasetId);
  if (a.climateDatasetId && !dataset) return { ok: false, fieldErrors: { climateDatasetId: ["That climate dataset is not in this project."] } };
  const document = a.document ?? documentFromStored(defaultScenario(PLACEHOLDER_CLIMATE));
  const doc = { ...document, name } as ScenarioDocument;
  const row = await insertScenario(db, {
    projectId: a.projectId,
    name,
    climateDatasetId: dataset?.id ?? null,
    input: dataset ? toStoredInput(doc, dataset.id) : doc,
    inputVersion: SCENARIO_INPUT_VERSION,
    userId: a.userId,
  });
  return { ok: true, id: row.id, revision: row.revision };
}

export type SaveOutcome =
  | { ok: true; revision: number; input: ScenarioInput }
  | { ok: false; kind: "invalid"; fieldErrors: FieldErrorMap }
  | { ok: false; kind: "conflict"; message: string; currentRevision: number; savedAt: string; savedBy: string | null }
  | { ok: false; kind: "archived"; message: string }
  | { ok: false; kind: "notFound" };

/**
 * Validate and store an edited document. The write happens only when the stored revision is still the
 * one the editor loaded: a stale save is refused and nothing is overwritten (the client keeps what was typed).
 */
export async function saveScenario(
  db: Executor,
  a: { scenarioId: string; expectedRevision: number; name: string; climateDatasetId: string | null; document: unknown; userId: string | null },
): Promise<SaveOutcome> {
  const row = await findScenario(db, a.scenarioId);
  if (!row) return { ok: false, kind: "notFound" };
  if (row.archivedAt) return { ok: false, kind: "archived", message: "This scenario is archived; restore it or clone it to edit." };
  const project = await findProjectSite(db, row.projectId);
  if (!project) return { ok: false, kind: "notFound" };
  const name = a.name.trim();
  const dataset = await loadDataset(db, row.projectId, a.climateDatasetId);
  const docIn = (a.document && typeof a.document === "object" ? a.document : {}) as Record<string, unknown>;
  const built = buildEngineInput({ ...(docIn as unknown as ScenarioDocument), name }, dataset, project);
  const nameErrors: FieldErrorMap = name ? {} : { name: ["Give the scenario a name."] };
  if (!built.ok || !name) {
    return { ok: false, kind: "invalid", fieldErrors: { ...(built.ok ? {} : built.fieldErrors), ...nameErrors } };
  }
  if (row.revision !== a.expectedRevision) return conflict(db, a.scenarioId);
  const updated = await updateScenarioAtRevision(db, a.scenarioId, a.expectedRevision, {
    name,
    climateDatasetId: dataset!.id,
    input: toStoredInput(built.input, dataset!.id),
    inputVersion: SCENARIO_INPUT_VERSION,
    userId: a.userId,
  });
  if (!updated) return conflict(db, a.scenarioId);
  return { ok: true, revision: updated.revision, input: built.input };
}

async function conflict(db: Executor, scenarioId: string): Promise<SaveOutcome> {
  const now = await findScenarioLastSave(db, scenarioId);
  if (!now) return { ok: false, kind: "notFound" };
  const at = now.updatedAt.toISOString();
  return {
    ok: false,
    kind: "conflict",
    currentRevision: now.revision,
    savedAt: at,
    savedBy: now.updatedByName ?? null,
    message:
      `Not saved: ${now.updatedByName ?? "someone"} saved this scenario (revision ${now.revision}) after you opened it. ` +
      "Nothing was overwritten and your edits are still in the form — copy them, then reload to see the newer version.",
  };
}

/** Copy a scenario (its stored document and dataset) under a new name; results are not copied. */
export async function cloneScenario(db: Executor, a: { scenarioId: string; name?: string; userId: string | null }) {
  const row = await findScenario(db, a.scenarioId);
  if (!row) return null;
  const doc = documentFromStored(row.input);
  const name = (a.name?.trim() || `${row.name} (copy)`).slice(0, 200);
  const input = row.climateDatasetId ? toStoredInput({ ...doc, name }, row.climateDatasetId) : { ...doc, name };
  const created = await insertScenario(db, {
    projectId: row.projectId,
    name,
    climateDatasetId: row.climateDatasetId,
    input,
    inputVersion: row.inputVersion,
    userId: a.userId,
  });
  return { id: created.id, projectId: row.projectId, name };
}

export async function archiveScenario(db: Executor, a: { scenarioId: string; archived: boolean; userId: string | null }) {
  return setScenarioArchived(db, a.scenarioId, a.archived, a.userId);
}
