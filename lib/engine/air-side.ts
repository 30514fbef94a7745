/**
 * Air-side state of an evaporative device: entering air from the weather, leaving air saturated at
 * the enthalpy the energy balance gives (Merkel's assumption), and the water evaporated.
 *
 * Two entering-air enthalpies, each used where its method says:
 *  - the rating (Merkel number, enthalpy-potential effectiveness) takes the saturated enthalpy at the
 *    entering wet-bulb, hs(t*), as the cooling-tower test code does (CTI ATC-105 practice);
 *  - the water evaporated (the air-side mass and energy balance) starts from the true enthalpy of the
 *    entering air, h(t, W) = 1.006·t + W·(2501 + 1.86·t) (ASHRAE Fundamentals 2017 ch.1 eq. 32).
 * They differ by (Ws* − W)·hw(t*) (the adiabatic-saturation balance): ~0.4 kJ/kg at 35/25.6 °C, which
 * is ~1 % of the evaporation in warm dry air.
 */
import { moistAirEnthalpyKJPerKg, saturatedAirEnthalpyKJPerKg } from "./psychrometrics";
import {
  humidityRatioFromWetBulbAndWs,
  saturatedEnthalpySlopeKJPerKgK,
  saturationHumidityRatioFromEnthalpy,
} from "./saturation";

/**
 * Saturated-air enthalpy tabulated every 0.25 K from −40 to 90 °C at one pressure, for inverting
 * hs(T) = h (the leaving-air temperature) without iterating on the exponential: linear interpolation
 * of T between table points, then one exact correction with the analytic slope of the table point.
 * Error ≤ 1e−4 K. Built once per pressure (521 saturated-enthalpy evaluations).
 */
export interface SaturationTable {
  pressurePa: number;
  startC: number;
  stepK: number;
  enthalpyKJPerKg: Float64Array;
  /**
   * Index of the inverse: enthalpy buckets of equal width from hs(startC); `bucketLowIndex[b]` is the last
   * table point at or below the bucket's start, so a lookup searches only the few points of its bucket.
   */
  bucketWidthKJPerKg: number;
  bucketLowIndex: Int32Array;
}

const TABLE_START_C = -40;
const TABLE_STEP_K = 0.25;
const TABLE_POINTS = 521;
const tableCache = new Map<number, SaturationTable>();

/** The saturation table at a pressure (cached per pressure). */
export function saturationTable(pPa: number): SaturationTable {
  const cached = tableCache.get(pPa);
  if (cached) return cached;
  const h = new Float64Array(TABLE_POINTS);
  for (let i = 0; i < TABLE_POINTS; i++) h[i] = saturatedAirEnthalpyKJPerKg(TABLE_START_C + i * TABLE_STEP_K, pPa);
  const t: SaturationTable = { pressurePa: pPa, startC: TABLE_START_C, stepK: TABLE_STEP_K, enthalpyKJPerKg: h, ...inverseIndex(h) };
  if (tableCache.size > 16) tableCache.clear();
  tableCache.set(pPa, t);
  return t;
}

/** Buckets as wide as the table's narrowest step (at most 16,384 of them), each with its first point. */
function inverseIndex(h: Float64Array): { bucketWidthKJPerKg: number; bucketLowIndex: Int32Array } {
  const n = h.length;
  const h0 = h[0] ?? 0;
  let minStep = Number.POSITIVE_INFINITY;
  for (let i = 1; i < n; i++) minStep = Math.min(minStep, (h[i] ?? 0) - (h[i - 1] ?? 0));
  const width = Math.max(minStep, ((h[n - 1] ?? 0) - h0) / 16384);
  const buckets = Math.ceil(((h[n - 1] ?? 0) - h0) / width) + 1;
  const low = new Int32Array(buckets);
  let i = 0;
  for (let b = 0; b < buckets; b++) {
    const start = h0 + b * width;
    while (i < n - 2 && (h[i + 1] ?? 0) <= start) i++;
    low[b] = i;
  }
  return { bucketWidthKJPerKg: width, bucketLowIndex: low };
}

/**
 * Temperature of saturated air with enthalpy h from the table, °C: the enthalpy's bucket, then bisection
 * among the bucket's points for the interval, linear
 * inverse of the three-point quadratic through the interval (curvature from the neighbours). Falls back to the exact Newton iteration outside the table.
 */
export function tableSaturatedTemperatureC(table: SaturationTable, hKJPerKg: number): number {
  const hs = table.enthalpyKJPerKg;
  const n = hs.length;
  if (!(hKJPerKg > (hs[0] ?? 0)) || !(hKJPerKg < (hs[n - 1] ?? 0))) return Number.NaN;
  const idx = table.bucketLowIndex;
  const b = Math.floor((hKJPerKg - (hs[0] ?? 0)) / table.bucketWidthKJPerKg);
  let lo = idx[b] ?? 0;
  let hi = b + 1 < idx.length ? (idx[b + 1] ?? n - 2) + 1 : n - 1;
  // hs[lo] ≤ h (the bucket's start is at or above hs[lo]) and h < hs[hi]: the interval lies between.
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((hs[mid] ?? 0) <= hKJPerKg) lo = mid;
    else hi = mid;
  }
  const h0 = hs[lo] ?? 0;
  const h1 = hs[hi] ?? 0;
  const hPrev = hs[lo > 0 ? lo - 1 : lo] ?? h0;
  const hNext = hs[hi < n - 1 ? hi + 1 : hi] ?? h1;
  // Quadratic (three-point) inverse: interpolate on the interval using the neighbouring curvature.
  const inverseSpan = 1 / (h1 - h0);
  const u = (hKJPerKg - h0) * inverseSpan;
  // ≈ h'' Δ²/2 per unit u², relative to the interval's span
  const curvature = 0.25 * ((hNext - h1) - (h0 - hPrev)) * inverseSpan;
  let uc = u;
  for (let i = 0; i < 3; i++) uc = u - curvature * uc * (uc - 1);
  return table.startC + (lo + uc) * table.stepK;
}

/** Entering-air quantities of one hour or bin, computed once and shared by every option. */
export interface EnteringAir {
  dryBulbC: number;
  wetBulbC: number;
  /** hs(wet-bulb): the Merkel entering-air enthalpy of the rating (CTI practice), kJ/kg dry air. */
  enthalpyKJPerKg: number;
  /** h(dry-bulb, W): the true entering-air enthalpy of the mass and energy balance, kJ/kg dry air. */
  moistEnthalpyKJPerKg: number;
  /** dhs/dT at the wet-bulb, kJ/(kg·K). */
  slopeAtWetBulbKJPerKgK: number;
  /** Humidity ratio of the entering air from dry-bulb and wet-bulb, kg/kg. */
  humidityRatio: number;
  /** Moist-air specific heat 1.006 + 1.86·W for the dry coil, kJ/(kg·K). */
  moistSpecificHeatKJPerKgK: number;
  /** Saturation table at the site pressure (shared). */
  table: SaturationTable;
}

/**
 * Entering-air state from dry-bulb and wet-bulb at pressure p: one saturated-enthalpy evaluation.
 * ha,in = hs(t*) for the rating (CTI practice: the entering air enthalpy is taken at saturation at its
 * wet-bulb); Ws* recovered from hs(t*) exactly; W from the wet-bulb relation (ASHRAE Fundamentals 2017
 * ch.1 eq. 33/35); the true enthalpy h(t, W) (eq. 32) for the evaporation balance.
 */
export function enteringAir(dryBulbC: number, wetBulbC: number, pPa: number): EnteringAir {
  const a = blankEnteringAir(saturationTable(pPa));
  fillEnteringAir(a, dryBulbC, wetBulbC, pPa);
  return a;
}

/** Writes the entering-air state of (dry-bulb, wet-bulb, p) into `a` (see `enteringAir`); `a.table` is kept. */
function fillEnteringAir(a: EnteringAir, dryBulbC: number, wetBulbC: number, pPa: number): void {
  const twb = Math.min(wetBulbC, dryBulbC);
  const hs = saturatedAirEnthalpyKJPerKg(twb, pPa);
  const ws = saturationHumidityRatioFromEnthalpy(twb, hs);
  const w = humidityRatioFromWetBulbAndWs(dryBulbC, twb, ws);
  a.dryBulbC = dryBulbC;
  a.wetBulbC = twb;
  a.enthalpyKJPerKg = hs;
  a.moistEnthalpyKJPerKg = moistAirEnthalpyKJPerKg(dryBulbC, w);
  a.slopeAtWetBulbKJPerKgK = saturatedEnthalpySlopeKJPerKgK(twb, hs);
  a.humidityRatio = w;
  a.moistSpecificHeatKJPerKgK = 1.006 + 1.86 * w;
}

/**
 * The entering-air states of a whole climate, one column per quantity (the same numbers as `enteringAir`
 * per record). A year of records kept as 8,760 small objects cost the garbage collector more than their
 * arithmetic (they outlive many young-generation collections during the year loop); columns are a few
 * typed arrays. `enteringAirAt` reads one record into an object the caller reuses.
 */
export interface EnteringAirColumns {
  count: number;
  dryBulbC: Float64Array;
  wetBulbC: Float64Array;
  enthalpyKJPerKg: Float64Array;
  moistEnthalpyKJPerKg: Float64Array;
  slopeAtWetBulbKJPerKgK: Float64Array;
  humidityRatio: Float64Array;
  moistSpecificHeatKJPerKgK: Float64Array;
  /** 1 where the record has a state (a bin list may have holes), else 0. */
  present: Uint8Array;
  table: SaturationTable;
}

/** An entering-air object to fill (its fields in `enteringAir`'s order, so both share one shape). */
export function blankEnteringAir(table: SaturationTable): EnteringAir {
  return {
    dryBulbC: 0,
    wetBulbC: 0,
    enthalpyKJPerKg: 0,
    moistEnthalpyKJPerKg: 0,
    slopeAtWetBulbKJPerKgK: 0,
    humidityRatio: 0,
    moistSpecificHeatKJPerKgK: 0,
    table,
  };
}

/** Empty columns for `count` records at pressure p (fill with `setEnteringAir`). */
export function enteringAirColumns(count: number, pPa: number): EnteringAirColumns {
  return {
    count,
    dryBulbC: new Float64Array(count),
    wetBulbC: new Float64Array(count),
    enthalpyKJPerKg: new Float64Array(count),
    moistEnthalpyKJPerKg: new Float64Array(count),
    slopeAtWetBulbKJPerKgK: new Float64Array(count),
    humidityRatio: new Float64Array(count),
    moistSpecificHeatKJPerKgK: new Float64Array(count),
    present: new Uint8Array(count),
    table: saturationTable(pPa),
  };
}

/** Record i of the columns: the entering-air state of `enteringAir(dryBulbC, wetBulbC, p)`. */
export function setEnteringAir(cols: EnteringAirColumns, i: number, dryBulbC: number, wetBulbC: number, pPa: number): void {
  const a = FILL_SCRATCH.air ?? (FILL_SCRATCH.air = blankEnteringAir(cols.table));
  fillEnteringAir(a, dryBulbC, wetBulbC, pPa);
  cols.dryBulbC[i] = a.dryBulbC;
  cols.wetBulbC[i] = a.wetBulbC;
  cols.enthalpyKJPerKg[i] = a.enthalpyKJPerKg;
  cols.moistEnthalpyKJPerKg[i] = a.moistEnthalpyKJPerKg;
  cols.slopeAtWetBulbKJPerKgK[i] = a.slopeAtWetBulbKJPerKgK;
  cols.humidityRatio[i] = a.humidityRatio;
  cols.moistSpecificHeatKJPerKgK[i] = a.moistSpecificHeatKJPerKgK;
  cols.present[i] = 1;
}

/** `setEnteringAir`'s one state object, filled and copied per record (its table is not read). */
const FILL_SCRATCH: { air: EnteringAir | null } = { air: null };

/**
 * Record i of the columns as an EnteringAir, written into `into` (a new object when omitted), or undefined
 * where the record has no state. The object is the caller's: the year loop passes one and reuses it.
 */
export function enteringAirAt(cols: EnteringAirColumns, i: number, into?: EnteringAir): EnteringAir | undefined {
  if (!(i >= 0 && i < cols.count) || cols.present[i] !== 1) return undefined;
  const a = into ?? blankEnteringAir(cols.table);
  a.dryBulbC = cols.dryBulbC[i]!;
  a.wetBulbC = cols.wetBulbC[i]!;
  a.enthalpyKJPerKg = cols.enthalpyKJPerKg[i]!;
  a.moistEnthalpyKJPerKg = cols.moistEnthalpyKJPerKg[i]!;
  a.slopeAtWetBulbKJPerKgK = cols.slopeAtWetBulbKJPerKgK[i]!;
  a.humidityRatio = cols.humidityRatio[i]!;
  a.moistSpecificHeatKJPerKgK = cols.moistSpecificHeatKJPerKgK[i]!;
  a.table = cols.table;
  return a;
}

/**
 * Temperature of saturated air with enthalpy h, °C: Newton on hs(T) = h with the analytic slope,
 * started from the tangent at the wet-bulb (hs is convex, so the iterates approach from above);
 * inside the table's range the table inverse is used instead (no evaluation).
 * Source: ASHRAE Fundamentals 2017 ch.1 eqs. 6, 23, 32.
 */
export function saturatedTemperatureFromEnthalpyC(hKJPerKg: number, pPa: number, air: EnteringAir): number {
  const fromTable = tableSaturatedTemperatureC(air.table, hKJPerKg);
  if (Number.isFinite(fromTable)) return fromTable;
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
 * ha,out = h(t, W)in + Q/G;  Wout = Ws(Tout) with hs(Tout) = ha,out;  E = G·(Wout − Win), kg/s.
 * The entering enthalpy is the air's true one, h(dry-bulb, W), not hs at the wet-bulb (see the module
 * comment). Merkel's assumption of saturated leaving air; in hot dry air E can exceed Q/hfg because the
 * air's sensible heat also evaporates water. Q in kW, G in kg dry air/s.
 * Check (issue 10, ASHRAE psychrometrics, 14.696 psia, L/G 1.2, range 10 °F): 95/78 °F → E = 1.037 %
 * of the circulating flow.
 */
export function evaporationKgPerS(heatKW: number, airFlowKgPerS: number, pPa: number, air: EnteringAir): number {
  if (!(heatKW > 0) || !(airFlowKgPerS > 0)) return 0;
  const hOut = air.moistEnthalpyKJPerKg + heatKW / airFlowKgPerS;
  const tOut = saturatedTemperatureFromEnthalpyC(hOut, pPa, air);
  const wOut = saturationHumidityRatioFromEnthalpy(tOut, hOut);
  const e = airFlowKgPerS * (wOut - air.humidityRatio);
  return e > 0 ? e : 0;
}
