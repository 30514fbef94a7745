"use client";

import { ResponsiveBar } from "@nivo/bar";
import { ChartFrame } from "./chart-frame";
import { CATEGORY_COLORS, chartTheme, compactNumber } from "./theme";

export interface CostStackSeries {
  optionId: string;
  label: string;
  /** One row per study year: `year` is the calendar year, the other keys are amounts by category. */
  years: ({ year: string } & Record<string, number | string>)[];
}

/**
 * Yearly cost by category, one small stacked chart per option on a common scale. The base-date
 * investment is left out (it would flatten every other year); the table shows it.
 */
export function CostStackChart({
  series,
  categories,
  currency,
}: {
  series: CostStackSeries[];
  categories: { key: string; label: string }[];
  currency: string;
}) {
  const keys = categories.map((c) => c.key);
  const labelOf = Object.fromEntries(categories.map((c) => [c.key, c.label]));
  let max = 0;
  let min = 0;
  for (const s of series) {
    for (const y of s.years) {
      let pos = 0;
      let neg = 0;
      for (const k of keys) {
        const v = Number(y[k] ?? 0);
        if (v >= 0) pos += v;
        else neg += v;
      }
      max = Math.max(max, pos);
      min = Math.min(min, neg);
    }
  }
  return (
    <div className="grid gap-4 md:grid-cols-2 xl:grid-cols-3" data-testid="chart-cost-stack">
      {series.map((s) => (
        <ChartFrame key={s.optionId} title={`Yearly cost — ${s.label}`} unit={`${currency} per year`} height={240}>
          <ResponsiveBar
            data={s.years}
            keys={keys}
            indexBy="year"
            margin={{ top: 8, right: 8, bottom: 36, left: 56 }}
            padding={0.2}
            valueScale={{ type: "linear", min: min * 1.05, max: max * 1.05 }}
            colors={({ id }) => CATEGORY_COLORS[String(id)] ?? "#a9b7c1"}
            theme={chartTheme}
            enableLabel={false}
            axisBottom={{ tickRotation: -45, tickValues: s.years.filter((_, i) => i % 5 === 0).map((y) => y.year) }}
            axisLeft={{ format: (v: number) => compactNumber(v) }}
            tooltipLabel={(d) => `${labelOf[String(d.id)] ?? d.id} ${d.indexValue}`}
            valueFormat={(v) => `${Math.round(v).toLocaleString("en-US")} ${currency}`}
            role="img"
            ariaLabel={`Yearly cost by category for ${s.label}`}
          />
        </ChartFrame>
      ))}
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft md:col-span-2 xl:col-span-3" aria-label="Cost categories">
        {categories.map((c) => (
          <li key={c.key} className="flex items-center gap-1.5">
            <span aria-hidden="true" className="inline-block h-2.5 w-2.5 rounded-sm" style={{ background: CATEGORY_COLORS[c.key] }} />
            {c.label}
          </li>
        ))}
      </ul>
    </div>
  );
}
