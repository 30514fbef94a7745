"use client";

import { useEffect, useRef, useState, type ReactNode } from "react";

/**
 * Gives a fixed-height chart the width of its container. The first render (on the server too) uses
 * `initialWidth`, so the SVG exists before hydration; afterwards the chart follows the container.
 */
export function ClimateChartFrame({
  height,
  initialWidth = 760,
  label,
  children,
}: {
  height: number;
  initialWidth?: number;
  label: string;
  children: (width: number) => ReactNode;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(initialWidth);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const update = () => setWidth(Math.max(280, Math.floor(el.clientWidth)));
    update();
    const ro = new ResizeObserver(update);
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  return (
    <div ref={ref} role="figure" aria-label={label} className="w-full overflow-hidden" style={{ height }}>
      {children(width)}
    </div>
  );
}

/** Chart theme from LoopLedger's tokens (tailwind.config.ts): ink text, line grid, mono tick labels. */
export const climateChartTheme = {
  text: { fontSize: 11, fill: "#3d4b57", fontFamily: "var(--font-sans), system-ui, sans-serif" },
  axis: {
    ticks: { text: { fontSize: 11, fill: "#3d4b57", fontFamily: "var(--font-mono), ui-monospace, monospace" }, line: { stroke: "#a9b7c1" } },
    legend: { text: { fontSize: 12, fill: "#17222b", fontWeight: 600 } },
    domain: { line: { stroke: "#a9b7c1", strokeWidth: 1 } },
  },
  grid: { line: { stroke: "#d3dce2", strokeWidth: 1 } },
  tooltip: { container: { fontSize: 12, background: "#ffffff", color: "#17222b", border: "1px solid #d3dce2", borderRadius: 6 } },
};
