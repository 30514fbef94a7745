/**
 * Scenario-wide settings of one annual run (the year context) and the models built from the scenario's
 * inputs: compressor model, fouling growth law, cycles of concentration.
 */
import type { PreparedClimate } from "./climate";
import { type CompressorModel, carnotEfficiency } from "../compressor";
import { type FoulingGrowth } from "../fouling";
import type { DutyInput, FoulingInput, WaterInput } from "../input";
import { maximumCyclesFromChemistry } from "../water";

/** Scenario-wide settings the year loop needs. */
export interface YearContext {
  pPa: number;
  climate: PreparedClimate;
  duty: DutyInput;
  designHeatKW: number;
  /** Qe/Qrej, from the design COP. */
  refrigerationPerRejection: number;
  compressor: CompressorModel;
  water: WaterInput;
  cycles: number;
  loadFactor: number;
}


/** Build the compressor model from the duty. */
export function compressorModelFromDuty(duty: DutyInput): CompressorModel {
  if (duty.compressorModel.kind === "percentPerK") {
    return { kind: "percentPerK", percentPerK: duty.compressorModel.percentPerK, designCop: duty.designCop };
  }
  return {
    kind: "carnotFraction",
    carnotEfficiency: carnotEfficiency(duty.designCop, duty.condensingSetPointC, duty.evaporatingC),
    evaporatingK: duty.evaporatingC + 273.15,
  };
}

/** Growth law of the tower-water side from the scenario's fouling input. */
export function foulingGrowthFromInput(f: FoulingInput): FoulingGrowth {
  return f.model === "linear"
    ? { model: "linear", rateM2KPerWPerMonth: f.linearRateM2KPerWPerMonth }
    : { model: "asymptotic", asymptoticM2KPerW: f.asymptoticM2KPerW, timeConstantMonths: f.timeConstantMonths };
}

/** Cycles of concentration the scenario asks for (entered, or the chemistry limit). */
export function scenarioCycles(water: WaterInput): { cycles: number; limit: ReturnType<typeof maximumCyclesFromChemistry> } {
  const limit = maximumCyclesFromChemistry(water.makeup, water.limits);
  const cycles = water.cyclesMode === "entered" ? (water.cyclesOfConcentration ?? limit.cycles) : limit.cycles;
  return { cycles, limit };
}
