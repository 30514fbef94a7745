/**
 * Report downloads against the running app, signed in through the real sign-in page in Chromium:
 * demo finance downloads the PDF and the workbook of the demo scenario's issued version; the owner may
 * not have the workbook (403), another firm's consultant cannot see the scenario at all (404), an
 * anonymous caller must sign in (401) — and none of those refusals writes an audit event or a file.
 * Also measures how long the PDF takes and how long an unrelated request waits meanwhile.
 */
import { execFileSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import ExcelJS from "exceljs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext } from "playwright-core";
import { createDb } from "@/db/client";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed";
import { hashPassword } from "@/lib/auth/password";
import { usd } from "@/tests/support/money";
import { BASE_URL, launchBrowser, newContext, signIn } from "./support";

const OUT = path.resolve(__dirname, "../../test-results/report-pages");
mkdirSync(OUT, { recursive: true });

const db = createDb(process.env.DATABASE_URL!, 2);
let browser: Browser;
let scenarioId: string;
let versionLcc: { label: string; lcc: number }[] = [];
const rivalEmail = `rival.${Date.now().toString(36)}@elsewhere.example`;
const rivalPassword = "rival-consultant-pass-2026";

async function auditCount(): Promise<number> {
  const r = await db
    .selectFrom("audit_events")
    .select((eb) => eb.fn.countAll<number>().as("n"))
    .where("action", "=", "report.download")
    .where("target_id", "=", scenarioId)
    .executeTakeFirstOrThrow();
  return Number(r.n);
}

async function signedIn(email: string, password: string): Promise<BrowserContext> {
  const ctx = await newContext(browser);
  const page = await ctx.newPage();
  await signIn(page, email, password);
  await page.close();
  return ctx;
}

beforeAll(async () => {
  browser = await launchBrowser();
  const project = await db
    .selectFrom("projects")
    .select(["id", "firm_id"])
    .where("name", "like", "Harrowgate Flats%")
    .executeTakeFirstOrThrow();
  // The seed's issued demo scenario (W2's seed issues version 1).
  const v = await db
    .selectFrom("scenario_versions")
    .select(["scenario_id", "result"])
    .where("project_id", "=", project.id)
    .orderBy("version_number", "desc")
    .executeTakeFirst();
  if (!v) throw new Error("The demo seed has no issued version: run the seed (db/seed.ts) first.");
  scenarioId = v.scenario_id;
  const result = (typeof v.result === "string" ? JSON.parse(v.result) : v.result) as {
    economics: { options: { label: string; lcc: number }[] };
  };
  versionLcc = result.economics.options.map((o) => ({ label: o.label, lcc: o.lcc }));
  // A consultant of another firm, who must not learn the scenario exists.
  const firm = await db
    .insertInto("firms")
    .values({ name: `Elsewhere Engineering (report test ${Date.now()})` })
    .returning("id")
    .executeTakeFirstOrThrow();
  const user = await db
    .insertInto("users")
    .values({ email: rivalEmail, name: "Rhea Rival", password_hash: await hashPassword(rivalPassword) })
    .returning("id")
    .executeTakeFirstOrThrow();
  await db
    .insertInto("firm_members")
    .values({ firm_id: firm.id, user_id: user.id, role: "consultant" })
    .execute();
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

describe("report downloads", () => {
  it("finance downloads the PDF of the issued version; an unrelated request is not held up meanwhile", async () => {
    const ctx = await signedIn(DEMO_ACCOUNTS.finance.email, DEMO_PASSWORD);
    const before = await auditCount();
    // Baseline: how long the sign-in page takes with nothing else running.
    const baseline: number[] = [];
    for (let i = 0; i < 5; i++) {
      const b0 = performance.now();
      await (await fetch(`${BASE_URL}/signin`)).text();
      baseline.push(performance.now() - b0);
    }
    const t0 = performance.now();
    let done = false;
    const pdfReq = ctx.request
      .get(`/api/scenarios/${scenarioId}/report`, { timeout: 120_000 })
      .finally(() => (done = true));
    // While the PDF renders, keep timing the cheap request (bounded: at most 200 requests).
    const during: number[] = [];
    for (let i = 0; i < 200 && !done; i++) {
      const p0 = performance.now();
      const ping = await fetch(`${BASE_URL}/signin`);
      await ping.text();
      expect(ping.status).toBe(200);
      during.push(performance.now() - p0);
      await new Promise((r) => setTimeout(r, 50));
    }
    const pingMs = Math.max(0, ...during);
    const res = await pdfReq;
    const pdfMs = performance.now() - t0;
    expect(res.status()).toBe(200);
    const h = res.headers();
    expect(h["content-type"]).toBe("application/pdf");
    expect(h["cache-control"]).toBe("private, no-store");
    expect(h["content-disposition"]).toMatch(
      /^attachment; filename="harrowgate-flats-cold-store[a-z0-9.-]*_[a-z0-9.-]+_v1_report_\d{4}-\d{2}-\d{2}\.pdf"/,
    );
    const body = await res.body();
    expect(body.subarray(0, 5).toString()).toBe("%PDF-");
    writeFileSync(path.join(OUT, "e2e-finance-report.pdf"), body);
    const text = execFileSync("pdftotext", [path.join(OUT, "e2e-finance-report.pdf"), "-"], {
      encoding: "utf8",
    }).replace(/\s+/g, " ");
    // The issued version's LCCs, in whole dollars (the test's own formatting rule).
    for (const o of versionLcc) expect(text.includes(usd(o.lcc))).toBe(true);
    expect(text).toContain("Version 1");
    expect(await auditCount()).toBe(before + 1);
    const audit = await db
      .selectFrom("audit_events")
      .select(["detail"])
      .where("action", "=", "report.download")
      .where("target_id", "=", scenarioId)
      .orderBy("at", "desc")
      .executeTakeFirstOrThrow();
    expect((audit.detail as { format: string }).format).toBe("pdf");
    const med = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? NaN;
    console.log(
      `[report e2e] PDF ${body.length} bytes in ${pdfMs.toFixed(0)} ms; /signin alone: median ${med(baseline).toFixed(0)} ms; ` +
        `during the render: ${during.length} requests, median ${med(during).toFixed(0)} ms, slowest ${pingMs.toFixed(0)} ms`,
    );
    // A second PDF: the worker is warm now.
    const t1 = performance.now();
    const again = await ctx.request.get(`/api/scenarios/${scenarioId}/report`, { timeout: 120_000 });
    expect(again.status()).toBe(200);
    console.log(`[report e2e] second PDF in ${(performance.now() - t1).toFixed(0)} ms`);
    await ctx.close();
  });

  it("finance downloads the workbook, with live formulas, and the CSV exports", async () => {
    const ctx = await signedIn(DEMO_ACCOUNTS.finance.email, DEMO_PASSWORD);
    const before = await auditCount();
    const t0 = performance.now();
    const res = await ctx.request.get(`/api/scenarios/${scenarioId}/workbook`);
    const ms = performance.now() - t0;
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toBe(
      "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
    );
    expect(res.headers()["content-disposition"]).toMatch(
      /filename="[a-z0-9._-]+_v1_cash-flows_\d{4}-\d{2}-\d{2}\.xlsx"/,
    );
    const buf = await res.body();
    writeFileSync(path.join(OUT, "e2e-finance-workbook.xlsx"), buf);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(buf as unknown as ArrayBuffer);
    const lcc = wb.getWorksheet("Summary")!.getCell(5, 3).value as { formula: string; result: number };
    expect(lcc.formula).toBe("LCC_1");
    expect(Math.abs(lcc.result - versionLcc[0]!.lcc)).toBeLessThan(0.01);
    console.log(`[report e2e] workbook ${buf.length} bytes in ${ms.toFixed(0)} ms`);
    for (const table of ["cashflows", "water-energy", "climate-bins"]) {
      const c = await ctx.request.get(`/api/scenarios/${scenarioId}/csv/${table}`);
      expect(c.status()).toBe(200);
      expect(c.headers()["content-type"]).toBe("text/csv; charset=utf-8");
      const first = (await c.text()).split("\r\n")[0]!;
      expect(first).toMatch(/\((USD|kgal|°F|h|kWh)/);
    }
    expect(await auditCount()).toBe(before + 4);
    await ctx.close();
  });

  it("refuses the owner the workbook (403), another firm's consultant the PDF (404), an anonymous caller (401): no file, no audit", async () => {
    const before = await auditCount();
    const owner = await signedIn(DEMO_ACCOUNTS.owner.email, DEMO_PASSWORD);
    const o = await owner.request.get(`/api/scenarios/${scenarioId}/workbook`);
    expect(o.status()).toBe(403);
    expect(o.headers()["content-disposition"]).toBeUndefined();
    expect(o.headers()["content-type"]).toContain("application/json");
    const oc = await owner.request.get(`/api/scenarios/${scenarioId}/csv/cashflows`);
    expect(oc.status()).toBe(403);
    // The owner may have the PDF of the issued version, but not a version that does not exist.
    const missing = await owner.request.get(`/api/scenarios/${scenarioId}/report?version=99`);
    expect(missing.status()).toBe(404);
    await owner.close();

    const rival = await signedIn(rivalEmail, rivalPassword);
    const r = await rival.request.get(`/api/scenarios/${scenarioId}/report`);
    expect(r.status()).toBe(404);
    const rBody = await r.text();
    expect(rBody).not.toContain("Harrowgate");
    // The same answer as for an id that does not exist at all.
    const unknown = await rival.request.get(`/api/scenarios/00000000-0000-4000-8000-000000000000/report`);
    expect(unknown.status()).toBe(404);
    expect(await unknown.text()).toBe(rBody);
    await rival.close();

    for (const p of ["report", "workbook", "csv/cashflows"]) {
      const a = await fetch(`${BASE_URL}/api/scenarios/${scenarioId}/${p}`, { redirect: "manual" });
      expect(a.status).toBe(401);
      expect(a.headers.get("content-disposition")).toBeNull();
    }
    expect(await auditCount()).toBe(before);
  });
  it("the issued version's page offers finance the PDF, workbook and CSVs, the owner only the PDF, and the link downloads", async () => {
    const project = await db.selectFrom("scenarios").select("project_id").where("id", "=", scenarioId).executeTakeFirstOrThrow();
    const url = `/projects/${project.project_id}/scenarios/${scenarioId}/versions/1`;
    const finance = await signedIn(DEMO_ACCOUNTS.finance.email, DEMO_PASSWORD);
    const page = await finance.newPage();
    await page.goto(url);
    await expect(page.getByTestId("download-pdf").count()).resolves.toBe(1);
    await expect(page.getByTestId("download-workbook").count()).resolves.toBe(1);
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("download-pdf").click()]);
    expect(download.suggestedFilename()).toMatch(/\.pdf$/);
    await finance.close();
    const owner = await signedIn(DEMO_ACCOUNTS.owner.email, DEMO_PASSWORD);
    const op = await owner.newPage();
    await op.goto(url);
    await expect(op.getByTestId("download-pdf").count()).resolves.toBe(1);
    await expect(op.getByTestId("download-workbook").count()).resolves.toBe(0);
    await owner.close();
  });
});
