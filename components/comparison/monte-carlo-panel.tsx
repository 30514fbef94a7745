"use client";

import useSWR from "swr";
import type { MonteCarloInputKey, MonteCarloResult } from "@/lib/engine/economics/types";
import { MC_LABELS } from "@/lib/scenarios/field-labels";
import { formatNumber } from "@/lib/units";
import { MonteCarloChart } from "@/components/charts/monte-carlo-chart";
import { money } from "@/lib/comparison/headline";

export interface MonteCarloSlot {
  status: "queued" | "running" | "done" | "failed" | "off";
  progress: number;
  result: MonteCarloResult | null;
  error: string | null;
}

async function getJson(url: string): Promise<{ monteCarlo: MonteCarloSlot | null }> {
  const res = await fetch(url, { headers: { accept: "application/json" } });
  if (!res.ok) throw new Error(`status ${res.status}`);
  return res.json();
}

/**
 * The Monte Carlo view. While the job is queued or running it polls `pollUrl` every second and shows
 * its progress; the rest of the page stays usable meanwhile.
 */
export function MonteCarloPanel({
  initial,
  pollUrl,
  labels,
  currency,
}: {
  initial: MonteCarloSlot;
  pollUrl: string | null;
  labels: Record<string, string>;
  currency: string;
}) {
  const pending = initial.status === "queued" || initial.status === "running";
  const { data } = useSWR(pending && pollUrl ? pollUrl : null, getJson, {
    refreshInterval: (latest) => {
      const s = latest?.monteCarlo?.status ?? initial.status;
      return s === "queued" || s === "running" ? 1000 : 0;
    },
    revalidateOnFocus: false,
  });
  const mc = data?.monteCarlo ?? initial;
  if (mc.status === "off") {
    return <p className="text-sm text-ink-soft">Monte Carlo is switched off for this scenario (Economics → Uncertainty in the editor).</p>;
  }
  if (mc.status === "failed") {
    return (
      <p className="text-sm text-danger-700" role="status">
        The Monte Carlo run failed: {mc.error ?? "unknown error"}. Save the scenario again to start a new run.
      </p>
    );
  }
  if (mc.status !== "done" || !mc.result) {
    const pct = Math.round(100 * (mc.status === "queued" ? 0 : mc.progress));
    return (
      <div role="status" data-testid="monte-carlo-progress" className="text-sm">
        <p className="text-ink-soft">{mc.status === "queued" ? "Monte Carlo queued — it starts in a moment." : `Monte Carlo running — ${pct} %`}</p>
        <div
          className="mt-2 h-2 w-full overflow-hidden rounded bg-paper-sunk"
          role="progressbar"
          aria-label="Monte Carlo progress"
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={pct}
        >
          <div className="h-full bg-basin-500 transition-all" style={{ width: `${Math.max(pct, 3)}%` }} />
        </div>
        <p className="mt-2 text-xs text-ink-faint">The page stays usable; the distribution appears here when the run is done.</p>
      </div>
    );
  }
  const r = mc.result;
  return (
    <div className="space-y-4" data-testid="monte-carlo-done">
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="mb-1 text-left text-xs text-ink-faint">
            {formatNumber(r.draws, { decimals: 0 })} seeded draws (seed {r.seed}) of the uncertain inputs
          </caption>
          <thead>
            <tr className="border-b border-line text-xs text-ink-soft">
              <th className="py-1 text-left font-medium">Option</th>
              <th className="py-1 text-right font-medium">Chance of lowest LCC, %</th>
              <th className="py-1 text-right font-medium">LCC P10, {currency}</th>
              <th className="py-1 text-right font-medium">LCC P50, {currency}</th>
              <th className="py-1 text-right font-medium">LCC P90, {currency}</th>
            </tr>
          </thead>
          <tbody>
            {r.lccPercentiles.map((p) => (
              <tr key={p.optionId} className="border-b border-line last:border-0">
                <td className="py-1">{labels[p.optionId] ?? p.optionId}</td>
                <td className="num py-1" data-testid={`mc-lowest-${p.optionId}`}>{formatNumber(100 * (r.probabilityLowest[p.optionId] ?? 0), { decimals: 1 })}</td>
                <td className="num py-1">{formatNumber(p.p10, { decimals: 0 })}</td>
                <td className="num py-1">{formatNumber(p.p50, { decimals: 0 })}</td>
                <td className="num py-1">{formatNumber(p.p90, { decimals: 0 })}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        {r.netSavings.map((ns) => {
          const pair = `${labels[ns.alternativeOptionId] ?? ns.alternativeOptionId} against ${labels[ns.baseOptionId] ?? ns.baseOptionId}`;
          return (
            <div key={`${ns.baseOptionId}-${ns.alternativeOptionId}`}>
              <MonteCarloChart bins={ns.histogram} currency={currency} pairLabel={pair} draws={r.draws} />
              <p className="mt-1 text-xs text-ink-soft">
                Net savings P10 {money(ns.p10, currency)} · P50 {money(ns.p50, currency)} · P90 {money(ns.p90, currency)}; the alternative saves money in{" "}
                {formatNumber(100 * ns.probabilityPositive, { decimals: 0 })} % of draws.
              </p>
              {ns.drivers && ns.drivers.length > 0 ? <Drivers drivers={ns.drivers} labels={labels} /> : null}
            </div>
          );
        })}
      </div>
      {r.notes.length > 0 ? (
        <ul className="list-disc pl-5 text-xs text-ink-faint">
          {r.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/**
 * What drives the spread of one pair's net savings: each sampled input's Spearman rank correlation with
 * them, strongest first (+: a higher value of the input raises the alternative's net savings).
 */
function Drivers({
  drivers,
  labels,
}: {
  drivers: { input: MonteCarloInputKey; optionId?: string; rankCorrelation: number }[];
  labels: Record<string, string>;
}) {
  const shown = drivers.filter((d) => Math.abs(d.rankCorrelation) >= 0.05).slice(0, 6);
  if (shown.length === 0) return null;
  return (
    <table className="mt-2 w-full text-xs" data-testid="mc-drivers">
      <caption className="text-left text-ink-soft">What drives the spread (rank correlation with the net savings)</caption>
      <tbody>
        {shown.map((d) => {
          const name = `${MC_LABELS[d.input]?.label ?? d.input}${d.optionId ? ` — ${labels[d.optionId] ?? d.optionId}` : ""}`;
          const w = Math.round(100 * Math.abs(d.rankCorrelation));
          return (
            <tr key={`${d.input}|${d.optionId ?? ""}`}>
              <td className="py-0.5 pr-2">{name}</td>
              <td className="w-1/3 py-0.5">
                <div className="h-2 rounded bg-paper-sunk" aria-hidden>
                  <div className={`h-2 rounded ${d.rankCorrelation >= 0 ? "bg-basin-500" : "bg-danger-600"}`} style={{ width: `${w}%` }} />
                </div>
              </td>
              <td className="num w-16 py-0.5">{d.rankCorrelation > 0 ? "+" : ""}{formatNumber(d.rankCorrelation, { decimals: 2 })}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
