import { describe, expect, it } from "vitest";
import { climateYearWarnings, toClimateYear } from "@/lib/engine/climate/input";
import { calendarOfYear } from "@/lib/engine/climate/calendar";
import { climateInputSchema } from "@/lib/scenarios/schema-climate";
import { parseEpw } from "@/lib/engine/climate/epw";
import { syntheticEpw, unwrap } from "./helpers";

function hourlyInput(leap = false) {
  const y = unwrap(parseEpw(syntheticEpw(7, leap).epw)).year;
  return {
    source: "hourly" as const,
    label: "Harrowgate Flats (invented)",
    month: y.month,
    day: y.day,
    hour: y.hour,
    dryBulbC: y.dryBulbC,
    wetBulbC: y.wetBulbC,
  };
}

describe("climateInputSchema", () => {
  it("accepts a parsed hourly year (8760) and a leap year (8784)", () => {
    expect(climateInputSchema.safeParse(hourlyInput()).success).toBe(true);
    expect(climateInputSchema.safeParse(hourlyInput(true)).success).toBe(true);
  });

  it("rejects arrays of unequal length and a year of the wrong size, with field paths", () => {
    const v = hourlyInput();
    const r = climateInputSchema.safeParse({ ...v, wetBulbC: v.wetBulbC.slice(0, 100) });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join("."))).toContain("wetBulbC");
    const cut = climateInputSchema.safeParse({
      ...v,
      month: v.month.slice(0, 24),
      day: v.day.slice(0, 24),
      hour: v.hour.slice(0, 24),
      dryBulbC: v.dryBulbC.slice(0, 24),
      wetBulbC: v.wetBulbC.slice(0, 24),
    });
    expect(cut.error!.issues[0]).toMatchObject({ path: ["dryBulbC"] });
    expect(cut.error!.issues[0]!.message).toMatch(/8760/);
  });

  it("points at the entry: hour 24, 30 February, wet-bulb above dry-bulb", () => {
    const v = hourlyInput();
    const hour = v.hour.slice();
    hour[5] = 24;
    const day = v.day.slice();
    day[32 * 24] = 30; // a February hour
    const wetBulbC = v.wetBulbC.slice();
    wetBulbC[4000] = v.dryBulbC[4000]! + 2;
    const r = climateInputSchema.safeParse({ ...v, hour, day, wetBulbC });
    const paths = r.error!.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["hour.5", `day.${32 * 24}`, "wetBulbC.4000"]));
  });

  it("caps the per-entry messages of one array and says how many more there are", () => {
    const v = hourlyInput();
    const r = climateInputSchema.safeParse({ ...v, hour: v.hour.map(() => 99) });
    const hourIssues = r.error!.issues.filter((i) => i.path[0] === "hour");
    expect(hourIssues).toHaveLength(21);
    expect(hourIssues[20]!.message).toMatch(/8740 more/);
  });

  it("validates bins field by field", () => {
    const ok = climateInputSchema.safeParse({
      source: "wetBulbBins",
      bins: [
        { wetBulbC: 20, meanCoincidentDryBulbC: 27, hours: 500 },
        { wetBulbC: 10, meanCoincidentDryBulbC: 14, hours: 8260 },
      ],
    });
    expect(ok.success).toBe(true);
    const bad = climateInputSchema.safeParse({
      source: "dryBulbBins",
      bins: [{ dryBulbC: 20, meanCoincidentWetBulbC: 24, hours: -3, month: 13 }],
    });
    const paths = bad.error!.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(
      expect.arrayContaining(["bins.0.hours", "bins.0.month", "bins.0.meanCoincidentWetBulbC"]),
    );
    const source = climateInputSchema.safeParse({ source: "monthly" });
    expect(source.error!.issues[0]!.path).toEqual(["source"]);
  });
});

describe("toClimateYear", () => {
  it("carries hourly arrays into an hourly ClimateYear", () => {
    const input = climateInputSchema.parse(hourlyInput());
    const y = toClimateYear(input);
    expect(y.kind).toBe("hourly");
    if (y.kind !== "hourly") return;
    expect(y.wetBulbC).toEqual(input.source === "hourly" ? input.wetBulbC : []);
    expect(climateYearWarnings(y)).toEqual([]);
  });

  it("turns dry-bulb bins into bins keyed on their mean coincident wet-bulb", () => {
    const y = toClimateYear({
      source: "dryBulbBins",
      bins: [{ dryBulbC: 30, meanCoincidentWetBulbC: 21, hours: 100, month: 7 }],
    });
    expect(y).toEqual({
      kind: "bins",
      binnedOn: "dryBulb",
      bins: [{ wetBulbC: 21, meanCoincidentDryBulbC: 30, hours: 100, month: 7 }],
    });
    // 100 h is not a year: the engine warns rather than refuses
    expect(climateYearWarnings(y).map((w) => w.code)).toEqual(["climate.hoursNotAYear"]);
  });

  it("warns about bins whose wet-bulb exceeds their dry-bulb", () => {
    const cal = calendarOfYear(false);
    const w = climateYearWarnings({
      kind: "hourly",
      ...cal,
      dryBulbC: cal.month.map(() => 20),
      wetBulbC: cal.month.map((_, i) => (i === 7 ? 21 : 15)),
    });
    expect(w.map((x) => x.code)).toEqual(["climate.wetBulbAboveDryBulb"]);
    expect(w[0]!.message).toMatch(/^1 hours/);
  });
});
