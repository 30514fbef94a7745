/**
 * Compressor power against condensing temperature, for the penalty of a warmer condenser.
 *
 * Carnot-fraction model: COP = η·Te/(Tc − Te) (temperatures in K), η calibrated from the design COP
 * at the condensing set-point; W = Qe/COP, so dW/dTc = Qe/(η·Te) exactly (≈ W/(Tc − Te) per K).
 * Or a user-entered sensitivity: ΔW = Wdesign·(%/K)/100·ΔTc (2–4 %/K in industrial refrigeration,
 * 1–2 % per °F of entering condenser water for chillers [practice]).
 * Heat rejected = refrigeration load × (1 + 1/COP). Sources: thermodynamics of the reversed Carnot
 * cycle; LoopLedger engineering notes §5.
 */

const KELVIN = 273.15;

export type CompressorModel =
  | { kind: "carnotFraction"; carnotEfficiency: number; evaporatingK: number }
  | { kind: "percentPerK"; percentPerK: number; designCop: number };

/**
 * Carnot efficiency from a design point: η = COP·(Tc − Te)/Te, K. Dimensionless.
 */
export function carnotEfficiency(designCop: number, condensingC: number, evaporatingC: number): number {
  return (designCop * (condensingC - evaporatingC)) / (evaporatingC + KELVIN);
}

/** COP of the Carnot-fraction model at a condensing temperature: η·Te/(Tc − Te). */
export function carnotFractionCop(model: { carnotEfficiency: number; evaporatingK: number }, condensingC: number): number {
  return (model.carnotEfficiency * model.evaporatingK) / (condensingC + KELVIN - model.evaporatingK);
}

/**
 * Extra compressor power when condensing at Tc instead of Tref, kW (negative if Tc < Tref).
 * Carnot fraction: ΔW = Qe·(Tc − Tref)/(η·Te). Per cent per K: ΔW = (Qe/COPd)·(%/K)/100·(Tc − Tref).
 */
export function compressorPenaltyKW(
  model: CompressorModel,
  refrigerationLoadKW: number,
  condensingC: number,
  referenceCondensingC: number,
): number {
  const dT = condensingC - referenceCondensingC;
  if (model.kind === "carnotFraction") return (refrigerationLoadKW * dT) / (model.carnotEfficiency * model.evaporatingK);
  return (refrigerationLoadKW / model.designCop) * (model.percentPerK / 100) * dT;
}

/** Compressor power at a condensing temperature, kW (Carnot fraction, or design COP ± %/K about the set-point). */
export function compressorPowerKW(
  model: CompressorModel,
  refrigerationLoadKW: number,
  condensingC: number,
  setPointC: number,
): number {
  if (model.kind === "carnotFraction") return refrigerationLoadKW / carnotFractionCop(model, condensingC);
  return (refrigerationLoadKW / model.designCop) * (1 + (model.percentPerK / 100) * (condensingC - setPointC));
}

/** Refrigeration load from the heat rejected: Qe = Qrej·COP/(1 + COP), kW. */
export function refrigerationLoadFromRejectionKW(heatRejectedKW: number, cop: number): number {
  return (heatRejectedKW * cop) / (1 + cop);
}
