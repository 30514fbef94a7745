import type { EconomicsResult } from "@/lib/engine/economics/types";

/**
 * A result as one viewer may receive it. The owner (no scenario.viewCashFlows) sees present values,
 * life-cycle costs, savings measures, sensitivity and the Monte Carlo view, but never the yearly cash
 * flows: each option's yearly table and each comparison's yearly difference stream are emptied here, in
 * the data-access layer, so no page, route, PDF or export can hand them on. Client-safe (pure).
 */
export function shapeResultFor<R extends { economics: EconomicsResult }>(result: R, withholdCashFlows: boolean): R {
  if (!withholdCashFlows || !result?.economics) return result;
  const e = result.economics;
  return {
    ...result,
    economics: {
      ...e,
      options: e.options.map((o) => ({ ...o, cashFlows: [] })),
      comparisons: (e.comparisons ?? []).map((c) => ({ ...c, differenceCashFlows: [] })),
    },
  };
}

/** True when a result carries no yearly cash flows (withheld, or none computed). */
export function hasYearlyCashFlows(e: Pick<EconomicsResult, "options">): boolean {
  return e.options.some((o) => o.cashFlows.length > 0);
}
