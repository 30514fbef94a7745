import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "kysely";
import { testDb } from "../support/db";
import { buildWorld, type World } from "./sharing-fixtures";
import { addComment, COMMENT_RATE_LIMIT } from "@/lib/sharing/comments";
import { cloneScenarioIn, archiveScenarioIn } from "@/lib/scenarios/data";

/**
 * Comments are rate-limited per person (COMMENT_RATE_LIMIT: 10 a minute), and refusals of the scenario
 * actions are 403/404 answers, never thrown errors. Expected statuses: tests/support/authz-table.ts's
 * conventions (404 no relation or unknown id, 403 a relation without the right, 429 over a limit).
 */
const db = testDb();
let w: World;
const APP_URL = { appUrl: "http://127.0.0.1:1" };

beforeAll(async () => {
  w = await buildWorld(db);
});
afterAll(() => db.destroy());

const countBy = async (authorId: string) =>
  Number((await db.selectFrom("comments").select(sql<string>`count(*)`.as("n")).where("author_id", "=", authorId).executeTakeFirstOrThrow()).n);

describe("comments are rate-limited per user", () => {
  it("15 comments sent at once by one person: 10 stored, 5 refused with 429 and a field message; another person is not held back", async () => {
    expect(COMMENT_RATE_LIMIT).toEqual({ max: 10, windowS: 60 });
    const owner = (await w.viewer("owner"))!;
    const before = await countBy(owner.id);
    const outbox0 = Number((await db.selectFrom("mail_outbox").select(sql<string>`count(*)`.as("n")).executeTakeFirstOrThrow()).n);
    const results = await Promise.all(
      Array.from({ length: 15 }, (_, i) => addComment(db, owner, { projectId: w.P.id, versionId: w.P.versionId, body: `burst ${i}` }, APP_URL)),
    );
    const stored = results.filter((r) => r.ok);
    const refused = results.filter((r) => !r.ok);
    expect(stored).toHaveLength(10);
    expect(refused).toHaveLength(5);
    for (const r of refused) {
      expect(r).toMatchObject({ ok: false, status: 429, detail: { retryAfterS: 60 } });
      if (!r.ok) {
        expect(r.error).toMatch(/wait a minute/);
        expect(r.fieldErrors?.body?.[0]).toMatch(/^At most 10 comments a minute/);
      }
    }
    expect((await countBy(owner.id)) - before).toBe(10);
    // Only the stored comments queued e-mails (one per firm member each).
    const notified = stored.reduce((n, r) => n + (r.ok ? r.value.notified : 0), 0);
    const outbox1 = Number((await db.selectFrom("mail_outbox").select(sql<string>`count(*)`.as("n")).executeTakeFirstOrThrow()).n);
    expect(outbox1 - outbox0).toBe(notified);

    const finance = await w.viewer("finance");
    expect(await addComment(db, finance, { projectId: w.P.id, versionId: w.P.versionId, body: "not held back" }, APP_URL)).toMatchObject({ ok: true });
  });

  it("once the minute has passed, the person may comment again", async () => {
    const owner = (await w.viewer("owner"))!;
    // Move this person's comments back in time instead of waiting a minute.
    await db.updateTable("comments").set({ created_at: sql`now() - interval '61 seconds'` }).where("author_id", "=", owner.id).execute();
    expect(await addComment(db, owner, { projectId: w.P.id, versionId: w.P.versionId, body: "after the window" }, APP_URL)).toMatchObject({ ok: true });
  });
});

describe("clone and archive refuse with 403/404, never throw", () => {
  const cases: [string, () => Promise<unknown>, number][] = [];
  beforeAll(() => {
    cases.push(
      ["clone, a client viewer", async () => cloneScenarioIn(db, await w.viewer("owner"), { projectId: w.P.id, scenarioId: w.P.scenarioId }), 403],
      ["clone, another firm", async () => cloneScenarioIn(db, await w.viewer("consultantOther"), { projectId: w.P.id, scenarioId: w.P.scenarioId }), 404],
      ["clone, a scenario of another project", async () => cloneScenarioIn(db, await w.viewer("consultant"), { projectId: w.P.id, scenarioId: w.C.scenarioId }), 404],
      ["clone, a non-UUID id", async () => cloneScenarioIn(db, await w.viewer("consultant"), { projectId: w.P.id, scenarioId: "../../etc" }), 404],
      ["clone, a NUL in the id", async () => cloneScenarioIn(db, await w.viewer("consultant"), { projectId: w.P.id, scenarioId: "a\u0000b" }), 422],
      ["archive, anonymous", async () => archiveScenarioIn(db, null, { projectId: w.P.id, scenarioId: w.P.scenarioId, archived: true }), 401],
      ["archive, finance viewer", async () => archiveScenarioIn(db, await w.viewer("finance"), { projectId: w.P.id, scenarioId: w.P.scenarioId, archived: true }), 403],
      ["archive, unknown scenario", async () => archiveScenarioIn(db, await w.viewer("consultant"), { projectId: w.P.id, scenarioId: "00000000-0000-4000-8000-000000000000", archived: true }), 404],
      ["archive, archived is a string", async () => archiveScenarioIn(db, await w.viewer("consultant"), { projectId: w.P.id, scenarioId: w.P.scenarioId, archived: "yes" }), 422],
      ["archive, a project id that is not a UUID", async () => archiveScenarioIn(db, await w.viewer("consultant"), { projectId: "1 or 1=1", scenarioId: w.P.scenarioId, archived: true }), 404],
    );
  });
  it("answers each refusal with its status", async () => {
    const got: string[] = [];
    for (const [name, run, want] of cases) {
      const r = (await run()) as { ok: boolean; status?: number };
      got.push(`${name}: ${r.ok ? 200 : r.status} (want ${want})`);
      expect(r.ok ? 200 : r.status, name).toBe(want);
    }
    const archived = await db.selectFrom("scenarios").select("archived_at").where("id", "=", w.P.scenarioId).executeTakeFirstOrThrow();
    expect(archived.archived_at).toBeNull();
  });
});
