import { describe, expect, it } from "vitest";
import { monthlyPeakFromMonthlessRecordsKW } from "@/lib/engine/demand";

describe("monthly peak demand from bins without months (stated screening estimate, Methods §6)", () => {
  // Hand calculation: 1000 h at 100 kW, 3380 h at 80 kW, 4380 h at 50 kW (H = 8760 h, H/12 = 730 h).
  // The demand exceeded for (k − 1)·730 h, k = 1…12: 100, 100, 80, 80, 80, 80, 50 (4380 h is the end of
  // the 80 kW block), 50, 50, 50, 50, 50 → mean 820/12 = 68.333 kW; midpoint with the 100 kW peak: 84.167 kW.
  it("is the mean over the twelve month ranks of the midpoint between the annual peak and the seasonal curve", () => {
    const kw = monthlyPeakFromMonthlessRecordsKW([
      { kW: 50, hours: 4380 },
      { kW: 100, hours: 1000 },
      { kW: 80, hours: 3380 },
    ]);
    expect(kw).toBeCloseTo(0.5 * (100 + 820 / 12), 9);
  });

  // Common practice, no source: a flat demand has every month's peak equal to it; no records, no demand.
  it("a constant demand is its own monthly peak; no records give 0", () => {
    expect(monthlyPeakFromMonthlessRecordsKW([{ kW: 42, hours: 8760 }])).toBe(42);
    expect(monthlyPeakFromMonthlessRecordsKW([])).toBe(0);
  });
});
