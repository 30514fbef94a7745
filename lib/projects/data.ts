import "server-only";
import { inTransaction } from "@/db/transaction";
import type { Executor } from "@/db/schema";
import { insertProject, lastProjectEdit, listProjectsForUser, updateProjectAtRevision } from "@/db/queries/projects";
import type { Viewer } from "@/lib/auth/access";
import { writeAudit } from "@/db/queries/audit";
import { defineAction } from "@/lib/actions/define";
import { fail, ok, REFUSALS, type Result } from "@/lib/result";
import { projectCreateSchema, projectUpdateSchema, type ProjectFields } from "./schema";

/**
 * Create a project in one of the viewer's firms (project.create there). Input: the project's fields and
 * `firmId`. Validated with the shared schema (all field errors returned, nothing written); the row and its
 * audit event are written in one transaction.
 */
export const createProject = defineAction({
  gate: { firm: "project.create" },
  schema: projectCreateSchema,
  run: async (db, { viewer }, v): Promise<Result<{ projectId: string }>> => {
    const projectId = await inTransaction(db, async (trx) => {
      const { id } = await insertProject(trx, {
        firm_id: v.firmId,
        name: v.name,
        client_name: v.clientName,
        site_name: v.siteName,
        location_label: v.locationLabel,
        elevation_m: v.elevationM,
        unit_system: v.unitSystem,
        currency: v.currency,
        created_by: viewer.id,
      });
      await writeAudit(trx, {
        actorId: viewer.id,
        firmId: v.firmId,
        projectId: id,
        action: "project.create",
        targetType: "project",
        targetId: id,
        detail: { name: v.name, clientName: v.clientName, unitSystem: v.unitSystem, currency: v.currency },
      });
      return id;
    });
    return ok({ projectId });
  },
});

const FIELD_COLUMNS = {
  name: "name",
  clientName: "client_name",
  siteName: "site_name",
  locationLabel: "location_label",
  elevationM: "elevation_m",
  unitSystem: "unit_system",
  currency: "currency",
} as const satisfies Record<keyof ProjectFields, string>;

/** What a refused stale edit tells the form: the revision someone else saved first. */
export interface ProjectConflict {
  currentRevision: number;
  savedBy: string | null;
  savedAt: string;
}

/**
 * Edit a project's fields (project.edit). Input: `{ projectId, revision, …fields }`, `revision` being the
 * one the form was opened at. Validation errors for every field; an edit that started from an older
 * revision than the stored one is refused (409, nothing written) — as a scenario save is; on success the
 * revision steps by one and the audit event lists each changed field with its old and new value.
 */
export const updateProject = defineAction({
  gate: { project: "project.edit" },
  schema: projectUpdateSchema,
  run: async (db, { access }, v): Promise<Result<{ changed: string[]; revision: number }, ProjectConflict>> => {
    const before = access.project;
    const stale = async (): Promise<Result<never, ProjectConflict>> => {
      const now = await lastProjectEdit(db, before.id);
      if (!now) return REFUSALS.notFound;
      return fail(
        409,
        `Not saved: ${now.actorName ?? "someone"} changed this project (revision ${now.revision}) after you opened it. ` +
          "Nothing was overwritten and your edits are still in the form — copy them, then reload to see the newer version.",
        undefined,
        { currentRevision: now.revision, savedBy: now.actorName ?? null, savedAt: now.updatedAt.toISOString() },
      );
    };
    if (before.revision !== v.revision) return stale();
    const changes: Record<string, { from: unknown; to: unknown }> = {};
    const update: Record<string, unknown> = {};
    for (const key of Object.keys(FIELD_COLUMNS) as (keyof ProjectFields)[]) {
      if (before[key] !== v[key]) {
        changes[key] = { from: before[key], to: v[key] };
        update[FIELD_COLUMNS[key]] = v[key];
      }
    }
    const changed = Object.keys(changes);
    if (changed.length === 0) return ok({ changed, revision: before.revision });
    const revision = await inTransaction(db, async (trx) => {
      const next = await updateProjectAtRevision(trx, before.id, v.revision, update);
      if (next === null) return null;
      await writeAudit(trx, {
        actorId: access.viewer.id,
        firmId: before.firmId,
        projectId: before.id,
        action: "project.edit",
        targetType: "project",
        targetId: before.id,
        detail: { changes, revision: next },
      });
      return next;
    });
    if (revision === null) return stale();
    return ok({ changed, revision });
  },
});

/** Projects of the viewer's firms ("I work on") and projects shared with them ("shared with me"). */
export async function listProjectsFor(db: Executor, viewer: Viewer | null, search?: string) {
  if (!viewer) return [];
  return listProjectsForUser(db, viewer.id, search);
}
