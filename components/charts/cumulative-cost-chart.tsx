"use client";

import { ResponsiveLine } from "@nivo/line";
import { ChartFrame } from "./chart-frame";
import { OPTION_COLORS, chartTheme, compactNumber } from "./theme";

export interface CumulativeSeries {
  optionId: string;
  label: string;
  /** Cumulative present value at the end of each year, year 0 (first cost) first. */
  points: { year: number; value: number }[];
}

/** Cumulative discounted cost per option: where the lines cross, the dearer first cost has paid back. */
export function CumulativeCostChart({ series, currency }: { series: CumulativeSeries[]; currency: string }) {
  const data = series.map((s) => ({ id: s.label, data: s.points.map((p) => ({ x: p.year, y: p.value })) }));
  return (
    <ChartFrame title="Cumulative discounted cost" unit={`${currency}, present value`} testId="chart-cumulative" height={300}>
      <ResponsiveLine
        data={data}
        margin={{ top: 12, right: 16, bottom: 44, left: 64 }}
        xScale={{ type: "linear", min: 0, max: "auto" }}
        yScale={{ type: "linear", min: "auto", max: "auto" }}
        colors={OPTION_COLORS}
        theme={chartTheme}
        enablePoints={false}
        lineWidth={2}
        useMesh
        axisBottom={{ legend: "Study year", legendOffset: 34, legendPosition: "middle" }}
        axisLeft={{ format: (v: number) => compactNumber(v) }}
        yFormat={(v) => `${Math.round(Number(v)).toLocaleString("en-US")} ${currency}`}
        legends={[
          { anchor: "top-left", direction: "column", translateX: 12, itemWidth: 200, itemHeight: 16, symbolSize: 10, symbolShape: "square" },
        ]}
        role="img"
        ariaLabel="Cumulative discounted cost per option by study year"
      />
    </ChartFrame>
  );
}
