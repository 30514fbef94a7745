/**
 * Economic measures of NIST Handbook 135 ch. 6 and the ASTM standards it rests on: LCC (E917), net
 * savings (E1074), SIR (E964), AIRR (E1057), payback (E1121), plus an IRR where it is unique.
 */
import { irr, pmt } from "financial";
import { airrFromSir } from "./factors";
import type { CategoryAmounts, OptionComparison, OptionEconomics, YearCashFlow } from "./types";
import { enUsNumber } from "../en-us";

/** Categories that make up the investment-related side of SIR (Handbook 135: I = I₀ + Repl − Res). */
const INVESTMENT_CATEGORIES = ["investment", "replacements", "residual"] as const;
/** Categories of operational savings in SIR (energy, water, OM&R). */
const OPERATIONAL_CATEGORIES = ["energy", "demand", "water", "sewer", "chemicals", "upkeep"] as const;

function sumOf(c: CategoryAmounts, keys: readonly (keyof CategoryAmounts)[]): number {
  let s = 0;
  for (const k of keys) s += c[k];
  return s;
}

/**
 * Annualised cost: the level end-of-year amount over N years with present value LCC,
 * A = LCC·CRF(d, N) = −pmt(d, N, LCC) (`financial.pmt`, numpy-financial sign convention).
 * Source: NIST Handbook 135 (CRF = 1/UPV).
 */
export function annualisedCost(lcc: number, discountRate: number, studyPeriodYears: number): number {
  return -pmt(discountRate, studyPeriodYears, lcc);
}

/** Number of sign changes in a stream, ignoring values that are zero to within `tolerance`. */
export function signChanges(values: readonly number[], tolerance = 0): number {
  let changes = 0;
  let last = 0;
  for (const v of values) {
    if (Math.abs(v) <= tolerance) continue;
    const s = Math.sign(v);
    if (last !== 0 && s !== last) changes++;
    last = s;
  }
  return changes;
}

/**
 * Years until cumulative savings reach the extra first cost, interpolated linearly within the year in
 * which they cross: y − 1 + (X − S_{y−1})/s_y. Null when they never do within the study period.
 * Source: ASTM E1121 (simple and discounted payback); Handbook 135 §6.
 */
export function paybackYears(extraFirstCost: number, yearlySavings: readonly number[]): number | null {
  if (extraFirstCost <= 0) return 0;
  let cumulative = 0;
  for (let i = 0; i < yearlySavings.length; i++) {
    const s = yearlySavings[i] ?? 0;
    if (s > 0 && cumulative + s >= extraFirstCost) return i + (extraFirstCost - cumulative) / s;
    cumulative += s;
  }
  return null;
}

/** Yearly amounts of years 1…N without the residual value (a payback does not count the study-end credit). */
function operatingAndReplacement(
  rows: readonly YearCashFlow[],
  key: "byCategory" | "presentValueByCategory",
): number[] {
  const out: number[] = [];
  for (const r of rows) {
    if (r.yearIndex === 0) continue;
    const c = r[key];
    out.push(sumOf(c, [...OPERATIONAL_CATEGORIES, "replacements"]));
  }
  return out;
}

function formatMoney(x: number): string {
  return enUsNumber(Math.round(x));
}

/**
 * Compare an alternative with the base option (Handbook 135 §6; ASTM E917, E964, E1057, E1121):
 * NS = LCC_base − LCC_alt; ΔI = PV(investment + replacements − residual)_alt − (…)_base;
 * S = PV operational savings (energy, demand, water, sewer, chemicals, upkeep) of the alternative;
 * SIR = S/ΔI; AIRR = (1 + r)·SIR^(1/N) − 1; simple/discounted payback of the extra first cost of the
 * option that costs more to buy; IRR = `financial.irr` of the yearly difference (base − alternative)
 * only when that stream changes sign exactly once.
 */
export function compareOptions(
  base: OptionEconomics,
  alt: OptionEconomics,
  discountRate: number,
  studyPeriodYears: number,
): OptionComparison {
  const netSavings = base.lcc - alt.lcc;
  const deltaInvestmentPV =
    sumOf(alt.pvByCategory, INVESTMENT_CATEGORIES) - sumOf(base.pvByCategory, INVESTMENT_CATEGORIES);
  const operationalSavingsPV =
    sumOf(base.pvByCategory, OPERATIONAL_CATEGORIES) - sumOf(alt.pvByCategory, OPERATIONAL_CATEGORIES);

  let sir: number | null = null;
  let sirNote: string | undefined;
  let airr: number | null = null;
  let airrNote: string | undefined;
  if (deltaInvestmentPV > 0) {
    sir = operationalSavingsPV / deltaInvestmentPV;
    if (sir > 0) airr = airrFromSir(sir, discountRate, studyPeriodYears);
    else airrNote = "The alternative saves nothing on operation (SIR ≤ 0), so the AIRR is undefined.";
  } else {
    sirNote =
      operationalSavingsPV >= 0
        ? "The alternative needs no extra investment and costs no more to run: it dominates; SIR is undefined."
        : "The alternative needs less investment (ΔI ≤ 0), so SIR is undefined; compare by net savings.";
    airrNote = "AIRR needs a positive extra investment.";
  }

  // Payback of the extra first cost, from the point of view of whichever option costs more to buy.
  const altCostsMore = alt.firstCost > base.firstCost;
  const hi = altCostsMore ? alt : base;
  const lo = altCostsMore ? base : alt;
  const extraFirstCost = hi.firstCost - lo.firstCost;
  let simplePaybackYears: number | null = 0;
  let discountedPaybackYears: number | null = 0;
  let paybackNote: string | undefined;
  if (extraFirstCost > 0) {
    const loRows = operatingAndReplacement(lo.cashFlows, "byCategory");
    const hiRows = operatingAndReplacement(hi.cashFlows, "byCategory");
    const loPv = operatingAndReplacement(lo.cashFlows, "presentValueByCategory");
    const hiPv = operatingAndReplacement(hi.cashFlows, "presentValueByCategory");
    simplePaybackYears = paybackYears(
      extraFirstCost,
      loRows.map((v, i) => v - (hiRows[i] ?? 0)),
    );
    discountedPaybackYears = paybackYears(
      extraFirstCost,
      loPv.map((v, i) => v - (hiPv[i] ?? 0)),
    );
    if (simplePaybackYears === null) {
      paybackNote = `${hi.label}'s extra first cost of ${formatMoney(extraFirstCost)} is not recovered within the ${studyPeriodYears}-year study period.`;
    } else if (discountedPaybackYears === null) {
      paybackNote = `${hi.label}'s extra first cost is recovered in undiscounted terms but not once savings are discounted, within ${studyPeriodYears} years.`;
    }
  } else {
    paybackNote = "Both options have the same first cost: there is no extra first cost to pay back.";
  }

  const differenceCashFlows = base.cashFlows.map((r, i) => r.total - (alt.cashFlows[i]?.total ?? 0));
  const scale = Math.max(1, ...differenceCashFlows.map(Math.abs));
  const changes = signChanges(differenceCashFlows, scale * 1e-12);
  let irrValue: number | null = null;
  let irrNote: string | undefined;
  if (changes === 1) {
    const r = irr(differenceCashFlows);
    if (Number.isFinite(r)) irrValue = r;
    else
      irrNote =
        "No IRR was found for the yearly difference (the savings barely or never repay the extra cost); use net savings and the AIRR.";
  } else if (changes === 0) {
    irrNote =
      "The yearly difference never changes sign (one option is cheaper every year), so there is no IRR.";
  } else {
    irrNote = `The yearly difference changes sign ${changes} times (e.g. replacements), so an IRR is not unique; use the AIRR.`;
  }

  const out: OptionComparison = {
    baseOptionId: base.optionId,
    alternativeOptionId: alt.optionId,
    netSavings,
    deltaInvestmentPV,
    operationalSavingsPV,
    sir,
    airr,
    paybackOfOptionId: hi.optionId,
    extraFirstCost,
    simplePaybackYears,
    discountedPaybackYears,
    irr: irrValue,
    differenceCashFlows,
  };
  if (sirNote) out.sirNote = sirNote;
  if (airrNote) out.airrNote = airrNote;
  if (paybackNote) out.paybackNote = paybackNote;
  if (irrNote) out.irrNote = irrNote;
  return out;
}
