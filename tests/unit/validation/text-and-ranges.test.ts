import { describe, expect, it } from "vitest";
import { isSafeText, unsafeTextIssues, UNSAFE_TEXT_MESSAGE } from "@/lib/validation/text";
import { parseScenarioDocument } from "@/lib/scenarios/validate";
import { projectSchema } from "@/lib/projects/schema";
import { commentInputSchema } from "@/lib/sharing/comments";
import { defaultScenario } from "@/lib/scenarios/schema";
import { replacementTimes } from "@/lib/engine/economics/cashflows";
import type { ClimateInput } from "@/lib/engine/climate/types";
import { AnalysisLimitExceeded, isBudgetExceeded } from "@/lib/engine/budget";

/**
 * Text safety and ranges at the edges. Sources: the Unicode Standard, ch. 3 (D71–D76: a surrogate code
 * point alone is not a Unicode scalar value and has no UTF-8 form); PostgreSQL docs, "Character Types"
 * (the character with code zero cannot be stored in text) and "JSON Types" (\u0000 is refused in jsonb).
 */
const bins: ClimateInput = { source: "wetBulbBins", label: "t", bins: [{ wetBulbC: 10, meanCoincidentDryBulbC: 15, hours: 8760 }] };
function doc(patch: (d: Record<string, unknown>) => void) {
  const d = structuredClone(defaultScenario(bins, { elevationM: 0, locationLabel: "Site" })) as unknown as Record<string, unknown>;
  patch(d);
  return d;
}
const optionsOf = (d: Record<string, unknown>) => d.options as Record<string, unknown>[];

describe("text safety", () => {
  it("refuses NUL and lone surrogates, keeps pairs and ordinary text", () => {
    expect(isSafeText("Kühlturm ❄ 冷却塔 😀")).toBe(true); // 😀 is the pair D83D DE00
    expect(isSafeText("a\u0000b")).toBe(false);
    expect(isSafeText("\uD800")).toBe(false);
    expect(isSafeText("x\uDC00")).toBe(false);
    expect(isSafeText("\uDE00\uD83D")).toBe(false); // reversed pair: both lone
  });
  it("finds unsafe values and keys anywhere in a raw input, with their paths", () => {
    const issues = unsafeTextIssues({ a: [1, "ok", "bad\u0000"], ["k\uD801"]: 1, b: { c: "\uDFFF" } });
    expect(issues.map((i) => i.path.join("."))).toEqual(["a.2", "", "b.c"]);
    expect(issues.every((i) => i.message === UNSAFE_TEXT_MESSAGE)).toBe(true);
  });
  it("gives a field error at every text field of the scenario, the project and a comment", () => {
    const r = parseScenarioDocument(doc((d) => { optionsOf(d)[0]!.label = "Tower\u0000"; d.name = "\uD800x"; }));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.fieldErrors["options.0.label"]).toEqual([UNSAFE_TEXT_MESSAGE]);
      expect(r.fieldErrors["name"]).toEqual([UNSAFE_TEXT_MESSAGE]);
    }
    const p = projectSchema.safeParse({ clientName: "C\u0000", name: "N", siteName: "S", elevationM: 0, unitSystem: "SI", currency: "USD" });
    expect(p.success).toBe(false);
    expect(p.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([["clientName", UNSAFE_TEXT_MESSAGE]]);
    expect(commentInputSchema.safeParse({ body: "fine \uDBFF" }).success).toBe(false);
  });
});

describe("ranges", () => {
  const errorsOf = (d: Record<string, unknown>) => {
    const r = parseScenarioDocument(d);
    return r.ok ? {} : r.fieldErrors;
  };
  it("money has a ceiling, stated in words", () => {
    const e = errorsOf(doc((d) => { d.tariffs = { water: { pricePerM3: 1e300 } }; }));
    expect(e["tariffs.water.pricePerM3"]?.[0]).toMatch(/^Enter at most /);
  });
  it("distributions stay in their input's range and keep min ≤ mode ≤ max", () => {
    const e = errorsOf(
      doc((d) => {
        d.monteCarlo = {
          distributions: {
            waterPriceFactor: { type: "triangular", min: -3, mode: 1, max: 2 },
            discountRateDelta: { type: "uniform", min: -0.01, max: 5 },
            electricityPriceFactor: { type: "triangular", min: 1, mode: 0.5, max: 2 },
          },
        };
      }),
    );
    expect(e["monteCarlo.distributions.waterPriceFactor.min"]).toEqual(["A price factor cannot go below 0."]);
    expect(e["monteCarlo.distributions.discountRateDelta.max"]).toEqual(["A discount-rate change cannot exceed 0.5."]);
    expect(e["monteCarlo.distributions.electricityPriceFactor"]).toEqual(["A distribution needs min ≤ mode ≤ max."]);
  });
  it("array sizes and labour hours are bounded; a tornado bound of 1e308 is refused", () => {
    const e = errorsOf(
      doc((d) => {
        optionsOf(d)[0]!.costs = { upkeep: { periodicItems: Array.from({ length: 51 }, () => ({ kind: "other", everyYears: 1, costPerEvent: 1 })), annualLabourHours: 1e9 } };
        d.sensitivity = { tornado: { waterPrice: { low: 0.5, high: 1e308 } } };
      }),
    );
    expect(e["options.0.costs.upkeep.periodicItems"]).toEqual(["Use at most 50 entries."]);
    expect(e["options.0.costs.upkeep.annualLabourHours"]?.[0]).toMatch(/^Enter at most 100,?000/);
    expect(e["sensitivity.tornado.waterPrice.high"]?.[0]).toMatch(/^Enter at most 100/);
  });
  it("no message carries the library's wording or a schema path", () => {
    const e = errorsOf(doc((d) => { d.economics = { studyPeriodYears: "x", baseOptionId: "y".repeat(65) }; d.monteCarlo = { draws: Infinity }; }));
    const all = Object.values(e).flat();
    expect(all.length).toBeGreaterThan(0);
    for (const m of all) expect(m).not.toMatch(/expected|received|invalid input|too (big|small)|\w+\.\w+\.\w+/i);
  });
});

describe("the engine's own step limit (should a value slip past the schema)", () => {
  it("a replacement schedule every 5e-324 years stops at once with a clear error", () => {
    // The error itself shows the loop stopped at its step limit (no timing assertion: benchmarks print figures).
    let err: unknown;
    try {
      replacementTimes(5e-324, 25);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(AnalysisLimitExceeded);
    expect(isBudgetExceeded(err)).toBe(true);
    expect((err as Error).message).toMatch(/^The analysis stopped: replacements every 5e-324 years/);
  });
  it("an ordinary schedule is unchanged: a 10-year life in 25 years is replaced at 10 and 20 (hand count)", () => {
    expect(replacementTimes(10, 25)).toEqual([10, 20]);
  });
});
