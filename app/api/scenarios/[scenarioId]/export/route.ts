import { after } from "next/server";
import { perform } from "@/lib/actions/request";
import { failureResponse, NO_STORE } from "@/lib/http";
import { auditResolved, exportableDraft } from "@/lib/scenarios/data";
import { exportDocument } from "@/lib/scenarios/export";
import { parseVersionParam, resolveScenarioSelection } from "@/lib/scenarios/resolve";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/**
 * The scenario as one self-contained JSON document (the scenario schema's shape, climate arrays and site
 * included): posting it to /api/v1/analyses reproduces the stored result. Through the one draft-or-issued
 * resolver: firm members export the draft (or `?version=N`), client viewers an issued version. Inputs
 * only: no result, so no cash flows.
 */
export async function GET(request: Request, { params }: { params: Promise<{ scenarioId: string }> }) {
  const { scenarioId } = await params;
  const version = parseVersionParam(new URL(request.url).searchParams.get("version"));
  const sel = await perform(resolveScenarioSelection, scenarioId, { action: "project.view", version: version.ok ? version.value : null });
  if (!sel.ok) return failureResponse(sel);
  if (!version.ok) return failureResponse(version);
  const s = sel.value;
  const full = await exportableDraft(s.scenario);
  const doc = s.kind === "issued" ? exportDocument(s.version.input, full.dataset, full.project) : exportDocument(full.dto.document, full.dataset, full.project);
  const suffix = s.kind === "issued" ? `v${s.version.versionNumber}` : `r${s.scenario.row.revision}`;
  after(() => auditResolved(s, "scenario.export", { what: suffix }));
  const fileName = `${s.scenario.row.name.replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 80) || "scenario"}-${suffix}.json`;
  return new Response(JSON.stringify(doc), {
    headers: { ...NO_STORE, "content-type": "application/json; charset=utf-8", "content-disposition": `attachment; filename="${fileName}"` },
  });
}
