import { describe, expect, it } from "vitest";
import { defaultEditorDocument, newOptionOfKind } from "@/lib/scenarios/prefill";
import { FIELD_INFO, pathPattern } from "@/lib/scenarios/field-labels";
import { placeOf, placeText } from "@/lib/scenarios/field-messages";
import { validateEditorValues } from "@/lib/scenarios/editor-validation";
import { sectionOfPath, type EditorValues } from "@/lib/scenarios/editor-values";
import { parseScenarioDocument, withPlaceholders } from "@/lib/scenarios/validate";

/** Words and shapes no person should meet in a message (issue 11): schema paths and the schema library's wording. */
const LEAKS = [/\b[a-zA-Z]+\.\d+\.[a-zA-Z]/, /\b[a-z]+[A-Z][a-zA-Z]*\.[a-z]+[A-Z]?/, /invalid input/i, /expected (number|string|int)/i, /received/i, /too (small|big)/i, /NaN/];

function starter(): EditorValues {
  return { ...defaultEditorDocument(), climateDatasetId: "00000000-0000-4000-8000-000000000000" };
}

function leaves(v: unknown, p = "", out: string[] = []): string[] {
  if (Array.isArray(v)) {
    out.push(p);
    v.forEach((x, i) => leaves(x, `${p}.${i}`, out));
  } else if (v && typeof v === "object") for (const [k, x] of Object.entries(v)) leaves(x, p ? `${p}.${k}` : k, out);
  else out.push(p);
  return out;
}

describe("messages a person can act on", () => {
  it("the starter has no problem at all: it saves with its first costs missing", () => {
    expect(validateEditorValues(starter(), { system: "SI", currency: "USD" })).toEqual([]);
  });

  it("every field of the starter has a label in the table (none falls back to its key)", () => {
    const missing = [...new Set(leaves(starter()).map(pathPattern))].filter((p) => !FIELD_INFO[p]);
    expect(missing).toEqual([]);
  });

  it("every field of each kind of option has a label, the evaporative condenser included", () => {
    const v = starter();
    v.options = [...v.options, newOptionOfKind("evaporativeCondenser", v.options.map((o) => o.id))];
    const missing = [...new Set(leaves(v).map(pathPattern))].filter((p) => !FIELD_INFO[p]);
    expect(missing).toEqual([]);
    expect(validateEditorValues(v, { system: "SI", currency: "USD" })).toEqual([]);
  });

  it("a nonsense form: every message is a sentence without a path or library wording, in the project's units", () => {
    const v = starter() as unknown as Record<string, unknown> & { options: Record<string, Record<string, unknown>>[]; duty: Record<string, unknown>; water: { makeup: Record<string, unknown> } };
    v.name = "";
    v.duty.designHeatRejectionKW = Number.NaN;
    v.duty.evaporatingC = "cold";
    v.options[0]!.tower!.leavingWaterC = 120; // above the 90 °C limit of water temperatures
    v.options[0]!.fan!.designPowerKW = undefined;
    v.options[1]!.tower!.waterFlowKgPerS = -3;
    v.options[2]!.cooler!.designFluidToAirRatio = 0;
    v.water.makeup.ph = 99;
    (v.options[0]!.costs as Record<string, unknown>).firstCost = { equipment: -1 };
    const problems = validateEditorValues(v as unknown as EditorValues, { system: "IP", currency: "USD" });
    expect(problems.length).toBeGreaterThanOrEqual(9);
    for (const p of problems) {
      for (const leak of LEAKS) expect(p.message, p.path).not.toMatch(leak);
      expect(p.message).toMatch(/^[A-Z].*\.$/);
      const place = placeText(placeOf(p.path, ["Tower A", "Tower B", "Cooler C"]));
      for (const leak of LEAKS) expect(place, p.path).not.toMatch(leak);
    }
    const at = (path: string) => {
      const p = problems.find((x) => x.path === path);
      return p && { ...p, message: p.message.replace(/\u00a0/g, " ") };
    };
    // 90 °C = 194 °F (t°F = 1.8·t°C + 32, NIST SP 811): the limit is stated in the project's units.
    expect(at("options.0.tower.leavingWaterC")?.message).toBe("Enter at most 194 °F.");
    expect(at("options.0.fan.designPowerKW")?.kind).toBe("missing");
    expect(at("duty.evaporatingC")?.message).toMatch(/^Enter a number/);
    expect(at("water.makeup.ph")?.message).toBe("Enter at most 11 pH.");
    expect(at("options.0.costs.firstCost.equipment")?.message).toBe("Enter zero or more.");
    expect(placeText(placeOf("options.0.tower.leavingWaterC", ["Tower A"]))).toBe("Option 1: Tower A › Tower selection at design › Leaving (cold) water");
    expect(at("options.1.tower.waterFlowKgPerS")?.section).toBe("option-2");
  });

  it("SI projects read the same limit in °C", () => {
    const v = starter();
    const o = v.options[0]!;
    if (o.kind !== "openTowerDirect") throw new Error("the starter's first option is the direct tower");
    o.tower.leavingWaterC = 120;
    const p = validateEditorValues(v, { system: "SI", currency: "EUR" }).find((x) => x.path === "options.0.tower.leavingWaterC");
    expect(p?.message.replace(/\u00a0/g, " ")).toBe("Enter at most 90 °C.");
  });

  it("the server's parse words its problems the same way (no paths, no library wording)", () => {
    const doc = withPlaceholders({ ...starter(), options: [{ kind: "rocket" }], water: { makeup: { ph: "x" } } });
    const r = parseScenarioDocument(doc, { system: "IP", currency: "USD" });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      const messages = Object.values(r.fieldErrors).flat();
      expect(messages.length).toBeGreaterThan(3);
      for (const m of messages) for (const leak of LEAKS) expect(m).not.toMatch(leak);
    }
  });

  it("fields are placed in the editor's sections", () => {
    expect(sectionOfPath("tariffs.water.pricePerM3")).toBe("water");
    expect(sectionOfPath("tariffs.electricity.energyPricePerKWh")).toBe("tariffs");
    expect(sectionOfPath("fouling.model")).toBe("upkeep");
    expect(sectionOfPath("options.3.costs.firstCost.other")).toBe("option-4");
    expect(sectionOfPath("monteCarlo.draws")).toBe("economics");
    expect(sectionOfPath("climateDatasetId")).toBe("general");
  });
});
