import { afterAll, describe, expect, it } from "vitest";
import net from "node:net";
import { sql } from "kysely";
import { testDb, uniq } from "../support/db";
import { deliverOutboxMail, earliestRetryS, enqueueMail, MailRetryLater } from "@/lib/mail/outbox";
import { smtpTransport } from "@/lib/mail/transport";
import { startCaptureServer } from "@/lib/mail/capture";
import { findOutboxStatus } from "@/db/queries/outbox";
import { ensureQueues } from "@/lib/jobs/boss";
import { MAIL_ATTEMPTS, QUEUES } from "@/lib/jobs/queues";
import { startWorker } from "@/lib/jobs/worker";

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

async function mailJob(id: string) {
  const r = await sql<{ state: string; retry_limit: number; retry_delay: number; retry_backoff: boolean }>`
    select state, retry_limit, retry_delay, retry_backoff from pgboss.job where name = ${QUEUES.mail} and id = ${id}::uuid`.execute(db);
  return r.rows[0];
}

const FIRST = { retryCount: 0, retryLimit: MAIL_ATTEMPTS - 1, retryDelayS: 30 };

describe("mail outbox", () => {
  it("queues a message and its delivery job together, or neither", async () => {
    const to = `${uniq("atomic")}@example.test`;
    await db
      .transaction()
      .execute(async (trx) => {
        await enqueueMail(trx, { kind: "test", to, subject: "Rolled back", text: "t" });
        throw new Error("roll back");
      })
      .catch(() => undefined);
    expect(await db.selectFrom("mail_outbox").select("id").where("to_address", "=", to).execute()).toHaveLength(0);

    const id = await enqueueMail(db, { kind: "test", to, subject: "Kept", text: "t" });
    // One job per message: its id is the message's, and it retries ten attempts in all with back-off.
    expect(await mailJob(id)).toMatchObject({ state: "created", retry_limit: MAIL_ATTEMPTS - 1, retry_backoff: true });
  });

  it("keeps a message while the SMTP server is down and sends it once one is up, once", async () => {
    const port = await freePort();
    const transport = smtpTransport({ host: "127.0.0.1", port, from: "LoopLedger <no-reply@loopledger.test>" });
    const to = `${uniq("outbox")}@example.test`;
    const id = await enqueueMail(db, { kind: "test", to, subject: "Outbox check", text: "Body with a link http://127.0.0.1/x" });

    // Server down: the attempt fails and is thrown for the queue to retry; the message stays pending.
    await expect(deliverOutboxMail(db, transport, id, FIRST)).rejects.toBeInstanceOf(MailRetryLater);
    const afterDown = await findOutboxStatus(db, id);
    expect(afterDown?.status).toBe("pending");
    expect(afterDown?.attempts).toBe(1);
    expect(afterDown?.lastError).toMatch(/ECONNREFUSED/);
    const nowDb = (await sql<{ now: Date }>`select now() as now`.execute(db)).rows[0]!.now;
    const waitS = (afterDown!.nextAttemptAt.getTime() - nowDb.getTime()) / 1000;
    expect(waitS).toBeGreaterThan(30 - 5);
    expect(waitS).toBeLessThanOrEqual(30 + 1);

    const smtp = await startCaptureServer({ port });
    try {
      expect(await deliverOutboxMail(db, transport, id, { ...FIRST, retryCount: 1 })).toBe("sent");
      const got = await smtp.waitFor((m) => m.envelopeTo.includes(to), 5000);
      expect(got.subject).toBe("Outbox check");
      expect(got.text).toContain("http://127.0.0.1/x");
      // The Message-ID is the message's own, so a repeat would be recognisable downstream too.
      expect(got.messageId).toBe(`<${id}@loopledger.mail>`);
      const sent = await findOutboxStatus(db, id);
      expect(sent?.status).toBe("sent");
      expect(sent?.attempts).toBe(2);
      expect(sent?.sentAt).toBeInstanceOf(Date);
      // The queue delivers at least once: a repeat of the job sends nothing.
      expect(await deliverOutboxMail(db, transport, id, { ...FIRST, retryCount: 2 })).toBe("skipped");
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
    await db.updateTable("mail_outbox").set({ attempts: MAIL_ATTEMPTS - 1 }).where("id", "=", id).execute();
    expect(await deliverOutboxMail(db, transport, id, { ...FIRST, retryCount: MAIL_ATTEMPTS - 1 })).toBe("failed");
    expect(await findOutboxStatus(db, id)).toMatchObject({ status: "failed", attempts: MAIL_ATTEMPTS });
  });

  it("the earliest retry follows pg-boss's back-off: delay·2^(n−1), here from 30 s", () => {
    // pg-boss 10 (src/plans.js, failJobs): start_after = now + d·2^min(16, c+1)/2·(1 + random) after the
    // attempt with retry_count c = n − 1; the lower bound is d·2^(n−1). Written out by hand for d = 30 s.
    expect([1, 2, 3, 4, 5, 6, 7, 8, 9].map((n) => earliestRetryS(n, 30))).toEqual([30, 60, 120, 240, 480, 960, 1920, 3840, 7680]);
  });

  it("end to end: a worker retries with back-off while the server is down and delivers once it is up", async () => {
    const port = await freePort();
    const transport = smtpTransport({ host: "127.0.0.1", port, from: "x@loopledger.test" });
    process.env.MAIL_RETRY_DELAY_S = "1";
    const worker = await startWorker({ connectionString: process.env.DATABASE_URL!, db, transport, queues: [QUEUES.mail], resubmit: false, log: () => undefined });
    const to = `${uniq("e2e")}@example.test`;
    try {
      const id = await enqueueMail(db, { kind: "test", to, subject: "Through the queue", text: "t" });
      await expect.poll(async () => (await findOutboxStatus(db, id))?.attempts, { timeout: 20_000, interval: 200 }).toBeGreaterThanOrEqual(2);
      const smtp = await startCaptureServer({ port });
      try {
        await smtp.waitFor((m) => m.envelopeTo.includes(to), 30_000);
        await expect.poll(async () => (await findOutboxStatus(db, id))?.status, { timeout: 10_000, interval: 200 }).toBe("sent");
        expect(smtp.messages.filter((m) => m.envelopeTo.includes(to))).toHaveLength(1);
      } finally {
        await smtp.close();
      }
    } finally {
      await worker.stop();
      delete process.env.MAIL_RETRY_DELAY_S;
      const { default: PgBoss } = await import("pg-boss");
      const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, max: 1, supervise: false, schedule: false });
      await boss.start();
      await ensureQueues(boss);
      await boss.stop({ graceful: false });
    }
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
      expect(await deliverOutboxMail(db, transport, r.value.mailId, FIRST)).toBe("skipped");
      expect(await findOutboxStatus(db, r.value.mailId)).toMatchObject({ status: "failed", lastError: "Invitation expired before it could be sent." });
      expect(smtp.messages).toHaveLength(0);
    } finally {
      await smtp.close();
    }
  });
});
