/**
 * CSV exports (RFC 4180: comma-separated, CRLF line ends, fields with a comma, quote or line break
 * quoted): the yearly cash flows, the climate bins and the annual water and energy table. The header
 * row carries each column's unit; user text is neutralised against formula injection; numbers are
 * plain numbers in the viewer's units.
 */
import { binHourly } from "@/lib/engine/climate/binning";
import type { ClimateInput } from "@/lib/engine/climate/types";
import { COST_CATEGORIES, COST_CATEGORY_LABELS } from "@/lib/engine/economics/types";
import { calendarYearLabel } from "./format";
import { neutraliseText } from "./neutralise";
import type { ReportSource } from "./types";
import { convert, unitOf } from "./units";

export const CSV_TABLES = ["cashflows", "climate-bins", "water-energy"] as const;
export type CsvTable = (typeof CSV_TABLES)[number];

export function isCsvTable(v: string): v is CsvTable {
  return (CSV_TABLES as readonly string[]).includes(v);
}

type Cell = string | number | null;

/** One CSV field: numbers as numbers, text neutralised and quoted when needed. */
export function csvField(v: Cell, userText = true): string {
  if (v === null) return "";
  if (typeof v === "number") return Number.isFinite(v) ? String(Number(v.toPrecision(12))) : "";
  const s = userText ? neutraliseText(v) : v;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function toCsv(header: string[], rows: Cell[][]): string {
  const lines = [
    header.map((h) => csvField(h, false)).join(","),
    ...rows.map((r) => r.map((c) => csvField(c)).join(",")),
  ];
  return lines.join("\r\n") + "\r\n";
}

const round = (v: number, decimals: number) => Math.round(v * 10 ** decimals) / 10 ** decimals;

export function cashFlowsCsv(src: ReportSource): string {
  const eco = src.result.economics;
  const cur = src.project.currency;
  const basis = eco.analysis === "real" ? `constant ${eco.baseYear} ${cur}` : `then-current ${cur}`;
  const header = [
    "Option",
    "Study year t",
    "Calendar year",
    ...COST_CATEGORIES.map((c) => `${COST_CATEGORY_LABELS[c]} (${basis})`),
    `Total (${basis})`,
    `Present value (${cur} at 1 January ${eco.baseYear})`,
    `Cumulative present value (${cur})`,
    "Discount rate (fraction per year)",
    "First cost",
    // Years 0 and 1 share a calendar year: this says which is which. Last, so no earlier column moves.
    "Calendar year (labelled)",
  ];
  const rows: Cell[][] = [];
  for (const o of eco.options) {
    // Without the option's first cost its present values are not a life-cycle cost: every row says so.
    const status = o.firstCostMissing ? "first costs missing: not a life-cycle cost" : "entered";
    for (const c of o.cashFlows) {
      rows.push([
        o.label,
        c.yearIndex,
        c.calendarYear,
        ...COST_CATEGORIES.map((k) => round(c.byCategory[k], 2)),
        round(c.total, 2),
        round(c.presentValue, 2),
        round(c.cumulativePresentValue, 2),
        eco.discountRate,
        status,
        calendarYearLabel(c.yearIndex, c.calendarYear),
      ]);
    }
  }
  return toCsv(header, rows);
}

function climateOf(input: unknown): ClimateInput | undefined {
  const c = (input as { climate?: unknown } | null)?.climate as ClimateInput | undefined;
  return c && (c.source === "hourly" || c.source === "wetBulbBins" || c.source === "dryBulbBins")
    ? c
    : undefined;
}

/** Wet-bulb bins (1 K) with their hours and mean coincident dry-bulb; from the climate in the input, else the result's histogram. */
export function climateBinsCsv(src: ReportSource): string {
  const sys = src.unitSystem;
  const t = unitOf("temperatureC", sys);
  const climate = climateOf(src.input);
  if (climate?.source === "hourly") {
    const table = binHourly({
      kind: "hourly",
      month: climate.month,
      day: climate.day,
      hour: climate.hour,
      dryBulbC: climate.dryBulbC,
      wetBulbC: climate.wetBulbC,
    });
    return toCsv(
      [
        `Wet-bulb bin low (${t})`,
        `Wet-bulb bin high (${t})`,
        `Mean wet-bulb (${t})`,
        `Mean coincident dry-bulb (${t})`,
        "Hours (h)",
      ],
      table.rows.map((r) => [
        round(convert("temperatureC", r.lowC, sys), 2),
        round(convert("temperatureC", r.highC, sys), 2),
        round(convert("temperatureC", r.meanC, sys), 2),
        round(convert("temperatureC", r.meanCoincidentC, sys), 2),
        r.hours,
      ]),
    );
  }
  if (climate?.source === "wetBulbBins") {
    return toCsv(
      [`Wet-bulb (${t})`, `Mean coincident dry-bulb (${t})`, "Hours (h)", "Month (1-12, blank = whole year)"],
      climate.bins.map((b) => [
        round(convert("temperatureC", b.wetBulbC, sys), 2),
        round(convert("temperatureC", b.meanCoincidentDryBulbC, sys), 2),
        b.hours,
        b.month ?? null,
      ]),
    );
  }
  if (climate?.source === "dryBulbBins") {
    return toCsv(
      [`Dry-bulb (${t})`, `Mean coincident wet-bulb (${t})`, "Hours (h)", "Month (1-12, blank = whole year)"],
      climate.bins.map((b) => [
        round(convert("temperatureC", b.dryBulbC, sys), 2),
        round(convert("temperatureC", b.meanCoincidentWetBulbC, sys), 2),
        b.hours,
        b.month ?? null,
      ]),
    );
  }
  const hist = src.result.climate?.wetBulbHistogram ?? [];
  return toCsv(
    [`Wet-bulb bin low (${t})`, `Wet-bulb bin high (${t})`, `Bin centre (${t})`, "Hours (h)"],
    hist.map((b) => [
      round(convert("temperatureC", b.lowC, sys), 2),
      round(convert("temperatureC", b.highC, sys), 2),
      round(convert("temperatureC", b.centerC, sys), 2),
      b.hours,
    ]),
  );
}

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** Water by component and electric energy by component, per option, for each month and the year. */
export function waterEnergyCsv(src: ReportSource): string {
  const sys = src.unitSystem;
  const v = unitOf("waterVolumeM3", sys);
  const header = [
    "Option",
    "Period",
    "Hours (h)",
    `Evaporation (${v})`,
    `Drift (${v})`,
    `Blowdown (${v})`,
    `Makeup (${v})`,
    `Sewer billed (${v})`,
    "Fan energy (kWh)",
    "Condenser pump energy (kWh)",
    "Tower-side pump energy (kWh)",
    "Spray pump energy (kWh)",
    "Basin heater energy (kWh)",
    "Compressor energy (kWh)",
    "Total electric energy (kWh)",
    "Peak demand (kW)",
    "Dry-mode hours (h)",
    "Hours set-point not held (h)",
  ];
  const vol = (m3: number) => round(convert("waterVolumeM3", m3, sys), 3);
  const kwh = (x: number) => round(x, 1);
  const rows: Cell[][] = [];
  for (const p of src.result.physics) {
    const peak = Math.max(0, ...p.monthly.map((m) => m.peakDemandKW));
    const periods = [
      ...p.monthly.map((m) => ({
        period: MONTHS[m.month - 1] ?? String(m.month),
        hours: m.hours,
        w: m.waterM3,
        e: m.energyKWh,
        peak: m.peakDemandKW,
        dry: m.dryModeHours,
        unmet: m.unmetHours,
      })),
      {
        period: "Year",
        hours: p.hoursTotal,
        w: p.waterM3,
        e: p.energyKWh,
        peak,
        dry: p.dryModeHours,
        unmet: p.unmetHours,
      },
    ];
    for (const x of periods) {
      rows.push([
        p.label,
        x.period,
        x.hours,
        vol(x.w.evaporation),
        vol(x.w.drift),
        vol(x.w.blowdown),
        vol(x.w.makeup),
        vol(x.w.sewerBilled),
        kwh(x.e.fan),
        kwh(x.e.condenserPump),
        kwh(x.e.secondaryPump),
        kwh(x.e.sprayPump),
        kwh(x.e.basinHeater),
        kwh(x.e.compressor),
        kwh(x.e.total),
        round(x.peak, 2),
        x.dry,
        x.unmet,
      ]);
    }
  }
  return toCsv(header, rows);
}

export function buildCsv(src: ReportSource, table: CsvTable): string {
  switch (table) {
    case "cashflows":
      return cashFlowsCsv(src);
    case "climate-bins":
      return climateBinsCsv(src);
    case "water-energy":
      return waterEnergyCsv(src);
  }
}
