/** Shared look of LoopLedger's charts: the tokens of tailwind.config.ts, tabular numbers in the mono face. */
export const CHART_COLORS = {
  ink: "#17222b",
  inkSoft: "#3d4b57",
  inkFaint: "#6b7a86",
  line: "#d3dce2",
  basin: "#1f8a8f",
  copper: "#bf6a2e",
  caution: "#a86a00",
  ok: "#1f7a45",
  danger: "#b42323",
};

/**
 * One colour per option, in option order (teal, copper, slate, light teal) — the PDF report's order. Amber as
 * the fourth was hard to tell from copper in the cumulative-cost lines; light teal differs in lightness too.
 */
export const OPTION_COLORS = ["#157277", "#bf6a2e", "#56697a", "#7cc4c6"];

/** Cost categories, stacked bottom to top. */
export const CATEGORY_COLORS: Record<string, string> = {
  investment: "#0a3436",
  energy: "#1f8a8f",
  demand: "#7cc4c6",
  water: "#3f7fbf",
  sewer: "#8fb3d9",
  chemicals: "#a86a00",
  upkeep: "#bf6a2e",
  carbon: "#5b6b3a",
  replacements: "#86461b",
  residual: "#a9b7c1",
};

export const WATER_COLORS: Record<string, string> = { evaporation: "#1f8a8f", drift: "#7cc4c6", blowdown: "#3f7fbf" };

export const chartTheme = {
  background: "transparent",
  text: { fontSize: 11, fill: CHART_COLORS.inkSoft, fontFamily: "var(--font-sans), system-ui, sans-serif" },
  axis: {
    domain: { line: { stroke: CHART_COLORS.line, strokeWidth: 1 } },
    ticks: { line: { stroke: CHART_COLORS.line, strokeWidth: 1 }, text: { fontSize: 11, fill: CHART_COLORS.inkSoft } },
    legend: { text: { fontSize: 11, fill: CHART_COLORS.ink, fontWeight: 600 } },
  },
  grid: { line: { stroke: "#e9eef1", strokeWidth: 1 } },
  legends: { text: { fontSize: 11, fill: CHART_COLORS.inkSoft } },
  tooltip: {
    container: { fontSize: 12, background: "#ffffff", color: CHART_COLORS.ink, border: `1px solid ${CHART_COLORS.line}`, borderRadius: 6 },
  },
};

/** Compact axis numbers: 1 250 000 → 1.25M, 12 000 → 12k. */
export function compactNumber(v: number): string {
  const a = Math.abs(v);
  if (a >= 1e9) return `${trim(v / 1e9)}G`;
  if (a >= 1e6) return `${trim(v / 1e6)}M`;
  if (a >= 1e4) return `${trim(v / 1e3)}k`;
  return trim(v);
}

function trim(v: number): string {
  const a = Math.abs(v);
  const digits = a >= 100 ? 0 : a >= 10 ? 1 : 2;
  return Number(v.toFixed(digits)).toString();
}
