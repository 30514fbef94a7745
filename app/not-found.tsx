import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-gutter py-24 text-center">
      <p className="font-mono text-sm text-ink-faint">404</p>
      <h1 className="mt-2 text-2xl font-semibold">Nothing here</h1>
      <p className="mt-2 text-ink-soft">The page does not exist, or it has not been shared with you.</p>
      <Link href="/projects" className="mt-6 inline-block text-basin-700 underline">Back to projects</Link>
    </main>
  );
}
