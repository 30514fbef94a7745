import { describe, expect, it } from "vitest";
import {
  airrFromSir,
  crf,
  nominalFromReal,
  realFromNominal,
  spv,
  spvMidYear,
  upv,
  upvMidYear,
  upvStar,
  upvStarMidYear,
} from "@/lib/engine/economics/factors";

const series = (n: number, term: (t: number) => number) => {
  let s = 0;
  for (let t = 1; t <= n; t++) s += term(t);
  return s;
};

describe("NIST Handbook 135 discount factors", () => {
  it("UPV(3 %, 20) = 14.8775", () => {
    // NIST Handbook 135, UPV factor definition (Table 4-1 formula); value quoted in Methods §6.
    expect(upv(0.03, 20)).toBeCloseTo(14.8775, 4);
  });

  it("SPV(3 %, 10) = 0.744094", () => {
    // NIST Handbook 135, SPV factor definition; value quoted in Methods §6.
    expect(spv(0.03, 10)).toBeCloseTo(0.744094, 6);
  });

  it("UPV is the sum of the SPVs of years 1…n and UPV(0, n) = n", () => {
    // NIST Handbook 135: UPV = Σ_{t=1..n} SPV(d, t) by definition.
    expect(upv(0.07, 30)).toBeCloseTo(
      series(30, (t) => spv(0.07, t)),
      10,
    );
    expect(upv(0, 12)).toBe(12);
  });

  it("UPV* equals its series, equals UPV at e = 0, and equals n when d = e", () => {
    // NIST Handbook 135: UPV*(d, e, n) = Σ_{t=1..n} ((1 + e)/(1 + d))^t; limit n at d = e.
    expect(upvStar(0.03, 0.02, 25)).toBeCloseTo(
      series(25, (t) => (1.02 / 1.03) ** t),
      10,
    );
    expect(upvStar(0.03, -0.01, 25)).toBeCloseTo(
      series(25, (t) => (0.99 / 1.03) ** t),
      10,
    );
    expect(upvStar(0.03, 0, 20)).toBeCloseTo(14.8775, 4);
    expect(upvStar(0.04, 0.04, 17)).toBe(17);
    // Just off d = e the closed form must still approach n (no 0/0 blow-up).
    expect(upvStar(0.04, 0.04 + 1e-7, 17)).toBeCloseTo(17, 4);
  });

  it("UPV* keeps its digits when d and e differ by a hair (found by a property test)", () => {
    // NIST Handbook 135 series definition as the reference; the closed form cancels near d = e.
    const d = 1.1 * (1 + 9e-10) - 1;
    const e = 0.1;
    expect(upvStar(d, e, 25)).toBeCloseTo(
      series(25, (t) => ((1 + e) / (1 + d)) ** t),
      10,
    );
    expect(upv(9e-10, 25)).toBeCloseTo(
      series(25, (t) => (1 + 9e-10) ** -t),
      10,
    );
  });

  it("UPV* equals UPV at the escalation-adjusted rate (1 + d)/(1 + e) − 1", () => {
    // Identity of the Handbook 135 factor definitions: ((1 + e)/(1 + d))^t = (1 + d')^−t.
    const d = 0.06;
    const e = 0.025;
    expect(upvStar(d, e, 20)).toBeCloseTo(upv((1 + d) / (1 + e) - 1, 20), 10);
  });

  it("mid-year variants discount from t − 0.5", () => {
    // NIST Handbook 135 mid-year convention.
    expect(spvMidYear(0.03, 1)).toBeCloseTo(1 / Math.sqrt(1.03), 12);
    expect(upvMidYear(0.05, 10)).toBeCloseTo(
      series(10, (t) => 1.05 ** -(t - 0.5)),
      10,
    );
    expect(upvStarMidYear(0.05, 0.02, 10)).toBeCloseTo(
      series(10, (t) => (1.02 / 1.05) ** (t - 0.5)),
      10,
    );
  });

  it("real and nominal rates: (1 + D) = (1 + d)(1 + I)", () => {
    // NIST Handbook 135, relation between nominal and real discount rates.
    expect(nominalFromReal(0.03, 0.02)).toBeCloseTo(0.0506, 12);
    expect(realFromNominal(0.0506, 0.02)).toBeCloseTo(0.03, 12);
    expect(realFromNominal(nominalFromReal(0.041, 0.033), 0.033)).toBeCloseTo(0.041, 12);
  });

  it("CRF = 1/UPV; CRF(3 %, 20) = 0.06722", () => {
    // NIST Handbook 135 (CRF = 1/UPV); capital-recovery factor A/P(3 %, 20) = 0.06722 in standard
    // compound-interest tables [memory].
    expect(crf(0.03, 20)).toBeCloseTo(1 / 14.8775, 5);
    expect(crf(0.03, 20)).toBeCloseTo(0.06722, 5);
  });
});

describe("AIRR from SIR (ASTM E1057, Handbook 135)", () => {
  it("equals the rate at which reinvested savings grow to match the investment", () => {
    // ASTM E1057 definition: (1 + AIRR)^N = TV / PV(I), TV = Σ S_t (1 + r)^(N − t) (savings reinvested at r).
    const r = 0.04;
    const n = 10;
    const investment = 1000;
    const savings = [150, 160, 170, 180, 190, 200, 210, 220, 230, 240];
    const tv = savings.reduce((acc, s, i) => acc + s * (1 + r) ** (n - (i + 1)), 0);
    const airrByDefinition = (tv / investment) ** (1 / n) - 1;
    const sir = savings.reduce((acc, s, i) => acc + s * spv(r, i + 1), 0) / investment;
    expect(airrFromSir(sir, r, n)).toBeCloseTo(airrByDefinition, 12);
  });

  it("AIRR = r exactly when SIR = 1", () => {
    // ASTM E1057: an SIR of 1 earns exactly the discount rate.
    expect(airrFromSir(1, 0.031, 25)).toBeCloseTo(0.031, 14);
  });
});
