/**
 * Plain-text summary of an EconomicsResult for command-line tools (`npm run analyze`): LCC by category
 * per option, the measures against the base, the tornado, the break-evens and the Monte Carlo.
 */
import { COST_CATEGORIES, COST_CATEGORY_LABELS, type EconomicsResult } from "./types";
import { enUsNumber } from "../en-us";

const money = (x: number) => enUsNumber(Math.round(x));
const pct = (x: number | null, digits = 1) => (x === null ? "—" : `${(100 * x).toFixed(digits)} %`);
const num = (x: number | null, digits = 2) => (x === null ? "—" : x.toFixed(digits));

function table(rows: string[][]): string[] {
  const widths: number[] = [];
  for (const r of rows) r.forEach((c, i) => (widths[i] = Math.max(widths[i] ?? 0, c.length)));
  return rows.map((r) =>
    r.map((c, i) => (i === 0 ? c.padEnd(widths[i] ?? 0) : c.padStart(widths[i] ?? 0))).join("  "),
  );
}

/** Plain-text summary of an economics result (life-cycle costs, measures, sensitivity, Monte Carlo) for the command line. */
export function formatEconomicsSummary(r: EconomicsResult): string {
  const label = new Map(r.options.map((o) => [o.optionId, o.label]));
  const name = (id: string) => label.get(id) ?? id;
  const out: string[] = [];
  out.push(
    `Life-cycle cost — ${r.analysis} analysis, ${r.studyPeriodYears} years from ${r.baseYear}, ` +
      `discount rate ${pct(r.discountRate, 2)} (${r.discounting === "midYear" ? "mid-year" : "end-of-year"}), base: ${name(r.baseOptionId)}`,
  );
  out.push(
    ...table([
      ["present value", ...r.options.map((o) => o.label)],
      ...COST_CATEGORIES.map((c) => [
        COST_CATEGORY_LABELS[c],
        ...r.options.map((o) => money(o.pvByCategory[c])),
      ]),
      ["LCC", ...r.options.map((o) => money(o.lcc))],
      ["annualised cost", ...r.options.map((o) => money(o.annualisedCost))],
      ["year-1 operating cost", ...r.options.map((o) => money(o.firstYearOperatingCost))],
    ]),
  );
  out.push(`Lowest LCC: ${name(r.lowestLccOptionId)}`);
  for (const c of r.comparisons) {
    out.push(
      `${name(c.alternativeOptionId)} vs ${name(c.baseOptionId)}: net savings ${money(c.netSavings)}, SIR ${num(c.sir)}, ` +
        `AIRR ${pct(c.airr, 2)}, IRR ${pct(c.irr, 2)}; payback of ${name(c.paybackOfOptionId)}'s extra first cost ` +
        `${money(c.extraFirstCost)}: ${num(c.simplePaybackYears, 1)} yr simple, ${num(c.discountedPaybackYears, 1)} yr discounted`,
    );
    for (const note of [c.sirNote, c.paybackNote, c.irrNote]) if (note) out.push(`  · ${note}`);
  }
  if (r.sensitivity) {
    for (const t of r.sensitivity.tornado) {
      out.push(
        `Tornado — net savings of ${name(t.alternativeOptionId)} vs ${name(t.baseOptionId)} (base ${money(t.baseNetSavings)}):`,
      );
      out.push(
        ...table(
          t.bars.map((b) => [
            `  ${b.label}`,
            b.mode === "factor"
              ? `×${b.low} … ×${b.high}`
              : b.mode === "delta"
                ? `${b.low >= 0 ? "+" : ""}${b.low} … +${b.high}`
                : `${num(b.low, 1)} … ${num(b.high, 1)}`,
            b.skippedReason
              ? `skipped: ${b.skippedReason}`
              : `${money(b.netSavingsAtLow)} … ${money(b.netSavingsAtHigh)}`,
            b.skippedReason ? "" : `swing ${money(b.swing)}`,
          ]),
        ),
      );
    }
    out.push(`Break-even (${r.sensitivity.physicsReruns} physics re-runs for the tornado):`);
    for (const b of r.sensitivity.breakEven)
      out.push(`  ${name(b.alternativeOptionId)} vs ${name(b.baseOptionId)}: ${b.note}`);
  }
  if (r.monteCarlo) {
    const m = r.monteCarlo;
    out.push(
      `Monte Carlo — ${enUsNumber(m.draws)} draws, seed ${m.seed}, inputs: ${m.sampledInputs.join(", ") || "none"}`,
    );
    out.push(
      `  probability of lowest LCC: ${r.options.map((o) => `${o.label} ${pct(m.probabilityLowest[o.optionId] ?? 0, 1)}`).join(", ")}`,
    );
    for (const ns of m.netSavings) {
      out.push(
        `  net savings ${name(ns.alternativeOptionId)} vs ${name(ns.baseOptionId)}: P10 ${money(ns.p10)}, P50 ${money(ns.p50)}, ` +
          `P90 ${money(ns.p90)}, P(savings > 0) ${pct(ns.probabilityPositive, 1)}`,
      );
    }
    for (const n of m.notes) out.push(`  · ${n}`);
  }
  for (const w of r.warnings) out.push(`! ${w.message}`);
  return out.join("\n");
}
