/**
 * Moist-air psychrometrics, SI: °C, Pa, kg water per kg dry air, kJ/kg dry air.
 *
 * Source for every formula: ASHRAE Handbook—Fundamentals (2017), chapter 1 ("Psychrometrics").
 * The closed-form functions (pressure, saturation pressure, humidity ratio, enthalpy) are evaluated
 * here directly because the tower and cooler solvers call them in their inner loops. The iterative
 * ones (wet-bulb, dew point) delegate to the `psychrolib` package, the open reference implementation
 * of the same chapter, which this module is the only one to import.
 *
 * The Handbook's tables include the enhancement factor f ≈ 1.004 that its formulas omit: formula
 * results sit ~0.4 % below the tabulated saturation values. That is the Handbook's own convention.
 */
import psychrolib from "psychrolib";
import { logSaturationPressureSlopePerK } from "./saturation";

/** Standard atmosphere at sea level, Pa (ASHRAE Fundamentals 2017 ch.1 Table 1). */
export const STANDARD_ATMOSPHERE_PA = 101325;

/**
 * Counts of the expensive primitive, read by benchmarks. A plain object rather than a closure so the
 * increment in the hot path stays a single property write.
 */
export const psychroCounters = { saturatedEnthalpyCalls: 0, exactSaturatedEnthalpyCalls: 0 };

/** Zero the counters (benchmarks call it before a measured run). */
export function resetPsychroCounters(): void {
  psychroCounters.saturatedEnthalpyCalls = 0;
  psychroCounters.exactSaturatedEnthalpyCalls = 0;
}

/**
 * psychrolib keeps one global unit system. Set SI once; re-set only if some other importer changed
 * it (a cheap read, not a toggle per call).
 */
function lib(): typeof psychrolib {
  if (psychrolib.GetUnitSystem() !== psychrolib.SI) psychrolib.SetUnitSystem(psychrolib.SI);
  return psychrolib;
}
lib();

const KELVIN_OFFSET = 273.15;
const TRIPLE_POINT_C = 0.01;
/** Ratio of the molar masses of water and dry air (ASHRAE 2017 ch.1 eq. 20). */
const MOLAR_MASS_RATIO = 0.621945;

/**
 * Standard-atmosphere barometric pressure at an elevation.
 * p = 101325·(1 − 2.25577e−5·Z)^5.2559, Z in m, p in Pa.
 * Source: ASHRAE Fundamentals 2017 ch.1 eq. 3 (Table 1: 89,875 Pa at 1000 m).
 */
export function pressureFromElevationPa(elevationM: number): number {
  return STANDARD_ATMOSPHERE_PA * Math.pow(1 - 2.25577e-5 * elevationM, 5.2559);
}

/**
 * Saturation pressure of water vapour over liquid water (t > 0.01 °C) or ice (t ≤ 0.01 °C), Pa.
 * Hyland–Wexler: ln pws = C8/T + C9 + C10·T + C11·T² + C12·T³ + C13·ln T over water (eq. 6),
 * ln pws = C1/T + C2 + C3·T + C4·T² + C5·T³ + C6·T⁴ + C7·ln T over ice (eq. 5), T in K.
 * Switches at the triple point so the curve is continuous (as psychrolib does).
 * Source: ASHRAE Fundamentals 2017 ch.1 eqs. 5–6. Valid −100…200 °C.
 */
export function saturationVaporPressurePa(tC: number): number {
  return Math.exp(lnSaturationPressure(tC + KELVIN_OFFSET, !(tC > TRIPLE_POINT_C)));
}

/**
 * Humidity ratio from the partial pressure of water vapour.
 * W = 0.621945·pw/(p − pw), kg/kg dry air; pw, p in Pa.
 * Source: ASHRAE Fundamentals 2017 ch.1 eq. 20.
 */
export function humidityRatioFromVaporPressure(pwPa: number, pPa: number): number {
  return (MOLAR_MASS_RATIO * pwPa) / (pPa - pwPa);
}

/**
 * Humidity ratio of saturated air at temperature t and total pressure p.
 * Ws = 0.621945·pws(t)/(p − pws(t)), kg/kg dry air.
 * Source: ASHRAE Fundamentals 2017 ch.1 eq. 23.
 */
export function saturationHumidityRatio(tC: number, pPa: number): number {
  return humidityRatioFromVaporPressure(saturationVaporPressurePa(tC), pPa);
}

/**
 * Specific enthalpy of moist air per kg of dry air.
 * h = 1.006·t + W·(2501 + 1.86·t), kJ/kg dry air, t in °C, W in kg/kg.
 * Source: ASHRAE Fundamentals 2017 ch.1 eq. 32.
 */
export function moistAirEnthalpyKJPerKg(tC: number, wKgPerKg: number): number {
  return 1.006 * tC + wKgPerKg * (2501 + 1.86 * tC);
}

/**
 * ln pws(T) of the Hyland–Wexler correlations, T in K: over water (eq. 6) or over ice (eq. 5).
 * Source: ASHRAE Fundamentals 2017 ch.1 eqs. 5–6.
 */
function lnSaturationPressure(t: number, overIce: boolean): number {
  return overIce
    ? -5.6745359e3 / t +
        6.3925247 +
        t * (-9.677843e-3 + t * (6.2215701e-7 + t * (2.0747825e-9 + t * -9.484024e-13))) +
        4.1635019 * Math.log(t)
    : -5.8002206e3 / t +
        1.3914993 +
        t * (-4.8640239e-2 + t * (4.1764768e-5 + t * -1.4452093e-8)) +
        6.5459673 * Math.log(t);
}

/** hs and dhs/dT on one branch (water or ice) of the saturation curve, kJ/kg and kJ/(kg·K). */
function saturatedEnthalpyOnBranch(tC: number, pPa: number, overIce: boolean): { hs: number; slope: number } {
  const t = tC + KELVIN_OFFSET;
  const pws = Math.exp(lnSaturationPressure(t, overIce));
  const capped = pws >= 0.99 * pPa;
  const pw = capped ? 0.99 * pPa : pws;
  const ws = (MOLAR_MASS_RATIO * pw) / (pPa - pw);
  const dWs = capped ? 0 : ((MOLAR_MASS_RATIO * pPa) / ((pPa - pw) * (pPa - pw))) * pw * logSaturationPressureSlopePerK(tC, overIce);
  return { hs: 1.006 * tC + ws * (2501 + 1.86 * tC), slope: 1.006 + 1.86 * ws + (2501 + 1.86 * tC) * dWs };
}

/**
 * Enthalpy of saturated air at temperature t by the Handbook formulas, evaluated in full (one exp, one
 * log), kJ/kg dry air. hs = 1.006·t + Ws·(2501 + 1.86·t), Ws = 0.621945·pws/(p − pws), pws from
 * Hyland–Wexler (eq. 6 over water above 0.01 °C, eq. 5 over ice at and below).
 * Source: ASHRAE Fundamentals 2017 ch.1 eqs. 5–6, 23, 32. Where the water would boil at the given
 * pressure (pws ≥ p) the vapour pressure is capped at 99 % of p so solvers get a large finite value.
 * Builds the saturation tables and serves the temperatures outside them; counted in
 * `psychroCounters.exactSaturatedEnthalpyCalls`.
 */
export function saturatedAirEnthalpyExactKJPerKg(tC: number, pPa: number): number {
  psychroCounters.exactSaturatedEnthalpyCalls++;
  const t = tC + KELVIN_OFFSET;
  const pws = Math.exp(lnSaturationPressure(t, !(tC > TRIPLE_POINT_C)));
  const pw = pws < 0.99 * pPa ? pws : 0.99 * pPa;
  const ws = (MOLAR_MASS_RATIO * pw) / (pPa - pw);
  return 1.006 * tC + ws * (2501 + 1.86 * tC);
}

/**
 * Saturated-air enthalpy tabulated once per pressure: nodes every 0.5 K from −39.99 °C so that the
 * triple point 0.01 °C is a node (the ice and water branches never share an interval), up to 90.01 °C or
 * the last node where pws ≤ 0.5·p, whichever is lower. On each interval a cubic Hermite polynomial through
 * the end values and the end slopes of its own branch (analytic dhs/dT). Interpolation error
 * ≤ h⁴·max|hs⁗|/384 ≈ 1e−5 kJ/kg at h = 0.5 K (checked against psychrolib in the tests).
 * Coefficients interleaved per interval: c0 + u·(c1 + u·(c2 + u·c3)), u ∈ [0, 1).
 */
interface SaturatedEnthalpyTable {
  pressurePa: number;
  intervals: number;
  coefficients: Float64Array;
}

const HS_TABLE_START_C = TRIPLE_POINT_C - 80 * 0.5;
const HS_TABLE_STEP_K = 0.5;
const HS_TABLE_MAX_INTERVALS = 180;

function buildSaturatedEnthalpyTable(pPa: number): SaturatedEnthalpyTable {
  const c = new Float64Array(4 * HS_TABLE_MAX_INTERVALS);
  const h = HS_TABLE_STEP_K;
  let intervals = 0;
  for (let i = 0; i < HS_TABLE_MAX_INTERVALS; i++) {
    const t0 = HS_TABLE_START_C + i * h;
    const t1 = t0 + h;
    if (saturationVaporPressurePa(t1) > 0.5 * pPa) break;
    psychroCounters.exactSaturatedEnthalpyCalls += 2;
    // The interval (t0, t1] lies on one branch: ice up to the triple point, water above it.
    const overIce = t1 <= TRIPLE_POINT_C + 1e-9;
    const a = saturatedEnthalpyOnBranch(t0, pPa, overIce);
    const b = saturatedEnthalpyOnBranch(t1, pPa, overIce);
    const d0 = a.slope * h;
    const d1 = b.slope * h;
    c[4 * i] = a.hs;
    c[4 * i + 1] = d0;
    c[4 * i + 2] = 3 * (b.hs - a.hs) - 2 * d0 - d1;
    c[4 * i + 3] = 2 * (a.hs - b.hs) + d0 + d1;
    intervals = i + 1;
  }
  return { pressurePa: pPa, intervals, coefficients: c };
}

const hsTables = new Map<number, SaturatedEnthalpyTable>();
let currentHsTable: SaturatedEnthalpyTable = buildSaturatedEnthalpyTable(STANDARD_ATMOSPHERE_PA);
hsTables.set(STANDARD_ATMOSPHERE_PA, currentHsTable);

function hsTableFor(pPa: number): SaturatedEnthalpyTable {
  let t = hsTables.get(pPa);
  if (!t) {
    if (hsTables.size >= 32) hsTables.clear();
    t = buildSaturatedEnthalpyTable(pPa);
    hsTables.set(pPa, t);
  }
  currentHsTable = t;
  return t;
}

/**
 * Enthalpy of saturated air at temperature t (the hs of Merkel's equation), kJ/kg dry air: the
 * formula of `saturatedAirEnthalpyExactKJPerKg` (ASHRAE Fundamentals 2017 ch.1 eqs. 5–6, 23, 32) read
 * from its per-pressure cubic table (within 1e−4 kJ/kg of the formula, see the table's comment), and
 * evaluated in full outside the table.
 *
 * The hot path of the tower and cooler solvers: no exp, no log, no allocation. Each call is counted in
 * `psychroCounters.saturatedEnthalpyCalls` (the count of hs values the solvers ask for).
 */
export function saturatedAirEnthalpyKJPerKg(tC: number, pPa: number): number {
  psychroCounters.saturatedEnthalpyCalls++;
  const table = currentHsTable.pressurePa === pPa ? currentHsTable : hsTableFor(pPa);
  const x = (tC - HS_TABLE_START_C) / HS_TABLE_STEP_K;
  const i = Math.floor(x);
  if (!(i >= 0 && i < table.intervals)) {
    psychroCounters.saturatedEnthalpyCalls--;
    return saturatedAirEnthalpyExactKJPerKgCounted(tC, pPa);
  }
  const u = x - i;
  const c = table.coefficients;
  const k = 4 * i;
  return c[k]! + u * (c[k + 1]! + u * (c[k + 2]! + u * c[k + 3]!));
}

function saturatedAirEnthalpyExactKJPerKgCounted(tC: number, pPa: number): number {
  psychroCounters.saturatedEnthalpyCalls++;
  return saturatedAirEnthalpyExactKJPerKg(tC, pPa);
}

function clampFraction(x: number): number {
  return x < 0 ? 0 : x > 1 ? 1 : x;
}

/**
 * Thermodynamic wet-bulb temperature from dry-bulb and relative humidity at pressure p, °C.
 * Solves the wet-bulb relation W = [(2501 − 2.326·t*)·Ws* − 1.006·(t − t*)]/(2501 + 1.86·t − 4.186·t*)
 * (ice: eq. 35) for t* by bisection between the dew point and the dry-bulb (tolerance 0.001 K).
 * Source: ASHRAE Fundamentals 2017 ch.1 eqs. 33/35, via psychrolib GetTWetBulbFromRelHum.
 * rhFraction is clamped to 0…1 (weather files carry 100.5 % and the like).
 */
export function wetBulbFromRelativeHumidityC(dryBulbC: number, rhFraction: number, pPa: number): number {
  return lib().GetTWetBulbFromRelHum(dryBulbC, clampFraction(rhFraction), pPa);
}

/**
 * Thermodynamic wet-bulb temperature from dry-bulb and dew point at pressure p, °C.
 * W = Ws(dew point, p) (eq. 23), then the wet-bulb relation (eqs. 33/35) solved for t* by bisection.
 * Source: ASHRAE Fundamentals 2017 ch.1, via psychrolib GetTWetBulbFromTDewPoint.
 * A dew point above the dry-bulb (rounding in weather files) is treated as saturation.
 */
export function wetBulbFromDewPointC(dryBulbC: number, dewPointC: number, pPa: number): number {
  return lib().GetTWetBulbFromTDewPoint(dryBulbC, Math.min(dewPointC, dryBulbC), pPa);
}

/**
 * Dew-point temperature of air with humidity ratio W at pressure p, °C.
 * pw = p·W/(0.621945 + W) (eq. 20 inverted), then pws(td) = pw solved by Newton on ln pws.
 * Source: ASHRAE Fundamentals 2017 ch.1 eqs. 5–6, 20, via psychrolib GetTDewPointFromHumRatio.
 * The result never exceeds the dry-bulb.
 */
export function dewPointFromHumidityRatioC(dryBulbC: number, wKgPerKg: number, pPa: number): number {
  return lib().GetTDewPointFromHumRatio(dryBulbC, Math.max(wKgPerKg, 0), pPa);
}

/**
 * Humidity ratio from dry-bulb and thermodynamic wet-bulb at pressure p, kg/kg dry air.
 * W = [(2501 − 2.326·t*)·Ws* − 1.006·(t − t*)]/(2501 + 1.86·t − 4.186·t*) for t* ≥ 0 °C (eq. 33);
 * W = [(2830 − 0.24·t*)·Ws* − 1.006·(t − t*)]/(2830 + 1.86·t − 2.1·t*) below (eq. 35).
 * Source: ASHRAE Fundamentals 2017 ch.1, via psychrolib GetHumRatioFromTWetBulb.
 * A wet-bulb above the dry-bulb is treated as equal to it.
 */
export function humidityRatioFromWetBulb(dryBulbC: number, wetBulbC: number, pPa: number): number {
  return lib().GetHumRatioFromTWetBulb(dryBulbC, Math.min(wetBulbC, dryBulbC), pPa);
}

/**
 * Relative humidity (fraction 0…1) from dry-bulb and thermodynamic wet-bulb at pressure p.
 * W from eq. 33/35, then φ = pw/pws(t) with pw = p·W/(0.621945 + W) (eqs. 20, 24).
 * Source: ASHRAE Fundamentals 2017 ch.1, via psychrolib GetRelHumFromTWetBulb.
 */
export function relativeHumidityFromWetBulb(dryBulbC: number, wetBulbC: number, pPa: number): number {
  return lib().GetRelHumFromTWetBulb(dryBulbC, Math.min(wetBulbC, dryBulbC), pPa);
}

/**
 * Latent heat of vaporization of water at the water temperature, kJ/kg, 0…100 °C.
 * hfg = 2500.92 − 2.37604·t + 5.5056e−4·t² − 1.24150e−5·t³ (t in °C): a least-squares cubic fitted
 * to the saturated-water hfg of the IAPWS-95 steam tables at 0.01, 10, …, 100 °C (2500.9, 2477.2,
 * 2453.5, 2429.8, 2406.0, 2381.9, 2357.7, 2333.0, 2308.0, 2282.5, 2256.4 kJ/kg [memory]);
 * fit residual ≤ 0.05 kJ/kg. ≈ 2429.8 kJ/kg at 30 °C.
 */
export function latentHeatOfVaporizationKJPerKg(tWaterC: number): number {
  const t = tWaterC;
  return 2500.92 + t * (-2.37604 + t * (5.5056e-4 + t * -1.2415e-5));
}

/**
 * Specific heat of liquid water used in the tower and cooler energy balances, kJ/(kg·K).
 * 4.186 is the value the Handbook's wet-bulb relation itself uses (ASHRAE 2017 ch.1 eq. 33) and
 * CTI practice; the true value varies by < 0.3 % between 10 and 50 °C.
 */
export const waterSpecificHeatKJPerKgK = 4.186;
