import { describe, expect, it } from "vitest";
import {
  CONDENSER_CONSTRUCTIONS,
  CONDENSER_CONSTRUCTION_DEFAULTS,
  type Sourced,
  constructionChargeKgPerKW,
  constructionWarnings,
  defaultCondenserMaterial,
} from "@/lib/engine/condenser-construction";
import { condenserInventoryKg, inventoryCautions } from "@/lib/engine/refrigerant-inventory";
import { globalWarmingPotential100 } from "@/lib/engine/refrigerants";
import { fromSI } from "@/lib/units";

function isSourced(v: unknown): v is Sourced<unknown> {
  return typeof v === "object" && v !== null && "value" in v && "source" in v;
}

describe("condenser construction defaults", () => {
  it.each(CONDENSER_CONSTRUCTIONS)("%s: every default carries a source; every number a [practice]/[memory] tag or a reason", (c) => {
    const d = CONDENSER_CONSTRUCTION_DEFAULTS[c];
    const entries: [string, Sourced<unknown>][] = [];
    for (const [k, v] of Object.entries(d)) {
      if (isSourced(v)) entries.push([k, v]);
      else if (typeof v === "object" && v !== null)
        for (const [k2, v2] of Object.entries(v)) if (isSourced(v2)) entries.push([`${k}.${k2}`, v2]);
    }
    // 17 sourced defaults per construction: 15 top-level and the material for ammonia and for halocarbons.
    expect(entries.length).toBe(17);
    for (const [key, s] of entries) {
      expect(s.source.trim().length, key).toBeGreaterThan(2);
      const numeric = typeof s.value === "number" && s.value > 0;
      if (numeric) expect(s.source, key).toMatch(/\[(practice|memory)\]/);
    }
  });

  it("the clean U default lies inside its stated range", () => {
    for (const c of CONDENSER_CONSTRUCTIONS) {
      const d = CONDENSER_CONSTRUCTION_DEFAULTS[c];
      const [lo, hi] = d.cleanURangeWPerM2K.value;
      expect(d.cleanUWPerM2K.value).toBeGreaterThanOrEqual(lo);
      expect(d.cleanUWPerM2K.value).toBeLessThanOrEqual(hi);
    }
  });

  it("eddy-current testing applies to tubes only", () => {
    for (const c of CONDENSER_CONSTRUCTIONS) {
      const isTubes = c === "shellAndTube";
      expect(CONDENSER_CONSTRUCTION_DEFAULTS[c].inspectionMethod.value === "eddyCurrentTesting").toBe(isTubes);
    }
  });

  it("chooses steel for ammonia and copper alloys for halocarbons in a shell-and-tube condenser (common practice, no source)", () => {
    expect(defaultCondenserMaterial("shellAndTube", "R717")).toBe("carbonSteel");
    expect(defaultCondenserMaterial("shellAndTube", "R134a")).toBe("copperAlloy");
    expect(defaultCondenserMaterial("brazedPlate", "R717")).toBe("stainlessNickelBrazed");
  });
});

describe("construction warnings", () => {
  // Literal table: construction on open-tower water → the plate/welded warning expected.
  const expected: Record<string, boolean> = { shellAndTube: false, plateAndFrame: true, plateAndShell: true, brazedPlate: true };
  it.each(CONDENSER_CONSTRUCTIONS)("%s on open-tower water", (c) => {
    const codes = constructionWarnings({
      construction: c,
      material: "stainlessSteel",
      refrigerant: "R717",
      waterSide: "openTower",
      designHeatKW: 300,
      path: "options.0.condenser",
      optionId: "direct",
    }).map((w) => w.code);
    expect(codes.includes("condenser.plateOnOpenTowerWater")).toBe(expected[c]);
  });

  it("no plate warning on a closed loop; copper with ammonia warns; copper with R-134a does not", () => {
    const base = { construction: "plateAndFrame" as const, refrigerant: "R717" as const, designHeatKW: 300, path: "p" };
    expect(constructionWarnings({ ...base, material: "stainlessSteel", waterSide: "closedLoop" })).toEqual([]);
    expect(constructionWarnings({ ...base, construction: "shellAndTube", material: "copperAlloy", waterSide: "closedLoop" }).map((w) => w.code)).toEqual([
      "condenser.copperWithAmmonia",
    ]);
    expect(constructionWarnings({ ...base, refrigerant: "R134a", construction: "shellAndTube", material: "copperAlloy", waterSide: "closedLoop" })).toEqual([]);
    expect(constructionWarnings({ ...base, construction: "brazedPlate", material: "stainlessCopperBrazed", waterSide: "closedLoop" }).map((w) => w.code)).toContain(
      "condenser.copperWithAmmonia",
    );
  });
});

describe("refrigerant inventory", () => {
  it("matches the stated charge per kW (hand calculation)", () => {
    // Stated defaults: shell-and-tube 0.08, plate-and-frame 0.03, plate-and-shell 0.02, brazed 0.015 kg NH3/kW.
    expect(condenserInventoryKg(1000, constructionChargeKgPerKW("shellAndTube", "R717"))).toBeCloseTo(80, 9);
    expect(condenserInventoryKg(1000, constructionChargeKgPerKW("plateAndFrame", "R717"))).toBeCloseTo(30, 9);
    expect(condenserInventoryKg(1000, constructionChargeKgPerKW("plateAndShell", "R717"))).toBeCloseTo(20, 9);
    expect(condenserInventoryKg(200, constructionChargeKgPerKW("brazedPlate", "R717"))).toBeCloseTo(3, 9);
    // R-134a held in the same liquid volume: 0.08 × 1168/588 kg/kW (stated liquid densities) × 1000 kW = 158.91 kg.
    expect(condenserInventoryKg(1000, constructionChargeKgPerKW("shellAndTube", "R134a"))).toBeCloseTo(158.912, 3);
    // 80 kg = 176.37 lb (1 lb = 0.45359237 kg exactly, NIST SP 811).
    expect(fromSI("massKg", 80, "IP")).toBeCloseTo(176.3698, 3);
  });

  it("shows the ammonia caution always and a threshold caution only at or above it", () => {
    const small = inventoryCautions({ refrigerant: "R717", inventoryKg: 80, gwp: 0 }).map((w) => w.code);
    expect(small).toEqual(["caution.ammonia"]);
    // 10,000 lb = 4,535.9 kg [memory: 29 CFR 1910.119 App. A and 40 CFR 68 threshold for anhydrous ammonia]
    const big = inventoryCautions({ refrigerant: "R717", inventoryKg: 4600, gwp: 0 }).map((w) => w.code);
    expect(big.filter((c) => c === "caution.refrigerantThreshold").length).toBe(2);
    // R-134a: 3 kg × 1300 = 3.9 t CO2e (< 5 t) and < 50 lb: nothing; 25 kg: both the 50 lb and the 5 t CO2e rules.
    const gwp = globalWarmingPotential100("R134a", "AR5");
    expect(inventoryCautions({ refrigerant: "R134a", inventoryKg: 3, gwp })).toEqual([]);
    expect(inventoryCautions({ refrigerant: "R134a", inventoryKg: 25, gwp }).length).toBe(2);
  });
});
