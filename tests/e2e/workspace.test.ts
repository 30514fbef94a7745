import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_PROJECT } from "@/db/seed";
import { createDb } from "@/db/client";
import { FIRST_COST_ITEMS } from "@/lib/engine/economics/types";
import { generateSyntheticYear, syntheticYearToEpw } from "@/lib/engine/climate";
import { BASE_URL, launchBrowser, newContext, screenshot, signIn } from "./support";

let browser: Browser;
let consultant: BrowserContext;
let page: Page;
const db = createDb(process.env.DATABASE_URL!, 2);
const stamp = Date.now().toString(36);

// Invented weather from the documented generator (lib/engine/climate/synthetic.ts), never station data.
const dir = mkdtempSync(path.join(tmpdir(), "ll-workspace-"));
const epwPath = path.join(dir, "invented-valley-workspace.epw");
writeFileSync(epwPath, syntheticYearToEpw(generateSyntheticYear({ seed: 4242 })));

/** First costs typed into the editor (invented quotes): the same in both unit systems. */
const FIRST_COSTS: Record<string, Partial<Record<(typeof FIRST_COST_ITEMS)[number], number>>> = {
  "0": { equipment: 180000, installation: 60000, structureAndCrane: 30000, electrical: 25000, controls: 12000, waterTreatmentEquipment: 15000, meters: 3000, other: 0 },
  "1": { equipment: 200000, installation: 68000, structureAndCrane: 34000, electrical: 28000, controls: 14000, plateExchanger: 55000, waterTreatmentEquipment: 15000, meters: 3000, other: 0 },
  "2": { equipment: 300000, installation: 72000, structureAndCrane: 40000, electrical: 27000, controls: 13000, waterTreatmentEquipment: 10000, meters: 3000, other: 0 },
};

interface Observed {
  lccText: Record<string, string>;
  makeup: number[];
  energy: number[];
  towerEnteringShown: string;
  whatIfMs: number;
  saveMs: number;
}
const observed: Partial<Record<"IP" | "SI", Observed>> = {};

const num = (s: string) => Number(s.replace(/[,\s]/g, "").replace("\u2212", "-"));

beforeAll(async () => {
  browser = await launchBrowser();
  consultant = await newContext(browser);
  page = await consultant.newPage();
  await signIn(page, DEMO_ACCOUNTS.consultant.email, DEMO_PASSWORD);
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

async function buildAndCompare(system: "IP" | "SI"): Promise<Observed> {
  const started = Date.now();
  const step = (what: string) => console.log(`[workspace ${system}] ${((Date.now() - started) / 1000).toFixed(1)} s: ${what}`);
  // 1. A project through the project form.
  await page.goto("/projects/new");
  await page.fill("#f-clientName", "Invented Orchard Co-op");
  await page.fill("#f-name", `Packhouse condenser loop ${system} ${stamp}`);
  await page.fill("#f-siteName", "Packhouse");
  await page.fill("#f-locationLabel", "Invented valley");
  await page.selectOption("#f-unitSystem", system);
  // 240 m = 787.402 ft (NIST SP 811: 1 ft = 0.3048 m exactly); 6 significant figures keep the two sites 0.1 mm apart.
  await page.fill("#f-elevationM", system === "IP" ? "787.402" : "240");
  await page.fill("#f-currency", "USD");
  await Promise.all([page.waitForURL(/\/projects\/[0-9a-f-]{36}$/), page.click("[data-testid=project-submit]")]);
  const projectUrl = new URL(page.url()).pathname;
  // The site's elevation in the project's units (787.402 ft → "787 ft", with the stored 240 m beside it in IP).
  expect(await page.innerText("[data-testid=project-elevation]")).toMatch(system === "IP" ? /^787\s*ft \(240\s*m\)$/ : /^240\s*m$/);

  step("project created");
  // 2. The generated EPW through the climate import.
  await page.goto(`${projectUrl}/climate/import`);
  await page.setInputFiles("input[type=file]", epwPath);
  await Promise.all([page.waitForURL(/\/climate\/[0-9a-f-]{36}$/, { timeout: 60_000 }), page.click("[data-testid=climate-upload-submit]")]);

  step("climate imported");
  // 3. A new scenario on that dataset: it starts with all three option kinds.
  await page.goto(projectUrl);
  await page.fill("#new-scenario-name", `Three options ${system}`);
  await Promise.all([page.waitForURL(/\/scenarios\/[0-9a-f-]{36}\/edit$/), page.click("[data-testid=new-scenario-form] button[type=submit]")]);
  await page.waitForSelector("[data-testid=scenario-editor]");
  expect(await page.locator("[data-testid^=nav-option-]").count()).toBe(3);
  await page.click("[data-testid=nav-option-1]");

  step("editor open");
  // Values are shown in the project's units: the direct tower's default entering water is 33 °C = 91.4 °F
  // (NIST SP 811: t/°F = 1.8·t/°C + 32).
  const entering = page.locator("#f-options-0-tower-enteringWaterC");
  expect(await entering.getAttribute("data-unit")).toBe(system === "IP" ? "°F" : "°C");
  const towerEnteringShown = await entering.inputValue();
  expect(towerEnteringShown).toBe(system === "IP" ? "91.4" : "33");
  // Each default carries its source beside the field.
  expect(await page.locator("[data-field='f-options-0-fan-minSpeedFraction'] [data-testid=field-default]").innerText()).toMatch(/Default.*25.*%.*practice/);

  // First costs have no default, yet the starter saves as it is (issue 11): the nav says which options wait for them.
  expect(await page.locator("[data-testid=nav-option-1]").innerText()).toMatch(/first cost/);
  if (system === "IP") await screenshot(page, "workspace-editor-first-cost-due");

  step("client validation seen");
  for (const [i, items] of Object.entries(FIRST_COSTS)) {
    await page.click(`[data-testid=nav-option-${Number(i) + 1}]`);
    await page.click("[data-testid=part-costs]");
    for (const [k, v] of Object.entries(items)) await page.fill(`#f-options-${i}-costs-firstCost-${k}`, String(v));
  }
  await page.locator("[data-testid=form-error-summary]").waitFor({ state: "detached" }).catch(() => undefined);
  step("first costs typed");
  const t0 = Date.now();
  await page.click("[data-testid=save-scenario]");
  await page.locator("[data-testid=banner-saved]").waitFor({ timeout: 90_000 });
  const saveMs = Date.now() - t0;
  expect(await page.locator("[data-testid=banner-saved]").innerText()).toMatch(/Saved as revision 2/);
  await screenshot(page, `workspace-editor-saved-${system}`);

  step("saved");
  // 4. The comparison with every chart drawn.
  await Promise.all([page.waitForURL(/\/scenarios\/[0-9a-f-]{36}$/), page.click("[data-testid=banner-saved] a")]);
  await page.waitForSelector("[data-testid=comparison]");
  for (const chart of ["chart-cumulative", "chart-cost-stack", "chart-monthly-water", "chart-wet-bulb-bins", "chart-tornado"]) {
    await page.locator(`[data-testid=${chart}] svg`).first().waitFor({ timeout: 20_000 });
  }
  step("charts drawn");
  // The Monte Carlo runs after the response: progress first (or already done), then its distribution.
  await page.locator("[data-testid=monte-carlo-done]").waitFor({ timeout: 90_000 });
  await page.locator("[data-testid=chart-monte-carlo] svg").first().waitFor();
  expect(await page.locator("[data-testid=cautions] [data-caution=legionella]").count()).toBe(1);
  expect(await page.locator("[data-testid=screening-note]").count()).toBe(1);
  const lead = await page.locator("[data-testid=headline-lead]").innerText();
  expect(lead).toMatch(/has the lowest life-cycle cost/);
  await screenshot(page, `workspace-comparison-${system}`);

  step("Monte Carlo done");
  const lccText: Record<string, string> = {};
  for (const id of ["tower-direct", "tower-plate", "cooler"]) lccText[id] = await page.locator(`[data-testid=lcc-${id}]`).innerText();
  const cells = async (row: string) => (await page.locator(`[data-testid=${row}] td`).allInnerTexts()).map(num);
  const makeup = await cells("row-makeup");
  const energy = await cells("row-energy-total");
  expect(await page.locator("[data-testid=row-makeup] th").innerText()).toContain(system === "IP" ? "kgal/yr" : "m³/yr");

  step("table read");
  // 5. The what-if: move the water + sewer slider; the headline number changes, nothing is saved.
  const revisionBefore = await db.selectFrom("scenarios").select("revision").where("name", "=", `Three options ${system}`).executeTakeFirstOrThrow();
  const before = await page.locator("[data-testid=whatif-lead]").innerText();
  await page.locator("[data-testid=whatif-water]").focus();
  const responded = page.waitForResponse((r) => r.url().includes("/what-if") && r.request().method() === "POST");
  const k0 = Date.now();
  for (let n = 0; n < 10; n++) await page.keyboard.press("ArrowRight");
  const res = await responded;
  expect(res.status()).toBe(200);
  const serverMs = ((await res.json()) as { elapsedMs: number }).elapsedMs;
  const timing = res.request().timing();
  step(`what-if: server compute ${serverMs.toFixed(1)} ms, request → response ${(timing.responseEnd - timing.requestStart).toFixed(0)} ms`);
  await page.waitForFunction((b) => document.querySelector("[data-testid=whatif-lead]")?.textContent !== b, before, { timeout: 15_000 });
  const whatIfMs = Date.now() - k0;
  const afterText = await page.locator("[data-testid=whatif-lead]").innerText();
  expect(afterText).not.toBe(before);
  const moneyIn = (s: string) => (s.match(/USD ([\d.,]+(?: million)?)/)?.[1] ?? "");
  expect(moneyIn(afterText)).not.toBe(moneyIn(before));
  const revisionAfter = await db.selectFrom("scenarios").select("revision").where("name", "=", `Three options ${system}`).executeTakeFirstOrThrow();
  expect(revisionAfter.revision).toBe(revisionBefore.revision);
  await page.locator("[data-testid=what-if]").screenshot({ path: path.join(path.resolve(__dirname, "../../test-results/screenshots"), `workspace-whatif-${system}.png`) });
  return { lccText, makeup, energy, towerEnteringShown, whatIfMs, saveMs };
}

describe("the consultant's day: project, climate, scenario with three options, comparison, what-if", () => {
  it("in IP units", async () => {
    observed.IP = await buildAndCompare("IP");
  });

  it("in SI units", async () => {
    observed.SI = await buildAndCompare("SI");
  });

  it("IP and SI give the same physical answer, converted", () => {
    const ip = observed.IP!;
    const si = observed.SI!;
    // Money does not depend on the unit system.
    expect(ip.lccText).toEqual(si.lccText);
    // Makeup shown to 4 significant figures: kgal × 3.785411784 = m³ (Methods §8), within display rounding.
    for (let i = 0; i < 3; i++) {
      expect(Math.abs(ip.makeup[i]! * 3.785411784 - si.makeup[i]!) / si.makeup[i]!).toBeLessThan(2e-3);
      expect(Math.abs(ip.energy[i]! - si.energy[i]!) / si.energy[i]!).toBeLessThan(2e-3);
    }
    console.log(`[workspace] save + analysis ${ip.saveMs} / ${si.saveMs} ms; what-if keypress → headline ${ip.whatIfMs} / ${si.whatIfMs} ms (IP / SI)`);
  });
});

describe("the API", () => {
  it("round trip: export the scenario's JSON, post it to /api/v1/analyses, get the stored result", async () => {
    const s = await db.selectFrom("scenarios").select(["id"]).where("name", "=", "Three options SI").orderBy("created_at", "desc").executeTakeFirstOrThrow();
    const req = consultant.request;
    const exp = await req.get(`/api/scenarios/${s.id}/export`);
    expect(exp.status()).toBe(200);
    expect(exp.headers()["content-disposition"]).toMatch(/attachment; filename=".+\.json"/);
    const doc = await exp.json();
    const stored = await req.get(`/api/scenarios/${s.id}/results`);
    expect(stored.status()).toBe(200);
    const storedBody = await stored.json();
    const t0 = Date.now();
    const posted = await req.post("/api/v1/analyses", { data: doc });
    // An hourly year with a Monte Carlo is too large to answer at once: 202 and a job to poll.
    expect(posted.status()).toBe(202);
    const accepted = await posted.json();
    expect(posted.headers()["location"]).toBe(`/api/v1/analyses/${accepted.id}`);
    let body: { status: string; inputsHash?: string; result?: { economics?: Record<string, unknown> }; monteCarlo?: unknown; error?: string } =
      accepted;
    await expect
      .poll(
        async () => {
          body = await (await req.get(accepted.statusUrl)).json();
          return body.status;
        },
        { timeout: 90_000, interval: 500 },
      )
      .toBe("done");
    const ms = Date.now() - t0;
    expect(body.inputsHash).toBe(storedBody.inputsHash);
    // The scenario's results route folds a finished Monte Carlo run into economics.monteCarlo; the API answers
    // it beside the deterministic result. Compare the deterministic part exactly, and the distribution when the
    // saved scenario's run had finished when it was read.
    const { monteCarlo: storedMc, ...storedEconomics } = (storedBody.result.economics ?? {}) as Record<string, unknown>;
    const { monteCarlo: _apiInline, ...apiEconomics } = (body.result?.economics ?? {}) as Record<string, unknown>;
    expect({ ...body.result, economics: apiEconomics }).toEqual({ ...storedBody.result, economics: storedEconomics });
    if (storedMc) expect(body.monteCarlo).toEqual(storedMc);
    console.log(`[workspace] POST /api/v1/analyses with Monte Carlo, queued and polled: ${ms} ms`);
  });

  it("answers 401 anonymous, 404 unknown, 413/415/422 for bad bodies, with field paths", async () => {
    const anon = await browser.newContext({ baseURL: BASE_URL });
    const someId = "00000000-0000-4000-8000-000000000000";
    expect((await anon.request.post("/api/v1/analyses", { data: {} })).status()).toBe(401);
    expect((await anon.request.get(`/api/scenarios/${someId}/results`)).status()).toBe(401);
    expect((await anon.request.post(`/api/scenarios/${someId}/what-if`, { data: {} })).status()).toBe(401);
    expect((await anon.request.get(`/api/scenarios/${someId}/export`)).status()).toBe(401);
    await anon.close();
    const req = consultant.request;
    expect((await req.get(`/api/scenarios/${someId}/results`)).status()).toBe(404);
    expect((await req.post("/api/v1/analyses", { data: "not json", headers: { "content-type": "text/plain" } })).status()).toBe(415);
    const big = await req.post("/api/v1/analyses", { data: JSON.stringify({ pad: "x".repeat(5 * 1024 * 1024 + 10) }), headers: { "content-type": "application/json" } });
    expect(big.status()).toBe(413);
    const bad = await req.post("/api/v1/analyses", { data: { inputVersion: 1, name: "x", options: [] } });
    expect(bad.status()).toBe(422);
    const b = await bad.json();
    expect(Object.keys(b.fieldErrors)).toEqual(expect.arrayContaining(["site", "climate", "duty", "options", "water"]));
    expect(b.issues[0]).toHaveProperty("path");
  });

  it("client viewers get the issued version only: results and what-if on version 1 of the demo", async () => {
    const owner = await newContext(browser);
    const p = await owner.newPage();
    await signIn(p, DEMO_ACCOUNTS.owner.email, DEMO_PASSWORD);
    const project = await db.selectFrom("projects").select("id").where("name", "=", DEMO_PROJECT.name).executeTakeFirstOrThrow();
    const s = await db.selectFrom("scenarios").select("id").where("project_id", "=", project.id).orderBy("created_at").executeTakeFirstOrThrow();
    const r = await owner.request.get(`/api/scenarios/${s.id}/results`);
    expect(r.status()).toBe(200);
    const body = await r.json();
    expect(body.version).toBe(1);
    const w = await owner.request.post(`/api/scenarios/${s.id}/what-if?version=1`, { data: { electricityPriceFactor: 1.5 } });
    expect(w.status()).toBe(200);
    expect((await w.json()).version).toBe(1);
    const missing = await owner.request.get(`/api/scenarios/${s.id}/results?version=99`);
    expect(missing.status()).toBe(404);
    // The draft page sends a client viewer to the issued versions.
    await p.goto(`/projects/${project.id}/scenarios/${s.id}`);
    expect(new URL(p.url()).pathname).toBe(`/projects/${project.id}/scenarios/${s.id}/versions`);
    await owner.close();
  });
});
