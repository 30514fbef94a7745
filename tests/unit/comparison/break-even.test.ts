/**
 * The comparison page's break-even lines and measure notes speak the project's units and currency (the engine's own note
 * says "per m³" and leaves money bare). Expected texts are worked by hand below; the conversion factor is
 * the exact US gallon: 1 gal = 231 in³ = 3.785411784 L (NIST SP 811, Appendix B), so 1 kgal = 3.785411784 m³.
 */
import { describe, expect, it } from "vitest";
import type { BreakEvenResult, OptionComparison } from "@/lib/engine/economics/types";
import { breakEvenLine } from "@/lib/comparison/break-even";
import { measureNotesOf } from "@/lib/comparison/measure-notes";

const NBSP = "\u00a0";

function tie(input: BreakEvenResult["input"], value: number | null, absoluteValue: number | null, note = "engine note"): BreakEvenResult {
  return { input, baseOptionId: "a", alternativeOptionId: "b", value, absoluteValue, searchMin: 0, searchMax: 10, note };
}

describe("break-even lines in the project's units", () => {
  it("water and sewer: 6.811 USD/m³ reads 25.8 USD/kgal in IP (6.811 × 3.785411784 = 25.78, hand calculation) and 6.81 USD/m³ in SI", () => {
    const b = tie("waterAndSewerPrice", 0.9333, 6.811, "The options tie at ×0.933 the entered water and sewer prices (6.811 per m³ of water and sewer together).");
    expect(breakEvenLine(b, "USD", "IP")).toBe(`The options tie at ×0.933 the entered water and sewer prices (25.8${NBSP}USD/kgal of water and sewer together).`);
    expect(breakEvenLine(b, "USD", "SI")).toBe(`The options tie at ×0.933 the entered water and sewer prices (6.81${NBSP}USD/m³ of water and sewer together).`);
    expect(breakEvenLine(b, "USD", "IP")).not.toMatch(/m³/);
  });

  it("electricity and first cost carry the currency", () => {
    expect(breakEvenLine(tie("electricityPrice", 1.06, 0.1121), "EUR", "SI")).toBe(
      `The options tie at ×1.06 the entered electricity prices (a mean energy price of 0.112${NBSP}EUR/kWh).`,
    );
    expect(breakEvenLine(tie("firstCostPremium", 1.14, 166_119.4), "USD", "IP")).toBe(
      "The options tie at ×1.14 the alternative's extra first cost (an extra first cost of USD 166,119).",
    );
  });

  it("keeps the engine's note where there is no tie, for cycles, and keeps a note of several ties", () => {
    expect(breakEvenLine(tie("electricityPrice", null, null, "No tie within range (×0 … ×10 the entered electricity prices): the base stays cheaper throughout."), "USD", "IP")).toBe(
      "No tie within range (×0 … ×10 the entered electricity prices): the base stays cheaper throughout.",
    );
    expect(breakEvenLine(tie("cyclesOfConcentration", 8.03, null, "The options tie at 8.03 cycles."), "USD", "IP")).toBe("The options tie at 8.03 cycles.");
    const several = tie("firstCostPremium", 2, 1000, "The options tie at ×2 x. There are 2 ties in the range; the one nearest the entered value is shown.");
    expect(breakEvenLine(several, "USD", "IP")).toMatch(/USD 1,000\)\. There are 2 ties in the range; the one nearest the entered value is shown\.$/);
  });
});

describe("measure notes carry the currency", () => {
  const base = {
    baseOptionId: "a",
    alternativeOptionId: "b",
    netSavings: -439_880,
    deltaInvestmentPV: 1,
    operationalSavingsPV: -1,
    sir: -2.4,
    airr: null,
    airrNote: "The alternative saves nothing on operation (SIR ≤ 0), so the AIRR is undefined.",
    paybackOfOptionId: "b",
    extraFirstCost: 100_000,
    simplePaybackYears: null,
    discountedPaybackYears: null,
    paybackNote: "Plate's extra first cost of 100,000 is not recovered within the 25-year study period.",
    irr: null,
  } as unknown as OptionComparison;
  const label = (id: string) => (id === "b" ? "Open tower + plate exchanger" : "Open tower, direct");

  it("states an unrecovered extra first cost with its currency and keeps the other notes", () => {
    expect(measureNotesOf(base, label, "USD", 25)).toEqual([
      "The alternative saves nothing on operation (SIR ≤ 0), so the AIRR is undefined.",
      "Open tower + plate exchanger's extra first cost of USD 100,000 is not recovered within the 25-year study period.",
    ]);
  });

  it("passes a recovered payback's note through unchanged", () => {
    const paid = { ...base, simplePaybackYears: 12, paybackNote: "recovered undiscounted only", airrNote: undefined };
    expect(measureNotesOf(paid, label, "USD", 25)).toEqual(["recovered undiscounted only"]);
  });
});
