/**
 * Water and carbon footprint of an option (Methods §13).
 *
 * Water withdrawn = makeup; water consumed = evaporation + drift (the water that leaves to the air and
 * does not return to a sewer or a river); both per year and per MWh of heat rejected.
 * Emissions, kg CO₂e per year = electricity kWh × grid emission factor (kg CO₂e/kWh, the project's own
 * figure with its source and year) + annual leak fraction × refrigerant inventory (kg) × GWP
 * (100-year, from the IPCC assessment report named in the project; ammonia 0).
 * Optional carbon price: cost per year = emissions (t) × price per t CO₂e, escalated on its own stream.
 */
import type { CondenserPlan } from "./condenser-plan";
import type { Sourced } from "./condenser-construction";
import type { FootprintInput } from "./input";
import { GWP_REPORT_LABELS, type GwpReport, type Refrigerant, REFRIGERANT_LABELS, globalWarmingPotential100 } from "./refrigerants";
import type { OptionAnnualPhysics, WaterByComponentM3 } from "./types";

/** Default grid factor: recalled, with its data year. */
export const DEFAULT_GRID_EMISSION_FACTOR: Sourced<{ kgCO2ePerKWh: number; dataYear: number }> = {
  value: { kgCO2ePerKWh: 0.37, dataYear: 2022 },
  source:
    "[memory] about the US grid average (EPA eGRID, data year 2022, ≈ 0.37 kg CO₂e/kWh); enter the project's own grid or supplier factor and its year",
};

/** Default annual leak fraction of the condenser's refrigerant inventory. */
export const DEFAULT_ANNUAL_LEAK_FRACTION: Sourced<number> = {
  value: 0.05,
  source: "[practice] a few per cent a year for well-kept industrial systems; commercial halocarbon systems often lose 10–25 % [memory]",
};

export interface WaterFootprint {
  withdrawnM3: number;
  consumedM3: number;
  withdrawnM3PerMWh: number;
  consumedM3PerMWh: number;
}

/**
 * Water withdrawn (makeup) and consumed (evaporation + drift), m³ per year and per MWh rejected
 * (heat in kWh; per-MWh values are 0 when no heat was rejected).
 */
export function waterFootprint(water: WaterByComponentM3, heatRejectedKWh: number): WaterFootprint {
  const withdrawn = water.makeup;
  const consumed = water.evaporation + water.drift;
  const mwh = heatRejectedKWh / 1000;
  return {
    withdrawnM3: withdrawn,
    consumedM3: consumed,
    withdrawnM3PerMWh: mwh > 0 ? withdrawn / mwh : 0,
    consumedM3PerMWh: mwh > 0 ? consumed / mwh : 0,
  };
}

/** Emissions from electricity, kg CO₂e: kWh × factor (kg CO₂e/kWh). */
export function electricityEmissionsKgCO2e(electricityKWh: number, gridFactorKgCO2ePerKWh: number): number {
  return electricityKWh * gridFactorKgCO2ePerKWh;
}

/** Emissions from refrigerant leakage, kg CO₂e per year: leak fraction × inventory (kg) × GWP. */
export function leakageEmissionsKgCO2e(inventoryKg: number, annualLeakFraction: number, gwp100: number): number {
  return annualLeakFraction * inventoryKg * gwp100;
}

export interface EmissionsFootprint {
  electricityKgCO2e: number;
  leakageKgCO2e: number;
  totalKgCO2e: number;
  /** Refrigerant lost per year, kg. */
  leakedRefrigerantKg: number;
  totalKgCO2ePerMWh: number;
}

/** Yearly emissions of an option: electricity + refrigerant leakage, kg CO₂e (and per MWh rejected). */
export function emissionsFootprint(args: {
  electricityKWh: number;
  gridFactorKgCO2ePerKWh: number;
  inventoryKg: number;
  annualLeakFraction: number;
  gwp100: number;
  heatRejectedKWh: number;
}): EmissionsFootprint {
  const el = electricityEmissionsKgCO2e(args.electricityKWh, args.gridFactorKgCO2ePerKWh);
  const leak = leakageEmissionsKgCO2e(args.inventoryKg, args.annualLeakFraction, args.gwp100);
  const total = el + leak;
  const mwh = args.heatRejectedKWh / 1000;
  return {
    electricityKgCO2e: el,
    leakageKgCO2e: leak,
    totalKgCO2e: total,
    leakedRefrigerantKg: args.annualLeakFraction * args.inventoryKg,
    totalKgCO2ePerMWh: mwh > 0 ? total / mwh : 0,
  };
}

/** Carbon cost per year at base-date prices: emissions (kg) / 1000 × price per tonne CO₂e. */
export function carbonCostPerYear(emissionsKgCO2e: number, pricePerTonneCO2e: number): number {
  return (emissionsKgCO2e / 1000) * pricePerTonneCO2e;
}

export interface OptionFootprint {
  optionId: string;
  water: WaterFootprint;
  emissions: EmissionsFootprint;
  /** Electricity counted, kWh per year (the energy the life-cycle cost prices). */
  electricityKWh: number;
  inventoryKg: number;
}

export interface ScenarioFootprint {
  refrigerant: Refrigerant;
  refrigerantLabel: string;
  gwp100: number;
  gwpReport: GwpReport;
  gwpReportLabel: string;
  gridFactorKgCO2ePerKWh: number;
  gridFactorYear: number;
  gridFactorSource: string;
  annualLeakFraction: number;
  options: OptionFootprint[];
}

/** Every option's footprint from its yearly physics and condenser plan (same order as the physics). */
export function scenarioFootprint(physics: OptionAnnualPhysics[], plans: CondenserPlan[], refrigerant: Refrigerant, f: FootprintInput): ScenarioFootprint {
  const gwp = globalWarmingPotential100(refrigerant, f.gwpReport);
  const inventory = new Map(plans.map((p) => [p.optionId, p.inventoryKg]));
  return {
    refrigerant,
    refrigerantLabel: REFRIGERANT_LABELS[refrigerant],
    gwp100: gwp,
    gwpReport: f.gwpReport,
    gwpReportLabel: GWP_REPORT_LABELS[f.gwpReport],
    gridFactorKgCO2ePerKWh: f.gridEmissionFactorKgCO2ePerKWh,
    gridFactorYear: f.gridEmissionFactorYear,
    gridFactorSource: f.gridEmissionFactorSource,
    annualLeakFraction: f.annualLeakFraction,
    options: physics.map((p) => {
      const inv = inventory.get(p.optionId) ?? 0;
      return {
        optionId: p.optionId,
        water: waterFootprint(p.waterM3, p.heatRejectedKWh),
        electricityKWh: p.energyKWh.total,
        inventoryKg: inv,
        emissions: emissionsFootprint({
          electricityKWh: p.energyKWh.total,
          gridFactorKgCO2ePerKWh: f.gridEmissionFactorKgCO2ePerKWh,
          inventoryKg: inv,
          annualLeakFraction: f.annualLeakFraction,
          gwp100: gwp,
          heatRejectedKWh: p.heatRejectedKWh,
        }),
      };
    }),
  };
}
