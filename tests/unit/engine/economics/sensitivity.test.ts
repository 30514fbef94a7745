import { describe, expect, it } from "vitest";
import { analyzeEconomics, whatIf } from "@/lib/engine/economics";
import { findRoots } from "@/lib/engine/economics/sensitivity";
import { baseArgs, defaultSensitivity, physicsFor } from "./helpers";

describe("root finding", () => {
  it("finds every sign change in range", () => {
    const roots = findRoots((x) => (x - 1) * (x - 3), 0, 4);
    expect(roots).toHaveLength(2);
    expect(roots[0]).toBeCloseTo(1, 8);
    expect(roots[1]).toBeCloseTo(3, 8);
    expect(findRoots((x) => x * x + 1, -5, 5)).toEqual([]);
  });
});

describe("tornado and break-even", () => {
  const reruns: object[] = [];
  const args = baseArgs({
    sensitivity: defaultSensitivity(),
    rerunPhysics: (o) => {
      reruns.push(o);
      return physicsFor(o);
    },
  });
  // A dearer cooler, so that water and sewer prices within the search range can make it tie.
  const closedCosts = args.options[2]?.costs;
  if (closedCosts?.firstCost) closedCosts.firstCost.equipment = 800000;
  const r = analyzeEconomics(args);
  const s = r.sensitivity;
  const stored = {
    physics: args.physics,
    options: args.options,
    tariffs: args.tariffs,
    upkeep: args.upkeep,
    economics: args.economics,
  };

  it("one tornado per alternative, bars sorted by swing", () => {
    expect(s?.tornado.map((t) => t.alternativeOptionId)).toEqual(["plate", "closed"]);
    for (const t of s?.tornado ?? []) {
      const swings = t.bars.map((b) => b.swing);
      expect([...swings].sort((a, b) => b - a)).toEqual(swings);
      expect(t.bars).toHaveLength(10);
      expect(t.bars.every((b) => b.skippedReason === undefined)).toBe(true);
    }
  });

  // Hand calculation with NIST Handbook 135's UPV* = [(1 + e)/(d − e)]·[1 − ((1 + e)/(1 + d))^n]:
  // the synthetic loops run C = 4 with B > 0, so M = E·C/(C − 1) = 4E/3 (standard mass balance), sewer
  // billed on makeup. Water 2.0 + sewer 2.5 per m³ (schema defaults), both escalating 2 %/yr real,
  // d = 3 %, n = 25. Moving both escalations by +2 %/yr changes the closed cooler's net savings by
  // (M_direct − M_closed)·4.5·[UPV*(3 %, 4 %, 25) − UPV*(3 %, 2 %, 25)].
  it("the water-and-sewer escalation bar moves both escalations together (hand UPV* check)", () => {
    const upvStar = (d: number, e: number, n: number) => ((1 + e) / (d - e)) * (1 - Math.pow((1 + e) / (1 + d), n));
    const mDirect = (4 / 3) * 20000;
    const mClosed = (4 / 3) * 12000;
    const expected = (mDirect - mClosed) * 4.5 * (upvStar(0.03, 0.04, 25) - upvStar(0.03, 0.02, 25));
    const closed = s?.tornado.find((t) => t.alternativeOptionId === "closed");
    const bar = closed?.bars.find((b) => b.input === "waterAndSewerEscalation");
    expect(bar?.mode).toBe("delta");
    expect(bar?.high).toBe(0.02);
    expect(((bar?.netSavingsAtHigh ?? NaN) - (closed?.baseNetSavings ?? NaN)) / expected).toBeCloseTo(1, 9);
  });

  it("physics-dependent inputs re-run the physics (two values each), prices do not", () => {
    expect(s?.physicsReruns).toBe(6);
    expect(reruns).toContainEqual({ foulingRateFactor: 0.5 });
    expect(reruns).toContainEqual({ loadFactor: 1.2 });
    expect(reruns).toContainEqual({ cyclesOfConcentration: 3 });
  });

  it("price bars agree with the what-if at the same values", () => {
    const closed = s?.tornado.find((t) => t.alternativeOptionId === "closed");
    const bar = closed?.bars.find((b) => b.input === "firstCostPremium");
    const w = whatIf(stored, { firstCostPremiumFactor: bar?.high ?? 0 });
    expect(w.comparisons.find((c) => c.alternativeOptionId === "closed")?.netSavings).toBeCloseTo(
      bar?.netSavingsAtHigh ?? NaN,
      6,
    );
    const dr = closed?.bars.find((b) => b.input === "discountRate");
    const w2 = whatIf(stored, { discountRate: 0.03 + (dr?.low ?? 0) });
    expect(w2.comparisons.find((c) => c.alternativeOptionId === "closed")?.netSavings).toBeCloseTo(
      dr?.netSavingsAtLow ?? NaN,
      6,
    );
  });

  it("a break-even water + sewer price makes the pair tie", () => {
    const be = s?.breakEven.find(
      (b) => b.input === "waterAndSewerPrice" && b.alternativeOptionId === "closed",
    );
    expect(be?.value).not.toBeNull();
    const w = whatIf(stored, { waterAndSewerPriceFactor: be?.value ?? NaN });
    expect(w.comparisons.find((c) => c.alternativeOptionId === "closed")?.netSavings).toBeCloseTo(0, 3);
    expect(be?.absoluteValue).toBeCloseTo((be?.value ?? 0) * (2.0 + 2.5), 9);
    expect(be?.note).toMatch(/tie at/);
  });

  it("a break-even first-cost premium and cycles make the pair tie", () => {
    for (const input of ["firstCostPremium", "cyclesOfConcentration", "electricityPrice"] as const) {
      for (const be of s?.breakEven.filter((b) => b.input === input) ?? []) {
        if (be.value === null) {
          expect(be.note).toMatch(/No tie within range/);
          continue;
        }
        const ov =
          input === "firstCostPremium"
            ? { firstCostPremiumFactor: be.value }
            : input === "cyclesOfConcentration"
              ? { cyclesOfConcentration: be.value }
              : { electricityPriceFactor: be.value };
        const w = whatIf(stored, ov);
        expect(
          w.comparisons.find((c) => c.alternativeOptionId === be.alternativeOptionId)?.netSavings,
        ).toBeCloseTo(0, 2);
      }
    }
  });

  it('says "no tie within range" plainly when one option wins throughout', () => {
    const narrow = defaultSensitivity();
    narrow.breakEven.waterAndSewerPrice = { enabled: true, min: 0.9, max: 1.1 };
    const rr = analyzeEconomics({ ...args, sensitivity: narrow });
    const be = rr.sensitivity?.breakEven.find(
      (b) => b.input === "waterAndSewerPrice" && b.alternativeOptionId === "closed",
    );
    expect(be?.value).toBeNull();
    expect(be?.absoluteValue).toBeNull();
    expect(be?.note).toMatch(/^No tie within range/);
  });

  it("without a physics re-run, fouling and load bars are skipped with a reason", () => {
    const rr = analyzeEconomics(baseArgs({ sensitivity: defaultSensitivity() }));
    const bars = rr.sensitivity?.tornado[0]?.bars ?? [];
    expect(
      bars
        .filter((b) => b.skippedReason)
        .map((b) => b.input)
        .sort(),
    ).toEqual(["foulingRate", "load"]);
    expect(bars.at(-1)?.skippedReason).toBeDefined();
  });
});
