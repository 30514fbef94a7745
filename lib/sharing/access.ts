import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { authorizeProject, isUuid, type Viewer } from "@/lib/auth/access";
import type { ProjectRole } from "@/lib/auth/roles";
import { writeAudit } from "@/db/queries/audit";
import { deleteProjectAccess } from "@/db/queries/sharing";
import { failure, refused, success, type Outcome } from "./outcome";

/**
 * Take a client viewer's access away. Nothing is cached: the data access layer reads grants on every
 * request (lib/auth/access.ts), so the viewer's next request is already refused.
 */
export async function revokeViewerAccess(
  db: Kysely<Database>,
  viewer: Viewer | null,
  projectId: string,
  userId: string,
): Promise<Outcome<{ userId: string; role: ProjectRole }>> {
  const auth = await authorizeProject(db, viewer, projectId, "access.revoke");
  if (!auth.ok) return refused(auth);
  if (!isUuid(userId)) return failure(404, "Not found.");
  const { project, viewer: actor } = auth.access;
  return db.transaction().execute(async (trx) => {
    const removed = await deleteProjectAccess(trx, projectId, userId);
    if (!removed) return failure(404, "That person has no access to this project.");
    const who = await trx.selectFrom("users").select(["email", "name"]).where("id", "=", userId).executeTakeFirst();
    await writeAudit(trx, {
      actorId: actor.id,
      firmId: project.firmId,
      projectId,
      action: "access.revoke",
      targetType: "user",
      targetId: userId,
      detail: { email: who?.email ?? null, name: who?.name ?? null, role: removed.role },
    });
    return success({ userId, role: removed.role });
  });
}
