import { execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { renderReportPdf } from "@/lib/reports/pdf/render";
import { reportSource } from "./fixture";

const PAGES = path.resolve(__dirname, "../../../test-results/report-pages");

function pdfToText(pdf: Buffer): string {
  const dir = mkdtempSync(path.join(tmpdir(), "ll-pdf-"));
  try {
    const file = path.join(dir, "r.pdf");
    writeFileSync(file, pdf);
    return execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

describe("PDF report", () => {
  it("renders and writes page images", async () => {
    const src = await reportSource();
    const t0 = performance.now();
    const pdf = await renderReportPdf(src);
    const ms = performance.now() - t0;
    console.log(`PDF ${pdf.length} bytes in ${ms.toFixed(0)} ms (${src.fixture})`);
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    mkdirSync(PAGES, { recursive: true });
    for (const f of readdirSync(PAGES)) rmSync(path.join(PAGES, f));
    writeFileSync(path.join(PAGES, "report.pdf"), pdf);
    execFileSync("pdftoppm", ["-png", "-r", "80", path.join(PAGES, "report.pdf"), path.join(PAGES, "page")]);
    const text = pdfToText(pdf);
    writeFileSync(path.join(PAGES, "report.txt"), text);
    expect(text).toContain("lowest life-cycle cost");
  }, 60_000);
});
