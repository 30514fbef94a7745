import "server-only";
import { cache } from "react";
import { getServerSession } from "next-auth";
import { forbidden, notFound, redirect } from "next/navigation";
import { db } from "@/db";
import { env } from "@/lib/env";
import { authOptions } from "./options";
import {
  authorizeProject,
  isUuid,
  loadProjectAccess,
  loadViewer,
  type ProjectAccess,
  type ProjectDTO,
  type Viewer,
} from "./access";
import type { Action } from "./permissions";
import { sessionIsCurrent } from "./session-rules";

export { isUuid };
export type { ProjectAccess, ProjectDTO, Viewer };

/**
 * The signed-in viewer, re-read from the database on every request so that a removed member or a
 * revoked viewer loses access at the next request (the JWT's roles are only a hint for the UI).
 * A session older than SESSION_MAX_AGE_S, or signed before the last password change, counts as none.
 */
export const currentViewer = cache(async (): Promise<Viewer | null> => {
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  if (!isUuid(id)) return null;
  const viewer = await loadViewer(db, id);
  if (!viewer) return null;
  const claims = { authAtMs: session?.authAtMs, pwdAtMs: session?.pwdAtMs };
  if (!sessionIsCurrent(claims, viewer, env().SESSION_MAX_AGE_S, Date.now())) return null;
  return viewer;
});

/** For pages: the viewer, or a redirect to sign-in. */
export async function requireViewer(): Promise<Viewer> {
  const viewer = await currentViewer();
  if (!viewer) redirect("/signin");
  return viewer;
}

/** What this viewer may do with this project; null when the project does not exist for them. */
export async function projectAccess(viewer: Viewer, projectId: string): Promise<ProjectAccess | null> {
  return loadProjectAccess(db, viewer, projectId);
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
  const r = await authorizeProject(db, await currentViewer(), projectId, action);
  return r.ok ? r : { ok: false, status: r.status, body: { error: r.error } };
}
