import { NextResponse } from "next/server";
import { after } from "next/server";
import { db } from "@/db";
import { writeAudit } from "@/db/queries/audit";
import { currentViewer } from "@/lib/auth/session";
import { analyzeDocument } from "@/lib/scenarios/analysis";
import { jsonError, readJsonBody, resultResponse } from "@/lib/http";
import { parseScenarioDocument } from "@/lib/scenarios/validate";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** A full hourly scenario is ~0.3 MB of JSON; 5 MB leaves room for 8784-hour years and four options. */
const MAX_ANALYSIS_BYTES = 5 * 1024 * 1024;

/**
 * Analyse a scenario document (the scenario schema's shape, e.g. from /api/scenarios/[id]/export) for a
 * signed-in user; nothing is stored. 401 anonymous, 413 too large, 415 not JSON, 422 with every field
 * error by path.
 */
export async function POST(request: Request) {
  const viewer = await currentViewer();
  if (!viewer) return jsonError(401, "Sign in first.");
  const body = await readJsonBody(request, MAX_ANALYSIS_BYTES);
  if (!body.ok) return resultResponse(body);
  const parsed = parseScenarioDocument(body.value);
  if (!parsed.ok) {
    const issues = Object.entries(parsed.fieldErrors).flatMap(([path, messages]) => messages.map((message) => ({ path, message })));
    return jsonError(422, `The scenario is not valid: ${issues.length} ${issues.length === 1 ? "problem" : "problems"}.`, { fieldErrors: parsed.fieldErrors, issues });
  }
  const r = analyzeDocument(parsed.value);
  after(() =>
    writeAudit(db, {
      actorId: viewer.id,
      action: "analysis.api",
      targetType: "analysis",
      detail: { inputsHash: r.inputsHash, options: parsed.value.options.length, ms: Math.round(r.elapsedMs) },
    }),
  );
  return NextResponse.json(r, { headers: { "cache-control": "no-store" } });
}
