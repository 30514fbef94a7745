import { z } from "zod";
import { text } from "@/lib/validation/text";
import { optionsWithoutFirstCost } from "@/lib/scenarios/first-costs";
import type { Executor } from "@/db/schema";
import { inTransaction } from "@/db/transaction";
import { defineAction } from "@/lib/actions/define";
import { findScenario } from "@/db/queries/scenarios";
import type { EconomicsResult } from "@/lib/engine/economics/types";
import { shapeResultFor } from "@/lib/scenarios/result-view";
import { authorizeProject, isUuid, type ProjectAccess, type Viewer } from "@/lib/auth/access";
import { writeAudit } from "@/db/queries/audit";
import {
  findScenarioHeader,
  findVersion,
  insertVersionRow,
  listProjectVersions,
  listScenarioVersions,
  lockScenarioDraft,
  nextVersionNumber,
} from "@/db/queries/versions";
import { fail, ok, REFUSALS, type Result } from "@/lib/result";
import { currentStoredResult, type CurrentResultResolver } from "./current-result";

export const issueInputSchema = z.object({
  note: text().trim().max(2000, "Use at most 2000 characters.").default(""),
});
const issueSchema = issueInputSchema.extend({ scenarioId: text().max(64) });

export interface IssuedVersionSummary {
  id: string;
  scenarioId: string;
  versionNumber: number;
  name: string;
  note: string;
  engineVersion: string;
  scenarioRevision: number;
  issuedAt: Date;
  issuedByName: string | null;
}

/**
 * Issue the scenario as it stands. Input: `{ projectId, scenarioId, note? }`. Its inputs and the stored
 * result computed from exactly those inputs (by the current engine) are copied into a new, numbered
 * version. The copy is what client viewers see; a later edit changes the draft only. Refused when the
 * draft has no finished result for its current inputs. `opts.resolveResult` stands in for the lookup in tests.
 */
export const issueScenario = defineAction<
  { project: "scenario.issue" },
  typeof issueSchema,
  { versionId: string; versionNumber: number; issuedAt: Date },
  never,
  { resolveResult: CurrentResultResolver }
>({
  gate: { project: "scenario.issue" },
  schema: issueSchema,
  invalidMessage: "Check the note.",
  run: async (db, { access }, { scenarioId, note }, opts) => {
    if (!isUuid(scenarioId)) return REFUSALS.notFound;
    const { project, viewer: actor } = access;
    const resolveResult = opts.resolveResult ?? currentStoredResult;
    return inTransaction(db, async (trx) => {
      const draft = await lockScenarioDraft(trx, scenarioId);
      if (!draft || draft.projectId !== project.id) return REFUSALS.notFound;
      if (draft.archivedAt) return fail(409, "This scenario is archived; restore it before issuing.");
      const current = await resolveResult(trx, draft);
      if (!current) {
        return fail(409, "There is no finished result for the scenario's current inputs. Run the analysis, then issue.");
      }
      const missing = optionsWithoutFirstCost(current.input);
      if (missing.length > 0) {
        return fail(409, `Enter the first costs of ${missing.join(", ")} before issuing: an issued version carries a complete life-cycle cost.`);
      }
      const versionNumber = await nextVersionNumber(trx, scenarioId);
      const row = await insertVersionRow(trx, {
        scenarioId,
        projectId: project.id,
        versionNumber,
        name: draft.name,
        note,
        input: current.input,
        inputVersion: draft.inputVersion,
        result: current.result,
        engineVersion: current.engineVersion,
        inputsHash: current.inputsHash,
        scenarioRevision: draft.revision,
        issuedBy: actor.id,
      });
      await writeAudit(trx, {
        actorId: actor.id,
        firmId: project.firmId,
        projectId: project.id,
        action: "version.issue",
        targetType: "scenario",
        targetId: scenarioId,
        detail: { versionNumber, scenarioName: draft.name, scenarioRevision: draft.revision, engineVersion: current.engineVersion },
      });
      return ok({ versionId: row.id, versionNumber, issuedAt: row.issuedAt });
    });
  },
});

/** Every issued version of the project the viewer may see (client viewers see these and nothing else). */
export async function listIssuedVersions(
  db: Executor,
  viewer: Viewer | null,
  projectId: string,
): Promise<Result<IssuedVersionSummary[]>> {
  const auth = await authorizeProject(db, viewer, projectId, "scenario.viewIssued");
  if (!auth.ok) return auth;
  return ok(await listProjectVersions(db, projectId));
}

/**
 * The versions page of one scenario. The firm sees the draft's header too; a client viewer sees only
 * what was issued, and a scenario with nothing issued does not exist for them (404, not 403).
 */
export async function scenarioVersions(
  db: Executor,
  viewer: Viewer | null,
  projectId: string,
  scenarioId: string,
): Promise<
  Result<{
    access: ProjectAccess;
    draft: { id: string; name: string; revision: number; archived: boolean; firstCostsMissing: string[] } | null;
    versions: IssuedVersionSummary[];
  }>
> {
  const auth = await authorizeProject(db, viewer, projectId, "scenario.viewIssued");
  if (!auth.ok) return auth;
  if (!isUuid(scenarioId)) return REFUSALS.notFound;
  const header = await findScenarioHeader(db, projectId, scenarioId);
  if (!header) return REFUSALS.notFound;
  const versions = await listScenarioVersions(db, projectId, scenarioId);
  const seesDraft = auth.access.can("scenario.viewDraft");
  if (!seesDraft && versions.length === 0) return REFUSALS.notFound;
  return ok({
    access: auth.access,
    draft: seesDraft
      ? {
          id: header.id,
          name: header.name,
          revision: header.revision,
          archived: Boolean(header.archivedAt),
          // Issuing needs every option's first cost: the page says so before the person tries.
          firstCostsMissing: optionsWithoutFirstCost((await findScenario(db, scenarioId))?.input),
        }
      : null,
    versions,
  });
}

export type IssuedVersionDetail = IssuedVersionSummary & { projectId: string; input: unknown; inputVersion: number; result: unknown; inputsHash: string };

/**
 * Open one issued version (frozen inputs + result). A client viewer's opening is written to the audit
 * trail: the firm can see who looked at what they shared, and when.
 */
export async function openIssuedVersion(
  db: Executor,
  viewer: Viewer | null,
  projectId: string,
  scenarioId: string,
  versionNumber: number,
): Promise<Result<{ access: ProjectAccess; version: IssuedVersionDetail }>> {
  const auth = await authorizeProject(db, viewer, projectId, "scenario.viewIssued");
  if (!auth.ok) return auth;
  if (!isUuid(scenarioId) || !Number.isSafeInteger(versionNumber) || versionNumber < 1) return REFUSALS.notFound;
  const version = await findVersion(db, projectId, scenarioId, versionNumber);
  if (!version) return REFUSALS.notFound;
  const { access } = auth;
  if (access.relation === "owner" || access.relation === "finance") {
    await writeAudit(db, {
      actorId: access.viewer.id,
      firmId: access.project.firmId,
      projectId,
      action: "version.view",
      targetType: "version",
      targetId: version.id,
      detail: { versionNumber, scenarioName: version.name, role: access.relation },
    });
  }
  // The owner never receives yearly cash flows, whichever page renders this version.
  return ok({ access, version: { ...version, result: shapeResultFor(version.result as { economics: EconomicsResult }, !access.can("scenario.viewCashFlows")) } });
}

/** Parse the [version] route segment: a positive integer, nothing else ("1", not "01" or "1.0"). */
export function parseVersionParam(raw: string): number | null {
  return /^[1-9][0-9]{0,8}$/.test(raw) ? Number(raw) : null;
}
