/**
 * Chart series and table rows from a scenario result, converted to the viewer's unit system through
 * lib/units. Pure and server-safe: the comparison view builds them on the server and hands plain
 * numbers to the client charts.
 */
import type { ScenarioResult } from "@/lib/engine";
import type { ClimateInput } from "@/lib/engine/climate/types";
import { COST_CATEGORIES, COST_CATEGORY_LABELS, type EconomicsResult } from "@/lib/engine/economics/types";
import type { OptionAnnualPhysics } from "@/lib/engine/types";
import { fromSI, unitLabel, type UnitSystem } from "@/lib/units";
import type { CostStackSeries } from "@/components/charts/cost-stack-chart";
import type { CumulativeSeries } from "@/components/charts/cumulative-cost-chart";
import type { MonthlyWaterSeries } from "@/components/charts/monthly-water-chart";
import type { TornadoRow } from "@/components/charts/tornado-chart";
import type { WetBulbBinRow } from "@/components/charts/wet-bulb-bins-chart";

export const MONTH_NAMES = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** Categories drawn in the yearly stack (the base-date investment is left to the table). */
export const STACK_CATEGORIES = COST_CATEGORIES.filter((k) => k !== "investment").map((k) => ({ key: k, label: COST_CATEGORY_LABELS[k] }));

export function costStackSeries(e: EconomicsResult): CostStackSeries[] {
  return e.options.map((o) => ({
    optionId: o.optionId,
    label: o.label,
    years: o.cashFlows
      .filter((cf) => cf.yearIndex >= 1)
      .map((cf) => ({ year: String(cf.calendarYear), ...cf.byCategory })),
  }));
}

export function cumulativeSeries(e: EconomicsResult): CumulativeSeries[] {
  return e.options.map((o) => ({
    optionId: o.optionId,
    label: o.label,
    points: o.cashFlows.map((cf) => ({ year: cf.yearIndex, value: cf.cumulativePresentValue })),
  }));
}

export function monthlyWaterSeries(physics: OptionAnnualPhysics[], system: UnitSystem): { series: MonthlyWaterSeries[]; unit: string } {
  const conv = (m3: number) => fromSI("waterVolumeM3", m3, system);
  return {
    unit: unitLabel("waterVolumeM3", system),
    series: physics.map((p) => ({
      optionId: p.optionId,
      label: p.label,
      months: MONTH_NAMES.map((name, i) => {
        const m = p.monthly.find((x) => x.month === i + 1);
        return {
          month: name,
          evaporation: conv(m?.waterM3.evaporation ?? 0),
          drift: conv(m?.waterM3.drift ?? 0),
          blowdown: conv(m?.waterM3.blowdown ?? 0),
        };
      }),
    })),
  };
}

/**
 * Hours per 1 K (SI) or 2 °F (IP) wet-bulb bin; for the closed-circuit cooler, its dry-mode hours split out.
 * The engine reports dry-mode hours by month, not by bin: each month's dry hours are placed in that
 * month's coldest dry-bulb hours (dry operation is possible when the air is cold enough), then binned on
 * their wet-bulb. For a bin climate without hourly records only the hours are drawn.
 */
export function wetBulbBinRows(
  climate: ClimateInput | null,
  result: ScenarioResult,
  system: UnitSystem,
): { rows: WetBulbBinRow[]; unit: string; dryLabel: string | null; dryApproximated: boolean } {
  const unit = unitLabel("temperatureC", system);
  const widthShown = system === "IP" ? 2 : 1;
  const binOf = (wbC: number) => Math.floor(fromSI("temperatureC", wbC, system) / widthShown) * widthShown;
  const cooler = result.physics.find((p) => p.kind === "closedCircuitCooler");
  const wet = new Map<number, number>();
  const dry = new Map<number, number>();
  const add = (m: Map<number, number>, k: number, h: number) => m.set(k, (m.get(k) ?? 0) + h);
  let dryApproximated = false;
  if (climate && climate.source === "hourly") {
    const n = climate.wetBulbC.length;
    const dryByMonth = new Map<number, number>((cooler?.monthly ?? []).map((m) => [m.month, Math.round(m.dryModeHours)]));
    const byMonth = new Map<number, number[]>();
    for (let i = 0; i < n; i++) {
      const m = climate.month[i] ?? 0;
      const list = byMonth.get(m) ?? [];
      list.push(i);
      byMonth.set(m, list);
    }
    const isDry = new Uint8Array(n);
    for (const [m, idx] of byMonth) {
      const k = Math.min(idx.length, dryByMonth.get(m) ?? 0);
      if (k <= 0) continue;
      dryApproximated = true;
      idx.sort((a, b) => (climate.dryBulbC[a] ?? 0) - (climate.dryBulbC[b] ?? 0));
      for (let j = 0; j < k; j++) isDry[idx[j]!] = 1;
    }
    for (let i = 0; i < n; i++) add(isDry[i] ? dry : wet, binOf(climate.wetBulbC[i] ?? 0), 1);
  } else {
    for (const bar of result.climateSummary.wetBulbHistogram) add(wet, binOf(bar.centerC), bar.hours);
  }
  const keys = [...new Set([...wet.keys(), ...dry.keys()])].sort((a, b) => a - b);
  const rows: WetBulbBinRow[] = [];
  if (keys.length > 0) {
    for (let k = keys[0]!; k <= keys[keys.length - 1]!; k += widthShown) {
      rows.push({ bin: String(k), wetHours: wet.get(k) ?? 0, dryHours: dry.get(k) ?? 0 });
    }
  }
  return { rows, unit, dryLabel: cooler && dryApproximated ? `${cooler.label}: dry (spray off)` : null, dryApproximated };
}

const INPUT_LABELS: Record<string, string> = {
  waterPrice: "Water price",
  sewerPrice: "Sewer price",
  electricityPrice: "Electricity price",
  electricityEscalation: "Electricity escalation",
  cyclesOfConcentration: "Cycles of concentration",
  discountRate: "Discount rate",
  firstCostPremium: "Extra first cost",
  foulingRate: "Fouling rate",
  load: "Heat-rejection load",
};

function rangeText(mode: "factor" | "delta" | "value", low: number, high: number): string {
  const f = (v: number) => Number(v.toPrecision(3)).toString();
  if (mode === "factor") return `×${f(low)} … ×${f(high)}`;
  if (mode === "delta") return `${low >= 0 ? "+" : "−"}${f(Math.abs(100 * low))} … ${high >= 0 ? "+" : "−"}${f(Math.abs(100 * high))} %-pt`;
  return `${f(low)} … ${f(high)}`;
}

/** Tornado bars of the first pair (the base against the first alternative), as changes from the base case. */
export function tornadoRows(e: EconomicsResult, pairIndex = 0): { rows: TornadoRow[]; pairLabel: string; skipped: string[] } | null {
  const pair = e.sensitivity?.tornado[pairIndex];
  if (!pair) return null;
  const label = (id: string) => e.options.find((o) => o.optionId === id)?.label ?? id;
  const rows: TornadoRow[] = [];
  const skipped: string[] = [];
  for (const b of pair.bars) {
    const name = `${INPUT_LABELS[b.input] ?? b.label} ${rangeText(b.mode, b.low, b.high)}`;
    if (b.skippedReason) {
      skipped.push(`${INPUT_LABELS[b.input] ?? b.label}: ${b.skippedReason}`);
      continue;
    }
    rows.push({ label: name, low: b.netSavingsAtLow - pair.baseNetSavings, high: b.netSavingsAtHigh - pair.baseNetSavings });
  }
  return { rows, pairLabel: `${label(pair.alternativeOptionId)} against ${label(pair.baseOptionId)}`, skipped };
}
