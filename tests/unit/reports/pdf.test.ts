/**
 * The PDF report rendered from a stored result: its text (pdftotext, Debian poppler-utils) carries the
 * stored result's numbers, formatted here by the test's own rule (whole US dollars with comma grouping, a
 * leading minus), not by the report's formatters; its pages are written as PNG images to
 * test-results/report-pages/ for a person to look at.
 */
import { execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { hasGlyph } from "@/lib/reports/pdf/glyphs";
import { renderReportPdfOffThread } from "@/lib/reports/pdf/offthread";
import { renderReportPdf } from "@/lib/reports/pdf/render";
import type { ReportSource } from "@/lib/reports/types";
import { fixed, usd } from "@/tests/support/money";
import { reportSource } from "./fixture";

const PAGES = path.resolve(__dirname, "../../../test-results/report-pages");

function pdfToText(pdf: Buffer, args: string[] = []): string {
  const dir = mkdtempSync(path.join(tmpdir(), "ll-pdf-"));
  try {
    const file = path.join(dir, "r.pdf");
    writeFileSync(file, pdf);
    return execFileSync("pdftotext", [...args, file, "-"], { encoding: "utf8" });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function pageCount(pdf: Buffer): number {
  const dir = mkdtempSync(path.join(tmpdir(), "ll-pdf-"));
  try {
    const file = path.join(dir, "r.pdf");
    writeFileSync(file, pdf);
    const info = execFileSync("pdfinfo", [file], { encoding: "utf8" });
    return Number(/Pages:\s+(\d+)/.exec(info)?.[1] ?? 0);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** A short failure message instead of the whole document's text. */
function expectContains(text: string, needle: string) {
  if (!text.includes(needle)) expect.fail(`PDF text lacks ${JSON.stringify(needle)}`);
}

let src: ReportSource & { fixture: string };
let pdf: Buffer;

beforeAll(async () => {
  src = await reportSource();
  // Render on the worker thread as the route does.
  pdf = await renderReportPdfOffThread(src);
  console.log(`[report] PDF ${pdf.length} bytes, ${pageCount(pdf)} pages (fixture: ${src.fixture})`);
  mkdirSync(PAGES, { recursive: true });
  for (const f of readdirSync(PAGES)) rmSync(path.join(PAGES, f), { recursive: true, force: true });
  writeFileSync(path.join(PAGES, "report.pdf"), pdf);
  execFileSync("pdftoppm", ["-png", "-r", "80", path.join(PAGES, "report.pdf"), path.join(PAGES, "page")]);
}, 120_000);

describe("PDF report", () => {
  it("is a PDF of several pages with the document's title", () => {
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(pageCount(pdf)).toBeGreaterThanOrEqual(8);
  });

  it("prints the stored result's numbers on the summary page", () => {
    expect(src.project.currency).toBe("USD");
    const text = pdfToText(pdf, ["-f", "2", "-l", "2"]);
    const flat = text.replace(/\s+/g, " ");
    // The summary's opening sentence names the option of lowest LCC (the product's wording).
    const sorted = [...src.result.economics.options].sort((a, b) => a.lcc - b.lcc);
    expectContains(flat, `${sorted[0]!.label} has the lowest life-cycle cost.`);
    for (const o of src.result.economics.options) {
      // LCC, first cost and annualised cost of every option, as the engine stored them.
      expectContains(flat, usd(o.lcc));
      expectContains(flat, usd(o.firstCost));
      expectContains(flat, usd(o.annualisedCost));
    }
    for (const c of src.result.economics.comparisons) {
      expectContains(flat, usd(c.netSavings));
      if (c.sir !== null) expectContains(flat, fixed(c.sir, 2));
      if (c.airr !== null) expectContains(flat, `${fixed(c.airr * 100, 1)}%`);
      if (c.simplePaybackYears !== null) expectContains(flat, `${fixed(c.simplePaybackYears, 1)} yr`);
    }
    // The headline gap is the difference of the two lowest LCCs.
    expectContains(flat, usd(sorted[1]!.lcc - sorted[0]!.lcc));
  });

  it("has the cover facts, running header with scenario and version, page numbers, methods and cautions", () => {
    const text = pdfToText(pdf).replace(/\s+/g, " ");
    for (const s of [
      src.project.name,
      src.project.clientName,
      src.project.siteName,
      src.preparedBy.firmName,
      "Cole Pereira",
      "Issued 1 December 2026",
    ]) {
      expectContains(text, s);
    }
    const pages = pageCount(pdf);
    expectContains(text, `Page 2 of ${pages}`);
    expectContains(text, `Page ${pages} of ${pages}`);
    // The running header prints a scenario name of up to 64 characters whole; a longer one (the engine fixture's
    // is 91) as its start cut at a word with "…", so it cannot run into the firm's name on the left.
    const esc = (x: string) => x.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
    if (src.scenarioName.length <= 64) expectContains(text, `${src.scenarioName} · ${src.versionLabel}`);
    else expect(text).toMatch(new RegExp(`${esc(src.scenarioName.slice(0, 20))}[^·…]{0,44}… · ${esc(src.versionLabel)}`));
    expectContains(text, src.scenarioName);
    // The appendix is the methods document, the same text as the app's Methods page.
    for (const s of ["Methods and sources", "4. Water balance and chemistry", "Water density: 998.2 kg/m³", "14. Defaults and their sources"]) {
      expectContains(text, s);
    }
    for (const s of [
      "Merkel",
      "ATC-105",
      "NIST Handbook 135",
      "ASTM E917",
      "Kern",
      "effectiveness-NTU",
      "Legionella",
      "water-management programme",
      "Freezing",
      "Ammonia",
      "Structural",
      "Screening estimate",
    ]) {
      expectContains(text, s);
    }
  });

  it("has one cash-flow table per option and repeats its header row on every page it continues on", () => {
    const n = pageCount(pdf);
    let tables = 0;
    let pagesWithRows = 0;
    for (let p = 1; p <= n; p++) {
      const t = pdfToText(pdf, ["-f", String(p), "-l", String(p), "-layout"]);
      tables += (t.match(/: constant dollars \(real\)|: current dollars \(nominal\)/g) ?? []).length;
      // A data row: study year, calendar year, then money ("12   2037   $0 ...").
      const hasRows = /^\s*\d+(?: \(base\))?\s+20\d\d\s+-?\$/m.test(t);
      if (!hasRows) continue;
      pagesWithRows++;
      if (!/Cumulative PV/.test(t)) expect.fail(`page ${p} continues a cash-flow table without its header row`);
      // The chemicals column is headed in words, not an unexplained abbreviation (the header wraps in its
      // column and pdftotext interleaves the wrapped lines, so the words are looked for one by one).
      if (/\bWMP\b/.test(t)) expect.fail(`page ${p} abbreviates the water-management programme`);
      if (/Chemicals &/.test(t)) for (const w of ["water-management", "programme"]) expect(t).toContain(w);
    }
    expect(tables).toBe(src.result.economics.options.length);
    expect(pagesWithRows).toBeGreaterThanOrEqual(src.result.economics.options.length);
  });

  it("says in each cash-flow table which 2026 is year 0 (first cost) and which year 1 (first operating year)", () => {
    // The fixture's base year is 2026: year 0 is 1 January 2026 (first costs) and year 1, the first operating
    // year, is also 2026 (NIST Handbook 135's base date and study years); the wording is the workbook's.
    expect(src.result.economics.baseYear).toBe(2026);
    const text = pdfToText(pdf).replace(/\s+/g, " ");
    const n = src.result.economics.options.length;
    expect(text.match(/2026 \(year 0, first cost\)/g)?.length ?? 0).toBeGreaterThanOrEqual(n);
    expect(text.match(/2026 \(year 1, first operating year\)/g)?.length ?? 0).toBeGreaterThanOrEqual(n);
  });

  it("uses only characters the shipped latin font subset can draw", () => {
    const text = pdfToText(pdf);
    const missing = [
      ...new Set([...text].filter((ch) => ch.codePointAt(0)! >= 0x20 && !hasGlyph(ch.codePointAt(0)!))),
    ];
    // pdftotext adds form feeds and new lines between pages; everything else must be drawable.
    expect(missing.filter((c) => c !== "\f")).toEqual([]);
    // Characters outside the subset (ε, ∝, subscripts…) are spelled out, never printed as "?": neither the
    // methods text nor the fixture contains a question mark.
    const marks = text.split("\n").filter((line) => line.includes("?"));
    expect(marks).toEqual([]);
    // Subscripts of the condensers-and-footprint page are drawn as digits, not replaced by "?".
    expect(text).toContain("CO2e from refrigerant leakage per year");
    expect(text).not.toMatch(/CO\?e/);
  });

  it("renders the same document on the main thread (fallback path)", async () => {
    const again = await renderReportPdf(src);
    expect(pageCount(again)).toBe(pageCount(pdf));
    expect(pdfToText(again, ["-f", "2", "-l", "2"])).toBe(pdfToText(pdf, ["-f", "2", "-l", "2"]));
  }, 120_000);
});
