/**
 * Small numerical helpers of the engine (lib/engine/solvers.ts).
 */
import { describe, expect, it } from "vitest";
import { positivePower } from "@/lib/engine/solvers";

describe("positivePower (x^p as exp(p·ln x), the hot paths' fractional powers)", () => {
  // Reference: the language's own Math.pow (ECMAScript Number::exponentiate); exact hand values where the
  // power is a rational number: 0.25^0.5 = 0.5, 32^0.8 = 16, 8^(−1/3) = 0.5.
  it("agrees with Math.pow within a few units in the last place over the engine's range", () => {
    for (const x of [1e-4, 0.05, 0.3, 0.7, 1, 1.3, 2.5, 40]) {
      for (const p of [0.8, -0.6, 0.55, -0.45, 0.2, 3]) {
        expect(Math.abs(positivePower(x, p) / Math.pow(x, p) - 1)).toBeLessThan(1e-14);
      }
    }
  });
  it("gives the hand values", () => {
    expect(positivePower(0.25, 0.5)).toBeCloseTo(0.5, 14);
    expect(positivePower(32, 0.8)).toBeCloseTo(16, 12);
    expect(positivePower(8, -1 / 3)).toBeCloseTo(0.5, 14);
    expect(positivePower(1, 0.8)).toBe(1);
  });
  it("falls back to Math.pow at and below zero", () => {
    expect(positivePower(0, 0.8)).toBe(0);
    expect(positivePower(-8, 3)).toBe(-512);
  });
});
