import { irr, npv, pmt } from "financial";
import { describe, expect, it } from "vitest";
import { upv } from "@/lib/engine/economics/factors";

// `financial` is a port of numpy-financial; its documented examples are the checks here.
describe("financial (numpy-financial port)", () => {
  it("npv(0.281, [-100, 39, 59, 55, 20]) = −0.0084785916384548798", () => {
    // numpy(.lib.financial) / numpy-financial npv docstring example (Gitman 2003, p. 346).
    expect(npv(0.281, [-100, 39, 59, 55, 20])).toBeCloseTo(-0.0084785916384548798, 12);
  });

  it("irr examples of the numpy-financial docstring", () => {
    // numpy-financial irr docstring, rounded to 5 decimals there.
    expect(irr([-100, 39, 59, 55, 20])).toBeCloseTo(0.28095, 5);
    expect(irr([-100, 0, 0, 74])).toBeCloseTo(-0.0955, 4);
    expect(irr([-100, 100, 0, -7])).toBeCloseTo(-0.0833, 4);
    expect(irr([-100, 100, 0, 7])).toBeCloseTo(0.06206, 5);
  });

  it("pmt(0.075/12, 12·15, 200000) = −1854.0247200054619", () => {
    // numpy-financial pmt docstring example (15-year loan of 200,000 at 7.5 %/yr, monthly).
    expect(pmt(0.075 / 12, 12 * 15, 200000)).toBeCloseTo(-1854.0247200054619, 8);
  });

  it("npv discounts values[0] at t = 0 (spreadsheet NPV starts at t = 1)", () => {
    // numpy-financial npv docstring: Σ_{t=0}^{M−1} values_t/(1 + rate)^t — the first value is not discounted.
    expect(npv(0.1, [100])).toBe(100);
    expect(npv(0.1, [0, 110])).toBeCloseTo(100, 12);
    // A spreadsheet's NPV(0.1, 100, 110) would give 100/1.1 + 110/1.21 = 181.818…; numpy's convention gives 200.
    expect(npv(0.1, [100, 110])).toBeCloseTo(200, 12);
  });

  it("−pmt(d, n, PV) is PV·CRF, the annualised cost of Handbook 135", () => {
    // NIST Handbook 135: CRF = 1/UPV; numpy-financial sign convention returns the payment as negative.
    expect(-pmt(0.03, 20, 14.8775)).toBeCloseTo(14.8775 / upv(0.03, 20), 10);
  });
});
