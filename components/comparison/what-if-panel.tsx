"use client";

import { useEffect, useId, useState } from "react";
import useSWR from "swr";
import { formatNumber, formatQuantity, type UnitSystem } from "@/lib/units";
import type { WhatIfBaseline, WhatIfBody, WhatIfResponse } from "@/lib/scenarios/what-if";
import { money, type Headline } from "./headline";

type Key = "water" | "electricity" | "cycles" | "discount" | "premium";

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
 * Sliders for the inputs that most often decide the comparison. Each move asks the server to re-price
 * the stored physics (debounced, nothing saved); the headline and key numbers update in place.
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
  const start = { water: 1, electricity: 1, cycles: baseCyclesShown, discount: Number((100 * baseline.discountRate).toFixed(1)), premium: 1 };
  const [values, setValues] = useState<Record<Key, number>>(start);
  const debounced = useDebounced(values, 150);
  const id = useId();

  const body: WhatIfBody = {};
  if (debounced.water !== 1) body.waterAndSewerPriceFactor = debounced.water;
  if (debounced.electricity !== 1) body.electricityPriceFactor = debounced.electricity;
  if (debounced.cycles !== baseCyclesShown) body.cyclesOfConcentration = debounced.cycles;
  if (debounced.discount !== start.discount) body.discountRate = debounced.discount / 100;
  if (debounced.premium !== 1) body.firstCostPremiumFactor = debounced.premium;
  const changed = Object.keys(body).length > 0;
  const { data, error, isLoading, isValidating } = useSWR(changed ? [endpoint, JSON.stringify(body)] : null, postWhatIf, {
    keepPreviousData: true,
    revalidateOnFocus: false,
    dedupingInterval: 0,
  });
  const headline = changed && data ? data.headline : initialHeadline;

  const sliders: Slider[] = [
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
                ? `Recomputed in ${formatNumber(data.elapsedMs, { sig: 2 })} ms on the server · nothing saved`
                : "Move a slider: the stored physics are re-priced, nothing is saved."}
        </p>
      </div>
      <div className="mt-3 grid gap-x-6 gap-y-3 md:grid-cols-2 xl:grid-cols-3">
        {sliders.map((s) => (
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
              onChange={(e) => setValues((v) => ({ ...v, [s.key]: Number(e.target.value) }))}
              className="mt-1 w-full accent-basin-600"
            />
          </div>
        ))}
      </div>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <button
          type="button"
          className="rounded-md border border-line-strong bg-paper-raised px-3 py-1.5 text-sm hover:bg-paper-sunk"
          onClick={() => setValues(start)}
          disabled={!changed && values === start}
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
