import { NextResponse } from "next/server";
import { authorizeScenarioApi, draftSource, issuedSource, issuedVersionOf } from "@/lib/scenarios/data";
import { toFieldErrors } from "@/lib/result";
import { jsonError, readJsonBody, resultResponse } from "@/lib/http";
import { firstCostsMissingLabels } from "@/lib/scenarios/first-costs";
import { firstCostsMissingText } from "@/lib/scenarios/first-costs";
import { needsPhysics } from "@/lib/engine/what-if";
import {
  computeWhatIf,
  physicalOverrides,
  preparedFor,
  whatIfBodySchema,
  whatIfFieldErrors,
  WHAT_IF_MAX_BYTES,
} from "@/lib/scenarios/what-if";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/**
 * Re-price the stored physics with the what-if overrides — and re-run the physics on the compressed climate
 * when a physical input moved (lib/scenarios/what-if.ts); nothing is saved. Firm members work on the
 * draft (or `?version=N`); client viewers only on an issued version (`?version=N`, else the latest).
 */
export async function POST(request: Request, { params }: { params: Promise<{ scenarioId: string }> }) {
  const { scenarioId } = await params;
  const auth = await authorizeScenarioApi(scenarioId, "scenario.whatIf", { withClimateData: false });
  if (!auth.ok) return jsonError(auth.status, auth.error);
  const body = await readJsonBody(request, WHAT_IF_MAX_BYTES);
  if (!body.ok) return resultResponse(body);
  const parsed = whatIfBodySchema.safeParse(body.value);
  if (!parsed.success) return jsonError(422, "The what-if values are not valid.", { fieldErrors: toFieldErrors(parsed.error.issues) });

  const { access } = auth;
  const versionParam = new URL(request.url).searchParams.get("version");
  let src;
  if (versionParam !== null || !access.can("scenario.viewDraft")) {
    if (!access.can("scenario.viewIssued")) return jsonError(403, "You do not have access to this.");
    const n = versionParam === null ? undefined : Number(versionParam);
    if (n !== undefined && (!Number.isInteger(n) || n < 1)) return jsonError(400, "version must be a whole number ≥ 1.");
    const v = await issuedVersionOf(auth.ctx.row.id, n);
    if (!v) return jsonError(404, "No issued version to work on.");
    src = issuedSource(v);
  } else {
    src = await draftSource(auth);
    if (!src) return jsonError(409, "The draft has no result for its current inputs yet: save it to analyse it first.");
  }
  const physical = needsPhysics(physicalOverrides(parsed.data));
  const prepared = physical ? preparedFor(`${scenarioId}|${src.version ?? "draft"}|${src.inputsHash}`, src.input) : null;
  const fieldErrors = whatIfFieldErrors(parsed.data, src.input, !physical || prepared !== null);
  if (Object.keys(fieldErrors).length > 0) return jsonError(422, "The what-if values are not valid for this scenario.", { fieldErrors });
  const missing = firstCostsMissingLabels(src.result.economics);
  if (missing.length > 0) return jsonError(409, firstCostsMissingText(missing));
  const r = computeWhatIf(src.input, src.result, parsed.data, access.project.unitSystem, access.project.currency, prepared);
  return NextResponse.json({ ...r, version: src.version }, { headers: { "cache-control": "no-store" } });
}
