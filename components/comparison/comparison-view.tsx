import type { ReactNode } from "react";
import type { ScenarioResult } from "@/lib/engine";
import type { ScenarioInput } from "@/lib/engine/input";
import { formatNumber, formatQuantity, type UnitSystem } from "@/lib/units";
import { whatIfBaseline } from "@/lib/scenarios/what-if";
import { firstCostsMissingText } from "@/lib/scenarios/first-costs";
import { Panel } from "@/components/ui/panel";
import { CostStackChart } from "@/components/charts/cost-stack-chart";
import { CumulativeCostChart } from "@/components/charts/cumulative-cost-chart";
import { MonthlyWaterChart } from "@/components/charts/monthly-water-chart";
import { TornadoChart } from "@/components/charts/tornado-chart";
import { WetBulbBinsChart } from "@/components/charts/wet-bulb-bins-chart";
import { CautionList, ScreeningNote, cautionsFor } from "./cautions";
import { ComparisonTable, WarningList, sectionOfWarning } from "./comparison-table";
import { buildHeadline, designDaySentence, money } from "@/lib/comparison/headline";
import { breakEvenLine } from "@/lib/comparison/break-even";
import { MonteCarloPanel, type MonteCarloSlot } from "./monte-carlo-panel";
import { STACK_CATEGORIES, costStackSeries, cumulativeSeries, monthlyWaterSeries, tornadoRows, wetBulbBinRows } from "./series";
import { WhatIfPanel } from "./what-if-panel";
import { CondenserFootprintPanel } from "./condenser-footprint-panel";
import { RatingFitTable } from "./rating-fit-table";

export interface ComparisonProject {
  name: string;
  currency: string;
  clientName?: string;
  siteName?: string;
  locationLabel?: string;
}

export interface ComparisonViewProps {
  project: ComparisonProject;
  scenarioName: string;
  /** The engine input the result was computed from (a draft's current input, or an issued version's frozen one). */
  input: ScenarioInput;
  result: ScenarioResult;
  unitSystem: UnitSystem;
  /** Finance and the firm see yearly cash flows; the owner sees present values only. */
  canSeeCashFlows: boolean;
  /** Monte Carlo state when it runs as a job (drafts); defaults to the result's own Monte Carlo. */
  monteCarlo?: MonteCarloSlot;
  /** Where the Monte Carlo panel polls while the job runs (GET, returns `{ monteCarlo }`). */
  monteCarloPollUrl?: string | null;
  /** POST endpoint of the what-if panel; omitted: no panel. */
  whatIfEndpoint?: string | null;
  /** Extra content under the headline (download buttons, issue actions). */
  actions?: ReactNode;
}

/**
 * The comparison of one scenario's options: headline in plain words, the what-if panel, the side-by-side
 * table, the charts, engine warnings beside what they concern, the cautions and the screening note.
 * A server component; the charts and panels inside are client leaves. Used by the draft page and by the
 * issued-version pages.
 */
export function ComparisonView(props: ComparisonViewProps) {
  const { input, result, unitSystem: system, project } = props;
  const currency = project.currency;
  const e = result.economics;
  const headline = buildHeadline(e, system, currency);
  const labels = Object.fromEntries(e.options.map((o) => [o.optionId, o.label]));
  const water = monthlyWaterSeries(result.physics, system);
  const bins = wetBulbBinRows(input.climate, result, system);
  const tornadoPairs = (e.sensitivity?.tornado ?? []).map((_, i) => tornadoRows(e, i)).filter((t): t is NonNullable<typeof t> => t !== null);
  const mcSlot: MonteCarloSlot =
    props.monteCarlo ??
    (e.monteCarlo
      ? { status: "done", progress: 1, result: e.monteCarlo, error: null }
      : { status: input.monteCarlo?.enabled ? "queued" : "off", progress: 0, result: null, error: null });
  const climateNotes = result.warnings.filter((w) => sectionOfWarning(w) === "climate");
  const generalNotes = result.warnings.filter((w) => sectionOfWarning(w) === "general" && !w.optionId);
  const cheapest = Math.min(...e.options.map((o) => o.firstCost));
  const extraFirstCost = Math.max(...e.options.map((o) => o.firstCost)) - cheapest;
  const context = [project.name, project.siteName, project.clientName, props.scenarioName].filter(Boolean).join(" ");
  const climate = result.climateSummary;
  const design04 = climate.designWetBulbC.find((d) => d.exceedancePercent === 0.4);
  const designNote = designDaySentence(result.physics, system);
  // The carbon-price layer only when carbon is priced (off by default).
  const stackCategories = STACK_CATEGORIES.filter((c) => c.key !== "carbon" || e.options.some((o) => o.pvByCategory.carbon !== 0));

  return (
    <div className="space-y-6" data-testid="comparison">
      <section aria-labelledby="headline-title" className="rounded-panel border border-line bg-paper-raised p-panel shadow-panel">
        <h2 id="headline-title" className="text-xs font-semibold uppercase tracking-wide text-ink-faint">
          The answer
        </h2>
        <p className="mt-2 text-lg font-semibold leading-snug text-ink" data-testid="headline-lead">
          {headline.lead}
        </p>
        <p className="mt-2 text-sm text-ink-soft" data-testid="headline-payback">
          {headline.payback}
        </p>
        {designNote ? (
          <p className="mt-2 text-sm font-semibold text-caution-800" data-testid="headline-design-day">
            {designNote}
          </p>
        ) : null}
        {headline.flipSummary ? (
          <p className="mt-2 text-sm text-ink-soft" data-testid="headline-flips">
            {headline.flipSummary}
          </p>
        ) : null}
        <dl className="mt-4 grid gap-3 text-sm sm:grid-cols-2 lg:grid-cols-4">
          {e.options.map((o) => (
            <div key={o.optionId} className={`rounded-md border px-3 py-2 ${o.optionId === headline.winnerOptionId ? "border-ok-600 bg-ok-50" : "border-line"}`}>
              <dt className="text-xs text-ink-soft">{o.label}</dt>
              {o.firstCostMissing ? (
                <>
                  <dd className="text-left text-base font-semibold text-caution-800" data-testid={`lcc-${o.optionId}`}>
                    first costs missing
                  </dd>
                  <dd className="text-2xs text-ink-faint">life-cycle cost waits for the first cost</dd>
                </>
              ) : (
                <>
                  <dd className="num text-left text-base font-semibold" data-testid={`lcc-${o.optionId}`}>
                    {money(o.lcc, currency)}
                  </dd>
                  <dd className="text-2xs text-ink-faint">life-cycle cost, present value</dd>
                </>
              )}
              <dd className="text-2xs text-ink-faint" data-testid={`operating-${o.optionId}`}>
                {money(o.firstYearOperatingCost, currency)} operating cost in year 1
              </dd>
            </div>
          ))}
        </dl>
        {generalNotes.length > 0 ? (
          <div className="mt-3">
            <WarningList warnings={generalNotes} system={system} />
          </div>
        ) : null}
        {props.actions ? <div className="mt-4 flex flex-wrap gap-2">{props.actions}</div> : null}
      </section>

      {props.whatIfEndpoint && headline.firstCostsMissing.length > 0 ? (
        <p className="rounded-md border border-caution-600 bg-caution-50 px-3 py-2 text-sm text-caution-800" data-testid="first-costs-missing">
          {firstCostsMissingText(headline.firstCostsMissing)} The what-if panel, the tornado and the Monte Carlo open once they are entered.
        </p>
      ) : props.whatIfEndpoint ? (
        <WhatIfPanel
          endpoint={props.whatIfEndpoint}
          baseline={whatIfBaseline(input, result)}
          initialHeadline={headline}
          system={system}
          currency={currency}
          extraFirstCost={extraFirstCost}
        />
      ) : null}

      <Panel title="Side by side">
        <ComparisonTable result={result} system={system} currency={currency} />
      </Panel>

      {result.condensers || result.footprint ? (
        <Panel title="Condensers and footprint">
          <CondenserFootprintPanel result={result} system={system} currency={currency} />
        </Panel>
      ) : null}

      {props.canSeeCashFlows ? (
        <Panel title="Cost over the study period">
          <div className="space-y-6">
            {headline.firstCostsMissing.length > 0 ? (
              <p className="text-sm text-ink-soft">The cumulative discounted cost waits for the first costs; the yearly costs below are operating costs and component replacements.</p>
            ) : (
              <CumulativeCostChart series={cumulativeSeries(e)} currency={currency} />
            )}
            <CostStackChart series={costStackSeries(e)} categories={stackCategories} currency={currency} />
          </div>
        </Panel>
      ) : (
        <p className="text-sm text-ink-soft">Yearly cash flows are shared with finance; the table shows their present values.</p>
      )}

      <Panel title="Water and climate">
        <div className="grid gap-6 lg:grid-cols-2">
          <MonthlyWaterChart series={water.series} unit={water.unit} />
          <div>
            <WetBulbBinsChart rows={bins.rows} unit={bins.unit} dryLabel={bins.dryLabel} />
            <p className="mt-1 text-xs text-ink-faint">
              {climate.label ?? "Climate"}: {formatNumber(climate.hours, { decimals: 0 })} h · mean wet-bulb{" "}
              {formatQuantity("temperatureC", climate.wetBulb.meanC, system, { sig: 3 })}
              {design04 ? ` · 0.4 % design wet-bulb ${formatQuantity("temperatureC", design04.wetBulbC, system, { sig: 3 })}` : ""}
              {bins.dryApproximated
                ? ". Dry hours per bin are placed in each month's coldest hours from the cooler's monthly dry-mode hours (the engine reports them by month)."
                : "."}
            </p>
            <WarningList warnings={climateNotes} system={system} />
          </div>
        </div>
      </Panel>

      <Panel title="Sensitivity and uncertainty">
        <div className="space-y-6">
          {tornadoPairs.length > 0 ? (
            <div className="grid gap-6 lg:grid-cols-2">
              {tornadoPairs.map((t) => (
                <div key={t.pairLabel}>
                  <TornadoChart rows={t.rows} currency={currency} pairLabel={t.pairLabel} />
                  {t.skipped.length > 0 ? <p className="mt-1 text-xs text-ink-faint">Not varied: {t.skipped.join("; ")}</p> : null}
                </div>
              ))}
            </div>
          ) : (
            <p className="text-sm text-ink-soft">
              {headline.firstCostsMissing.length > 0 ? "The tornado and break-evens wait for the first costs." : "The tornado is switched off for this scenario."}
            </p>
          )}
          {e.sensitivity && e.sensitivity.breakEven.length > 0 ? (
            <div>
              <h3 className="text-sm font-semibold">Break-even values</h3>
              <ul className="mt-1 list-disc pl-5 text-sm text-ink-soft" data-testid="break-evens">
                {e.sensitivity.breakEven.map((b) => (
                  <li key={`${b.input}-${b.alternativeOptionId}`}>
                    {labels[b.alternativeOptionId]} against {labels[b.baseOptionId]?.toLowerCase()}: {breakEvenLine(b, currency, system)}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          <div>
            <h3 className="mb-2 text-sm font-semibold">Monte Carlo</h3>
            {headline.firstCostsMissing.length > 0 ? (
              <p className="text-sm text-ink-soft">The Monte Carlo waits for the first costs.</p>
            ) : (
              <MonteCarloPanel initial={mcSlot} pollUrl={props.monteCarloPollUrl ?? null} labels={labels} currency={currency} />
            )}
          </div>
        </div>
      </Panel>

      <Panel title="Selections and their rating points">
        <div className="grid gap-6 lg:grid-cols-2" data-testid="rating-fits">
          {result.physics.map((p) =>
            p.ratingFit ? (
              <RatingFitTable key={p.optionId} fit={p.ratingFit} system={system} title={p.label} />
            ) : (
              <p key={p.optionId} className="text-sm text-ink-soft">
                <span className="font-semibold text-ink">{p.label}</span>:{" "}
                {p.kind === "evaporativeCondenser" ? "calibrated on its rated heat rejection (no rating-point fit)." : "this result was computed before rating-point fits were recorded; save the scenario again to see it."}
              </p>
            ),
          )}
        </div>
      </Panel>

      <Panel title="Cautions">
        <div className="space-y-4">
          <CautionList cautions={cautionsFor(input, result, system, context)} />
          <ScreeningNote />
        </div>
      </Panel>
    </div>
  );
}
