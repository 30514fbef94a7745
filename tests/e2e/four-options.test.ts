/**
 * Issue 14, end to end in Chromium: the demo consultant builds a four-option scenario in the editor — the
 * starter's direct tower (shell-and-tube condenser, chosen in the editor), tower + plate exchanger and
 * closed-circuit cooler, plus an evaporative condenser added with the editor's button — saves it, reads the
 * comparison (each option's condenser plan, refrigerant in kg and lb, footprint; no horizontal overflow at
 * 1280 px; four series in the charts), issues version 1, and reads the PDF (poppler's pdftotext) and the
 * workbook (exceljs) of that version. Screenshots go to test-results/.
 */
import { execFileSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import ExcelJS from "exceljs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { createDb } from "@/db/client";
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_PROJECT } from "@/db/seed";
import { launchBrowser, newContext, screenshot, signIn } from "./support";

const OUT = path.resolve(__dirname, "../../test-results/four-options");
mkdirSync(OUT, { recursive: true });

const db = createDb(process.env.DATABASE_URL!, 2);
let browser: Browser;
let context: BrowserContext;
let page: Page;
let projectId: string;
let scenarioUrl = "";
let scenarioId = "";
const LABELS = ["Open tower, direct", "Open tower + plate exchanger", "Closed-circuit cooler", "Evaporative condenser"];

beforeAll(async () => {
  browser = await launchBrowser();
  context = await newContext(browser);
  page = await context.newPage();
  const project = await db.selectFrom("projects").select("id").where("name", "=", DEMO_PROJECT.name).executeTakeFirstOrThrow();
  projectId = project.id;
  await signIn(page, DEMO_ACCOUNTS.consultant.email, DEMO_PASSWORD);
});

afterAll(async () => {
  await context?.close();
  await browser?.close();
  await db.destroy();
});

describe("four ways to reject the heat", () => {
  it("builds the four options in the editor: shell-and-tube on the direct tower, an evaporative condenser added", async () => {
    await page.goto(`/projects/${projectId}`);
    await page.fill("#new-scenario-name", `Four options ${Date.now().toString(36)}`);
    await Promise.all([page.waitForURL(/\/scenarios\/[0-9a-f-]{36}\/edit/), page.click("[data-testid=new-scenario-form] button[type=submit]")]);
    await page.waitForSelector("[data-testid=scenario-editor]");
    scenarioUrl = new URL(page.url()).pathname.replace(/\/edit$/, "");
    scenarioId = scenarioUrl.split("/").pop()!;

    // The fourth option, added by its button in the options list.
    await page.getByRole("button", { name: "Add evaporative condenser" }).click();
    await page.locator("[data-testid=nav-option-4]").waitFor();
    await page.click("[data-testid=nav-option-4]");
    await page.locator("#f-options-3-evaporativeCondenser-ratedHeatRejectionKW").waitFor();
    // No condenser water loop on it: no condenser construction, no condenser pump.
    expect(await page.locator("#f-options-3-condenser-construction").count()).toBe(0);
    expect(await page.locator("#f-options-3-condenserPump-headM").count()).toBe(0);
    await screenshot(page, "four-options-01-evaporative-condenser-in-editor");

    // The evaporative condenser's coil is in its "Condenser" part (one part of a step at a time).
    await page.click("[data-testid=part-condenser]");
    await page.locator("#f-options-3-evaporativeCondenser-coilScaling-cleaningIntervalMonths").waitFor();
    expect(await page.locator("#f-options-3-evaporativeCondenser-ratedHeatRejectionKW").count()).toBe(0);

    // The direct tower's condenser: shell-and-tube, with its defaults and their sources beside them. Moving to
    // another option keeps the open part.
    await page.click("[data-testid=nav-option-1]");
    await page.waitForURL(/section=option-1&part=condenser/);
    await page.selectOption("#f-options-0-condenser-construction", "plateAndFrame");
    await page.locator("[data-testid=construction-defaults] summary").click();
    await page.locator("[data-testid=construction-defaults]", { hasText: "gasketed" }).waitFor();
    await page.selectOption("#f-options-0-condenser-construction", "shellAndTube");
    const defaults = page.locator("[data-testid=construction-defaults]");
    await defaults.filter({ hasText: "Eddy-current testing" }).waitFor();
    expect(await defaults.innerText()).toMatch(/\[practice\]/);
    expect(await defaults.innerText()).toMatch(/\[memory\]/);
    // The clean U followed the construction back to shell-and-tube's 1000 W/(m²·K), shown in this IP project
    // as 1000 / 5.678263 = 176.11 Btu/(h·ft²·°F) (NIST SP 811 B.8: 1 Btu/(h·ft²·°F) = 5.678263 W/(m²·K)).
    expect(await page.inputValue("#f-options-0-condenser-cleanUWPerM2K")).toBe("176.11");
    await screenshot(page, "four-options-02-shell-and-tube-defaults");

    // First costs: one quote per option (the other items count as 0), in each option's "First cost and upkeep"
    // part; its count says "first cost" until one is entered.
    const quotes = ["410000", "470000", "520000", "455000"];
    for (let i = 0; i < 4; i++) {
      await page.click(`[data-testid=nav-option-${i + 1}]`);
      await page.click("[data-testid=part-costs]");
      await page.locator("[data-testid=part-costs][aria-current=step]").waitFor();
      await page.fill(`#f-options-${i}-costs-firstCost-equipment`, quotes[i]!);
      await page.locator("[data-testid=part-costs][data-state=complete]").waitFor();
    }
    // Saved from another part than the one holding the first costs: the hidden parts' values are kept.
    await page.click("[data-testid=part-selection]");
    await page.locator("#f-options-3-evaporativeCondenser-ratedHeatRejectionKW").waitFor();
    await page.click("[data-testid=save-scenario]");
    await page.locator("[data-testid=banner-saved]").waitFor({ timeout: 120_000 });
    expect(await page.locator("[data-testid=banner-saved]").innerText()).not.toMatch(/First costs are still missing/);
    // …and stored: opened afresh at option 2's costs part (the address names the part).
    await page.goto(`${scenarioUrl}/edit?section=option-2&part=costs`);
    expect(await page.inputValue("#f-options-1-costs-firstCost-equipment")).toBe("470000");
    expect(await page.locator("[data-testid=part-costs]").getAttribute("aria-current")).toBe("step");
  });

  it("compares the four: condenser plans, inventory in kg and lb, footprint, readable at 1280 px", async () => {
    await page.goto(scenarioUrl);
    await page.waitForSelector("[data-testid=comparison]", { timeout: 120_000 });
    await page.locator("[data-testid=condenser-plans]").waitFor();
    const plans = await page.locator("[data-testid=condenser-plans]").innerText();
    for (const label of LABELS) expect(plans).toContain(label);
    expect(plans).toContain("Shell-and-tube");
    expect(plans).toContain("Evaporative condenser coil");
    expect(plans).toMatch(/Eddy-current testing/);
    expect(await page.locator("[data-testid=condenser-plans] tr[data-row=inventoryKg] td").count()).toBe(4);
    expect(await page.locator("[data-testid=condenser-plans] tr[data-row=inventoryLb]").innerText()).toMatch(/\d+ lb/);
    expect(await page.locator("[data-testid=inventory-cautions]").innerText()).toMatch(/29 CFR 1910\.119[\s\S]*process-safety management/);
    const footprint = await page.locator("[data-testid=footprint]").innerText();
    expect(footprint).toMatch(/Water withdrawn \(makeup\) per year/);
    expect(footprint).toMatch(/CO₂e from refrigerant leakage per year/);
    expect(footprint).toMatch(/not priced/);

    // No horizontal overflow of the page at 1280 px.
    expect(page.viewportSize()?.width).toBe(1280);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);

    // Charts legible with four options: four lines in the cumulative cost chart's legend, four choices of the water chart.
    const cumulative = page.locator("[data-testid=chart-cumulative] svg");
    await cumulative.first().waitFor();
    const legend = await cumulative.first().locator("text").allTextContents();
    for (const label of LABELS) expect(legend).toContain(label);
    expect(await page.locator("[data-testid=chart-monthly-water] input[type=radio]").count()).toBe(4);
    await screenshot(page, "four-options-03-comparison-1280");
  });

  it("issues version 1, whose PDF and workbook carry the condensers, inventory and footprint", async () => {
    await page.goto(`${scenarioUrl}/versions`);
    await page.locator("[data-testid=issue-form]").waitFor();
    await Promise.all([page.waitForURL(/\/versions\/1$/, { timeout: 60_000 }), page.click("[data-testid=issue-form] button[type=submit]")]);

    const pdf = await context.request.get(`/api/scenarios/${scenarioId}/report?version=1`, { timeout: 180_000 });
    expect(pdf.status()).toBe(200);
    const pdfFile = path.join(OUT, "four-options-v1.pdf");
    writeFileSync(pdfFile, await pdf.body());
    const text = execFileSync("pdftotext", [pdfFile, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toContain("Each option's condenser, refrigerant and footprint");
    for (const label of LABELS) expect(text).toContain(label);
    expect(text).toContain("Shell-and-tube");
    expect(text).toContain("Evaporative condenser coil");
    expect(text).toMatch(/Refrigerant in the condenser \(kg\) .*\d+ kg/);
    expect(text).toMatch(/\d+ lb/);
    expect(text).toContain("29 CFR 1910.119");
    expect(text).toContain("Water consumed per MWh rejected");
    expect(text).toContain("CO2e from refrigerant leakage per year");

    const xlsx = await context.request.get(`/api/scenarios/${scenarioId}/workbook?version=1`, { timeout: 120_000 });
    expect(xlsx.status()).toBe(200);
    const buf = await xlsx.body();
    writeFileSync(path.join(OUT, "four-options-v1.xlsx"), buf);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(buf as unknown as ArrayBuffer);
    const ws = wb.getWorksheet("Condensers");
    expect(ws).toBeDefined();
    const rows: unknown[][] = [];
    ws!.eachRow((r) => rows.push((r.values as unknown[]).slice(1)));
    const header = rows.find((r) => r[1] === "Unit")!;
    expect(header.slice(2)).toEqual(LABELS);
    const kg = rows.find((r) => r[0] === "Refrigerant in the condenser (kg)")!;
    const lb = rows.find((r) => r[0] === "Refrigerant in the condenser (lb)")!;
    // 1 lb = 0.45359237 kg exactly (NIST SP 811).
    for (let i = 0; i < 4; i++) {
      expect(Number(kg[2 + i])).toBeGreaterThan(0);
      expect(Number(lb[2 + i])).toBeCloseTo(Number(kg[2 + i]) / 0.45359237, 6);
    }
    expect(rows.some((r) => r[0] === "CO₂e from electricity per year")).toBe(true);
  });
});
