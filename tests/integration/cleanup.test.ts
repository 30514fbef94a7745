import { afterAll, describe, expect, it } from "vitest";
import { sql } from "kysely";
import { testDb, uniq } from "../support/db";
import { buildWorld } from "./sharing-fixtures";
import { runCleanup } from "@/lib/jobs/handlers";

const db = testDb();
afterAll(() => db.destroy());

const DAY_MS = 86_400_000;

/**
 * The periodic cleanup removes only what has outlived its retention (30 days after an unused invitation
 * expired; throttle rows a day old whose block has passed; analysis API rows older than 24 h; bodies of
 * messages no longer pending) and leaves everything else. Each row here is made by this test, and the
 * checks look only at these rows, so other tests' rows do not matter.
 */
describe("cleanup of expired artefacts", () => {
  it("removes what outlived its retention and keeps the rest", async () => {
    const w = await buildWorld(db);
    const by = w.users.consultant.id;
    const now = Date.now();
    const invite = async (tag: string, expiresAt: Date, acceptedAt: Date | null) =>
      (
        await db
          .insertInto("invitations")
          .values({
            project_id: w.P.id,
            email: `${uniq(tag)}@example.test`,
            role: "owner",
            token_hash: uniq("hash"),
            expires_at: expiresAt,
            invited_by: by,
            accepted_at: acceptedAt,
          })
          .returning("id")
          .executeTakeFirstOrThrow()
      ).id;
    const oldUnused = await invite("old", new Date(now - 31 * DAY_MS), null);
    const recentUnused = await invite("recent", new Date(now - 29 * DAY_MS), null);
    const oldAccepted = await invite("accepted", new Date(now - 60 * DAY_MS), new Date(now - 61 * DAY_MS));

    const k = uniq("ip");
    await db
      .insertInto("sign_in_attempts")
      .values([
        { key: `${k}-stale`, failures: 3, window_start: new Date(now - 2 * DAY_MS), blocked_until: null },
        { key: `${k}-blocked`, failures: 9, window_start: new Date(now - 2 * DAY_MS), blocked_until: new Date(now + DAY_MS) },
        { key: `${k}-fresh`, failures: 1, window_start: new Date(now - 60_000), blocked_until: null },
      ])
      .execute();

    const api = async (hoursAgo: number) =>
      (
        await db
          .insertInto("api_analyses")
          .values({ user_id: by, inputs_hash: uniq("h"), input: null, created_at: new Date(now - hoursAgo * 3_600_000) })
          .returning("id")
          .executeTakeFirstOrThrow()
      ).id;
    const apiOld = await api(25);
    const apiNew = await api(1);

    const mail = async (status: "pending" | "sent") =>
      (
        await db
          .insertInto("mail_outbox")
          .values({ kind: "test", to_address: `${uniq("m")}@example.test`, subject: "s", text_body: "body text", html_body: "<p>body</p>", status })
          .returning("id")
          .executeTakeFirstOrThrow()
      ).id;
    const sent = await mail("sent");
    const pending = await mail("pending");

    const report = await runCleanup(db);
    // Counted over the whole database: at least this test's rows.
    expect(report.invitations).toBeGreaterThanOrEqual(1);
    expect(report.signInRows).toBeGreaterThanOrEqual(1);
    expect(report.apiAnalyses).toBeGreaterThanOrEqual(1);
    expect(report.mailBodies).toBeGreaterThanOrEqual(1);

    const invIds = (await db.selectFrom("invitations").select("id").where("id", "in", [oldUnused, recentUnused, oldAccepted]).execute()).map((r) => r.id);
    expect(invIds.sort()).toEqual([recentUnused, oldAccepted].sort());
    const keys = (await db.selectFrom("sign_in_attempts").select("key").where("key", "like", `${k}-%`).execute()).map((r) => r.key);
    expect(keys.sort()).toEqual([`${k}-blocked`, `${k}-fresh`]);
    const apiIds = (await db.selectFrom("api_analyses").select("id").where("id", "in", [apiOld, apiNew]).execute()).map((r) => r.id);
    expect(apiIds).toEqual([apiNew]);
    const bodies = await db.selectFrom("mail_outbox").select(["id", "text_body", "html_body"]).where("id", "in", [sent, pending]).execute();
    expect(bodies.find((b) => b.id === sent)).toMatchObject({ text_body: "", html_body: null });
    expect(bodies.find((b) => b.id === pending)).toMatchObject({ text_body: "body text", html_body: "<p>body</p>" });

    // A second run finds none of this test's rows left to remove.
    await runCleanup(db);
    const again = await sql<{ n: number }>`select count(*)::int as n from invitations where id in (${recentUnused}, ${oldAccepted})`.execute(db);
    expect(again.rows[0]?.n).toBe(2);
  });
});
