/**
 * Floating head pressure with a variable-speed fan: the hour's condensing temperature Tc (and with it
 * the fan speed) that minimises fan + compressor power, Tc between a lower bound (the minimum condensing
 * temperature, or what full speed reaches) and the set-point [practice: the usual energy optimum of
 * floating head pressure].
 *
 * The search runs on Tc, not on fan speed: for a given Tc the device's required airflow f(Tc) is a cheap
 * root (the tower's four saturated enthalpies are fixed once Tc is), and its slope df/dTc comes with it.
 * The total P(Tc) = Pfan(f(Tc)) + W(Tc) is minimal where its marginal
 *   m(Tc) = dPfan/df·df/dTc + dW/dTc = Pd·(1 − a)·3f²·df/dTc + dW/dTc
 * changes sign (fan laws P = Pd·(a + (1 − a)·f³)): at the lower bound when m ≥ 0 there (the common case —
 * compressor power outweighs fan power), else by a search stopping at the set-point or at the fan's minimum
 * speed. Where the device gives the airflow's curvature exactly (the tower: implicit second derivatives of its
 * Merkel root), the search takes Newton steps on the marginal, m′ = Pd·(1 − a)·(6f·f′² + 3f²·f″) + W″, and
 * carries the last solve along f′ and f″ for a final step under 0.1 K (about 0.001 K left); otherwise a
 * bracketed secant (Illinois) search with a 0.05 K stop. A handful of evaluations at most.
 */
import type { FanModel } from "./fans";

export interface AirflowAtCondensing {
  /** Airflow fraction needed to hold this condensing temperature (+∞: not reachable). */
  fraction: number;
  /** d(fraction)/d(Tc), 1/K (≤ 0). */
  slopePerK: number;
  /** d²(fraction)/d(Tc)², 1/K², where the device gives it exactly (then the search takes Newton steps). */
  curvaturePerK2?: number;
}

/** Marginal of fan + compressor power with the condensing temperature, kW/K. */
export function fanCompressorMarginalKWPerK(fan: FanModel, airflow: AirflowAtCondensing, compressorSlopeKWPerK: number): number {
  const f = airflow.fraction;
  return fan.designPowerKW * (1 - fan.powerFloorFraction) * 3 * f * f * airflow.slopePerK + compressorSlopeKWPerK;
}

/**
 * One hour of one device as the search sees it (an object reused across hours, not a closure per hour:
 * the annual loop calls this a few times per hour and option).
 */
export interface FloatingHour {
  /** The device's required airflow (and its slope) to hold condensing temperature Tc. */
  airflowAt(condensingC: number): AirflowAtCondensing;
  /** dW/dTc of the compressors at this hour's load, kW/K. */
  compressorSlope(condensingC: number): number;
  /** d²W/dTc² of the compressors at this hour's load, kW/K² (with the airflow's curvature: Newton steps). */
  compressorCurvature?(condensingC: number): number;
  /**
   * The airflow's slope is its exact derivative (an analytic implicit derivative, not a difference with a
   * property held), so the search may carry a solved airflow ≤ 0.05 K along it instead of solving again.
   */
  readonly slopeIsExact: boolean;
}

/**
 * The condensing temperature in [lowC, highC] minimising fan + compressor power of a variable-speed fan
 * (see the file comment). `atLow` is hour.airflowAt(lowC) when the caller has it. The fan's speed stays
 * ≥ its minimum speed.
 */
export function optimalFloatingCondensing(
  fan: FanModel,
  lowC: number,
  highC: number,
  hour: FloatingHour,
  atLow?: AirflowAtCondensing,
): { condensingC: number; airflow: AirflowAtCondensing } {
  const fMin = Math.max(fan.minSpeedFraction, fan.naturalDraftAirflowFraction);
  const a0 = atLow ?? hour.airflowAt(lowC);
  if (!(highC > lowC + 1e-6) || !(a0.fraction > fMin) || !Number.isFinite(a0.fraction)) return { condensingC: lowC, airflow: a0 };
  const m0 = fanCompressorMarginalKWPerK(fan, a0, hour.compressorSlope(lowC));
  if (m0 >= 0) return { condensingC: lowC, airflow: a0 };
  if (a0.curvaturePerK2 !== undefined && hour.compressorCurvature && hour.slopeIsExact) return newtonOnMarginal(fan, fMin, lowC, highC, hour, a0, m0);
  // Bracket by secant steps on the marginal (nearly linear over a few K): the first Tc where it turns
  // positive, the fan's minimum speed, or the set-point.
  let tLo = lowC;
  let gLo = m0;
  let aLo = a0;
  let tHi = Math.min(highC, lowC + 1);
  let aHi = hour.airflowAt(tHi);
  let gHi = 0;
  let boundary: "marginal" | "minSpeed" | null = null;
  for (let i = 0; i < 12; i++) {
    if (!(aHi.fraction > fMin)) {
      boundary = "minSpeed";
      break;
    }
    gHi = fanCompressorMarginalKWPerK(fan, aHi, hour.compressorSlope(tHi));
    if (gHi >= 0) {
      boundary = "marginal";
      break;
    }
    if (tHi >= highC) return { condensingC: highC, airflow: aHi };
    const span = tHi - tLo;
    let next = gHi > gLo ? tHi - (gHi * span) / (gHi - gLo) : tHi + 2 * span;
    next = Math.min(highC, Math.max(tHi + 0.05, Math.min(next + 0.02, tHi + 4)));
    tLo = tHi;
    gLo = gHi;
    aLo = aHi;
    tHi = next;
    aHi = hour.airflowAt(tHi);
  }
  if (boundary === null) return { condensingC: tHi, airflow: aHi };
  if (boundary === "minSpeed") {
    gLo = aLo.fraction - fMin;
    gHi = aHi.fraction - fMin;
  }
  // Illinois inside the bracket on the marginal (or on f − fMin when the minimum speed binds first).
  let side = 0;
  let best = { condensingC: tLo, airflow: aLo };
  let prev = Number.NaN;
  let prevAirflow: AirflowAtCondensing | null = null;
  for (let i = 0; i < 20; i++) {
    const t = (tLo * gHi - tHi * gLo) / (gHi - gLo);
    // 0.05 K: near its minimum the total is flat (quadratic), so the power error is far below 0.1 %. An
    // estimate within 0.05 K of the previous trial is the answer; its airflow is that trial's carried
    // along its slope (first order over ≤ 0.05 K) instead of a further airflow solve.
    if (prevAirflow !== null && hour.slopeIsExact && Math.abs(t - prev) < 0.05) return { condensingC: t, airflow: airflowNear(prevAirflow, t - prev) };
    const a = hour.airflowAt(t);
    const gt = boundary === "marginal" ? fanCompressorMarginalKWPerK(fan, a, hour.compressorSlope(t)) : a.fraction - fMin;
    best = { condensingC: t, airflow: a };
    if (tHi - tLo < 0.05 || Math.abs(t - prev) < 0.05 || gt === 0) break;
    prev = t;
    prevAirflow = a;
    // Marginal: negative below the optimum. f − fMin: positive below the minimum-speed point.
    const below = boundary === "marginal" ? gt < 0 : gt > 0;
    if (below) {
      tLo = t;
      gLo = gt;
      if (side === -1) gHi *= 0.5;
      side = -1;
    } else {
      tHi = t;
      gHi = gt;
      if (side === 1) gLo *= 0.5;
      side = 1;
    }
  }
  return best;
}

/**
 * The airflow a known solve implies a small step `stepK` away: fraction + slope·step (first-order Taylor;
 * the slope is kept). Used only for steps ≤ 0.05 K, where the airflow's curvature is negligible.
 */
export function airflowNear(known: AirflowAtCondensing, stepK: number): AirflowAtCondensing {
  return { fraction: known.fraction + known.slopePerK * stepK, slopePerK: known.slopePerK };
}

/**
 * d(marginal)/dTc, kW/K²: d/dTc of Pd·(1 − a)·3f²·f′ + W′ = Pd·(1 − a)·(6f·f′² + 3f²·f″) + W″.
 */
export function fanCompressorMarginalSlopeKWPerK2(fan: FanModel, airflow: AirflowAtCondensing, compressorCurvatureKWPerK2: number): number {
  const f = airflow.fraction;
  const s = airflow.slopePerK;
  return fan.designPowerKW * (1 - fan.powerFloorFraction) * (6 * f * s * s + 3 * f * f * (airflow.curvaturePerK2 ?? 0)) + compressorCurvatureKWPerK2;
}

/**
 * A Newton step on the marginal this small (K) is the last: it leaves about |m″/(2m′)|·s² — thousandths of a
 * kelvin — and its end's airflow is the last solve's carried along its slope and curvature.
 */
const NEWTON_STOP_K = 0.1;

/**
 * The search by Newton steps on the marginal (m and m′ from the airflow's slope and curvature), kept inside
 * the bracket [a Tc where m < 0, the set-point or a Tc where m ≥ 0] (bisection when a step leaves it). A
 * trial beyond the fan's minimum speed turns the search, in the bracket below it, to the Tc where the
 * required airflow falls to the minimum speed (Newton steps on f − fMin). From the lower bound, a few solves:
 * one where the marginal is nearly linear, and the last step is carried, not solved.
 */
function newtonOnMarginal(
  fan: FanModel,
  fMin: number,
  lowC: number,
  highC: number,
  hour: FloatingHour,
  a0: AirflowAtCondensing,
  m0: number,
): { condensingC: number; airflow: AirflowAtCondensing } {
  let lo = lowC;
  let aLo = a0;
  let hi = highC;
  let bracketed = false;
  // Seeking the minimum-speed point (f = fMin) instead of the marginal's root.
  let minimumSpeed = false;
  let t = lowC;
  let a = a0;
  let m = m0;
  for (let i = 0; i < 48; i++) {
    // The function sought and its slope: the marginal (rising with Tc) or f − fMin (falling).
    const g = minimumSpeed ? a.fraction - fMin : m;
    const slope = minimumSpeed ? a.slopePerK : fanCompressorMarginalSlopeKWPerK2(fan, a, hour.compressorCurvature ? hour.compressorCurvature(t) : 0);
    const newton = (minimumSpeed ? slope < 0 : slope > 0) ? t - g / slope : Number.NaN;
    const inside = newton > lo && newton < hi;
    if (inside && Math.abs(newton - t) < NEWTON_STOP_K) {
      const carried = airflowAlong(a, newton - t);
      if (minimumSpeed) return { condensingC: newton, airflow: { ...carried, fraction: Math.max(carried.fraction, fMin) } };
      if (carried.fraction > fMin) return { condensingC: newton, airflow: carried };
    }
    const next = inside ? newton : bracketed || minimumSpeed ? 0.5 * (lo + hi) : newton >= hi ? hi : Math.min(hi, t + 2);
    const an = hour.airflowAt(next);
    if (minimumSpeed) {
      if (an.fraction > fMin) lo = next;
      else hi = next;
    } else if (!(an.fraction > fMin)) {
      // Beyond the minimum speed: from the last Tc above it, seek where the requirement reaches it.
      minimumSpeed = true;
      hi = next;
      t = lo;
      a = aLo;
      continue;
    } else {
      const mn = fanCompressorMarginalKWPerK(fan, an, hour.compressorSlope(next));
      if (mn >= 0) {
        hi = next;
        bracketed = true;
      } else {
        if (next >= highC) return { condensingC: highC, airflow: an };
        lo = next;
        aLo = an;
      }
      m = mn;
    }
    t = next;
    a = an;
    if ((bracketed || minimumSpeed) && hi - lo < 1e-4) break;
  }
  return { condensingC: t, airflow: a };
}

/**
 * The airflow a known solve implies a step `stepK` away, to second order: f + f′·s + f″·s²/2, slope
 * f′ + f″·s (the curvature kept). Used for steps below NEWTON_STOP_K, where the third-order term is
 * negligible.
 */
export function airflowAlong(known: AirflowAtCondensing, stepK: number): AirflowAtCondensing {
  const c = known.curvaturePerK2 ?? 0;
  return { fraction: known.fraction + known.slopePerK * stepK + 0.5 * c * stepK * stepK, slopePerK: known.slopePerK + c * stepK, curvaturePerK2: c };
}
