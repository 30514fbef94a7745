/**
 * Scenario-wide settings of one annual run (the year context) and the models built from the scenario's
 * inputs: compressor model, fouling growth law, cycles of concentration.
 */
import type { PreparedClimate } from "./climate";
import {
  type CompressorModel,
  CYCLE_REFRIGERANT_LABELS,
  type CycleRefrigerant,
  carnotEfficiency,
  compressorPowerKW,
  compressorPowerSlopeKWPerK,
  impliedIsentropicEfficiency,
  manufacturerCurve,
  refrigerantCycleFitRange,
} from "../compressor";
import { designRefrigerationLoadKW } from "../duty";
import type { EngineWarning } from "../types";
import { numericWarning, wv } from "../warnings";
import { type FoulingGrowth } from "../fouling";
import type { DutyInput, FoulingInput, OptionInput, WaterInput } from "../input";
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
  /** Target cycles of concentration of the wet loop being run (set per option, see `loopCycles`). */
  cycles: number;
  loadFactor: number;
}


/** What the result says about the compressor model in use. */
export interface CompressorSummary {
  kind: DutyInput["compressorModel"]["kind"];
  /** Plain-language name of the model and its source. */
  description: string;
  /** COP at the set-point and at the minimum condensing temperature with this model. */
  copAtSetPoint: number;
  copAtMinimumCondensing: number;
  /** Power change per K of condensing temperature at the set-point, % (d ln W/dTc). */
  percentPerKAtSetPoint: number;
  /** Refrigerant cycle only: the isentropic efficiency the design COP implies. */
  impliedIsentropicEfficiency?: number;
}

/**
 * Build the compressor model from the duty, calibrated so that its COP at the set-point is the design
 * COP (except the manufacturer's data, which stand as given: a mismatch is a warning). Range and
 * plausibility checks become warnings with numbers.
 */
export function compressorModelFromDuty(duty: DutyInput): { model: CompressorModel; summary: CompressorSummary; warnings: EngineWarning[] } {
  const warnings: EngineWarning[] = [];
  const cm = duty.compressorModel;
  const setC = duty.condensingSetPointC;
  const qeDesign = designRefrigerationLoadKW(duty);
  let model: CompressorModel;
  let description: string;
  let implied: number | undefined;
  switch (cm.kind) {
    case "percentPerK":
      model = { kind: "percentPerK", percentPerK: cm.percentPerK, designKWPerKW: 1 / duty.designCop, setPointC: setC, floorFraction: cm.floorFraction };
      description = `${cm.percentPerK} % per K of condensing temperature, compounding from the design COP at the set-point, never below ${Math.round(cm.floorFraction * 100)} % of the design power (entered sensitivity)`;
      break;
    case "refrigerantCycle": {
      const plant = duty.refrigerant;
      const refrigerant: CycleRefrigerant = cm.refrigerant ?? (plant === "R717" ? "R717" : "R134a");
      if (cm.refrigerant === undefined && plant !== "R717" && plant !== "R134a") {
        warnings.push({
          code: "compressor.cycleStandIn",
          severity: "info",
          message: `The compressor's sensitivity to condensing temperature follows the R-134a cycle, standing in for the plant's ${plant}: enter the manufacturer's data for a closer figure.`,
          path: "duty.compressorModel",
        });
      }
      implied = impliedIsentropicEfficiency(refrigerant, duty.designCop, duty.evaporatingC, setC);
      model = { kind: "refrigerantCycle", refrigerant, evaporatingC: duty.evaporatingC, isentropicEfficiency: implied };
      description = `single-stage saturated ${CYCLE_REFRIGERANT_LABELS[refrigerant]} cycle (fit of CoolProp reference-library values), scaled to the design COP`;
      const range = refrigerantCycleFitRange(refrigerant);
      if (duty.evaporatingC < range.evaporatingC[0] || duty.evaporatingC > range.evaporatingC[1]) {
        warnings.push(
          numericWarning({
            code: "compressor.evaporatingOutsideFit",
            severity: "warning",
            template: `The evaporating temperature {te} is outside the {lo} … {hi} the ${CYCLE_REFRIGERANT_LABELS[refrigerant]} cycle fit covers: the compressor's sensitivity is extrapolated.`,
            values: { te: wv.tempC(duty.evaporatingC), lo: wv.tempC(range.evaporatingC[0]), hi: wv.tempC(range.evaporatingC[1]) },
            path: "duty.evaporatingC",
          }),
        );
      }
      if (implied < 0.45 || implied > 0.9) {
        warnings.push(
          numericWarning({
            code: "compressor.implausibleEfficiency",
            severity: "warning",
            template: `A design COP of {cop} at {te}/{tc} implies an isentropic efficiency of {eta} for a single-stage ${CYCLE_REFRIGERANT_LABELS[refrigerant]} cycle (0.6–0.85 is usual for screw and reciprocating compressors): check the design COP, the temperatures or the refrigerant (a two-stage plant is better entered with the manufacturer's data).`,
            values: { cop: wv.ratio(duty.designCop), te: wv.tempC(duty.evaporatingC), tc: wv.tempC(setC), eta: wv.ratio(implied) },
            path: "duty.designCop",
          }),
        );
      }
      break;
    }
    case "manufacturer": {
      const curves = cm.curves.map((c) => ({
        evaporatingC: c.evaporatingC,
        points: c.points.map((p) => ({
          condensingC: p.condensingC,
          cop: p.cop ?? (p.refrigerationKW ?? qeDesign) / Math.max(p.powerKW ?? Number.NaN, 1e-9),
        })),
      }));
      const { curve, extrapolatedSuction } = manufacturerCurve(curves, duty.evaporatingC);
      model = { kind: "manufacturer", kwPerKW: curve };
      description = `the manufacturer's data (${cm.curves.map((c) => `${c.points.length} points at ${c.evaporatingC} °C suction`).join(", ")}), monotone interpolation`;
      if (extrapolatedSuction) {
        warnings.push(
          numericWarning({
            code: "compressor.suctionExtrapolated",
            severity: "warning",
            template: "The evaporating temperature {te} lies outside the suction temperatures of the compressor data ({lo} and {hi}): the data are extrapolated in suction temperature.",
            values: {
              te: wv.tempC(duty.evaporatingC),
              lo: wv.tempC(Math.min(...cm.curves.map((c) => c.evaporatingC))),
              hi: wv.tempC(Math.max(...cm.curves.map((c) => c.evaporatingC))),
            },
            path: "duty.compressorModel.curves",
          }),
        );
      }
      const copSet = 1 / compressorPowerKW(model, 1, setC);
      if (Math.abs(copSet / duty.designCop - 1) > 0.05) {
        warnings.push(
          numericWarning({
            code: "compressor.dataDisagreeWithDesignCop",
            severity: "warning",
            template: "The compressor data give a COP of {data} at the set-point {tc}, the duty's design COP is {cop}: the heat rejection follows the design COP, the compressor energy the data.",
            values: { data: wv.ratio(copSet), tc: wv.tempC(setC), cop: wv.ratio(duty.designCop) },
            path: "duty.designCop",
          }),
        );
      }
      break;
    }
    case "carnotFraction":
      model = {
        kind: "carnotFraction",
        carnotEfficiency: carnotEfficiency(duty.designCop, setC, duty.evaporatingC),
        evaporatingK: duty.evaporatingC + 273.15,
      };
      description = "a constant fraction of the Carnot COP, calibrated on the design COP (the simplest model: its sensitivity is 15–25 % below a real ammonia cycle's)";
      break;
  }
  const w = (tc: number): number => compressorPowerKW(model, 1, tc);
  const summary: CompressorSummary = {
    kind: cm.kind,
    description,
    copAtSetPoint: 1 / w(setC),
    copAtMinimumCondensing: 1 / w(duty.minimumCondensingC),
    percentPerKAtSetPoint: (100 * compressorPowerSlopeKWPerK(model, 1, setC)) / w(setC),
  };
  if (implied !== undefined) summary.impliedIsentropicEfficiency = implied;
  return { model, summary, warnings };
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

/**
 * Target cycles of one wet loop: its own entered cycles, else the scenario's. A cycles override (what-if,
 * sensitivity, break-even) replaces the scenario's cycles and scales a loop's own cycles by the same
 * factor, so a spray loop held lower than the tower stays proportionally lower. Never below 1.05.
 */
export function loopCycles(option: Pick<OptionInput, "cyclesOfConcentration">, scenarioCyclesValue: number, override?: number): number {
  const own = option.cyclesOfConcentration ?? scenarioCyclesValue;
  const scaled = override !== undefined ? (own * override) / scenarioCyclesValue : own;
  return Math.max(scaled, 1.05);
}
