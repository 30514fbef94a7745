import type { Executor } from "@/db/schema";
import { findProjectForUser } from "@/db/queries/projects";
import { clientRolesOf, findUserById, firmRolesOf } from "@/db/queries/users";
import { can, relationTo, type Action, type Principal, type ProjectRelation } from "./permissions";
import type { ProjectRole } from "./roles";
import { REFUSALS, type Refusal } from "@/lib/result";

/**
 * The executor-first core of the data access layer: who the viewer is and what they may do with a
 * project, read from the database on every call. lib/auth/session.ts binds it to the request's session;
 * tests and scripts call it with their own executor, so the rules a page obeys are the rules a test checks.
 */

export interface Viewer {
  id: string;
  name: string;
  email: string;
  principal: Principal;
  firms: { firmId: string; firmName: string; role: "admin" | "consultant" }[];
  clientRoles: ProjectRole[];
  /** When the password last changed: sessions issued before it are void. */
  passwordChangedAt: Date;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[1-8][0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/i;
export function isUuid(v: unknown): v is string {
  return typeof v === "string" && UUID.test(v);
}

/** The viewer with their firm memberships and client grants as they stand now; null for an unknown id. */
export async function loadViewer(db: Executor, userId: string): Promise<Viewer | null> {
  if (!isUuid(userId)) return null;
  const user = await findUserById(db, userId);
  if (!user) return null;
  const [firms, clients] = await Promise.all([firmRolesOf(db, userId), clientRolesOf(db, userId)]);
  return {
    id: user.id,
    name: user.name,
    email: user.email,
    principal: { userId: user.id, firms: firms.map((f) => ({ firmId: f.firmId, role: f.role })) },
    firms,
    clientRoles: [...new Set(clients.map((c) => c.role))],
    passwordChangedAt: user.password_changed_at,
  };
}

export type ProjectDTO = NonNullable<Awaited<ReturnType<typeof findProjectForUser>>>;

export interface ProjectAccess {
  viewer: Viewer;
  project: Omit<ProjectDTO, "clientRole">;
  relation: ProjectRelation;
  can: (action: Action) => boolean;
}

/** What this viewer may do with this project; null when the project does not exist for them. */
export async function loadProjectAccess(db: Executor, viewer: Viewer, projectId: string): Promise<ProjectAccess | null> {
  if (!isUuid(projectId)) return null;
  const row = await findProjectForUser(db, projectId, viewer.id);
  if (!row) return null;
  const grant = { projectId: row.id, firmId: row.firmId, clientRole: row.clientRole ?? null };
  const relation = relationTo(viewer.principal, grant);
  if (!relation) return null;
  const { clientRole: _omit, ...project } = row;
  void _omit;
  return { viewer, project, relation, can: (action) => can(viewer.principal, grant, action) };
}

export type Authorized = { ok: true; access: ProjectAccess };

export { REFUSALS, type Refusal };

/** 401 anonymous, 404 no relation (no hint the id exists), 403 a relation without this action. */
export async function authorizeProject(
  db: Executor,
  viewer: Viewer | null,
  projectId: string,
  action: Action,
): Promise<Authorized | Refusal> {
  if (!viewer) return REFUSALS.anonymous;
  const access = await loadProjectAccess(db, viewer, projectId);
  if (!access) return REFUSALS.notFound;
  if (!access.can(action)) return REFUSALS.forbidden;
  return { ok: true, access };
}
