/**
 * Three invented options (open tower direct, open tower + plate exchanger, closed-circuit cooler) on
 * synthetic yearly physics — round invented numbers, not a physics model (lib/engine/economics/synthetic.ts).
 * Shared by the report test fixture (tests/unit/reports/fixture.ts) and the economics benchmark
 * (scripts/bench-economics.ts --synthetic), so both exercise the same economics inputs.
 */
import type { PhysicsOverrides } from "@/lib/engine/economics";
import { syntheticPhysics } from "@/lib/engine/economics/synthetic";
import type { OptionAnnualPhysics, OptionKind } from "@/lib/engine/types";
import { optionCostsSchema } from "@/lib/scenarios/schema-economics";

export interface SyntheticOption {
  id: string;
  kind: OptionKind;
  label: string;
  kwh: number;
  kw: number;
  evapM3: number;
  equipment: number;
  plate: number;
  cleanings: number;
}

export const SYNTHETIC_OPTIONS: readonly SyntheticOption[] = [
  {
    id: "direct",
    kind: "openTowerDirect",
    label: "Open tower, direct",
    kwh: 420_000,
    kw: 95,
    evapM3: 21_000,
    equipment: 210_000,
    plate: 0,
    cleanings: 1,
  },
  {
    id: "plate",
    kind: "openTowerPlateHx",
    label: "Open tower + plate exchanger",
    kwh: 470_000,
    kw: 105,
    evapM3: 21_500,
    equipment: 210_000,
    plate: 60_000,
    cleanings: 0.5,
  },
  {
    id: "closed",
    kind: "closedCircuitCooler",
    label: "Closed-circuit cooler",
    kwh: 380_000,
    kw: 90,
    evapM3: 13_000,
    equipment: 390_000,
    plate: 0,
    cleanings: 0,
  },
];

/**
 * Yearly physics of the three options under the overrides a physics re-run receives: energy, demand and
 * evaporation scale with the load factor; fouling adds 4 % energy per unit of factor to the options that
 * are cleaned and scales their cleanings. `monthlyWeights` spreads energy over the months (default even).
 */
export function syntheticOptionsPhysics(
  o: PhysicsOverrides = {},
  monthlyWeights?: number[],
): OptionAnnualPhysics[] {
  const load = o.loadFactor ?? 1;
  const fouling = o.foulingRateFactor ?? 1;
  return SYNTHETIC_OPTIONS.map((s) =>
    syntheticPhysics({
      optionId: s.id,
      kind: s.kind,
      label: s.label,
      energyKWh: s.kwh * load * (s.cleanings > 0 ? 1 + 0.04 * (fouling - 1) : 1),
      peakDemandKW: s.kw * load,
      evaporationM3: s.evapM3 * load,
      driftM3: 15,
      cyclesOfConcentration: o.cyclesOfConcentration ?? 4,
      cleaningsPerYear: s.cleanings * fouling,
      monthlyWeights,
    }),
  );
}

function firstCost(equipment: number, plateExchanger: number) {
  return {
    equipment,
    installation: 0.35 * equipment,
    structureAndCrane: 25_000,
    electrical: 30_000,
    controls: 12_000,
    plateExchanger,
    waterTreatmentEquipment: 18_000,
    meters: 3_000,
    other: 0,
  };
}

/** The option's costs (first cost, fill and fan-motor replacements, cleaning and periodic upkeep), parsed. */
export function syntheticOptionCosts(s: SyntheticOption) {
  return optionCostsSchema.parse({
    firstCost: firstCost(s.equipment, s.plate),
    components: [
      { component: "fill", label: "PVC film fill", lifeYears: 15, replacementCost: 40_000 },
      { component: "fanMotor", lifeYears: 18, replacementCost: 9_000 },
    ],
    upkeep: {
      cleaningCostPerEvent: 6_000,
      periodicItems: [
        { kind: "eddyCurrentTesting", everyYears: 3, costPerEvent: 4_500 },
        { kind: "basinDisinfection", everyYears: 0.5, costPerEvent: 800, labourHoursPerEvent: 6 },
      ],
    },
  });
}
