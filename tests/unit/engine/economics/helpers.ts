/** Shared inputs of the economics tests: three options on synthetic physics, scenario defaults for prices. */
import type { AnalyzeEconomicsArgs, EconomicsOptionInput, PhysicsOverrides } from "@/lib/engine/economics";
import { syntheticPhysics } from "@/lib/engine/economics/synthetic";
import type { OptionAnnualPhysics } from "@/lib/engine/types";
import {
  economicsSchema,
  monteCarloSchema,
  optionCostsSchema,
  sensitivitySchema,
  tariffsSchema,
  upkeepSchema,
} from "@/lib/scenarios/schema-economics";

export function firstCost(equipment: number, plateExchanger = 0) {
  return {
    equipment,
    installation: 0.3 * equipment,
    structureAndCrane: 20000,
    electrical: 25000,
    controls: 10000,
    plateExchanger,
    waterTreatmentEquipment: 15000,
    meters: 2000,
    other: 0,
  };
}

export function physicsFor(o: PhysicsOverrides = {}, credit = false): OptionAnnualPhysics[] {
  const load = o.loadFactor ?? 1;
  const fouling = o.foulingRateFactor ?? 1;
  const c = o.cyclesOfConcentration ?? 4;
  return [
    syntheticPhysics({
      optionId: "direct",
      kind: "openTowerDirect",
      energyKWh: 400000 * load * (1 + 0.05 * (fouling - 1)),
      peakDemandKW: 90 * load,
      evaporationM3: 20000 * load,
      driftM3: 15,
      cyclesOfConcentration: c,
      sewerEvaporationCredit: credit,
      cleaningsPerYear: fouling,
    }),
    syntheticPhysics({
      optionId: "plate",
      kind: "openTowerPlateHx",
      energyKWh: 450000 * load,
      peakDemandKW: 100 * load,
      evaporationM3: 20500 * load,
      driftM3: 15,
      cyclesOfConcentration: c,
      sewerEvaporationCredit: credit,
      cleaningsPerYear: 0.5 * fouling,
    }),
    syntheticPhysics({
      optionId: "closed",
      kind: "closedCircuitCooler",
      energyKWh: 360000 * load,
      peakDemandKW: 85 * load,
      evaporationM3: 12000 * load,
      driftM3: 8,
      cyclesOfConcentration: c,
      sewerEvaporationCredit: credit,
      cleaningsPerYear: 0,
    }),
  ];
}

export function threeOptions(): EconomicsOptionInput[] {
  return [
    {
      optionId: "direct",
      kind: "openTowerDirect",
      label: "Direct",
      costs: optionCostsSchema.parse({
        firstCost: firstCost(200000),
        components: [{ component: "fill", lifeYears: 15, replacementCost: 35000 }],
        upkeep: {
          cleaningCostPerEvent: 6000,
          periodicItems: [{ kind: "eddyCurrentTesting", everyYears: 3, costPerEvent: 4500 }],
        },
      }),
    },
    {
      optionId: "plate",
      kind: "openTowerPlateHx",
      label: "Plate",
      costs: optionCostsSchema.parse({
        firstCost: firstCost(200000, 60000),
        components: [{ component: "exchangerPlates", lifeYears: 12, replacementCost: 20000 }],
        upkeep: { cleaningCostPerEvent: 5000 },
      }),
    },
    {
      optionId: "closed",
      kind: "closedCircuitCooler",
      label: "Closed",
      costs: optionCostsSchema.parse({
        firstCost: firstCost(380000),
        serviceLifeYears: 25,
        components: [{ component: "sprayPump", lifeYears: 10, replacementCost: 6000 }],
        upkeep: { periodicItems: [{ kind: "coilExteriorDescaling", everyYears: 5, costPerEvent: 8000 }] },
      }),
    },
  ];
}

export function baseArgs(overrides: Partial<AnalyzeEconomicsArgs> = {}): AnalyzeEconomicsArgs {
  return {
    physics: physicsFor(),
    options: threeOptions(),
    tariffs: tariffsSchema.parse({}),
    upkeep: upkeepSchema.parse({}),
    economics: economicsSchema.parse({}),
    ...overrides,
  };
}

export const defaultSensitivity = () => sensitivitySchema.parse({});
export const defaultMonteCarlo = (x: object = {}) => monteCarloSchema.parse(x);
