import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { testDb, uniq } from "../support/db";
import { insertClimateDataset } from "@/db/queries/climate";
import { insertProject } from "@/db/queries/projects";
import { findResult } from "@/db/queries/results";
import { DEMO_PROJECT } from "@/db/seed";
import { climateDatasetRow } from "@/lib/climate/build";
import { ENGINE_VERSION, type ScenarioResult } from "@/lib/engine";
import { analyzeAndStore, analyzeDocument, storedFor } from "@/lib/scenarios/analysis";
import { demoClimateDataset, demoScenarioDocument, DEMO_SCENARIO_NAME } from "@/lib/scenarios/demo";
import { exportDocument } from "@/lib/scenarios/export";
import { inputsHash } from "@/lib/scenarios/hash";
import { runScenarioResultJob } from "@/lib/jobs/handlers";
import type { ScenarioDocument } from "@/lib/scenarios/mappers";
import { buildEngineInput, cloneScenario, createScenario, loadScenarioContext, saveScenario } from "@/lib/scenarios/store";
import { parseScenarioDocument } from "@/lib/scenarios/validate";

const db = testDb();
afterAll(() => db.destroy());

let projectId = "";
let datasetId = "";
let userId = "";

/** The demo scenario made lighter for tests: no tornado, a short Monte Carlo. */
function testDocument(): ScenarioDocument {
  const d = structuredClone(demoScenarioDocument()) as unknown as Record<string, unknown>;
  d.sensitivity = { enabled: false };
  d.monteCarlo = { enabled: true, draws: 1000, seed: 7, histogramBins: 20 };
  return d as unknown as ScenarioDocument;
}

const throughJsonb = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

async function resultRows(scenarioId: string) {
  return db.selectFrom("scenario_results").select(["kind", "status", "engine_version", "inputs_hash"]).where("scenario_id", "=", scenarioId).execute();
}

async function newScenario(name = uniq("scn")) {
  const c = await createScenario(db, { projectId, name, climateDatasetId: datasetId, userId, document: testDocument() });
  if (!c.ok) throw new Error(JSON.stringify(c.fieldErrors));
  return c;
}

beforeAll(async () => {
  const firm = await db.selectFrom("firms").select("id").executeTakeFirstOrThrow();
  const user = await db.selectFrom("users").select("id").where("email", "=", "cole.consultant@corrandale.example").executeTakeFirstOrThrow();
  userId = user.id;
  projectId = (
    await insertProject(db, {
      firm_id: firm.id,
      name: uniq("Scenario tests "),
      client_name: "Invented client",
      site_name: "Invented site",
      location_label: "Invented valley",
      elevation_m: 240,
      unit_system: "SI",
      currency: "USD",
      created_by: userId,
    })
  ).id;
  const ds = demoClimateDataset(240);
  datasetId = (await insertClimateDataset(db, climateDatasetRow(ds, { projectId, createdBy: userId }))).id;
});

describe("save → analyse → stored result keyed by engine version and inputs hash", () => {
  it("stores the result under (ENGINE_VERSION, hash of the engine input), reuses it on an unchanged save, recomputes on a change", async () => {
    const c = await newScenario();
    const s1 = await saveScenario(db, { scenarioId: c.id, expectedRevision: c.revision, name: "First", climateDatasetId: datasetId, document: testDocument(), userId });
    expect(s1.ok).toBe(true);
    if (!s1.ok) return;
    expect(s1.revision).toBe(c.revision + 1);
    const a1 = await analyzeAndStore(db, c.id, s1.input);
    expect(a1.reused).toBe(false);
    expect(a1.engineVersion).toBe(ENGINE_VERSION);
    expect(a1.inputsHash).toBe(inputsHash(s1.input));
    expect(a1.inputsHash).toMatch(/^[0-9a-f]{64}$/);
    // An hourly year is not computed where it is asked for: it is queued for a worker.
    expect(a1.result).toBeNull();
    expect(a1.full?.status).toBe("queued");
    expect(await runScenarioResultJob(db, a1.full!.id)).toBe("stored");
    const row = await findResult(db, c.id, ENGINE_VERSION, a1.inputsHash, "full");
    expect(row?.status).toBe("done");
    expect((row?.result as ScenarioResult).economics.options).toHaveLength(4);
    // The Monte Carlo is queued for the same key, not run during the save.
    expect(a1.monteCarlo?.status).toBe("queued");

    // Save again without a change: new revision, same hash, the stored row is reused.
    const s2 = await saveScenario(db, { scenarioId: c.id, expectedRevision: s1.revision, name: "First", climateDatasetId: datasetId, document: testDocument(), userId });
    expect(s2.ok).toBe(true);
    if (!s2.ok) return;
    const a2 = await analyzeAndStore(db, c.id, s2.input);
    expect(a2.reused).toBe(true);
    expect(a2.inputsHash).toBe(a1.inputsHash);
    expect((await resultRows(c.id)).filter((r) => r.kind === "full")).toHaveLength(1);

    // Change one input: a new hash and a second stored result; the old one stays under its own key.
    const changed = testDocument() as unknown as { tariffs: { water: { pricePerM3: number } } };
    changed.tariffs.water.pricePerM3 = 4.0;
    const s3 = await saveScenario(db, { scenarioId: c.id, expectedRevision: s2.revision, name: "First", climateDatasetId: datasetId, document: changed, userId });
    expect(s3.ok).toBe(true);
    if (!s3.ok) return;
    const a3 = await analyzeAndStore(db, c.id, s3.input);
    expect(a3.reused).toBe(false);
    expect(await runScenarioResultJob(db, a3.full!.id)).toBe("stored");
    expect(a3.inputsHash).not.toBe(a1.inputsHash);
    const full = (await resultRows(c.id)).filter((r) => r.kind === "full");
    expect(full.map((r) => r.inputs_hash).sort()).toEqual([a1.inputsHash, a3.inputsHash].sort());
    // The water bill scales with the price: LCC water category × 4.0/3.1 (same physics, same discounting).
    const r1 = (await findResult(db, c.id, ENGINE_VERSION, a1.inputsHash, "full"))?.result as ScenarioResult;
    const r3 = (await findResult(db, c.id, ENGINE_VERSION, a3.inputsHash, "full"))?.result as ScenarioResult;
    const w1 = r1.economics.options[0]!.pvByCategory.water;
    const w3 = r3.economics.options[0]!.pvByCategory.water;
    expect(w3 / w1).toBeCloseTo(4.0 / 3.1, 6);

    // A different engine version is a different key: nothing is found for it (results never outlive their formulas).
    expect(await findResult(db, c.id, "0.0.0-old", a3.inputsHash, "full")).toBeUndefined();
  });
});

describe("optimistic concurrency", () => {
  it("a stale save is refused with a clear message and nothing is overwritten", async () => {
    const c = await newScenario();
    const mine = testDocument() as unknown as { tariffs: { sewer: { pricePerM3: number } } };
    mine.tariffs.sewer.pricePerM3 = 5.5;
    const theirs = testDocument() as unknown as { tariffs: { sewer: { pricePerM3: number } } };
    theirs.tariffs.sewer.pricePerM3 = 9.9;
    const first = await saveScenario(db, { scenarioId: c.id, expectedRevision: c.revision, name: "Mine", climateDatasetId: datasetId, document: mine, userId });
    expect(first.ok).toBe(true);
    const stale = await saveScenario(db, { scenarioId: c.id, expectedRevision: c.revision, name: "Theirs", climateDatasetId: datasetId, document: theirs, userId });
    expect(stale.ok).toBe(false);
    if (stale.ok || stale.kind !== "conflict") throw new Error(`expected a conflict, got ${JSON.stringify(stale)}`);
    expect(stale.currentRevision).toBe(c.revision + 1);
    expect(stale.message).toMatch(/Nothing was overwritten/);
    expect(stale.savedBy).toBe("Cole Pereira");
    const row = await db.selectFrom("scenarios").select(["name", "revision", "input"]).where("id", "=", c.id).executeTakeFirstOrThrow();
    expect(row.name).toBe("Mine");
    expect(row.revision).toBe(c.revision + 1);
    expect((row.input as { tariffs: { sewer: { pricePerM3: number } } }).tariffs.sewer.pricePerM3).toBe(5.5);
  });

  it("two saves racing on the same revision: exactly one is written", async () => {
    const c = await newScenario();
    const save = (name: string) => saveScenario(db, { scenarioId: c.id, expectedRevision: c.revision, name, climateDatasetId: datasetId, document: testDocument(), userId });
    const [a, b] = await Promise.all([save("A"), save("B")]);
    expect([a.ok, b.ok].filter(Boolean)).toHaveLength(1);
    const row = await db.selectFrom("scenarios").select(["name", "revision"]).where("id", "=", c.id).executeTakeFirstOrThrow();
    expect(row.revision).toBe(c.revision + 1);
    expect(row.name).toBe(a.ok ? "A" : "B");
  });

  it("an invalid save returns every field error by path and stores nothing", async () => {
    const c = await newScenario();
    const bad = testDocument() as unknown as { options: Record<string, unknown>[]; economics: Record<string, unknown> };
    // A missing first cost is not an error (issue 11: the draft analyses without it); a negative one is.
    (bad.options[0]!.costs as Record<string, unknown>).firstCost = { equipment: -1 };
    (bad.options[2]!.cooler as Record<string, unknown>).leavingFluidC = 50;
    bad.economics.realDiscountRate = 2;
    const r = await saveScenario(db, { scenarioId: c.id, expectedRevision: c.revision, name: "", climateDatasetId: datasetId, document: bad, userId });
    expect(r.ok).toBe(false);
    if (r.ok || r.kind !== "invalid") throw new Error("expected invalid");
    const paths = Object.keys(r.fieldErrors);
    expect(paths).toContain("name");
    expect(paths).toContain("options.0.costs.firstCost.equipment");
    // Messages a person can act on: no schema library wording.
    for (const m of Object.values(r.fieldErrors).flat()) expect(m).not.toMatch(/invalid input|expected number|received/i);
    expect(paths).toContain("options.2.cooler.leavingFluidC");
    expect(paths).toContain("economics.realDiscountRate");
    const row = await db.selectFrom("scenarios").select(["revision", "name"]).where("id", "=", c.id).executeTakeFirstOrThrow();
    expect(row.revision).toBe(c.revision);
  });

  it("clone copies the document and dataset under a new name; the copy has no results yet", async () => {
    const c = await newScenario("Original");
    const copy = await cloneScenario(db, { scenarioId: c.id, userId });
    expect(copy?.name).toBe("Original (copy)");
    const ctx = await loadScenarioContext(db, copy!.id);
    expect(ctx?.row.climateDatasetId).toBe(datasetId);
    expect(await resultRows(copy!.id)).toHaveLength(0);
  });
});

describe("the Monte Carlo job", () => {
  it("queued → done by its job, the distribution stored under the same key; a second run stores nothing more", async () => {
    const c = await newScenario();
    const s = await saveScenario(db, { scenarioId: c.id, expectedRevision: c.revision, name: "MC", climateDatasetId: datasetId, document: testDocument(), userId });
    if (!s.ok) throw new Error("save failed");
    const a = await analyzeAndStore(db, c.id, s.input);
    expect(a.monteCarlo?.status).toBe("queued");
    expect(await runScenarioResultJob(db, a.monteCarlo!.id)).toBe("stored");
    const row = await findResult(db, c.id, ENGINE_VERSION, a.inputsHash, "monteCarlo");
    expect(row?.status).toBe("done");
    expect(row?.progress).toBe(1);
    const mc = row?.result as { draws: number; probabilityLowest: Record<string, number> };
    expect(mc.draws).toBe(1000);
    const total = Object.values(mc.probabilityLowest).reduce((x, y) => x + y, 0);
    // Probabilities of being lowest over all options sum to one (ties split evenly) — common practice, no source.
    expect(total).toBeCloseTo(1, 9);
    // The queue delivers at least once: a repeat of the job finds the row done and leaves it as it is.
    expect(await runScenarioResultJob(db, a.monteCarlo!.id)).toBe("alreadyDone");
    expect((await resultRows(c.id)).filter((r) => r.kind === "monteCarlo")).toHaveLength(1);
  });

  it("a queued row whose inputs no longer match the scenario is failed by its job, not stored", async () => {
    const c = await newScenario();
    const inserted = await db
      .insertInto("scenario_results")
      .values({ scenario_id: c.id, engine_version: ENGINE_VERSION, inputs_hash: "f".repeat(64), kind: "monteCarlo", status: "queued" })
      .returning("id")
      .executeTakeFirstOrThrow();
    expect(await runScenarioResultJob(db, inserted.id)).toBe("failed");
    const after = await db.selectFrom("scenario_results").select(["status", "error", "result"]).where("id", "=", inserted.id).executeTakeFirstOrThrow();
    expect(after.status).toBe("failed");
    expect(after.error).toMatch(/inputs changed/);
    expect(after.result).toBeNull();
  });

  it("a newer save supersedes the runs still queued for the older inputs", async () => {
    const c = await newScenario();
    const s1 = await saveScenario(db, { scenarioId: c.id, expectedRevision: c.revision, name: "v1", climateDatasetId: datasetId, document: testDocument(), userId });
    if (!s1.ok) throw new Error("save failed");
    const a1 = await analyzeAndStore(db, c.id, s1.input);
    const changed = testDocument() as unknown as { tariffs: { water: { pricePerM3: number } } };
    changed.tariffs.water.pricePerM3 = 5.0;
    const s2 = await saveScenario(db, { scenarioId: c.id, expectedRevision: s1.revision, name: "v2", climateDatasetId: datasetId, document: changed, userId });
    if (!s2.ok) throw new Error("save failed");
    await analyzeAndStore(db, c.id, s2.input);
    const old = await db.selectFrom("scenario_results").select(["kind", "status", "error"]).where("scenario_id", "=", c.id).where("inputs_hash", "=", a1.inputsHash).execute();
    expect(old.map((r) => r.status)).toEqual(["failed", "failed"]);
    expect(old[0]!.error).toMatch(/Superseded/);
  });
});

describe("API round trip on the stored data", () => {
  it("the export document, posted to the analysis, gives the stored result", async () => {
    const c = await newScenario();
    const s = await saveScenario(db, { scenarioId: c.id, expectedRevision: c.revision, name: "Round trip", climateDatasetId: datasetId, document: testDocument(), userId });
    if (!s.ok) throw new Error("save failed");
    const stored = await analyzeAndStore(db, c.id, s.input, { inline: true });
    const ctx = await loadScenarioContext(db, c.id);
    const exported = JSON.parse(JSON.stringify(exportDocument(ctx!.dto.document, ctx!.dataset, ctx!.project)));
    expect((exported.climate as { datasetId: string }).datasetId).toBe(datasetId);
    expect((exported.climate as { dryBulbC: number[] }).dryBulbC).toHaveLength(8760);
    const parsed = parseScenarioDocument(exported);
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const fresh = analyzeDocument(parsed.value);
    expect(fresh.inputsHash).toBe(stored.inputsHash);
    const fromDb = await findResult(db, c.id, ENGINE_VERSION, stored.inputsHash, "full");
    expect(throughJsonb(fresh.result)).toEqual(fromDb?.result);
  });
});

describe("the demo seed", () => {
  it("holds the four-option scenario, analysed under the current engine and issued as version 1", async () => {
    const project = await db.selectFrom("projects").select(["id"]).where("name", "=", DEMO_PROJECT.name).executeTakeFirstOrThrow();
    const scenario = await db.selectFrom("scenarios").select(["id"]).where("project_id", "=", project.id).where("name", "=", DEMO_SCENARIO_NAME).executeTakeFirstOrThrow();
    const ctx = await loadScenarioContext(db, scenario.id);
    const built = buildEngineInput(ctx!.dto.document, ctx!.dataset, ctx!.project);
    expect(built.ok).toBe(true);
    if (!built.ok) return;
    expect(built.input.options.map((o) => o.kind).sort()).toEqual(["closedCircuitCooler", "evaporativeCondenser", "openTowerDirect", "openTowerPlateHx"]);
    // The page computes the same key the seed stored under, so it opens without recomputing.
    const st = await storedFor(db, scenario.id, built.input);
    expect(st.result).not.toBeNull();
    expect(st.monteCarlo?.status).toBe("done");
    const v = await db.selectFrom("scenario_versions").select(["version_number", "inputs_hash", "engine_version", "result"]).where("scenario_id", "=", scenario.id).execute();
    expect(v).toHaveLength(1);
    expect(v[0]!.version_number).toBe(1);
    expect(v[0]!.inputs_hash).toBe(st.inputsHash);
    expect((v[0]!.result as ScenarioResult).economics.monteCarlo?.draws).toBe(10_000);
    // Heat rejected by every option over the year equals the duty served (Methods §4 balance):
    // the same for all four options, since they serve the same load.
    const q = (st.result as ScenarioResult).physics.map((p) => p.heatRejectedKWh);
    expect(Math.max(...q) / Math.min(...q)).toBeCloseTo(1, 3);
  });
});
