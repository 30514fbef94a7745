import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { findProjectForUser, insertProject, updateProject } from "@/db/queries/projects";
import { writeAudit } from "@/db/queries/audit";
import { can, canInFirm, relationTo, type Principal } from "@/lib/auth/permissions";
import { toFieldErrors, type ActionResult } from "@/components/forms/errors";
import { projectCreateSchema, projectSchema, type ProjectFields } from "./schema";

/** Who is acting: the DAL re-reads this from the database on every request (lib/auth/session.ts). */
export interface Actor {
  userId: string;
  principal: Principal;
}

const NOT_ALLOWED = "You do not have permission to do this.";

/**
 * Create a project in one of the actor's firms. Validates with the shared schema (all field errors
 * returned, nothing written), checks project.create in that firm, writes the row and its audit event
 * in one transaction.
 */
export async function createProjectFor(db: Kysely<Database>, actor: Actor, input: unknown): Promise<ActionResult<{ projectId: string }>> {
  const parsed = projectCreateSchema.safeParse(input);
  if (!parsed.success) return { ok: false, fieldErrors: toFieldErrors(parsed.error.issues) };
  const v = parsed.data;
  if (!canInFirm(actor.principal, v.firmId, "project.create")) {
    return { ok: false, fieldErrors: { firmId: [NOT_ALLOWED] }, formError: "You cannot create projects in that firm." };
  }
  const projectId = await db.transaction().execute(async (trx) => {
    const { id } = await insertProject(trx, {
      firm_id: v.firmId,
      name: v.name,
      client_name: v.clientName,
      site_name: v.siteName,
      location_label: v.locationLabel,
      elevation_m: v.elevationM,
      unit_system: v.unitSystem,
      currency: v.currency,
      created_by: actor.userId,
    });
    await writeAudit(trx, {
      actorId: actor.userId,
      firmId: v.firmId,
      projectId: id,
      action: "project.create",
      targetType: "project",
      targetId: id,
      detail: { name: v.name, clientName: v.clientName, unitSystem: v.unitSystem, currency: v.currency },
    });
    return id;
  });
  return { ok: true, data: { projectId } };
}

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
 * Edit a project's fields. 404-like "not found" when the actor has no relation to it, a refusal when
 * they lack project.edit; validation errors for every field; on success the audit event lists each
 * changed field with its old and new value.
 */
export async function updateProjectFor(
  db: Kysely<Database>,
  actor: Actor,
  projectId: string,
  input: unknown,
): Promise<ActionResult<{ changed: string[] }>> {
  const row = await findProjectForUser(db, projectId, actor.userId);
  const grant = row ? { projectId: row.id, firmId: row.firmId, clientRole: row.clientRole ?? null } : null;
  if (!row || !grant || !relationTo(actor.principal, grant)) return { ok: false, fieldErrors: {}, formError: "That project was not found." };
  if (!can(actor.principal, grant, "project.edit")) return { ok: false, fieldErrors: {}, formError: NOT_ALLOWED };
  const parsed = projectSchema.safeParse(input);
  if (!parsed.success) return { ok: false, fieldErrors: toFieldErrors(parsed.error.issues) };
  const v = parsed.data;
  const changes: Record<string, { from: unknown; to: unknown }> = {};
  const update: Record<string, unknown> = {};
  for (const key of Object.keys(FIELD_COLUMNS) as (keyof ProjectFields)[]) {
    const before = row[key];
    const after = v[key];
    if (before !== after) {
      changes[key] = { from: before, to: after };
      update[FIELD_COLUMNS[key]] = after;
    }
  }
  const changed = Object.keys(changes);
  if (changed.length === 0) return { ok: true, data: { changed } };
  await db.transaction().execute(async (trx) => {
    await updateProject(trx, projectId, update);
    await writeAudit(trx, {
      actorId: actor.userId,
      firmId: row.firmId,
      projectId,
      action: "project.edit",
      targetType: "project",
      targetId: projectId,
      detail: { changes },
    });
  });
  return { ok: true, data: { changed } };
}
