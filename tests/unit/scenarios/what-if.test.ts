/**
 * The what-if body and its checks against the scenario: physical ranges refused at the field, unknown
 * options and a minimum condensing temperature above the set-point refused, physical inputs re-run the
 * physics (and move the answer the way the physics says), prices alone do not.
 */
import { describe, expect, it, vi } from "vitest";
import { analyzeScenario } from "@/lib/engine";
import { computeWhatIf, preparedFor, whatIfBodySchema, whatIfFieldErrors } from "@/lib/scenarios/what-if";
import { fixtureInput } from "../engine/helpers";

vi.setConfig({ testTimeout: 120_000 });

const input = { ...fixtureInput("scenario-hourly.json"), sensitivity: undefined, monteCarlo: undefined };
const result = analyzeScenario(input);

describe("what-if body", () => {
  it("refuses physical inputs outside their ranges, each at its field", () => {
    const r = whatIfBodySchema.safeParse({ loadFactor: 3, climateShiftK: -9, foulingRateFactor: -1, sizeFactorByOptionId: { cooler: 9 } });
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.path.join(".")).sort()).toEqual(["climateShiftK", "foulingRateFactor", "loadFactor", "sizeFactorByOptionId.cooler"]);
    expect(whatIfBodySchema.safeParse({ fanControl: "magic" }).success).toBe(false);
    expect(whatIfBodySchema.safeParse({ somethingElse: 1 }).success).toBe(false);
  });

  it("checks option ids and the minimum condensing temperature against the scenario", () => {
    const fixed = whatIfFieldErrors({ minimumCondensingC: 20, sizeFactorByOptionId: { nope: 1.1 } }, input, true);
    expect(Object.keys(fixed).sort()).toEqual(["minimumCondensingC", "sizeFactorByOptionId.nope"]);
    const floating = { ...input, duty: { ...input.duty, headPressureControl: "floating" as const } };
    expect(whatIfFieldErrors({ minimumCondensingC: input.duty.condensingSetPointC + 1 }, floating, true)).toHaveProperty("minimumCondensingC");
    expect(whatIfFieldErrors({ minimumCondensingC: input.duty.condensingSetPointC - 5 }, floating, true)).toEqual({});
    expect(whatIfFieldErrors({ loadFactor: 1.1 }, input, false)).toHaveProperty("loadFactor");
    expect(whatIfFieldErrors({ electricityPriceFactor: 1.1 }, input, false)).toEqual({});
  });
});

describe("computeWhatIf", () => {
  const prepared = preparedFor("unit-test|hourly", input);

  it("re-runs the physics for a heavier load: every option costs more to run (more heat, more fan and compressor work)", () => {
    const base = computeWhatIf(input, result, {}, "SI", "USD", prepared);
    const heavy = computeWhatIf(input, result, { loadFactor: 1.25 }, "SI", "USD", prepared);
    expect(base.physicsRerun).toBe(false);
    expect(heavy.physicsRerun).toBe(true);
    heavy.options.forEach((o, i) => expect(o.firstYearOperatingCost).toBeGreaterThan(base.options[i]?.firstYearOperatingCost ?? Infinity));
    // At the entered values the answer is the stored result's.
    base.options.forEach((o, i) => expect(o.lcc).toBeCloseTo(result.economics.options[i]?.lcc ?? 0, 6));
  });

  it("prices alone never re-run the physics", () => {
    const r = computeWhatIf(input, result, { electricityPriceFactor: 1.2, loadFactor: 1 }, "SI", "USD", prepared);
    expect(r.physicsRerun).toBe(false);
  });
});
