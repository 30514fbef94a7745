/**
 * The notes under the comparison's measures (SIR, AIRR, payback). The engine's payback note states the
 * extra first cost as a bare number (it knows no currency); the page restates that one with its currency.
 */
import type { OptionComparison } from "@/lib/engine/economics/types";
import { money } from "./headline";

export function measureNotesOf(c: OptionComparison, labelOf: (optionId: string) => string, currency: string, studyPeriodYears: number): string[] {
  const payback =
    c.paybackNote && c.extraFirstCost > 0 && c.simplePaybackYears === null
      ? `${labelOf(c.paybackOfOptionId)}'s extra first cost of ${money(c.extraFirstCost, currency)} is not recovered within the ${studyPeriodYears}-year study period.`
      : c.paybackNote;
  return [c.sirNote, c.airrNote, payback].filter((n): n is string => Boolean(n));
}
