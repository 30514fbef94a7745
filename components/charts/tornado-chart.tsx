"use client";

import { ResponsiveBar } from "@nivo/bar";
import { ChartFrame } from "./chart-frame";
import { chartTheme, compactNumber } from "./theme";

export interface TornadoRow {
  /** e.g. "Electricity price ×0.8 … ×1.25" */
  label: string;
  /** Change of net savings against the base case at the low and at the high value. */
  low: number;
  high: number;
}

/** Swing of net savings (alternative against base) per input, largest swing on top. */
export function TornadoChart({ rows, currency, pairLabel }: { rows: TornadoRow[]; currency: string; pairLabel: string }) {
  // nivo draws the first row at the bottom of a horizontal chart
  const data = [...rows].reverse().map((r) => ({ input: r.label, low: r.low, high: r.high }));
  // A symmetric scale keeps zero in the middle, so bars that lower the savings never run under the labels.
  const m = Math.max(1, ...rows.flatMap((r) => [Math.abs(r.low), Math.abs(r.high)])) * 1.05;
  // Room for the longest input label (11 px text, about 6 px a character) so none is cut at the left edge.
  const left = Math.min(280, Math.max(150, Math.ceil(6 * Math.max(0, ...rows.map((r) => r.label.length))) + 12));
  return (
    <ChartFrame title={`Tornado — ${pairLabel}`} unit={`change of net savings, ${currency}`} testId="chart-tornado" height={Math.max(200, 34 * rows.length + 60)}>
      <ResponsiveBar
        data={data}
        keys={["low", "high"]}
        indexBy="input"
        layout="horizontal"
        groupMode="grouped"
        innerPadding={0}
        margin={{ top: 8, right: 16, bottom: 40, left }}
        padding={0.3}
        valueScale={{ type: "linear", min: -m, max: m }}
        colors={({ id }) => (id === "low" ? "#7cc4c6" : "#bf6a2e")}
        theme={chartTheme}
        enableLabel={false}
        enableGridX
        enableGridY={false}
        // Five ticks: a half-width chart has no room for nivo's default dozen (their labels ran together).
        axisBottom={{ format: (v: number) => compactNumber(v), tickValues: 5 }}
        tooltipLabel={(d) => `${d.indexValue} at its ${d.id} value`}
        valueFormat={(v) => `${v >= 0 ? "+" : ""}${Math.round(v).toLocaleString("en-US")} ${currency}`}
        markers={[{ axis: "x", value: 0, lineStyle: { stroke: "#17222b", strokeWidth: 1 } }]}
        legends={[
          {
            dataFrom: "keys",
            anchor: "bottom-right",
            direction: "row",
            translateY: 38,
            itemWidth: 110,
            itemHeight: 14,
            symbolSize: 10,
            data: [
              { id: "low", label: "Input at low", color: "#7cc4c6" },
              { id: "high", label: "Input at high", color: "#bf6a2e" },
            ],
          },
        ]}
        role="img"
        ariaLabel={`Tornado of net savings for ${pairLabel}`}
      />
    </ChartFrame>
  );
}
