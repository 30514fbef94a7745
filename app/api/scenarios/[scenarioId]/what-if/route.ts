import { perform } from "@/lib/actions/request";
import { failureResponse, jsonError, jsonOk, readJsonBody, resultResponse } from "@/lib/http";
import { firstCostsMissingLabels, firstCostsMissingText } from "@/lib/scenarios/first-costs";
import { needsPhysics } from "@/lib/engine/what-if";
import { invalid } from "@/lib/result";
import { humaneIssues } from "@/lib/scenarios/field-messages";
import { parseVersionParam, resolveScenarioResult } from "@/lib/scenarios/resolve";
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
 * when a physical input moved (lib/scenarios/what-if.ts); nothing is saved. Through the one draft-or-issued
 * resolver: firm members work on the draft (or `?version=N`), client viewers only on an issued version
 * (`?version=N`, else the latest). The answer holds life-cycle figures, no yearly cash flows.
 */
export async function POST(request: Request, { params }: { params: Promise<{ scenarioId: string }> }) {
  const { scenarioId } = await params;
  const version = parseVersionParam(new URL(request.url).searchParams.get("version"));
  const r = await perform(resolveScenarioResult, scenarioId, { action: "scenario.whatIf", version: version.ok ? version.value : null, monteCarlo: false });
  if (!r.ok) return failureResponse(r);
  if (!version.ok) return failureResponse(version);
  const body = await readJsonBody(request, WHAT_IF_MAX_BYTES);
  if (!body.ok) return resultResponse(body);
  const parsed = whatIfBodySchema.safeParse(body.value);
  if (!parsed.success) return failureResponse(invalid(humaneIssues(parsed.error.issues), "The what-if values are not valid."));
  const { input, result, access, versionNumber, inputsHash } = r.value;
  const physical = needsPhysics(physicalOverrides(parsed.data));
  const prepared = physical ? preparedFor(`${scenarioId}|${versionNumber ?? "draft"}|${inputsHash}`, input) : null;
  const fieldErrors = whatIfFieldErrors(parsed.data, input, !physical || prepared !== null);
  if (Object.keys(fieldErrors).length > 0) return jsonError(422, "The what-if values are not valid for this scenario.", { fieldErrors });
  const missing = firstCostsMissingLabels(result.economics);
  if (missing.length > 0) return jsonError(409, firstCostsMissingText(missing));
  const w = computeWhatIf(input, result, parsed.data, access.project.unitSystem, access.project.currency, prepared);
  return jsonOk({ ...w, version: versionNumber });
}
