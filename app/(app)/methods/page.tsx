import type { Metadata } from "next";
import { requireViewer } from "@/lib/auth/session";
import { methodsDocument, type Inline, type MethodsBlock } from "@/lib/methods";
import { PageHeader } from "@/components/ui/panel";

export const metadata: Metadata = { title: "Methods and sources" };

function Text({ inlines }: { inlines: Inline[] }) {
  return (
    <>
      {inlines.map((i, n) => {
        let node: React.ReactNode = i.text;
        if (i.code) node = <code className="rounded bg-paper-sunk px-1 font-mono text-[0.9em]">{node}</code>;
        if (i.em) node = <em>{node}</em>;
        if (i.strong) node = <strong>{node}</strong>;
        return <span key={n}>{node}</span>;
      })}
    </>
  );
}

function Block({ b }: { b: MethodsBlock }) {
  switch (b.kind) {
    case "heading":
      return b.level <= 2 ? (
        <h2 id={b.id} className="mt-8 scroll-mt-4 text-lg font-semibold">
          {b.text}
        </h2>
      ) : (
        <h3 id={b.id} className="mt-6 font-semibold">
          {b.text}
        </h3>
      );
    case "paragraph":
      return (
        <p className="mt-3 text-sm leading-6">
          <Text inlines={b.inlines} />
        </p>
      );
    case "list":
      return (
        <ul className="mt-3 list-disc space-y-1.5 pl-5 text-sm leading-6">
          {b.items.map((item, n) => (
            <li key={n}>
              <Text inlines={item} />
            </li>
          ))}
        </ul>
      );
    case "table":
      return (
        <div className="mt-3 overflow-x-auto">
          <table className="w-full text-left text-xs" data-testid="methods-defaults">
            <thead>
              <tr className="border-b border-line-strong">
                {b.header.map((h) => (
                  <th key={h} scope="col" className="py-1.5 pr-3 font-semibold">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {b.rows.map((r, n) => (
                <tr key={n} className="border-b border-line align-top">
                  {r.map((c, k) => (
                    <td key={k} className={`py-1.5 pr-3 ${k === 0 ? "font-mono" : ""}`}>
                      {c}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      );
  }
}

/** The methods document, for every signed-in person (the PDF report carries the same text as its appendix). */
export default async function MethodsPage() {
  await requireViewer();
  const doc = methodsDocument();
  const sections = doc.blocks.filter(
    (b): b is Extract<MethodsBlock, { kind: "heading" }> => b.kind === "heading" && b.level === 2,
  );
  return (
    <>
      <PageHeader
        title={doc.title}
        subtitle={`How LoopLedger computes a comparison · engine version ${doc.engineVersion}`}
      />
      <div className="grid gap-8 lg:grid-cols-[14rem_1fr]">
        <nav aria-label="Sections" className="text-sm lg:sticky lg:top-4 lg:self-start">
          <ol className="space-y-1">
            {sections.map((s) => (
              <li key={s.id}>
                <a href={`#${s.id}`} className="text-basin-700 hover:underline">
                  {s.text}
                </a>
              </li>
            ))}
          </ol>
        </nav>
        <article className="max-w-3xl" data-testid="methods">
          {doc.blocks.map((b, n) => (
            <Block key={n} b={b} />
          ))}
        </article>
      </div>
    </>
  );
}
