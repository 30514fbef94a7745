import "server-only";
import { db } from "@/db";
import { writeAudit } from "@/db/queries/audit";
import type { Action } from "@/lib/auth/permissions";
import { UNIT_SYSTEMS, type UnitSystem } from "@/lib/auth/roles";
import { currentViewer } from "@/lib/auth/session";
import { failureResponse } from "@/lib/http";
import { parseVersionParam, resolveScenarioResult } from "@/lib/scenarios/resolve";
import { isoDate } from "./format";
import { reportSourceOf } from "./source";
import type { ReportSource } from "./types";

/** ASCII file-name part: letters, digits, dot, dash; everything else collapsed to one dash. */
export function fileNamePart(s: string, max = 60): string {
  const ascii = s.normalize("NFKD").replace(/[\u0300-\u036f]/g, "");
  const clean = ascii
    .replace(/[^A-Za-z0-9.]+/g, "-")
    .replace(/-+/g, "-")
    .replace(/^[-.]+|[-.]+$/g, "");
  return clean.slice(0, max).replace(/[-.]+$/g, "") || "report";
}

/** "harrowgate-flats-cold-store_base-case_v1_2026-12-01.pdf" */
export function reportFileName(
  src: Pick<ReportSource, "project" | "scenarioName" | "versionNumber" | "issuedAt" | "resultAt">,
  kind: string,
  ext: string,
): string {
  const date = src.issuedAt ?? src.resultAt ?? new Date();
  const version = src.versionNumber !== null ? `v${src.versionNumber}` : "draft";
  return (
    [fileNamePart(src.project.name, 40), fileNamePart(src.scenarioName, 40), version, kind, isoDate(date)]
      .join("_")
      .toLowerCase() + `.${ext}`
  );
}

export type ReportRequest =
  | { ok: false; response: Response }
  | {
      ok: true;
      source: ReportSource;
      audit: (format: string, extra?: Record<string, unknown>) => Promise<void>;
    };

/**
 * Resolve and authorize one report download through the one draft-or-issued resolver
 * (lib/scenarios/resolve.ts): 401 anonymous, 404 an id the viewer cannot see (no hint it exists),
 * 403 lacking the action, 400 a malformed `?version=`; then the report source, shaped by the viewer's
 * rights (no yearly cash flows for the owner).
 */
export async function prepareReportRequest(req: Request, scenarioId: string, action: Action): Promise<ReportRequest> {
  const url = new URL(req.url);
  const viewer = await currentViewer();
  const version = parseVersionParam(url.searchParams.get("version"));
  const unitsParam = url.searchParams.get("units");
  const units = unitsParam && (UNIT_SYSTEMS as readonly string[]).includes(unitsParam) ? (unitsParam as UnitSystem) : null;
  const resolved = await resolveScenarioResult(db, viewer, scenarioId, { action, version: version.ok ? version.value : null });
  if (!resolved.ok) return { ok: false, response: failureResponse(resolved) };
  if (!version.ok) return { ok: false, response: failureResponse(version) };
  const source = await reportSourceOf(db, resolved.value, units);
  if (!source.ok) return { ok: false, response: failureResponse(source) };
  const { access } = resolved.value;
  return {
    ok: true,
    source: source.value,
    audit: (format, extra = {}) =>
      writeAudit(db, {
        actorId: access.viewer.id,
        firmId: access.project.firmId,
        projectId: access.project.id,
        action: "report.download",
        targetType: "scenario",
        targetId: resolved.value.scenario.row.id,
        detail: { format, version: source.value.versionNumber, units: source.value.unitSystem, ...extra },
      }),
  };
}
