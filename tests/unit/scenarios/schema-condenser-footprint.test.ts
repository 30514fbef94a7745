import { describe, expect, it } from "vitest";
import { type OptionInput, hasWaterCooledCondenser } from "@/lib/engine/input";
import { parseScenario } from "@/lib/scenarios/schema";

function condenserOf(o: OptionInput | undefined) {
  if (!o || !hasWaterCooledCondenser(o)) throw new Error("expected a water-cooled option");
  return o.condenser;
}
import { readFixture } from "../engine/helpers";

describe("schema: condenser construction, refrigerant and footprint fields", () => {
  it("a scenario stored before these fields existed still reads, with the previous behaviour as default", () => {
    const doc = readFixture("scenario-bins.json");
    const r = parseScenario(doc);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const c = condenserOf(r.value.options[0]);
    expect(c?.construction).toBe("shellAndTube");
    // The clean U the engine used before construction existed: 1000 W/(m²·K) unless entered.
    const entered = ((doc.options as Record<string, unknown>[])[0]?.condenser as { cleanUWPerM2K?: number }).cleanUWPerM2K;
    expect(c?.cleanUWPerM2K).toBe(entered ?? 1000);
    expect(c?.upkeep).toEqual({});
    expect(r.value.duty.refrigerant).toBe("R717");
    expect(r.value.footprint).toEqual({
      gridEmissionFactorKgCO2ePerKWh: 0.37,
      gridEmissionFactorYear: 2022,
      gridEmissionFactorSource: "[memory] US grid average, EPA eGRID data year 2022",
      gwpReport: "AR5",
      annualLeakFraction: 0.05,
    });
    expect(r.value.tariffs.carbon).toEqual({ enabled: false, pricePerTonneCO2e: 50 });
    expect(r.value.tariffs.escalation.carbon).toBe(0);
  });

  it("a plate condenser takes its construction's clean U unless one is entered", () => {
    const doc = readFixture("scenario-bins.json");
    const opts = doc.options as { condenser: Record<string, unknown> }[];
    const first = opts[0];
    const second = opts[1];
    if (!first || !second) throw new Error("fixture needs two options");
    first.condenser = { ...first.condenser, construction: "plateAndShell", cleanUWPerM2K: undefined };
    second.condenser = { ...second.condenser, construction: "plateAndFrame", cleanUWPerM2K: 4200 };
    const r = parseScenario(doc);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    // Stated construction defaults: plate-and-shell 2500 W/(m²·K) [practice]; an entered value wins.
    expect(condenserOf(r.value.options[0]).cleanUWPerM2K).toBe(2500);
    expect(condenserOf(r.value.options[1]).cleanUWPerM2K).toBe(4200);
  });

  it("rejects out-of-range values with field-level errors and changes nothing else", () => {
    const doc = readFixture("scenario-bins.json");
    doc.footprint = { gridEmissionFactorKgCO2ePerKWh: 5, annualLeakFraction: 1.5, gwpReport: "AR9" };
    (doc.duty as Record<string, unknown>).refrigerant = "R999";
    const opts = doc.options as { condenser: Record<string, unknown> }[];
    const first = opts[0];
    if (!first) throw new Error("fixture needs an option");
    first.condenser = { ...first.condenser, construction: "spiral", specificChargeKgPerKW: -1, upkeep: { inspectionIntervalYears: 80 } };
    const r = parseScenario(doc);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const paths = r.errors.map((e) => e.path).sort();
    expect(paths).toEqual(
      [
        "duty.refrigerant",
        "footprint.annualLeakFraction",
        "footprint.gridEmissionFactorKgCO2ePerKWh",
        "footprint.gwpReport",
        "options.0.condenser.construction",
        "options.0.condenser.specificChargeKgPerKW",
        "options.0.condenser.upkeep.inspectionIntervalYears",
      ].sort(),
    );
  });
});
