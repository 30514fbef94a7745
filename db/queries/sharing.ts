import type { Executor } from "../schema";


/** Client viewers of a project with who granted them and when. */
export async function listClientViewers(db: Executor, projectId: string) {
  return db
    .selectFrom("project_access")
    .innerJoin("users", "users.id", "project_access.user_id")
    .leftJoin("users as granter", "granter.id", "project_access.granted_by")
    .select([
      "users.id as userId",
      "users.name",
      "users.email",
      "project_access.role",
      "project_access.created_at as since",
      "granter.name as grantedByName",
    ])
    .where("project_access.project_id", "=", projectId)
    .orderBy("users.name")
    .execute();
}

/** Remove a client viewer's grant; returns the removed grant, or undefined when there was none. */
export async function deleteProjectAccess(db: Executor, projectId: string, userId: string) {
  return db
    .deleteFrom("project_access")
    .where("project_id", "=", projectId)
    .where("user_id", "=", userId)
    .returning(["user_id as userId", "role"])
    .executeTakeFirst();
}

/** Every client grant on the firm's projects (for the firm admin's overview). */
export async function listFirmClientAccess(db: Executor, firmId: string) {
  return db
    .selectFrom("project_access")
    .innerJoin("projects", "projects.id", "project_access.project_id")
    .innerJoin("users", "users.id", "project_access.user_id")
    .select([
      "projects.id as projectId",
      "projects.name as projectName",
      "users.id as userId",
      "users.name",
      "users.email",
      "project_access.role",
      "project_access.created_at as since",
    ])
    .where("projects.firm_id", "=", firmId)
    .orderBy("projects.name")
    .orderBy("users.name")
    .execute();
}

/** Firm members who should hear about activity on a project (the consultants and admins of its firm). */
export async function listFirmMembersWithRole(db: Executor, firmId: string) {
  return db
    .selectFrom("firm_members")
    .innerJoin("users", "users.id", "firm_members.user_id")
    .select(["users.id as userId", "users.name", "users.email", "firm_members.role"])
    .where("firm_members.firm_id", "=", firmId)
    .execute();
}
