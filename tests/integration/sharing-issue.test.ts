import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { testDb } from "../support/db";
import { buildWorld, type World } from "./sharing-fixtures";
import { importClimateFile } from "@/lib/climate/import";
import { buildEngineInput, loadScenarioContext } from "@/lib/scenarios/store";
import { analyzeAndStore } from "@/lib/scenarios/analysis";
import { toStoredInput, type ScenarioDocument } from "@/lib/scenarios/mappers";
import { inputsHash } from "@/lib/scenarios/hash";
import { ENGINE_VERSION } from "@/lib/engine";
import { issueScenario, openIssuedVersion } from "@/lib/sharing/versions";

/**
 * Issuing with the real "current result" lookup: the draft's stored document + its climate dataset (imported
 * from the test EPW through the climate import) + the project's site, looked up under the current engine
 * version and the hash of that input.
 */
const db = testDb();
let w: World;
let datasetId: string;
const FIXTURE = path.resolve(__dirname, "../fixtures/scenario-hourly.json");
const EPW = path.resolve(__dirname, "../fixtures/weather/harrowgate-flats.epw");

async function analyse(id: string) {
  const ctx = await loadScenarioContext(db, id);
  const built = buildEngineInput(ctx!.dto.document as ScenarioDocument, ctx!.dataset, ctx!.project);
  if (!built.ok) throw new Error(JSON.stringify(built.fieldErrors));
  return { built: built.input, stored: await analyzeAndStore(db, id, built.input, { inline: true }) };
}

beforeAll(async () => {
  w = await buildWorld(db);
  const consultant = await w.viewer("consultant");
  const imported = await importClimateFile(
    db,
    { projectId: w.P.id, firmId: w.firmA, actorId: consultant!.id, siteElevationM: 0 },
    { file: { name: "harrowgate-flats.epw", bytes: readFileSync(EPW) } },
  );
  if (imported.status !== 201) throw new Error(JSON.stringify(imported.body));
  // The climate dataset is shared and never changed; every test makes its own draft scenario.
  datasetId = imported.body.datasetId;
});

/** A draft scenario of this test's own, from the hourly fixture, with no result yet. */
async function newDraft(): Promise<string> {
  const doc = JSON.parse(readFileSync(FIXTURE, "utf8")) as Record<string, unknown>;
  const s = await db
    .insertInto("scenarios")
    .values({ project_id: w.P.id, name: "Issue check", climate_dataset_id: datasetId, input: JSON.stringify(toStoredInput(doc, datasetId)) })
    .returning("id")
    .executeTakeFirstOrThrow();
  return s.id;
}
afterAll(() => db.destroy());

describe("issuing freezes exactly what was analysed", () => {
  it("is refused while the draft's current inputs have no stored result", async () => {
    const scenarioId = await newDraft();
    const r = await issueScenario(db, await w.viewer("consultant"), { projectId: w.P.id, scenarioId: scenarioId });
    expect(r).toMatchObject({ ok: false, status: 409 });
    if (!r.ok) expect(r.error).toMatch(/no finished result for the scenario's current inputs/);
  });

  it("freezes the engine input (climate included) and the stored result under its key", async () => {
    const scenarioId = await newDraft();
    const { built, stored } = await analyse(scenarioId);
    const r = await issueScenario(db, await w.viewer("consultant"), { projectId: w.P.id, scenarioId: scenarioId, note: "v1" });
    expect(r.ok).toBe(true);
    const row = await db.selectFrom("scenario_versions").selectAll().where("scenario_id", "=", scenarioId).executeTakeFirstOrThrow();
    expect(row.version_number).toBe(1);
    expect(row.engine_version).toBe(ENGINE_VERSION);
    expect(row.inputs_hash).toBe(inputsHash(built));
    expect(row.inputs_hash).toBe(stored.inputsHash);
    expect(inputsHash(row.input)).toBe(row.inputs_hash);
    expect((row.result as { economics: { lowestLccOptionId: string } }).economics.lowestLccOptionId).toBe(stored.result!.economics.lowestLccOptionId);
    // 8760 hourly records of the test year travel with the version.
    expect((row.input as { climate: { dryBulbC: number[] } }).climate.dryBulbC).toHaveLength(8760);
  });

  it("after an edit the draft needs a new analysis before it can be issued again; version 1 never changes", async () => {
    const scenarioId = await newDraft();
    await analyse(scenarioId);
    expect((await issueScenario(db, await w.viewer("consultant"), { projectId: w.P.id, scenarioId })).ok).toBe(true);
    const v1 = await db.selectFrom("scenario_versions").selectAll().where("scenario_id", "=", scenarioId).executeTakeFirstOrThrow();
    const draft = await db.selectFrom("scenarios").select(["input"]).where("id", "=", scenarioId).executeTakeFirstOrThrow();
    const edited = structuredClone(draft.input) as { economics: { realDiscountRate: number } };
    edited.economics.realDiscountRate = 0.07;
    await db.updateTable("scenarios").set({ input: JSON.stringify(edited), revision: 2 }).where("id", "=", scenarioId).execute();

    expect(await issueScenario(db, await w.viewer("consultant"), { projectId: w.P.id, scenarioId: scenarioId })).toMatchObject({ ok: false, status: 409 });
    await analyse(scenarioId);
    const v2 = await issueScenario(db, await w.viewer("admin"), { projectId: w.P.id, scenarioId: scenarioId });
    expect(v2.ok && v2.value.versionNumber).toBe(2);

    const v1After = await db.selectFrom("scenario_versions").selectAll().where("id", "=", v1.id).executeTakeFirstOrThrow();
    expect(v1After).toEqual(v1);
    const opened = await openIssuedVersion(db, await w.viewer("owner"), w.P.id, scenarioId, 1);
    expect(opened.ok && (opened.value.version.input as { economics: { realDiscountRate: number } }).economics.realDiscountRate).toBe(0.04);
    const opened2 = await openIssuedVersion(db, await w.viewer("owner"), w.P.id, scenarioId, 2);
    expect(opened2.ok && (opened2.value.version.input as { economics: { realDiscountRate: number } }).economics.realDiscountRate).toBe(0.07);
  });
});
