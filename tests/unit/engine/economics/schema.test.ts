import { describe, expect, it } from "vitest";
import { z } from "zod";
import {
  economicsFieldDefaults,
  economicsSchema,
  monteCarloSchema,
  optionCostsSchema,
  sensitivitySchema,
  tariffsSchema,
  upkeepSchema,
} from "@/lib/scenarios/schema-economics";

describe("economic schemas", () => {
  it("first costs have no default: absent until entered, then every item (empty ones as 0); negative refused", () => {
    // product.md: "first costs have no default (they must come from the consultant's selections)"; a draft
    // without them still analyses (issue 11).
    expect(optionCostsSchema.parse({}).firstCost).toBeUndefined();
    expect(optionCostsSchema.parse({ firstCost: {} }).firstCost).toBeUndefined();
    const one = optionCostsSchema.parse({ firstCost: { equipment: 1000 } }).firstCost;
    expect(one?.equipment).toBe(1000);
    expect(one?.installation).toBe(0);
    expect(one?.meters).toBe(0);
    const bad = optionCostsSchema.safeParse({ firstCost: { equipment: -5 } });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((i) => i.path.join("."))).toEqual(["firstCost.equipment"]);
  });

  it("defaults come from economicsFieldDefaults, each with a source", () => {
    for (const [path, d] of Object.entries(economicsFieldDefaults)) {
      expect(d.source.length, path).toBeGreaterThan(3);
    }
    const t = tariffsSchema.parse({});
    expect(t.water.pricePerM3).toBe(economicsFieldDefaults["tariffs.water.pricePerM3"].default);
    expect(t.escalation.sewer).toBe(economicsFieldDefaults["tariffs.escalation.sewer"].default);
    const e = economicsSchema.parse({});
    expect(e.studyPeriodYears).toBe(25);
    expect(e.analysis).toBe("real");
    expect(upkeepSchema.parse({}).labourRatePerHour).toBe(
      economicsFieldDefaults["upkeep.labourRatePerHour"].default,
    );
    expect(monteCarloSchema.parse({}).draws).toBe(10000);
    expect(sensitivitySchema.parse({}).tornado.waterPrice).toEqual({ enabled: true, low: 0.75, high: 1.5 });
  });

  it("rejects inconsistent inputs with a field path", () => {
    const tou = tariffsSchema.safeParse({ electricity: { pricing: "monthHour" } });
    expect(tou.error?.issues[0]?.path).toEqual(["electricity", "energyPricePerKWhByMonthHour"]);
    const tri = monteCarloSchema.safeParse({
      distributions: { waterPriceFactor: { type: "triangular", min: 1, mode: 0.5, max: 2 } },
    });
    expect(tri.success).toBe(false);
    expect(economicsSchema.safeParse({ realDiscountRate: -1 }).success).toBe(false);
  });

  it("every piece converts to JSON Schema", () => {
    for (const s of [
      optionCostsSchema,
      tariffsSchema,
      upkeepSchema,
      economicsSchema,
      sensitivitySchema,
      monteCarloSchema,
    ]) {
      expect(() => z.toJSONSchema(s, { io: "input", unrepresentable: "any" })).not.toThrow();
    }
  });

  it("a load or climate-shift distribution outside its physical range is refused at the field", () => {
    // Ranges (common practice, no source): load ×0.2…×2 of the design duty; a climate shift of ±5 K.
    const r = monteCarloSchema.safeParse({
      distributions: {
        loadFactor: { type: "triangular", min: 0.1, mode: 1, max: 1.2 },
        climateShiftK: { type: "uniform", min: 0, max: 8 },
      },
    });
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.path.join("."))).toEqual(["distributions.loadFactor.min", "distributions.climateShiftK.max"]);
    expect(
      monteCarloSchema.safeParse({ distributions: { loadFactor: { type: "uniform", min: 0.8, max: 1.2 }, climateShiftK: { type: "triangular", min: 0, mode: 1, max: 2 } } }).success,
    ).toBe(true);
  });
});
