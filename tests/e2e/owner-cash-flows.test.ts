/**
 * The owner never receives yearly cash flows, by any route: signed in as the demo owner through the real
 * sign-in page, every route and page that carries the scenario's results is downloaded and inspected —
 * JSON bodies must hold no yearly cash-flow rows, each page of the PDF (read with poppler's pdftotext)
 * no cash-flow table, the HTML of the pages no yearly table. Finance, who may see them, gets them from the
 * same routes (so the checks can fail). Expectations written out here, not read from the permission code.
 */
import { execFileSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext } from "playwright-core";
import { createDb } from "@/db/client";
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_PROJECT } from "@/db/seed";
import { launchBrowser, newContext, signIn } from "./support";

const OUT = path.resolve(__dirname, "../../test-results/owner-cash-flows");
mkdirSync(OUT, { recursive: true });
const db = createDb(process.env.DATABASE_URL!, 2);
let browser: Browser;
let projectId: string;
let scenarioId: string;
let versionId: string;

/** Words that only a yearly cash-flow table or chart prints. */
const CASH_TABLE_MARKS = ["Yearly cash flows per option", "Cumulative PV", "Cumulative discounted cost", "cumulativePresentValue", "presentValueByCategory"];

/** Every yearly row under a "cashFlows" or "differenceCashFlows" key of a JSON body. */
function yearlyRows(v: unknown): number {
  if (Array.isArray(v)) return v.reduce((n: number, x) => n + yearlyRows(x), 0);
  if (!v || typeof v !== "object") return 0;
  let n = 0;
  for (const [k, x] of Object.entries(v)) n += (k === "cashFlows" || k === "differenceCashFlows") && Array.isArray(x) ? x.length : yearlyRows(x);
  return n;
}

async function signedIn(email: string): Promise<BrowserContext> {
  const ctx = await newContext(browser);
  const page = await ctx.newPage();
  await signIn(page, email, DEMO_PASSWORD);
  await page.close();
  return ctx;
}

function pdfPages(file: string): string[] {
  const info = execFileSync("pdfinfo", [file], { encoding: "utf8" });
  const pages = Number(/Pages:\s+(\d+)/.exec(info)?.[1] ?? 0);
  return Array.from({ length: pages }, (_, i) =>
    execFileSync("pdftotext", ["-f", String(i + 1), "-l", String(i + 1), file, "-"], { encoding: "utf8" }).replace(/\s+/g, " "),
  );
}

beforeAll(async () => {
  browser = await launchBrowser();
  projectId = (await db.selectFrom("projects").select("id").where("name", "=", DEMO_PROJECT.name).executeTakeFirstOrThrow()).id;
  const v = await db.selectFrom("scenario_versions").select(["id", "scenario_id"]).where("project_id", "=", projectId).orderBy("version_number").executeTakeFirstOrThrow();
  scenarioId = v.scenario_id;
  versionId = v.id;
});
afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

/** The routes and pages that carry a scenario's results, as the client viewers call them. */
const jsonRoutes = () => [
  { method: "GET", url: `/api/scenarios/${scenarioId}/results` },
  { method: "GET", url: `/api/scenarios/${scenarioId}/results?version=1` },
  { method: "GET", url: `/api/scenarios/${scenarioId}/results?part=monteCarlo` },
  { method: "GET", url: `/api/scenarios/${scenarioId}/export` },
  { method: "POST", url: `/api/scenarios/${scenarioId}/what-if?version=1`, data: { electricityPriceFactor: 1.2 } },
  { method: "GET", url: `/api/projects/${projectId}/comments?versionId=${versionId}` },
  { method: "GET", url: `/api/projects/${projectId}/climate` },
];
const pages = () => [
  `/projects/${projectId}`,
  `/projects/${projectId}/scenarios/${scenarioId}/versions`,
  `/projects/${projectId}/scenarios/${scenarioId}/versions/1`,
];

describe("yearly cash flows by role", () => {
  it("the owner: no route, page or PDF page carries a yearly cash-flow table", async () => {
    const owner = await signedIn(DEMO_ACCOUNTS.owner.email);
    const seen: string[] = [];
    for (const r of jsonRoutes()) {
      const res = r.method === "GET" ? await owner.request.get(r.url) : await owner.request.post(r.url, { data: r.data });
      const body = await res.text();
      seen.push(`${r.method} ${r.url} ${res.status()}`);
      expect(res.status(), r.url).toBeLessThan(500);
      if (res.headers()["content-type"]?.includes("json")) expect(yearlyRows(JSON.parse(body)), r.url).toBe(0);
      for (const m of CASH_TABLE_MARKS) expect(body, `${r.url} contains ${m}`).not.toContain(m);
    }
    // Routes that exist to carry cash flows are refused outright.
    for (const p of ["workbook", "csv/cashflows", "csv/water-energy", "csv/climate-bins"]) {
      const res = await owner.request.get(`/api/scenarios/${scenarioId}/${p}`);
      expect(res.status(), p).toBe(403);
      expect(yearlyRows(await res.json())).toBe(0);
    }
    for (const url of pages()) {
      const page = await owner.newPage();
      const res = await page.goto(url);
      expect(res?.status(), url).toBe(200);
      const html = await page.content();
      for (const m of CASH_TABLE_MARKS) expect(html, `${url} contains ${m}`).not.toContain(m);
      await page.close();
    }
    const pdf = await owner.request.get(`/api/scenarios/${scenarioId}/report`, { timeout: 120_000 });
    expect(pdf.status()).toBe(200);
    const file = path.join(OUT, "owner-report.pdf");
    writeFileSync(file, await pdf.body());
    const texts = pdfPages(file);
    expect(texts.length).toBeGreaterThan(3);
    texts.forEach((t, i) => {
      for (const m of CASH_TABLE_MARKS) expect(t, `PDF page ${i + 1} contains ${m}`).not.toContain(m);
    });
    // The owner's report still has its life-cycle costs and the methods appendix.
    expect(texts.join(" ")).toContain("Life-cycle cost by category");
    expect(texts.join(" ")).toContain("Methods and sources");
    console.log(`[owner-cash-flows] ${seen.length} JSON routes, ${pages().length} pages, ${texts.length} PDF pages inspected`);
    await owner.close();
  });

  it("finance, who may see them, gets yearly cash flows from the same routes and PDF (the checks can fail)", async () => {
    const finance = await signedIn(DEMO_ACCOUNTS.finance.email);
    const res = await finance.request.get(`/api/scenarios/${scenarioId}/results`);
    expect(res.status()).toBe(200);
    expect(yearlyRows(await res.json())).toBeGreaterThan(0);
    const pdf = await finance.request.get(`/api/scenarios/${scenarioId}/report`, { timeout: 120_000 });
    const file = path.join(OUT, "finance-report.pdf");
    writeFileSync(file, await pdf.body());
    expect(pdfPages(file).join(" ")).toContain("Yearly cash flows per option");
    expect((await finance.request.get(`/api/scenarios/${scenarioId}/csv/cashflows`)).status()).toBe(200);
    await finance.close();
  });
});
