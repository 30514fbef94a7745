/**
 * Role-shaped results on a real PostgreSQL, through the data-access layer every route, page and report
 * uses (lib/scenarios/resolve.ts, lib/sharing/versions.ts, lib/reports/source.ts): the seeded demo project
 * (invented firm, client and site) with its issued version 1. Expectations are written out per role here
 * (SEES_CASH_FLOWS below): the owner receives no yearly cash flows by
 * any of these paths; finance and the firm do. Read-only: independent of test order.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { testDb, uniq } from "../support/db";
import { DEMO_ACCOUNTS, DEMO_PROJECT } from "@/db/seed";
import { loadViewer, type Viewer } from "@/lib/auth/access";
import { resolveScenarioResult } from "@/lib/scenarios/resolve";
import { openIssuedVersion } from "@/lib/sharing/versions";
import { reportSourceOf } from "@/lib/reports/source";
import { reportTree } from "@/lib/reports/pdf/offthread";
import type { SerialNode } from "@/lib/reports/pdf/serialize";

const db = testDb();
afterAll(() => db.destroy());

type Role = keyof typeof DEMO_ACCOUNTS;
const viewers = {} as Record<Role | "outsider", Viewer>;
let projectId: string;
let scenarioId: string;

/** Who may receive yearly cash flows — written out, not read from the permission table. */
const SEES_CASH_FLOWS: Record<Role, boolean> = { admin: true, consultant: true, owner: false, finance: true };

beforeAll(async () => {
  for (const role of Object.keys(DEMO_ACCOUNTS) as Role[]) {
    const u = await db.selectFrom("users").select("id").where("email", "=", DEMO_ACCOUNTS[role].email).executeTakeFirstOrThrow();
    viewers[role] = (await loadViewer(db, u.id))!;
  }
  const project = await db.selectFrom("projects").select("id").where("name", "=", DEMO_PROJECT.name).executeTakeFirstOrThrow();
  projectId = project.id;
  scenarioId = (await db.selectFrom("scenarios").select("id").where("project_id", "=", projectId).orderBy("created_at").executeTakeFirstOrThrow()).id;
  const firm = await db.insertInto("firms").values({ name: uniq("Other firm ") }).returning("id").executeTakeFirstOrThrow();
  const other = await db.insertInto("users").values({ email: `${uniq("out")}@example.test`, name: "Outsider", password_hash: null }).returning("id").executeTakeFirstOrThrow();
  await db.insertInto("firm_members").values({ firm_id: firm.id, user_id: other.id, role: "consultant" }).execute();
  viewers.outsider = (await loadViewer(db, other.id))!;
});

function texts(node: SerialNode): string[] {
  return typeof node === "string" ? [node] : node.c.flatMap(texts);
}

const yearlyRows = (e: { options: { cashFlows: unknown[] }[]; comparisons: { differenceCashFlows: unknown[] }[] }) =>
  e.options.reduce((n, o) => n + o.cashFlows.length, 0) + e.comparisons.reduce((n, c) => n + c.differenceCashFlows.length, 0);

describe("the result each role receives", () => {
  for (const role of Object.keys(SEES_CASH_FLOWS) as Role[]) {
    it(`${role}: ${SEES_CASH_FLOWS[role] ? "with" : "without"} yearly cash flows, in the resolver, the issued-version page and the PDF`, async () => {
      const r = await resolveScenarioResult(db, viewers[role], scenarioId, { action: "project.view", version: null });
      expect(r.ok).toBe(true);
      if (!r.ok) return;
      // Client viewers get issued version 1 of the demo; the firm gets its draft.
      expect(r.value.kind).toBe(role === "owner" || role === "finance" ? "issued" : "draft");
      expect(r.value.cashFlowsWithheld).toBe(!SEES_CASH_FLOWS[role]);
      const rows = yearlyRows(r.value.result.economics);
      if (SEES_CASH_FLOWS[role]) expect(rows).toBeGreaterThan(0);
      else expect(rows).toBe(0);
      // No stray yearly table anywhere in the serialized payload.
      const json = JSON.stringify(r.value.result);
      if (!SEES_CASH_FLOWS[role]) expect(json).not.toMatch(/"cumulativePresentValue"|"presentValueByCategory"/);

      const page = await openIssuedVersion(db, viewers[role], projectId, scenarioId, 1);
      expect(page.ok).toBe(true);
      if (page.ok) {
        const e = (page.value.version.result as { economics: Parameters<typeof yearlyRows>[0] }).economics;
        if (SEES_CASH_FLOWS[role]) expect(yearlyRows(e)).toBeGreaterThan(0);
        else expect(yearlyRows(e)).toBe(0);
      }

      const src = await reportSourceOf(db, r.value, null);
      expect(src.ok).toBe(true);
      if (!src.ok) return;
      const text = texts(reportTree(src.value)).join(" ");
      expect(text).toContain("Life-cycle cost by category");
      if (SEES_CASH_FLOWS[role]) {
        expect(text).toContain("Yearly cash flows per option");
        expect(text).toContain("Cumulative discounted cost");
      } else {
        expect(text).not.toContain("Yearly cash flows per option");
        expect(text).not.toContain("Cumulative discounted cost");
      }
    });
  }

  it("refuses anonymous (401), another firm's consultant (404) and a version that does not exist (404)", async () => {
    expect(await resolveScenarioResult(db, null, scenarioId, { action: "project.view", version: null })).toMatchObject({ ok: false, status: 401 });
    expect(await resolveScenarioResult(db, viewers.outsider, scenarioId, { action: "project.view", version: null })).toMatchObject({ ok: false, status: 404 });
    expect(await resolveScenarioResult(db, viewers.owner, scenarioId, { action: "project.view", version: 99 })).toMatchObject({ ok: false, status: 404 });
    expect(await resolveScenarioResult(db, viewers.owner, "not-a-uuid", { action: "project.view", version: null })).toMatchObject({ ok: false, status: 404 });
  });
});
