"use client";

import { useId, useState } from "react";
import { ResponsiveBar } from "@nivo/bar";
import { ChartFrame } from "./chart-frame";
import { WATER_COLORS, chartTheme, compactNumber } from "./theme";

export interface MonthlyWaterSeries {
  optionId: string;
  label: string;
  /** Twelve rows, already in the display unit. */
  months: { month: string; evaporation: number; drift: number; blowdown: number }[];
}

const KEYS = ["evaporation", "drift", "blowdown"] as const;
const LABELS: Record<(typeof KEYS)[number], string> = { evaporation: "Evaporation", drift: "Drift", blowdown: "Blowdown" };

/** Makeup water by month and component (makeup = evaporation + drift + blowdown), one option at a time. */
export function MonthlyWaterChart({ series, unit }: { series: MonthlyWaterSeries[]; unit: string }) {
  const [selected, setSelected] = useState(series[0]?.optionId ?? "");
  const group = useId();
  const s = series.find((x) => x.optionId === selected) ?? series[0];
  let max = 0;
  for (const o of series) for (const m of o.months) max = Math.max(max, m.evaporation + m.drift + m.blowdown);
  if (!s) return null;
  return (
    <div data-testid="chart-monthly-water">
      <fieldset className="mb-2 flex flex-wrap gap-1 text-xs" aria-label="Option shown">
        {series.map((o) => (
          <label
            key={o.optionId}
            className={`cursor-pointer rounded-md border px-2 py-1 focus-within:outline-2 focus-within:outline-basin-500 ${
              o.optionId === s.optionId ? "border-basin-600 bg-basin-50 text-basin-900" : "border-line text-ink-soft"
            }`}
          >
            <input
              type="radio"
              name={group}
              value={o.optionId}
              checked={o.optionId === s.optionId}
              onChange={() => setSelected(o.optionId)}
              className="sr-only"
            />
            {o.label}
          </label>
        ))}
      </fieldset>
      <ChartFrame title={`Monthly makeup water — ${s.label}`} unit={`${unit} per month`} height={260}>
        <ResponsiveBar
          data={s.months}
          keys={[...KEYS]}
          indexBy="month"
          margin={{ top: 8, right: 8, bottom: 52, left: 56 }}
          padding={0.25}
          valueScale={{ type: "linear", min: 0, max: max > 0 ? max * 1.05 : 1 }}
          colors={({ id }) => WATER_COLORS[String(id)] ?? "#7cc4c6"}
          theme={chartTheme}
          enableLabel={false}
          axisLeft={{ format: (v: number) => compactNumber(v) }}
          tooltipLabel={(d) => `${LABELS[d.id as (typeof KEYS)[number]] ?? d.id}, ${d.indexValue}`}
          valueFormat={(v) => `${v.toLocaleString("en-US", { maximumFractionDigits: 1 })} ${unit}`}
          legends={[
            {
              dataFrom: "keys",
              anchor: "bottom",
              direction: "row",
              translateY: 48,
              itemWidth: 90,
              itemHeight: 14,
              symbolSize: 10,
              data: KEYS.map((k) => ({ id: k, label: LABELS[k], color: WATER_COLORS[k] ?? "#7cc4c6" })),
            },
          ]}
          role="img"
          ariaLabel={`Monthly makeup water by component for ${s.label}`}
        />
      </ChartFrame>
    </div>
  );
}
