"use client";

import { useEffect, useId, useMemo, useState } from "react";
import useSWR from "swr";
import { formatNumber, formatQuantity, type UnitSystem } from "@/lib/units";
import type { WhatIfBaseline, WhatIfBody, WhatIfResponse } from "@/lib/scenarios/what-if";
import { money, type Headline } from "@/lib/comparison/headline";

type Key = "water" | "electricity" | "cycles" | "discount" | "premium" | "load" | "shift" | "fouling" | "minCond";
type FanChoice = "asSelected" | "variableSpeed" | "twoSpeed" | "cycling";

const FAN_CHOICES: { value: FanChoice; label: string }[] = [
  { value: "asSelected", label: "As selected" },
  { value: "variableSpeed", label: "Variable speed" },
  { value: "twoSpeed", label: "Two-speed" },
  { value: "cycling", label: "On/off cycling" },
];

interface Slider {
  key: Key;
  label: string;
  min: number;
  max: number;
  step: number;
  /** The value shown beside the slider, in the viewer's units. */
  show: (v: number) => string;
}

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

async function postWhatIf([url, body]: [string, string]): Promise<WhatIfResponse> {
  const res = await fetch(url, { method: "POST", headers: { "content-type": "application/json" }, body });
  const json = (await res.json().catch(() => ({}))) as WhatIfResponse & { error?: string };
  if (!res.ok) throw new Error(json.error ?? `The what-if failed (${res.status}).`);
  return json;
}

/**
 * Sliders for the inputs that most often decide the comparison. Each move (debounced) asks the server to
 * re-price the stored physics — or, for a physical input (load, climate, fouling, minimum condensing
 * temperature, fan control, selection size), to re-run the physics on a compressed year; nothing is saved.
 * The headline and key numbers update in place.
 */
export function WhatIfPanel({
  endpoint,
  baseline,
  initialHeadline,
  system,
  currency,
  extraFirstCost,
}: {
  endpoint: string;
  baseline: WhatIfBaseline;
  initialHeadline: Headline;
  system: UnitSystem;
  currency: string;
  /** The largest extra first cost among the options (for the premium slider's label). */
  extraFirstCost: number;
}) {
  const baseCyclesShown = Number(baseline.cyclesOfConcentration.toFixed(1));
  const floating = baseline.headPressureControl === "floating";
  const start: Record<Key, number> = {
    water: 1,
    electricity: 1,
    cycles: baseCyclesShown,
    discount: Number((100 * baseline.discountRate).toFixed(1)),
    premium: 1,
    load: 1,
    shift: 0,
    fouling: 1,
    minCond: baseline.minimumCondensingC,
  };
  const startSizes = Object.fromEntries(baseline.options.map((o) => [o.optionId, 1]));
  const [values, setValues] = useState<Record<Key, number>>(start);
  const [fan, setFan] = useState<FanChoice>("asSelected");
  const [sizes, setSizes] = useState<Record<string, number>>(startSizes);
  const current = useMemo(() => ({ values, fan, sizes }), [values, fan, sizes]);
  const debounced = useDebounced(current, 150);
  const id = useId();

  const body: WhatIfBody = {};
  const v = debounced.values;
  if (v.water !== 1) body.waterAndSewerPriceFactor = v.water;
  if (v.electricity !== 1) body.electricityPriceFactor = v.electricity;
  if (v.cycles !== baseCyclesShown) body.cyclesOfConcentration = v.cycles;
  if (v.discount !== start.discount) body.discountRate = v.discount / 100;
  if (v.premium !== 1) body.firstCostPremiumFactor = v.premium;
  if (baseline.physicsAvailable) {
    if (v.load !== 1) body.loadFactor = v.load;
    if (v.shift !== 0) body.climateShiftK = v.shift;
    if (v.fouling !== 1) body.foulingRateFactor = v.fouling;
    if (floating && v.minCond !== start.minCond) body.minimumCondensingC = v.minCond;
    if (debounced.fan !== "asSelected") body.fanControl = debounced.fan;
    const moved = Object.entries(debounced.sizes).filter(([, f]) => f !== 1);
    if (moved.length > 0) body.sizeFactorByOptionId = Object.fromEntries(moved);
  }
  const changed = Object.keys(body).length > 0;
  const { data, error, isLoading, isValidating } = useSWR(changed ? [endpoint, JSON.stringify(body)] : null, postWhatIf, {
    keepPreviousData: true,
    revalidateOnFocus: false,
    dedupingInterval: 0,
  });
  const headline = changed && data ? data.headline : initialHeadline;  const sliders: Slider[] = [
    {
      key: "water",
      label: "Water + sewer price",
      min: 0.25,
      max: 4,
      step: 0.05,
      show: (f) => `${formatQuantity("pricePerM3", f * baseline.waterAndSewerPricePerM3, system, { currency, sig: 3 })} (×${formatNumber(f, { decimals: 2 })})`,
    },
    {
      key: "electricity",
      label: "Electricity price",
      min: 0.25,
      max: 3,
      step: 0.05,
      show: (f) => `${formatNumber(f * baseline.electricityPricePerKWh, { sig: 3 })} ${currency}/kWh (×${formatNumber(f, { decimals: 2 })})`,
    },
    { key: "cycles", label: "Cycles of concentration", min: 1.5, max: 15, step: 0.1, show: (c) => formatNumber(c, { decimals: 1 }) },
    {
      key: "discount",
      label: `Discount rate (${baseline.analysis})`,
      min: 0,
      max: 15,
      step: 0.1,
      show: (d) => `${formatNumber(d, { decimals: 1 })} %`,
    },
    {
      key: "premium",
      label: "Extra first cost",
      min: 0,
      max: 3,
      step: 0.05,
      show: (f) => `×${formatNumber(f, { decimals: 2 })}${extraFirstCost > 0 ? ` (${money(f * extraFirstCost, currency)} for the dearest option)` : ""}`,
    },
  ];
  const physical: Slider[] = [
    {
      key: "load",
      label: "Heat-rejection load",
      min: 0.5,
      max: 1.5,
      step: 0.05,
      show: (f) => `×${formatNumber(f, { decimals: 2 })} in every hour`,
    },
    {
      key: "shift",
      label: "Warmer or cooler year (dry-bulb and wet-bulb)",
      min: -3,
      max: 3,
      step: 0.5,
      show: (k) => `${k > 0 ? "+" : ""}${formatQuantity("temperatureDifferenceK", k, system, { decimals: 1 })}`,
    },
    {
      key: "fouling",
      label: "Fouling growth",
      min: 0,
      max: 4,
      step: 0.1,
      show: (f) => `×${formatNumber(f, { decimals: 1 })}`,
    },
    ...(floating
      ? [
          {
            key: "minCond" as const,
            label: "Minimum condensing temperature",
            min: Math.max(5, baseline.condensingSetPointC - 20),
            max: baseline.condensingSetPointC,
            step: 0.5,
            show: (t: number) => formatQuantity("temperatureC", t, system, { decimals: 1 }),
          },
        ]
      : []),
  ];
  const reset = () => {
    setValues(start);
    setFan("asSelected");
    setSizes(startSizes);
  };
  const slider = (s: Slider) => (
    <div key={s.key}>
      <label htmlFor={`${id}-${s.key}`} className="flex items-baseline justify-between gap-2 text-sm font-medium">
        <span>{s.label}</span>
        <span className="num text-xs font-normal text-ink-soft">{s.show(values[s.key])}</span>
      </label>
      <input
        id={`${id}-${s.key}`}
        data-testid={`whatif-${s.key}`}
        type="range"
        min={s.min}
        max={s.max}
        step={s.step}
        value={values[s.key]}
        aria-valuetext={s.show(values[s.key])}
        onChange={(e) => setValues((x) => ({ ...x, [s.key]: Number(e.target.value) }))}
        className="mt-1 w-full accent-basin-600"
      />
    </div>
  );

  return (
    <section aria-labelledby={`${id}-title`} className="rounded-panel border border-basin-300 bg-basin-50 p-4" data-testid="what-if">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={`${id}-title`} className="text-lg font-semibold">
          What if…
        </h2>
        <p className="text-xs text-ink-soft" aria-live="polite">
          {error
            ? <span className="text-danger-700">{(error as Error).message}</span>
            : isLoading || isValidating
              ? "Recomputing…"
              : changed && data
                ? `Recomputed in ${formatNumber(data.elapsedMs, { sig: 2 })} ms on the server${data.physicsRerun ? " (physics re-run)" : ""} · nothing saved`
                : "Move a slider: prices re-price the stored physics, physical inputs re-run it; nothing is saved."}
        </p>
      </div>
      <h3 className="mt-3 text-sm font-semibold text-ink-soft">Prices and money</h3>
      <div className="mt-2 grid gap-x-6 gap-y-3 md:grid-cols-2 xl:grid-cols-3">{sliders.map(slider)}</div>
      {baseline.physicsAvailable ? (
        <>
          <h3 className="mt-4 text-sm font-semibold text-ink-soft">Physical inputs (the physics is re-run)</h3>
          <div className="mt-2 grid gap-x-6 gap-y-3 md:grid-cols-2 xl:grid-cols-3">
            {physical.map(slider)}
            <div>
              <label htmlFor={`${id}-fan`} className="block text-sm font-medium">
                Fan control (every option)
              </label>
              <select
                id={`${id}-fan`}
                data-testid="whatif-fan"
                value={fan}
                onChange={(e) => setFan(e.target.value as FanChoice)}
                className="mt-1 w-full rounded-md border border-line-strong bg-paper-raised px-2 py-1 text-sm"
              >
                {FAN_CHOICES.map((c) => (
                  <option key={c.value} value={c.value}>
                    {c.value === "asSelected" && baseline.fanControl ? `As selected (${FAN_CHOICES.find((x) => x.value === baseline.fanControl)?.label.toLowerCase()})` : c.label}
                  </option>
                ))}
              </select>
            </div>
            {baseline.options.map((o) => (
              <div key={o.optionId}>
                <label htmlFor={`${id}-size-${o.optionId}`} className="flex items-baseline justify-between gap-2 text-sm font-medium">
                  <span>Selection size: {o.label}</span>
                  <span className="num text-xs font-normal text-ink-soft">×{formatNumber(sizes[o.optionId] ?? 1, { decimals: 2 })}</span>
                </label>
                <input
                  id={`${id}-size-${o.optionId}`}
                  data-testid={`whatif-size-${o.optionId}`}
                  type="range"
                  min={0.6}
                  max={1.6}
                  step={0.05}
                  value={sizes[o.optionId] ?? 1}
                  aria-valuetext={`×${formatNumber(sizes[o.optionId] ?? 1, { decimals: 2 })}`}
                  onChange={(e) => setSizes((x) => ({ ...x, [o.optionId]: Number(e.target.value) }))}
                  className="mt-1 w-full accent-basin-600"
                />
              </div>
            ))}
          </div>
          <p className="mt-2 text-xs text-ink-soft">
            Physical inputs re-run the yearly physics on a compressed year (hours grouped by month, wet-bulb and load) and move the stored
            hourly result by the change. A larger or smaller selection stands for more or fewer units of the selected model sharing the same
            water; its equipment cost follows the six-tenths rule. A screening estimate: selections and their ratings come from the
            manufacturer.
          </p>
        </>
      ) : null}
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <button
          type="button"
          className="rounded-md border border-line-strong bg-paper-raised px-3 py-1.5 text-sm hover:bg-paper-sunk"
          onClick={reset}
          disabled={!changed}
        >
          Back to the entered values
        </button>
      </div>
      <div className="mt-4 rounded-md bg-paper-raised p-3 text-sm" aria-live="polite">
        <p data-testid="whatif-lead" className="font-medium">
          {headline.lead}
        </p>
        <p className="mt-1 text-ink-soft">{headline.payback}</p>
        {changed && data ? (
          <table className="mt-3 w-full text-xs">
            <thead>
              <tr className="border-b border-line text-ink-soft">
                <th className="py-1 text-left font-medium">Option</th>
                <th className="py-1 text-right font-medium">Life-cycle cost, {currency} PV</th>
                <th className="py-1 text-right font-medium">Annualised, {currency}/yr</th>
                <th className="py-1 text-right font-medium">Net savings, {currency} PV</th>
                <th className="py-1 text-right font-medium">Simple payback, years</th>
              </tr>
            </thead>
            <tbody>
              {data.options.map((o) => {
                const c = data.comparisons.find((x) => x.alternativeOptionId === o.optionId);
                return (
                  <tr key={o.optionId} className="border-b border-line last:border-0">
                    <td className="py-1">
                      {o.label}
                      {o.optionId === data.lowestLccOptionId ? <span className="ml-1 text-ok-600">· lowest</span> : null}
                    </td>
                    <td className="num py-1" data-testid={`whatif-lcc-${o.optionId}`}>{formatNumber(o.lcc, { decimals: 0 })}</td>
                    <td className="num py-1">{formatNumber(o.annualisedCost, { decimals: 0 })}</td>
                    <td className="num py-1">{c ? formatNumber(c.netSavings, { decimals: 0 }) : "base"}</td>
                    <td className="num py-1">{c ? (c.simplePaybackYears === null ? "none" : formatNumber(c.simplePaybackYears, { decimals: 1 })) : "—"}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        ) : null}
      </div>
    </section>
  );
}
