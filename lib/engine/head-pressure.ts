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
 * compressor power outweighs fan power), else by a bracketed secant (Illinois) search, stopping at the
 * set-point or at the fan's minimum speed. A handful of evaluations at most.
 */
import type { FanModel } from "./fans";

export interface AirflowAtCondensing {
  /** Airflow fraction needed to hold this condensing temperature (+∞: not reachable). */
  fraction: number;
  /** d(fraction)/d(Tc), 1/K (≤ 0). */
  slopePerK: number;
}

/** Marginal of fan + compressor power with the condensing temperature, kW/K. */
export function fanCompressorMarginalKWPerK(fan: FanModel, airflow: AirflowAtCondensing, compressorSlopeKWPerK: number): number {
  const f = airflow.fraction;
  return fan.designPowerKW * (1 - fan.powerFloorFraction) * 3 * f * f * airflow.slopePerK + compressorSlopeKWPerK;
}

/**
 * The condensing temperature in [lowC, highC] minimising fan + compressor power of a variable-speed fan
 * (see the file comment). `airflowAt(Tc)` is the device's required airflow; `compressorSlope(Tc)` dW/dTc.
 * `atLow` is airflowAt(lowC) when the caller has it. The fan's speed stays ≥ its minimum speed.
 */
export function optimalFloatingCondensing(
  fan: FanModel,
  lowC: number,
  highC: number,
  airflowAt: (condensingC: number) => AirflowAtCondensing,
  compressorSlope: (condensingC: number) => number,
  atLow?: AirflowAtCondensing,
): { condensingC: number; airflow: AirflowAtCondensing } {
  const fMin = Math.max(fan.minSpeedFraction, fan.naturalDraftAirflowFraction);
  const a0 = atLow ?? airflowAt(lowC);
  if (!(highC > lowC + 1e-6) || !(a0.fraction > fMin) || !Number.isFinite(a0.fraction)) return { condensingC: lowC, airflow: a0 };
  const m0 = fanCompressorMarginalKWPerK(fan, a0, compressorSlope(lowC));
  if (m0 >= 0) return { condensingC: lowC, airflow: a0 };
  // Bracket: the first Tc where the marginal turns positive, the speed reaches its minimum, or the set-point.
  let tLo = lowC;
  let gLo = m0;
  let aLo = a0;
  let step = 0.5;
  let tHi = lowC;
  let aHi = a0;
  let gHi = m0;
  let boundary: "marginal" | "minSpeed" | "setPoint" = "setPoint";
  for (let i = 0; i < 12; i++) {
    tHi = Math.min(highC, tLo + step);
    aHi = airflowAt(tHi);
    if (!(aHi.fraction > fMin)) {
      boundary = "minSpeed";
      break;
    }
    gHi = fanCompressorMarginalKWPerK(fan, aHi, compressorSlope(tHi));
    if (gHi >= 0) {
      boundary = "marginal";
      break;
    }
    if (tHi >= highC) return { condensingC: highC, airflow: aHi };
    tLo = tHi;
    gLo = gHi;
    aLo = aHi;
    step *= 2;
  }
  if (boundary === "setPoint") return { condensingC: tHi, airflow: aHi };
  // Illinois on the marginal (or on f − fMin when the minimum speed binds first).
  const g = (a: AirflowAtCondensing, t: number): number =>
    boundary === "marginal" ? fanCompressorMarginalKWPerK(fan, a, compressorSlope(t)) : a.fraction - fMin;
  if (boundary === "minSpeed") {
    gLo = aLo.fraction - fMin;
    gHi = aHi.fraction - fMin;
  }
  let side = 0;
  let best = { condensingC: tLo, airflow: aLo };
  for (let i = 0; i < 20; i++) {
    const t = boundary === "minSpeed" || gHi !== gLo ? (tLo * gHi - tHi * gLo) / (gHi - gLo) : 0.5 * (tLo + tHi);
    const a = airflowAt(t);
    const gt = g(a, t);
    best = { condensingC: t, airflow: a };
    if (tHi - tLo < 0.02 || Math.abs(gt) < 1e-9) break;
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
