import { describe, expect, it } from "vitest";
import { fc, test } from "@fast-check/vitest";
import {
  binHourly,
  binnedClimateFromHourly,
  designWetBulbPercentilesC,
  exceedanceValue,
  histogram,
  monthHourMeanC,
  wetBulbHistogram,
} from "@/lib/engine/climate/binning";
import { calendarOfYear } from "@/lib/engine/climate/calendar";
import { parseEpw } from "@/lib/engine/climate/epw";
import { summarizeClimate } from "@/lib/engine/climate/summary";
import type { BinnedClimateYear, HourlyClimateYear } from "@/lib/engine/climate/types";
import { syntheticEpw, unwrap } from "./helpers";

const year = unwrap(parseEpw(syntheticEpw().epw)).year;
const leapYear = unwrap(parseEpw(syntheticEpw(11, true).epw)).year;
const HOURS_BY_MONTH = [744, 672, 744, 720, 744, 720, 744, 744, 720, 744, 720, 744]; // calendar fact

const sum = (a: number[]) => a.reduce((s, x) => s + x, 0);
const mean = (a: number[]) => sum(a) / a.length;

describe("binHourly", () => {
  it.each([0.5, 1, 2])("wet-bulb bins of %d K hold every hour once, by month too", (w) => {
    const t = binHourly(year, { binWidthK: w });
    expect(sum(t.rows.map((r) => r.hours))).toBe(8760);
    for (let m = 0; m < 12; m++) expect(sum(t.rows.map((r) => r.hoursByMonth[m]!))).toBe(HOURS_BY_MONTH[m]);
    for (const r of t.rows) {
      expect(r.highC - r.lowC).toBeCloseTo(w, 12);
      expect(r.meanC).toBeGreaterThanOrEqual(r.lowC - 1e-9);
      expect(r.meanC).toBeLessThan(r.highC);
      expect(r.meanCoincidentC).toBeGreaterThanOrEqual(r.meanC - 1e-9); // dry-bulb ≥ wet-bulb, so means too
    }
  });

  it("preserves the year's mean dry-bulb through the mean coincident dry-bulbs (hour-weighted)", () => {
    const t = binHourly(year);
    const weighted = sum(t.rows.map((r) => r.meanCoincidentC * r.hours)) / 8760;
    expect(weighted).toBeCloseTo(mean(year.dryBulbC), 9);
  });

  it("bins on dry-bulb with mean coincident wet-bulb", () => {
    const t = binHourly(year, { basis: "dryBulb", binWidthK: 2 });
    expect(t.basis).toBe("dryBulb");
    expect(sum(t.rows.map((r) => r.hours))).toBe(8760);
    const weighted = sum(t.rows.map((r) => r.meanCoincidentC * r.hours)) / 8760;
    expect(weighted).toBeCloseTo(mean(year.wetBulbC), 9);
    for (const r of t.rows) expect(r.meanCoincidentC).toBeLessThanOrEqual(r.meanC + 1e-9);
  });

  it("holds 8784 hours for a leap year", () => {
    expect(sum(binHourly(leapYear).rows.map((r) => r.hours))).toBe(8784);
  });

  it("centres bins on multiples of the width: 20.49 → 20, 20.5 → 21, −0.5 → 0", () => {
    const tiny: HourlyClimateYear = {
      kind: "hourly",
      month: [1, 1, 1],
      day: [1, 1, 1],
      hour: [0, 1, 2],
      dryBulbC: [25, 25, 5],
      wetBulbC: [20.49, 20.5, -0.5],
    };
    expect(binHourly(tiny).rows.map((r) => [r.centerC, r.hours])).toEqual([
      [0, 1],
      [20, 1],
      [21, 1],
    ]);
  });
});

describe("binnedClimateFromHourly", () => {
  it("keeps total hours and both hour-weighted means exactly, whole year and by month", () => {
    for (const byMonth of [false, true]) {
      const b = binnedClimateFromHourly(year, { byMonth });
      const hours = sum(b.bins.map((x) => x.hours));
      expect(hours).toBe(8760);
      expect(sum(b.bins.map((x) => x.wetBulbC * x.hours)) / hours).toBeCloseTo(mean(year.wetBulbC), 9);
      expect(sum(b.bins.map((x) => x.meanCoincidentDryBulbC * x.hours)) / hours).toBeCloseTo(
        mean(year.dryBulbC),
        9,
      );
      if (byMonth) {
        for (let m = 1; m <= 12; m++) {
          expect(sum(b.bins.filter((x) => x.month === m).map((x) => x.hours))).toBe(HOURS_BY_MONTH[m - 1]);
        }
      }
    }
  });
});

describe("design wet-bulb percentiles (annual exceedance, ASHRAE Fundamentals 2017 ch.14 convention)", () => {
  function yearOf(values: number[]): HourlyClimateYear {
    const cal = calendarOfYear(false);
    return { kind: "hourly", ...cal, dryBulbC: values.map((v) => v + 5), wetBulbC: values };
  }

  it("on a uniform distribution 0…30 °C: x(p) = 30·(1 − p)", () => {
    // values spread evenly over [0, 30]: the p-exceedance value of U(0, 30) is 30(1 − p) (definition)
    const vals = Array.from({ length: 8760 }, (_, i) => (30 * i) / 8759).reverse();
    const [p04, p1, p2] = designWetBulbPercentilesC(yearOf(vals));
    expect(p04!.wetBulbC).toBeCloseTo(30 * 0.996, 6);
    expect(p1!.wetBulbC).toBeCloseTo(30 * 0.99, 6);
    expect(p2!.wetBulbC).toBeCloseTo(30 * 0.98, 6);
  });

  it("on a normal distribution N(18, 4²): x(p) = 18 + 4·z(1 − p)", () => {
    // Standard normal quantiles z(0.996) = 2.6521, z(0.99) = 2.3263, z(0.98) = 2.0537 (standard normal table).
    // The sample is the normal's quantiles at (i + 0.5)/N, obtained by bisection on the error function.
    const erf = (x: number) => {
      // Abramowitz & Stegun 7.1.26, |error| ≤ 1.5e-7
      const t = 1 / (1 + 0.3275911 * Math.abs(x));
      const y =
        1 -
        ((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496736) * t + 0.254829592) *
          t *
          Math.exp(-x * x);
      return x >= 0 ? y : -y;
    };
    const cdf = (z: number) => 0.5 * (1 + erf(z / Math.SQRT2));
    const inv = (q: number) => {
      let lo = -8;
      let hi = 8;
      for (let k = 0; k < 60; k++) {
        const mid = (lo + hi) / 2;
        if (cdf(mid) < q) lo = mid;
        else hi = mid;
      }
      return (lo + hi) / 2;
    };
    const vals = Array.from({ length: 8760 }, (_, i) => 18 + 4 * inv((i + 0.5) / 8760));
    const got = designWetBulbPercentilesC(yearOf(vals)).map((d) => d.wetBulbC);
    const want = [18 + 4 * 2.6521, 18 + 4 * 2.3263, 18 + 4 * 2.0537];
    // Definition 7 reads order statistic (N − 1)(1 − p), i.e. probability ≈ 1 − p − 0.5/N at the sample's
    // plotting positions: a 0.02 K offset at z = 2.65 for N = 8760. Tolerance 0.03 K.
    got.forEach((g, k) => expect(Math.abs(g - want[k]!)).toBeLessThan(0.03));
  });

  it("on bins: the bin in which the hours counted from the top reach p % of the year", () => {
    const bins: BinnedClimateYear = {
      kind: "bins",
      bins: [
        { wetBulbC: 25, meanCoincidentDryBulbC: 32, hours: 30 }, // 0.34 % of 8760
        { wetBulbC: 24, meanCoincidentDryBulbC: 31, hours: 60 }, // cumulative 1.03 %
        { wetBulbC: 22, meanCoincidentDryBulbC: 28, hours: 100 }, // cumulative 2.17 %
        { wetBulbC: 10, meanCoincidentDryBulbC: 14, hours: 8570 },
      ],
    };
    expect(designWetBulbPercentilesC(bins).map((d) => d.wetBulbC)).toEqual([24, 24, 22]);
  });

  test.prop([fc.integer({ min: 1, max: 2 ** 31 - 1 }), fc.constantFrom("shuffled", "rising", "falling", "ties")], { numRuns: 25 })(
    "an hourly year's percentiles equal definition 7 on the fully sorted year (Hyndman & Fan 1996), in any order and with ties",
    (seed, order) => {
      // Park–Miller generator: a year of wet-bulbs the engine did not choose.
      let x = seed;
      const next = () => (x = (x * 48271) % 2147483647) / 2147483647;
      let vals = Array.from({ length: 8760 }, () => -25 + 55 * next());
      if (order === "rising") vals.sort((a, b) => a - b);
      if (order === "falling") vals.sort((a, b) => b - a);
      if (order === "ties") vals = vals.map((v) => Math.round(v / 2) * 2);
      const sorted = [...vals].sort((a, b) => a - b);
      const want = [0.4, 1, 2].map((p) => {
        const h = (sorted.length - 1) * (1 - p / 100);
        const lo = Math.floor(h);
        return sorted[lo]! + (h - lo) * (sorted[lo + 1]! - sorted[lo]!);
      });
      expect(designWetBulbPercentilesC(yearOf(vals)).map((d) => d.wetBulbC)).toEqual(want);
    },
  );

  test.prop([fc.array(fc.double({ min: -30, max: 35, noNaN: true }), { minLength: 1, maxLength: 300 })])(
    "lies within the data and falls as the exceedance grows",
    (vals) => {
      const a = exceedanceValue(vals, 0.4);
      const b = exceedanceValue(vals, 1);
      const c = exceedanceValue(vals, 2);
      expect(a).toBeLessThanOrEqual(Math.max(...vals));
      expect(c).toBeGreaterThanOrEqual(Math.min(...vals));
      expect(a).toBeGreaterThanOrEqual(b);
      expect(b).toBeGreaterThanOrEqual(c);
    },
  );
});

describe("month × hour matrix and histograms", () => {
  it("averages each month's hours of the day", () => {
    const cal = calendarOfYear(false);
    const y: HourlyClimateYear = {
      kind: "hourly",
      ...cal,
      dryBulbC: cal.month.map((m, i) => m + cal.hour[i]! / 10 + 5),
      // day-dependent part averages to the month's mean day (d − 1)/100 per month
      wetBulbC: cal.month.map((m, i) => m + cal.hour[i]! / 10 + cal.day[i]! / 100),
    };
    const mat = monthHourMeanC(y);
    expect(mat).toHaveLength(12);
    for (let m = 1; m <= 12; m++) {
      const nd = HOURS_BY_MONTH[m - 1]! / 24;
      const meanDay = (nd + 1) / 2;
      for (const h of [0, 7, 23]) expect(mat[m - 1]![h]).toBeCloseTo(m + h / 10 + meanDay / 100, 9);
    }
    expect(monthHourMeanC(y, "dryBulbC")[6]![15]).toBeCloseTo(7 + 1.5 + 5, 9);
  });

  it("histogram keeps every hour, has no holes, and matches bin hours", () => {
    const bars = wetBulbHistogram(year);
    expect(sum(bars.map((b) => b.hours))).toBe(8760);
    for (let i = 1; i < bars.length; i++) expect(bars[i]!.lowC).toBeCloseTo(bars[i - 1]!.highC, 12);
    const rows = binHourly(year).rows;
    for (const r of rows) expect(bars.find((b) => b.centerC === r.centerC)?.hours).toBe(r.hours);
    expect(histogram([1, 4], 1).map((b) => b.hours)).toEqual([1, 0, 0, 1]);
  });
});

describe("summarizeClimate", () => {
  it("summarises a parsed hourly year", () => {
    const parsed = unwrap(parseEpw(syntheticEpw().epw));
    const s = summarizeClimate(parsed.year, { location: parsed.location, stats: parsed.stats });
    expect(s.hours).toBe(8760);
    expect(s.records).toBe(8760);
    expect(s.location?.elevationM).toBe(240);
    expect(s.wetBulb.maxC).toBe(Math.max(...parsed.year.wetBulbC));
    expect(s.dryBulb.meanC).toBeCloseTo(mean(parsed.year.dryBulbC), 9);
    expect(s.designWetBulbC.map((d) => d.exceedancePercent)).toEqual([0.4, 1, 2]);
    expect(s.monthHourMeanWetBulbC).toHaveLength(12);
    expect(s.monthlyMeanWetBulbC![6]).toBeGreaterThan(s.monthlyMeanWetBulbC![0]!);
    expect(sum(s.wetBulbHistogram.map((b) => b.hours))).toBe(8760);
    expect(s.missingValues).toEqual({ dryBulbC: 0, dewPointC: 0, pressurePa: 0 });
  });

  it("summarises a bin table with hour-weighted means", () => {
    const b: BinnedClimateYear = {
      kind: "bins",
      bins: [
        { wetBulbC: 20, meanCoincidentDryBulbC: 26, hours: 1000, month: 7 },
        { wetBulbC: 10, meanCoincidentDryBulbC: 13, hours: 3000, month: 1 },
      ],
    };
    const s = summarizeClimate(b);
    expect(s.hours).toBe(4000);
    expect(s.records).toBe(2);
    expect(s.wetBulb.meanC).toBeCloseTo(12.5, 12);
    expect(s.monthlyMeanWetBulbC![6]).toBe(20);
    expect(Number.isNaN(s.monthlyMeanWetBulbC![3]!)).toBe(true);
    expect(s.monthHourMeanWetBulbC).toBeUndefined();
  });
});
