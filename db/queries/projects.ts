import { sql } from "kysely";
import type { NewProject, ProjectUpdate, Executor } from "../schema";
import type { ProjectRole } from "@/db/enums";


const projectColumns = [
  "projects.id",
  "projects.firm_id as firmId",
  "projects.name",
  "projects.client_name as clientName",
  "projects.site_name as siteName",
  "projects.location_label as locationLabel",
  "projects.elevation_m as elevationM",
  "projects.unit_system as unitSystem",
  "projects.currency",
  "projects.created_at as createdAt",
  "projects.updated_at as updatedAt",
  "projects.revision",
] as const;

/** The project with the viewer's client role on it (null when none), or undefined when it does not exist. */
export async function findProjectForUser(db: Executor, projectId: string, userId: string) {
  return db
    .selectFrom("projects")
    .innerJoin("firms", "firms.id", "projects.firm_id")
    .leftJoin("project_access", (j) =>
      j.onRef("project_access.project_id", "=", "projects.id").on("project_access.user_id", "=", userId),
    )
    .select([...projectColumns, "firms.name as firmName", "project_access.role as clientRole"])
    .where("projects.id", "=", projectId)
    .executeTakeFirst();
}

/** Projects of the viewer's firms ("I work on") and projects shared with them ("shared with me"). */
export async function listProjectsForUser(db: Executor, userId: string, search?: string) {
  let q = db
    .selectFrom("projects")
    .innerJoin("firms", "firms.id", "projects.firm_id")
    .leftJoin("firm_members", (j) =>
      j.onRef("firm_members.firm_id", "=", "projects.firm_id").on("firm_members.user_id", "=", userId),
    )
    .leftJoin("project_access", (j) =>
      j.onRef("project_access.project_id", "=", "projects.id").on("project_access.user_id", "=", userId),
    )
    .select([
      ...projectColumns,
      "firms.name as firmName",
      "firm_members.role as firmRole",
      "project_access.role as clientRole",
    ])
    .where((eb) => eb.or([eb("firm_members.user_id", "is not", null), eb("project_access.user_id", "is not", null)]));
  if (search && search.trim()) {
    const like = `%${search.trim().replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    q = q.where((eb) =>
      eb.or([
        eb("projects.name", "ilike", like),
        eb("projects.client_name", "ilike", like),
        eb("projects.site_name", "ilike", like),
        eb("projects.location_label", "ilike", like),
      ]),
    );
  }
  return q.orderBy("projects.updated_at", "desc").execute();
}

export async function insertProject(db: Executor, p: NewProject) {
  return db.insertInto("projects").values(p).returning("id").executeTakeFirstOrThrow();
}

export async function updateProject(db: Executor, projectId: string, p: ProjectUpdate) {
  await db
    .updateTable("projects")
    .set({ ...p, updated_at: sql`now()` })
    .where("id", "=", projectId)
    .execute();
}

/**
 * Update a project's fields only while its revision is still `expectedRevision` (and step it by one):
 * the new revision, or null when someone else's edit came first (nothing written).
 */
export async function updateProjectAtRevision(db: Executor, projectId: string, expectedRevision: number, p: ProjectUpdate): Promise<number | null> {
  const row = await db
    .updateTable("projects")
    .set({ ...p, revision: sql<number>`revision + 1`, updated_at: sql`now()` })
    .where("id", "=", projectId)
    .where("revision", "=", expectedRevision)
    .returning("revision")
    .executeTakeFirst();
  return row?.revision ?? null;
}

/** Who last edited a project's fields and when (from the audit trail), for a refused stale edit. */
export async function lastProjectEdit(db: Executor, projectId: string) {
  return db
    .selectFrom("projects")
    .leftJoin(
      (eb) =>
        eb
          .selectFrom("audit_events")
          .leftJoin("users", "users.id", "audit_events.actor_id")
          .select(["audit_events.project_id", "users.name as actorName"])
          .where("audit_events.project_id", "=", projectId)
          .where("audit_events.action", "=", "project.edit")
          .orderBy("audit_events.id", "desc")
          .limit(1)
          .as("last"),
      (j) => j.onRef("last.project_id", "=", "projects.id"),
    )
    .select(["projects.revision", "projects.updated_at as updatedAt", "last.actorName"])
    .where("projects.id", "=", projectId)
    .executeTakeFirst();
}

export async function grantProjectAccess(
  db: Executor,
  g: { projectId: string; userId: string; role: ProjectRole; grantedBy: string | null },
) {
  await db
    .insertInto("project_access")
    .values({ project_id: g.projectId, user_id: g.userId, role: g.role, granted_by: g.grantedBy })
    .onConflict((oc) => oc.columns(["project_id", "user_id"]).doUpdateSet({ role: g.role }))
    .execute();
}

export async function listProjectAccess(db: Executor, projectId: string) {
  return db
    .selectFrom("project_access")
    .innerJoin("users", "users.id", "project_access.user_id")
    .select(["users.id as userId", "users.name", "users.email", "project_access.role", "project_access.created_at as grantedAt"])
    .where("project_access.project_id", "=", projectId)
    .orderBy("users.name")
    .execute();
}

/** A project's site and report settings, as a scenario's analysis needs them. */
export function findProjectSite(ex: Executor, projectId: string) {
  return ex
    .selectFrom("projects")
    .select(["id", "name", "elevation_m as elevationM", "location_label as locationLabel", "site_name as siteName", "unit_system as unitSystem", "currency"])
    .where("id", "=", projectId)
    .executeTakeFirst();
}
