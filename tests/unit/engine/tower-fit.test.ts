import { describe, expect, it } from "vitest";
import { fitTowerCharacteristic, liquidToGasFromFanPower } from "@/lib/engine/tower-fit";

// The rating points are generated here by an independent Merkel integration (this file's own saturated-air
// enthalpy and a fine Simpson rule), not with the code under test.
const P = 101325;
const CPW = 4.186; // kJ/(kg·K), liquid water near 30 °C [memory: 4.18 kJ/(kg·K) in ASHRAE Fundamentals ch.1 tables]

/** Saturation pressure over liquid water, Pa: Hyland–Wexler, ASHRAE Handbook—Fundamentals (2017) ch.1 eq. 6. */
function pws(tC: number): number {
  const T = tC + 273.15;
  return Math.exp(-5.8002206e3 / T + 1.3914993 - 4.8640239e-2 * T + 4.1764768e-5 * T * T - 1.4452093e-8 * T ** 3 + 6.5459673 * Math.log(T));
}
/** Saturated-air enthalpy, kJ/kg dry air: W = 0.621945·pws/(p − pws), h = 1.006·t + W·(2501 + 1.86·t) (ch.1 eq. 20, 32). */
function hs(tC: number): number {
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
function coldWater(c: number, n: number, lg: number, rangeK: number, wbC: number): number {
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

const F = (f: number) => ((f - 32) * 5) / 9;

describe("fitting the tower characteristic to rating points", () => {
  // Issue 11's check: 95/85/78 °F design (range 10 °F = 5.556 K, wet-bulb 78 °F) at L/G 1.2, C = 1.3241, n = 0.6.
  const C = 1.3241;
  const N = 0.6;
  const wb = F(78);
  const range = F(95) - F(85);

  it("three points generated from C = 1.3241, n = 0.6 are fitted back within 0.5 %", () => {
    const lgs = [0.9, 1.2, 1.5];
    const points = lgs.map((lg) => {
      const cold = coldWater(C, N, lg, range, wb);
      return { waterFlowKgPerS: 50, enteringWaterC: cold + range, leavingWaterC: cold, wetBulbC: wb, liquidToGasRatio: lg };
    });
    // At the design L/G the generated tower should give about the design's 85 °F (a sanity check of the generator).
    expect(points[1]!.leavingWaterC).toBeGreaterThan(F(80));
    expect(points[1]!.leavingWaterC).toBeLessThan(F(90));
    const fit = fitTowerCharacteristic(points, P, 0.6)!;
    expect(fit.method).toBe("fitted");
    console.log(`[tower fit] C ${fit.coefficientC.toFixed(5)} (${(100 * (fit.coefficientC / C - 1)).toFixed(3)} %), n ${fit.exponentN.toFixed(5)} (${(100 * (fit.exponentN / N - 1)).toFixed(3)} %)`);
    expect(Math.abs(fit.coefficientC / C - 1)).toBeLessThan(0.005);
    expect(Math.abs(fit.exponentN / N - 1)).toBeLessThan(0.005);
    for (const p of fit.points) expect(Math.abs(p.residualFraction)).toBeLessThan(0.005);
  });

  it("one point: the default exponent is used and said so; C puts the characteristic through the point", () => {
    const cold = coldWater(C, 0.75, 1.1, range, wb);
    const fit = fitTowerCharacteristic([{ waterFlowKgPerS: 50, enteringWaterC: cold + range, leavingWaterC: cold, wetBulbC: wb, liquidToGasRatio: 1.1 }], P, 0.6)!;
    expect(fit.method).toBe("defaultExponent");
    expect(fit.exponentN).toBe(0.6);
    expect(Math.abs(fit.points[0]!.residualFraction)).toBeLessThan(1e-9);
  });

  it("shows each point's residual when the points do not lie on one characteristic", () => {
    const pts = [0.9, 1.2, 1.5].map((lg, i) => {
      const cold = coldWater(C, N, lg, range, wb) + (i === 1 ? 0.4 : 0);
      return { waterFlowKgPerS: 50, enteringWaterC: cold + range, leavingWaterC: cold, wetBulbC: wb, liquidToGasRatio: lg };
    });
    const fit = fitTowerCharacteristic(pts, P, 0.6)!;
    expect(fit.points).toHaveLength(3);
    expect(Math.max(...fit.points.map((p) => Math.abs(p.residualFraction)))).toBeGreaterThan(0.01);
  });

  it("refuses impossible points and names why", () => {
    const fit = fitTowerCharacteristic(
      [
        { waterFlowKgPerS: 50, enteringWaterC: 30, leavingWaterC: 24, wetBulbC: 25, liquidToGasRatio: 1.2 },
        { waterFlowKgPerS: 50, enteringWaterC: 30, leavingWaterC: 31, wetBulbC: 25, liquidToGasRatio: 1.2 },
      ],
      P,
      0.6,
    );
    expect(fit).toBeNull();
  });

  it("L/G from fan power by the fan laws: an eighth of the power is half the airflow, so twice the L/G", () => {
    expect(liquidToGasFromFanPower({ waterFlowKgPerS: 50, fanPowerKW: 15 / 8 }, { waterFlowKgPerS: 50, fanPowerKW: 15, liquidToGasRatio: 1.2 })).toBeCloseTo(2.4, 12);
  });
});
