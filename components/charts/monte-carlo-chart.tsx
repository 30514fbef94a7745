"use client";

import { ResponsiveBar } from "@nivo/bar";
import { ChartFrame } from "./chart-frame";
import { chartTheme } from "./theme";

export interface HistogramRow {
  /** Bin centre, in the currency. */
  from: number;
  to: number;
  count: number;
}

/** Distribution of net savings over the Monte Carlo draws; bars left of zero are draws where the alternative loses. */
export function MonteCarloChart({
  bins,
  currency,
  pairLabel,
  draws,
}: {
  bins: HistogramRow[];
  currency: string;
  pairLabel: string;
  draws: number;
}) {
  const fmt = (v: number) => `${(v / 1000).toLocaleString("en-US", { maximumFractionDigits: 0 })}k`;
  const data = bins.map((b) => ({ bin: fmt((b.from + b.to) / 2), share: draws > 0 ? (100 * b.count) / draws : 0, negative: b.to <= 0 ? 1 : 0 }));
  return (
    <ChartFrame title={`Net savings distribution — ${pairLabel}`} unit={`share of ${draws.toLocaleString("en-US")} draws, % per bin`} testId="chart-monte-carlo" height={260}>
      <ResponsiveBar
        data={data}
        keys={["share"]}
        indexBy="bin"
        margin={{ top: 8, right: 8, bottom: 48, left: 44 }}
        padding={0.05}
        colors={({ data: d }) => (d.negative ? "#a9b7c1" : "#1f8a8f")}
        theme={chartTheme}
        enableLabel={false}
        axisBottom={{
          // The ticks carry their own "k" (thousands), so the legend names only the currency.
          legend: `Net savings at the bin centre, ${currency}`,
          legendOffset: 38,
          legendPosition: "middle",
          tickValues: data.filter((_, i) => i % Math.max(1, Math.ceil(data.length / 8)) === 0).map((d) => d.bin),
        }}
        valueFormat={(v) => `${v.toFixed(1)} %`}
        role="img"
        ariaLabel={`Distribution of net savings for ${pairLabel}`}
      />
    </ChartFrame>
  );
}
