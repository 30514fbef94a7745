import { after } from "next/server";
import { perform } from "@/lib/actions/request";
import { failureResponse, jsonOk } from "@/lib/http";
import { auditResolved, draftAnalysisState } from "@/lib/scenarios/data";
import { parseVersionParam, resolveScenarioResult, resolveScenarioSelection } from "@/lib/scenarios/resolve";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/**
 * The stored result of a scenario, through the one draft-or-issued resolver and shaped by the viewer's
 * rights (the owner receives no yearly cash flows). Firm members get the draft's result for its current
 * inputs (and the Monte Carlo job's state), or `?version=N`; client viewers the latest issued version
 * (or `?version=N`), 404 when nothing is issued. `?part=monteCarlo` returns only the Monte Carlo state,
 * `?part=full` only the deterministic result's state while a worker computes it (the pages poll them).
 */
export async function GET(request: Request, { params }: { params: Promise<{ scenarioId: string }> }) {
  const { scenarioId } = await params;
  const url = new URL(request.url);
  const part = url.searchParams.get("part");
  const version = parseVersionParam(url.searchParams.get("version"));
  const selected = version.ok ? version.value : null;
  if (part === "full") {
    const sel = await perform(resolveScenarioSelection, scenarioId, { action: "project.view", version: selected });
    if (!sel.ok) return failureResponse(sel);
    return jsonOk({ full: sel.value.kind === "draft" ? await draftAnalysisState(sel.value.scenario) : null });
  }
  const r = await perform(resolveScenarioResult, scenarioId, { action: "project.view", version: selected });
  if (!r.ok) {
    if (part === "monteCarlo" && r.status === 409) return jsonOk({ monteCarlo: null });
    return failureResponse(r);
  }
  if (!version.ok) return failureResponse(version);
  const v = r.value;
  const mc =
    v.kind === "draft"
      ? v.monteCarloJob
      : v.result.economics.monteCarlo
        ? { status: "done", progress: 1, result: v.result.economics.monteCarlo, error: null }
        : null;
  if (part === "monteCarlo") return jsonOk({ monteCarlo: mc });
  after(() => auditResolved(v, "scenario.results.view", v.kind === "draft" ? { revision: v.scenario.row.revision } : { version: v.versionNumber }));
  return jsonOk({
    scenarioId: v.scenario.row.id,
    ...(v.kind === "draft" ? { revision: v.scenario.row.revision } : { version: v.versionNumber, issuedAt: v.issuedAt }),
    engineVersion: v.engineVersion,
    inputsHash: v.inputsHash,
    cashFlowsWithheld: v.cashFlowsWithheld,
    result: v.result,
    ...(v.kind === "draft" ? { monteCarlo: mc } : {}),
  });
}
