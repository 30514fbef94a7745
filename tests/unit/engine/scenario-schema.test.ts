import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { describe, expect, it, vi } from "vitest";
import { analyzeScenario } from "@/lib/engine";
import {
  defaultScenario,
  fieldDefaults,
  parseScenario,
  physicsFieldDefaults,
  scenarioJsonSchema,
  scenarioSchema,
} from "@/lib/scenarios/schema";
import { climateInputSchema } from "@/lib/scenarios/schema-climate";
import { FIXTURES, fixtureDocument, readFixture } from "./helpers";

// Whole-year runs and property tests: generous time on a shared CI machine.
vi.setConfig({ testTimeout: 60_000 });

const ROOT = resolve(__dirname, "../../..");

function errorsOf(doc: unknown): { path: string; message: string }[] {
  const r = parseScenario(doc);
  return r.ok ? [] : r.errors;
}

/**
 * The object (or array) at a dotted path inside a fixture document, e.g. "options.0.tower", for breaking
 * one field on purpose. Throws when the fixture has no such node, so a renamed field fails loudly.
 */
function at(doc: unknown, path: string): Record<string, unknown> {
  let node: unknown = doc;
  for (const key of path.split(".")) {
    if (typeof node !== "object" || node === null || !(key in node)) throw new Error(`the fixture has no ${path}`);
    node = (node as Record<string, unknown>)[key];
  }
  if (typeof node !== "object" || node === null) throw new Error(`${path} in the fixture is not an object`);
  return node as Record<string, unknown>;
}

function arrayAt(doc: unknown, path: string): unknown[] {
  const node = at(doc, path);
  if (!Array.isArray(node)) throw new Error(`${path} in the fixture is not an array`);
  return node;
}

describe("scenario schema", () => {
  // Stored scenarios written before issue 10 keep reading: the evaporation-credit flag becomes the sewer
  // basis, the heater's "runs below dry-bulb" becomes its thermostat set-point, and the heat loss defaults
  // to the rating over the set-point's margin above −17.8 °C (hand: 8 kW / (4.4 + 17.8) K = 0.3604 kW/K).
  it("reads stored scenarios with the earlier sewer-credit flag and basin-heater threshold", () => {
    const doc = readFixture("scenario-hourly.json");
    at(doc, "water").sewerEvaporationCredit = true;
    at(doc, "options.0").basinHeater = { powerKW: 8, belowDryBulbC: 4.4 };
    const climate = fixtureDocument("scenario-hourly.json").climate;
    const r = parseScenario({ ...doc, climate });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.water.sewerBasis).toBe("makeupMinusEvaporation");
    expect("sewerEvaporationCredit" in r.value.water).toBe(false);
    const bh = r.value.options[0]?.basinHeater;
    expect(bh?.setPointC).toBe(4.4);
    expect(bh?.heatLossKWPerK).toBeCloseTo(8 / 22.2, 12);
    expect(bh?.drainedWhenIdle).toBe(false);
    at(doc, "water").sewerEvaporationCredit = false;
    const r2 = parseScenario({ ...doc, climate });
    expect(r2.ok && r2.value.water.sewerBasis).toBe("makeup");
    // An explicit basis wins over the old flag.
    at(doc, "water").sewerBasis = "blowdown";
    const r3 = parseScenario({ ...doc, climate });
    expect(r3.ok && r3.value.water.sewerBasis).toBe("blowdown");
  });

  it("parses both example scenarios and fills the defaults from fieldDefaults", () => {
    const r = parseScenario(readFixture("scenario-bins.json"));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const direct = r.value.options[0];
    expect(direct?.fan.minSpeedFraction).toBe(fieldDefaults["options[].fan.minSpeedFraction"]?.default);
    expect(direct && "condenserPump" in direct ? direct.condenserPump.headM : undefined).toBe(22);
    expect(r.value.fouling.asymptoticM2KPerW).toBe(physicsFieldDefaults["fouling.asymptoticM2KPerW"].default);
    expect(r.value.water.limits.silicaMgPerL).toBe(150);
    expect(r.value.tariffs.escalation.water).toBe(fieldDefaults["tariffs.escalation.water"]?.default);
    expect(parseScenario(fixtureDocument("scenario-hourly.json")).ok).toBe(true);
  });

  it("round-trips: the parsed scenario, as JSON, parses to itself", () => {
    const first = scenarioSchema.parse(readFixture("scenario-bins.json"));
    const again = scenarioSchema.parse(JSON.parse(JSON.stringify(first)));
    expect(again).toEqual(first);
  });

  it("refuses upkeep intervals shorter than a week and lives shorter than a quarter-year (no runaway cash-flow loop)", () => {
    // A probe found everyYears = 5e-324 (positive, so once accepted) made the cash-flow loop run practically
    // forever. Bounds [practice]: weekly is the shortest scheduled upkeep interval, 0.25 year the shortest life.
    const doc = readFixture("scenario-bins.json");
    const items = at(doc, "options.0.costs.upkeep.periodicItems") as unknown as Record<string, unknown>[];
    items[0]!.everyYears = 5e-324;
    const lives = at(doc, "options.0.costs.components") as unknown as Record<string, unknown>[];
    lives[0]!.lifeYears = 0.01;
    const paths = errorsOf(doc).map((e) => e.path);
    expect(paths).toContain("options.0.costs.upkeep.periodicItems.0.everyYears");
    expect(paths).toContain("options.0.costs.components.0.lifeYears");
    const ok = readFixture("scenario-bins.json");
    (at(ok, "options.0.costs.upkeep.periodicItems") as unknown as Record<string, unknown>[])[0]!.everyYears = 1 / 52;
    expect(errorsOf(ok)).toEqual([]);
  });

  it("reports cross-field problems at the field to fix", () => {
    const doc = readFixture("scenario-bins.json");
    at(doc, "options.0.tower").leavingWaterC = 34;
    at(doc, "duty").minimumCondensingC = 36;
    at(doc, "options.2").id = at(doc, "options.1").id;
    at(doc, "duty.loadProfile").fractions = [1, 1];
    at(doc, "options.1.condenser").designCondensingC = 20;
    const paths = errorsOf(doc).map((e) => e.path);
    expect(paths).toContain("options.0.tower.leavingWaterC");
    expect(paths).toContain("duty.minimumCondensingC");
    expect(paths).toContain("options.2.id");
    expect(paths).toContain("duty.loadProfile.fractions");
    expect(paths).toContain("options.1.condenser.designCondensingC");
  });

  it("reports missing and mistyped fields with their paths; 2–4 options; known kinds only", () => {
    const doc = readFixture("scenario-bins.json");
    delete at(doc, "options.0.tower").waterFlowKgPerS;
    at(doc, "options.1.fan").designPowerKW = "thirty";
    doc.water = { ...at(doc, "water"), cyclesMode: "entered", cyclesOfConcentration: undefined };
    const paths = errorsOf(doc).map((e) => e.path);
    expect(paths).toContain("options.0.tower.waterFlowKgPerS");
    expect(paths).toContain("options.1.fan.designPowerKW");
    expect(paths).toContain("water.cyclesOfConcentration");
    const one = readFixture("scenario-bins.json");
    one.options = arrayAt(one, "options").slice(0, 1);
    expect(errorsOf(one).map((e) => e.path)).toContain("options");
    const bad = readFixture("scenario-bins.json");
    at(bad, "options.0").kind = "evaporativeCondenser";
    expect(errorsOf(bad).some((e) => e.path.startsWith("options.0"))).toBe(true);
  });

  it("every defaulted field carries a source", () => {
    for (const [path, d] of Object.entries(fieldDefaults)) {
      expect(d.source.length, path).toBeGreaterThan(3);
      expect(d.default, path).not.toBeUndefined();
    }
  });

  it("exports a JSON Schema of the document", () => {
    const s = scenarioJsonSchema as { type?: string; properties?: Record<string, unknown>; required?: string[] };
    expect(s.type).toBe("object");
    expect(Object.keys(s.properties ?? {})).toEqual(expect.arrayContaining(["site", "climate", "duty", "options", "water", "fouling", "tariffs"]));
    expect(s.required).toEqual(expect.arrayContaining(["inputVersion", "site", "climate", "duty", "options", "water"]));
  });

  it("defaultScenario is valid and analyses at once; its first costs are missing until entered (issue 11)", () => {
    const doc = readFixture("scenario-bins.json");
    const draft = defaultScenario(climateInputSchema.parse(doc.climate), { elevationM: 100, locationLabel: "test" });
    expect(errorsOf(draft)).toEqual([]);
    const parsed = parseScenario(draft);
    expect(parsed.ok).toBe(true);
    if (parsed.ok) {
      const a = analyzeScenario(parsed.value);
      expect(a.physics).toHaveLength(3);
      // Every option is named as missing its first cost, and nothing that needs it (tornado, Monte Carlo) ran.
      expect(a.economics.firstCostsMissing).toEqual(["tower-direct", "tower-plate", "cooler"]);
      expect(a.economics.sensitivity).toBeUndefined();
      expect(a.economics.monteCarlo).toBeUndefined();
      // Operating costs are priced all the same.
      for (const o of a.economics.options) expect(o.firstYearOperatingCost).toBeGreaterThan(0);
    }
    const firstCost = { equipment: 1, installation: 0, structureAndCrane: 0, electrical: 0, controls: 0, plateExchanger: 0, waterTreatmentEquipment: 0, meters: 0, other: 0 };
    const complete = { ...draft, options: draft.options.map((o) => ({ ...o, costs: { ...o.costs, firstCost } })) };
    const r = parseScenario(complete);
    expect(r.ok).toBe(true);
    if (r.ok) expect(analyzeScenario(r.value).economics.firstCostsMissing).toEqual([]);
  });
});

describe("npm run analyze", () => {
  const run = (file: string) =>
    spawnSync(process.execPath, ["--import", "tsx", join(ROOT, "scripts/analyze.ts"), file], { cwd: ROOT, encoding: "utf8", timeout: 120_000 });

  it("prints the result of a valid scenario", () => {
    const r = run(join(FIXTURES, "scenario-bins.json"));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.physics).toHaveLength(3);
    expect(out.economics.options).toHaveLength(3);
  }, 120_000);

  it("prints field-path errors and exits with 2 for a malformed scenario", () => {
    const doc = readFixture("scenario-bins.json");
    at(doc, "options.0.tower").leavingWaterC = 40;
    delete at(doc, "duty").designCop;
    const dir = mkdtempSync(join(tmpdir(), "loopledger-"));
    const file = join(dir, "bad.json");
    writeFileSync(file, JSON.stringify(doc));
    const r = run(file);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain("options.0.tower.leavingWaterC:");
    expect(r.stderr).toContain("duty.designCop:");
    expect(r.stdout).toBe("");
  }, 120_000);
});
