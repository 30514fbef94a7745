"use client";

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="mx-auto max-w-xl px-gutter py-24 text-center">
      <h1 className="text-2xl font-semibold">Something went wrong</h1>
      <p className="mt-2 text-ink-soft">Nothing you saved was lost. Try again; if it keeps happening, quote this reference.</p>
      {error.digest && <p className="mt-2 font-mono text-xs text-ink-faint">ref {error.digest}</p>}
      <button onClick={reset} className="mt-6 rounded-md bg-basin-600 px-4 py-2 text-white">Try again</button>
    </main>
  );
}
