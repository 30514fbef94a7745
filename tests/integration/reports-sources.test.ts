/**
 * The report's queries on a real PostgreSQL: which stored result a draft report uses, which issued
 * version a client viewer gets, and the Monte Carlo run stored beside a result.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  findFirmMemberName,
  findLatestDoneResult,
  findMonteCarloResult,
  findReportScenario,
} from "@/db/queries/report-sources";
import { findIssuedVersion } from "@/db/queries/versions";
import { testDb, uniq } from "../support/db";

const db = testDb();
let scenarioId: string;
let firmId: string;
let consultantId: string;

beforeAll(async () => {
  const firm = await db
    .insertInto("firms")
    .values({ name: uniq("Report test firm ") })
    .returning("id")
    .executeTakeFirstOrThrow();
  firmId = firm.id;
  const user = await db
    .insertInto("users")
    .values({ email: `${uniq("rep")}@example.test`, name: "Rita Reporter", password_hash: null })
    .returning("id")
    .executeTakeFirstOrThrow();
  consultantId = user.id;
  await db
    .insertInto("firm_members")
    .values({ firm_id: firmId, user_id: consultantId, role: "consultant" })
    .execute();
  const project = await db
    .insertInto("projects")
    .values({ firm_id: firmId, name: uniq("Report project "), client_name: "C", site_name: "S" })
    .returning("id")
    .executeTakeFirstOrThrow();
  const s = await db
    .insertInto("scenarios")
    .values({
      project_id: project.id,
      name: "Draft",
      input: JSON.stringify({ name: "Draft" }),
      created_by: consultantId,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  scenarioId = s.id;
  const result = (tag: string) => JSON.stringify({ tag, physics: [], economics: { options: [] } });
  await db
    .insertInto("scenario_results")
    .values([
      {
        scenario_id: scenarioId,
        engine_version: "0.9.0",
        inputs_hash: "h-old",
        kind: "full",
        status: "done",
        result: result("old engine, newer run"),
        finished_at: new Date("2026-12-01T12:00:00Z"),
      },
      {
        scenario_id: scenarioId,
        engine_version: "1.0.0",
        inputs_hash: "h1",
        kind: "full",
        status: "done",
        result: result("current engine"),
        finished_at: new Date("2026-12-01T10:00:00Z"),
      },
      {
        scenario_id: scenarioId,
        engine_version: "1.0.0",
        inputs_hash: "h2",
        kind: "full",
        status: "running",
        result: null,
      },
      {
        scenario_id: scenarioId,
        engine_version: "1.0.0",
        inputs_hash: "h1",
        kind: "monteCarlo",
        status: "done",
        result: JSON.stringify({ draws: 10 }),
        finished_at: new Date(),
      },
    ])
    .execute();
  for (const n of [1, 2]) {
    await db
      .insertInto("scenario_versions")
      .values({
        scenario_id: scenarioId,
        project_id: project.id,
        version_number: n,
        name: `Issued ${n}`,
        input: "{}",
        input_version: 1,
        result: result(`v${n}`),
        engine_version: "1.0.0",
        inputs_hash: "h1",
        scenario_revision: n,
        issued_by: consultantId,
      })
      .execute();
  }
});

afterAll(async () => {
  await db.destroy();
});

describe("report source queries", () => {
  it("finds the scenario with its project", async () => {
    const s = await findReportScenario(db, scenarioId);
    expect(s?.name).toBe("Draft");
    expect(await findReportScenario(db, "00000000-0000-4000-8000-000000000000")).toBeUndefined();
  });

  it("uses the latest finished result of the current engine version for a draft, never a running one", async () => {
    const r = await findLatestDoneResult(db, scenarioId, "1.0.0");
    expect((r?.result as { tag: string }).tag).toBe("current engine");
    // With no result of the asked version, the newest finished one of any version.
    const any = await findLatestDoneResult(db, scenarioId, "2.0.0");
    expect((any?.result as { tag: string }).tag).toBe("old engine, newer run");
  });

  it("gives the latest issued version, or the one asked for", async () => {
    expect((await findIssuedVersion(db, scenarioId, null))?.versionNumber).toBe(2);
    expect((await findIssuedVersion(db, scenarioId, 1))?.name).toBe("Issued 1");
    expect(await findIssuedVersion(db, scenarioId, 7)).toBeUndefined();
  });

  it("finds the Monte Carlo run of the same engine version and inputs only", async () => {
    expect((await findMonteCarloResult(db, scenarioId, "1.0.0", "h1"))?.result).toEqual({ draws: 10 });
    expect(await findMonteCarloResult(db, scenarioId, "1.0.0", "h2")).toBeUndefined();
  });

  it("names the preparing consultant only while they belong to the firm", async () => {
    expect(await findFirmMemberName(db, consultantId, firmId)).toBe("Rita Reporter");
    const other = await db
      .insertInto("firms")
      .values({ name: uniq("Other firm ") })
      .returning("id")
      .executeTakeFirstOrThrow();
    expect(await findFirmMemberName(db, consultantId, other.id)).toBeNull();
  });
});
