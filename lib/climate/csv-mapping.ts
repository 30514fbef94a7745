/**
 * The column mapping a person picks for an hourly CSV weather file: its zod schema (the upload route
 * validates what the browser sends with it), a preview of the first rows and a first guess from the
 * header names. Client-safe.
 */
import * as Papa from "papaparse";
import { z } from "zod";
import type { HourlyCsvMapping } from "@/lib/engine/climate";

const column = z.number({ error: "pick a column" }).int("pick a column").min(0, "pick a column").max(500);

export const csvMappingSchema = z.object({
  delimiter: z.enum([",", ";", "\t"], { error: "pick the delimiter" }),
  decimalSeparator: z.enum([".", ","], { error: "pick the decimal separator" }),
  skipLines: z.number().int().min(0).max(100).default(0),
  hasHeader: z.boolean().default(true),
  temperatureUnit: z.enum(["C", "F"], { error: "pick °C or °F" }),
  dryBulb: column,
  humidity: z.object({
    kind: z.enum(["relativeHumidity", "dewPoint", "wetBulb"], { error: "pick the humidity kind" }),
    column,
    unit: z.enum(["percent", "fraction"]).default("percent"),
  }),
  time: z.discriminatedUnion(
    "kind",
    [
      z.object({
        kind: z.literal("timestamp"),
        column,
        format: z.enum(["iso", "dmy", "mdy"]).default("iso"),
        convention: z.enum(["start", "end"]).default("start"),
      }),
      z.object({
        kind: z.literal("dateAndTime"),
        date: column,
        time: column,
        format: z.enum(["iso", "dmy", "mdy"]).default("mdy"),
        convention: z.enum(["start", "end"]).default("start"),
      }),
      z.object({
        kind: z.literal("monthDayHour"),
        month: column,
        day: column,
        hour: column,
        hourConvention: z.enum(["0-23", "1-24", "auto"]).default("auto"),
      }),
    ],
    { error: "pick how time is given" },
  ),
  pressure: z.object({ column, unit: z.enum(["Pa", "hPa", "mbar", "kPa"]) }).optional(),
}).superRefine((m, ctx) => {
  if (m.delimiter === "," && m.decimalSeparator === ",") {
    ctx.addIssue({ code: "custom", path: ["decimalSeparator"], message: "a decimal comma needs a delimiter other than the comma" });
  }
});

export type CsvMappingInput = z.input<typeof csvMappingSchema>;
export type CsvMapping = z.output<typeof csvMappingSchema>;

/** The mapping as the engine's parser wants it, with the site's elevation for the wet-bulb pressure. */
export function toHourlyCsvMapping(m: CsvMapping, extra: { elevationM: number; label?: string }): HourlyCsvMapping {
  return {
    delimiter: m.delimiter,
    decimalSeparator: m.decimalSeparator,
    skipLines: m.skipLines,
    hasHeader: m.hasHeader,
    temperatureUnit: m.temperatureUnit,
    dryBulb: m.dryBulb,
    humidity:
      m.humidity.kind === "relativeHumidity"
        ? { kind: "relativeHumidity", column: m.humidity.column, unit: m.humidity.unit }
        : { kind: m.humidity.kind, column: m.humidity.column },
    time:
      m.time.kind === "timestamp"
        ? { kind: "timestamp", column: m.time.column, format: m.time.format, convention: m.time.convention }
        : m.time.kind === "dateAndTime"
          ? { kind: "dateAndTime", date: m.time.date, time: m.time.time, format: m.time.format, convention: m.time.convention }
          : { kind: "monthDayHour", month: m.time.month, day: m.time.day, hour: m.time.hour, hourConvention: m.time.hourConvention },
    ...(m.pressure ? { pressure: m.pressure } : {}),
    elevationM: extra.elevationM,
    ...(extra.label ? { label: extra.label } : {}),
  };
}

export interface CsvPreview {
  delimiter: "," | ";" | "\t";
  decimalSeparator: "." | ",";
  header: string[];
  /** The first data rows, as text. */
  rows: string[][];
  /** Lines in the file (approximate: line breaks counted). */
  lineCount: number;
  /** The first raw lines of the file, so the browser can re-read the preview with another header line. */
  headLines: string[];
  guess: CsvMappingInput;
}

const PREVIEW_ROWS = 8;

function detectDelimiter(sample: string): "," | ";" | "\t" {
  const lines = sample.split(/\r\n|\n|\r/).filter((l) => l.trim() !== "").slice(0, 20);
  let best: "," | ";" | "\t" = ",";
  let bestScore = -1;
  for (const d of [";", "\t", ","] as const) {
    const counts = lines.map((l) => l.split(d).length - 1);
    const first = counts[0] ?? 0;
    // A delimiter that splits every line into the same number of fields wins.
    const consistent = counts.filter((c) => c === first && c > 0).length;
    if (consistent > bestScore) {
      bestScore = consistent;
      best = d;
    }
  }
  return best;
}

function findColumn(header: string[], patterns: RegExp[], exclude: number[] = []): number | undefined {
  for (const p of patterns) {
    const i = header.findIndex((h, idx) => !exclude.includes(idx) && p.test(h.trim().toLowerCase()));
    if (i >= 0) return i;
  }
  return undefined;
}

/** A first guess of the mapping from the header and the first rows; the person confirms or changes it. */
export function guessCsvMapping(header: string[], rows: string[][], delimiter: "," | ";" | "\t", decimal: "." | ","): CsvMappingInput {
  const lower = header.map((h) => h.trim().toLowerCase());
  const month = findColumn(header, [/^(month|mon|mo|mm)$/]);
  const day = findColumn(header, [/^(day|dd|dom)$/]);
  const hour = findColumn(header, [/^(hour|hr|hh|hour[ _-]?of[ _-]?day)$/]);
  const stamp = findColumn(header, [/time ?stamp|date ?time|^date|^time|^timestamp|^ts$/]);
  // A date column and a separate clock-time column ("Date (MM/DD/YYYY)" and "Time (HH:MM)").
  const dateOnly = findColumn(header, [/^date(?!\s*[-_ ]?time)/]);
  const timeOnly = findColumn(header, [/^(time|hh:mm|clock)(?!\s*stamp)/], dateOnly !== undefined ? [dateOnly] : []);
  const dew = findColumn(header, [/dew|tdp|td\b/]);
  const wet = findColumn(header, [/wet|twb|\bwb\b/]);
  const rh = findColumn(header, [/\brh\b|rh_|relative|humid/]);
  const dry = findColumn(header, [/dry|tdb|\bdb\b|air ?temp|^temp|temperature|^t$|^t_/], [dew, wet, rh].filter((x): x is number => x !== undefined));
  const tempHeader = lower[dry ?? -1] ?? "";
  const fahrenheit = /(_f\b|°f|degf|\(f\)|\bf\)|fahrenheit|\bf$)/.test(tempHeader);
  const humidity =
    rh !== undefined
      ? { kind: "relativeHumidity" as const, column: rh, unit: "percent" as const }
      : dew !== undefined
        ? { kind: "dewPoint" as const, column: dew }
        : wet !== undefined
          ? { kind: "wetBulb" as const, column: wet }
          : { kind: "relativeHumidity" as const, column: Math.min(2, Math.max(0, header.length - 1)), unit: "percent" as const };
  if (humidity.kind === "relativeHumidity") {
    const values = rows.map((r) => Number((r[humidity.column] ?? "").replace(",", "."))).filter(Number.isFinite);
    if (values.length > 0 && values.every((v) => v >= 0 && v <= 1.0001)) (humidity as { unit: string }).unit = "fraction";
  }
  const firstStamp = stamp !== undefined ? (rows[0]?.[stamp] ?? "").trim() : "";
  const format: "iso" | "dmy" | "mdy" = /^\d{4}-/.test(firstStamp) ? "iso" : /^\d{1,2}\/\d{1,2}\//.test(firstStamp) ? "mdy" : "dmy";
  const firstDate = dateOnly !== undefined ? (rows[0]?.[dateOnly] ?? "").trim() : "";
  const dateFormat: "iso" | "dmy" | "mdy" = /^\d{4}-/.test(firstDate) ? "iso" : /^\d{1,2}\.\d{1,2}\./.test(firstDate) ? "dmy" : "mdy";
  const time =
    month !== undefined && day !== undefined && hour !== undefined
      ? { kind: "monthDayHour" as const, month, day, hour, hourConvention: "auto" as const }
      : dateOnly !== undefined && timeOnly !== undefined && dateOnly !== timeOnly
        ? {
            kind: "dateAndTime" as const,
            date: dateOnly,
            time: timeOnly,
            format: dateFormat,
            // Hour-ending files write 01:00 … 24:00; the first rows show 01:00 where hour-starting ones show 00:00.
            convention: /^0?1:00/.test((rows[0]?.[timeOnly] ?? "").trim()) ? ("end" as const) : ("start" as const),
          }
        : { kind: "timestamp" as const, column: stamp ?? 0, format, convention: "start" as const };
  return {
    delimiter,
    decimalSeparator: decimal,
    skipLines: 0,
    hasHeader: true,
    temperatureUnit: fahrenheit ? "F" : "C",
    dryBulb: dry ?? 1,
    humidity,
    time,
  };
}

const HEAD_LINES = 40;

/**
 * The line the header is on (0-based): the first line with as many fields as the lines after it, so a
 * preamble (a station line, notes) above the header is skipped.
 */
export function detectHeaderLine(lines: string[], delimiter: "," | ";" | "\t"): number {
  const counts = lines.map((l) => (l.trim() === "" ? 0 : Papa.parse<string[]>(l, { delimiter }).data[0]?.length ?? 0));
  const tail = counts.slice(Math.min(counts.length - 1, 10)).filter((c) => c > 0);
  const tally = new Map<number, number>();
  for (const c of tail) tally.set(c, (tally.get(c) ?? 0) + 1);
  const usual = [...tally.entries()].sort((a, b) => b[1] - a[1])[0]?.[0];
  if (usual === undefined) return 0;
  const i = counts.findIndex((c) => c === usual);
  return i < 0 ? 0 : Math.min(i, 100);
}

/**
 * The first rows of a CSV text with a detected delimiter, decimal separator and header line and a mapping
 * guess. `skipLines` (lines above the header) is detected when not given.
 */
export function previewCsv(text: string, skipLines?: number): CsvPreview {
  const full = text.replace(/^\uFEFF/, "");
  const allHead = full.slice(0, 64 * 1024).split(/\r\n|\n|\r/).slice(0, HEAD_LINES);
  const delimiter = detectDelimiter(allHead.slice(Math.min(allHead.length - 1, 5)).join("\n"));
  const skip = skipLines ?? detectHeaderLine(allHead, delimiter);
  const body = full.split(/\r\n|\n|\r/).slice(skip).join("\n");
  const sample = body.slice(0, 64 * 1024);
  const parsed = Papa.parse<string[]>(sample, { delimiter, preview: PREVIEW_ROWS + 1, skipEmptyLines: true });
  const [header = [], ...rows] = parsed.data;
  const decimalComma = delimiter !== "," && rows.some((r) => r.some((c) => /^-?\d+,\d+$/.test(c.trim())));
  const decimalSeparator = decimalComma ? "," : ".";
  let lineCount = 0;
  for (let i = 0; i < full.length; i++) if (full.charCodeAt(i) === 10) lineCount++;
  if (full.length > 0 && !full.endsWith("\n")) lineCount++;
  return {
    delimiter,
    decimalSeparator,
    header,
    rows,
    lineCount,
    headLines: allHead,
    guess: { ...guessCsvMapping(header, rows, delimiter, decimalSeparator), skipLines: skip },
  };
}
