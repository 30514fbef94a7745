import "server-only";
import type { NextResponse } from "next/server";
import { jsonError } from "@/lib/http";
import { db } from "@/db";
import { writeAudit } from "@/db/queries/audit";
import type { Action } from "@/lib/auth/permissions";
import { UNIT_SYSTEMS, type UnitSystem } from "@/lib/auth/roles";
import { authorizeProjectApi, isUuid } from "@/lib/auth/session";
import { isoDate } from "./format";
import { reportScenario, resolveReportSource } from "./source";
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
  | { ok: false; response: NextResponse }
  | {
      ok: true;
      source: ReportSource;
      audit: (format: string, extra?: Record<string, unknown>) => Promise<void>;
    };

function parseVersion(v: string | null): number | null | "bad" {
  if (v === null || v === "") return null;
  return /^[1-9][0-9]{0,5}$/.test(v) ? Number(v) : "bad";
}

/**
 * Resolve and authorize one report download: the scenario's project first (404 for an id the viewer
 * cannot see, with no hint it exists), then the action (401 anonymous, 403 lacking it), then what the
 * viewer may download (the issued version for client viewers, the draft or a version for the firm).
 */
export async function prepareReportRequest(
  req: Request,
  scenarioId: string,
  action: Action,
): Promise<ReportRequest> {
  if (!isUuid(scenarioId)) {
    // Same answer as an unknown id, but an anonymous caller still learns only that they must sign in.
    const auth = await authorizeProjectApi("not-a-project", action);
    return {
      ok: false,
      response: jsonError(auth.ok ? 404 : auth.status, auth.ok ? "Not found." : auth.body.error),
    };
  }
  const url = new URL(req.url);
  const version = parseVersion(url.searchParams.get("version"));
  const unitsParam = url.searchParams.get("units");
  const units =
    unitsParam && (UNIT_SYSTEMS as readonly string[]).includes(unitsParam)
      ? (unitsParam as UnitSystem)
      : null;
  const scenario = await reportScenario(scenarioId);
  const auth = await authorizeProjectApi(
    scenario?.projectId ?? "00000000-0000-4000-8000-000000000000",
    action,
  );
  if (!auth.ok) return { ok: false, response: jsonError(auth.status, auth.body.error) };
  if (!scenario || version === "bad") return { ok: false, response: jsonError(404, "Not found.") };
  const outcome = await resolveReportSource(auth.access, scenario, { version, units });
  if (!outcome.ok) return { ok: false, response: jsonError(outcome.status, outcome.error) };
  const access = auth.access;
  return {
    ok: true,
    source: outcome.source,
    audit: (format, extra = {}) =>
      writeAudit(db, {
        actorId: access.viewer.id,
        firmId: access.project.firmId,
        projectId: access.project.id,
        action: "report.download",
        targetType: "scenario",
        targetId: scenarioId,
        detail: { format, version: outcome.source.versionNumber, units: outcome.source.unitSystem, ...extra },
      }),
  };
}
