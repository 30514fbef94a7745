/**
 * The PDF summary's break-even sentences speak the project's units: the engine states a water-and-sewer
 * tie per m³ (SI); an IP project reads it per thousand US gallons (kgal). Conversion factor: the exact US
 * gallon, 1 gal = 231 in³ = 3.785411784 L (NIST SP 811, Appendix B), so 1 kgal = 3.785411784 m³ and a price
 * per m³ × 3.785411784 is the price per kgal. Expected texts are worked by hand below.
 */
import { describe, expect, it } from "vitest";
import type { BreakEvenResult } from "@/lib/engine/economics/types";
import { readEngineResult } from "@/lib/reports/result";
import { buildSummary } from "@/lib/reports/summary";
import { syntheticResult } from "./fixture";

/** The synthetic result with one hand-made water-and-sewer tie on the summary's key comparison. */
function withWaterTie(absolutePerM3: number) {
  const r = readEngineResult(JSON.parse(JSON.stringify(syntheticResult().result)));
  const key = buildSummary(r, "USD", "SI").keyComparison;
  if (!key || !r.economics.sensitivity) throw new Error("fixture has no key comparison or sensitivity");
  const tie: BreakEvenResult = {
    input: "waterAndSewerPrice",
    baseOptionId: key.baseOptionId,
    alternativeOptionId: key.alternativeOptionId,
    value: 0.9333,
    absoluteValue: absolutePerM3,
    absoluteUnit: "per m³, water and sewer together",
    searchMin: 0.25,
    searchMax: 4,
    note: "The options tie at ×0.933 the entered water and sewer prices (6.811 per m³ of water and sewer together).",
  };
  r.economics.sensitivity.breakEven = [tie];
  return r;
}

describe("summary break-even sentence in the project's units", () => {
  const r = withWaterTie(6.811);

  it("IP: 6.811 USD/m³ reads USD 25.78 per kgal (6.811 × 3.785411784 = 25.7824, hand calculation)", () => {
    const s = buildSummary(r, "USD", "IP");
    const line = s.flips.find((f) => f.startsWith("Water and sewer prices"));
    expect(line).toBe(
      "Water and sewer prices: the two options cost the same over their life at ×0.93 the entered prices ($25.78 per kgal, water and sewer together).",
    );
    expect(s.flips.join(" ")).not.toMatch(/m³/);
  });

  it("SI: unchanged, 6.811 USD/m³ reads $6.81 per m³", () => {
    const line = buildSummary(r, "USD", "SI").flips.find((f) => f.startsWith("Water and sewer prices"));
    expect(line).toBe(
      "Water and sewer prices: the two options cost the same over their life at ×0.93 the entered prices ($6.81 per m³, water and sewer together).",
    );
  });
});
