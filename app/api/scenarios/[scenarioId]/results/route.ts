import { NextResponse } from "next/server";
import { after } from "next/server";
import { auditScenario, authorizeScenarioApi, draftSource, issuedSource, issuedVersionOf } from "@/lib/scenarios/data";
import { jsonError } from "@/lib/http";
import { monteCarloStatusOf } from "@/lib/scenarios/analysis";
import { inputsHash } from "@/lib/scenarios/hash";
import { buildEngineInput, withClimateData } from "@/lib/scenarios/store";
import { findResult } from "@/db/queries/results";
import { ENGINE_VERSION } from "@/lib/engine";
import { db } from "@/db";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/**
 * The stored result of a scenario. Firm members get the draft's result for its current inputs (and the
 * Monte Carlo job's state); client viewers get the latest issued version's result (or `?version=N`),
 * 404 when nothing is issued. `?part=monteCarlo` returns only the Monte Carlo state, `?part=full` only the
 * deterministic result's state while a worker computes it (the pages poll them).
 */
export async function GET(request: Request, { params }: { params: Promise<{ scenarioId: string }> }) {
  const { scenarioId } = await params;
  const url = new URL(request.url);
  const part = url.searchParams.get("part");
  const versionParam = url.searchParams.get("version");
  const auth = await authorizeScenarioApi(scenarioId, "project.view", { withClimateData: false });
  if (!auth.ok) return jsonError(auth.status, auth.error);
  const { access } = auth;
  const headers = { "cache-control": "no-store" };

  if (versionParam !== null || !access.can("scenario.viewDraft")) {
    if (!access.can("scenario.viewIssued")) return jsonError(403, "You do not have access to this.");
    const n = versionParam === null ? undefined : Number(versionParam);
    if (n !== undefined && (!Number.isInteger(n) || n < 1)) return jsonError(400, "version must be a whole number ≥ 1.", { fieldErrors: { version: ["must be a whole number ≥ 1"] } });
    const v = await issuedVersionOf(auth.ctx.row.id, n);
    if (!v) return jsonError(404, n === undefined ? "No version of this scenario has been issued yet." : `Version ${n} does not exist.`);
    const src = issuedSource(v);
    const mc = src.result.economics.monteCarlo;
    if (part === "monteCarlo") return NextResponse.json({ monteCarlo: mc ? { status: "done", progress: 1, result: mc, error: null } : null }, { headers });
    after(() => auditScenario(auth, "scenario.results.view", { version: v.versionNumber }));
    return NextResponse.json(
      { scenarioId, version: v.versionNumber, issuedAt: v.issuedAt, engineVersion: v.engineVersion, inputsHash: v.inputsHash, result: src.result },
      { headers },
    );
  }

  if (part === "full") {
    // The deterministic result's state while a worker computes it (the comparison page polls this).
    const full = await withClimateData(db, auth.ctx);
    const built = buildEngineInput(full.dto.document, full.dataset, full.project);
    if (!built.ok) return NextResponse.json({ full: null }, { headers });
    const row = await findResult(db, auth.ctx.row.id, ENGINE_VERSION, inputsHash(built.input), "full");
    return NextResponse.json({ full: row ? { status: row.status, progress: row.progress, error: row.error } : null }, { headers });
  }
  const src = await draftSource(auth);
  if (part === "monteCarlo" && !src) return NextResponse.json({ monteCarlo: null }, { headers });
  if (!src) return jsonError(404, "The draft has no stored result for its current inputs: complete and save it to analyse it.");
  const monteCarlo = monteCarloStatusOf(await findResult(db, auth.ctx.row.id, ENGINE_VERSION, src.inputsHash, "monteCarlo"));
  if (part === "monteCarlo") return NextResponse.json({ monteCarlo }, { headers });
  after(() => auditScenario(auth, "scenario.results.view", { revision: auth.ctx.row.revision }));
  return NextResponse.json(
    {
      scenarioId,
      revision: auth.ctx.row.revision,
      engineVersion: ENGINE_VERSION,
      inputsHash: src.inputsHash,
      result: src.result,
      monteCarlo,
    },
    { headers },
  );
}
