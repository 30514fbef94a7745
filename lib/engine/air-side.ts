/**
 * Air-side state of an evaporative device: entering air from the weather, leaving air saturated at
 * the enthalpy the energy balance gives (Merkel's assumption), and the water evaporated.
 */
import { saturatedAirEnthalpyKJPerKg } from "./psychrometrics";
import {
  humidityRatioFromWetBulbAndWs,
  saturatedEnthalpySlopeKJPerKgK,
  saturationHumidityRatioFromEnthalpy,
} from "./saturation";

/** Entering-air quantities of one hour or bin, computed once and shared by every option. */
export interface EnteringAir {
  dryBulbC: number;
  wetBulbC: number;
  /** hs(wet-bulb): the Merkel entering-air enthalpy (CTI practice), kJ/kg dry air. */
  enthalpyKJPerKg: number;
  /** dhs/dT at the wet-bulb, kJ/(kg·K). */
  slopeAtWetBulbKJPerKgK: number;
  /** Humidity ratio of the entering air from dry-bulb and wet-bulb, kg/kg. */
  humidityRatio: number;
  /** Moist-air specific heat 1.006 + 1.86·W for the dry coil, kJ/(kg·K). */
  moistSpecificHeatKJPerKgK: number;
}

/**
 * Entering-air state from dry-bulb and wet-bulb at pressure p: one saturated-enthalpy evaluation.
 * ha,in = hs(t*) (CTI practice: the entering air enthalpy is taken at saturation at its wet-bulb);
 * Ws* recovered from hs(t*) exactly; W from the wet-bulb relation (ASHRAE Fundamentals 2017 ch.1 eq. 33/35).
 */
export function enteringAir(dryBulbC: number, wetBulbC: number, pPa: number): EnteringAir {
  const twb = Math.min(wetBulbC, dryBulbC);
  const hs = saturatedAirEnthalpyKJPerKg(twb, pPa);
  const ws = saturationHumidityRatioFromEnthalpy(twb, hs);
  const w = humidityRatioFromWetBulbAndWs(dryBulbC, twb, ws);
  return {
    dryBulbC,
    wetBulbC: twb,
    enthalpyKJPerKg: hs,
    slopeAtWetBulbKJPerKgK: saturatedEnthalpySlopeKJPerKgK(twb, hs),
    humidityRatio: w,
    moistSpecificHeatKJPerKgK: 1.006 + 1.86 * w,
  };
}

/**
 * Temperature of saturated air with enthalpy h, °C: Newton on hs(T) = h with the analytic slope,
 * started from the tangent at the wet-bulb (hs is convex, so the iterates approach from above).
 * Typically 2–3 saturated-enthalpy evaluations for 0.001 K.
 * Source: ASHRAE Fundamentals 2017 ch.1 eqs. 6, 23, 32.
 */
export function saturatedTemperatureFromEnthalpyC(hKJPerKg: number, pPa: number, air: EnteringAir): number {
  let t = air.wetBulbC + (hKJPerKg - air.enthalpyKJPerKg) / air.slopeAtWetBulbKJPerKgK;
  for (let i = 0; i < 8; i++) {
    const hs = saturatedAirEnthalpyKJPerKg(t, pPa);
    const step = (hs - hKJPerKg) / saturatedEnthalpySlopeKJPerKgK(t, hs);
    t -= step;
    if (Math.abs(step) < 1e-3) break;
  }
  return t;
}

/**
 * Water evaporated into an air stream that leaves saturated at the enthalpy of the energy balance:
 * ha,out = ha,in + Q/G;  Wout = Ws(Tout) with hs(Tout) = ha,out;  E = G·(Wout − Win), kg/s.
 * (Merkel's assumption of saturated leaving air; in hot dry air E can exceed Q/hfg because the air's
 * sensible heat also evaporates water.) Q in kW, G in kg dry air/s.
 */
export function evaporationKgPerS(heatKW: number, airFlowKgPerS: number, pPa: number, air: EnteringAir): number {
  if (!(heatKW > 0) || !(airFlowKgPerS > 0)) return 0;
  const hOut = air.enthalpyKJPerKg + heatKW / airFlowKgPerS;
  const tOut = saturatedTemperatureFromEnthalpyC(hOut, pPa, air);
  const wOut = saturationHumidityRatioFromEnthalpy(tOut, hOut);
  const e = airFlowKgPerS * (wOut - air.humidityRatio);
  return e > 0 ? e : 0;
}
