import { describe, expect, it } from "vitest";
import { datasetFromBins } from "@/lib/climate/build";
import { FIRST_COST_ITEMS } from "@/lib/engine/economics/types";
import type { OptionAnnualPhysics } from "@/lib/engine/types";
import { demoClimateDataset, demoScenarioDocument } from "@/lib/scenarios/demo";
import { canonicalJson, inputsHash } from "@/lib/scenarios/hash";
import { climateInputFromDataset, documentFromStored, toScenarioDTO, toStoredInput, type ScenarioDocument } from "@/lib/scenarios/mappers";
import { defaultEditorDocument, defaultFor, newOptionOfKind, prefillDocument } from "@/lib/scenarios/prefill";
import { fieldDefaults, scenarioSchema } from "@/lib/scenarios/schema";
import { buildEngineInput } from "@/lib/scenarios/store";
import { withPlaceholders } from "@/lib/scenarios/validate";
import { monthlyWaterSeries, wetBulbBinRows } from "@/components/comparison/series";

const DATASET_ID = "0b6f3a52-7c1e-4d8a-9f21-3c4d5e6f7a8b";
const SITE = { elevationM: 240, locationLabel: "Harrowgate Flats (invented)" };
const stored = demoClimateDataset(SITE.elevationM);
const dataset = { id: DATASET_ID, name: stored.name, source_kind: stored.sourceKind, data: JSON.parse(JSON.stringify(stored.data)) };

/** What PostgreSQL's jsonb gives back: the JSON text parsed again (key order may change, undefined members vanish). */
const throughJsonb = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

function built(doc: ScenarioDocument, ds: typeof dataset | null = dataset, site = SITE) {
  const r = buildEngineInput(doc, ds, site);
  if (!r.ok) throw new Error(JSON.stringify(r.fieldErrors));
  return r.input;
}

describe("scenario document ⇄ stored row ⇄ DTO ⇄ engine input (common practice, no source: a round trip must be the identity)", () => {
  it("the stored form keeps a dataset reference instead of the climate arrays and no site", () => {
    const input = built(demoScenarioDocument());
    const s = toStoredInput(input, DATASET_ID);
    expect(s.climate).toEqual({ datasetId: DATASET_ID });
    expect("site" in s).toBe(false);
    // The hourly arrays are the bulk of an input: the stored document is a small fraction of it.
    expect(JSON.stringify(s).length).toBeLessThan(JSON.stringify(input).length / 5);
  });

  it("engine input → stored → jsonb → row → DTO → engine input gives the same input and the same hash", () => {
    const input = built(demoScenarioDocument());
    const row = {
      id: "5a0c1a6e-1111-4aaa-8bbb-222233334444",
      projectId: "5a0c1a6e-1111-4aaa-8bbb-555566667777",
      name: input.name,
      climateDatasetId: DATASET_ID,
      input: throughJsonb(toStoredInput(input, DATASET_ID)),
      inputVersion: 1,
      revision: 3,
      updatedAt: new Date("2026-12-01T10:00:00Z"),
      archivedAt: null,
    };
    const dto = toScenarioDTO(row);
    expect(dto.revision).toBe(3);
    expect(dto.updatedAt).toBe("2026-12-01T10:00:00.000Z");
    const again = built(dto.document);
    expect(again).toEqual(input);
    expect(inputsHash(again)).toBe(inputsHash(input));
  });

  it("the parsed scenario is a fixed point of the schema (defaults written out parse to themselves)", () => {
    const input = built(demoScenarioDocument());
    expect(scenarioSchema.parse(throughJsonb(input))).toEqual(input);
  });

  it("the site comes from the project and the climate from the dataset: either change changes the hash", () => {
    const doc = demoScenarioDocument();
    const h = inputsHash(built(doc));
    expect(inputsHash(built(doc, dataset, { ...SITE, elevationM: 300 }))).not.toBe(h);
    const otherDataset = { ...dataset, id: "9c9c9c9c-1111-4aaa-8bbb-222233334444" };
    expect(inputsHash(built(doc, otherDataset))).not.toBe(h);
  });

  it("a document missing its dataset or with a broken selection gives field errors at the paths to fix", () => {
    const none = buildEngineInput(demoScenarioDocument(), null, SITE);
    expect(none.ok).toBe(false);
    if (!none.ok) expect(Object.keys(none.fieldErrors)).toEqual(["climateDatasetId"]);
    const doc = structuredClone(demoScenarioDocument()) as unknown as { options: { tower?: { leavingWaterC: number } }[] };
    doc.options[0]!.tower!.leavingWaterC = 40; // above the entering 33.5 °C
    const bad = buildEngineInput(doc as unknown as ScenarioDocument, dataset, SITE);
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.fieldErrors["options.0.tower.leavingWaterC"]?.join(" ")).toMatch(/colder/);
  });
});

describe("climate datasets as the scenario's climate key", () => {
  it("an imported hourly year (lib/climate/build.ts shape) becomes hourly arrays tagged with the dataset id", () => {
    const c = climateInputFromDataset(dataset);
    expect(c.source).toBe("hourly");
    if (c.source !== "hourly") return;
    expect(c.datasetId).toBe(DATASET_ID);
    // A common year: 365 × 24 = 8760 hours.
    expect(c.dryBulbC).toHaveLength(8760);
    expect(c.wetBulbC).toHaveLength(8760);
    expect(c.hour[0]).toBe(0);
  });

  it("an entered wet-bulb bin table stays a wet-bulb bin table", () => {
    const ds = datasetFromBins(
      { source: "wetBulbBins", bins: [{ wetBulbC: 5, meanCoincidentDryBulbC: 8, hours: 4380 }, { wetBulbC: 18, meanCoincidentDryBulbC: 24, hours: 4380 }] },
      { name: "Entered bins", siteElevationM: 240 },
    );
    const c = climateInputFromDataset({ id: DATASET_ID, name: ds.name, source_kind: ds.sourceKind, data: throughJsonb(ds.data) });
    expect(c).toEqual({
      source: "wetBulbBins",
      datasetId: DATASET_ID,
      label: "Entered bins",
      bins: [
        { wetBulbC: 5, meanCoincidentDryBulbC: 8, hours: 4380 },
        { wetBulbC: 18, meanCoincidentDryBulbC: 24, hours: 4380 },
      ],
    });
  });

  it("the engine's own ClimateYear shape is read too", () => {
    const c = climateInputFromDataset({ id: DATASET_ID, name: "x", data: { kind: "bins", binnedOn: "dryBulb", bins: [{ wetBulbC: 10, meanCoincidentDryBulbC: 14, hours: 8760 }] } });
    expect(c).toEqual({ source: "dryBulbBins", datasetId: DATASET_ID, label: "x", bins: [{ dryBulbC: 14, meanCoincidentWetBulbC: 10, hours: 8760 }] });
  });
});

describe("canonical JSON hash", () => {
  it("ignores key order and undefined members, keeps array order", () => {
    expect(canonicalJson({ b: 1, a: { d: [1, 2], c: "x" }, u: undefined })).toBe('{"a":{"c":"x","d":[1,2]},"b":1}');
    expect(inputsHash({ a: 1, b: 2 })).toBe(inputsHash({ b: 2, a: 1 }));
    expect(inputsHash([1, 2])).not.toBe(inputsHash([2, 1]));
    // sha256 of the empty JSON object "{}" (FIPS 180-4 SHA-256; value from coreutils' sha256sum of the two bytes "{}").
    expect(inputsHash({})).toBe("44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a");
  });
});

describe("the editor's starting values", () => {
  it("a new scenario has the three option kinds, every default filled, and empty first costs (they have no default)", () => {
    const d = defaultEditorDocument() as unknown as { options: { kind: string; fan: { minSpeedFraction: number }; costs: { firstCost?: Record<string, unknown> } }[] };
    expect(d.options.map((o) => o.kind)).toEqual(["openTowerDirect", "openTowerPlateHx", "closedCircuitCooler"]);
    expect(d.options[0]!.fan.minSpeedFraction).toBe(fieldDefaults["options[].fan.minSpeedFraction"]!.default);
    for (const o of d.options) expect(o.costs.firstCost).toBeUndefined();
    // The starter is valid as it is (issue 11): it saves and analyses with its first costs missing.
    const r = scenarioSchema.safeParse(withPlaceholders(d as unknown as Record<string, unknown>));
    expect(r.success).toBe(true);
    if (r.success) for (const o of r.data.options) expect(o.costs.firstCost).toBeUndefined();
    // One item entered makes the first cost entered; the items left empty count as 0.
    const one = structuredClone(d);
    one.options[0]!.costs.firstCost = { equipment: 120000 };
    const r1 = scenarioSchema.safeParse(withPlaceholders(one as unknown as Record<string, unknown>));
    expect(r1.success && r1.data.options[0]!.costs.firstCost).toEqual(Object.fromEntries(FIRST_COST_ITEMS.map((k) => [k, k === "equipment" ? 120000 : 0])));
  });

  it("prefilling a complete document changes nothing the schema would not fill itself", () => {
    const doc = demoScenarioDocument();
    const pre = prefillDocument(doc);
    expect(built(pre)).toEqual(built(doc));
    expect(documentFromStored(toStoredInput(built(pre), DATASET_ID))).toEqual(pre);
  });

  it("a new option gets an unused id and the defaults of its kind", () => {
    const o = newOptionOfKind("closedCircuitCooler", ["cooler", "cooler-2"]);
    expect(o.id).toBe("cooler-3");
    expect(o.kind === "closedCircuitCooler" && o.cooler.allowDryMode).toBe(true);
  });

  it("a new evaporative condenser is an evaporative condenser (not a copy of the first option), defaults filled", () => {
    const o = newOptionOfKind("evaporativeCondenser", ["tower-direct"]);
    expect(o.kind).toBe("evaporativeCondenser");
    expect(o.id).toBe("evap-condenser");
    if (o.kind !== "evaporativeCondenser") return;
    // Schema defaults written out (the coil-scaling default object and the spray pump's efficiency).
    expect(o.evaporativeCondenser.coilScaling).toEqual(defaultFor("options.0.evaporativeCondenser.coilScaling")?.default);
    expect(o.sprayPump.efficiency).toBe(defaultFor("options.0.sprayPump.efficiency")?.default);
    expect("condenser" in o).toBe(false);
  });

  it("defaults are found for option paths and for members of defaulted objects", () => {
    expect(defaultFor("options.2.fan.minSpeedFraction")?.default).toBe(0.25);
    expect(defaultFor("sensitivity.tornado.electricityPrice.high")?.default).toBe(1.25);
    expect(defaultFor("options.0.costs.firstCost.equipment")).toBeNull();
  });
});

describe("comparison series in the viewer's units", () => {
  const month = (m: number, evapM3: number) => ({
    month: m,
    hours: 730,
    heatRejectedKWh: 0,
    energyKWh: { fan: 0, condenserPump: 0, secondaryPump: 0, sprayPump: 0, basinHeater: 0, compressorPenalty: 0, total: 0 },
    waterM3: { evaporation: evapM3, drift: 0, blowdown: 0, makeup: evapM3, sewerBilled: evapM3 },
    peakDemandKW: 0,
    dryModeHours: m === 1 ? 2 : 0,
    unmetHours: 0,
  });
  const physics = [{ optionId: "c", kind: "closedCircuitCooler", label: "Cooler", monthly: Array.from({ length: 12 }, (_, i) => month(i + 1, 3785.411784)) }] as unknown as OptionAnnualPhysics[];

  it("monthly water: 3785.411784 m³ is 1000 kgal in IP (Methods §8: 1 kgal = 3.785411784 m³)", () => {
    const ip = monthlyWaterSeries(physics, "IP");
    expect(ip.unit).toBe("kgal");
    expect(ip.series[0]!.months[0]!.evaporation).toBeCloseTo(1000, 9);
    const si = monthlyWaterSeries(physics, "SI");
    expect(si.series[0]!.months[0]!.evaporation).toBeCloseTo(3785.411784, 9);
  });

  it("wet-bulb bins: 20 °C falls in the 68 °F bin (NIST SP 811: t/°F = 1.8·t/°C + 32), dry hours go to each month's coldest hours", () => {
    const climate = {
      source: "hourly" as const,
      label: "t",
      month: [1, 1, 1, 2],
      day: [1, 1, 1, 1],
      hour: [0, 1, 2, 0],
      dryBulbC: [-5, 10, 25, 20],
      wetBulbC: [-6, 8, 20, 18],
    };
    const result = { physics, climateSummary: { wetBulbHistogram: [] } } as never;
    const ip = wetBulbBinRows(climate, result, "IP");
    const at = (bin: string) => ip.rows.find((r) => r.bin === bin);
    expect(at("68")).toEqual({ bin: "68", wetHours: 1, dryHours: 0 });
    // January's two dry hours are its two coldest: −5 °C (wet-bulb −6 °C = 21.2 °F → bin 20) and 10 °C (8 °C = 46.4 °F → bin 46).
    expect(at("20")?.dryHours).toBe(1);
    expect(at("46")?.dryHours).toBe(1);
    expect(ip.rows.reduce((s, r) => s + r.wetHours + r.dryHours, 0)).toBe(4);
  });
});
