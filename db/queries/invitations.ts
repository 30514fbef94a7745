import { sql } from "kysely";
import type { Executor } from "../schema";
import type { ProjectRole } from "@/db/enums";


export async function insertInvitation(
  db: Executor,
  i: { projectId: string; email: string; role: ProjectRole; tokenHash: string; expiresAt: Date; invitedBy: string },
) {
  return db
    .insertInto("invitations")
    .values({
      project_id: i.projectId,
      email: i.email,
      role: i.role,
      token_hash: i.tokenHash,
      expires_at: i.expiresAt,
      invited_by: i.invitedBy,
    })
    .returning(["id", "expires_at as expiresAt"])
    .executeTakeFirstOrThrow();
}

/** The invitation a link points at, with its project and firm (no token hash in the result). */
export async function findInvitationByTokenHash(db: Executor, tokenHash: string) {
  return db
    .selectFrom("invitations")
    .innerJoin("projects", "projects.id", "invitations.project_id")
    .innerJoin("firms", "firms.id", "projects.firm_id")
    .leftJoin("users as inviter", "inviter.id", "invitations.invited_by")
    .select([
      "invitations.id",
      "invitations.project_id as projectId",
      "invitations.email",
      "invitations.role",
      "invitations.expires_at as expiresAt",
      "invitations.accepted_at as acceptedAt",
      "invitations.revoked_at as revokedAt",
      "invitations.invited_by as invitedBy",
      "projects.name as projectName",
      "projects.firm_id as firmId",
      "firms.name as firmName",
      "inviter.name as inviterName",
    ])
    .where("invitations.token_hash", "=", tokenHash)
    .executeTakeFirst();
}

/** Invitations of a project, newest first (no token hash). */
export async function listProjectInvitations(db: Executor, projectId: string) {
  return db
    .selectFrom("invitations")
    .leftJoin("users as inviter", "inviter.id", "invitations.invited_by")
    .leftJoin("users as acceptor", "acceptor.id", "invitations.accepted_by")
    .select([
      "invitations.id",
      "invitations.email",
      "invitations.role",
      "invitations.expires_at as expiresAt",
      "invitations.accepted_at as acceptedAt",
      "invitations.revoked_at as revokedAt",
      "invitations.created_at as createdAt",
      "inviter.name as inviterName",
      "acceptor.name as acceptorName",
    ])
    .where("invitations.project_id", "=", projectId)
    .orderBy("invitations.created_at", "desc")
    .execute();
}

/** Open invitations of a project for an address (pending: not accepted, not revoked, not expired). */
export async function findOpenInvitations(db: Executor, projectId: string, email: string) {
  return db
    .selectFrom("invitations")
    .select(["id", "role"])
    .where("project_id", "=", projectId)
    .where(sql`lower(email)`, "=", email.trim().toLowerCase())
    .where("accepted_at", "is", null)
    .where("revoked_at", "is", null)
    .where("expires_at", ">", sql<Date>`now()`)
    .execute();
}

/** Withdraw an open invitation of this project; returns its id, or undefined when none was open. */
export async function revokeInvitationRow(db: Executor, projectId: string, invitationId: string) {
  return db
    .updateTable("invitations")
    .set({ revoked_at: sql`now()` })
    .where("id", "=", invitationId)
    .where("project_id", "=", projectId)
    .where("accepted_at", "is", null)
    .where("revoked_at", "is", null)
    .returning(["id", "email", "role"])
    .executeTakeFirst();
}

/**
 * Spend the invitation: the one statement that decides whether the link still works, so two tabs
 * accepting at once cannot both succeed. Returns undefined when it was used, withdrawn or expired.
 */
export async function consumeInvitation(db: Executor, invitationId: string, userId: string) {
  return db
    .updateTable("invitations")
    .set({ accepted_at: sql`now()`, accepted_by: userId })
    .where("id", "=", invitationId)
    .where("accepted_at", "is", null)
    .where("revoked_at", "is", null)
    .where("expires_at", ">", sql<Date>`now()`)
    .returning(["id", "project_id as projectId", "role", "email"])
    .executeTakeFirst();
}

/** Delete invitations that expired unused more than `days` ago (the audit trail keeps the record). */
export async function deleteInvitationsExpiredBefore(db: Executor, days: number): Promise<number> {
  const r = await db
    .deleteFrom("invitations")
    .where("accepted_at", "is", null)
    .where("expires_at", "<", sql<Date>`now() - make_interval(days => ${days})`)
    .executeTakeFirst();
  return Number(r.numDeletedRows);
}
