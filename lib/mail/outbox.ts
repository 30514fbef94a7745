import type { Kysely } from "kysely";
import type { Database, Executor } from "@/db/schema";
import { cancelStaleInvitationMail, claimDueMail, insertOutboxMail, markMailAttemptFailed, markMailSent, type OutgoingMail } from "@/db/queries/outbox";
import type { MailTransport } from "./transport";


/** After this many failed attempts a message is marked failed (visible on the access page). */
export const MAX_MAIL_ATTEMPTS = 10;

/**
 * Wait before the next attempt after `failedAttempts` failures: 30 s doubling, capped at 1 h
 * (30 s, 1 min, 2 min … 1 h; about 4 h from the first try to the tenth).
 */
export function retryDelayS(failedAttempts: number): number {
  return Math.min(30 * 2 ** Math.max(0, failedAttempts - 1), 3600);
}

/** Queue a message; pass the transaction that creates what the message is about. */
export async function enqueueMail(db: Executor, m: OutgoingMail): Promise<string> {
  return (await insertOutboxMail(db, m)).id;
}

export interface DeliveryReport {
  sent: number;
  retrying: number;
  failed: number;
}

/**
 * Send every due pending message once. Each message is claimed (leased) before it is sent, so two
 * senders never send the same one; a failure is recorded with its error and scheduled again with back-off.
 * `asOf` lets a caller act as if later (tests); `onlyIds` restricts the run to some messages.
 */
export async function deliverDueMail(
  db: Kysely<Database>,
  transport: MailTransport,
  opts: { asOf?: Date; onlyIds?: string[]; batch?: number; leaseS?: number } = {},
): Promise<DeliveryReport> {
  const report: DeliveryReport = { sent: 0, retrying: 0, failed: 0 };
  await cancelStaleInvitationMail(db);
  for (let round = 0; round < 20; round++) {
    const claimed = await claimDueMail(db, {
      limit: opts.batch ?? 20,
      leaseS: opts.leaseS ?? 120,
      asOf: opts.asOf,
      onlyIds: opts.onlyIds,
    });
    if (claimed.length === 0) break;
    for (const m of claimed) {
      try {
        await transport.send({ to: m.to, subject: m.subject, text: m.text, html: m.html });
        await markMailSent(db, m.id);
        report.sent++;
      } catch (err) {
        const attempts = m.attempts + 1;
        const giveUp = attempts >= MAX_MAIL_ATTEMPTS;
        await markMailAttemptFailed(db, m.id, describeError(err), giveUp ? null : retryDelayS(attempts));
        if (giveUp) report.failed++;
        else report.retrying++;
      }
    }
  }
  return report;
}

function describeError(err: unknown): string {
  if (err instanceof Error) {
    const code = (err as { code?: unknown }).code;
    return typeof code === "string" ? `${code}: ${err.message}` : err.message;
  }
  return String(err);
}
