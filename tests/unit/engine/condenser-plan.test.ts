import { describe, expect, it, vi } from "vitest";
import { analyzeScenario } from "@/lib/engine";
import { condenserPlan, costsWithCondenserPlan, economicsOptionsOf } from "@/lib/engine/condenser-plan";
import { type OptionInput, type ScenarioInput, type WaterCooledOptionInput, hasWaterCooledCondenser } from "@/lib/engine/input";
import { fixtureInput } from "./helpers";

vi.setConfig({ testTimeout: 60_000 });

const base = fixtureInput("scenario-bins.json");

function wc(o: OptionInput | undefined): WaterCooledOptionInput {
  if (!o || !hasWaterCooledCondenser(o)) throw new Error("expected a water-cooled option");
  return o;
}

function variant(edit: (s: ScenarioInput) => void): ScenarioInput {
  const s = structuredClone(base);
  edit(s);
  return s;
}

describe("condenser plan per option", () => {
  it("the direct option's shell-and-tube plan: entered cleaning cost wins, the entered eddy-current item is not duplicated", () => {
    const o = base.options[0]!;
    const plan = condenserPlan(o, 0, base.duty);
    expect(plan.construction).toBe("shellAndTube");
    expect(plan.waterSide).toBe("openTower");
    expect(plan.material).toBe("carbonSteel");
    expect(plan.cleaning.surface).toBe("condenser");
    expect(plan.cleaning.costPerEvent).toBe(6500); // entered in the fixture
    const costs = costsWithCondenserPlan(o.costs, plan);
    expect(costs.upkeep.periodicItems.filter((p) => p.kind === "eddyCurrentTesting")).toHaveLength(1);
    // Inventory: 1500 kW × 0.08 kg NH3/kW (stated shell-and-tube default) = 120 kg.
    expect(plan.inventoryKg).toBeCloseTo(120, 9);
  });

  it("without entered costs the construction's defaults make the plan", () => {
    const s = variant((x) => {
      const o = x.options[0]!;
      o.costs.upkeep.cleaningCostPerEvent = 0;
      o.costs.upkeep.periodicItems = [];
    });
    const plan = condenserPlan(s.options[0]!, 0, s.duty);
    // Stated defaults: brushing 3000 per event; eddy-current testing every 3 years on open-tower water, 4000.
    expect(plan.cleaning.costPerEvent).toBe(3000);
    const items = costsWithCondenserPlan(s.options[0]!.costs, plan).upkeep.periodicItems;
    expect(items).toEqual([{ kind: "eddyCurrentTesting", label: "Condenser: eddy-current testing of the tube walls", everyYears: 3, costPerEvent: 4000, labourHoursPerEvent: 0 }]);
    // On the plate option's clean loop the same condenser is tested every 6 years and is not on the cleaning schedule.
    const plate = condenserPlan(s.options[1]!, 1, s.duty);
    expect(plate.waterSide).toBe("closedLoop");
    expect(plate.inspection.intervalYears).toBe(6);
    expect(plate.cleaning.surface).toBe("plateExchanger");
  });

  it("a welded plate condenser on the direct option warns, fouls at half the tube rate, and has no eddy-current testing", () => {
    const s = variant((x) => {
      wc(x.options[0]).condenser.construction = "plateAndShell";
      x.options[0]!.costs.upkeep.periodicItems = [];
    });
    const plan = condenserPlan(s.options[0]!, 0, s.duty);
    expect(plan.warnings.map((w) => w.code)).toEqual(["condenser.plateOnOpenTowerWater"]);
    expect(plan.warnings[0]?.path).toBe("options.0.condenser.construction");
    expect(plan.foulingGrowthMultiplier).toBe(0.5);
    expect(costsWithCondenserPlan(s.options[0]!.costs, plan).upkeep.periodicItems).toEqual([]);
    // 1500 kW × 0.02 kg/kW (stated plate-and-shell default) = 30 kg.
    expect(plan.inventoryKg).toBeCloseTo(30, 9);
  });

  it("carries the leakage basis to the economics: R-134a at AR5 = 0.05 × inventory × 1300", () => {
    const s = variant((x) => {
      x.duty.refrigerant = "R134a";
      wc(x.options[0]).condenser.material = "copperAlloy";
    });
    // Shell-and-tube R-134a charge = 0.08 × 1168/588 kg/kW (stated densities) × 1500 kW = 238.367 kg;
    // leakage = 0.05 × 238.367 × 1300 = 15,493.9 kg CO2e per year.
    const eco = economicsOptionsOf(s);
    expect(eco[0]?.carbon?.leakageKgCO2ePerYear).toBeCloseTo(15_493.88, 1);
    expect(eco[0]?.carbon?.gridFactorKgCO2ePerKWh).toBe(0.37);
    // Ammonia: GWP 0.
    expect(economicsOptionsOf(base)[0]?.carbon?.leakageKgCO2ePerYear).toBe(0);
  });
});

describe("the analysis reports condensers and footprints", () => {
  const r = analyzeScenario(base);
  it("one plan and one footprint per option, with the ammonia caution once", () => {
    expect(r.condensers?.map((c) => c.construction)).toEqual(["shellAndTube", "shellAndTube", "shellAndTube"]);
    expect(r.footprint?.options).toHaveLength(3);
    expect(r.footprint?.gwp100).toBe(0);
    expect(r.warnings.filter((w) => w.code === "caution.ammonia")).toHaveLength(1);
    for (const f of r.footprint?.options ?? []) {
      const p = r.physics.find((x) => x.optionId === f.optionId)!;
      // Withdrawn is the makeup, consumed evaporation + drift (Methods §13).
      expect(f.water.withdrawnM3).toBe(p.waterM3.makeup);
      expect(f.water.consumedM3).toBeCloseTo(p.waterM3.evaporation + p.waterM3.drift, 9);
      expect(f.emissions.leakageKgCO2e).toBe(0);
    }
  });

  it("a carbon price adds a positive carbon stream to every option's LCC", () => {
    const s = variant((x) => {
      x.tariffs.carbon = { enabled: true, pricePerTonneCO2e: 80 };
      x.sensitivity = undefined;
      x.monteCarlo = undefined;
    });
    const withCarbon = analyzeScenario(s);
    for (const o of withCarbon.economics.options) expect(o.pvByCategory.carbon).toBeGreaterThan(0);
    expect(r.economics.options.every((o) => o.pvByCategory.carbon === 0)).toBe(true);
  });
});
