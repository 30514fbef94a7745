import { describe, expect, it } from "vitest";
import { analyzeEconomics, upvStar } from "@/lib/engine/economics";
import {
  linearResidualFraction,
  replacementTimes,
  waterAtCycles,
  waterQuantitiesFromPhysics,
} from "@/lib/engine/economics/cashflows";
import { economicsSchema, tariffsSchema } from "@/lib/scenarios/schema-economics";
import { baseArgs, physicsFor } from "./helpers";

describe("schedules", () => {
  it("replacements at k·L strictly inside the study period", () => {
    // NIST Handbook 135: a replacement at the end of the study period is not costed (its residual would be full).
    expect(replacementTimes(10, 25)).toEqual([10, 20]);
    expect(replacementTimes(5, 25)).toEqual([5, 10, 15, 20]);
    expect(replacementTimes(30, 25)).toEqual([]);
  });

  it("linear residual value fraction = remaining life / life", () => {
    // NIST Handbook 135, residual value by remaining useful life (linear approximation).
    expect(linearResidualFraction(20, 20, 25)).toBeCloseTo(0.75, 12);
    expect(linearResidualFraction(0, 30, 25)).toBeCloseTo(5 / 30, 12);
    expect(linearResidualFraction(0, 20, 25)).toBe(0);
  });
});

describe("cash flows", () => {
  const r = analyzeEconomics(baseArgs());
  const direct = r.options.find((o) => o.optionId === "direct");

  it("replacements, unit renewal and residual of the direct option over 25 years", () => {
    // Unit life 20: whole first cost reinvested at year 20, residual 15/20 of it at year 25 [Handbook 135 linear].
    // Fill life 15: bought at 15; the unit renewal at 20 renews it, so no separate fill residual.
    const fc = direct?.firstCost ?? 0;
    expect(direct?.cashFlows[20]?.byCategory.replacements).toBeCloseTo(fc, 6);
    expect(direct?.cashFlows[15]?.byCategory.replacements).toBeCloseTo(35000, 6);
    expect(direct?.cashFlows[25]?.byCategory.residual).toBeCloseTo(-0.75 * fc, 6);
  });

  it("a recurring stream's PV is its base-date amount × UPV*(d, e, N)", () => {
    // NIST Handbook 135: PV of a cost escalating at e = A0 · UPV*(d, e, N).
    const kwhCost = 400000 * 0.12;
    expect(direct?.pvByCategory.energy).toBeCloseTo(kwhCost * upvStar(0.03, 0.005, 25), 4);
    expect(direct?.cashFlows[1]?.byCategory.energy).toBeCloseTo(kwhCost * 1.005, 6);
  });

  it("periodic items every 0.5 years bill twice a year", () => {
    // Common practice, no source: basin disinfection twice a year.
    const args = baseArgs();
    const first = args.options[0];
    if (!first) throw new Error("fixture");
    first.costs.upkeep.periodicItems = [
      { kind: "basinDisinfection", everyYears: 0.5, costPerEvent: 100, labourHoursPerEvent: 0 },
    ];
    first.costs.upkeep.cleaningCostPerEvent = 0;
    first.costs.upkeep.annualLabourHours = 0;
    const rr = analyzeEconomics(args);
    expect(rr.options[0]?.cashFlows[7]?.byCategory.upkeep).toBeCloseTo(200, 9);
  });

  it("real and nominal analyses give the same present values", () => {
    // NIST Handbook 135: constant- and current-dollar analyses agree when (1 + D) = (1 + d)(1 + I) and
    // every escalation is converted the same way.
    const real = analyzeEconomics(baseArgs());
    const nominal = analyzeEconomics(
      baseArgs({ economics: economicsSchema.parse({ analysis: "nominal", inflationRate: 0.03 }) }),
    );
    expect(nominal.discountRate).toBeCloseTo(1.03 * 1.03 - 1, 12);
    real.options.forEach((o, i) => expect(nominal.options[i]?.lcc).toBeCloseTo(o.lcc, 4));
    // …while the then-current yearly amounts are larger by (1 + I)^t.
    const t = 10;
    expect(nominal.options[0]?.cashFlows[t]?.byCategory.energy).toBeCloseTo(
      (real.options[0]?.cashFlows[t]?.byCategory.energy ?? 0) * 1.03 ** t,
      6,
    );
  });

  it("month × hour pricing at a uniform price equals flat pricing", () => {
    // Consistency of the two tariff forms (common practice, no source).
    const flat = analyzeEconomics(baseArgs());
    const tou = analyzeEconomics(
      baseArgs({
        tariffs: tariffsSchema.parse({
          electricity: {
            pricing: "monthHour",
            energyPricePerKWhByMonthHour: Array.from({ length: 288 }, () => 0.12),
          },
        }),
      }),
    );
    expect(tou.options[0]?.pvByCategory.energy).toBeCloseTo(flat.options[0]?.pvByCategory.energy ?? 0, 6);
    expect(tou.warnings).toEqual([]);
  });

  it("mid-year discounting raises the PV of recurring costs by about (1 + d)^0.5 (no escalation)", () => {
    // NIST Handbook 135 mid-year convention.
    const args = baseArgs({ economics: economicsSchema.parse({ discounting: "midYear" }) });
    args.tariffs.escalation.energy = 0;
    const end = baseArgs();
    end.tariffs.escalation.energy = 0;
    const rm = analyzeEconomics(args);
    const re = analyzeEconomics(end);
    expect(rm.options[0]?.pvByCategory.energy).toBeCloseTo(
      (re.options[0]?.pvByCategory.energy ?? 0) * Math.sqrt(1.03),
      6,
    );
    expect(rm.options[0]?.pvByCategory.investment).toBe(re.options[0]?.pvByCategory.investment);
  });
});

describe("water balance at other cycles (Methods §4: B = E/(C − 1) − D, M = E + B + D)", () => {
  it("reproduces the physics at its own cycles and scales blowdown at others", () => {
    const p = physicsFor({}, true)[0];
    if (!p) throw new Error("fixture");
    const q = waterQuantitiesFromPhysics(p);
    const same = waterAtCycles(q, 4);
    expect(same.makeupM3).toBeCloseTo(p.waterM3.makeup, 9);
    expect(same.sewerBilledM3).toBeCloseTo(p.waterM3.sewerBilled, 9);
    const six = waterAtCycles(q, 6);
    expect(six.blowdownM3).toBeCloseTo(20000 / 5 - 15, 9);
    expect(six.makeupM3).toBeCloseTo((20000 * 6) / 5, 9);
    // Evaporation credit: the billed sewer volume stays makeup − evaporation.
    expect(six.sewerBilledM3).toBeCloseTo(six.makeupM3 - 20000, 6);
  });
});
