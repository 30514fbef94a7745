import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  type CompressorModel,
  carnotEfficiency,
  compressorExtrapolates,
  compressorPowerKW,
  evaluateMonotoneCurve,
  isentropicCycleCop,
  manufacturerCurve,
  monotoneCurve,
} from "@/lib/engine/compressor";

/** Power rise per K over +2 K of condensing temperature, %: ((W(Tc + 2)/W(Tc))^(1/2) − 1)·100. */
function percentPerK(cop: (tc: number) => number, tc: number): number {
  return (Math.sqrt(cop(tc) / cop(tc + 2)) - 1) * 100;
}

describe("refrigerant-cycle compressor model", () => {
  // Check values of issue 10 and Methods §5 [pub: computed with the CoolProp reference
  // library; single-stage, saturated suction, no subcooling, isentropic efficiency 0.75].
  const issue: { r: "R717" | "R134a"; te: number; tc: number; cop: number; pctPerK: number }[] = [
    { r: "R717", te: -10, tc: 35, cop: 3.647, pctPerK: 2.65 },
    { r: "R717", te: -33, tc: 35, cop: 1.976, pctPerK: 1.92 },
    { r: "R717", te: 5, tc: 35, cop: 6.143, pctPerK: 3.75 },
    { r: "R134a", te: 5, tc: 35, cop: 5.922, pctPerK: 3.96 },
  ];
  for (const c of issue) {
    it(`${c.r} ${c.te}/${c.tc} °C: COP ${c.cop} (±0.5 %) and +${c.pctPerK} %/K (the issue asks ±10 %; held to ±3 %)`, () => {
      const cop = (tc: number) => 0.75 * isentropicCycleCop(c.r, c.te, tc);
      expect(Math.abs(cop(c.tc) / c.cop - 1)).toBeLessThan(0.005);
      expect(Math.abs(percentPerK(cop, c.tc) / c.pctPerK - 1)).toBeLessThan(0.03);
    });
  }
  it("R717 −10/37 °C: COP 3.462 (issue 10 check value, CoolProp)", () => {
    expect(0.75 * isentropicCycleCop("R717", -10, 37)).toBeCloseTo(3.462, 2);
  });

  // Further points off the issue's list [pub: CoolProp 8.0.0 (PyPI), PropsSI, same cycle definition and
  // η 0.75, computed for this test: h1, s1 saturated vapour at te; h2s at (psat(tc), s1); h3 saturated
  // liquid at tc; COP = 0.75·(h1 − h3)/(h2s − h1)].
  const more: [("R717" | "R134a"), number, number, number][] = [
    ["R717", -20, 25, 3.5028],
    ["R717", 0, 45, 3.7775],
    ["R717", -40, 20, 2.2382],
    ["R717", 10, 50, 4.4813],
    ["R134a", -10, 40, 3.0221],
    ["R134a", -25, 30, 2.5866],
    ["R134a", 10, 55, 3.5357],
    ["R134a", 0, 20, 9.2951],
  ];
  it.each(more)("%s %d/%d °C: COP %d within 0.5 %", (r, te, tc, cop) => {
    expect(Math.abs((0.75 * isentropicCycleCop(r, te, tc)) / cop - 1)).toBeLessThan(0.005);
  });

  // The Carnot fraction's sensitivity 1/(Tc − Te) per K is 15–25 % below the real ammonia cycle's
  // (Methods §5, from the check values above).
  it("the Carnot fraction understates the ammonia cycle's sensitivity by 15–25 %", () => {
    const carnot: CompressorModel = { kind: "carnotFraction", carnotEfficiency: carnotEfficiency(3.647, 35, -10), evaporatingK: 263.15 };
    const cop = (tc: number) => 1 / compressorPowerKW(carnot, 1, tc);
    const ratio = percentPerK(cop, 35) / 2.65;
    expect(ratio).toBeGreaterThan(0.75);
    expect(ratio).toBeLessThan(0.85);
  });
});

describe("percent-per-K compressor model", () => {
  const model: CompressorModel = { kind: "percentPerK", percentPerK: 3, designKWPerKW: 0.5, setPointC: 35, floorFraction: 0.4 };
  // Hand calculation: multiplicative per kelvin, W = Wd·1.03^(Tc − 35), Wd = 1000/2 = 500 kW.
  it("compounds per kelvin: +2 K → ×1.0609, −5 K → ×1.03^−5", () => {
    expect(compressorPowerKW(model, 1000, 37)).toBeCloseTo(500 * 1.0609, 9);
    expect(compressorPowerKW(model, 1000, 30)).toBeCloseTo(500 / 1.1592740743, 6);
  });
  it("never returns less than its floor, even at 10 %/K far below the set-point (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 10, noNaN: true }), fc.double({ min: -40, max: 70, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (pct, tc, floor) => {
        const m: CompressorModel = { kind: "percentPerK", percentPerK: pct, designKWPerKW: 0.5, setPointC: 35, floorFraction: floor };
        return compressorPowerKW(m, 1000, tc) >= 500 * floor - 1e-9;
      }),
    );
    expect(compressorPowerKW({ ...model, percentPerK: 10 }, 1000, 5)).toBeCloseTo(200, 9);
  });
});

describe("manufacturer's compressor data", () => {
  // Fritsch & Carlson (1980): the interpolant passes through the data and is monotone where they are.
  it("passes through the points and interpolates monotonically (property on random increasing data)", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0.01, max: 5, noNaN: true }), { minLength: 3, maxLength: 8 }), fc.array(fc.double({ min: 0, max: 2, noNaN: true }), { minLength: 8, maxLength: 8 }), (dx, dy) => {
        const x: number[] = [];
        const y: number[] = [];
        let xs = 10;
        let ys = 0.1;
        dx.forEach((d, i) => {
          xs += d;
          ys += dy[i] ?? 0;
          x.push(xs);
          y.push(ys);
        });
        const c = monotoneCurve(x, y);
        for (let i = 0; i < x.length; i++) if (Math.abs(evaluateMonotoneCurve(c, x[i] ?? 0) - (y[i] ?? 0)) > 1e-9) return false;
        let prev = -Infinity;
        for (let t = x[0] ?? 0; t <= (x[x.length - 1] ?? 0); t += 0.01) {
          const v = evaluateMonotoneCurve(c, t);
          if (v < prev - 1e-12) return false;
          prev = v;
        }
        return true;
      }),
    );
  });

  // Hand case: step data 0, 0, 1, 1 — a natural cubic spline overshoots below 0 and above 1; the monotone
  // interpolant stays inside [0, 1] (Fritsch & Carlson 1980, the motivating example).
  it("does not overshoot step data", () => {
    const c = monotoneCurve([0, 1, 2, 3], [0, 0, 1, 1]);
    for (let t = 0; t <= 3; t += 0.01) {
      const v = evaluateMonotoneCurve(c, t);
      expect(v).toBeGreaterThanOrEqual(-1e-12);
      expect(v).toBeLessThanOrEqual(1 + 1e-12);
    }
  });

  it("COP points → power per unit refrigeration; outside the data it is flagged as extrapolated", () => {
    const { curve } = manufacturerCurve([{ evaporatingC: -10, points: [{ condensingC: 25, cop: 5 }, { condensingC: 35, cop: 3.6 }, { condensingC: 45, cop: 2.6 }] }], -10);
    const model: CompressorModel = { kind: "manufacturer", kwPerKW: curve };
    expect(compressorPowerKW(model, 1000, 35)).toBeCloseTo(1000 / 3.6, 9);
    expect(compressorPowerKW(model, 1000, 25)).toBeCloseTo(200, 9);
    expect(compressorExtrapolates(model, 35)).toBe(false);
    expect(compressorExtrapolates(model, 20)).toBe(true);
    expect(compressorExtrapolates(model, 46)).toBe(true);
  });

  // Hand calculation: with two suction temperatures, 1/COP is linear in Te at each condensing temperature:
  // at Te −15 between −10 (COP 3.6 at 35 °C) and −20 (COP 2.8): 1/COP = (1/3.6 + 1/2.8)/2.
  it("two suction temperatures: linear in Te between them", () => {
    const pts = (a: number, b: number, c: number) => [{ condensingC: 25, cop: a }, { condensingC: 35, cop: b }, { condensingC: 45, cop: c }];
    const { curve, extrapolatedSuction } = manufacturerCurve([{ evaporatingC: -10, points: pts(5, 3.6, 2.6) }, { evaporatingC: -20, points: pts(3.9, 2.8, 2.1) }], -15);
    expect(extrapolatedSuction).toBe(false);
    expect(evaluateMonotoneCurve(curve, 35)).toBeCloseTo((1 / 3.6 + 1 / 2.8) / 2, 12);
    expect(manufacturerCurve([{ evaporatingC: -10, points: pts(5, 3.6, 2.6) }, { evaporatingC: -20, points: pts(3.9, 2.8, 2.1) }], -25).extrapolatedSuction).toBe(true);
  });
});
