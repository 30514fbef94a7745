/**
 * Evaporative condenser: refrigerant condenses inside the coil (isothermal at the condensing
 * temperature Tc), spray water recirculates over the outside, fans move air across it. No condenser
 * water loop, condenser pump or water-cooled condenser.
 *
 * Model [pub: Webb (1984), ASHRAE Trans. 90(2); Jaber & Webb (1989), ASME J. Heat Transfer 111:837–843 —
 * effectiveness-NTU in enthalpy potential for evaporative equipment], in the screening form of
 * Methods §11: with the inside isothermal the capacity-rate ratio is 0, so
 *   Q = (1 − s)·ε·ma·(hs(Tc) − ha,in),   ε = 1 − e^(−NTU),   NTU = UAh/ma,
 *   1/UAh = 1/(hD·A) + cs/UAint,   hD·A = (hD·A)design·(ma/ma,design)^0.8,
 * UAh the overall conductance on an enthalpy basis (kg/s), hD·A the external film → air mass-transfer
 * conductance, UAint the condensing-side and wall conductance (kW/K, constant), cs = (hs(Tc) − ha,in)/(Tc − twb)
 * the chord slope of the saturation curve that turns it into enthalpy terms, and s the coil-exterior
 * scale derate (a capacity fraction, restored by cleaning [practice]). hD·A and UAint are calibrated on
 * the manufacturer's rating (capacity at a design wet-bulb and condensing temperature).
 *
 * Dry operation (spray pump off, where the unit is rated for it): sensible only,
 * Q = (1 − s)·(1 − e^(−UA/(ma·cp)))·ma·cp·(Tc − tdb), 1/UA = 1/(k·hD·A·cp) + 1/UAint, with the Lewis-analogy
 * factor k calibrated on the dry rating (else 0.5–0.8 [practice]).
 * Evaporation from the air-side balance (leaving air saturated at ha,in + Q/ma), as every wet device.
 */
import { allowedSprayModes } from "./spray-modes";
import { type EnteringAir, evaporationKgPerS, saturatedTemperatureFromEnthalpyC } from "./air-side";
import type { Sourced } from "./condenser-construction";
import { type FanModel, fanOperationForRequiredAirflow, highStateTimeFraction } from "./fans";
import { type FoulingGrowth, monthlyFoulingM2KPerW } from "./fouling";
import { saturatedAirEnthalpyKJPerKg } from "./psychrometrics";
import { positivePower } from "./solvers";
import type { EngineWarning } from "./types";
import { blowdown } from "./water";

/** The manufacturer's selection of an evaporative condenser. */
export interface EvaporativeCondenserSelection {
  /** Heat rejected at the rating point (not the refrigeration capacity), kW. */
  ratedHeatRejectionKW: number;
  ratedCondensingC: number;
  ratedWetBulbC: number;
  /** Rated airflow, kg dry air/s; default: `DEFAULT_AIRFLOW_KG_PER_S_PER_KW` × rated heat. */
  airFlowKgPerS?: number;
  /** Share of the overall resistance at the rating that is inside the tubes (condensing film + wall), 0…<1. */
  internalResistanceFraction: number;
  /** Dry rating: heat rejected with the spray off at a condensing temperature and dry-bulb. */
  dryRating?: { heatRejectionKW: number; condensingC: number; dryBulbC: number };
  /** Dry external conductance / Lewis-analogy value hD·A·cp when no dry rating is given. */
  dryExternalConductanceFactor: number;
  /** The unit may run dry (spray pump off) where it is rated for it. */
  allowDryMode: boolean;
  /** Dry mode only at or below this dry-bulb; undefined = no limit. */
  dryModeMaxDryBulbC?: number;
  /**
   * Wet or dry in each hour (as the closed-circuit cooler): "lowestTotalPower" — the mode with the lower
   * fan + spray pump + compressor power; "switchOverDryBulb" — dry at or below `switchOverDryBulbC`.
   */
  modeSelection: "lowestTotalPower" | "switchOverDryBulb";
  switchOverDryBulbC?: number;
  /** Spray locked out (dry operation forced) below this dry-bulb: freeze protection of the spray water. */
  sprayLockoutDryBulbC: number;
}

/** Rated airflow per kW of rated heat rejection when the airflow is not entered, kg/s per kW. */
export const DEFAULT_AIRFLOW_KG_PER_S_PER_KW: Sourced<number> = {
  value: 0.03,
  source: "[practice] about 0.03 kg/s of air per kW rejected at the usual ammonia rating; enter the rated airflow",
};

/** Ammonia held in the coil per kW of rated heat rejection. */
export const EVAPORATIVE_CONDENSER_AMMONIA_CHARGE_KG_PER_KW: Sourced<number> = {
  value: 0.1,
  source: "[memory] screening figure 0.05–0.15 kg of ammonia per kW in the condensing coil; use the manufacturer's stated charge",
};

/** Cost of one coil-exterior cleaning and descaling. */
export const EVAPORATIVE_CONDENSER_COIL_CLEANING_COST: Sourced<number> = {
  value: 2500,
  source: "[practice] order of magnitude for a ~1 MW unit (spray side cleaned and descaled), currency units of the project; get a contractor's price",
};

/** Life of a galvanized coil. */
export const EVAPORATIVE_CONDENSER_COIL_LIFE_YEARS: Sourced<number> = {
  value: 20,
  source: "[practice] hot-dip galvanized coil about the unit's life with good water treatment; stainless longer",
};

/** Typical rating for ammonia: 35 °C (95 °F) condensing at 25.6 °C (78 °F) wet-bulb. */
export const TYPICAL_AMMONIA_RATING: Sourced<{ condensingC: number; wetBulbC: number }> = {
  value: { condensingC: 35, wetBulbC: 25.6 },
  source: "[memory] usual ammonia rating point 95 °F condensing at 78 °F wet-bulb",
};

const CP_DRY_RATING_AIR = 1.006 + 1.86 * 0.005; // moist-air cp at a typical W for the dry rating

/** A calibrated evaporative condenser. Conductances at the rated airflow. */
export interface EvaporativeCondenserModel {
  designAirFlowKgPerS: number;
  /** hD·A at the rated airflow, kg/s. */
  externalMassTransferKgPerS: number;
  /** Condensing-side + wall conductance, kW/K (+∞ when the internal share is 0). */
  internalUaKWPerK: number;
  dryFactor: number;
  allowDryMode: boolean;
  dryModeMaxDryBulbC: number;
  modeSelection: "lowestTotalPower" | "switchOverDryBulb";
  switchOverDryBulbC: number;
  sprayLockoutDryBulbC: number;
  ratedHeatRejectionKW: number;
  ratedCondensingC: number;
  ratedWetBulbC: number;
}

/**
 * Calibrate on the rating: ε = Q/(ma·(hs(Tc) − hs(twb))), NTU = −ln(1 − ε), UAh = NTU·ma, split by
 * the internal share φ: hD·A = UAh/(1 − φ), UAint = cs·UAh/φ. The dry factor from the dry rating
 * when given: ε = Q/(ma·cp·(Tc − tdb)), UA = −ma·cp·ln(1 − ε), k = 1/((1/UA − 1/UAint)·hD·A·cp).
 * Two saturated-enthalpy evaluations.
 */
export function calibrateEvaporativeCondenser(
  sel: EvaporativeCondenserSelection,
  pPa: number,
  path: string,
): { model: EvaporativeCondenserModel; warnings: EngineWarning[] } {
  const warnings: EngineWarning[] = [];
  const ma = sel.airFlowKgPerS ?? DEFAULT_AIRFLOW_KG_PER_S_PER_KW.value * sel.ratedHeatRejectionKW;
  const hIn = saturatedAirEnthalpyKJPerKg(sel.ratedWetBulbC, pPa);
  const hC = saturatedAirEnthalpyKJPerKg(sel.ratedCondensingC, pPa);
  const dh = hC - hIn;
  let eps = sel.ratedHeatRejectionKW / (ma * dh);
  if (!(eps > 0 && eps < 0.98)) {
    warnings.push({
      code: "evaporativeCondenser.ratingInfeasible",
      severity: "warning",
      message: `The rating needs an effectiveness of ${eps.toFixed(3)} at the stated airflow (the air cannot carry ${Math.round(sel.ratedHeatRejectionKW)} kW between ${sel.ratedWetBulbC} °C wet-bulb and saturation at ${sel.ratedCondensingC} °C); capped at 0.98 — check the airflow and the rating.`,
      path: `${path}.airFlowKgPerS`,
    });
    eps = Math.min(Math.max(eps, 0.01), 0.98);
  }
  const uaH = -Math.log(1 - eps) * ma;
  const phi = sel.internalResistanceFraction;
  const cs = dh / (sel.ratedCondensingC - sel.ratedWetBulbC);
  const hDA = uaH / (1 - phi);
  const uaInt = phi > 0 ? (cs * uaH) / phi : Number.POSITIVE_INFINITY;
  let dryFactor = sel.dryExternalConductanceFactor;
  if (sel.dryRating) {
    const d = sel.dryRating;
    const ca = ma * CP_DRY_RATING_AIR;
    const epsD = d.heatRejectionKW / (ca * (d.condensingC - d.dryBulbC));
    const uaDry = -ca * Math.log(1 - epsD);
    const inv = 1 / uaDry - 1 / uaInt;
    if (epsD > 0 && epsD < 1 && inv > 0) {
      dryFactor = 1 / inv / (hDA * CP_DRY_RATING_AIR);
    } else {
      warnings.push({
        code: "evaporativeCondenser.dryRatingInconsistent",
        severity: "warning",
        message: "The dry rating cannot be reproduced with the wet rating's internal conductance and airflow; the default dry factor was used.",
        path: `${path}.dryRating`,
      });
    }
  } else if (sel.allowDryMode) {
    warnings.push({
      code: "evaporativeCondenser.dryModeWithoutRating",
      severity: "info",
      message: `Dry operation is allowed but no dry rating is entered: the dry capacity comes from the Lewis analogy with a factor of ${sel.dryExternalConductanceFactor} — get the manufacturer's dry rating.`,
      path: `${path}.dryRating`,
    });
  }
  return {
    model: {
      designAirFlowKgPerS: ma,
      externalMassTransferKgPerS: hDA,
      internalUaKWPerK: uaInt,
      dryFactor,
      allowDryMode: sel.allowDryMode,
      dryModeMaxDryBulbC: sel.dryModeMaxDryBulbC ?? Number.POSITIVE_INFINITY,
      modeSelection: sel.modeSelection,
      switchOverDryBulbC: sel.switchOverDryBulbC ?? Number.NEGATIVE_INFINITY,
      sprayLockoutDryBulbC: sel.sprayLockoutDryBulbC,
      ratedHeatRejectionKW: sel.ratedHeatRejectionKW,
      ratedCondensingC: sel.ratedCondensingC,
      ratedWetBulbC: sel.ratedWetBulbC,
    },
    warnings,
  };
}

/** Chord slope of the saturation curve between the entering air (at its wet-bulb) and Tc, kJ/(kg·K). */
function chordSlope(air: EnteringAir, condensingC: number, hsCondensing: number): number {
  const span = condensingC - air.wetBulbC;
  return span > 0.05 ? (hsCondensing - air.enthalpyKJPerKg) / span : air.slopeAtWetBulbKJPerKgK;
}

/**
 * ε·ma of the wet coil, kg/s: ma·(1 − e^(−UAh/ma)), 1/UAh = 1/(hD·A·f^0.8) + cs/UAint. Multiplied by
 * hs(Tc) − ha,in (and 1 − s) it gives the heat rejected. No saturated-enthalpy evaluation.
 */
export function wetConductanceKgPerS(model: EvaporativeCondenserModel, airflowFraction: number, csKJPerKgK: number): number {
  const f = Math.max(airflowFraction, 1e-4);
  const ma = model.designAirFlowKgPerS * f;
  const uaH = 1 / (1 / (model.externalMassTransferKgPerS * positivePower(f, 0.8)) + csKJPerKgK / model.internalUaKWPerK);
  return ma * (1 - Math.exp(-uaH / ma));
}

/** ε·ma·cp of the dry coil, kW/K: ma·cp·(1 − e^(−UA/(ma·cp))), 1/UA = 1/(k·hD·A·f^0.8·cp) + 1/UAint. */
export function dryConductanceKWPerK(model: EvaporativeCondenserModel, airflowFraction: number, air: EnteringAir): number {
  const f = Math.max(airflowFraction, 1e-4);
  const cp = air.moistSpecificHeatKJPerKgK;
  const ca = model.designAirFlowKgPerS * f * cp;
  const ua = 1 / (1 / (model.dryFactor * model.externalMassTransferKgPerS * positivePower(f, 0.8) * cp) + 1 / model.internalUaKWPerK);
  return ca * (1 - Math.exp(-ua / ca));
}

/**
 * Heat the condenser rejects at a condensing temperature, kW: wet Q = (1 − s)·ε·ma·(hs(Tc) − ha,in),
 * dry Q = (1 − s)·ε·ma·cp·(Tc − tdb). One saturated-enthalpy evaluation (wet). `scaleDerate` s in 0…1.
 */
export function evaporativeCondenserCapacityKW(
  model: EvaporativeCondenserModel,
  condensingC: number,
  air: EnteringAir,
  airflowFraction: number,
  wet: boolean,
  pPa: number,
  scaleDerate = 0,
): number {
  const keep = 1 - scaleDerate;
  if (!wet) return keep * dryConductanceKWPerK(model, airflowFraction, air) * (condensingC - air.dryBulbC);
  const hs = saturatedAirEnthalpyKJPerKg(condensingC, pPa);
  const cs = chordSlope(air, condensingC, hs);
  return keep * wetConductanceKgPerS(model, airflowFraction, cs) * (hs - air.enthalpyKJPerKg);
}

/**
 * Condensing temperature at which the condenser rejects Q at an airflow, °C (the head pressure floats).
 * Dry: Tc = tdb + Q/((1 − s)·εma·cp). Wet: fixed point on cs — hs(Tc) = ha,in + Q/((1 − s)·εma), Tc from the
 * saturation table's inverse (no exponential per pass), cs = (hs − ha,in)/(Tc − twb); 3–6 passes.
 */
export function condensingTemperatureAtAirflowC(
  model: EvaporativeCondenserModel,
  air: EnteringAir,
  heatKW: number,
  airflowFraction: number,
  wet: boolean,
  pPa: number,
  scaleDerate = 0,
): number {
  const keep = 1 - scaleDerate;
  if (!wet) return air.dryBulbC + heatKW / (keep * dryConductanceKWPerK(model, airflowFraction, air));
  let cs = air.slopeAtWetBulbKJPerKgK * 1.3;
  let tc = air.wetBulbC;
  for (let i = 0; i < 30; i++) {
    const hs = air.enthalpyKJPerKg + heatKW / (keep * wetConductanceKgPerS(model, airflowFraction, cs));
    const next = saturatedTemperatureFromEnthalpyC(hs, pPa, air);
    const done = Math.abs(next - tc) < 1e-5;
    tc = next;
    cs = chordSlope(air, tc, hs);
    if (done) break;
  }
  return tc;
}

/**
 * Airflow fraction that holds a condensing target (hs(Tc) fixed, so cs is fixed): the root of
 * (1 − s)·εma(f)·Δh = Q, or of (1 − s)·εma·cp(f)·ΔT = Q dry. Illinois regula falsi on a monotone function,
 * no saturated-enthalpy evaluation. +∞ if even full airflow cannot (or the driving difference is ≤ 0).
 */
function requiredAirflowFraction(
  model: EvaporativeCondenserModel,
  air: EnteringAir,
  heatKW: number,
  wet: boolean,
  drivingDifference: number,
  cs: number,
  keep: number,
): number {
  if (!(drivingDifference > 0) || !(heatKW > 0)) return Number.POSITIVE_INFINITY;
  const need = heatKW / (keep * drivingDifference);
  const g = (f: number): number => (wet ? wetConductanceKgPerS(model, f, cs) : dryConductanceKWPerK(model, f, air)) - need;
  let hi = 1;
  let gHi = g(hi);
  // The rating point itself (full airflow at the rated conditions) counts as held despite round-off.
  if (gHi < -1e-9 * need) return Number.POSITIVE_INFINITY;
  if (gHi <= 0) return hi;
  let lo = 1e-3;
  let gLo = g(lo);
  if (gLo >= 0) return lo;
  let side = 0;
  for (let i = 0; i < 60; i++) {
    const f = (lo * gHi - hi * gLo) / (gHi - gLo);
    const gf = g(f);
    if (Math.abs(gf) < 1e-10 * need || hi - lo < 1e-10) return f;
    if (gf > 0) {
      hi = f;
      gHi = gf;
      if (side === 1) gLo *= 0.5;
      side = 1;
    } else {
      lo = f;
      gLo = gf;
      if (side === -1) gHi *= 0.5;
      side = -1;
    }
  }
  return 0.5 * (lo + hi);
}

/** One hour (or bin) of evaporative-condenser operation; rates are hour averages. */
export interface EvaporativeCondenserHourResult {
  mode: "wet" | "dry";
  /** The condensing target was held (fans at or below full speed). */
  held: boolean;
  /** Time-averaged condensing temperature, °C. */
  condensingC: number;
  airflowFraction: number;
  fanPowerKW: number;
  evaporationKgPerS: number;
  sprayOn: boolean;
}

/**
 * Modes the hour allows (as the closed-circuit cooler): spray locked out below its dry-bulb → dry only;
 * a switch-over dry-bulb fixes the mode; otherwise wet, and dry too where the unit is rated for it.
 */
export function allowedEvaporativeCondenserModes(model: EvaporativeCondenserModel, dryBulbC: number): { wet: boolean; dry: boolean } {
  return allowedSprayModes(model, dryBulbC);
}

/**
 * Airflow fraction that holds a condensing temperature in one mode, and its slope d f/d Tc (1/K) by a
 * forward difference of 0.05 K — what the floating-head optimum (head-pressure.ts) searches on.
 * One saturated-enthalpy evaluation per temperature (wet).
 */
export function evaporativeCondenserAirflowForCondensing(
  model: EvaporativeCondenserModel,
  air: EnteringAir,
  heatKW: number,
  condensingC: number,
  wet: boolean,
  pPa: number,
  scaleDerate = 0,
): { fraction: number; slopePerK: number } {
  const keep = 1 - scaleDerate;
  const at = (tc: number): number => {
    if (!wet) return requiredAirflowFraction(model, air, heatKW, false, tc - air.dryBulbC, 0, keep);
    const hs = saturatedAirEnthalpyKJPerKg(tc, pPa);
    return requiredAirflowFraction(model, air, heatKW, true, hs - air.enthalpyKJPerKg, chordSlope(air, tc, hs), keep);
  };
  const f0 = at(condensingC);
  if (!Number.isFinite(f0)) return { fraction: f0, slopePerK: 0 };
  const f1 = at(condensingC + 0.05);
  return { fraction: f0, slopePerK: Number.isFinite(f1) ? (f1 - f0) / 0.05 : 0 };
}

/**
 * One hour in a given mode: the fan control holds the condensing target (variable speed, or a time mix of
 * two states weighted on their condensing temperatures) or the condensing temperature floats at full
 * speed. Evaporation (wet only) from the air-side balance.
 */
export function solveEvaporativeCondenserModeHour(
  model: EvaporativeCondenserModel,
  fan: FanModel,
  air: EnteringAir,
  heatKW: number,
  targetCondensingC: number,
  wet: boolean,
  pPa: number,
  scaleDerate = 0,
): EvaporativeCondenserHourResult {
  if (!(heatKW > 0)) {
    return { mode: wet ? "wet" : "dry", held: true, condensingC: targetCondensingC, airflowFraction: 0, fanPowerKW: 0, evaporationKgPerS: 0, sprayOn: false };
  }
  const keep = 1 - scaleDerate;
  if (!wet) {
    const fDry = requiredAirflowFraction(model, air, heatKW, false, targetCondensingC - air.dryBulbC, 0, keep);
    return finish(model, fan, fDry, air, heatKW, targetCondensingC, false, pPa, scaleDerate);
  }
  const hsTarget = saturatedAirEnthalpyKJPerKg(targetCondensingC, pPa);
  const cs = chordSlope(air, targetCondensingC, hsTarget);
  const fWet = requiredAirflowFraction(model, air, heatKW, true, hsTarget - air.enthalpyKJPerKg, cs, keep);
  return finish(model, fan, fWet, air, heatKW, targetCondensingC, true, pPa, scaleDerate);
}

/**
 * The simplest mode rule (for checks of the model on its own; the annual pipeline chooses modes by
 * lowest total power): dry where allowed and dry operation holds the target at full airflow or less,
 * else wet.
 */
export function solveEvaporativeCondenserHour(
  model: EvaporativeCondenserModel,
  fan: FanModel,
  air: EnteringAir,
  heatKW: number,
  targetCondensingC: number,
  pPa: number,
  scaleDerate = 0,
): EvaporativeCondenserHourResult {
  const modes = allowedEvaporativeCondenserModes(model, air.dryBulbC);
  if (modes.dry) {
    const dry = solveEvaporativeCondenserModeHour(model, fan, air, heatKW, targetCondensingC, false, pPa, scaleDerate);
    if (dry.held || !modes.wet) return dry;
  }
  return solveEvaporativeCondenserModeHour(model, fan, air, heatKW, targetCondensingC, true, pPa, scaleDerate);
}

function finish(
  model: EvaporativeCondenserModel,
  fan: FanModel,
  requiredFraction: number,
  air: EnteringAir,
  heatKW: number,
  targetC: number,
  wet: boolean,
  pPa: number,
  scaleDerate: number,
): EvaporativeCondenserHourResult {
  const op = fanOperationForRequiredAirflow(fan, requiredFraction);
  const ma = model.designAirFlowKgPerS;
  const mode = wet ? "wet" : "dry";
  const evap = (f: number): number => (wet ? evaporationKgPerS(heatKW, f * ma, pPa, air) : 0);
  if (op.kind === "insufficient") {
    const tc = condensingTemperatureAtAirflowC(model, air, heatKW, 1, wet, pPa, scaleDerate);
    return { mode, held: false, condensingC: tc, airflowFraction: 1, fanPowerKW: op.state.powerKW, evaporationKgPerS: evap(1), sprayOn: wet };
  }
  if (op.kind === "continuous") {
    // Fan off with natural draft to spare: the head-pressure control holds the target; the air that
    // actually takes the heat is about the required airflow.
    const f = op.state.powerKW > 0 ? op.state.airflowFraction : Math.max(requiredFraction, 1e-3);
    return { mode, held: true, condensingC: targetC, airflowFraction: f, fanPowerKW: op.state.powerKW, evaporationKgPerS: evap(f), sprayOn: wet };
  }
  const tLow = condensingTemperatureAtAirflowC(model, air, heatKW, op.low.airflowFraction, wet, pPa, scaleDerate);
  const tHigh = condensingTemperatureAtAirflowC(model, air, heatKW, op.high.airflowFraction, wet, pPa, scaleDerate);
  const x = highStateTimeFraction(tLow, tHigh, targetC);
  return {
    mode,
    held: true,
    condensingC: targetC,
    airflowFraction: x * op.high.airflowFraction + (1 - x) * op.low.airflowFraction,
    fanPowerKW: x * op.high.powerKW + (1 - x) * op.low.powerKW,
    evaporationKgPerS: x * evap(op.high.airflowFraction) + (1 - x) * evap(op.low.airflowFraction),
    sprayOn: wet,
  };
}

/**
 * Mean coil-exterior scale derate in each calendar month (12 fractions) for cleanings every
 * `intervalMonths`: the derate grows linearly from 0 after a cleaning to `derateBeforeCleaning` at the
 * next one [practice], averaged over each month of the long-run pattern (the same schedule arithmetic
 * as tube fouling, fouling.ts).
 */
export function monthlyScaleDerate(derateBeforeCleaning: number, intervalMonths: number): number[] {
  const t = Math.max(1, Math.round(intervalMonths));
  if (!(derateBeforeCleaning > 0)) return new Array<number>(12).fill(0);
  const growth: FoulingGrowth = { model: "linear", rateM2KPerWPerMonth: derateBeforeCleaning / t };
  return monthlyFoulingM2KPerW(growth, t);
}

/** Spray-loop water of one hour, kg/s: evaporation, drift, blowdown and makeup (M = E + B + D). */
export interface SprayLoopWaterKgPerS {
  evaporation: number;
  drift: number;
  blowdown: number;
  makeup: number;
}

/**
 * Spray-loop water balance [pub: standard mass balance]: drift D = drift fraction × spray flow (while
 * the spray runs), blowdown B = max(0, E/(C − 1) − D), makeup M = E + B + D.
 */
export function sprayLoopWaterKgPerS(evaporationKgPerSValue: number, sprayFlowKgPerS: number, driftFractionOfFlow: number, cycles: number, sprayOn: boolean): SprayLoopWaterKgPerS {
  if (!sprayOn) return { evaporation: 0, drift: 0, blowdown: 0, makeup: 0 };
  const drift = driftFractionOfFlow * sprayFlowKgPerS;
  const b = blowdown(evaporationKgPerSValue, cycles, drift);
  return { evaporation: evaporationKgPerSValue, drift, blowdown: b, makeup: evaporationKgPerSValue + b + drift };
}
