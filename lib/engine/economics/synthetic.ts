/**
 * Synthetic yearly physics for economics tests and benchmarks: round numbers spread evenly over the
 * months and hours, with an exact water balance (M = E + B + D, B = E/(C − 1) − D). Not a physics model.
 */
import type { OptionAnnualPhysics, OptionKind } from "../types";

export interface SyntheticPhysicsSpec {
  optionId: string;
  kind: OptionKind;
  label?: string;
  energyKWh: number;
  peakDemandKW: number;
  evaporationM3: number;
  driftM3: number;
  cyclesOfConcentration: number;
  sewerEvaporationCredit?: boolean;
  /** Overrides the credit flag: what the sewer bills. */
  sewerBasis?: "makeup" | "makeupMinusEvaporation" | "blowdown";
  cleaningsPerYear?: number;
  /** Spread of energy over the months: a weight per month (defaults to equal). */
  monthlyWeights?: number[];
}

/** Invented yearly physics of one option for tests and benchmarks; its water balance closes (B = E/(C − 1) − D, M = E + B + D). */
export function syntheticPhysics(spec: SyntheticPhysicsSpec): OptionAnnualPhysics {
  const weights = spec.monthlyWeights ?? Array.from({ length: 12 }, () => 1);
  const wSum = weights.reduce((a, b) => a + b, 0);
  const c = spec.cyclesOfConcentration;
  const e = spec.evaporationM3;
  const d = spec.driftM3;
  const b = Math.max(e / (c - 1) - d, 0);
  const m = e + b + d;
  const basis = spec.sewerBasis ?? (spec.sewerEvaporationCredit ? "makeupMinusEvaporation" : "makeup");
  const sewer = basis === "blowdown" ? b : basis === "makeupMinusEvaporation" ? m - e : m;
  const byMonthHour: number[] = [];
  const monthly = weights.map((w, i) => {
    const share = w / wSum;
    for (let h = 0; h < 24; h++) byMonthHour.push((spec.energyKWh * share) / 24);
    const energy = spec.energyKWh * share;
    return {
      month: i + 1,
      hours: 730,
      heatRejectedKWh: 0,
      energyKWh: {
        fan: energy,
        condenserPump: 0,
        secondaryPump: 0,
        sprayPump: 0,
        basinHeater: 0,
        compressor: 0,
        total: energy,
      },
      waterM3: {
        evaporation: e * share,
        drift: d * share,
        blowdown: b * share,
        makeup: m * share,
        sewerBilled: sewer * share,
      },
      peakDemandKW: spec.peakDemandKW,
      dryModeHours: 0,
      unmetHours: 0,
    };
  });
  return {
    optionId: spec.optionId,
    kind: spec.kind,
    label: spec.label ?? spec.optionId,
    hoursTotal: 8760,
    heatRejectedKWh: 0,
    energyKWh: {
      fan: spec.energyKWh,
      condenserPump: 0,
      secondaryPump: 0,
      sprayPump: 0,
      basinHeater: 0,
      compressor: 0,
      total: spec.energyKWh,
    },
    energyKWhByMonthHour: byMonthHour,
    waterM3: { evaporation: e, drift: d, blowdown: b, makeup: m, sewerBilled: sewer },
    monthly,
    cyclesOfConcentration: c,
    scenarioCyclesOfConcentration: c,
    targetCyclesOfConcentration: c,
    sewerBasis: basis,
    dryModeHours: 0,
    unmetHours: 0,
    meanCondensingC: 35,
    meanReferenceCondensingC: 35,
    cleaningsPerYear: spec.cleaningsPerYear ?? 0,
    optimalCleaningIntervalMonths: null,
    chemicals: { treatedOutflowM3: b + d, systemVolumeM3: 10, inhibitorKg: 0, biocideKg: 0, acidKg: 0 },
    compressorAboveCleanReferenceKWh: 0,
    compressorExtrapolatedHours: 0,
    warnings: [],
  };
}
