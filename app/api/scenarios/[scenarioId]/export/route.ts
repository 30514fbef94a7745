import { NextResponse } from "next/server";
import { after } from "next/server";
import { auditScenario, authorizeScenarioApi, issuedVersionOf } from "@/lib/scenarios/data";
import { jsonError } from "@/lib/http";
import { exportDocument } from "@/lib/scenarios/export";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/**
 * The scenario as one self-contained JSON document (the scenario schema's shape, climate arrays and site
 * included): posting it to /api/v1/analyses reproduces the stored result. Firm members export the draft
 * (or `?version=N`); client viewers an issued version.
 */
export async function GET(request: Request, { params }: { params: Promise<{ scenarioId: string }> }) {
  const { scenarioId } = await params;
  const versionParam = new URL(request.url).searchParams.get("version");
  const auth = await authorizeScenarioApi(scenarioId, "project.view");
  if (!auth.ok) return jsonError(auth.status, auth.error);
  const { access, ctx } = auth;
  let doc: unknown;
  let suffix = `r${ctx.row.revision}`;
  if (versionParam !== null || !access.can("scenario.viewDraft")) {
    if (!access.can("scenario.viewIssued")) return jsonError(403, "You do not have access to this.");
    const n = versionParam === null ? undefined : Number(versionParam);
    if (n !== undefined && (!Number.isInteger(n) || n < 1)) return jsonError(400, "version must be a whole number ≥ 1.");
    const v = await issuedVersionOf(ctx.row.id, n);
    if (!v) return jsonError(404, "No issued version to export.");
    doc = exportDocument(v.input, ctx.dataset, ctx.project);
    suffix = `v${v.versionNumber}`;
  } else {
    doc = exportDocument(ctx.dto.document, ctx.dataset, ctx.project);
  }
  after(() => auditScenario(auth, "scenario.export", { what: suffix }));
  const fileName = `${ctx.row.name.replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 80) || "scenario"}-${suffix}.json`;
  return new NextResponse(JSON.stringify(doc), {
    headers: {
      "content-type": "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="${fileName}"`,
      "cache-control": "no-store",
    },
  });
}
