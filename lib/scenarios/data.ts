import "server-only";
/**
 * The scenario data access layer for pages, server actions and route handlers: every function resolves
 * the request's viewer, authorizes through lib/auth (404 without a relation, 403 without the action),
 * writes the audit trail and returns DTOs only. The work itself is in ./store and ./analysis; long
 * analyses run in a worker process (lib/jobs), never here.
 */
import { firstCostsMissingLabels } from "./first-costs";
import { forbidden, notFound } from "next/navigation";
import { z } from "zod";
import type { Executor } from "@/db/schema";
import { defineAction } from "@/lib/actions/define";
import { text } from "@/lib/validation/text";
import { MAX_REVISION } from "@/lib/validation/limits";
import type { EditorProblem } from "./editor-validation";
import { sectionOfPath } from "./editor-values";
import { fail, invalid, ok, REFUSALS, type Refusal, type Result } from "@/lib/result";
import { db } from "@/db";
import { writeAudit } from "@/db/queries/audit";
import { listScenarioSummaries } from "@/db/queries/scenarios";
import { listClimateDatasetChoices } from "@/db/queries/climate";
import { inputsHash } from "./hash";
import { latestResultsOfKind } from "@/db/queries/results";
import { authorizeProject, loadProjectAccess, type ProjectAccess, type Viewer } from "@/lib/auth/access";
import type { Action } from "@/lib/auth/permissions";
import { currentViewer, isUuid, requireViewer } from "@/lib/auth/session";
import type { ScenarioResult } from "@/lib/engine";
import type { ScenarioInput } from "@/lib/engine/input";
import type { RatingFitSummary } from "@/lib/engine/types";
import { analyzeAndStore, awaitResult, storedFor, type ResultState, type StoredAnalysis } from "./analysis";
import { findResult } from "@/db/queries/results";
import { ENGINE_VERSION } from "@/lib/engine";
import { inTransaction } from "@/db/transaction";
import { buildEngineInput, withClimateData, cloneScenario, createScenario, loadScenarioContext, saveScenario, archiveScenario, type ScenarioContext } from "./store";
import type { ScenarioDocument } from "./mappers";
import { draftResult } from "./resolve";
import { shapeResultFor } from "./result-view";

const saveSchema = z.object({
  scenarioId: text().max(64),
  revision: z.number().int().min(0).max(MAX_REVISION),
  name: text().max(1000),
  climateDatasetId: text()
    .max(64)
    .nullish()
    .transform((v) => v || null),
  document: z.unknown(),
});

export interface ScenarioAccess {
  access: ProjectAccess;
  ctx: ScenarioContext;
}

/** 401 anonymous; 404 unknown scenario or no relation to its project; 403 a relation without `action`. */
export async function authorizeScenario(
  viewer: Viewer | null,
  scenarioId: string,
  action: Action,
  opts: { withClimateData?: boolean } = {},
): Promise<({ ok: true } & ScenarioAccess) | Refusal> {
  if (!viewer) return REFUSALS.anonymous;
  if (!isUuid(scenarioId)) return REFUSALS.notFound;
  const ctx = await loadScenarioContext(db, scenarioId, opts);
  if (!ctx) return REFUSALS.notFound;
  const auth = await authorizeProject(db, viewer, ctx.row.projectId, action);
  if (!auth.ok) return auth;
  return { ok: true, access: auth.access, ctx };
}

/** For route handlers: the request's viewer, authorized on the scenario. */
export async function authorizeScenarioApi(scenarioId: string, action: Action, opts: { withClimateData?: boolean } = {}) {
  return authorizeScenario(await currentViewer(), scenarioId, action, opts);
}

/** For pages: the scenario in this project (404 when it is another project's), or 404/403. */
export async function requireScenario(projectId: string, scenarioId: string, action: Action, opts: { withClimateData?: boolean } = {}): Promise<ScenarioAccess> {
  const viewer = await requireViewer();
  if (!isUuid(projectId) || !isUuid(scenarioId)) notFound();
  const access = await loadProjectAccess(db, viewer, projectId);
  if (!access) notFound();
  // Client viewers never learn whether a draft id exists.
  if (!access.can("scenario.viewDraft") && action !== "scenario.viewIssued") notFound();
  const ctx = await loadScenarioContext(db, scenarioId, opts);
  if (!ctx || ctx.row.projectId !== projectId) notFound();
  if (!access.can(action)) forbidden();
  return { access, ctx };
}

export interface ScenarioListItem {
  id: string;
  name: string;
  revision: number;
  updatedAt: string;
  updatedByName: string | null;
  climateName: string | null;
  /** The newest stored result's winner and margin (null when never analysed). */
  latest: { lowestLabel: string; marginLcc: number | null; analysedAt: string; studyPeriodYears: number; firstCostsMissing: string[] } | null;
}

/** Draft scenarios of a project with their latest result's headline (firm members only). */
export async function listDraftScenarios(access: ProjectAccess): Promise<ScenarioListItem[]> {
  if (!access.can("scenario.viewDraft")) return [];
  const rows = await listScenarioSummaries(db, access.project.id);
  const results = await latestResultsOfKind(db, rows.map((r) => r.id), "full");
  const byId = new Map(results.map((r) => [r.scenarioId, r]));
  return rows.map((r) => {
    const res = byId.get(r.id);
    const e = (res?.result as ScenarioResult | null | undefined)?.economics;
    const sorted = e ? [...e.options].sort((a, b) => a.lcc - b.lcc) : [];
    return {
      id: r.id,
      name: r.name,
      revision: r.revision,
      updatedAt: r.updatedAt.toISOString(),
      updatedByName: r.updatedByName ?? null,
      climateName: r.climateName ?? null,
      latest:
        e && sorted[0]
          ? {
              lowestLabel: sorted[0].label,
              marginLcc: sorted[1] ? sorted[1].lcc - sorted[0].lcc : null,
              analysedAt: (res?.finishedAt ?? res?.createdAt ?? new Date()).toISOString(),
              studyPeriodYears: e.studyPeriodYears,
              firstCostsMissing: firstCostsMissingLabels(e),
            }
          : null,
    };
  });
}

/** Archived scenarios of a project (firm members only), newest first. */
export async function listArchivedScenarios(access: ProjectAccess): Promise<{ id: string; name: string; archivedAt: string }[]> {
  if (!access.can("scenario.viewDraft")) return [];
  const rows = await listScenarioSummaries(db, access.project.id, { includeArchived: true });
  return rows.filter((r) => r.archivedAt).map((r) => ({ id: r.id, name: r.name, archivedAt: (r.archivedAt as Date).toISOString() }));
}

/** Climate datasets a scenario may use (this project's), newest first. */
export async function listProjectDatasets(projectId: string) {
  return listClimateDatasetChoices(db, projectId);
}

/** The scenario named by the input's `scenarioId`, in the authorized project (404 when it is another project's). */
async function scenarioIn(db: Executor, access: ProjectAccess, scenarioId: string): Promise<Result<ScenarioAccess>> {
  if (!isUuid(scenarioId)) return REFUSALS.notFound;
  const ctx = await loadScenarioContext(db, scenarioId, { withClimateData: false });
  if (!ctx || ctx.row.projectId !== access.project.id) return REFUSALS.notFound;
  return ok({ access, ctx });
}

async function auditOn(db: Executor, access: ProjectAccess, action: string, targetId: string, detail: Record<string, unknown> = {}) {
  await writeAudit(db, {
    actorId: access.viewer.id,
    firmId: access.project.firmId,
    projectId: access.project.id,
    action,
    targetType: "scenario",
    targetId,
    detail,
  });
}

/** "New scenario": from the default scenario on a dataset of the project. Input: `{ projectId, name, climateDatasetId? }`. */
export const createScenarioIn = defineAction({
  gate: { project: "scenario.edit" },
  schema: z.object({
    name: text().trim().min(1, "Give the scenario a name.").max(200, "Keep the name under 200 characters."),
    climateDatasetId: text()
      .max(64)
      .nullish()
      .transform((v) => v || null),
  }),
  run: async (db, { access }, input): Promise<Result<{ id: string; revision: number }>> => {
    const r = await createScenario(db, { projectId: access.project.id, name: input.name, climateDatasetId: input.climateDatasetId, userId: access.viewer.id });
    if (!r.ok) return invalid(r.fieldErrors);
    await auditOn(db, access, "scenario.create", r.id, { name: input.name });
    return ok({ id: r.id, revision: r.revision });
  },
});

export interface SavedScenario {
  revision: number;
  inputsHash: string;
  reusedResult: boolean;
  analysisMs: number;
  monteCarlo: "queued" | "running" | "done" | "failed" | null;
  /** The deterministic analysis: done, still with a worker ("queued"/"running"), or failed (`analysisError`). */
  analysis: "queued" | "running" | "done" | "failed";
  analysisError: string | null;
  warnings: number;
  /** Labels of the options whose first costs are not entered yet (their life-cycle figures wait). */
  firstCostsMissing: string[];
  /** Each option's rating-point fit from this analysis, by option id (empty while it runs). */
  ratingFits: Record<string, RatingFitSummary>;
}

/** The rating-point fits of an analysis result, by option id (results of older engines have none). */
export function ratingFitsOf(result: Pick<ScenarioResult, "physics"> | null | undefined): Record<string, RatingFitSummary> {
  const out: Record<string, RatingFitSummary> = {};
  for (const p of result?.physics ?? []) if (p.ratingFit) out[p.optionId] = p.ratingFit;
  return out;
}

/** The fits of the draft's stored result for its current inputs (none when it has no result yet). */
export async function draftRatingFits(sa: ScenarioAccess): Promise<Record<string, RatingFitSummary>> {
  try {
    return ratingFitsOf((await draftResult(db, sa.ctx))?.result);
  } catch {
    return {};
  }
}

/**
 * How long a save waits for a worker to finish its deterministic analysis before it answers "analysing"
 * (the comparison page then shows the result when it is ready). Waiting only reads; nothing is computed here.
 */
export const SAVE_WAIT_MS = 15_000;

/** The analysis once its queued deterministic row is finished (or as it stands after `waitMs`). */
async function settled(db: Executor, analysis: StoredAnalysis, waitMs: number): Promise<StoredAnalysis> {
  if (!analysis.full || analysis.result) return analysis;
  const t0 = performance.now();
  const row = await awaitResult(db, analysis.full.id, waitMs);
  if (!row) return analysis;
  const full: ResultState = { id: row.id, status: row.status, progress: row.progress, error: row.error };
  const result = row.status === "done" ? (row.result as ScenarioResult) : null;
  return { ...analysis, full, result, elapsedMs: result ? performance.now() - t0 : 0 };
}

/**
 * What a refused save tells the editor: every problem with its section (422), or the newer revision
 * someone else saved first (409).
 */
export interface SaveDetail {
  problems?: EditorProblem[];
  conflict?: { currentRevision: number; savedBy: string | null; savedAt: string };
}

/**
 * Validate with the scenario schema, store when the revision still matches (optimistic concurrency),
 * analyse (stored by engine version + inputs hash) and queue the Monte Carlo. The scenario, its queued
 * analyses and the audit event are written in one transaction: all of them or none. A quick (bin-table)
 * analysis is computed in that transaction; an hourly one is queued for a worker and awaited for up to
 * `opts.waitMs` (SAVE_WAIT_MS). Input: `{ projectId, scenarioId, revision, name, climateDatasetId, document }`.
 * Nothing is stored when validation fails (422) or the save is stale (409 with the newer revision).
 */
export const saveScenarioIn = defineAction<
  { project: "scenario.edit" },
  typeof saveSchema,
  SavedScenario,
  SaveDetail,
  { waitMs: number }
>({
  gate: { project: "scenario.edit" },
  schema: saveSchema,
  invalidMessage: "The save was malformed; reload the page.",
  // The scenario schema checks the document's text and places each message at its field.
  textCheck: "schema",
  run: async (db, { access }, a, opts) => {
    const out = await inTransaction(db, async (trx): Promise<Result<{ saved: { revision: number; input: ScenarioInput }; analysis: StoredAnalysis }, SaveDetail>> => {
      const sa = await scenarioIn(trx, access, a.scenarioId);
      if (!sa.ok) return sa;
      const saved = await saveScenario(trx, {
        scenarioId: a.scenarioId,
        expectedRevision: a.revision,
        name: a.name,
        climateDatasetId: a.climateDatasetId,
        document: a.document,
        userId: access.viewer.id,
      });
      if (!saved.ok) {
        if (saved.kind === "invalid") {
          const problems: EditorProblem[] = Object.entries(saved.fieldErrors).flatMap(([path, messages]) =>
            messages.map((message) => ({
              path,
              section: sectionOfPath(path),
              kind: /^Enter a value/.test(message) ? ("missing" as const) : ("invalid" as const),
              message,
            })),
          );
          const n = problems.length;
          return fail(422, `Not saved: ${n} ${n === 1 ? "problem" : "problems"} to fix (listed at the top).`, saved.fieldErrors, { problems });
        }
        if (saved.kind === "conflict") {
          return fail(409, saved.message, undefined, {
            conflict: { currentRevision: saved.currentRevision, savedBy: saved.savedBy, savedAt: saved.savedAt },
          });
        }
        if (saved.kind === "archived") return fail(409, saved.message);
        return REFUSALS.notFound;
      }
      const analysis = await analyzeAndStore(trx, a.scenarioId, saved.input, { requestedBy: access.viewer.id });
      await auditOn(trx, access, "scenario.save", a.scenarioId, {
        revision: saved.revision,
        inputsHash: analysis.inputsHash,
        reusedResult: analysis.reused,
        analysisMs: Math.round(analysis.elapsedMs),
        analysis: analysis.full?.status ?? null,
      });
      return ok({ saved: { revision: saved.revision, input: saved.input }, analysis });
    });
    if (!out.ok) return out;
    const { saved } = out.value;
    const analysis = await settled(db, out.value.analysis, opts.waitMs ?? SAVE_WAIT_MS);
    return ok({
      revision: saved.revision,
      inputsHash: analysis.inputsHash,
      reusedResult: analysis.reused,
      analysisMs: Math.round(analysis.elapsedMs),
      monteCarlo: analysis.monteCarlo?.status ?? null,
      analysis: analysis.result ? "done" : (analysis.full?.status ?? "queued"),
      analysisError: analysis.full?.status === "failed" ? analysis.full.error : null,
      warnings: analysis.result?.warnings.length ?? 0,
      firstCostsMissing: saved.input.options.filter((o) => o.costs.firstCost === undefined).map((o) => o.label),
      ratingFits: ratingFitsOf(analysis.result),
    });
  },
});

/** Copy a scenario (its document and dataset, not its results). Input: `{ projectId, scenarioId, name? }`. */
export const cloneScenarioIn = defineAction({
  gate: { project: "scenario.edit" },
  schema: z.object({ scenarioId: text().max(64), name: text().trim().max(200).optional() }),
  run: async (db, { access }, a): Promise<Result<{ id: string; name: string }>> => {
    const sa = await scenarioIn(db, access, a.scenarioId);
    if (!sa.ok) return sa;
    const r = await cloneScenario(db, { scenarioId: a.scenarioId, userId: access.viewer.id, ...(a.name ? { name: a.name } : {}) });
    if (!r) return REFUSALS.notFound;
    await auditOn(db, access, "scenario.clone", r.id, { from: a.scenarioId, name: r.name });
    return ok({ id: r.id, name: r.name });
  },
});

/** Archive or restore a scenario. Input: `{ projectId, scenarioId, archived }`. */
export const archiveScenarioIn = defineAction({
  gate: { project: "scenario.edit" },
  schema: z.object({ scenarioId: text().max(64), archived: z.boolean() }),
  run: async (db, { access }, a): Promise<Result<{ archived: boolean }>> => {
    const sa = await scenarioIn(db, access, a.scenarioId);
    if (!sa.ok) return sa;
    await archiveScenario(db, { scenarioId: a.scenarioId, archived: a.archived, userId: access.viewer.id });
    await auditOn(db, access, a.archived ? "scenario.archive" : "scenario.restore", a.scenarioId);
    return ok({ archived: a.archived });
  },
});

export interface DraftView {
  input: ScenarioInput | null;
  inputErrors: Record<string, string[]> | null;
  /** Null while the analysis is queued or running in a worker (see `full`), or when it failed. */
  result: ScenarioResult | null;
  full: ResultState | null;
  inputsHash: string | null;
  monteCarlo: Awaited<ReturnType<typeof storedFor>>["monteCarlo"];
}

/**
 * The draft's engine input and its stored result. When the stored document is valid but has no result
 * for the current engine version (a new engine, a changed dataset or site), its analysis is queued (or
 * run here when quick) and the page shows it as pending.
 */
export async function draftView(sa: ScenarioAccess): Promise<DraftView> {
  const withheld = !sa.access.can("scenario.viewCashFlows");
  const cached = await draftResult(db, sa.ctx);
  if (cached) {
    return { input: cached.input, inputErrors: null, result: shapeResultFor(cached.result, withheld), full: null, inputsHash: cached.inputsHash, monteCarlo: cached.monteCarlo };
  }
  const full = await withClimateData(db, sa.ctx);
  const built = buildEngineInput(full.dto.document as ScenarioDocument, full.dataset, full.project);
  if (!built.ok) return { input: null, inputErrors: built.fieldErrors, result: null, full: null, inputsHash: null, monteCarlo: null };
  const a = await analyzeAndStore(db, sa.ctx.row.id, built.input, { requestedBy: sa.access.viewer.id });
  return { input: built.input, inputErrors: null, result: a.result ? shapeResultFor(a.result, withheld) : null, full: a.full, inputsHash: a.inputsHash, monteCarlo: a.monteCarlo };
}

/** The deterministic result's state of the draft's current inputs while a worker computes it (the page polls it). */
export async function draftAnalysisState(ctx: ScenarioContext) {
  const full = await withClimateData(db, ctx);
  const built = buildEngineInput(full.dto.document, full.dataset, full.project);
  if (!built.ok) return null;
  const row = await findResult(db, ctx.row.id, ENGINE_VERSION, inputsHash(built.input), "full");
  return row ? { status: row.status, progress: row.progress, error: row.error } : null;
}

/** Write an audit event for a scenario (views, downloads). */
export async function auditScenario(sa: ScenarioAccess, action: string, detail: Record<string, unknown> = {}) {
  await writeAudit(db, {
    actorId: sa.access.viewer.id,
    firmId: sa.access.project.firmId,
    projectId: sa.access.project.id,
    action,
    targetType: "scenario",
    targetId: sa.ctx.row.id,
    detail,
  });
}

/** Write an audit event about a resolved result (views, downloads). */
export async function auditResolved(r: { access: ProjectAccess; scenario: ScenarioContext }, action: string, detail: Record<string, unknown> = {}) {
  await auditOn(db, r.access, action, r.scenario.row.id, detail);
}


/** The draft's document with its climate arrays, for the JSON export. */
export async function exportableDraft(ctx: ScenarioContext) {
  return withClimateData(db, ctx);
}
