import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { generateSyntheticYear, syntheticYearToEpw } from "@/lib/engine/climate/synthetic";
import { mulberry32 } from "@/lib/engine/random";
import { parseEpw } from "@/lib/engine/climate/epw";
import { unwrap } from "./helpers";

describe("invented-weather generator", () => {
  it("is deterministic per seed and differs between seeds", () => {
    const a = generateSyntheticYear({ seed: 42 });
    const b = generateSyntheticYear({ seed: 42 });
    const c = generateSyntheticYear({ seed: 43 });
    expect(a.hours).toEqual(b.hours);
    expect(a.hours.map((h) => h.dryBulbC)).not.toEqual(c.hours.map((h) => h.dryBulbC));
  });

  it("mulberry32 gives uniform numbers in [0, 1) with mean ≈ 1/2", () => {
    const u = mulberry32(1);
    let s = 0;
    for (let i = 0; i < 100_000; i++) {
      const x = u();
      expect(x >= 0 && x < 1).toBe(true);
      s += x;
    }
    expect(Math.abs(s / 100_000 - 0.5)).toBeLessThan(0.005); // σ of the mean = 0.29/√1e5 ≈ 0.0009
  });

  it("follows its documented model: annual mean ≈ 11 °C, July warmer than January, warmest hour mid-afternoon", () => {
    const y = generateSyntheticYear({ seed: 5 });
    const db = y.hours.map((h) => h.dryBulbC);
    const mean = db.reduce((s, x) => s + x, 0) / db.length;
    expect(Math.abs(mean - 11)).toBeLessThan(1); // AR(1) anomaly with σ = 3 K, ~33 h memory: mean error ≪ 1 K
    const monthMean = (m: number) => {
      const v = y.hours.filter((h) => h.month === m).map((h) => h.dryBulbC);
      return v.reduce((s, x) => s + x, 0) / v.length;
    };
    expect(monthMean(7) - monthMean(1)).toBeGreaterThan(20); // seasonal swing 2·13·cos(~15°) ≈ 25 K
    const byHour = Array.from({ length: 24 }, (_, h) => {
      const v = y.hours.filter((x) => x.hour === h).map((x) => x.dryBulbC);
      return v.reduce((s, x) => s + x, 0) / v.length;
    });
    const warmest = byHour.indexOf(Math.max(...byHour));
    expect(warmest).toBeGreaterThanOrEqual(13);
    expect(warmest).toBeLessThanOrEqual(15);
    for (const h of y.hours) {
      expect(h.dewPointC).toBeLessThanOrEqual(h.dryBulbC);
      expect(h.relativeHumidityPercent).toBeGreaterThanOrEqual(0);
      expect(h.relativeHumidityPercent).toBeLessThanOrEqual(100);
    }
  });

  it("the committed fixture is exactly what the generator writes for its seed", () => {
    const file = readFileSync(
      path.resolve(__dirname, "../../../fixtures/weather/harrowgate-flats.epw"),
      "utf8",
    );
    expect(file).toBe(syntheticYearToEpw(generateSyntheticYear({ seed: 20240611 })));
    const parsed = unwrap(parseEpw(file));
    expect(parsed.location?.name).toBe("Harrowgate Flats");
    expect(parsed.year.wetBulbC).toHaveLength(8760);
  });
});
