/**
 * The one-page summary in plain words, built from the stored result: which option has the lowest
 * life-cycle cost, by how much, how quickly its extra first cost pays back, and what would flip the answer.
 * Pure; shared by the PDF and the tests (which look for these exact strings in the PDF's text).
 */
import type { UnitSystem } from "@/lib/auth/roles";
import type {
  BreakEvenResult,
  OptionComparison,
  OptionEconomics,
  TornadoBar,
} from "@/lib/engine/economics/types";
import { firstCostsMissingLabels } from "@/lib/scenarios/first-costs";
import { fmtMoney, fmtNumber, fmtPercent, fmtSignificant, fmtYears } from "./format";
import type { ReportEngineResult } from "./types";
import { convert, unitOf } from "./units";

export interface OptionSummaryRow {
  optionId: string;
  label: string;
  isBase: boolean;
  isLowest: boolean;
  /** No first cost entered: its first cost, LCC, annualised cost and measures are shown as missing. */
  firstCostMissing: boolean;
  firstCost: number;
  lcc: number;
  annualisedCost: number;
  firstYearOperatingCost: number;
  /** Against the base option; undefined for the base itself. */
  comparison?: OptionComparison;
  makeupM3PerYear: number;
  energyKWhPerYear: number;
  probabilityLowest?: number;
}

export interface ReportSummary {
  rows: OptionSummaryRow[];
  baseOptionId: string;
  lowestOptionId: string;
  /** The pair the recommendation turns on: base vs the lowest, or base vs the runner-up when the base wins. */
  keyComparison?: OptionComparison;
  headline: string;
  paragraphs: string[];
  flips: string[];
  noTies: string[];
  /** Labels of the options without first costs; while any, the report gives no life-cycle figures. */
  firstCostsMissing: string[];
}

function economicsOf(r: ReportEngineResult, id: string): OptionEconomics | undefined {
  return r.economics.options.find((o) => o.optionId === id);
}

export function labelOf(r: ReportEngineResult, id: string): string {
  return economicsOf(r, id)?.label ?? id;
}

/** Plain description of a tornado end: "×1.50", "+2.0 points", "6.0 cycles". */
export function tornadoValueText(bar: Pick<TornadoBar, "mode" | "input">, v: number): string {
  if (bar.mode === "factor") return `×${fmtNumber(v, 2)}`;
  if (bar.mode === "delta") return `${v >= 0 ? "+" : "-"}${fmtNumber(Math.abs(v) * 100, 1)} points`;
  return bar.input === "cyclesOfConcentration" ? `${fmtNumber(v, 1)} cycles` : fmtSignificant(v);
}

function breakEvenText(be: BreakEvenResult, currency: string, system: UnitSystem): string | null {
  if (be.value === null) return null;
  switch (be.input) {
    case "waterAndSewerPrice": {
      const abs =
        be.absoluteValue === null
          ? ""
          : ` (${fmtMoney(convert("pricePerM3", be.absoluteValue, system), currency, 2)} per ${unitOf("waterVolumeM3", system)}, water and sewer together)`;
      return `Water and sewer prices: the two options cost the same over their life at ×${fmtNumber(be.value, 2)} the entered prices${abs}.`;
    }
    case "electricityPrice": {
      const abs =
        be.absoluteValue === null ? "" : ` (a mean of ${fmtMoney(be.absoluteValue, currency, 3)} per kWh)`;
      return `Electricity price: they tie at ×${fmtNumber(be.value, 2)} the entered energy prices${abs}.`;
    }
    case "cyclesOfConcentration":
      return `Cycles of concentration: they tie at ${fmtNumber(be.value, 1)} cycles in every wet loop.`;
    case "firstCostPremium": {
      const abs =
        be.absoluteValue === null ? "" : ` (an extra first cost of ${fmtMoney(be.absoluteValue, currency)})`;
      return `First-cost premium: they tie at ×${fmtNumber(be.value, 2)} the alternative's extra first cost${abs}.`;
    }
  }
}

const BREAK_EVEN_NAMES: Record<BreakEvenResult["input"], string> = {
  waterAndSewerPrice: "water and sewer prices",
  electricityPrice: "electricity price",
  cyclesOfConcentration: "cycles of concentration",
  firstCostPremium: "first-cost premium",
};

export function buildSummary(r: ReportEngineResult, currency: string, system: UnitSystem): ReportSummary {
  const eco = r.economics;
  const lowestId = eco.lowestLccOptionId;
  const baseId = eco.baseOptionId;
  const mc = eco.monteCarlo;
  const rows: OptionSummaryRow[] = eco.options.map((o) => {
    const phys = r.physics.find((p) => p.optionId === o.optionId);
    const comparison = eco.comparisons.find((c) => c.alternativeOptionId === o.optionId);
    const row: OptionSummaryRow = {
      optionId: o.optionId,
      label: o.label,
      isBase: o.optionId === baseId,
      isLowest: o.optionId === lowestId,
      firstCostMissing: o.firstCostMissing === true,
      firstCost: o.firstCost,
      lcc: o.lcc,
      annualisedCost: o.annualisedCost,
      firstYearOperatingCost: o.firstYearOperatingCost,
      makeupM3PerYear: phys?.waterM3.makeup ?? 0,
      energyKWhPerYear: phys?.energyKWh.total ?? 0,
    };
    if (comparison) row.comparison = comparison;
    const p = mc?.probabilityLowest[o.optionId];
    if (p !== undefined) row.probabilityLowest = p;
    return row;
  });

  const missing = firstCostsMissingLabels(eco);
  if (missing.length > 0) {
    const byOperating = [...rows].sort((a, b) => a.firstYearOperatingCost - b.firstYearOperatingCost);
    const low = byOperating[0];
    return {
      rows: rows.map((x) => ({ ...x, isLowest: false })),
      baseOptionId: baseId,
      lowestOptionId: "",
      headline: `First costs missing for ${missing.join(", ")}: the life-cycle comparison waits for them.`,
      paragraphs: [
        "This report gives each option's water, energy and yearly operating costs. The life-cycle cost, net savings, savings-to-investment ratio, adjusted internal rate of return and payback need every option's first cost from its selection; they are left out until those are entered.",
        ...(low
          ? [`In the first year, ${low.label} has the lowest operating cost (energy, water, sewer, chemicals and upkeep): ${fmtMoney(low.firstYearOperatingCost, currency)}.`]
          : []),
      ],
      flips: [],
      noTies: [],
      firstCostsMissing: missing,
    };
  }
  const sorted = [...rows].sort((a, b) => a.lcc - b.lcc);
  const lowest = rows.find((x) => x.optionId === lowestId) ?? sorted[0];
  const runnerUp = sorted.find((x) => x.optionId !== lowest?.optionId);
  const keyComparison =
    lowestId !== baseId
      ? eco.comparisons.find((c) => c.alternativeOptionId === lowestId)
      : runnerUp
        ? eco.comparisons.find((c) => c.alternativeOptionId === runnerUp.optionId)
        : undefined;

  const paragraphs: string[] = [];
  const basis = eco.analysis === "real" ? "constant (real)" : "then-current (nominal)";
  const headline = lowest ? `${lowest.label} has the lowest life-cycle cost.` : "No option could be costed.";
  if (lowest && runnerUp) {
    const gap = runnerUp.lcc - lowest.lcc;
    const pct = runnerUp.lcc !== 0 ? gap / runnerUp.lcc : 0;
    paragraphs.push(
      `Over the ${eco.studyPeriodYears}-year study period from ${eco.baseYear}, in ${basis} terms at a ${fmtPercent(eco.discountRate)} discount rate, ` +
        `its present-value life-cycle cost is ${fmtMoney(lowest.lcc, currency)}: ${fmtMoney(gap, currency)} (${fmtPercent(pct)}) less than ` +
        `${runnerUp.label} at ${fmtMoney(runnerUp.lcc, currency)}.`,
    );
  } else if (lowest) {
    paragraphs.push(
      `Its present-value life-cycle cost over ${eco.studyPeriodYears} years is ${fmtMoney(lowest.lcc, currency)}.`,
    );
  }
  if (keyComparison) {
    const payer = labelOf(r, keyComparison.paybackOfOptionId);
    const other =
      keyComparison.paybackOfOptionId === keyComparison.baseOptionId
        ? keyComparison.alternativeOptionId
        : keyComparison.baseOptionId;
    if (keyComparison.extraFirstCost > 0) {
      const simple = keyComparison.simplePaybackYears;
      const disc = keyComparison.discountedPaybackYears;
      const back =
        simple === null
          ? "its lower running costs do not pay that back within the study period"
          : `its lower running costs pay that back in ${fmtYears(simple)} (simple payback)` +
            (disc === null
              ? ", but not within the study period once discounted"
              : ` or ${fmtYears(disc)} discounted`);
      paragraphs.push(
        `${payer} costs ${fmtMoney(keyComparison.extraFirstCost, currency)} more to build than ${labelOf(r, other)}; ${back}.`,
      );
    } else {
      paragraphs.push(
        `${labelOf(r, keyComparison.alternativeOptionId)} and ${labelOf(r, keyComparison.baseOptionId)} cost the same to build.`,
      );
    }
    const sir = keyComparison.sir;
    const airr = keyComparison.airr;
    paragraphs.push(
      `Against the base option (${labelOf(r, keyComparison.baseOptionId)}), ${labelOf(r, keyComparison.alternativeOptionId)} has net savings of ` +
        `${fmtMoney(keyComparison.netSavings, currency)}` +
        (sir !== null ? `, a savings-to-investment ratio of ${fmtNumber(sir, 2)}` : "") +
        (airr !== null ? ` and an adjusted internal rate of return of ${fmtPercent(airr)}` : "") +
        ".",
    );
  }
  if (mc && lowest) {
    const p = mc.probabilityLowest[lowest.optionId];
    if (p !== undefined) {
      paragraphs.push(
        `Across ${fmtNumber(mc.draws)} Monte Carlo draws of prices, escalation and first cost, ${lowest.label} had the lowest life-cycle cost in ${fmtPercent(p, 0)} of cases.`,
      );
    }
  }

  const flips: string[] = [];
  const noTies: string[] = [];
  if (keyComparison && eco.sensitivity) {
    for (const be of eco.sensitivity.breakEven) {
      if (
        be.baseOptionId !== keyComparison.baseOptionId ||
        be.alternativeOptionId !== keyComparison.alternativeOptionId
      )
        continue;
      const t = breakEvenText(be, currency, system);
      if (t) flips.push(t);
      else noTies.push(BREAK_EVEN_NAMES[be.input]);
    }
    const pair = eco.sensitivity.tornado.find(
      (p) =>
        p.baseOptionId === keyComparison.baseOptionId &&
        p.alternativeOptionId === keyComparison.alternativeOptionId,
    );
    if (pair) {
      const sign = Math.sign(pair.baseNetSavings);
      for (const bar of pair.bars) {
        if (bar.skippedReason) continue;
        for (const [end, v, ns] of [
          ["low", bar.low, bar.netSavingsAtLow],
          ["high", bar.high, bar.netSavingsAtHigh],
        ] as const) {
          if (Math.sign(ns) !== sign && ns !== 0) {
            const winner = ns > 0 ? labelOf(r, pair.alternativeOptionId) : labelOf(r, pair.baseOptionId);
            flips.push(
              `${bar.label} at its ${end} value (${tornadoValueText(bar, v)}): ${winner} would have the lower life-cycle cost (net savings ${fmtMoney(ns, currency)}).`,
            );
          }
        }
      }
    }
  }
  return {
    rows,
    baseOptionId: baseId,
    lowestOptionId: lowestId,
    ...(keyComparison ? { keyComparison } : {}),
    headline,
    paragraphs,
    flips,
    noTies,
    firstCostsMissing: [],
  };
}
