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
    // First cost of the fixture (helpers.ts), added by hand: equipment 200,000 + installation 30 % 60,000
    // + structure 20,000 + electrical 25,000 + controls 10,000 + water treatment 15,000 + meters 2,000
    // = 332,000; residual 0.75·332,000 = 249,000.
    const fc = 332_000;
    expect(direct?.firstCost).toBeCloseTo(fc, 6);
    expect(direct?.cashFlows[20]?.byCategory.replacements).toBeCloseTo(fc, 6);
    expect(direct?.cashFlows[15]?.byCategory.replacements).toBeCloseTo(35000, 6);
    expect(direct?.cashFlows[25]?.byCategory.residual).toBeCloseTo(-0.75 * fc, 6);
  });

  it("a recurring stream's PV is its base-date amount × UPV*(d, e, N)", () => {
    // NIST Handbook 135: PV of a cost escalating at e = A0 · UPV*(d, e, N), end-of-year amounts
    // A0·(1 + e)^t discounted by (1 + d)^t. Written out here as the sum over the 25 years (not the
    // closed form the engine uses): 400,000 kWh × 0.12 per kWh = 48,000 a year at the base date.
    const kwhCost = 400000 * 0.12;
    let upvStarBySum = 0;
    for (let t = 1; t <= 25; t++) upvStarBySum += Math.pow(1.005, t) / Math.pow(1.03, t);
    // Closed form (Handbook 135): (1.005/0.025)·[1 − (1.005/1.03)^25] = 40.2·(1 − 0.975728^25)
    // = 40.2·(1 − 0.541029) = 18.4506 (hand, 4 decimals).
    expect(upvStarBySum).toBeCloseTo(18.4506, 3);
    expect(upvStar(0.03, 0.005, 25)).toBeCloseTo(upvStarBySum, 9);
    expect(direct?.pvByCategory.energy).toBeCloseTo(kwhCost * upvStarBySum, 4);
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
    // Hand numbers at the fixture's own 4 cycles: E = 20000, D = 15 m³: B = 20000/3 − 15 = 6651.667,
    // M = 20000·4/3 = 26666.667 m³; with the evaporation credit the sewer bills M − E = 6666.667 m³.
    const same = waterAtCycles(q, 4);
    expect(same.makeupM3).toBeCloseTo(80000 / 3, 9);
    expect(same.sewerBilledM3).toBeCloseTo(20000 / 3, 6);
    expect(p.waterM3.makeup).toBeCloseTo(80000 / 3, 9);
    const six = waterAtCycles(q, 6);
    expect(six.blowdownM3).toBeCloseTo(20000 / 5 - 15, 9);
    expect(six.makeupM3).toBeCloseTo((20000 * 6) / 5, 9);
    // Evaporation credit: the billed sewer volume stays makeup − evaporation.
    expect(six.sewerBilledM3).toBeCloseTo(six.makeupM3 - 20000, 6);
  });

  // Hand numbers, E = 20000 m³, D = 15 m³, C = 6: B = 20000/5 − 15 = 3985, M = 24000.
  it("bills the sewer on its basis: makeup 24000, makeup − evaporation 4000, metered blowdown 3985 m³", () => {
    const base = physicsFor({})[0];
    if (!base) throw new Error("fixture");
    const q = waterQuantitiesFromPhysics(base);
    expect(waterAtCycles({ ...q, sewerBasis: "makeup" }, 6).sewerBilledM3).toBeCloseTo(24000, 9);
    expect(waterAtCycles({ ...q, sewerBasis: "makeupMinusEvaporation" }, 6).sewerBilledM3).toBeCloseTo(4000, 9);
    expect(waterAtCycles({ ...q, sewerBasis: "blowdown" }, 6).sewerBilledM3).toBeCloseTo(3985, 9);
  });

  // A spray loop entered at half the scenario's cycles keeps that ratio: scenario 8 → loop 4:
  // B = 20000/3 − 15 = 6651.67, M = 26666.67 (hand numbers, standard mass balance).
  it("a loop with its own cycles follows a cycles override in proportion", () => {
    const base = physicsFor({})[0];
    if (!base) throw new Error("fixture");
    const q = { ...waterQuantitiesFromPhysics(base), scenarioCycles: 8, loopCyclesPerScenarioCycle: 0.5 };
    const at8 = waterAtCycles(q, 8);
    expect(at8.cyclesOfConcentration).toBeCloseTo(4, 12);
    expect(at8.blowdownM3).toBeCloseTo(20000 / 3 - 15, 9);
    expect(at8.makeupM3).toBeCloseTo(80000 / 3, 9);
  });

  // Acid feed (hand calculation, Langelier 1936 A–D form; acid stoichiometry 49.04/50.04 = 0.980 g of
  // H2SO4 per g of alkalinity as CaCO3): makeup Ca 80, M-alk 60, TDS 300 mg/L, recirculating pH 8.4,
  // hottest surface 35 °C, LSI limit 1.5, 93 % acid. At C cycles the untreated LSI is
  // 8.4 − [9.3 + (log TDS·C − 1)/10 − 13.12·log 308.15 + 34.55 − (log 80C − 0.4) − log 60C]; above the
  // limit the acid lowers log(alkalinity) by Δ = (LSI − 1.5)/2 and its mass is
  // 0.980·(B + D)·(60C − 60C·10^−Δ)/0.93 g. The chemicals cost therefore rises again at high cycles.
  it("recomputes the acid feed at other cycles, so more cycles stop paying once the LSI limit binds", () => {
    const base = physicsFor({})[0];
    if (!base) throw new Error("fixture");
    const acidBasis = {
      makeup: { calciumHardnessMgPerLAsCaCO3: 80, mAlkalinityMgPerLAsCaCO3: 60, silicaMgPerL: 18, chlorideMgPerL: 40, tdsMgPerL: 300, ph: 7.8 },
      recirculatingPh: 8.4,
      hottestSurfaceC: 35,
      maximumLangelierIndex: 1.5,
      acidFeed: true,
      acidStrengthFraction: 0.93,
    };
    const q = { ...waterQuantitiesFromPhysics(base), acidBasis };
    const handAcidKg = (c: number): number => {
      const pHs = 9.3 + (Math.log10(300 * c) - 1) / 10 - 13.12 * Math.log10(35 + 273.15) + 34.55 - (Math.log10(80 * c) - 0.4) - Math.log10(60 * c);
      const lsi = 8.4 - pHs;
      if (lsi <= 1.5) return 0;
      const delta = (lsi - 1.5) / 2;
      const outflow = 20000 / (c - 1);
      return (0.98 * outflow * 60 * c * (1 - Math.pow(10, -delta))) / 0.93 / 1000;
    };
    for (const c of [3, 6, 8, 12]) {
      const w = waterAtCycles(q, c);
      const hand = handAcidKg(c);
      if (hand === 0) expect(w.acidKg).toBe(0);
      else expect(w.acidKg / hand).toBeCloseTo(1, 2);
    }
    expect(handAcidKg(3)).toBe(0);
    expect(handAcidKg(12)).toBeGreaterThan(handAcidKg(8));
    // Priced: 0.6 per m³ of outflow + 0.25 per kg of acid (schema defaults): the chemicals cost per m³
    // of water leaving the loop rises with cycles once the limit binds (it was a constant 0.6 before).
    const perM3 = (c: number) => {
      const w = waterAtCycles(q, c);
      return (w.treatedOutflowM3 * 0.6 + w.acidKg * 0.25) / w.treatedOutflowM3;
    };
    expect(perM3(3)).toBeCloseTo(0.6, 12);
    expect(perM3(12)).toBeGreaterThan(perM3(8));
    expect(perM3(8)).toBeGreaterThan(0.6);
  });
});
