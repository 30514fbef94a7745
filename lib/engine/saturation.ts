/**
 * Slope of the saturated-air enthalpy curve, dhs/dT, without a second exponential: the Merkel and
 * cooler solvers already hold hs(T) and need its slope for Newton steps and for the "fictitious"
 * specific heat cs = dhs/dT of the effectiveness-NTU cooler model.
 *
 * hs = 1.006·t + Ws·(2501 + 1.86·t), Ws = 0.621945·pws/(p − pws)  (ASHRAE Fundamentals 2017 ch.1 eqs. 23, 32)
 * ⇒ dhs/dt = 1.006 + 1.86·Ws + (2501 + 1.86·t)·dWs/dt,
 *   dWs/dt = Ws·(1 + Ws/0.621945)·d(ln pws)/dT,
 * with d(ln pws)/dT differentiated from the Hyland–Wexler correlations (ch.1 eqs. 5–6).
 */

const MOLAR_MASS_RATIO = 0.621945;
const KELVIN_OFFSET = 273.15;

/**
 * d(ln pws)/dT of the Hyland–Wexler saturation pressure, 1/K (over water above 0.01 °C, over ice at
 * and below; `overIce` picks the branch explicitly, e.g. for the one-sided slopes at the triple point).
 * Source: derivative of ASHRAE Fundamentals 2017 ch.1 eqs. 5 and 6.
 */
export function logSaturationPressureSlopePerK(tC: number, overIce = !(tC > 0.01)): number {
  const t = tC + KELVIN_OFFSET;
  if (!overIce) {
    return 5.8002206e3 / (t * t) - 4.8640239e-2 + 2 * 4.1764768e-5 * t - 3 * 1.4452093e-8 * t * t + 6.5459673 / t;
  }
  return (
    5.6745359e3 / (t * t) -
    9.677843e-3 +
    2 * 6.2215701e-7 * t +
    3 * 2.0747825e-9 * t * t -
    4 * 9.484024e-13 * t * t * t +
    4.1635019 / t
  );
}

/**
 * Humidity ratio of saturated air recovered from its enthalpy: Ws = (hs − 1.006·t)/(2501 + 1.86·t), kg/kg.
 * Source: ASHRAE Fundamentals 2017 ch.1 eq. 32 solved for W. Exact, no exponential.
 */
export function saturationHumidityRatioFromEnthalpy(tC: number, hsKJPerKg: number): number {
  return (hsKJPerKg - 1.006 * tC) / (2501 + 1.86 * tC);
}

/**
 * dhs/dT of saturated air at temperature t, given hs(t) already evaluated, kJ/(kg dry air·K).
 * Source: see module comment (analytic derivative of ASHRAE ch.1 eqs. 5–6, 23, 32).
 */
export function saturatedEnthalpySlopeKJPerKgK(tC: number, hsKJPerKg: number): number {
  const ws = saturationHumidityRatioFromEnthalpy(tC, hsKJPerKg);
  const dWs = ws * (1 + ws / MOLAR_MASS_RATIO) * logSaturationPressureSlopePerK(tC);
  return 1.006 + 1.86 * ws + (2501 + 1.86 * tC) * dWs;
}

/**
 * Humidity ratio of moist air from dry-bulb t and thermodynamic wet-bulb t*, given Ws* = Ws(t*):
 * W = [(2501 − 2.326·t*)·Ws* − 1.006·(t − t*)]/(2501 + 1.86·t − 4.186·t*) for t* ≥ 0 (eq. 33),
 * W = [(2830 − 0.24·t*)·Ws* − 1.006·(t − t*)]/(2830 + 1.86·t − 2.1·t*) below (eq. 35). kg/kg dry air.
 * Source: ASHRAE Fundamentals 2017 ch.1 eqs. 33, 35. Clamped at ≥ 0.
 */
export function humidityRatioFromWetBulbAndWs(dryBulbC: number, wetBulbC: number, wsAtWetBulb: number): number {
  const tw = Math.min(wetBulbC, dryBulbC);
  const w =
    tw >= 0
      ? ((2501 - 2.326 * tw) * wsAtWetBulb - 1.006 * (dryBulbC - tw)) / (2501 + 1.86 * dryBulbC - 4.186 * tw)
      : ((2830 - 0.24 * tw) * wsAtWetBulb - 1.006 * (dryBulbC - tw)) / (2830 + 1.86 * dryBulbC - 2.1 * tw);
  return w > 0 ? w : 0;
}

/**
 * d²(ln pws)/dT² of the Hyland–Wexler saturation pressure, 1/K² (branch as `logSaturationPressureSlopePerK`).
 * Source: second derivative of ASHRAE Fundamentals 2017 ch.1 eqs. 5 and 6.
 */
export function logSaturationPressureCurvaturePerK2(tC: number, overIce = !(tC > 0.01)): number {
  const t = tC + KELVIN_OFFSET;
  if (!overIce) {
    return (-2 * 5.8002206e3) / (t * t * t) + 2 * 4.1764768e-5 - 6 * 1.4452093e-8 * t - 6.5459673 / (t * t);
  }
  return (-2 * 5.6745359e3) / (t * t * t) + 2 * 6.2215701e-7 + 6 * 2.0747825e-9 * t - 12 * 9.484024e-13 * t * t - 4.1635019 / (t * t);
}

/**
 * d²hs/dT² of saturated air at temperature t, given hs(t) already evaluated, kJ/(kg dry air·K²): the
 * derivative of `saturatedEnthalpySlopeKJPerKgK`. With g = 1 + Ws/0.621945, L = d(ln pws)/dT, Ws′ = Ws·g·L:
 * Ws″ = Ws′·g·L + Ws·(Ws′/0.621945)·L + Ws·g·L′, hs″ = 2·1.86·Ws′ + (2501 + 1.86·t)·Ws″.
 * Source: calculus on ASHRAE Fundamentals 2017 ch.1 eqs. 5–6, 23, 32. No exponential.
 */
export function saturatedEnthalpyCurvatureKJPerKgK2(tC: number, hsKJPerKg: number): number {
  const ws = saturationHumidityRatioFromEnthalpy(tC, hsKJPerKg);
  const g = 1 + ws / MOLAR_MASS_RATIO;
  const l = logSaturationPressureSlopePerK(tC);
  const dWs = ws * g * l;
  const d2Ws = dWs * g * l + ws * (dWs / MOLAR_MASS_RATIO) * l + ws * g * logSaturationPressureCurvaturePerK2(tC);
  return 2 * 1.86 * dWs + (2501 + 1.86 * tC) * d2Ws;
}

/**
 * dhs/dT and d²hs/dT² of saturated air at t, given hs(t), into `out` — the same numbers as
 * `saturatedEnthalpySlopeKJPerKgK` and `saturatedEnthalpyCurvatureKJPerKgK2`, sharing their common terms
 * (Ws and d(ln pws)/dT) instead of computing them twice.
 */
export function saturatedEnthalpySlopeAndCurvature(tC: number, hsKJPerKg: number, out: { slope: number; curvature: number }): void {
  const ws = saturationHumidityRatioFromEnthalpy(tC, hsKJPerKg);
  const g = 1 + ws / MOLAR_MASS_RATIO;
  const l = logSaturationPressureSlopePerK(tC);
  const dWs = ws * g * l;
  const a = 2501 + 1.86 * tC;
  out.slope = 1.006 + 1.86 * ws + a * dWs;
  const d2Ws = dWs * g * l + ws * (dWs / MOLAR_MASS_RATIO) * l + ws * g * logSaturationPressureCurvaturePerK2(tC);
  out.curvature = 2 * 1.86 * dWs + a * d2Ws;
}
