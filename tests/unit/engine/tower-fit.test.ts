import { describe, expect, it } from "vitest";
import { fitTowerCharacteristic, liquidToGasFromFanPower } from "@/lib/engine/tower-fit";

import { F, P, coldWater } from "./merkel-reference";

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
