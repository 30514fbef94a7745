import "server-only";
import { cache } from "react";
import { getServerSession } from "next-auth";
import { forbidden, notFound, redirect } from "next/navigation";
import { db } from "@/db";
import { findProjectForUser } from "@/db/queries/projects";
import { clientRolesOf, findUserById, firmRolesOf } from "@/db/queries/users";
import { authOptions } from "./options";
import { can, relationTo, type Action, type Principal, type ProjectRelation } from "./permissions";
import type { ProjectRole } from "./roles";

export interface Viewer {
  id: string;
  name: string;
  email: string;
  principal: Principal;
  firms: { firmId: string; firmName: string; role: "admin" | "consultant" }[];
  clientRoles: ProjectRole[];
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[1-8][0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/i;
export function isUuid(v: unknown): v is string {
  return typeof v === "string" && UUID.test(v);
}

/**
 * The signed-in viewer, re-read from the database on every request so that a removed member or a
 * revoked viewer loses access at the next request (the JWT's roles are only a hint for the UI).
 */
export const currentViewer = cache(async (): Promise<Viewer | null> => {
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  if (!isUuid(id)) return null;
  const user = await findUserById(db, id);
  if (!user) return null;
  const [firms, clients] = await Promise.all([firmRolesOf(db, id), clientRolesOf(db, id)]);
  return {
    id: user.id,
    name: user.name,
    email: user.email,
    principal: { userId: user.id, firms: firms.map((f) => ({ firmId: f.firmId, role: f.role })) },
    firms,
    clientRoles: [...new Set(clients.map((c) => c.role))],
  };
});

/** For pages: the viewer, or a redirect to sign-in. */
export async function requireViewer(): Promise<Viewer> {
  const viewer = await currentViewer();
  if (!viewer) redirect("/signin");
  return viewer;
}

export type ProjectDTO = NonNullable<Awaited<ReturnType<typeof findProjectForUser>>>;

export interface ProjectAccess {
  viewer: Viewer;
  project: Omit<ProjectDTO, "clientRole">;
  relation: ProjectRelation;
  can: (action: Action) => boolean;
}

/** What this viewer may do with this project; null when the project does not exist for them. */
export async function projectAccess(viewer: Viewer, projectId: string): Promise<ProjectAccess | null> {
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

/** For pages: the project access, 404 when the viewer has no relation, 403 when the action is not theirs. */
export async function requireProjectAction(projectId: string, action: Action): Promise<ProjectAccess> {
  const viewer = await requireViewer();
  const access = await projectAccess(viewer, projectId);
  if (!access) notFound();
  if (!access.can(action)) forbidden();
  return access;
}

export type ApiAuth =
  | { ok: true; access: ProjectAccess }
  | { ok: false; status: 401 | 403 | 404; body: { error: string } };

/** For route handlers: 401 anonymous, 404 no relation (no hint the id exists), 403 relation without the right. */
export async function authorizeProjectApi(projectId: string, action: Action): Promise<ApiAuth> {
  const viewer = await currentViewer();
  if (!viewer) return { ok: false, status: 401, body: { error: "Sign in first." } };
  const access = await projectAccess(viewer, projectId);
  if (!access) return { ok: false, status: 404, body: { error: "Not found." } };
  if (!access.can(action)) return { ok: false, status: 403, body: { error: "You do not have access to this." } };
  return { ok: true, access };
}
