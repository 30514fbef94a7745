/**
 * A hand-checkable case: two options, three years, round numbers, d = 10 % real, no escalation,
 * end-of-year discounting. Every cash flow and measure below is worked by hand from the Handbook 135
 * definitions (SPV, UPV, CRF) and ASTM E917/E964/E1057/E1121 (LCC, SIR, AIRR, payback).
 *
 * SPV(10 %, 1…3) = 0.909091, 0.826446, 0.751315; UPV(10 %, 3) = 2.486852; CRF(10 %, 3) = 0.402115.
 *
 * Base A ("direct"): first cost 1000 (equipment), life 5 yr → residual at year 3 = 1000·(5 − 3)/5 = 400.
 *   energy 5000 kWh × 0.10 = 500/yr; demand 10 kW × 12 months × 1.00 = 120/yr;
 *   water E = 75, D = 0, C = 4 → B = 75/3 = 25, M = 100 m³ × 2.00 = 200/yr; sewer 100 m³ × 1.00 = 100/yr;
 *   chemicals 25 m³ outflow × 0.40 = 10 + programme fixed 40 + water-management 50 = 100/yr;
 *   upkeep 2 h × 25 = 50 + 1 cleaning × 50 = 100/yr  → operating 1120/yr.
 *   Component (fill) life 2 yr, 100: replaced at year 2; that replacement's residual = 100·(2 + 2 − 3)/2 = 50.
 *   Cash flows: y0 1000, y1 1120, y2 1120 + 100 = 1220, y3 1120 − 400 − 50 = 670.
 *   LCC_A = 1000 + 1120·2.486852 + 100·0.826446 − 450·0.751315 = 3529.827.
 * Alternative B ("cooler"): first cost 1500, life 6 yr → residual 1500·3/6 = 750.
 *   energy 3000 × 0.10 = 300; demand 5 × 12 × 1 = 60; water E = 50, C = 6 → B = 10, M = 60 → 120;
 *   sewer 60; chemicals 10 × 0.40 + 40 + 50 = 94; upkeep 2 h × 25 = 50 (no cleanings) → 684/yr.
 *   Cash flows: y0 1500, y1 684, y2 684, y3 684 − 750 = −66.
 *   LCC_B = 1500 + 684·2.486852 − 750·0.751315 = 2637.521.
 * Measures of B against A:
 *   NS = 3529.827 − 2637.521 = 892.307.
 *   ΔI = (1500 − 563.486) − (1000 + 82.645 − 338.092) = 191.961; S = 436·2.486852 = 1084.267.
 *   SIR = 1084.267/191.961 = 5.64838; AIRR = 1.10·5.64838^(1/3) − 1 = 0.958997.
 *   Extra first cost 500; yearly savings (no residual) y1 436, y2 436 + 100 = 536:
 *   simple payback = 1 + (500 − 436)/536 = 1.119403 yr; discounted = 1 + (500 − 396.364)/442.975 = 1.233955 yr.
 *   Difference A − B: [−500, 436, 536, 736], one sign change; IRR solves −500 + 436/(1+r) + 536/(1+r)² + 736/(1+r)³ = 0
 *   → r = 0.867842 (bisection by hand-run script).
 *   Annualised: A 3529.827·0.402115 = 1419.396; B 2637.521·0.402115 = 1060.586.
 */
import { describe, expect, it } from "vitest";
import { analyzeEconomics, type EconomicsOptionInput, type TariffsInput } from "@/lib/engine/economics";
import { syntheticPhysics } from "@/lib/engine/economics/synthetic";

const zeroFirstCost = {
  equipment: 0,
  installation: 0,
  structureAndCrane: 0,
  electrical: 0,
  controls: 0,
  plateExchanger: 0,
  waterTreatmentEquipment: 0,
  meters: 0,
  other: 0,
};

const tariffs: TariffsInput = {
  electricity: {
    pricing: "flat",
    energyPricePerKWh: 0.1,
    demandChargePerKWMonth: 1,
    demandCoincidenceFactor: 1,
  },
  water: { pricePerM3: 2, fixedChargePerMonth: 0 },
  sewer: { pricePerM3: 1, fixedChargePerMonth: 0, evaporationCreditMeterChargePerMonth: 0 },
  chemicals: { costPerM3Outflow: 0.4, inhibitorPricePerKg: 0, biocidePricePerKg: 0, acidPricePerKg: 0, fixedCostPerYear: 40 },
  waterManagementProgrammeCostPerYear: 50,
  carbon: { enabled: false, pricePerTonneCO2e: 0 },
  escalation: { energy: 0, demand: 0, water: 0, sewer: 0, chemicals: 0, labour: 0, replacements: 0, carbon: 0 },
};

const options: EconomicsOptionInput[] = [
  {
    optionId: "A",
    kind: "openTowerDirect",
    label: "Direct",
    costs: {
      firstCost: { ...zeroFirstCost, equipment: 1000 },
      serviceLifeYears: 5,
      replaceAtEndOfLife: true,
      components: [{ component: "fill", lifeYears: 2, replacementCost: 100 }],
      upkeep: { annualLabourHours: 2, annualServiceCost: 0, cleaningCostPerEvent: 50, periodicItems: [] },
    },
  },
  {
    optionId: "B",
    kind: "closedCircuitCooler",
    label: "Cooler",
    costs: {
      firstCost: { ...zeroFirstCost, equipment: 1500 },
      serviceLifeYears: 6,
      replaceAtEndOfLife: true,
      components: [],
      upkeep: { annualLabourHours: 2, annualServiceCost: 0, cleaningCostPerEvent: 50, periodicItems: [] },
    },
  },
];

const physics = [
  syntheticPhysics({
    optionId: "A",
    kind: "openTowerDirect",
    energyKWh: 5000,
    peakDemandKW: 10,
    evaporationM3: 75,
    driftM3: 0,
    cyclesOfConcentration: 4,
    cleaningsPerYear: 1,
  }),
  syntheticPhysics({
    optionId: "B",
    kind: "closedCircuitCooler",
    energyKWh: 3000,
    peakDemandKW: 5,
    evaporationM3: 50,
    driftM3: 0,
    cyclesOfConcentration: 6,
    cleaningsPerYear: 0,
  }),
];

const result = analyzeEconomics({
  physics,
  options,
  tariffs,
  upkeep: { labourRatePerHour: 25 },
  economics: {
    baseYear: 2030,
    studyPeriodYears: 3,
    discounting: "endOfYear",
    analysis: "real",
    realDiscountRate: 0.1,
    inflationRate: 0.02,
    residualValueMethod: "linear",
  },
});
const [a, b] = result.options;
const cmp = result.comparisons[0];

describe("hand-checkable two-option, three-year case (worked in the header comment)", () => {
  it("yearly cash flows", () => {
    expect(a?.cashFlows.map((r) => r.total)).toEqual(
      [1000, 1120, 1220, 670].map((v) => expect.closeTo(v, 9)),
    );
    expect(b?.cashFlows.map((r) => r.total)).toEqual([1500, 684, 684, -66].map((v) => expect.closeTo(v, 9)));
    expect(a?.cashFlows[1]?.byCategory).toEqual({
      investment: 0,
      energy: 500,
      demand: 120,
      water: 200,
      sewer: 100,
      chemicals: 100,
      upkeep: 100,
      carbon: 0,
      replacements: 0,
      residual: 0,
    });
    expect(a?.cashFlows[3]?.byCategory.residual).toBeCloseTo(-450, 9);
    expect(b?.cashFlows[1]?.byCategory.chemicals).toBeCloseTo(94, 9);
    expect(a?.cashFlows.map((r) => r.calendarYear)).toEqual([2030, 2030, 2031, 2032]);
  });

  it("LCC, categories and annualised cost", () => {
    expect(a?.lcc).toBeCloseTo(3529.827, 3);
    expect(b?.lcc).toBeCloseTo(2637.521, 3);
    expect(a?.pvByCategory.energy).toBeCloseTo(500 * 2.486852, 3);
    expect(a?.pvByCategory.replacements).toBeCloseTo(82.645, 3);
    expect(a?.pvByCategory.residual).toBeCloseTo(-338.092, 3);
    expect(a?.annualisedCost).toBeCloseTo(1419.396, 3);
    expect(b?.annualisedCost).toBeCloseTo(1060.586, 3);
    expect(a?.cashFlows[3]?.cumulativePresentValue).toBeCloseTo(3529.827, 3);
    expect(result.lowestLccOptionId).toBe("B");
  });

  it("net savings, SIR, AIRR", () => {
    expect(cmp?.netSavings).toBeCloseTo(892.307, 3);
    expect(cmp?.deltaInvestmentPV).toBeCloseTo(191.961, 3);
    expect(cmp?.operationalSavingsPV).toBeCloseTo(1084.267, 3);
    expect(cmp?.sir).toBeCloseTo(5.64838, 5);
    expect(cmp?.airr).toBeCloseTo(0.958997, 5);
  });

  it("simple and discounted payback of the extra first cost, IRR of the difference", () => {
    expect(cmp?.paybackOfOptionId).toBe("B");
    expect(cmp?.extraFirstCost).toBe(500);
    expect(cmp?.simplePaybackYears).toBeCloseTo(1.119403, 6);
    expect(cmp?.discountedPaybackYears).toBeCloseTo(1.233955, 6);
    expect(cmp?.differenceCashFlows).toEqual([-500, 436, 536, 736].map((v) => expect.closeTo(v, 9)));
    expect(cmp?.irr).toBeCloseTo(0.867842, 5);
  });
});

describe("carbon price stream (hand calculation)", () => {
  // Option A of the case above with a carbon price: 5000 kWh × 0.4 kg CO2e/kWh = 2000 kg, plus 500 kg CO2e of
  // refrigerant leakage = 2.5 t/yr × 40 per t = 100/yr at base-date prices, escalating 5 %/yr real on its own
  // stream: 105, 110.25, 115.7625 in years 1–3; PV at 10 % = 105/1.1 + 110.25/1.21 + 115.7625/1.331
  // = 95.454545 + 91.115702 + 86.974080 = 273.544327. Option B has no emissions basis: no carbon cost.
  const withCarbon = analyzeEconomics({
    physics,
    options: [{ ...options[0]!, carbon: { gridFactorKgCO2ePerKWh: 0.4, leakageKgCO2ePerYear: 500 } }, options[1]!],
    tariffs: { ...tariffs, carbon: { enabled: true, pricePerTonneCO2e: 40 }, escalation: { ...tariffs.escalation, carbon: 0.05 } },
    upkeep: { labourRatePerHour: 25 },
    economics: { baseYear: 2030, studyPeriodYears: 3, discounting: "endOfYear", analysis: "real", realDiscountRate: 0.1, inflationRate: 0.02, residualValueMethod: "linear" },
  });
  it("adds tonnes × price, escalated on its own stream, to the LCC", () => {
    const a2 = withCarbon.options[0];
    expect(a2?.cashFlows.map((r) => r.byCategory.carbon)).toEqual([0, 105, 110.25, 115.7625].map((v) => expect.closeTo(v, 9)));
    expect(a2?.pvByCategory.carbon).toBeCloseTo(273.544327, 5);
    expect(a2?.lcc).toBeCloseTo(3529.827 + 273.544327, 3);
    expect(withCarbon.options[1]?.pvByCategory.carbon).toBe(0);
  });
  it("is off by default: the same emissions basis costs nothing without a carbon price", () => {
    const off = analyzeEconomics({
      physics,
      options: [{ ...options[0]!, carbon: { gridFactorKgCO2ePerKWh: 0.4, leakageKgCO2ePerYear: 500 } }, options[1]!],
      tariffs,
      upkeep: { labourRatePerHour: 25 },
      economics: { baseYear: 2030, studyPeriodYears: 3, discounting: "endOfYear", analysis: "real", realDiscountRate: 0.1, inflationRate: 0.02, residualValueMethod: "linear" },
    });
    expect(off.options[0]?.lcc).toBeCloseTo(3529.827, 3);
  });
});
