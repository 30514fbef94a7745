/**
 * "First costs missing": an option whose first cost is not entered yet. Its physics and operating costs
 * are priced; its life-cycle figures are withheld everywhere they would appear. Client-safe.
 */
import type { EconomicsResult } from "@/lib/engine/economics/types";

/** Labels of the options of a scenario input (any shape read back from storage) without a first cost. */
export function optionsWithoutFirstCost(input: unknown): string[] {
  const options = (input as { options?: unknown } | null)?.options;
  if (!Array.isArray(options)) return [];
  return options
    .filter((o) => {
      const costs = (o as { costs?: { firstCost?: unknown } } | null)?.costs;
      return !costs || costs.firstCost === undefined || costs.firstCost === null;
    })
    .map((o, i) => String((o as { label?: unknown }).label ?? `Option ${i + 1}`));
}

/** Labels of the options the economics priced without a first cost (none for a result from before the field existed). */
export function firstCostsMissingLabels(e: Pick<EconomicsResult, "options"> & { firstCostsMissing?: string[] }): string[] {
  const ids = new Set(e.firstCostsMissing ?? []);
  return e.options.filter((o) => ids.has(o.optionId)).map((o) => o.label);
}

/** The sentence shown wherever a life-cycle figure would be. */
export function firstCostsMissingText(labels: readonly string[]): string {
  return labels.length === 0
    ? ""
    : `First costs missing for ${labels.join(", ")}: the life-cycle cost, net savings, SIR, AIRR and payback wait for them (enter them in the editor).`;
}
