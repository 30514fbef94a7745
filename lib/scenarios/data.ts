import "server-only";
/**
 * The scenario data access layer for pages, server actions and route handlers: every function resolves
 * the request's viewer, authorizes through lib/auth (404 without a relation, 403 without the action),
 * writes the audit trail and returns DTOs only. The work itself is in ./store, ./analysis and ./jobs.
 */
import { forbidden, notFound } from "next/navigation";
import { db } from "@/db";
import { writeAudit } from "@/db/queries/audit";
import { findIssuedVersion, listScenarioSummaries } from "@/db/queries/scenarios";
import { latestResultsOfKind } from "@/db/queries/results";
import { authorizeProject, loadProjectAccess, REFUSALS, type ProjectAccess, type Refusal, type Viewer } from "@/lib/auth/access";
import type { Action } from "@/lib/auth/permissions";
import { currentViewer, isUuid, requireViewer } from "@/lib/auth/session";
import type { ScenarioResult } from "@/lib/engine";
import type { ScenarioInput } from "@/lib/engine/input";
import { analyzeAndStore, monteCarloStatusOf, storedFor, type StoredAnalysis } from "./analysis";
import { findResult } from "@/db/queries/results";
import { ENGINE_VERSION } from "@/lib/engine";
import { upgradeStoredResult } from "@/lib/engine/legacy";
import { kickJobs } from "./jobs";
import { buildEngineInput, withClimateData, cloneScenario, createScenario, loadScenarioContext, saveScenario, archiveScenario, type ScenarioContext, type SaveOutcome } from "./store";
import type { ScenarioDocument } from "./mappers";
import { Lru } from "./cache";

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
  latest: { lowestLabel: string; marginLcc: number | null; analysedAt: string; studyPeriodYears: number } | null;
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
  return db
    .selectFrom("climate_datasets")
    .select(["id", "name", "source_kind as sourceKind", "hours_total as hoursTotal", "record_count as recordCount", "created_at as createdAt"])
    .where("project_id", "=", projectId)
    .orderBy("created_at", "desc")
    .execute();
}

export async function createScenarioFor(access: ProjectAccess, a: { name: string; climateDatasetId: string | null }) {
  if (!access.can("scenario.edit")) return { ok: false as const, fieldErrors: { "": ["You may not create scenarios in this project."] } };
  const r = await createScenario(db, { projectId: access.project.id, name: a.name, climateDatasetId: a.climateDatasetId, userId: access.viewer.id });
  if (r.ok) {
    await writeAudit(db, {
      actorId: access.viewer.id,
      firmId: access.project.firmId,
      projectId: access.project.id,
      action: "scenario.create",
      targetType: "scenario",
      targetId: r.id,
      detail: { name: a.name.trim() },
    });
  }
  return r;
}

export type SaveAndAnalyse =
  | (Extract<SaveOutcome, { ok: true }> & { analysis: StoredAnalysis })
  | Exclude<SaveOutcome, { ok: true }>;

/** Save (optimistic concurrency) and analyse; queue the Monte Carlo for after the response. */
export async function saveAndAnalyse(
  sa: ScenarioAccess,
  a: { expectedRevision: number; name: string; climateDatasetId: string | null; document: unknown },
  schedule: (task: () => void) => void,
): Promise<SaveAndAnalyse> {
  const { access, ctx } = sa;
  const saved = await saveScenario(db, {
    scenarioId: ctx.row.id,
    expectedRevision: a.expectedRevision,
    name: a.name,
    climateDatasetId: a.climateDatasetId,
    document: a.document,
    userId: access.viewer.id,
  });
  if (!saved.ok) return saved;
  const analysis = await analyzeAndStore(db, ctx.row.id, saved.input);
  await writeAudit(db, {
    actorId: access.viewer.id,
    firmId: access.project.firmId,
    projectId: access.project.id,
    action: "scenario.save",
    targetType: "scenario",
    targetId: ctx.row.id,
    detail: { revision: saved.revision, inputsHash: analysis.inputsHash, reusedResult: analysis.reused, analysisMs: Math.round(analysis.elapsedMs) },
  });
  if (analysis.monteCarlo && (analysis.monteCarlo.status === "queued" || analysis.monteCarlo.status === "running")) schedule(() => kickJobs(db));
  return { ...saved, analysis };
}

export async function cloneScenarioFor(sa: ScenarioAccess, name?: string) {
  const r = await cloneScenario(db, { scenarioId: sa.ctx.row.id, userId: sa.access.viewer.id, ...(name ? { name } : {}) });
  if (r) {
    await writeAudit(db, {
      actorId: sa.access.viewer.id,
      firmId: sa.access.project.firmId,
      projectId: sa.access.project.id,
      action: "scenario.clone",
      targetType: "scenario",
      targetId: r.id,
      detail: { from: sa.ctx.row.id, name: r.name },
    });
  }
  return r;
}

export async function archiveScenarioFor(sa: ScenarioAccess, archived: boolean) {
  const r = await archiveScenario(db, { scenarioId: sa.ctx.row.id, archived, userId: sa.access.viewer.id });
  await writeAudit(db, {
    actorId: sa.access.viewer.id,
    firmId: sa.access.project.firmId,
    projectId: sa.access.project.id,
    action: archived ? "scenario.archive" : "scenario.restore",
    targetType: "scenario",
    targetId: sa.ctx.row.id,
  });
  return r;
}

export interface DraftView {
  input: ScenarioInput | null;
  inputErrors: Record<string, string[]> | null;
  result: ScenarioResult | null;
  inputsHash: string | null;
  monteCarlo: Awaited<ReturnType<typeof storedFor>>["monteCarlo"];
}

/**
 * The draft's engine input and its stored result. When the stored document is valid but has no result
 * for the current engine version (a new engine, a changed dataset or site), it is analysed now.
 */
export async function draftView(sa: ScenarioAccess, schedule: (task: () => void) => void): Promise<DraftView> {
  const cached = await draftSource(sa);
  if (cached) {
    const mc = monteCarloStatusOf(await findResult(db, sa.ctx.row.id, ENGINE_VERSION, cached.inputsHash, "monteCarlo"));
    if (mc && (mc.status === "queued" || mc.status === "running")) schedule(() => kickJobs(db));
    return { input: cached.input, inputErrors: null, result: cached.result, inputsHash: cached.inputsHash, monteCarlo: mc };
  }
  const full = await withClimateData(db, sa.ctx);
  const built = buildEngineInput(full.dto.document as ScenarioDocument, full.dataset, full.project);
  if (!built.ok) return { input: null, inputErrors: built.fieldErrors, result: null, inputsHash: null, monteCarlo: null };
  const a = await analyzeAndStore(db, sa.ctx.row.id, built.input);
  if (a.monteCarlo && (a.monteCarlo.status === "queued" || a.monteCarlo.status === "running")) schedule(() => kickJobs(db));
  return { input: built.input, inputErrors: null, result: a.result, inputsHash: a.inputsHash, monteCarlo: a.monteCarlo };
}

/** The issued version a viewer may see (a number, or the latest), with its frozen input and result. */
export async function issuedVersionOf(scenarioId: string, versionNumber?: number) {
  return findIssuedVersion(db, scenarioId, versionNumber);
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

// --- what-if and results sources ------------------------------------------------------------------

type Source = { input: ScenarioInput; result: ScenarioResult; inputsHash: string; version: number | null };
const g = globalThis as unknown as { loopledgerWhatIfCache?: Lru<Source> };
const draftCache = (g.loopledgerWhatIfCache ??= new Lru<Source>(32));

/** The draft's input and its stored result (null when the current inputs have none yet). */
export async function draftSource(sa: ScenarioAccess): Promise<Source | null> {
  const { ctx } = sa;
  const key = [ctx.row.id, ctx.row.revision, ctx.row.climateDatasetId, ctx.project.elevationM, ctx.project.locationLabel].join("|");
  const hit = draftCache.get(key);
  if (hit) return hit;
  const full = await withClimateData(db, ctx);
  const built = buildEngineInput(full.dto.document, full.dataset, full.project);
  if (!built.ok) return null;
  const stored = await storedFor(db, ctx.row.id, built.input);
  if (!stored.result) return null;
  const src = { input: built.input, result: stored.result, inputsHash: stored.inputsHash, version: null };
  draftCache.set(key, src);
  return src;
}

/**
 * An issued version's frozen input and result, in the engine's shape. Versions freeze either the full
 * engine input or the stored document (climate as a dataset reference); the economics need neither the
 * climate nor the site, so both work for the what-if and the results API.
 */
export function issuedSource(v: NonNullable<Awaited<ReturnType<typeof findIssuedVersion>>>): Source {
  return { input: v.input as ScenarioInput, result: upgradeStoredResult(v.result as ScenarioResult), inputsHash: v.inputsHash, version: v.versionNumber };
}
