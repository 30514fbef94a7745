import { z } from "zod";
import { text } from "@/lib/validation/text";
import type { Executor } from "@/db/schema";
import { inTransaction } from "@/db/transaction";
import { defineAction } from "@/lib/actions/define";
import { authorizeProject, isUuid, type Viewer } from "@/lib/auth/access";
import { PROJECT_ROLES, type ProjectRole } from "@/lib/auth/roles";
import { writeAudit } from "@/db/queries/audit";
import { findUserByEmail, firmRolesOf } from "@/db/queries/users";
import { findOpenInvitations, insertInvitation, listProjectInvitations, revokeInvitationRow } from "@/db/queries/invitations";
import { cancelPendingMail, mailStatusByRef } from "@/db/queries/outbox";
import { listClientViewers } from "@/db/queries/sharing";
import { enqueueMail } from "@/lib/mail/outbox";
import { invitationMail } from "@/lib/mail/templates";
import { fail, ok, REFUSALS, type Result } from "@/lib/result";
import { invitationExpiry, invitationUrl, newInvitationToken } from "./tokens";

export const INVITATION_MAIL_KIND = "invitation";

/** The invite form and the invitations API share this payload. */
export const invitationInputSchema = z.object({
  email: text().trim().toLowerCase().max(320, "Use at most 320 characters.").email("Enter an e-mail address."),
  role: z.enum(PROJECT_ROLES, { error: "Choose owner or finance." }),
});
export type InvitationInput = z.infer<typeof invitationInputSchema>;

export interface CreatedInvitation {
  invitationId: string;
  mailId: string;
  email: string;
  role: ProjectRole;
  expiresAt: Date;
}

/**
 * A consultant invites an address to a project as owner or finance. The invitation, its e-mail (in the
 * outbox) and the audit event are written in one transaction: either the invitation exists and its mail
 * will go out, or neither. An older open invitation of the same address is withdrawn (one live link each).
 * A worker delivers it (the mail queue, lib/jobs). Input: `{ projectId, email, role }`.
 */
export const createInvitation = defineAction({
  gate: { project: "access.share" },
  schema: invitationInputSchema,
  invalidMessage: "Check the highlighted fields.",
  run: async (db, { access, now, appUrl }, { email, role }): Promise<Result<CreatedInvitation>> => {
    const { project, viewer: inviter } = access;
    const projectId = project.id;
    const existing = await findUserByEmail(db, email);
    if (existing) {
      const firms = await firmRolesOf(db, existing.id);
      if (firms.some((f) => f.firmId === project.firmId)) {
        return fail(409, `${email} is a member of ${project.firmName} and already sees this project.`, {
          email: ["This address belongs to a member of your firm."],
        });
      }
      const grant = (await listClientViewers(db, projectId)).find((v) => v.userId === existing.id);
      if (grant) {
        return fail(409, `${email} already has access as ${grant.role}. Revoke it first to change the role.`, {
          email: ["This person already has access."],
        });
      }
    }

    const { token, tokenHash } = newInvitationToken();
    const expiresAt = invitationExpiry(now);
    const mail = invitationMail({
      projectName: project.name,
      firmName: project.firmName,
      inviterName: inviter.name,
      role,
      url: invitationUrl(appUrl(), token),
      expiresAt,
    });

    const created = await inTransaction(db, async (trx) => {
      for (const old of await findOpenInvitations(trx, projectId, email)) {
        await revokeInvitationRow(trx, projectId, old.id);
        await cancelPendingMail(trx, INVITATION_MAIL_KIND, old.id, "Replaced by a newer invitation before it was sent.");
        await writeAudit(trx, {
          actorId: inviter.id,
          firmId: project.firmId,
          projectId,
          action: "invitation.revoke",
          targetType: "invitation",
          targetId: old.id,
          detail: { email, role: old.role, reason: "replaced" },
        });
      }
      const inv = await insertInvitation(trx, { projectId, email, role, tokenHash, expiresAt, invitedBy: inviter.id });
      const mailId = await enqueueMail(trx, { kind: INVITATION_MAIL_KIND, refId: inv.id, to: email, ...mail });
      await writeAudit(trx, {
        actorId: inviter.id,
        firmId: project.firmId,
        projectId,
        action: "invitation.create",
        targetType: "invitation",
        targetId: inv.id,
        detail: { email, role, expiresAt: expiresAt.toISOString() },
      });
      return { invitationId: inv.id, mailId, email, role, expiresAt };
    });
    return ok(created);
  },
});

/** Withdraw an invitation that has not been accepted; its unsent e-mail is cancelled with it. Input: `{ projectId, invitationId }`. */
export const revokeInvitation = defineAction({
  gate: { project: "access.revoke" },
  schema: z.object({ invitationId: text().max(64) }),
  run: async (db, { access }, { invitationId }): Promise<Result<{ invitationId: string; email: string }>> => {
    if (!isUuid(invitationId)) return REFUSALS.notFound;
    const { project, viewer: actor } = access;
    return inTransaction(db, async (trx) => {
      const row = await revokeInvitationRow(trx, project.id, invitationId);
      if (!row) return fail(404, "That invitation is not open any more (accepted, withdrawn, or not part of this project).");
      await cancelPendingMail(trx, INVITATION_MAIL_KIND, row.id, "Invitation withdrawn before it was sent.");
      await writeAudit(trx, {
        actorId: actor.id,
        firmId: project.firmId,
        projectId: project.id,
        action: "invitation.revoke",
        targetType: "invitation",
        targetId: row.id,
        detail: { email: row.email, role: row.role },
      });
      return ok({ invitationId: row.id, email: row.email });
    });
  },
});

export type InvitationState = "pending" | "accepted" | "revoked" | "expired";

export function invitationState(i: { acceptedAt: Date | null; revokedAt: Date | null; expiresAt: Date }, now: Date): InvitationState {
  if (i.acceptedAt) return "accepted";
  if (i.revokedAt) return "revoked";
  if (i.expiresAt.getTime() <= now.getTime()) return "expired";
  return "pending";
}

export interface InvitationDTO {
  id: string;
  email: string;
  role: ProjectRole;
  state: InvitationState;
  createdAt: Date;
  expiresAt: Date;
  acceptedAt: Date | null;
  revokedAt: Date | null;
  inviterName: string | null;
  acceptorName: string | null;
  mail: { status: "pending" | "sent" | "failed"; attempts: number; lastError: string | null; nextAttemptAt: Date; sentAt: Date | null } | null;
}

export interface ClientViewerDTO {
  userId: string;
  name: string;
  email: string;
  role: ProjectRole;
  since: Date;
  grantedByName: string | null;
}

/** Who has access to the project (client viewers) and every invitation with its e-mail's delivery state. */
export async function accessOverview(
  db: Executor,
  viewer: Viewer | null,
  projectId: string,
  now = new Date(),
): Promise<Result<{ viewers: ClientViewerDTO[]; invitations: InvitationDTO[] }>> {
  const auth = await authorizeProject(db, viewer, projectId, "access.share");
  if (!auth.ok) return auth;
  const [viewers, invitations] = await Promise.all([listClientViewers(db, projectId), listProjectInvitations(db, projectId)]);
  const mails = await mailStatusByRef(db, INVITATION_MAIL_KIND, invitations.map((i) => i.id));
  return ok({
    viewers,
    invitations: invitations.map((i) => {
      const m = mails.find((x) => x.refId === i.id);
      return {
        ...i,
        state: invitationState(i, now),
        mail: m ? { status: m.status, attempts: m.attempts, lastError: m.lastError, nextAttemptAt: m.nextAttemptAt, sentAt: m.sentAt } : null,
      };
    }),
  });
}
