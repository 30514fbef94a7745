/**
 * Zod schema of the scenario's `climate` key: a typical year as hourly arrays (already resolved to
 * wet-bulb at the site's pressure when the weather file was imported), or a bin table of wet-bulb
 * bins with mean coincident dry-bulb, or of dry-bulb bins with mean coincident wet-bulb.
 * Its output is assignable to the engine's `ClimateInput` (checked at the bottom of this file);
 * `toClimateYear` in lib/engine/climate turns it into the engine's ClimateYear.
 */
import { z } from "zod";
import { text } from "@/lib/validation/text";
import { MAX_BINS } from "@/lib/validation/limits";
import type { ClimateInput } from "@/lib/engine/climate/types";

/** Bounds of plausible outdoor air temperatures, °C (the EPW format's own limits: −70…70 °C). */
const MIN_AIR_C = -70;
const MAX_AIR_C = 70;
/** Stop listing per-entry problems of one array after this many (a broken upload would list 8760). */
const MAX_ISSUES_PER_ARRAY = 20;
const DAYS_IN_MONTH = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

const airTemperatureC = (what: string) =>
  z
    .number({ error: `${what} must be a number in °C` })
    .min(MIN_AIR_C, `${what} below ${MIN_AIR_C} °C is not an outdoor air temperature`)
    .max(MAX_AIR_C, `${what} above ${MAX_AIR_C} °C is not an outdoor air temperature`);

const binHours = z
  .number({ error: "hours must be a number" })
  .nonnegative("hours cannot be negative")
  .max(8784, "one bin cannot hold more hours than a leap year (8784 h)");

const binMonth = z
  .number()
  .int("month must be a whole number 1…12")
  .min(1, "month must be 1…12")
  .max(12, "month must be 1…12")
  .optional();

/** An hourly column: a number per hour of a (leap) year; longer arrays are refused before any entry is read. */
const numberArray = z.array(z.number({ error: "each entry must be a number" })).max(8784, "an hourly year has at most 8784 entries");

export const hourlyClimateInputSchema = z
  .object({
    source: z.literal("hourly"),
    datasetId: text().min(1).max(64).optional(),
    label: text().min(1, "give the climate a label (e.g. the station or file name)").max(200),
    month: numberArray,
    day: numberArray,
    hour: numberArray.describe("0…23, the hour starting at that time"),
    dryBulbC: numberArray,
    wetBulbC: numberArray,
  })
  .superRefine((v, ctx) => {
    const n = v.dryBulbC.length;
    if (n !== 8760 && n !== 8784) {
      ctx.addIssue({
        code: "custom",
        path: ["dryBulbC"],
        message: `an hourly year has 8760 entries (8784 with 29 February); this one has ${n}`,
      });
    }
    for (const key of ["month", "day", "hour", "wetBulbC"] as const) {
      if (v[key].length !== n) {
        ctx.addIssue({
          code: "custom",
          path: [key],
          message: `${key} has ${v[key].length} entries but dryBulbC has ${n}: the arrays must have equal length`,
        });
      }
    }
    const perArray: Record<string, number> = {};
    const report = (key: string, i: number, message: string) => {
      const count = (perArray[key] ?? 0) + 1;
      perArray[key] = count;
      if (count <= MAX_ISSUES_PER_ARRAY) ctx.addIssue({ code: "custom", path: [key, i], message });
    };
    let leapDayHours = 0;
    for (let i = 0; i < v.month.length; i++) {
      const m = v.month[i] ?? NaN;
      const d = v.day[i] ?? NaN;
      if (!Number.isInteger(m) || m < 1 || m > 12) {
        report("month", i, `month must be a whole number 1…12, not ${m}`);
        continue;
      }
      if (i < v.day.length && (!Number.isInteger(d) || d < 1 || d > (DAYS_IN_MONTH[m - 1] ?? 31))) {
        report("day", i, `day ${d} does not exist in month ${m}`);
      }
      if (m === 2 && d === 29) leapDayHours++;
    }
    if (leapDayHours > 0 && n === 8760) {
      ctx.addIssue({
        code: "custom",
        path: ["day"],
        message: "a year with 29 February must have 8784 entries",
      });
    }
    for (let i = 0; i < v.hour.length; i++) {
      const h = v.hour[i] ?? NaN;
      if (!Number.isInteger(h) || h < 0 || h > 23)
        report("hour", i, `hour must be a whole number 0…23, not ${h}`);
    }
    for (const key of ["dryBulbC", "wetBulbC"] as const) {
      const arr = v[key];
      for (let i = 0; i < arr.length; i++) {
        const t = arr[i] ?? NaN;
        if (!Number.isFinite(t) || t < MIN_AIR_C || t > MAX_AIR_C) {
          report(key, i, `${t} °C is outside ${MIN_AIR_C}…${MAX_AIR_C} °C`);
        }
      }
    }
    const m = Math.min(v.wetBulbC.length, n);
    for (let i = 0; i < m; i++) {
      const wb = v.wetBulbC[i] ?? NaN;
      const db = v.dryBulbC[i] ?? NaN;
      // 0.05 K of slack for rounding in exported files; beyond that the pair is impossible
      if (wb > db + 0.05) report("wetBulbC", i, `wet-bulb ${wb} °C is above the dry-bulb ${db} °C`);
    }
    for (const [key, count] of Object.entries(perArray)) {
      if (count > MAX_ISSUES_PER_ARRAY) {
        ctx.addIssue({
          code: "custom",
          path: [key],
          message: `${count - MAX_ISSUES_PER_ARRAY} more entries of ${key} have the same kind of problem`,
        });
      }
    }
  });

const wetBulbBinSchema = z
  .object({
    wetBulbC: airTemperatureC("wet-bulb"),
    meanCoincidentDryBulbC: airTemperatureC("mean coincident dry-bulb"),
    hours: binHours,
    month: binMonth,
  })
  .refine((b) => b.wetBulbC <= b.meanCoincidentDryBulbC + 0.05, {
    path: ["meanCoincidentDryBulbC"],
    message: "the mean coincident dry-bulb cannot be below the bin's wet-bulb",
  });

const dryBulbBinSchema = z
  .object({
    dryBulbC: airTemperatureC("dry-bulb"),
    meanCoincidentWetBulbC: airTemperatureC("mean coincident wet-bulb"),
    hours: binHours,
    month: binMonth,
  })
  .refine((b) => b.meanCoincidentWetBulbC <= b.dryBulbC + 0.05, {
    path: ["meanCoincidentWetBulbC"],
    message: "the mean coincident wet-bulb cannot be above the bin's dry-bulb",
  });

const binsHaveHours = (bins: { hours: number }[]) => bins.reduce((s, b) => s + b.hours, 0) > 0;

export const wetBulbBinsClimateInputSchema = z.object({
  source: z.literal("wetBulbBins"),
  datasetId: text().min(1).max(64).optional(),
  label: text().max(200).optional(),
  bins: z
    .array(wetBulbBinSchema)
    .min(1, "enter at least one wet-bulb bin")
    .max(MAX_BINS, `a bin table holds at most ${MAX_BINS} bins`)
    .refine(binsHaveHours, "the bins hold no hours"),
});

export const dryBulbBinsClimateInputSchema = z.object({
  source: z.literal("dryBulbBins"),
  datasetId: text().min(1).max(64).optional(),
  label: text().max(200).optional(),
  bins: z
    .array(dryBulbBinSchema)
    .min(1, "enter at least one dry-bulb bin")
    .max(MAX_BINS, `a bin table holds at most ${MAX_BINS} bins`)
    .refine(binsHaveHours, "the bins hold no hours"),
});

/** The scenario's `climate` key. */
export const climateInputSchema = z.discriminatedUnion(
  "source",
  [hourlyClimateInputSchema, wetBulbBinsClimateInputSchema, dryBulbBinsClimateInputSchema],
  { error: 'climate.source must be "hourly", "wetBulbBins" or "dryBulbBins"' },
);

export type ClimateInputDocument = z.infer<typeof climateInputSchema>;

// The schema's output must be assignable to the engine's input type (compile-time check only).
type Assignable<T, U> = T extends U ? true : false;
const climateSchemaMatchesEngine: Assignable<ClimateInputDocument, ClimateInput> = true;
void climateSchemaMatchesEngine;
