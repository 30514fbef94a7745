import type { Executor } from "@/db/schema";
import { findFirmMemberName } from "@/db/queries/report-sources";
import type { UnitSystem } from "@/lib/auth/roles";
import { fail, type Result } from "@/lib/result";
import type { ResolvedResult } from "@/lib/scenarios/resolve";
import { fmtDate } from "./format";
import { readEngineResult } from "./result";
import { ReportDataError, type ReportSource } from "./types";

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/**
 * A report's source from the resolved result (lib/scenarios/resolve.ts): the same input and result the
 * comparison page shows for this viewer — the draft's result for its current inputs, or the issued
 * version — with the yearly cash flows already withheld where the viewer may not see them.
 * 409 when the stored result cannot make a report.
 */
export async function reportSourceOf(db: Executor, r: ResolvedResult, units: UnitSystem | null): Promise<Result<ReportSource>> {
  const { access, scenario } = r;
  const p = access.project;
  let result;
  try {
    result = readEngineResult(r.result);
  } catch (e) {
    if (e instanceof ReportDataError) return fail(409, e.message);
    throw e;
  }
  const input = isObject(r.input) && isObject(r.input.site) ? r.input : { ...(r.input as object), site: { elevationM: p.elevationM, locationLabel: p.locationLabel } };
  const consultantName = r.authorId ? await findFirmMemberName(db, r.authorId, p.firmId) : null;
  const savedAt = scenario.row.updatedAt;
  return {
    ok: true,
    value: {
      project: {
        id: p.id,
        name: p.name,
        clientName: p.clientName,
        siteName: p.siteName,
        locationLabel: p.locationLabel,
        elevationM: p.elevationM,
        currency: p.currency,
        firmName: p.firmName,
      },
      scenarioId: scenario.row.id,
      scenarioName: r.name,
      versionNumber: r.versionNumber,
      versionLabel:
        r.kind === "issued"
          ? `Version ${r.versionNumber}`
          : `Working draft (not issued; revision ${scenario.row.revision} as saved ${fmtDate(savedAt)})`,
      input,
      result,
      unitSystem: units ?? p.unitSystem,
      preparedBy: { firmName: p.firmName, consultantName },
      issuedAt: r.issuedAt,
      resultAt: r.issuedAt ?? savedAt,
      engineVersion: r.engineVersion,
      cashFlowsWithheld: r.cashFlowsWithheld,
    },
  };
}
