import type { ReactNode } from "react";
import type { ScenarioResult } from "@/lib/engine";
import { COST_CATEGORIES, COST_CATEGORY_LABELS, type EconomicsResult, type OptionComparison } from "@/lib/engine/economics/types";
import type { EngineWarning, OptionAnnualPhysics } from "@/lib/engine/types";
import { formatNumber, formatQuantity, unitLabel, type QuantityKind, type UnitSystem } from "@/lib/units";
import { warningText } from "@/lib/units/warnings";
import { findComparison } from "@/lib/comparison/headline";
import { measureNotesOf } from "@/lib/comparison/measure-notes";

/** What a life-cycle cell shows while an option's first cost is not entered. */
export const FIRST_COSTS_MISSING = "first costs missing";

interface Row {
  label: string;
  unit: string;
  values: (string | null)[];
  strong?: boolean;
  testId?: string;
}

function Section({ title, rows, span, notes, optionLabel, system }: { title: string; rows: Row[]; span: number; notes?: EngineWarning[]; optionLabel?: (id: string) => string; system: UnitSystem }) {
  return (
    <tbody>
      <tr className="bg-paper-sunk">
        <th scope="rowgroup" colSpan={span} className="px-3 py-1.5 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">
          {title}
        </th>
      </tr>
      {rows.map((r) => (
        <tr key={r.label} className="border-b border-line last:border-0" data-testid={r.testId}>
          <th scope="row" className={`px-3 py-1.5 text-left font-normal ${r.strong ? "font-semibold" : ""}`}>
            {r.label}
            {r.unit ? <span className="text-ink-faint">, {r.unit}</span> : null}
          </th>
          {r.values.map((v, i) => (
            <td key={i} className={`num px-3 py-1.5 ${r.strong ? "font-semibold" : ""}`}>
              {v === FIRST_COSTS_MISSING ? (
                <span className="text-xs italic text-caution-800" data-testid="first-costs-missing-cell">
                  {v}
                </span>
              ) : (
                (v ?? <span className="text-ink-faint">—</span>)
              )}
            </td>
          ))}
        </tr>
      ))}
      {notes && notes.length > 0 ? (
        <tr>
          <td colSpan={span} className="px-3 pb-2">
            <WarningList warnings={notes} system={system} {...(optionLabel ? { optionLabel } : {})} />
          </td>
        </tr>
      ) : null}
    </tbody>
  );
}

/** Engine warnings, each number in the viewer's units. */
export function WarningList({ warnings, optionLabel, system }: { warnings: EngineWarning[]; optionLabel?: (id: string) => string; system: UnitSystem }): ReactNode {
  if (warnings.length === 0) return null;
  return (
    <ul className="space-y-1 text-xs" data-testid="engine-warnings">
      {warnings.map((w, i) => (
        <li
          key={`${w.code}-${w.optionId ?? ""}-${i}`}
          className={`rounded border px-2 py-1 ${w.severity === "warning" ? "border-caution-200 bg-caution-50 text-caution-800" : "border-line bg-paper text-ink-soft"}`}
        >
          <span className="font-semibold">{w.severity === "warning" ? "Check" : "Note"}</span>
          {w.optionId && optionLabel ? <span> · {optionLabel(w.optionId)}</span> : null}: {warningText(w, system)}
        </li>
      ))}
    </ul>
  );
}

/** Which table section an engine warning concerns, from its input path. */
export function sectionOfWarning(w: EngineWarning): "water" | "energy" | "design" | "cost" | "climate" | "general" {
  const p = w.path ?? "";
  if (p.startsWith("water") || w.code.startsWith("water.")) return "water";
  if (p.startsWith("climate") || w.code.startsWith("climate.")) return "climate";
  if (p.startsWith("tariffs") || p.startsWith("economics") || p.startsWith("upkeep") || p.includes("costs") || w.code.startsWith("economics.")) return "cost";
  if (w.code.startsWith("designDay.")) return "design";
  if (p.startsWith("options") || p.startsWith("duty") || p.startsWith("fouling") || w.code.startsWith("loop.") || w.code.startsWith("fouling.") || w.code.startsWith("compressor.")) return "energy";
  return "general";
}

const q = (kind: QuantityKind, v: number | null | undefined, system: UnitSystem, sig = 4, currency?: string) =>
  v === null || v === undefined || !Number.isFinite(v) ? null : formatQuantity(kind, v, system, { sig, withUnit: false, ...(currency ? { currency } : {}) });
const money = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? null : formatNumber(v, { decimals: 0 }));

/**
 * The side-by-side table: yearly water and energy by component, present-value cost by category and the
 * savings measures of each option against the base. Every number is in the viewer's units, every row
 * names its unit.
 */
export function ComparisonTable({
  result,
  system,
  currency,
}: {
  result: ScenarioResult;
  system: UnitSystem;
  currency: string;
}) {
  const e: EconomicsResult = result.economics;
  const physics = e.options.map((o) => result.physics.find((p) => p.optionId === o.optionId));
  const span = e.options.length + 1;
  const wu = unitLabel("waterVolumeM3", system);
  const per = (p: OptionAnnualPhysics | undefined, f: (p: OptionAnnualPhysics) => number, kind: QuantityKind, sig = 4) => (p ? q(kind, f(p), system, sig) : null);
  const warnings = result.warnings;
  const bySection = (s: ReturnType<typeof sectionOfWarning>) => warnings.filter((w) => sectionOfWarning(w) === s);
  const labelOf = (id: string) => e.options.find((o) => o.optionId === id)?.label ?? id;
  const cmp = (optionId: string): OptionComparison | null => {
    if (optionId === e.baseOptionId) return null;
    return findComparison(e, e.baseOptionId, optionId)?.c ?? null;
  };
  const baseLabel = labelOf(e.baseOptionId);
  // Without an option's first cost its investment, replacements, residual value and everything derived from
  // them are not life-cycle figures: those cells say so; water, energy and operating costs stand.
  const missing = new Set(e.firstCostsMissing ?? []);
  const anyMissing = missing.size > 0;
  const lifeCycle = (id: string, v: string | null) => (missing.has(id) ? FIRST_COSTS_MISSING : v);
  const pairMissing = (id: string) => missing.has(id) || missing.has(e.baseOptionId);
  const FROM_FIRST_COST = new Set(["investment", "replacements", "residual"]);

  const waterRows: Row[] = [
    { label: "Evaporation", unit: `${wu}/yr`, values: physics.map((p) => per(p, (x) => x.waterM3.evaporation, "waterVolumeM3")) },
    { label: "Drift", unit: `${wu}/yr`, values: physics.map((p) => per(p, (x) => x.waterM3.drift, "waterVolumeM3", 3)) },
    { label: "Blowdown", unit: `${wu}/yr`, values: physics.map((p) => per(p, (x) => x.waterM3.blowdown, "waterVolumeM3")) },
    { label: "Makeup", unit: `${wu}/yr`, values: physics.map((p) => per(p, (x) => x.waterM3.makeup, "waterVolumeM3")), strong: true, testId: "row-makeup" },
    { label: "Billed to sewer", unit: `${wu}/yr`, values: physics.map((p) => per(p, (x) => x.waterM3.sewerBilled, "waterVolumeM3")) },
    { label: "Cycles of concentration", unit: "", values: physics.map((p) => (p ? formatNumber(p.cyclesOfConcentration, { sig: 3 }) : null)) },
  ];
  const energyRows: Row[] = [
    { label: "Fans", unit: "kWh/yr", values: physics.map((p) => per(p, (x) => x.energyKWh.fan, "energyKWh")) },
    { label: "Condenser-loop pump", unit: "kWh/yr", values: physics.map((p) => per(p, (x) => x.energyKWh.condenserPump, "energyKWh")) },
    { label: "Tower-side pump (plate option)", unit: "kWh/yr", values: physics.map((p) => per(p, (x) => x.energyKWh.secondaryPump, "energyKWh")) },
    { label: "Spray pump (cooler)", unit: "kWh/yr", values: physics.map((p) => per(p, (x) => x.energyKWh.sprayPump, "energyKWh")) },
    { label: "Basin heater", unit: "kWh/yr", values: physics.map((p) => per(p, (x) => x.energyKWh.basinHeater, "energyKWh")) },
    {
      label: "Refrigeration compressors",
      unit: "kWh/yr",
      values: physics.map((p) => per(p, (x) => x.energyKWh.compressor, "energyKWh")),
      testId: "row-energy-compressor",
    },
    { label: "Total (priced)", unit: "kWh/yr", values: physics.map((p) => per(p, (x) => x.energyKWh.total, "energyKWh")), strong: true, testId: "row-energy-total" },
    {
      label: "Of the compressors: above a clean condenser on the same water (explanation, not priced)",
      unit: "kWh/yr",
      values: physics.map((p) => per(p, (x) => x.compressorAboveCleanReferenceKWh, "energyKWh")),
    },
    {
      label: "Peak demand",
      unit: unitLabel("powerKW", "SI"),
      values: physics.map((p) => (p ? formatNumber(Math.max(0, ...p.monthly.map((m) => m.peakDemandKW)), { sig: 3 }) : null)),
    },
    {
      label: "Mean condensing temperature",
      unit: unitLabel("temperatureC", system),
      values: physics.map((p) => per(p, (x) => x.meanCondensingC, "temperatureC", 3)),
    },
    { label: "Dry-mode hours", unit: "h/yr", values: physics.map((p) => (p ? formatNumber(p.dryModeHours, { decimals: 0 }) : null)) },
    { label: "Hours above the set-point", unit: "h/yr", values: physics.map((p) => (p ? formatNumber(p.unmetHours, { decimals: 0 }) : null)) },
    {
      label: "Cleanings",
      unit: "per year",
      values: physics.map((p) => (p ? (p.cleaningsPerYear > 0 ? formatNumber(p.cleaningsPerYear, { sig: 2 }) : "none") : null)),
    },
  ];
  const dd = (p: OptionAnnualPhysics | undefined) => p?.designDay;
  const designRows: Row[] = physics.some((p) => dd(p))
    ? [
        {
          label: "Selected for wet-bulb",
          unit: unitLabel("temperatureC", system),
          values: physics.map((p) => per(p, (x) => x.designDay?.selectionWetBulbC ?? Number.NaN, "temperatureC", 3)),
        },
        {
          label: `Site 0.4 % wet-bulb${dd(physics.find((p) => dd(p))) ? ` (${q("temperatureC", dd(physics.find((p) => dd(p)))?.siteDryBulbC, system, 3)} ${unitLabel("temperatureC", system)} coincident dry-bulb)` : ""}`,
          unit: unitLabel("temperatureC", system),
          values: physics.map((p) => per(p, (x) => x.designDay?.siteWetBulbC ?? Number.NaN, "temperatureC", 3)),
        },
        {
          label: "Heat rejected at the set-point in the design hour, full fan",
          unit: unitLabel("heatDutyKW", system),
          values: physics.map((p) => per(p, (x) => x.designDay?.capacityAtSetPointKW ?? Number.NaN, "heatDutyKW", 3)),
        },
        {
          label: "Holds the set-point at design duty",
          unit: "",
          values: physics.map((p) => {
            const d = dd(p);
            if (!d) return null;
            return d.holdsSetPoint ? "yes" : `no: condenses at ${formatQuantity("temperatureC", d.condensingC, system, { sig: 3 })}`;
          }),
          strong: true,
          testId: "row-design-holds",
        },
      ]
    : [];
  const costRows: Row[] = [
    ...COST_CATEGORIES.map((c) => ({
      label: COST_CATEGORY_LABELS[c],
      unit: `${currency}, PV`,
      values: e.options.map((o) => (FROM_FIRST_COST.has(c) ? lifeCycle(o.optionId, money(o.pvByCategory[c])) : money(o.pvByCategory[c]))),
    })),
    { label: "Life-cycle cost", unit: `${currency}, PV`, values: e.options.map((o) => lifeCycle(o.optionId, money(o.lcc))), strong: true, testId: "row-lcc" },
  ];
  const measureRows: Row[] = [
    { label: "First cost", unit: currency, values: e.options.map((o) => lifeCycle(o.optionId, money(o.firstCost))) },
    { label: "First-year operating cost", unit: `${currency}/yr`, values: e.options.map((o) => money(o.firstYearOperatingCost)) },
    { label: "Annualised cost", unit: `${currency}/yr`, values: e.options.map((o) => lifeCycle(o.optionId, money(o.annualisedCost))), testId: "row-annualised" },
    {
      label: `Net savings against ${baseLabel.toLowerCase()}`,
      unit: `${currency}, PV`,
      values: e.options.map((o) => (cmp(o.optionId) && pairMissing(o.optionId) ? FIRST_COSTS_MISSING : money(cmp(o.optionId)?.netSavings))),
    },
    {
      label: "Savings-to-investment ratio (SIR)",
      unit: "",
      values: e.options.map((o) => {
        const c = cmp(o.optionId);
        if (c && pairMissing(o.optionId)) return FIRST_COSTS_MISSING;
        return c ? (c.sir === null ? (c.sirNote ? "n/a" : null) : formatNumber(c.sir, { decimals: 2 })) : null;
      }),
    },
    {
      label: "Adjusted internal rate of return (AIRR)",
      unit: "%/yr",
      values: e.options.map((o) => {
        const c = cmp(o.optionId);
        if (c && pairMissing(o.optionId)) return FIRST_COSTS_MISSING;
        return c ? (c.airr === null ? "n/a" : formatNumber(100 * c.airr, { decimals: 1 })) : null;
      }),
    },
    {
      label: "Simple payback",
      unit: "years",
      values: e.options.map((o) => {
        const c = cmp(o.optionId);
        if (c && pairMissing(o.optionId)) return FIRST_COSTS_MISSING;
        return c ? (c.simplePaybackYears === null ? "none" : formatNumber(c.simplePaybackYears, { decimals: 1 })) : null;
      }),
    },
    {
      label: "Discounted payback",
      unit: "years",
      values: e.options.map((o) => {
        const c = cmp(o.optionId);
        if (c && pairMissing(o.optionId)) return FIRST_COSTS_MISSING;
        return c ? (c.discountedPaybackYears === null ? "none" : formatNumber(c.discountedPaybackYears, { decimals: 1 })) : null;
      }),
    },
  ];
  const notesOf = (id: string) => warnings.filter((w) => w.optionId === id && sectionOfWarning(w) === "general");
  const measureNotes = (anyMissing ? [] : e.comparisons).flatMap((c) =>
    measureNotesOf(c, labelOf, currency, e.studyPeriodYears).map((n) => ({
      code: "economics.measureNote",
      severity: "info" as const,
      message: n,
      optionId: c.alternativeOptionId,
    })),
  );
  return (
    <div className="overflow-x-auto" data-testid="comparison-table">
      <table className="w-full min-w-[44rem] border-collapse text-sm">
        <caption className="sr-only">Side-by-side comparison of the options, yearly quantities and present values</caption>
        <thead>
          <tr className="border-b border-line-strong">
            <th scope="col" className="px-3 py-2 text-left text-xs font-semibold text-ink-soft">
              Per year unless noted · {e.analysis === "real" ? "constant" : "then-current"} {currency} · {e.studyPeriodYears}-year study from {e.baseYear}
            </th>
            {e.options.map((o) => (
              <th key={o.optionId} scope="col" className="px-3 py-2 text-right align-bottom">
                <span className="block font-semibold">{o.label}</span>
                <span className="block text-2xs font-normal text-ink-faint">
                  {o.optionId === e.baseOptionId ? "base" : `against ${baseLabel.toLowerCase()}`}
                  {o.optionId === e.lowestLccOptionId && !anyMissing ? " · lowest LCC" : ""}
                  {missing.has(o.optionId) ? " · first costs missing" : ""}
                </span>
              </th>
            ))}
          </tr>
        </thead>
        <Section title="Water" rows={waterRows} span={span} notes={bySection("water")} optionLabel={labelOf} system={system} />
        <Section title="Energy and operation" rows={energyRows} span={span} notes={bySection("energy")} optionLabel={labelOf} system={system} />
        {designRows.length > 0 ? (
          <Section title="Design-day check (site 0.4 % design hour)" rows={designRows} span={span} notes={bySection("design")} optionLabel={labelOf} system={system} />
        ) : null}
        <Section title={`Life-cycle cost by category (present value at ${formatNumber(100 * e.discountRate, { decimals: 1 })} %)`} rows={costRows} span={span} notes={bySection("cost")} optionLabel={labelOf} system={system} />
        <Section title="Measures" rows={measureRows} span={span} notes={measureNotes} optionLabel={labelOf} system={system} />
        {e.options.some((o) => notesOf(o.optionId).length > 0) ? (
        <tbody>
          <tr>
            <th scope="row" className="px-3 py-2 text-left align-top text-xs font-semibold text-ink-soft">
              Other engine notes
            </th>
            {e.options.map((o) => (
              <td key={o.optionId} className="px-3 py-2 align-top">
                <WarningList warnings={notesOf(o.optionId)} system={system} />
              </td>
            ))}
          </tr>
        </tbody>
        ) : null}
      </table>
    </div>
  );
}
