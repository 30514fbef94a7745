/**
 * Water-cooled refrigerant condenser (shell-and-tube or plate): condensing side isothermal.
 *
 * Tc = Tw,in + Q/(ε·Cw), ε = 1 − e^(−UA/Cw) (an exchanger with one isothermal stream), 1/U = 1/Uclean + Rf.
 * The clean UA is calibrated from the design condensing temperature at the design entering water,
 * flow and heat. Source: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer (ε-NTU, Cr = 0);
 * fouling in series: TEMA Standards (RGP-T-2.4).
 */
import { isothermalStreamEffectiveness } from "./heat-exchanger";

/**
 * Clean-condenser UA from its design point, kW/K: ε = Q/(Cw·(Tc − Tw,in)), UA = −Cw·ln(1 − ε).
 * A design fouling allowance Rf,d (m²·K/W) in the stated design is removed: UAclean = UAdesign·(1 + Rf,d·Uclean).
 * Returns NaN when the design is impossible (Tc − Tw,in ≤ range, i.e. ε ≥ 1).
 */
export function calibrateCondenserCleanUaKWPerK(
  designCondensingC: number,
  designEnteringWaterC: number,
  designHeatKW: number,
  waterCapacityRateKWPerK: number,
  cleanUWPerM2K: number,
  designFoulingM2KPerW: number,
): number {
  const eps = designHeatKW / (waterCapacityRateKWPerK * (designCondensingC - designEnteringWaterC));
  if (!(eps > 0 && eps < 1)) return Number.NaN;
  const uaDesign = -waterCapacityRateKWPerK * Math.log(1 - eps);
  return uaDesign * (1 + designFoulingM2KPerW * cleanUWPerM2K);
}

/**
 * UA with a fouling resistance in series, kW/K: 1/UA = 1/UAclean + Rf/A with A = UAclean/Uclean,
 * i.e. UA = UAclean/(1 + Rf·Uclean). Rf in m²·K/W, Uclean in W/(m²·K).
 */
export function fouledUaKWPerK(cleanUaKWPerK: number, cleanUWPerM2K: number, foulingM2KPerW: number): number {
  return cleanUaKWPerK / (1 + foulingM2KPerW * cleanUWPerM2K);
}

/** Condensing temperature from the entering water, °C: Tc = Tw,in + Q/(ε·Cw), ε = 1 − e^(−UA/Cw). */
export function condensingTemperatureC(
  enteringWaterC: number,
  heatKW: number,
  uaKWPerK: number,
  waterCapacityRateKWPerK: number,
): number {
  return enteringWaterC + heatKW / (isothermalStreamEffectiveness(uaKWPerK, waterCapacityRateKWPerK) * waterCapacityRateKWPerK);
}

/** Entering water a condenser needs for a target condensing temperature, °C: Tw,in = Tc − Q/(ε·Cw). */
export function requiredEnteringWaterC(
  condensingC: number,
  heatKW: number,
  uaKWPerK: number,
  waterCapacityRateKWPerK: number,
): number {
  return condensingC - heatKW / (isothermalStreamEffectiveness(uaKWPerK, waterCapacityRateKWPerK) * waterCapacityRateKWPerK);
}

/**
 * Clean overall coefficient on a glycol loop relative to water, for a condenser whose water-side film is
 * a share f of its clean resistance 1/U: U_g/U_w = 1/(f/r + 1 − f), r = h_glycol/h_water (Dittus–Boelter
 * ratio at the same mass flow, glycol.ts). Resistances in series: Incropera & DeWitt, Fundamentals of
 * Heat and Mass Transfer (overall coefficient). Dimensionless; 1 for water (r = 1).
 */
export function condenserGlycolUFactor(waterSideResistanceFraction: number, coefficientRatio: number): number {
  const f = waterSideResistanceFraction;
  return 1 / (f / coefficientRatio + 1 - f);
}
