"use client";

import { ResponsiveBar } from "@nivo/bar";
import { ChartFrame } from "./chart-frame";
import { chartTheme } from "./theme";

export type WetBulbBinRow = {
  /** Bin label in the display unit, e.g. "62" (°F) or "17" (°C): the bin's lower edge. */
  bin: string;
  wetHours: number;
  dryHours: number;
};

/**
 * Hours of the year per wet-bulb bin; for the closed-circuit cooler, the hours it ran dry (spray off)
 * are split out, which is where its water saving comes from.
 */
export function WetBulbBinsChart({ rows, unit, dryLabel }: { rows: WetBulbBinRow[]; unit: string; dryLabel: string | null }) {
  const keys = dryLabel ? ["dryHours", "wetHours"] : ["wetHours"];
  const labels: Record<string, string> = { wetHours: dryLabel ? "Spray on (wet)" : "Hours", dryHours: dryLabel ?? "Dry" };
  return (
    <>
    <ChartFrame title="Wet-bulb bins" unit={`hours per ${unit} bin`} testId="chart-wet-bulb-bins" height={280}>
      <ResponsiveBar
        data={rows}
        keys={keys}
        indexBy="bin"
        margin={{ top: 8, right: 8, bottom: 44, left: 48 }}
        padding={0.1}
        colors={({ id }) => (id === "dryHours" ? "#d9854a" : "#1f8a8f")}
        theme={chartTheme}
        enableLabel={false}
        axisBottom={{
          legend: `Wet-bulb, ${unit}`,
          legendOffset: 32,
          legendPosition: "middle",
          tickValues: rows.filter((_, i) => i % Math.max(1, Math.ceil(rows.length / 12)) === 0).map((r) => r.bin),
        }}
        tooltipLabel={(d) => `${labels[String(d.id)] ?? d.id}, bin ${d.indexValue} ${unit}`}
        valueFormat={(v) => `${Math.round(v).toLocaleString("en-US")} h`}
        role="img"
        ariaLabel="Hours per wet-bulb bin"
      />
    </ChartFrame>
    <ul className="mt-1 flex flex-wrap gap-x-4 text-xs text-ink-soft" aria-label="Legend">
      {keys.map((k) => (
        <li key={k} className="flex items-center gap-1.5">
          <span aria-hidden="true" className="inline-block h-2.5 w-2.5 rounded-sm" style={{ background: k === "dryHours" ? "#d9854a" : "#1f8a8f" }} />
          {labels[k] ?? k}
        </li>
      ))}
    </ul>
    </>
  );
}
