import type { Kysely } from "kysely";
import type { Database, Executor } from "@/db/schema";
import { cancelStaleInvitationMail, findPendingMail, insertOutboxMail, markMailAttemptFailed, markMailSent, type OutgoingMail } from "@/db/queries/outbox";
import { sendJob } from "@/lib/jobs/boss";
import { MAIL_ATTEMPTS, QUEUES } from "@/lib/jobs/queues";
import type { MailTransport } from "./transport";

/**
 * The earliest the queue retries after `failedAttempts` failures with a first delay of `delayS`: pg-boss
 * waits delay·2^(n−1) to twice that (exponential back-off with jitter) — 30–60 s, 1–2 min, 2–4 min …
 * for the default 30 s. Shown on the access page as "next try after".
 */
export function earliestRetryS(failedAttempts: number, delayS: number): number {
  return delayS * 2 ** Math.max(0, failedAttempts - 1);
}

/**
 * Queue a message: its outbox row and its delivery job, in the caller's transaction (the one that creates
 * what the message is about), so both commit or neither. The job's id is the row's id: one job per
 * message, whatever re-submits it.
 */
export async function enqueueMail(db: Executor, m: OutgoingMail): Promise<string> {
  if (!db.isTransaction) return db.transaction().execute((trx) => enqueueMail(trx, m));
  const { id } = await insertOutboxMail(db, m);
  await sendJob(db, QUEUES.mail, { kind: "mail", outboxId: id }, { id });
  return id;
}

export type DeliveryOutcome = "sent" | "skipped" | "failed" | "retry";

/** Thrown so that the queue retries the job later (its message stays pending). */
export class MailRetryLater extends Error {}

/**
 * Deliver one outbox message (the mail job's handler). A message that is no longer pending — sent
 * already, failed, withdrawn, or an invitation that expired or was accepted meanwhile — is skipped, so a
 * job that runs twice sends once; the SMTP Message-ID is derived from the row so that a receiving server
 * can also recognise a repeat. A failed attempt is recorded and thrown (the queue retries with back-off)
 * until the last one, which marks the message failed.
 */
export async function deliverOutboxMail(
  db: Kysely<Database>,
  transport: MailTransport,
  outboxId: string,
  attempt: { retryCount: number; retryLimit: number; retryDelayS: number },
): Promise<DeliveryOutcome> {
  await cancelStaleInvitationMail(db, outboxId);
  const m = await findPendingMail(db, outboxId);
  if (!m) return "skipped";
  try {
    await transport.send({ to: m.to, subject: m.subject, text: m.text, html: m.html, messageId: `<${m.id}@loopledger.mail>` });
  } catch (err) {
    const attempts = m.attempts + 1;
    const last = attempt.retryCount >= attempt.retryLimit || attempts >= MAIL_ATTEMPTS;
    await markMailAttemptFailed(db, m.id, describeError(err), last ? null : earliestRetryS(attempts, attempt.retryDelayS));
    if (last) return "failed";
    throw new MailRetryLater(`attempt ${attempts} failed: ${describeError(err)}`);
  }
  await markMailSent(db, m.id);
  return "sent";
}

function describeError(err: unknown): string {
  if (err instanceof Error) {
    const code = (err as { code?: unknown }).code;
    return typeof code === "string" ? `${code}: ${err.message}` : err.message;
  }
  return String(err);
}
