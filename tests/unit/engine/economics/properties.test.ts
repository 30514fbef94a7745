import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyzeEconomics, spv } from "@/lib/engine/economics";
import { economicsSchema, tariffsSchema } from "@/lib/scenarios/schema-economics";
import { baseArgs } from "./helpers";

const rateArb = fc.double({ min: 0, max: 0.12, noNaN: true });
const escalationArb = fc.double({ min: -0.03, max: 0.08, noNaN: true });

describe("monotonicity (fast-check)", () => {
  it("raising the water price never lowers a wet option's LCC", () => {
    // Every option kind has a wet loop with makeup > 0, so its water bill rises with the price
    // (common practice, no source: a cost with a positive quantity is non-decreasing in its price).
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 10, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        rateArb,
        escalationArb,
        fc.constantFrom("real", "nominal"),
        fc.constantFrom("endOfYear", "midYear"),
        (price, extra, d, e, analysis, discounting) => {
          const at = (p: number) => {
            const tariffs = tariffsSchema.parse({ water: { pricePerM3: p }, escalation: { water: e } });
            const economics = economicsSchema.parse({ realDiscountRate: d, analysis, discounting });
            return analyzeEconomics(baseArgs({ tariffs, economics })).options.map((o) => o.lcc);
          };
          const lo = at(price);
          const hi = at(price + extra);
          lo.forEach((l, i) => expect(hi[i] ?? -Infinity).toBeGreaterThanOrEqual(l - 1e-9 * Math.abs(l)));
        },
      ),
      { numRuns: 60 },
    );
  });

  it("raising the discount rate lowers the present value of a positive future stream", () => {
    // NIST Handbook 135: SPV(d, t) = (1 + d)^−t decreases in d for t > 0.
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0.01, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 40 }),
        rateArb,
        fc.double({ min: 1e-4, max: 0.1, noNaN: true }),
        (amounts, d, step) => {
          const pv = (rate: number) => amounts.reduce((s, a, i) => s + a * spv(rate, i + 1), 0);
          expect(pv(d + step)).toBeLessThan(pv(d));
        },
      ),
      { numRuns: 200 },
    );
  });

  it("…and so lowers the engine's PV of future costs (no residual credits)", () => {
    // Same property through the cash flows: LCC − first cost is a PV of positive future costs.
    fc.assert(
      fc.property(rateArb, fc.double({ min: 1e-3, max: 0.05, noNaN: true }), escalationArb, (d, step, e) => {
        const at = (rate: number) => {
          const economics = economicsSchema.parse({ realDiscountRate: rate, residualValueMethod: "none" });
          const tariffs = tariffsSchema.parse({ escalation: { energy: e, water: e } });
          return analyzeEconomics(baseArgs({ tariffs, economics })).options.map(
            (o) => o.lcc - o.pvByCategory.investment,
          );
        };
        const lo = at(d);
        const hi = at(d + step);
        lo.forEach((l, i) => expect(hi[i] ?? Infinity).toBeLessThan(l));
      }),
      { numRuns: 60 },
    );
  });

  it("real and nominal analyses agree for any inflation (Handbook 135: (1 + D) = (1 + d)(1 + I))", () => {
    fc.assert(
      fc.property(rateArb, fc.double({ min: 0, max: 0.1, noNaN: true }), escalationArb, (d, inflation, e) => {
        const tariffs = tariffsSchema.parse({ escalation: { energy: e, sewer: e } });
        const real = analyzeEconomics(
          baseArgs({
            tariffs,
            economics: economicsSchema.parse({ realDiscountRate: d, inflationRate: inflation }),
          }),
        );
        const nominal = analyzeEconomics(
          baseArgs({
            tariffs,
            economics: economicsSchema.parse({
              realDiscountRate: d,
              inflationRate: inflation,
              analysis: "nominal",
            }),
          }),
        );
        real.options.forEach((o, i) => expect(nominal.options[i]?.lcc).toBeCloseTo(o.lcc, 3));
      }),
      { numRuns: 40 },
    );
  });
});
