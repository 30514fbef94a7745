/**
 * The PDF report rendered from a stored result: its text (pdftotext, Debian poppler-utils) carries the
 * summary's numbers exactly as the result has them, formatted by the same functions; its pages are
 * written as PNG images to test-results/report-pages/ for a person to look at.
 */
import { execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { monitorEventLoopDelay } from "node:perf_hooks";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { fmtMoney, fmtPercent, fmtRatio, fmtYears } from "@/lib/reports/format";
import { hasGlyph } from "@/lib/reports/pdf/glyphs";
import { renderReportPdfOffThread } from "@/lib/reports/pdf/offthread";
import { renderReportPdf } from "@/lib/reports/pdf/render";
import { buildSummary } from "@/lib/reports/summary";
import type { ReportSource } from "@/lib/reports/types";
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
let renderMs = 0;
let maxLoopDelayMs = 0;

beforeAll(async () => {
  src = await reportSource();
  // Render on the worker thread as the route does, watching how long the event loop is held up meanwhile.
  const h = monitorEventLoopDelay({ resolution: 10 });
  h.enable();
  const t0 = performance.now();
  pdf = await renderReportPdfOffThread(src);
  renderMs = performance.now() - t0;
  h.disable();
  maxLoopDelayMs = h.max / 1e6;
  console.log(
    `[report] PDF ${pdf.length} bytes, ${pageCount(pdf)} pages, ${renderMs.toFixed(0)} ms on the worker thread (fixture: ${src.fixture}); event-loop delay max ${maxLoopDelayMs.toFixed(0)} ms`,
  );
  mkdirSync(PAGES, { recursive: true });
  for (const f of readdirSync(PAGES)) rmSync(path.join(PAGES, f), { recursive: true, force: true });
  writeFileSync(path.join(PAGES, "report.pdf"), pdf);
  execFileSync("pdftoppm", ["-png", "-r", "80", path.join(PAGES, "report.pdf"), path.join(PAGES, "page")]);
}, 120_000);

afterAll(() => {
  // Nothing to clean: the worker is unref'd and ends with the process.
});

describe("PDF report", () => {
  it("is a PDF of several pages with the document's title", () => {
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(pageCount(pdf)).toBeGreaterThanOrEqual(8);
  });

  it("prints the summary's numbers exactly as the stored result has them", () => {
    const text = pdfToText(pdf, ["-f", "2", "-l", "2"]);
    const flat = text.replace(/\s+/g, " ");
    const summary = buildSummary(src.result, src.project.currency, src.unitSystem);
    const cur = src.project.currency;
    expectContains(flat, summary.headline);
    for (const o of src.result.economics.options) {
      // LCC, first cost and annualised cost of every option, as the engine computed them.
      expectContains(flat, fmtMoney(o.lcc, cur));
      expectContains(flat, fmtMoney(o.firstCost, cur));
      expectContains(flat, fmtMoney(o.annualisedCost, cur));
    }
    for (const c of src.result.economics.comparisons) {
      expectContains(flat, fmtMoney(c.netSavings, cur));
      if (c.sir !== null) expectContains(flat, fmtRatio(c.sir));
      if (c.airr !== null) expectContains(flat, fmtPercent(c.airr));
      if (c.simplePaybackYears !== null) expectContains(flat, fmtYears(c.simplePaybackYears));
    }
    // The headline gap is the difference of the two lowest LCCs.
    const sorted = [...src.result.economics.options].sort((a, b) => a.lcc - b.lcc);
    expectContains(flat, fmtMoney(sorted[1]!.lcc - sorted[0]!.lcc, cur));
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
    expectContains(text, `${src.scenarioName} · ${src.versionLabel}`);
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

  it("repeats the cash-flow table's header row on every page the table continues on", () => {
    const n = pageCount(pdf);
    let pagesWithCashHeader = 0;
    for (let p = 1; p <= n; p++) {
      const t = pdfToText(pdf, ["-f", String(p), "-l", String(p)]);
      if (/Cumulative PV/.test(t)) pagesWithCashHeader++;
    }
    // One table per option at least, and every continuation page shows the header again.
    expect(pagesWithCashHeader).toBeGreaterThanOrEqual(src.result.economics.options.length);
  });

  it("uses only characters the shipped latin font subset can draw", () => {
    const text = pdfToText(pdf);
    const missing = [
      ...new Set([...text].filter((ch) => ch.codePointAt(0)! >= 0x20 && !hasGlyph(ch.codePointAt(0)!))),
    ];
    // pdftotext adds form feeds and new lines between pages; everything else must be drawable.
    expect(missing.filter((c) => c !== "\f")).toEqual([]);
  });

  it("renders the same document on the main thread (fallback path)", async () => {
    const again = await renderReportPdf(src);
    expect(pageCount(again)).toBe(pageCount(pdf));
    expect(pdfToText(again, ["-f", "2", "-l", "2"])).toBe(pdfToText(pdf, ["-f", "2", "-l", "2"]));
  }, 120_000);

  it("keeps the event loop responsive while the worker renders (benchmark figure, printed above)", () => {
    // Not a timing assertion on the render itself; the loop delay is the point of the worker.
    expect(renderMs).toBeGreaterThan(0);
    expect(maxLoopDelayMs).toBeLessThan(1000);
  });
});
