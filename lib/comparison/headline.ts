/**
 * The comparison's headline in plain words, from the economics result: which option has the lowest
 * life-cycle cost, by how much, the payback of its extra first cost, and what would make it lose its lead
 * (the break-evens). Pure: the page and the what-if panel both call it.
 */
import type { BreakEvenResult, EconomicsResult, OptionComparison, OptionEconomics } from "@/lib/engine/economics/types";
import { formatNumber, formatQuantity, type UnitSystem } from "@/lib/units";
import { firstCostsMissingLabels } from "@/lib/scenarios/first-costs";

export interface Headline {
  winnerOptionId: string;
  winnerLabel: string;
  runnerUpOptionId: string | null;
  runnerUpLabel: string | null;
  /** LCC(runner-up) − LCC(winner), ≥ 0. */
  marginLcc: number;
  marginPercent: number | null;
  /** The main sentence. */
  lead: string;
  /** The payback sentence (the winner's extra first cost against the cheapest-to-buy option). */
  payback: string;
  /** What would flip the ranking: one phrase per break-even that found a tie, and the sentence joining them. */
  flips: string[];
  flipSummary: string;
  /** Labels of the options without first costs: while any, there is no life-cycle winner. */
  firstCostsMissing: string[];
}

export function money(v: number, currency: string): string {
  const a = Math.abs(v);
  const text = a >= 1e6 ? `${formatNumber(v / 1e6, { sig: 3 })} million` : formatNumber(v, { decimals: 0 });
  return `${currency} ${text}`;
}

const years = (v: number | null) => (v === null ? null : `${formatNumber(v, { decimals: 1 })} years`);

/** The comparison between two options, whichever of them the economics used as its base. */
export function findComparison(e: EconomicsResult, a: string, b: string): { c: OptionComparison; flipped: boolean } | null {
  for (const c of e.comparisons) {
    if (c.baseOptionId === a && c.alternativeOptionId === b) return { c, flipped: false };
    if (c.baseOptionId === b && c.alternativeOptionId === a) return { c, flipped: true };
  }
  return null;
}

function ranked(e: EconomicsResult): OptionEconomics[] {
  return [...e.options].sort((x, y) => x.lcc - y.lcc);
}

export function buildHeadline(e: EconomicsResult, system: UnitSystem, currency: string): Headline {
  const order = ranked(e);
  const winner = order[0];
  const none = { winnerOptionId: "", winnerLabel: "", runnerUpOptionId: null, runnerUpLabel: null, marginLcc: 0, marginPercent: null, flips: [], flipSummary: "" };
  if (!winner) return { ...none, lead: "No option to compare.", payback: "", firstCostsMissing: [] };
  const missing = firstCostsMissingLabels(e);
  if (missing.length > 0) {
    // No life-cycle ranking without every first cost: say so, and give the yearly operating costs, which stand.
    const byOperating = [...e.options].sort((x, y) => x.firstYearOperatingCost - y.firstYearOperatingCost);
    const low = byOperating[0] ?? winner;
    const next = byOperating[1];
    return {
      ...none,
      lead: `First costs missing for ${missing.join(", ")}: the life-cycle comparison waits for them.`,
      payback:
        `Meanwhile the ${low.label.toLowerCase()} has the lowest operating cost in the first year: ${money(low.firstYearOperatingCost, currency)}` +
        (next ? `, ${money(next.firstYearOperatingCost - low.firstYearOperatingCost, currency)} less than the ${next.label.toLowerCase()}` : "") +
        ` (energy, water, sewer, chemicals and upkeep). Enter the first costs from the selections to see the life-cycle cost, net savings, SIR, AIRR and payback.`,
      firstCostsMissing: missing,
    };
  }
  const runnerUp = order[1] ?? null;
  const margin = runnerUp ? runnerUp.lcc - winner.lcc : 0;
  const pct = runnerUp && runnerUp.lcc !== 0 ? (100 * margin) / runnerUp.lcc : null;
  const period = `${e.studyPeriodYears} years`;
  const basis = e.analysis === "real" ? "constant" : "then-current";
  const lead = runnerUp
    ? `Over ${period}, the ${winner.label.toLowerCase()} has the lowest life-cycle cost: ${money(winner.lcc, currency)} in present value (${basis} ${currency} at ${formatNumber(100 * e.discountRate, { decimals: 1 })} %), ${money(margin, currency)}${pct !== null ? ` (${formatNumber(pct, { decimals: 1 })} %)` : ""} less than the ${runnerUp.label.toLowerCase()}.`
    : `Over ${period}, the ${winner.label.toLowerCase()} costs ${money(winner.lcc, currency)} in present value.`;

  // Payback: against the option that is cheapest to buy.
  const cheapestToBuy = [...e.options].sort((x, y) => x.firstCost - y.firstCost)[0] ?? winner;
  let payback: string;
  if (cheapestToBuy.optionId === winner.optionId || cheapestToBuy.firstCost === winner.firstCost) {
    payback = `It is also the cheapest to buy (${money(winner.firstCost, currency)}), so it has no extra first cost to pay back.`;
  } else {
    const pair = findComparison(e, cheapestToBuy.optionId, winner.optionId);
    const extra = winner.firstCost - cheapestToBuy.firstCost;
    const simple = years(pair?.c.simplePaybackYears ?? null);
    const discounted = years(pair?.c.discountedPaybackYears ?? null);
    payback =
      `Its extra first cost of ${money(extra, currency)} over the ${cheapestToBuy.label.toLowerCase()} ` +
      (simple ? `pays back in ${simple}${discounted ? ` (${discounted} discounted)` : " (not within the study period once discounted)"}.` : "does not pay back within the study period.") ;
  }

  const flips: string[] = [];
  let flipSummary = "";
  if (runnerUp && e.sensitivity) {
    const related = e.sensitivity.breakEven.filter(
      (b) =>
        (b.baseOptionId === winner.optionId && b.alternativeOptionId === runnerUp.optionId) ||
        (b.baseOptionId === runnerUp.optionId && b.alternativeOptionId === winner.optionId),
    );
    for (const b of related) {
      const s = flipPhrase(b, system, currency);
      if (s) flips.push(s);
    }
    flipSummary =
      flips.length > 0
        ? `The ${runnerUp.label.toLowerCase()} would become the cheaper one if ${flips.join(", or if ")}, other inputs unchanged.`
        : `No tie with the ${runnerUp.label.toLowerCase()} was found within the break-even search ranges: the ranking holds across them.`;
  }
  return {
    winnerOptionId: winner.optionId,
    winnerLabel: winner.label,
    runnerUpOptionId: runnerUp?.optionId ?? null,
    runnerUpLabel: runnerUp?.label ?? null,
    marginLcc: margin,
    marginPercent: pct,
    lead,
    payback,
    flips,
    flipSummary,
    firstCostsMissing: [],
  };
}

function flipPhrase(b: BreakEvenResult, system: UnitSystem, currency: string): string | null {
  if (b.value === null) return null;
  const way = b.value < 1 ? "fell below" : "rose above";
  switch (b.input) {
    case "waterAndSewerPrice":
      return b.absoluteValue === null
        ? null
        : `water and sewer together ${way} ${formatQuantity("pricePerM3", b.absoluteValue, system, { currency, sig: 3 })} (×${formatNumber(b.value, { sig: 3 })} the entered prices)`;
    case "electricityPrice":
      return b.absoluteValue === null
        ? null
        : `electricity ${way} a mean ${formatQuantity("pricePerKWh", b.absoluteValue, system, { currency, sig: 3 })} (×${formatNumber(b.value, { sig: 3 })})`;
    case "cyclesOfConcentration":
      return `every wet loop ran at ${formatNumber(b.value, { sig: 3 })} cycles of concentration`;
    case "firstCostPremium":
      return b.absoluteValue === null
        ? null
        : `the extra first cost were ${money(b.absoluteValue, currency)} (×${formatNumber(b.value, { sig: 3 })} the quoted difference)`;
  }
}

export { designDaySentence } from "@/lib/reports/design-day";
