"use client";

import { HeatMap } from "@nivo/heatmap";
import { formatNumber, fromSI, unitLabel, type UnitSystem } from "@/lib/units";
import { ClimateChartFrame, climateChartTheme } from "./climate-sizing";

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

export interface ClimateHeatmapProps {
  /** 12 × 24 mean wet-bulb, °C (null for a cell with no hours), rows January…December, columns hour 0…23 (hour starting). */
  matrixC: (number | null)[][];
  unitSystem: UnitSystem;
  height?: number;
}

/** Month × hour-of-day mean wet-bulb, shown in the project's units. */
export function ClimateHeatmap({ matrixC, unitSystem, height = 360 }: ClimateHeatmapProps) {
  const unit = unitLabel("temperatureC", unitSystem);
  const data = matrixC.map((row, m) => ({
    id: MONTHS[m] ?? String(m + 1),
    data: row.map((v, h) => ({ x: String(h).padStart(2, "0"), y: v == null ? null : fromSI("temperatureC", v, unitSystem) })),
  }));
  return (
    <ClimateChartFrame height={height} label={`Mean wet-bulb by month and hour of day, ${unit}`}>
      {(width) => (
        <HeatMap
          width={width}
          height={height}
          data={data}
          margin={{ top: 28, right: 90, bottom: 36, left: 44 }}
          valueFormat={(v) => `${formatNumber(v, { decimals: 1 })} ${unit}`}
          axisTop={null}
          axisBottom={{
            tickSize: 3,
            tickPadding: 4,
            tickValues: width < 640 ? ["00", "03", "06", "09", "12", "15", "18", "21"] : undefined,
            legend: "Hour of day (hour starting, local standard time)",
            legendPosition: "middle",
            legendOffset: 30,
          }}
          axisLeft={{ tickSize: 3, tickPadding: 4 }}
          colors={{ type: "sequential", scheme: "blues" }}
          emptyColor="#e9eef1"
          enableLabels={false}
          xInnerPadding={0.04}
          yInnerPadding={0.06}
          theme={climateChartTheme}
          legends={[
            {
              anchor: "right",
              translateX: 30,
              translateY: 0,
              length: Math.max(120, height - 80),
              thickness: 10,
              direction: "column",
              tickPosition: "after",
              tickSize: 3,
              tickSpacing: 4,
              tickOverlap: false,
              tickFormat: (v: number) => formatNumber(v, { decimals: 0 }),
              title: unit,
              titleAlign: "start",
              titleOffset: 4,
            },
          ]}
          animate={false}
          role="img"
          ariaLabel="Mean wet-bulb by month and hour"
        />
      )}
    </ClimateChartFrame>
  );
}
