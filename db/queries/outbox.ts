import { sql } from "kysely";
import type { Executor } from "../schema";


export interface OutgoingMail {
  kind: string;
  refId?: string | null;
  to: string;
  subject: string;
  text: string;
  html?: string | null;
}

/** Queue one message; call it inside the transaction that makes the message true (an invitation, a comment). */
export async function insertOutboxMail(db: Executor, m: OutgoingMail) {
  return db
    .insertInto("mail_outbox")
    .values({ kind: m.kind, ref_id: m.refId ?? null, to_address: m.to, subject: m.subject, text_body: m.text, html_body: m.html ?? null })
    .returning(["id"])
    .executeTakeFirstOrThrow();
}

export interface PendingMail {
  id: string;
  kind: string;
  refId: string | null;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  attempts: number;
}

/** A message still waiting to be sent (the mail job's handler reads it; null once sent or failed). */
export async function findPendingMail(db: Executor, id: string): Promise<PendingMail | undefined> {
  return db
    .selectFrom("mail_outbox")
    .select(["id", "kind", "ref_id as refId", "to_address as to", "subject", "text_body as text", "html_body as html", "attempts"])
    .where("id", "=", id)
    .where("status", "=", "pending")
    .executeTakeFirst();
}

/** Pending messages (a worker re-submits their jobs at start; the job id is the message id, so no repeats). */
export async function pendingMailIds(db: Executor, limit = 1000): Promise<string[]> {
  const rows = await db.selectFrom("mail_outbox").select("id").where("status", "=", "pending").orderBy("created_at").limit(limit).execute();
  return rows.map((r) => r.id);
}

/**
 * A delivered message. Its body is blanked: an invitation's body carries the only copy of its token,
 * which must not sit readable in the database once the recipient has it.
 */
export async function markMailSent(db: Executor, id: string) {
  await db
    .updateTable("mail_outbox")
    .set({ status: "sent", sent_at: sql`now()`, attempts: sql`attempts + 1`, last_error: null, text_body: "", html_body: null })
    .where("id", "=", id)
    .execute();
}

/** A failed attempt: the queue retries after at least `retryInS`, or give up (status failed) when `retryInS` is null. */
export async function markMailAttemptFailed(db: Executor, id: string, error: string, retryInS: number | null) {
  await db
    .updateTable("mail_outbox")
    .set({
      attempts: sql`attempts + 1`,
      last_error: error.slice(0, 500),
      status: retryInS === null ? "failed" : "pending",
      next_attempt_at: retryInS === null ? sql`now()` : sql`now() + make_interval(secs => ${retryInS})`,
      ...(retryInS === null ? { text_body: "", html_body: null } : {}),
    })
    .where("id", "=", id)
    .where("status", "=", "pending")
    .execute();
}

/** Withdraw unsent messages about something that no longer holds (a revoked invitation). */
export async function cancelPendingMail(db: Executor, kind: string, refId: string, reason: string) {
  await db
    .updateTable("mail_outbox")
    .set({ status: "failed", last_error: reason, text_body: "", html_body: null })
    .where("kind", "=", kind)
    .where("ref_id", "=", refId)
    .where("status", "=", "pending")
    .execute();
}

/**
 * An invitation e-mail still waiting (the mail server was down) whose invitation was accepted, withdrawn or
 * has expired in the meantime would only deliver a dead link: it is marked failed with the reason instead.
 */
export async function cancelStaleInvitationMail(db: Executor, onlyId?: string) {
  await sql`
    update mail_outbox m set status = 'failed', text_body = '', html_body = null,
      last_error = case when i.accepted_at is not null then 'Invitation already accepted; not sent.'
                        when i.revoked_at is not null then 'Invitation withdrawn before it was sent.'
                        else 'Invitation expired before it could be sent.' end
    from invitations i
    where m.kind = 'invitation' and m.status = 'pending' and m.ref_id = i.id::text
      and (i.accepted_at is not null or i.revoked_at is not null or i.expires_at <= now())
      and (${onlyId ?? null}::uuid is null or m.id = ${onlyId ?? null}::uuid)`.execute(db);
}

/** Delivery state only (never the body) of the messages about these references. */
export async function mailStatusByRef(db: Executor, kind: string, refIds: string[]) {
  if (refIds.length === 0) return [];
  return db
    .selectFrom("mail_outbox")
    .select([
      "id",
      "ref_id as refId",
      "status",
      "attempts",
      "last_error as lastError",
      "next_attempt_at as nextAttemptAt",
      "sent_at as sentAt",
      "created_at as createdAt",
    ])
    .where("kind", "=", kind)
    .where("ref_id", "in", refIds)
    .orderBy("created_at", "desc")
    .execute();
}

export async function findOutboxStatus(db: Executor, id: string) {
  return db
    .selectFrom("mail_outbox")
    .select(["id", "status", "attempts", "last_error as lastError", "next_attempt_at as nextAttemptAt", "sent_at as sentAt"])
    .where("id", "=", id)
    .executeTakeFirst();
}

/** Empty the bodies of messages that are no longer pending; returns how many. */
export async function clearFinishedMailBodies(db: Executor): Promise<number> {
  const r = await db
    .updateTable("mail_outbox")
    .set({ text_body: "", html_body: null })
    .where("status", "<>", "pending")
    .where((eb) => eb.or([eb("text_body", "<>", ""), eb("html_body", "is not", null)]))
    .executeTakeFirst();
  return Number(r.numUpdatedRows);
}
