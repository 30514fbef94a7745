import { afterAll, describe, expect, it } from "vitest";
import net from "node:net";
import { sql } from "kysely";
import { testDb, uniq } from "../support/db";
import { deliverDueMail, enqueueMail, MAX_MAIL_ATTEMPTS, retryDelayS } from "@/lib/mail/outbox";
import { smtpTransport } from "@/lib/mail/transport";
import { startCaptureServer } from "@/lib/mail/capture";
import { findOutboxStatus } from "@/db/queries/outbox";

const db = testDb();
afterAll(() => db.destroy());

/** A loopback port nobody listens on: bind one, note it, release it. */
async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

describe("mail outbox", () => {
  it("keeps a message while the SMTP server is down and sends it once one is up", async () => {
    const port = await freePort();
    const transport = smtpTransport({ host: "127.0.0.1", port, from: "LoopLedger <no-reply@loopledger.test>" });
    const to = `${uniq("outbox")}@example.test`;
    const id = await enqueueMail(db, { kind: "test", to, subject: "Outbox check", text: "Body with a link http://127.0.0.1/x" });

    // Server down: the attempt fails, the message stays pending with the error and a later retry time.
    const down = await deliverDueMail(db, transport, { onlyIds: [id] });
    expect(down).toEqual({ sent: 0, retrying: 1, failed: 0 });
    const afterDown = await findOutboxStatus(db, id);
    expect(afterDown?.status).toBe("pending");
    expect(afterDown?.attempts).toBe(1);
    expect(afterDown?.lastError).toMatch(/ECONNREFUSED/);
    const nowDb = (await sql<{ now: Date }>`select now() as now`.execute(db)).rows[0]!.now;
    const waitS = (afterDown!.nextAttemptAt.getTime() - nowDb.getTime()) / 1000;
    expect(waitS).toBeGreaterThan(retryDelayS(1) - 5);
    expect(waitS).toBeLessThanOrEqual(retryDelayS(1) + 1);

    // Not due yet: a pass right away leaves it alone.
    expect(await deliverDueMail(db, transport, { onlyIds: [id] })).toEqual({ sent: 0, retrying: 0, failed: 0 });

    // The server comes back; at the retry time the message goes out, once.
    const smtp = await startCaptureServer({ port });
    try {
      const later = new Date(Date.now() + 10 * 60_000);
      expect(await deliverDueMail(db, transport, { onlyIds: [id], asOf: later })).toEqual({ sent: 1, retrying: 0, failed: 0 });
      const got = await smtp.waitFor((m) => m.envelopeTo.includes(to), 5000);
      expect(got.subject).toBe("Outbox check");
      expect(got.text).toContain("http://127.0.0.1/x");
      const sent = await findOutboxStatus(db, id);
      expect(sent?.status).toBe("sent");
      expect(sent?.attempts).toBe(2);
      expect(sent?.sentAt).toBeInstanceOf(Date);
      expect(await deliverDueMail(db, transport, { onlyIds: [id], asOf: later })).toEqual({ sent: 0, retrying: 0, failed: 0 });
      expect(smtp.messages.filter((m) => m.envelopeTo.includes(to))).toHaveLength(1);
      // The body (an invitation's carries its token) is not kept once delivered.
      const row = await db.selectFrom("mail_outbox").select(["text_body", "html_body"]).where("id", "=", id).executeTakeFirstOrThrow();
      expect(row).toEqual({ text_body: "", html_body: null });
    } finally {
      await smtp.close();
    }
  });

  it("gives up after the last attempt and shows it as failed", async () => {
    const port = await freePort();
    const transport = smtpTransport({ host: "127.0.0.1", port, from: "x@loopledger.test" });
    const id = await enqueueMail(db, { kind: "test", to: `${uniq()}@example.test`, subject: "s", text: "t" });
    await db.updateTable("mail_outbox").set({ attempts: MAX_MAIL_ATTEMPTS - 1 }).where("id", "=", id).execute();
    expect(await deliverDueMail(db, transport, { onlyIds: [id] })).toEqual({ sent: 0, retrying: 0, failed: 1 });
    expect(await findOutboxStatus(db, id)).toMatchObject({ status: "failed", attempts: MAX_MAIL_ATTEMPTS });
  });

  it("two senders at once send each message once (claims skip locked rows)", async () => {
    const port = await freePort();
    const smtp = await startCaptureServer({ port });
    try {
      const transport = smtpTransport({ host: "127.0.0.1", port, from: "x@loopledger.test" });
      const tag = uniq("pair");
      const ids = [];
      for (let i = 0; i < 6; i++) ids.push(await enqueueMail(db, { kind: "test", to: `${tag}-${i}@example.test`, subject: `m${i}`, text: "t" }));
      const [a, b] = await Promise.all([
        deliverDueMail(db, transport, { onlyIds: ids, batch: 2 }),
        deliverDueMail(db, transport, { onlyIds: ids, batch: 2 }),
      ]);
      expect(a.sent + b.sent).toBe(6);
      expect(smtp.messages.filter((m) => m.envelopeTo[0]?.startsWith(tag))).toHaveLength(6);
    } finally {
      await smtp.close();
    }
  });

  it("back-off doubles from 30 s and stops at 1 h", () => {
    // The schedule documented in lib/mail/outbox.ts (common practice, no source: exponential back-off with a cap).
    expect([1, 2, 3, 4, 5, 6, 7, 8, 9].map(retryDelayS)).toEqual([30, 60, 120, 240, 480, 960, 1920, 3600, 3600]);
  });
});

describe("invitation e-mails that could not go out in time", () => {
  it("are not sent once their invitation expired, and say why", async () => {
    const { buildWorld } = await import("./sharing-fixtures");
    const { createInvitation } = await import("@/lib/sharing/invitations");
    const w = await buildWorld(db);
    const r = await createInvitation(db, await w.viewer("consultant"), { projectId: w.P.id, email: `${uniq("late")}@example.test`, role: "owner" }, { appUrl: "http://127.0.0.1:1" });
    if (!r.ok) throw new Error(r.error);
    await db.updateTable("invitations").set({ expires_at: sql`now() - interval '1 second'` }).where("id", "=", r.value.invitationId).execute();
    const port = await freePort();
    const smtp = await startCaptureServer({ port });
    try {
      const transport = smtpTransport({ host: "127.0.0.1", port, from: "x@loopledger.test" });
      expect(await deliverDueMail(db, transport, { onlyIds: [r.value.mailId] })).toEqual({ sent: 0, retrying: 0, failed: 0 });
      expect(await findOutboxStatus(db, r.value.mailId)).toMatchObject({ status: "failed", lastError: "Invitation expired before it could be sent." });
      expect(smtp.messages).toHaveLength(0);
    } finally {
      await smtp.close();
    }
  });
});
