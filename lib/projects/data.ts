import "server-only";
import { inTransaction } from "@/db/transaction";
import type { Executor } from "@/db/schema";
import { insertProject, listProjectsForUser, updateProject as updateProjectRow } from "@/db/queries/projects";
import type { Viewer } from "@/lib/auth/access";
import { writeAudit } from "@/db/queries/audit";
import { defineAction } from "@/lib/actions/define";
import { ok, type Result } from "@/lib/result";
import { projectCreateSchema, projectSchema, type ProjectFields } from "./schema";

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

/**
 * Edit a project's fields (project.edit). Input: `{ projectId, …fields }`. Validation errors for every
 * field; on success the audit event lists each changed field with its old and new value.
 */
export const updateProject = defineAction({
  gate: { project: "project.edit" },
  schema: projectSchema,
  run: async (db, { access }, v): Promise<Result<{ changed: string[] }>> => {
    const before = access.project;
    const changes: Record<string, { from: unknown; to: unknown }> = {};
    const update: Record<string, unknown> = {};
    for (const key of Object.keys(FIELD_COLUMNS) as (keyof ProjectFields)[]) {
      if (before[key] !== v[key]) {
        changes[key] = { from: before[key], to: v[key] };
        update[FIELD_COLUMNS[key]] = v[key];
      }
    }
    const changed = Object.keys(changes);
    if (changed.length === 0) return ok({ changed });
    await inTransaction(db, async (trx) => {
      await updateProjectRow(trx, before.id, update);
      await writeAudit(trx, {
        actorId: access.viewer.id,
        firmId: before.firmId,
        projectId: before.id,
        action: "project.edit",
        targetType: "project",
        targetId: before.id,
        detail: { changes },
      });
    });
    return ok({ changed });
  },
});

/** Projects of the viewer's firms ("I work on") and projects shared with them ("shared with me"). */
export async function listProjectsFor(db: Executor, viewer: Viewer | null, search?: string) {
  if (!viewer) return [];
  return listProjectsForUser(db, viewer.id, search);
}
