import "server-only";
import { db } from "@/db";
import {
  findFirmMemberName,
  findIssuedVersion,
  findLatestDoneResult,
  findMonteCarloResult,
  findReportScenario,
} from "@/db/queries/report-sources";
import type { UnitSystem } from "@/lib/auth/roles";
import type { ProjectAccess } from "@/lib/auth/session";
import { ENGINE_VERSION } from "@/lib/engine/version";
import type { MonteCarloResult } from "@/lib/engine/economics/types";
import { fmtDate } from "./format";
import { readEngineResult } from "./result";
import { ReportDataError, type ReportEngineResult, type ReportSource } from "./types";

export type ReportScenario = NonNullable<Awaited<ReturnType<typeof findReportScenario>>>;

export type SourceOutcome =
  { ok: true; source: ReportSource } | { ok: false; status: 404 | 409; error: string };

/** The scenario row a report is for (undefined when it does not exist; authorization comes after). */
export async function reportScenario(scenarioId: string): Promise<ReportScenario | undefined> {
  return findReportScenario(db, scenarioId);
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

function isMonteCarlo(v: unknown): v is MonteCarloResult {
  return (
    isObject(v) && typeof v.draws === "number" && isObject(v.probabilityLowest) && Array.isArray(v.netSavings)
  );
}

/** A Monte Carlo run stored as its own row: merged into the economics when the full result has none. */
async function withMonteCarlo(
  scenarioId: string,
  result: ReportEngineResult,
  engineVersion: string,
  inputsHash: string,
): Promise<ReportEngineResult> {
  if (result.economics.monteCarlo) return result;
  const row = await findMonteCarloResult(db, scenarioId, engineVersion, inputsHash);
  const raw = row?.result;
  const mc = isMonteCarlo(raw)
    ? raw
    : isObject(raw) && isMonteCarlo(raw.monteCarlo)
      ? raw.monteCarlo
      : isObject(raw) && isObject(raw.economics) && isMonteCarlo(raw.economics.monteCarlo)
        ? raw.economics.monteCarlo
        : undefined;
  return mc ? { ...result, economics: { ...result.economics, monteCarlo: mc } } : result;
}

/** The site is the project's; a stored draft document leaves it out. */
function withSite(input: unknown, access: ProjectAccess): unknown {
  const doc = isObject(input) ? input : {};
  if (isObject(doc.site)) return doc;
  return {
    ...doc,
    site: { elevationM: access.project.elevationM, locationLabel: access.project.locationLabel },
  };
}

/**
 * What this viewer may download for this scenario. Client viewers (owner, finance) get an issued version
 * only: the latest, or `version` when it exists. The firm (consultants, admin) get the current draft
 * result, or an issued `version`. 404 when there is nothing the viewer may see (no hint of what exists),
 * 409 when the firm's draft has no finished analysis yet.
 */
export async function resolveReportSource(
  access: ProjectAccess,
  scenario: ReportScenario,
  opts: { version: number | null; units?: UnitSystem | null },
): Promise<SourceOutcome> {
  const seesDrafts = access.can("scenario.viewDraft");
  if (!seesDrafts && !access.can("scenario.viewIssued"))
    return { ok: false, status: 404, error: "Not found." };
  if (!seesDrafts && scenario.archivedAt) return { ok: false, status: 404, error: "Not found." };
  const unitSystem = opts.units ?? access.project.unitSystem;
  const project = {
    id: access.project.id,
    name: access.project.name,
    clientName: access.project.clientName,
    siteName: access.project.siteName,
    locationLabel: access.project.locationLabel,
    elevationM: access.project.elevationM,
    currency: access.project.currency,
    firmName: access.project.firmName,
  };
  try {
    if (opts.version !== null || !seesDrafts) {
      const v = await findIssuedVersion(db, scenario.id, opts.version);
      if (!v) return { ok: false, status: 404, error: "Not found." };
      const consultant = v.issuedBy ? await findFirmMemberName(db, v.issuedBy, access.project.firmId) : null;
      const result = await withMonteCarlo(
        scenario.id,
        readEngineResult(v.result),
        v.engineVersion,
        v.inputsHash,
      );
      return {
        ok: true,
        source: {
          project,
          scenarioId: scenario.id,
          scenarioName: v.name || scenario.name,
          versionNumber: v.versionNumber,
          versionLabel: `Version ${v.versionNumber}`,
          input: withSite(v.input, access),
          result,
          unitSystem,
          preparedBy: { firmName: access.project.firmName, consultantName: consultant },
          issuedAt: v.issuedAt,
          resultAt: v.issuedAt,
          engineVersion: v.engineVersion,
        },
      };
    }
    const r = await findLatestDoneResult(db, scenario.id, ENGINE_VERSION);
    if (!r)
      return { ok: false, status: 409, error: "This scenario has no finished analysis yet: run it first." };
    const author = scenario.updatedBy ?? scenario.createdBy;
    const consultant = author ? await findFirmMemberName(db, author, access.project.firmId) : null;
    const result = await withMonteCarlo(
      scenario.id,
      readEngineResult(r.result),
      r.engineVersion,
      r.inputsHash,
    );
    const at = r.finishedAt ?? r.createdAt;
    const stale = at && scenario.updatedAt > at ? ", inputs edited since" : "";
    return {
      ok: true,
      source: {
        project,
        scenarioId: scenario.id,
        scenarioName: scenario.name,
        versionNumber: null,
        versionLabel: `Working draft (not issued; analysis of ${fmtDate(at)}${stale})`,
        input: withSite(scenario.input, access),
        result,
        unitSystem,
        preparedBy: { firmName: access.project.firmName, consultantName: consultant },
        issuedAt: null,
        resultAt: at,
        engineVersion: r.engineVersion,
      },
    };
  } catch (e) {
    if (e instanceof ReportDataError) return { ok: false, status: 409, error: e.message };
    throw e;
  }
}
