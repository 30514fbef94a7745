"use client";

import { useRouter } from "next/navigation";
import useSWR from "swr";

interface FullState {
  status: "queued" | "running" | "done" | "failed";
  error: string | null;
}

async function getJson(url: string): Promise<{ full: FullState | null }> {
  const res = await fetch(url, { headers: { accept: "application/json" } });
  if (!res.ok) throw new Error(`status ${res.status}`);
  return res.json();
}

/**
 * Shown while a worker analyses the draft (an hourly year takes seconds): polls `pollUrl` and reloads the
 * page's data once the result is stored.
 */
export function AnalysisPending({ pollUrl, initialStatus }: { pollUrl: string; initialStatus: "queued" | "running" }) {
  const router = useRouter();
  const { data } = useSWR(pollUrl, getJson, {
    refreshInterval: (latest) => {
      const s = latest?.full?.status ?? initialStatus;
      return s === "queued" || s === "running" ? 1500 : 0;
    },
    revalidateOnFocus: false,
    onSuccess: (d) => {
      if (d.full?.status === "done" || d.full?.status === "failed") router.refresh();
    },
  });
  const status = data?.full?.status ?? initialStatus;
  return (
    <div role="status" data-testid="analysis-pending" className="rounded-panel border border-dashed border-line-strong bg-paper px-panel py-8 text-center">
      <p className="font-semibold">{status === "running" ? "Analysing these inputs…" : "The analysis is queued…"}</p>
      <p className="mt-2 text-sm text-ink-soft">
        A background worker computes the year; the comparison appears here when it is stored. You can leave this page meanwhile.
      </p>
    </div>
  );
}
