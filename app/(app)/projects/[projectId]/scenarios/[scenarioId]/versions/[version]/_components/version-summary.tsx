import type { ScenarioResult } from "@/lib/engine";
import { upgradeStoredResult } from "@/lib/engine/legacy";
import type { ScenarioInput } from "@/lib/engine/input";
import type { UnitSystem } from "@/lib/units";
import { buildHeadline, money } from "@/lib/comparison/headline";

/** Enough of a stored result to show; an older or foreign shape is reported rather than rendered wrongly. */
export function isDisplayableResult(r: unknown): r is ScenarioResult {
  const e = (r as { economics?: { options?: unknown; comparisons?: unknown } } | null)?.economics;
  return Boolean(e && Array.isArray(e.options) && e.options.length > 0 && Array.isArray(e.comparisons));
}

/**
 * A version the full comparison view can draw: the frozen engine input (climate and options) and a result
 * of the shape this release writes. Versions issued by an older engine keep their stored JSON untouched
 * and are shown through VersionSummary instead of being drawn wrongly.
 */
export function displayableVersion(input: unknown, result: unknown): { input: ScenarioInput; result: ScenarioResult } | null {
  const i = input as { climate?: unknown; options?: unknown } | null;
  const r = result as { physics?: unknown; climateSummary?: unknown } | null;
  const ok = i && typeof i.climate === "object" && Array.isArray(i.options) && isDisplayableResult(result) && Array.isArray(r?.physics) && r?.climateSummary;
  return ok ? { input: input as ScenarioInput, result: upgradeStoredResult(result as ScenarioResult) } : null;
}

/**
 * A compact reading of an issued version's frozen result: the headline and each option's first cost and
 * life-cycle cost. Used where the full comparison view is not available for the stored result.
 */
export function VersionSummary({ result, unitSystem, currency }: { result: unknown; unitSystem: UnitSystem; currency: string }) {
  if (!isDisplayableResult(result)) {
    return (
      <p className="text-sm text-ink-soft" data-testid="version-summary-unavailable">
        This version&apos;s stored result cannot be shown by this release of LoopLedger. Its inputs and result are kept unchanged; ask the
        consultant for a newly issued version.
      </p>
    );
  }
  const e = result.economics;
  const headline = buildHeadline(e, unitSystem, currency);
  return (
    <div className="space-y-4" data-testid="version-summary">
      <p className="text-base font-medium">{headline.lead}</p>
      {headline.payback && <p className="text-sm text-ink-soft">{headline.payback}</p>}
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <thead className="text-left text-xs uppercase tracking-wide text-ink-faint">
            <tr>
              <th className="py-2 pr-4 font-medium">Option</th>
              <th className="py-2 pr-4 text-right font-medium">First cost, {currency}</th>
              <th className="py-2 pr-4 text-right font-medium">Life-cycle cost (PV), {currency}</th>
              <th className="py-2 text-right font-medium">Annualised cost, {currency}/yr</th>
            </tr>
          </thead>
          <tbody>
            {e.options.map((o) => (
              <tr key={o.optionId} className={`border-t border-line ${o.optionId === e.lowestLccOptionId ? "font-semibold" : ""}`}>
                <td className="py-2 pr-4">{o.label}</td>
                <td className="num py-2 pr-4">{money(o.firstCost, currency).replace(`${currency} `, "")}</td>
                <td className="num py-2 pr-4">{money(o.lcc, currency).replace(`${currency} `, "")}</td>
                <td className="num py-2">{money(o.annualisedCost, currency).replace(`${currency} `, "")}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-ink-faint">
        {e.analysis === "real" ? "Constant" : "Current"} {currency}, {e.studyPeriodYears}-year study from {e.baseYear}, discount rate{" "}
        {(e.discountRate * 100).toFixed(2)} %.
      </p>
    </div>
  );
}
