import Link from "next/link";

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-xl px-gutter py-24 text-center">
      <p className="font-mono text-sm text-ink-faint">403</p>
      <h1 className="mt-2 text-2xl font-semibold">Not part of your access</h1>
      <p className="mt-2 text-ink-soft">Your role on this project does not include this. Ask the project&apos;s consultant if you need it.</p>
      <Link href="/projects" className="mt-6 inline-block text-basin-700 underline">Back to projects</Link>
    </main>
  );
}
