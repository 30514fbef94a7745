import type { ReactNode } from "react";

/**
 * A fixed-height box with a caption that states what is drawn and in which unit. `summary` is a plain-text
 * reading of the chart for screen readers and for anyone who prefers the numbers.
 */
export function ChartFrame({
  title,
  unit,
  summary,
  height = 280,
  children,
  testId,
}: {
  title: string;
  unit: string;
  summary?: string;
  height?: number;
  children: ReactNode;
  testId?: string;
}) {
  return (
    <figure className="min-w-0" data-testid={testId}>
      <figcaption className="mb-1 flex items-baseline justify-between gap-2 text-sm">
        <span className="font-semibold text-ink">{title}</span>
        <span className="text-xs text-ink-faint">{unit}</span>
      </figcaption>
      <div style={{ height }} className="w-full" role="img" aria-label={`${title} (${unit})${summary ? `: ${summary}` : ""}`}>
        {children}
      </div>
    </figure>
  );
}
