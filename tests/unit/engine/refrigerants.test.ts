import { describe, expect, it } from "vitest";
import { REFRIGERANTS, globalWarmingPotential100 } from "@/lib/engine/refrigerants";

describe("100-year GWP of refrigerants", () => {
  // Published blend values [memory]: AR5-based figures as listed in national inventories and industry
  // tables — R-410A 1924, R-404A 3943, R-407C 1624, R-507A 3985; AR6: R-134a 1530, R-410A 2256.
  it.each([
    ["R717", "AR5", 0],
    ["R134a", "AR5", 1300],
    ["R410A", "AR5", 1924],
    ["R404A", "AR5", 3943],
    ["R407C", "AR5", 1624],
    ["R507A", "AR5", 3985],
    ["R22", "AR5", 1760],
    ["R134a", "AR6", 1530],
    ["R410A", "AR6", 2256],
  ] as const)("%s (%s) = %d", (r, report, published) => {
    expect(Math.abs(globalWarmingPotential100(r, report) - published)).toBeLessThanOrEqual(0.6);
  });

  it("ammonia has none in either report; every other refrigerant has some", () => {
    for (const r of REFRIGERANTS) {
      for (const rep of ["AR5", "AR6"] as const) {
        if (r === "R717") expect(globalWarmingPotential100(r, rep)).toBe(0);
        else expect(globalWarmingPotential100(r, rep)).toBeGreaterThan(500);
      }
    }
  });
});
