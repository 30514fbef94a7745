/**
 * Hourly CSV parser tests on invented tables generated here. Reference values: the generator's own
 * hours; wet-bulb from tests/support/psychrometric-reference.ts (IAPWS saturation pressures and the
 * ASHRAE 2017 ch.1 psychrometric equations, coded in the test support; the parser uses psychrolib) at
 * the given pressure, within 0.01 K;
 * °F → °C by t = (t°F − 32)·5/9 (definition of the scales).
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseHourlyCsv, type HourlyCsvMapping } from "@/lib/engine/climate/csv";
import { parseEpw } from "@/lib/engine/climate/epw";
import {
  generateSyntheticYear,
  syntheticYearToCsv,
  syntheticYearToEpw,
} from "@/lib/engine/climate/synthetic";
import { pressureFromElevationPa } from "@/lib/engine/psychrometrics";
import {
  referenceSaturationPa,
  referenceWetBulbFromDewPointC,
  referenceWetBulbFromRelHumC,
} from "@/tests/support/psychrometric-reference";
import { unwrap } from "./helpers";

const gen = generateSyntheticYear({ seed: 3 });
const P240 = pressureFromElevationPa(240);
const byTimestamp = { kind: "timestamp", column: "timestamp" } as const;

describe("the wet-bulb reference itself", () => {
  // ASHRAE Handbook—Fundamentals 2017 ch.1: saturation pressure table 3169.7 Pa at 25 °C (Table 3);
  // Example 1: 40 °C dry-bulb, 20 °C wet-bulb at sea level has RH ≈ 14 % (so 14 % gives back about
  // 20 °C; RH is printed to 1 %, worth ±0.15 K of wet-bulb here).
  it("reproduces the Handbook's table and worked example", () => {
    expect(Math.abs(referenceSaturationPa(25) - 3169.7)).toBeLessThan(1);
    expect(Math.abs(referenceWetBulbFromRelHumC(40, 0.14, 101325) - 20)).toBeLessThan(0.15);
  });
});

describe("parseHourlyCsv", () => {
  it("reads `;`-delimited decimal-comma °C with RH % (European export)", () => {
    const text = syntheticYearToCsv(gen, { delimiter: ";", decimalComma: true });
    expect(text.split("\n")[1]).toMatch(/^2001-01-01 00:00;-?\d+,\d;\d+$/);
    const r = parseHourlyCsv(text, {
      delimiter: ";",
      decimalSeparator: ",",
      temperatureUnit: "C",
      dryBulb: "dry_bulb_C",
      humidity: { kind: "relativeHumidity", column: "rh_percent" },
      time: byTimestamp,
      elevationM: 240,
      label: "Harrowgate Flats CSV",
    });
    const v = unwrap(r);
    expect(v.year.dryBulbC).toHaveLength(8760);
    expect(v.location?.name).toBe("Harrowgate Flats CSV");
    for (const i of [0, 3333, 6000]) {
      const h = gen.hours[i]!;
      expect(v.year.dryBulbC[i]).toBeCloseTo(h.dryBulbC, 9);
      const ref = referenceWetBulbFromRelHumC(h.dryBulbC, h.relativeHumidityPercent / 100, P240);
      expect(Math.abs(v.year.wetBulbC[i]! - ref)).toBeLessThan(0.01);
    }
    expect(r.ok && r.warnings).toEqual([]);
  });

  it("auto-detects `;` and the decimal comma", () => {
    const text = syntheticYearToCsv(gen, { delimiter: ";", decimalComma: true });
    const v = unwrap(
      parseHourlyCsv(text, {
        temperatureUnit: "C",
        dryBulb: "DRY_BULB_C", // header match is case-insensitive
        humidity: { kind: "relativeHumidity", column: "rh_percent" },
        time: byTimestamp,
        elevationM: 240,
      }),
    );
    expect(v.year.dryBulbC[4000]).toBeCloseTo(gen.hours[4000]!.dryBulbC, 9);
  });

  it("converts °F dry-bulb and dew point: t°C = (t°F − 32)·5/9", () => {
    const text = syntheticYearToCsv(gen, { temperatureUnit: "F", humidity: "dewPoint" });
    const v = unwrap(
      parseHourlyCsv(text, {
        temperatureUnit: "F",
        dryBulb: "dry_bulb_F",
        humidity: { kind: "dewPoint", column: "dew_point_F" },
        time: byTimestamp,
        sitePressurePa: P240,
      }),
    );
    for (const i of [10, 5000, 8700]) {
      const h = gen.hours[i]!;
      // the file keeps °F to 0.01, i.e. 0.0056 K
      expect(Math.abs(v.year.dryBulbC[i]! - h.dryBulbC)).toBeLessThan(0.006);
      expect(Math.abs(v.year.dewPointC![i]! - h.dewPointC)).toBeLessThan(0.006);
    }
  });

  it("gives the same wet-bulbs from a dew-point CSV as from the EPW of the same year at the same pressure", () => {
    const csv = syntheticYearToCsv(gen, { humidity: "dewPoint" });
    const fromCsv = unwrap(
      parseHourlyCsv(csv, {
        temperatureUnit: "C",
        dryBulb: "dry_bulb_C",
        humidity: { kind: "dewPoint", column: "dew_point_C" },
        time: byTimestamp,
        elevationM: 240,
      }),
    );
    const fromEpw = unwrap(parseEpw(syntheticYearToEpw(gen), { pressure: "site" }));
    expect(fromCsv.year.wetBulbC).toEqual(fromEpw.year.wetBulbC);
  });

  it("reads month/day/hour columns, hour 1…24 (hour ending) detected automatically", () => {
    const lines = ["Month,Day,Hour,Tdb,Twb"];
    for (const h of gen.hours) {
      const twb = referenceWetBulbFromDewPointC(h.dryBulbC, h.dewPointC, P240);
      lines.push(`${h.month},${h.day},${h.hour + 1},${h.dryBulbC},${twb.toFixed(3)}`);
    }
    const mapping: HourlyCsvMapping = {
      temperatureUnit: "C",
      dryBulb: "Tdb",
      humidity: { kind: "wetBulb", column: "Twb" },
      time: { kind: "monthDayHour", month: "Month", day: "Day", hour: "Hour" },
    };
    const v = unwrap(parseHourlyCsv(lines.join("\n"), mapping));
    expect([v.year.month[0], v.year.hour[0]]).toEqual([1, 0]);
    expect(v.year.dryBulbC[8759]).toBeCloseTo(gen.hours[8759]!.dryBulbC, 9);
    expect(
      Math.abs(
        v.year.wetBulbC[100]! -
          referenceWetBulbFromDewPointC(gen.hours[100]!.dryBulbC, gen.hours[100]!.dewPointC, P240),
      ),
    ).toBeLessThan(6e-4);
    // a wet-bulb column needs no pressure, so there is no sea-level warning
    expect(v.stats.absentHours).toBe(0);
  });

  it("reads columns by position in a file without a header, hours 0…23", () => {
    const text = syntheticYearToCsv(gen, { time: "monthDayHour" }).split("\n").slice(1).join("\n");
    const r = parseHourlyCsv(text, {
      hasHeader: false,
      temperatureUnit: "C",
      dryBulb: 3,
      humidity: { kind: "relativeHumidity", column: 4 },
      time: { kind: "monthDayHour", month: 0, day: 1, hour: 2 },
    });
    const v = unwrap(r);
    expect(v.year.dryBulbC[2]).toBeCloseTo(gen.hours[2]!.dryBulbC, 9);
    expect(r.ok && r.warnings.map((w) => w.field)).toContain("sitePressurePa"); // sea level assumed, said so
  });

  it("shifts hour-ending timestamps back into the hour they describe (24:00 and next-year 00:00 too)", () => {
    const lines = ["time,t,rh"];
    for (const h of gen.hours) {
      // stamp = end of the hour, written as the next hour's 00 minute
      const d = new Date(Date.UTC(2001, h.month - 1, h.day, h.hour + 1));
      const stamp = `${d.getUTCFullYear()}-${d.getUTCMonth() + 1}-${d.getUTCDate()}T${d.getUTCHours()}:00`;
      lines.push(`${stamp},${h.dryBulbC},${h.relativeHumidityPercent}`);
    }
    const v = unwrap(
      parseHourlyCsv(lines.join("\n"), {
        temperatureUnit: "C",
        dryBulb: "t",
        humidity: { kind: "relativeHumidity", column: "rh" },
        time: { kind: "timestamp", column: "time", convention: "end" },
        elevationM: 240,
      }),
    );
    expect(v.year.dryBulbC[0]).toBeCloseTo(gen.hours[0]!.dryBulbC, 9);
    expect(v.year.dryBulbC[8759]).toBeCloseTo(gen.hours[8759]!.dryBulbC, 9); // stamped 2002-1-1T0:00
  });

  it("reads day.month.year timestamps and averages 15-minute records", () => {
    const lines = ["Zeit;Temperatur;Feuchte"];
    const pad = (n: number) => String(n).padStart(2, "0");
    for (const h of gen.hours) {
      for (const [k, off] of [-0.3, -0.1, 0.1, 0.3].entries()) {
        lines.push(
          `${pad(h.day)}.${pad(h.month)}.2001 ${pad(h.hour)}:${pad(15 * k)};${(h.dryBulbC + off).toFixed(2).replace(".", ",")};${h.relativeHumidityPercent}`,
        );
      }
    }
    const v = unwrap(
      parseHourlyCsv(lines.join("\n"), {
        delimiter: ";",
        decimalSeparator: ",",
        temperatureUnit: "C",
        dryBulb: "Temperatur",
        humidity: { kind: "relativeHumidity", column: "Feuchte" },
        time: { kind: "timestamp", column: "Zeit", format: "dmy" },
        elevationM: 240,
      }),
    );
    expect(v.stats.recordsPerHour).toBe(4);
    expect(v.year.dryBulbC[1500]).toBeCloseTo(gen.hours[1500]!.dryBulbC, 9);
  });

  it("interpolates cells marked missing (NA, blank, user sentinel)", () => {
    const lines = syntheticYearToCsv(gen).split("\n");
    const setCell = (row: number, col: number, value: string) => {
      const f = lines[row + 1]!.split(",");
      f[col] = value;
      lines[row + 1] = f.join(",");
    };
    setCell(50, 1, "NA");
    setCell(51, 1, "");
    setCell(52, 1, "-999");
    const v = unwrap(
      parseHourlyCsv(lines.join("\n"), {
        temperatureUnit: "C",
        dryBulb: "dry_bulb_C",
        humidity: { kind: "relativeHumidity", column: "rh_percent" },
        time: byTimestamp,
        elevationM: 240,
        missingValues: ["-999"],
      }),
    );
    const a = gen.hours[49]!.dryBulbC;
    const b = gen.hours[53]!.dryBulbC;
    expect(v.year.dryBulbC[51]).toBeCloseTo((a + b) / 2, 9);
    expect(v.stats.missingValues.dryBulbC).toBe(3);
  });

  it("reads the committed Harrowgate Flats CSV fixture", () => {
    const text = readFileSync(
      path.resolve(__dirname, "../../../fixtures/weather/harrowgate-flats.csv"),
      "utf8",
    );
    const v = unwrap(
      parseHourlyCsv(text, {
        delimiter: ";",
        decimalSeparator: ",",
        temperatureUnit: "C",
        dryBulb: "dry_bulb_C",
        humidity: { kind: "relativeHumidity", column: "rh_percent" },
        time: byTimestamp,
        elevationM: 240,
      }),
    );
    expect(v.year.dryBulbC).toHaveLength(8760);
  });
});

describe("parseHourlyCsv on broken tables", () => {
  const text = syntheticYearToCsv(gen);
  const base: HourlyCsvMapping = {
    temperatureUnit: "C",
    dryBulb: "dry_bulb_C",
    humidity: { kind: "relativeHumidity", column: "rh_percent" },
    time: byTimestamp,
    elevationM: 240,
  };

  it("names a mapped column that is not in the header", () => {
    const r = parseHourlyCsv(text, { ...base, dryBulb: "temp" });
    expect(!r.ok && r.errors[0]).toMatchObject({ line: 1, field: "dryBulb" });
    expect(!r.ok && r.errors[0]!.message).toMatch(/no column "temp"/);
  });

  it("names the line and column of a row with too few fields", () => {
    const lines = text.split("\n");
    lines[201] = lines[201]!.split(",").slice(0, 2).join(",");
    const r = parseHourlyCsv(lines.join("\n"), base);
    expect(!r.ok && r.errors[0]).toMatchObject({ line: 202, field: "rh_percent" });
  });

  it("names the line and column of a cell that is not a number", () => {
    const lines = text.split("\n");
    lines[10] = lines[10]!.replace(/,(-?\d+\.\d),/, ",warm,");
    const r = parseHourlyCsv(lines.join("\n"), base);
    expect(!r.ok && r.errors[0]).toMatchObject({ line: 11, field: "dry_bulb_C" });
  });

  it("names the line of an unreadable or impossible timestamp", () => {
    const lines = text.split("\n");
    lines[30] = lines[30]!.replace(/^2001-01-02/, "2001-02-30");
    const r = parseHourlyCsv(lines.join("\n"), base);
    expect(!r.ok && r.errors[0]).toMatchObject({ line: 31, field: "timestamp" });
  });

  it("reports a truncated table", () => {
    const cut = text.split("\n").slice(0, 5001).join("\n");
    const r = parseHourlyCsv(cut, base);
    expect(!r.ok && r.errors[0]!.message).toMatch(/truncated/);
    expect(!r.ok && r.errors[0]!.line).toBe(5001);
  });

  it("refuses a decimal comma in a comma-delimited file", () => {
    const r = parseHourlyCsv(text, { ...base, delimiter: ",", decimalSeparator: "," });
    expect(!r.ok && r.errors[0]).toMatchObject({ field: "decimalSeparator" });
  });

  it("returns errors, never throws, on an empty or a one-line file", () => {
    expect(parseHourlyCsv("", base).ok).toBe(false);
    expect(parseHourlyCsv("timestamp,dry_bulb_C,rh_percent\n", base).ok).toBe(false);
  });
});
