/**
 * An independent Merkel integration for generating tower rating points in tests: this file's own
 * saturated-air enthalpy and a fine Simpson rule, not the engine's code.
 */
// The rating points are generated here by an independent Merkel integration (this file's own saturated-air
// enthalpy and a fine Simpson rule), not with the code under test.
export const P = 101325;
const CPW = 4.186; // kJ/(kg·K), liquid water near 30 °C [memory: 4.18 kJ/(kg·K) in ASHRAE Fundamentals ch.1 tables]

/** Saturation pressure over liquid water, Pa: Hyland–Wexler, ASHRAE Handbook—Fundamentals (2017) ch.1 eq. 6. */
function pws(tC: number): number {
  const T = tC + 273.15;
  return Math.exp(-5.8002206e3 / T + 1.3914993 - 4.8640239e-2 * T + 4.1764768e-5 * T * T - 1.4452093e-8 * T ** 3 + 6.5459673 * Math.log(T));
}
/** Saturated-air enthalpy, kJ/kg dry air: W = 0.621945·pws/(p − pws), h = 1.006·t + W·(2501 + 1.86·t) (ch.1 eq. 20, 32). */
export function hs(tC: number): number {
  const p = pws(tC);
  const w = (0.621945 * p) / (P - p);
  return 1.006 * tC + w * (2501 + 1.86 * tC);
}
/** Merkel demand by composite Simpson with 4000 intervals, ha,in = hs(wet-bulb) (CTI practice). */
function merkel(coldC: number, rangeK: number, lg: number, wbC: number): number {
  const n = 4000;
  const h = rangeK / n;
  const hin = hs(wbC);
  let s = 0;
  for (let i = 0; i <= n; i++) {
    const dt = i * h;
    const w = i === 0 || i === n ? 1 : i % 2 ? 4 : 2;
    s += w / (hs(coldC + dt) - hin - lg * CPW * dt);
  }
  return ((CPW * h) / 3) * s;
}
/** The cold water a tower of characteristic C·(L/G)^−n gives at a range, wet-bulb and L/G: bisection on demand = supply. */
export function coldWater(c: number, n: number, lg: number, rangeK: number, wbC: number): number {
  const supply = c * Math.pow(lg, -n);
  let lo = wbC + 0.05;
  let hi = wbC + 30;
  for (let k = 0; k < 80; k++) {
    const mid = (lo + hi) / 2;
    const d = merkel(mid, rangeK, lg, wbC);
    // Demand falls as the cold water rises (a larger approach is easier).
    if (!Number.isFinite(d) || d > supply) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

export const F = (f: number) => ((f - 32) * 5) / 9;

