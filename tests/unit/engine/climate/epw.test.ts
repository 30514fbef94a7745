/**
 * EPW parser tests on invented files generated here. The format facts checked come from the EnergyPlus
 * "Auxiliary Programs" documentation, EPW data dictionary: 8 header lines, LOCATION fields (city,
 * state, country, source, WMO, latitude, longitude, time zone, elevation), 35 fields per data row,
 * hour 1…24 = hour ending, missing sentinels 99.9 (dry-bulb, dew point), 999 (RH), 999999 (pressure).
 * Wet-bulb values are checked against tests/support/psychrometric-reference.ts (IAPWS saturation
 * pressures and the ASHRAE 2017 ch.1 psychrometric equations, coded in the test support; the parser itself
 * uses psychrolib), within 0.01 K.
 */
import { describe, expect, it } from "vitest";
import { fc, test } from "@fast-check/vitest";
import { parseEpw } from "@/lib/engine/climate/epw";
import { formatEpw, HARROWGATE_FLATS, type EpwRow } from "@/lib/engine/climate/synthetic";
import { pressureFromElevationPa } from "@/lib/engine/psychrometrics";
import { referenceWetBulbFromDewPointC } from "@/tests/support/psychrometric-reference";
import { epwLineOfHour, syntheticEpw, unwrap, withField } from "./helpers";

describe("parseEpw on a well-formed invented year", () => {
  const { year: gen, epw } = syntheticEpw();
  const parsed = parseEpw(epw);
  const v = unwrap(parsed);

  it("reads the LOCATION header (EPW dictionary field order)", () => {
    expect(v.location).toMatchObject({
      name: "Harrowgate Flats",
      country: "ZZ",
      latitudeDeg: 41.8,
      longitudeDeg: -96.4,
      timeZoneH: -6,
      elevationM: 240,
    });
  });

  it("gives 8760 hours, EPW hour 1 (hour ending 01:00) as hour 0", () => {
    expect(v.year.dryBulbC).toHaveLength(8760);
    expect(v.stats).toMatchObject({
      recordsRead: 8760,
      recordsPerHour: 1,
      hours: 8760,
      hasLeapDay: false,
      absentHours: 0,
    });
    expect([v.year.month[0], v.year.day[0], v.year.hour[0]]).toEqual([1, 1, 0]);
    expect([v.year.month[8759], v.year.day[8759], v.year.hour[8759]]).toEqual([12, 31, 23]);
    for (const i of [0, 1234, 5000, 8759]) {
      expect(v.year.dryBulbC[i]).toBeCloseTo(gen.hours[i]!.dryBulbC, 9);
      expect(v.year.dewPointC?.[i]).toBeCloseTo(gen.hours[i]!.dewPointC, 9);
    }
    expect(parsed.ok && parsed.warnings).toEqual([]);
  });

  it("computes wet-bulb from dry-bulb and dew point at each hour's station pressure (independent reference)", () => {
    expect(v.stats.pressureSource).toBe("station");
    for (const i of [0, 100, 4000, 4500, 8000]) {
      const h = gen.hours[i]!;
      const ref = referenceWetBulbFromDewPointC(h.dryBulbC, h.dewPointC, h.pressurePa);
      expect(Math.abs(v.year.wetBulbC[i]! - ref)).toBeLessThan(0.01);
    }
  });

  it("can use the site pressure from the elevation instead (ASHRAE 2017 ch.1 eq. 3)", () => {
    const site = unwrap(parseEpw(epw, { pressure: "site" }));
    expect(site.stats.pressureSource).toBe("site");
    const p = pressureFromElevationPa(240);
    const h = gen.hours[4500]!;
    // Hand: 101325·(1 − 2.25577e−5·240)^5.2559 = 101325·0.994586^5.2559 = 98,475 Pa (ASHRAE 2017 ch.1 eq. 3).
    expect(Math.abs(p - 98475)).toBeLessThan(1);
    expect(Math.abs(site.year.wetBulbC[4500]! - referenceWetBulbFromDewPointC(h.dryBulbC, h.dewPointC, p))).toBeLessThan(0.01);
  });

  it("keys rows by month/day/hour, never by the year column or the row order", () => {
    const lines = epw.split("\n");
    const header = lines.slice(0, 8);
    // A typical year mixes source years by month; also scramble the row order.
    const data = lines
      .slice(8)
      .filter((l) => l !== "")
      .map((l) => {
        const f = l.split(",");
        f[0] = String(1990 + Number(f[1]));
        return f.join(",");
      });
    const scrambled = [
      ...data.filter((_, i) => i % 2 === 1),
      ...data.filter((_, i) => i % 2 === 0).reverse(),
    ];
    const w = unwrap(parseEpw([...header, ...scrambled].join("\n")));
    expect(w.year.dryBulbC).toEqual(v.year.dryBulbC);
    expect(w.year.wetBulbC).toEqual(v.year.wetBulbC);
  });

  it("accepts CRLF line endings and a byte-order mark", () => {
    const w = unwrap(parseEpw("\uFEFF" + epw.replace(/\n/g, "\r\n")));
    expect(w.year.dryBulbC).toEqual(v.year.dryBulbC);
  });
});

describe("parseEpw on broken files", () => {
  const { epw, lines } = syntheticEpw();

  it("reports a truncated file with the last line read", () => {
    const cut = lines.slice(0, epwLineOfHour(3999)).join("\n"); // 4000 data rows
    const r = parseEpw(cut);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors[0]).toMatchObject({ line: epwLineOfHour(3999), field: "data" });
    expect(r.errors[0]!.message).toMatch(/truncated/);
    expect(r.errors[0]!.message).toMatch(/4760 of 8760/);
  });

  it("reports a file cut inside the header", () => {
    const r = parseEpw(lines.slice(0, 5).join("\n"));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]).toMatchObject({ field: "header" });
  });

  it("names the line and the field of a row with too few fields", () => {
    const broken = lines.slice();
    const idx = epwLineOfHour(99) - 1;
    broken[idx] = broken[idx]!.split(",").slice(0, 8).join(","); // RH (field 9) and beyond gone
    const r = parseEpw(broken.join("\n"));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0]).toMatchObject({ line: 108, field: "relativeHumidity" });
    expect(r.errors[0]!.message).toMatch(/8 fields, expected 35/);
  });

  it("rejects a row with more than 35 fields, naming its line", () => {
    const broken = lines.slice();
    broken[epwLineOfHour(500) - 1] += ",1";
    const r = parseEpw(broken.join("\n"));
    expect(!r.ok && r.errors[0]).toMatchObject({ line: epwLineOfHour(500), field: "data" });
  });

  it("names the line and field of a value that is not a number", () => {
    const r = parseEpw(withField(lines, 2000, 6, "2O.5").join("\n"));
    expect(!r.ok && r.errors[0]).toMatchObject({ line: epwLineOfHour(2000), field: "dryBulbC" });
    expect(!r.ok && r.errors[0]!.message).toMatch(/field 7 \(dry-bulb/);
  });

  it("rejects impossible dates and hours with the line", () => {
    const r2 = parseEpw(withField(lines, 1000, 3, "25").join("\n"));
    expect(!r2.ok && r2.errors[0]).toMatchObject({ line: epwLineOfHour(1000), field: "hour" });
    const r3 = parseEpw(withField(lines, 1000, 2, "31").join("\n")); // hour 1000 is in February
    expect(!r3.ok && r3.errors[0]).toMatchObject({ line: epwLineOfHour(1000), field: "day" });
  });

  it("warns about a row misfiled under another date: that hour is doubled, its own hour absent", () => {
    const r = parseEpw(withField(lines, 10, 2, "30").join("\n")); // 1 Jan 10:00 row says 30 Jan
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.stats.absentHours).toBe(1);
    expect(r.warnings.map((w) => w.message).join(" ")).toMatch(/1 hours have a different number of records/);
  });

  it("rejects a bad LOCATION elevation on line 1", () => {
    const broken = lines.slice();
    broken[0] = broken[0]!.replace(/,240\.0$/, ",high");
    const r = parseEpw(broken.join("\n"));
    expect(!r.ok && r.errors[0]).toMatchObject({ line: 1, field: "elevation" });
  });

  it("rejects a file whose header lines are not EPW's", () => {
    const r = parseEpw("timestamp,dry_bulb\n" + epw);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]).toMatchObject({ line: 1, field: "LOCATION" });
  });

  test.prop([fc.string({ maxLength: 2000 })])("never throws on arbitrary text", (s) => {
    const r = parseEpw(s);
    expect(r.ok).toBe(false);
  });

  test.prop([fc.integer({ min: 8, max: 8767 }), fc.integer({ min: 0, max: 40 })], { numRuns: 20 })(
    "never throws when one line is cut short anywhere",
    (lineIdx, keep) => {
      const broken = lines.slice();
      broken[lineIdx] = broken[lineIdx]!.slice(0, keep);
      const r = parseEpw(broken.join("\n"));
      if (!r.ok) expect(r.errors[0]!.line).toBeGreaterThan(0);
    },
  );
});

describe("missing-value sentinels", () => {
  const { year: gen, lines } = syntheticEpw();

  it("interpolates 99.9 dry-bulb over a 3-hour gap linearly and counts it", () => {
    let l = lines;
    for (const i of [300, 301, 302]) l = withField(l, i, 6, "99.9");
    const r = parseEpw(l.join("\n"));
    const v = unwrap(r);
    const a = gen.hours[299]!.dryBulbC;
    const b = gen.hours[303]!.dryBulbC;
    expect(v.year.dryBulbC[300]).toBeCloseTo(a + (b - a) / 4, 9);
    expect(v.year.dryBulbC[302]).toBeCloseTo(a + (3 * (b - a)) / 4, 9);
    expect(v.stats.missingValues.dryBulbC).toBe(3);
    expect(v.stats.interpolatedHours.dryBulbC).toBe(3);
    expect(r.ok && r.warnings.some((w) => w.field === "dryBulbC")).toBe(true);
  });

  it("derives a missing (99.9) dew point from RH; interpolates when RH is 999 too", () => {
    const l1 = withField(lines, 4000, 7, "99.9");
    const v1 = unwrap(parseEpw(l1.join("\n")));
    // RH is stored to whole percent, so the derived dew point is within ~0.2 K of the generator's
    expect(Math.abs(v1.year.dewPointC![4000]! - gen.hours[4000]!.dewPointC)).toBeLessThan(0.25);
    expect(v1.stats.missingValues.dewPointC).toBe(0);

    const l2 = withField(withField(lines, 4000, 7, "99.9"), 4000, 8, "999");
    const v2 = unwrap(parseEpw(l2.join("\n")));
    const a = gen.hours[3999]!.dewPointC;
    const b = gen.hours[4001]!.dewPointC;
    expect(v2.year.dewPointC![4000]).toBeCloseTo((a + b) / 2, 9);
    expect(v2.stats.missingValues.dewPointC).toBe(1);
  });

  it("fills a 999999 station pressure by interpolation", () => {
    const v = unwrap(parseEpw(withField(lines, 10, 9, "999999").join("\n")));
    expect(v.stats.missingValues.pressurePa).toBe(1);
    expect(v.year.pressurePa![10]).toBeCloseTo((gen.hours[9]!.pressurePa + gen.hours[11]!.pressurePa) / 2, 9);
  });

  it("falls back to the site pressure when no row has a station pressure", () => {
    const all = lines.map((l, i) => {
      if (i < 8 || l === "") return l;
      const f = l.split(",");
      f[9] = "999999";
      return f.join(",");
    });
    const r = parseEpw(all.join("\n"));
    const v = unwrap(r);
    expect(v.stats.pressureSource).toBe("site");
    expect(v.year.pressurePa![0]).toBeCloseTo(pressureFromElevationPa(240), 6);
  });

  it("treats out-of-range values as missing (EPW dictionary: dry-bulb −70…70 °C)", () => {
    const v = unwrap(parseEpw(withField(lines, 600, 6, "85").join("\n")));
    expect(v.stats.missingValues.dryBulbC).toBe(1);
  });

  it("refuses to interpolate over a gap longer than the limit, naming field and line", () => {
    let l = lines;
    for (let i = 700; i < 710; i++) l = withField(l, i, 6, "99.9");
    const r = parseEpw(l.join("\n"));
    expect(!r.ok && r.errors[0]).toMatchObject({ field: "dryBulbC", line: epwLineOfHour(699) });
    expect(!r.ok && r.errors[0]!.message).toMatch(/10 consecutive hours/);
    expect(unwrap(parseEpw(l.join("\n"), { maxGapHours: 12 })).stats.interpolatedHours.dryBulbC).toBe(10);
  });

  it("interpolates a gap across New Year from both ends of the year", () => {
    let l = withField(lines, 0, 6, "99.9");
    l = withField(l, 8759, 6, "99.9");
    const v = unwrap(parseEpw(l.join("\n")));
    const a = gen.hours[8758]!.dryBulbC;
    const b = gen.hours[1]!.dryBulbC;
    expect(v.year.dryBulbC[8759]).toBeCloseTo(a + (b - a) / 3, 9);
    expect(v.year.dryBulbC[0]).toBeCloseTo(a + (2 * (b - a)) / 3, 9);
  });
});

describe("leap-day and sub-hourly files", () => {
  it("keeps 29 February: 8784 hours", () => {
    const { year: gen, epw } = syntheticEpw(11, true);
    const v = unwrap(parseEpw(epw));
    expect(v.year.dryBulbC).toHaveLength(8784);
    expect(v.stats.hasLeapDay).toBe(true);
    const i = (31 + 28) * 24 + 13; // 29 Feb 13:00
    expect([v.year.month[i], v.year.day[i], v.year.hour[i]]).toEqual([2, 29, 13]);
    expect(v.year.dryBulbC[i]).toBeCloseTo(gen.hours[i]!.dryBulbC, 9);
  });

  it("averages four 15-minute records into each hour", () => {
    const { year: gen } = syntheticEpw();
    const offsets = [-0.3, -0.1, 0.1, 0.3];
    const rows: EpwRow[] = [];
    for (const h of gen.hours) {
      offsets.forEach((o, k) => {
        rows.push({
          year: 2001,
          month: h.month,
          day: h.day,
          hourEnding: h.hour + 1,
          minute: 15 * (k + 1),
          dryBulbC: h.dryBulbC + o,
          dewPointC: h.dewPointC - 0.2 + o, // stays ≤ dry-bulb
          relativeHumidityPercent: h.relativeHumidityPercent,
          pressurePa: h.pressurePa + o * 10,
        });
      });
    }
    const text = formatEpw(HARROWGATE_FLATS, rows, { recordsPerHour: 4 });
    const r = parseEpw(text);
    const v = unwrap(r);
    expect(v.stats.recordsRead).toBe(4 * 8760);
    expect(v.stats.recordsPerHour).toBe(4);
    expect(v.year.dryBulbC).toHaveLength(8760);
    for (const i of [0, 777, 8759]) {
      expect(v.year.dryBulbC[i]).toBeCloseTo(gen.hours[i]!.dryBulbC, 9);
      expect(v.year.dewPointC![i]).toBeCloseTo(gen.hours[i]!.dewPointC - 0.2, 9);
    }
    expect(r.ok && r.warnings).toEqual([]);
  });

  it("warns when the header's records per hour disagree with the data", () => {
    const { lines } = syntheticEpw();
    const l = lines.slice();
    l[7] = "DATA PERIODS,1,4,Data,Sunday,1/1,12/31";
    const r = parseEpw(l.join("\n"));
    expect(r.ok && r.warnings.some((w) => w.field === "recordsPerHour")).toBe(true);
  });
});
