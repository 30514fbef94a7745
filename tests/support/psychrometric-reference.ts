/**
 * An independent wet-bulb reference for tests. The engine's climate parsers get their wet-bulb from
 * psychrolib; comparing them with psychrolib checks nothing. This module uses other published sources:
 *
 * - Saturation pressure over liquid water: the IAPWS (1992) supplementary release, Wagner & Pruß,
 *   J. Phys. Chem. Ref. Data 22 (1993) 783: ln(p/pc) = (Tc/T)·(a1·τ + a2·τ^1.5 + a3·τ³ + a4·τ^3.5 +
 *   a5·τ⁴ + a6·τ^7.5), τ = 1 − T/Tc, Tc = 647.096 K, pc = 22.064 MPa [memory: coefficients].
 * - Over ice: IAPWS (2011) sublimation-pressure release, Wagner, Riethmann, Feistel & Harvey:
 *   ln(p/pt) = θ⁻¹·Σ ai·θ^bi, θ = T/Tt, Tt = 273.16 K, pt = 611.657 Pa [memory: coefficients].
 * - Humidity ratio W = 0.621945·pw/(p − pw) and the psychrometric (wet-bulb) equations of ASHRAE
 *   Handbook—Fundamentals 2017 ch.1, eqs. 33 (wet surface above freezing) and 35 (iced surface).
 *
 * The IAPWS curves and the Handbook's Hyland–Wexler fit agree within about 0.02 % between −40 and 60 °C,
 * a few thousandths of a kelvin in wet-bulb; tests allow 0.01 K.
 */

const TC_K = 647.096;
const PC_PA = 22.064e6;
const A = [-7.85951783, 1.84408259, -11.7866497, 22.6807411, -15.9618719, 1.80122502];

function liquidSaturationPa(tC: number): number {
  const t = tC + 273.15;
  const tau = 1 - t / TC_K;
  const sum =
    A[0]! * tau + A[1]! * tau ** 1.5 + A[2]! * tau ** 3 + A[3]! * tau ** 3.5 + A[4]! * tau ** 4 + A[5]! * tau ** 7.5;
  return PC_PA * Math.exp((TC_K / t) * sum);
}

const ICE_A = [-21.2144006, 27.3203819, -6.1059813];
const ICE_B = [0.00333333333, 1.20666667, 1.70333333];

function iceSaturationPa(tC: number): number {
  const theta = (tC + 273.15) / 273.16;
  let sum = 0;
  for (let i = 0; i < 3; i++) sum += ICE_A[i]! * theta ** ICE_B[i]!;
  return 611.657 * Math.exp(sum / theta);
}

/** Saturation pressure of water vapour, Pa: over ice at or below 0.01 °C, over water above. */
export function referenceSaturationPa(tC: number): number {
  return tC > 0.01 ? liquidSaturationPa(tC) : iceSaturationPa(tC);
}

function humidityRatio(pwPa: number, pPa: number): number {
  return (0.621945 * pwPa) / (pPa - pwPa);
}

/** Humidity ratio the psychrometric equation gives for a dry-bulb and a trial wet-bulb (eqs. 33/35). */
function humidityRatioAtWetBulb(dryBulbC: number, wetBulbC: number, pPa: number): number {
  const wsStar = humidityRatio(referenceSaturationPa(wetBulbC), pPa);
  if (wetBulbC >= 0) {
    return ((2501 - 2.326 * wetBulbC) * wsStar - 1.006 * (dryBulbC - wetBulbC)) / (2501 + 1.86 * dryBulbC - 4.186 * wetBulbC);
  }
  return ((2830 - 0.24 * wetBulbC) * wsStar - 1.006 * (dryBulbC - wetBulbC)) / (2830 + 1.86 * dryBulbC - 2.1 * wetBulbC);
}

function wetBulbForHumidityRatio(dryBulbC: number, w: number, pPa: number): number {
  let lo = -100;
  let hi = dryBulbC;
  for (let i = 0; i < 100; i++) {
    const mid = 0.5 * (lo + hi);
    if (humidityRatioAtWetBulb(dryBulbC, mid, pPa) < w) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Wet-bulb, °C, from dry-bulb and dew point (pw = pws(dew point)) at a pressure in Pa. */
export function referenceWetBulbFromDewPointC(dryBulbC: number, dewPointC: number, pPa: number): number {
  return wetBulbForHumidityRatio(dryBulbC, humidityRatio(referenceSaturationPa(dewPointC), pPa), pPa);
}

/** Wet-bulb, °C, from dry-bulb and relative humidity (0–1; pw = RH·pws(dry-bulb)) at a pressure in Pa. */
export function referenceWetBulbFromRelHumC(dryBulbC: number, rhFraction: number, pPa: number): number {
  return wetBulbForHumidityRatio(dryBulbC, humidityRatio(rhFraction * referenceSaturationPa(dryBulbC), pPa), pPa);
}
