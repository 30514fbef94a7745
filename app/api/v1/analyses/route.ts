import { NextResponse } from "next/server";
import { after } from "next/server";
import { auditImmediateAnalysis, queueApiAnalysis } from "@/lib/analyses/data";
import { currentViewer } from "@/lib/auth/session";
import { isBudgetExceeded, timeBudget } from "@/lib/engine";
import { analyzeDocument, isQuickAnalysis, monteCarloDraws, QUICK_ANALYSIS_MAX_RECORDS } from "@/lib/scenarios/analysis";
import { inputsHash } from "@/lib/scenarios/hash";
import { jsonError, readJsonBody, resultResponse } from "@/lib/http";
import { parseScenarioDocument } from "@/lib/scenarios/validate";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** A full hourly scenario is ~0.3 MB of JSON; 5 MB leaves room for 8784-hour years and four options. */
const MAX_ANALYSIS_BYTES = 5 * 1024 * 1024;
/** Budget of an analysis answered at once (a quick one takes well under a second). */
const SYNC_BUDGET_MS = 5_000;

/**
 * Analyse a scenario document (the scenario schema's shape, e.g. from /api/scenarios/[id]/export) for a
 * signed-in user; nothing of the user's work is stored.
 *
 * Answered at once (200 with the result) only when it is small: a bin-table climate of at most
 * QUICK_ANALYSIS_MAX_RECORDS (400) bins and no Monte Carlo, unless the client sends `Prefer: respond-async`.
 * Everything else (an hourly year, any Monte Carlo) is queued for a worker: 202 Accepted with
 * `Location: /api/v1/analyses/{id}` to poll. Per-user limits on waiting work apply (429 + Retry-After).
 * 401 anonymous, 413 too large, 415 not JSON, 422 with every field error by path.
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
  const input = parsed.value;
  const draws = monteCarloDraws(input);
  const preferAsync = /\brespond-async\b/i.test(request.headers.get("prefer") ?? "");

  if (!preferAsync && draws === 0 && isQuickAnalysis(input)) {
    let r;
    try {
      r = analyzeDocument(input, timeBudget(SYNC_BUDGET_MS, () => performance.now()));
    } catch (err) {
      if (isBudgetExceeded(err)) return jsonError(422, err.message);
      throw err;
    }
    after(() => auditImmediateAnalysis(viewer.id, { inputsHash: r.inputsHash, options: input.options.length, ms: Math.round(r.elapsedMs) }));
    return NextResponse.json(r, { headers: { "cache-control": "no-store" } });
  }

  const hash = inputsHash(input);
  const queued = await queueApiAnalysis(viewer.id, { draws, inputsHash: hash, input, options: input.options.length });
  if (!queued.ok) return NextResponse.json({ error: queued.message }, { status: 429, headers: { "cache-control": "no-store", "retry-after": "30" } });
  const location = `/api/v1/analyses/${queued.row.id}`;
  return NextResponse.json(
    {
      id: queued.row.id,
      status: queued.row.status,
      statusUrl: location,
      inputsHash: hash,
      why:
        draws > 0
          ? `A Monte Carlo of ${draws.toLocaleString("en-US")} draws runs in the background.`
          : `Analyses of more than ${QUICK_ANALYSIS_MAX_RECORDS} climate records (an hourly year) run in the background.`,
    },
    { status: 202, headers: { "cache-control": "no-store", location, "retry-after": "2" } },
  );
}
