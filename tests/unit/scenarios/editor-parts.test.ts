import { describe, expect, it } from "vitest";
import { defaultEditorDocument, newOptionOfKind } from "@/lib/scenarios/prefill";
import { statusByPart, statusBySection, validateEditorValues } from "@/lib/scenarios/editor-validation";
import {
  editorPlaceQuery,
  parsePart,
  partOfPath,
  partsOfSection,
  sectionOfPath,
  type EditorValues,
} from "@/lib/scenarios/editor-values";
import { OPTION_KINDS } from "@/lib/engine/types";

// The editor's long steps are shown a part at a time (issue 11, "the editor's longest section fits in a few
// screens"). The expected parts below are written out by hand from the editor's layout: which group each
// field is drawn in (common practice of this editor, no source).

function starter(): EditorValues {
  return { ...defaultEditorDocument(), climateDatasetId: "00000000-0000-4000-8000-000000000000" };
}

function leaves(v: unknown, p = "", out: string[] = []): string[] {
  if (Array.isArray(v)) v.forEach((x, i) => leaves(x, `${p}.${i}`, out));
  else if (v && typeof v === "object") for (const [k, x] of Object.entries(v)) leaves(x, p ? `${p}.${k}` : k, out);
  else out.push(p);
  return out;
}

describe("parts of the editor's long steps", () => {
  it("option steps and Economics have four parts each; the other steps none", () => {
    expect(partsOfSection("option-1").map((p) => p.id)).toEqual(["selection", "condenser", "pumps", "costs"]);
    expect(partsOfSection("option-4").map((p) => p.id)).toEqual(["selection", "condenser", "pumps", "costs"]);
    expect(partsOfSection("economics").map((p) => p.id)).toEqual(["study", "sensitivity", "monte-carlo", "footprint"]);
    for (const s of ["general", "duty", "water", "upkeep", "tariffs"] as const) expect(partsOfSection(s)).toEqual([]);
  });

  it("an unknown or missing ?part= opens the step's first part; steps shown whole have none", () => {
    expect(parsePart("option-2", "pumps")).toBe("pumps");
    expect(parsePart("option-2", "sensitivity")).toBe("selection");
    expect(parsePart("option-2", null)).toBe("selection");
    expect(parsePart("economics", "monte-carlo")).toBe("monte-carlo");
    expect(parsePart("economics", "<script>")).toBe("study");
    expect(parsePart("water", "pumps")).toBeNull();
    expect(editorPlaceQuery("option-3", "costs")).toBe("?section=option-3&part=costs");
    expect(editorPlaceQuery("duty", null)).toBe("?section=duty");
  });

  it("each field is placed in the part whose groups draw it", () => {
    const cases: [string, string | null][] = [
      ["options.0.label", "selection"],
      ["options.0.tower.enteringWaterC", "selection"],
      ["options.0.tower.ratingPoints.2.wetBulbC", "selection"],
      ["options.2.cooler.dryRating.dryBulbC", "selection"],
      ["options.2.cooler.wetRatings.0.fluidFlowKgPerS", "selection"],
      ["options.1.fan.designPowerKW", "selection"],
      ["options.3.evaporativeCondenser.ratedHeatRejectionKW", "selection"],
      ["options.3.evaporativeCondenser.dryRating.condensingC", "selection"],
      ["options.3.evaporativeCondenser.coilScaling.cleaningIntervalMonths", "condenser"],
      ["options.3.evaporativeCondenser.coilReplacementCost", "condenser"],
      ["options.0.condenser.construction", "condenser"],
      ["options.0.condenser.upkeep.wearPartLifeYears", "condenser"],
      ["options.1.plateExchanger.designApproachK", "condenser"],
      ["options.1.towerPump.headM", "pumps"],
      ["options.2.sprayPump.flowKgPerS", "pumps"],
      ["options.0.basinHeater.setPointC", "pumps"],
      ["options.0.wetLoopVolumeM3", "pumps"],
      ["options.0.driftFractionOfFlow", "pumps"],
      ["options.0.costs.firstCost.equipment", "costs"],
      ["options.0.costs.upkeep.periodicItems.1.intervalYears", "costs"],
      ["options.0", "selection"],
      ["economics.realDiscountRate", "study"],
      ["sensitivity.tornado.waterPrice.low", "sensitivity"],
      ["monteCarlo.distributions.waterPrice.kind", "monte-carlo"],
      ["footprint.gridEmissionFactorKgCO2ePerKWh", "footprint"],
      ["tariffs.carbon.pricePerTonneCO2e", null],
      ["water.makeup.ph", null],
      ["duty.designHeatRejectionKW", null],
    ];
    for (const [path, part] of cases) expect(partOfPath(path), path).toBe(part);
  });

  it("every field of each option kind lands in one of the option's parts, and no part is left empty", () => {
    for (const kind of OPTION_KINDS) {
      const o = newOptionOfKind(kind, []);
      const seen = new Set<string>();
      for (const path of leaves(o, "options.0")) {
        const part = partOfPath(path);
        expect(part, path).not.toBeNull();
        seen.add(part!);
      }
      // First costs have no default; the costs part holds the service life and upkeep figures.
      expect([...seen].sort(), kind).toEqual(["condenser", "costs", "pumps", "selection"]);
    }
  });

  it("a step's count is the sum of its parts' counts", () => {
    const v = starter();
    const o = v.options[0]!;
    if (o.kind !== "openTowerDirect") throw new Error("the starter's first option is the direct tower");
    o.tower.leavingWaterC = 500; // selection: out of range
    o.fan.designPowerKW = -4; // selection: negative
    o.condenser.designCondensingC = 500; // condenser
    o.basinHeater = { ...o.basinHeater, setPointC: 500 }; // pumps
    o.costs.firstCost = { equipment: -5 }; // costs
    v.economics = { ...v.economics, realDiscountRate: 5 }; // 500 %: study
    const problems = validateEditorValues(v, { system: "SI", currency: "USD" });
    const step = statusBySection(problems).get("option-1")!;
    const parts = statusByPart(problems, "option-1");
    expect([...parts.keys()].sort()).toEqual(["condenser", "costs", "pumps", "selection"]);
    const sum = [...parts.values()].reduce((a, s) => ({ missing: a.missing + s.missing, invalid: a.invalid + s.invalid }), {
      missing: 0,
      invalid: 0,
    });
    expect(sum).toEqual(step);
    // Selection: the fan power, and the leaving water twice (above 90 °C, and not colder than the entering water).
    expect(parts.get("selection")!.invalid).toBe(3);
    expect(statusByPart(problems, "economics").get("study")?.invalid).toBe(1);
    for (const p of problems) expect(sectionOfPath(p.path)).toBe(p.section);
  });
});
