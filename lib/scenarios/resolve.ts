import type { Executor } from "@/db/schema";
import { findMonteCarloResult } from "@/db/queries/report-sources";
import { findIssuedVersion } from "@/db/queries/versions";
import { authorizeProject, isUuid, type ProjectAccess, type Viewer } from "@/lib/auth/access";
import type { Action } from "@/lib/auth/permissions";
import type { ScenarioResult } from "@/lib/engine";
import { upgradeStoredResult } from "@/lib/engine/legacy";
import type { MonteCarloResult } from "@/lib/engine/economics/types";
import type { ScenarioInput } from "@/lib/engine/input";
import { fail, REFUSALS, type Result } from "@/lib/result";
import { storedFor, storedMonteCarloFor } from "./analysis";
import { Lru } from "./cache";
import { buildEngineInput, loadScenarioContext, withClimateData, type ScenarioContext } from "./store";
import { shapeResultFor } from "./result-view";

/**
 * The one draft-or-issued resolver of every route, page and report that shows a scenario's result:
 *
 * - the firm (scenario.viewDraft) gets the draft's result for its CURRENT inputs (the same the comparison
 *   page shows), or an issued `version` when one is asked for;
 * - client viewers get an issued version only: the latest, or `version`; a scenario with nothing issued
 *   does not exist for them (404, no hint of what exists);
 * - the result comes back shaped by the viewer's rights (result-view.ts): without scenario.viewCashFlows
 *   the yearly cash flows are withheld, whatever route asked.
 * Refusals: 401 anonymous, 404 unknown id or no relation, 403 a relation without `action`.
 */

export interface ResolvedResult {
  access: ProjectAccess;
  scenario: ScenarioContext;
  kind: "draft" | "issued";
  /** The scenario's name as issued (issued) or as it stands (draft). */
  name: string;
  versionNumber: number | null;
  /** Who issued the version (issued) or last saved the draft. */
  authorId: string | null;
  issuedAt: Date | null;
  /** The engine input the result was computed from (issued: as frozen, which may be the stored document). */
  input: ScenarioInput;
  result: ScenarioResult;
  inputsHash: string;
  engineVersion: string;
  /** Monte Carlo job state of a draft (queued, running, done); null for an issued version. */
  monteCarloJob: Awaited<ReturnType<typeof storedFor>>["monteCarlo"];
  /** True when the yearly cash flows were removed for this viewer. */
  cashFlowsWithheld: boolean;
}

/** `?version=` of a URL: absent → null (latest / draft), a whole number ≥ 1, else 400. */
export function parseVersionParam(raw: string | null): Result<number | null> {
  if (raw === null || raw === "") return { ok: true, value: null };
  if (!/^[1-9][0-9]{0,8}$/.test(raw)) return fail(400, "version must be a whole number ≥ 1.", { version: ["must be a whole number ≥ 1"] });
  return { ok: true, value: Number(raw) };
}

type DraftSource = { input: ScenarioInput; result: ScenarioResult; inputsHash: string; monteCarlo: ResolvedResult["monteCarloJob"] };
const g = globalThis as unknown as { loopledgerDraftCache?: Lru<Omit<DraftSource, "monteCarlo">> };
const draftCache = (g.loopledgerDraftCache ??= new Lru<Omit<DraftSource, "monteCarlo">>(32));

/** The draft's engine input and the stored result for exactly that input (null when it has none yet). */
export async function draftResult(db: Executor, ctx: ScenarioContext, opts: { monteCarlo: boolean } = { monteCarlo: true }): Promise<DraftSource | null> {
  const key = [ctx.row.id, ctx.row.revision, ctx.row.climateDatasetId, ctx.project.elevationM, ctx.project.locationLabel].join("|");
  const hit = draftCache.get(key);
  if (hit) {
    // The input, its hash and its result are the cached ones; only the Monte Carlo job moves on its own.
    return { ...hit, monteCarlo: opts.monteCarlo ? await storedMonteCarloFor(db, ctx.row.id, hit.inputsHash) : null };
  }
  const full = await withClimateData(db, ctx);
  const built = buildEngineInput(full.dto.document, full.dataset, full.project);
  if (!built.ok) return null;
  const stored = await storedFor(db, ctx.row.id, built.input);
  if (!stored.result) return null;
  const src = { input: built.input, result: stored.result, inputsHash: stored.inputsHash };
  draftCache.set(key, src);
  return { ...src, monteCarlo: stored.monteCarlo };
}

function isMonteCarlo(v: unknown): v is MonteCarloResult {
  return typeof v === "object" && v !== null && typeof (v as { draws?: unknown }).draws === "number" && Array.isArray((v as { netSavings?: unknown }).netSavings);
}

/** A Monte Carlo run stored as its own row, merged into the economics when the result has none. */
async function withMonteCarlo(db: Executor, scenarioId: string, result: ScenarioResult, engineVersion: string, inputsHash: string): Promise<ScenarioResult> {
  if (result.economics?.monteCarlo) return result;
  const raw = (await findMonteCarloResult(db, scenarioId, engineVersion, inputsHash))?.result as Record<string, unknown> | undefined;
  const economics = raw?.economics as Record<string, unknown> | undefined;
  const mc = isMonteCarlo(raw) ? raw : isMonteCarlo(raw?.monteCarlo) ? raw.monteCarlo : isMonteCarlo(economics?.monteCarlo) ? economics.monteCarlo : undefined;
  return mc ? { ...result, economics: { ...result.economics, monteCarlo: mc } } : result;
}

export type IssuedVersionRow = NonNullable<Awaited<ReturnType<typeof findIssuedVersion>>>;

/** What a viewer asked for, authorized: the draft (firm only) or an issued version row. */
export type Selection = { access: ProjectAccess; scenario: ScenarioContext } & ({ kind: "draft" } | { kind: "issued"; version: IssuedVersionRow });

/** The draft-or-issued choice and its authorization, without loading a result (the JSON export uses it alone). */
export async function resolveScenarioSelection(
  db: Executor,
  viewer: Viewer | null,
  scenarioId: string,
  opts: { action: Action; version: number | null },
): Promise<Result<Selection>> {
  if (!viewer) return REFUSALS.anonymous;
  if (!isUuid(scenarioId)) return REFUSALS.notFound;
  const ctx = await loadScenarioContext(db, scenarioId, { withClimateData: false });
  if (!ctx) return REFUSALS.notFound;
  const auth = await authorizeProject(db, viewer, ctx.row.projectId, opts.action);
  if (!auth.ok) return auth;
  const { access } = auth;
  const seesDrafts = access.can("scenario.viewDraft");
  if (opts.version === null && seesDrafts) return { ok: true, value: { access, scenario: ctx, kind: "draft" } };
  if (!access.can("scenario.viewIssued")) return REFUSALS.notFound;
  const v = await findIssuedVersion(db, ctx.row.id, opts.version);
  if (!v) {
    return seesDrafts
      ? fail(404, opts.version === null ? "No version of this scenario has been issued yet." : `Version ${opts.version} does not exist.`)
      : REFUSALS.notFound;
  }
  return { ok: true, value: { access, scenario: ctx, kind: "issued", version: v } };
}

export async function resolveScenarioResult(
  db: Executor,
  viewer: Viewer | null,
  scenarioId: string,
  opts: { action: Action; version: number | null; monteCarlo?: boolean },
): Promise<Result<ResolvedResult>> {
  const sel = await resolveScenarioSelection(db, viewer, scenarioId, opts);
  if (!sel.ok) return sel;
  const { access, scenario: ctx } = sel.value;
  const withheld = !access.can("scenario.viewCashFlows");
  // `monteCarlo: false` (the what-if, which re-prices without the draws): the stored Monte Carlo run — ten
  // thousand draws per comparison — is neither read nor merged.
  const wantMonteCarlo = opts.monteCarlo ?? true;

  if (sel.value.kind === "issued") {
    const v = sel.value.version;
    const upgraded = upgradeStoredResult(v.result as ScenarioResult);
    const result = wantMonteCarlo ? await withMonteCarlo(db, ctx.row.id, upgraded, v.engineVersion, v.inputsHash) : upgraded;
    return {
      ok: true,
      value: {
        access,
        scenario: ctx,
        kind: "issued",
        name: v.name || ctx.row.name,
        versionNumber: v.versionNumber,
        authorId: v.issuedBy,
        issuedAt: v.issuedAt,
        input: v.input as ScenarioInput,
        result: shapeResultFor(result, withheld),
        inputsHash: v.inputsHash,
        engineVersion: v.engineVersion,
        monteCarloJob: null,
        cashFlowsWithheld: withheld,
      },
    };
  }

  const draft = await draftResult(db, ctx, { monteCarlo: wantMonteCarlo });
  if (!draft) return fail(409, "The draft has no stored result for its current inputs: complete and save it to analyse it.");
  const mc = draft.monteCarlo?.status === "done" ? draft.monteCarlo.result : null;
  const result = mc && !draft.result.economics.monteCarlo ? { ...draft.result, economics: { ...draft.result.economics, monteCarlo: mc } } : draft.result;
  return {
    ok: true,
    value: {
      access,
      scenario: ctx,
      kind: "draft",
      name: ctx.row.name,
      versionNumber: null,
      authorId: ctx.row.updatedBy ?? ctx.row.createdBy ?? null,
      issuedAt: null,
      input: draft.input,
      result: shapeResultFor(result, withheld),
      inputsHash: draft.inputsHash,
      engineVersion: result.engineVersion,
      monteCarloJob: draft.monteCarlo,
      cashFlowsWithheld: withheld,
    },
  };
}
