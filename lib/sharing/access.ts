import { z } from "zod";
import { text } from "@/lib/validation/text";
import { inTransaction } from "@/db/transaction";
import { writeAudit } from "@/db/queries/audit";
import { deleteProjectAccess } from "@/db/queries/sharing";
import { findUserContact } from "@/db/queries/users";
import { defineAction } from "@/lib/actions/define";
import { isUuid } from "@/lib/auth/access";
import type { ProjectRole } from "@/lib/auth/roles";
import { fail, ok, REFUSALS, type Result } from "@/lib/result";

/**
 * Take a client viewer's access away. Input: `{ projectId, userId }`. Nothing is cached: the data access
 * layer reads grants on every request (lib/auth/access.ts), so the viewer's next request is already refused.
 */
export const revokeViewerAccess = defineAction({
  gate: { project: "access.revoke" },
  schema: z.object({ userId: text().max(64) }),
  run: async (db, { access }, { userId }): Promise<Result<{ userId: string; role: ProjectRole }>> => {
    if (!isUuid(userId)) return REFUSALS.notFound;
    const { project, viewer: actor } = access;
    return inTransaction(db, async (trx) => {
      const removed = await deleteProjectAccess(trx, project.id, userId);
      if (!removed) return fail(404, "That person has no access to this project.");
      const who = await findUserContact(trx, userId);
      await writeAudit(trx, {
        actorId: actor.id,
        firmId: project.firmId,
        projectId: project.id,
        action: "access.revoke",
        targetType: "user",
        targetId: userId,
        detail: { email: who?.email ?? null, name: who?.name ?? null, role: removed.role },
      });
      return ok({ userId, role: removed.role });
    });
  },
});
