import "server-only";
import { readFileSync } from "node:fs";
import path from "node:path";
import { marked, type Token, type Tokens } from "marked";
import { ENGINE_VERSION } from "@/lib/engine/version";
import { fieldDefaults } from "@/lib/scenarios/schema";
import { componentLifeDefaultsYears, type FieldDefault } from "@/lib/scenarios/schema-economics";
import { fieldInfo } from "@/lib/scenarios/field-labels";
import { formatNumber, formatQuantity } from "@/lib/units";

/**
 * The methods document (lib/methods/methods.md) as blocks that both the Methods page and the PDF
 * report's appendix render, so the two always say the same. The engine version and the table of every
 * default with its source (from the scenario schema's default registry) are filled in here.
 */

export interface Inline {
  text: string;
  strong?: boolean;
  em?: boolean;
  code?: boolean;
}

export type MethodsBlock =
  | { kind: "heading"; level: number; text: string; id: string }
  | { kind: "paragraph"; inlines: Inline[] }
  | { kind: "list"; items: Inline[][] }
  | { kind: "table"; header: string[]; rows: string[][] };

export interface MethodsDocument {
  engineVersion: string;
  title: string;
  blocks: MethodsBlock[];
}

function documentPath(): string {
  return path.join(/*turbopackIgnore: true*/ process.cwd(), "lib", "methods", "methods.md");
}

/** A default value in words: numbers as written, objects as their fields. */
export function defaultText(v: unknown): string {
  if (v === undefined || v === null) return "—";
  if (typeof v === "string") return v;
  if (typeof v === "number" || typeof v === "boolean") return String(v);
  if (Array.isArray(v)) return v.map(defaultText).join(", ");
  return Object.entries(v as Record<string, unknown>)
    .map(([k, x]) => `${k} ${defaultText(x)}`)
    .join(", ");
}

/** An identifier-like default ("variableSpeed") in words ("variable speed"); other text as written. */
function wordsOf(v: string): string {
  return /^[a-z]+(?:[A-Z][a-z0-9]*)+$/.test(v) ? v.replace(/([a-z0-9])([A-Z])/g, "$1 $2").toLowerCase() : v;
}

/**
 * A default as a person reads it: in the field's display unit (SI, like the rest of this document), percent
 * fields ×100 with "%", yes/no for switches, identifiers in words. Values with no display stay as written.
 */
export function defaultCell(field: string, v: unknown): string {
  const d = fieldInfo(field).display;
  if (typeof v === "boolean") return v ? "yes" : "no";
  if (typeof v === "string") return wordsOf(v);
  if (typeof v !== "number" || !d) return defaultText(v);
  const n = (x: number) => formatNumber(x, { sig: 4, grouping: false });
  if ("q" in d) return d.q === "money" ? n(v) + " (currency of the project)" : formatQuantity(d.q, v, "SI", { sig: 4, grouping: false });
  if ("percent" in d) return `${n(v * 100)} %${d.perYear ? "/yr" : ""}`;
  if ("unit" in d) {
    if (d.unit.startsWith("%")) return `${n(v * 100)} ${d.unit}`;
    if (d.unit === "—" || d.unit === "year") return n(v);
    return `${n(v)} ${d.unit}`;
  }
  return defaultText(v);
}

/** Every default of the scenario schema with its source, as markdown table rows: the input's name, then its key in the scenario file. */
export function defaultsTableMarkdown(): string {
  const rows: [string, string, string][] = [
    ...Object.entries(fieldDefaults as Record<string, FieldDefault>).map(([field, d]) => {
      const info = fieldInfo(field);
      const name = info.group && info.group !== info.label ? `${info.group}: ${info.label}` : info.label;
      return [`${name} (${field})`, defaultCell(field, d.default), d.source] as [string, string, string];
    }),
    ...Object.entries(componentLifeDefaultsYears).map(
      ([component, d]) =>
        [`Component life: ${wordsOf(component)}`, `${defaultText(d.default)} years`, d.source] as [
          string,
          string,
          string,
        ],
    ),
  ];
  const cell = (s: string) => s.replace(/\|/g, "\\|").replace(/\n/g, " ");
  return [
    "| Input (key in the scenario file) | Default | Source |",
    "| --- | --- | --- |",
    ...rows.map((r) => `| ${r.map(cell).join(" | ")} |`),
  ].join("\n");
}

function slug(s: string): string {
  return s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "");
}

function inlinesOf(tokens: Token[] | undefined, style: Omit<Inline, "text"> = {}): Inline[] {
  const out: Inline[] = [];
  for (const t of tokens ?? []) {
    if (t.type === "strong") out.push(...inlinesOf((t as Tokens.Strong).tokens, { ...style, strong: true }));
    else if (t.type === "em") out.push(...inlinesOf((t as Tokens.Em).tokens, { ...style, em: true }));
    else if (t.type === "codespan") out.push({ text: (t as Tokens.Codespan).text, ...style, code: true });
    else if ("tokens" in t && Array.isArray(t.tokens) && t.tokens.length)
      out.push(...inlinesOf(t.tokens as Token[], style));
    else if (t.type === "br") out.push({ text: " ", ...style });
    else out.push({ text: decode("text" in t ? String(t.text) : t.raw), ...style });
  }
  return out;
}

function decode(s: string): string {
  return s
    .replace(/&amp;/g, "&")
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'");
}

const plain = (inlines: Inline[]) => inlines.map((i) => i.text).join("");

/** Parse the document text (placeholders already filled) into blocks. */
export function methodsBlocks(markdown: string): MethodsBlock[] {
  const blocks: MethodsBlock[] = [];
  for (const t of marked.lexer(markdown)) {
    if (t.type === "heading") {
      const h = t as Tokens.Heading;
      const text = plain(inlinesOf(h.tokens));
      blocks.push({ kind: "heading", level: h.depth, text, id: slug(text) });
    } else if (t.type === "paragraph") {
      blocks.push({ kind: "paragraph", inlines: inlinesOf((t as Tokens.Paragraph).tokens) });
    } else if (t.type === "list") {
      blocks.push({ kind: "list", items: (t as Tokens.List).items.map((i) => inlinesOf(i.tokens)) });
    } else if (t.type === "table") {
      const tb = t as Tokens.Table;
      blocks.push({
        kind: "table",
        header: tb.header.map((c) => plain(inlinesOf(c.tokens))),
        rows: tb.rows.map((r) => r.map((c) => plain(inlinesOf(c.tokens)))),
      });
    } else if (t.type !== "space" && t.type !== "hr") {
      blocks.push({ kind: "paragraph", inlines: [{ text: decode(t.raw.trim()) }] });
    }
  }
  return blocks;
}

let cached: MethodsDocument | undefined;

/** The methods document as shipped, with the current engine version and the defaults table filled in. */
export function methodsDocument(): MethodsDocument {
  if (cached) return cached;
  const text = readFileSync(documentPath(), "utf8")
    .replaceAll("{{ENGINE_VERSION}}", ENGINE_VERSION)
    .replace("{{DEFAULTS_TABLE}}", defaultsTableMarkdown());
  const blocks = methodsBlocks(text);
  const first = blocks[0];
  const title = first && first.kind === "heading" ? first.text : "Methods and sources";
  cached = {
    engineVersion: ENGINE_VERSION,
    title,
    blocks: first && first.kind === "heading" ? blocks.slice(1) : blocks,
  };
  return cached;
}
