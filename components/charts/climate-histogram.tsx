"use client";

import { Bar } from "@nivo/bar";
import { formatNumber, fromSI, unitLabel, type UnitSystem } from "@/lib/units";
import { ClimateChartFrame, climateChartTheme } from "./climate-sizing";

export interface ClimateHistogramProps {
  /** 1 K wet-bulb bands (°C) with their hours, as stored in the climate summary. */
  bars: { centerC: number; lowC: number; highC: number; hours: number }[];
  unitSystem: UnitSystem;
  /** The 0.4 % design wet-bulb, °C, marked on the chart. */
  designWetBulb04C?: number | null;
  height?: number;
}

/** Hours per 1 K wet-bulb band, labelled in the project's units. */
export function ClimateHistogram({ bars, unitSystem, designWetBulb04C, height = 300 }: ClimateHistogramProps) {
  const unit = unitLabel("temperatureC", unitSystem);
  const label = (c: number) => formatNumber(fromSI("temperatureC", c, unitSystem), { decimals: 0, grouping: false });
  const data = bars.map((b) => ({ band: label(b.centerC), hours: b.hours, lowC: b.lowC, highC: b.highC }));
  const designBand =
    designWetBulb04C != null ? bars.find((b) => designWetBulb04C >= b.lowC && designWetBulb04C < b.highC) : undefined;
  // Every label at tablet width would overlap: keep about one per 28 px.
  const every = (w: number) => Math.max(1, Math.ceil((data.length * 28) / Math.max(1, w - 90)));
  return (
    <ClimateChartFrame height={height} label={`Wet-bulb histogram: hours in each 1 K band, ${unit}`}>
      {(width) => (
        <Bar
          width={width}
          height={height}
          data={data}
          keys={["hours"]}
          indexBy="band"
          margin={{ top: 16, right: 16, bottom: 48, left: 60 }}
          padding={0.15}
          colors={["#1f8a8f"]}
          enableLabel={false}
          theme={climateChartTheme}
          axisBottom={{
            tickSize: 4,
            tickPadding: 4,
            tickValues: data.filter((_, i) => i % every(width) === 0).map((d) => d.band),
            legend: unitSystem === "IP" ? `Wet-bulb band centre, ${unit} (bands 1 K = 1.8 °F wide)` : `Wet-bulb band centre, ${unit} (1 K bands)`,
            legendPosition: "middle",
            legendOffset: 36,
          }}
          axisLeft={{ tickSize: 4, tickPadding: 4, legend: "Hours per year", legendPosition: "middle", legendOffset: -48 }}
          markers={
            designBand
              ? [
                  {
                    axis: "x",
                    value: label(designBand.centerC),
                    lineStyle: { stroke: "#bf6a2e", strokeWidth: 2, strokeDasharray: "4 3" },
                    legend: "0.4 % design",
                    legendPosition: "top-left",
                    textStyle: { fill: "#86461b", fontSize: 11 },
                  },
                ]
              : []
          }
          tooltip={({ data: d }) => (
            <div className="rounded-md border border-line bg-paper-raised px-2 py-1 text-xs shadow-panel">
              <span className="font-mono">
                {formatNumber(fromSI("temperatureC", d.lowC as number, unitSystem), { decimals: 1 })}…
                {formatNumber(fromSI("temperatureC", d.highC as number, unitSystem), { decimals: 1 })} {unit}
              </span>
              : <strong className="font-mono">{formatNumber(d.hours as number, { decimals: 0 })} h</strong>
            </div>
          )}
          role="img"
          ariaLabel="Wet-bulb histogram"
          barAriaLabel={(d) => `${d.indexValue} ${unit}: ${d.formattedValue} hours`}
          animate={false}
        />
      )}
    </ClimateChartFrame>
  );
}
