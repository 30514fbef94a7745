import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed";
import { createDb } from "@/db/client";
import { generateSyntheticYear, syntheticYearToCsv, syntheticYearToEpw } from "@/lib/engine/climate";
import { launchBrowser, newContext, screenshot, signIn } from "./support";

let browser: Browser;
let consultant: BrowserContext;
let page: Page;
let projectUrl = "";
const db = createDb(process.env.DATABASE_URL!, 2);
const dir = mkdtempSync(path.join(tmpdir(), "ll-climate-"));
const stamp = Date.now().toString(36);
const projectName = `Dairy condenser loop ${stamp}`;

// Invented weather from the documented generator (lib/engine/climate/synthetic.ts), never station data.
const year = generateSyntheticYear({ seed: 31337 });
const epwPath = path.join(dir, "invented-valley.epw");
writeFileSync(epwPath, syntheticYearToEpw(year));
const brokenLines = syntheticYearToEpw(year).split("\n");
// Data row of hour 300 is file line 8 + 300 + 1 = 309; cut to 7 fields so the dew point (field 8) is absent.
brokenLines[308] = brokenLines[308]!.split(",").slice(0, 7).join(",");
const brokenPath = path.join(dir, "broken.epw");
writeFileSync(brokenPath, brokenLines.join("\n"));
const csvPath = path.join(dir, "invented-valley.csv");
writeFileSync(csvPath, syntheticYearToCsv(year, { delimiter: ";", decimalComma: true, temperatureUnit: "F" }));

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

async function datasetCount(): Promise<number> {
  const id = projectUrl.split("/").pop()!;
  const r = await db.selectFrom("climate_datasets").select((eb) => eb.fn.countAll<number>().as("n")).where("project_id", "=", id).executeTakeFirstOrThrow();
  return Number(r.n);
}

describe("the consultant creates a project and imports its climate", () => {
  it("New project: an empty submit lists every problem at its field, then the project is created in IP units", async () => {
    await page.goto("/projects");
    await page.click("[data-testid=main-nav] a:has-text('New project')");
    await page.waitForURL("**/projects/new");
    await page.click("[data-testid=project-submit]");
    const summary = page.locator("[data-testid=form-error-summary]");
    await summary.waitFor();
    const text = await summary.innerText();
    for (const label of ["Client", "Project name", "Site name", "Site elevation"]) expect(text).toContain(label);
    expect(await page.getAttribute("#f-clientName", "aria-invalid")).toBe("true");
    await screenshot(page, "projects-new-errors");

    await page.fill("#f-clientName", "Invented Dairy Co-op");
    await page.fill("#f-name", projectName);
    await page.fill("#f-siteName", "North plant");
    await page.fill("#f-locationLabel", "Invented valley");
    await page.selectOption("#f-unitSystem", "IP");
    // The unit beside the elevation follows the chosen system.
    expect(await page.getAttribute("#f-elevationM", "data-unit")).toBe("ft");
    await page.fill("#f-elevationM", "787.4");
    await page.fill("#f-currency", "usd");
    await Promise.all([page.waitForURL(/\/projects\/[0-9a-f-]{36}$/), page.click("[data-testid=project-submit]")]);
    projectUrl = new URL(page.url()).pathname;
    expect(await page.locator("h1").innerText()).toBe(projectName);
    const row = await db.selectFrom("projects").selectAll().where("name", "=", projectName).executeTakeFirstOrThrow();
    // 787.4 ft × 0.3048 m/ft = 240.0 m (NIST SP 811 B.8, exact foot).
    expect(row.elevation_m).toBeCloseTo(240.0, 1);
    expect(row.currency).toBe("USD");
    await expect(page.locator("text=No climate data yet.").count()).resolves.toBe(1);
    await screenshot(page, "projects-created-empty-climate");
  });

  it("uploads a generated EPW and sees the summary with both charts drawn", async () => {
    await page.click("text=Import climate");
    await page.waitForURL("**/climate/import");
    expect(await page.locator("text=up to 10 MB").count()).toBeGreaterThan(0);
    await page.setInputFiles("input[type=file]", epwPath);
    await Promise.all([page.waitForURL(/\/climate\/[0-9a-f-]{36}$/, { timeout: 30_000 }), page.click("[data-testid=climate-upload-submit]")]);
    expect(await page.locator("[data-testid=climate-site]").innerText()).toContain("Harrowgate Flats");
    // A common year: 365 × 24 = 8760 hourly records.
    expect(await page.locator("[data-testid=climate-records]").innerText()).toBe("8,760");
    expect(await page.locator("[data-testid=climate-hours]").innerText()).toBe("8,760 h");
    expect(await page.locator("[data-testid=climate-missing]").innerText()).toBe("none");
    const design = await page.locator("[data-testid=climate-design]").innerText();
    expect(design).toContain("0.4 % of the hours");
    expect(design).toMatch(/°F/);
    // nivo draws SVG: bars in the histogram, 12 × 24 cells in the heat map.
    const hist = page.locator("[role=figure][aria-label^='Wet-bulb histogram'] svg");
    await hist.first().waitFor();
    expect(await page.locator("[role=figure][aria-label^='Wet-bulb histogram'] svg rect").count()).toBeGreaterThan(10);
    const heat = page.locator("[role=figure][aria-label^='Mean wet-bulb by month'] svg");
    await heat.first().waitFor();
    expect(await page.locator("[role=figure][aria-label^='Mean wet-bulb by month'] svg rect").count()).toBeGreaterThanOrEqual(288);
    await screenshot(page, "climate-summary-epw");
  });

  it("a broken file shows the line and the field, and nothing is stored", async () => {
    const before = await datasetCount();
    await page.goto(`${projectUrl}/climate/import`);
    await page.setInputFiles("input[type=file]", brokenPath);
    await page.click("[data-testid=climate-upload-submit]");
    const issues = page.locator("[data-testid=climate-upload-issues]");
    await issues.waitFor();
    const text = await issues.innerText();
    expect(text).toContain("309");
    expect(text).toContain("dewPointC");
    expect(text).toMatch(/7 fields, expected 35/);
    expect(await datasetCount()).toBe(before);
    await screenshot(page, "climate-upload-broken");
  });

  it("a CSV gets a column-mapping step with a preview, then imports", async () => {
    await page.goto(`${projectUrl}/climate/import`);
    await page.setInputFiles("input[type=file]", csvPath);
    await page.fill("input[placeholder=\"Defaults to the file's location\"]", "CSV year (°F, decimal comma)");
    await page.click("[data-testid=climate-upload-submit]");
    await page.locator("[data-testid=csv-preview]").waitFor();
    expect(await page.locator("[data-testid=csv-temperature-unit]").inputValue()).toBe("F");
    await screenshot(page, "climate-csv-mapping");
    await Promise.all([page.waitForURL(/\/climate\/[0-9a-f-]{36}$/, { timeout: 30_000 }), page.click("[data-testid=climate-upload-submit]")]);
    expect(await page.locator("h1").innerText()).toBe("CSV year (°F, decimal comma)");
    expect(await page.locator("[data-testid=climate-records]").innerText()).toBe("8,760");
  });

  it("a bin table pasted from a spreadsheet is saved and summarised", async () => {
    await page.goto(`${projectUrl}/climate/bins`);
    await page.fill("input[placeholder^='e.g. Airport bins']", "Entered bins");
    await page.click("text=Paste from a spreadsheet");
    // Tab-separated, as a spreadsheet copies: wet-bulb °F, mean coincident dry-bulb °F, hours (sum 8760).
    await page.fill("[data-testid=bin-paste]", "WB\tMCDB\th\n75\t86\t40\n72\t82\t300\n65\t74\t2000\n50\t56\t3000\n32\t36\t3420\n");
    await page.click("[data-testid=bin-paste-apply]");
    expect(await page.locator("[data-testid=bin-hours-total]").innerText()).toBe("8,760 h");
    await page.fill("[data-testid=bin-hours-1]", "-3");
    await page.click("[data-testid=bin-save]");
    await page.locator("[data-testid=bin-errors]").waitFor();
    expect(await page.getAttribute("[data-testid=bin-hours-1]", "aria-invalid")).toBe("true");
    await screenshot(page, "climate-bins-error");
    await page.fill("[data-testid=bin-hours-1]", "300");
    await Promise.all([page.waitForURL(/\/climate\/[0-9a-f-]{36}$/), page.click("[data-testid=bin-save]")]);
    expect(await page.locator("[data-testid=climate-hours]").innerText()).toBe("8,760 h");
    // 0.4 % of 8760 h = 35 h lies in the 75 °F bin (40 h): the bin's value is the design wet-bulb (ASHRAE 2017 ch.14 on bins).
    expect(await page.locator("[data-testid=climate-design]").innerText()).toContain("75.0\u00a0°F");
    await page.locator("[role=figure][aria-label^='Wet-bulb histogram'] svg").first().waitFor();
    await screenshot(page, "climate-summary-bins");
  });

  it("the project page lists the datasets; editing to SI shows the elevation in metres", async () => {
    await page.goto(projectUrl);
    const rows = page.locator("[data-testid=climate-datasets] tbody tr");
    expect(await rows.count()).toBe(3);
    await page.click("text=Edit project");
    await page.waitForURL("**/edit");
    expect(await page.inputValue("#f-elevationM")).toBe("787.4");
    await page.selectOption("#f-unitSystem", "SI");
    // 787.4 ft × 0.3048 = 239.99952 m, which the box shows to 6 significant figures: 240.000 → "240".
    expect(await page.inputValue("#f-elevationM")).toBe("240");
    await page.fill("#f-elevationM", "241");
    await Promise.all([page.waitForURL((u) => u.pathname === projectUrl), page.click("[data-testid=project-submit]")]);
    const table = await page.locator("[data-testid=climate-datasets]").innerText();
    expect(table).toMatch(/°C/);
    await screenshot(page, "projects-page-with-climate");
  });
});

describe("client viewers see climate but cannot import it", () => {
  it("the owner sees the demo project's climate section without import actions and the API refuses an upload", async () => {
    const ctx = await newContext(browser);
    const p = await ctx.newPage();
    await signIn(p, DEMO_ACCOUNTS.owner.email, DEMO_PASSWORD);
    const demo = await db.selectFrom("projects").select("id").where("name", "like", "Harrowgate Flats%").executeTakeFirstOrThrow();
    await p.goto(`/projects/${demo.id}`);
    expect(await p.locator("text=Import climate").count()).toBe(0);
    expect(await p.locator("text=Enter bins").count()).toBe(0);
    const status = await p.evaluate(async (id) => {
      const fd = new FormData();
      fd.set("file", new Blob(["LOCATION,x"]), "x.epw");
      return (await fetch(`/api/projects/${id}/climate`, { method: "POST", body: fd })).status;
    }, demo.id);
    expect(status).toBe(403);
    const page403 = await p.goto(`/projects/${demo.id}/climate/import`);
    expect(page403?.status()).toBe(403);
    const other = await p.goto(projectUrl);
    // No relation to the consultant's new project: it does not exist for the owner.
    expect(other?.status()).toBe(404);
    await ctx.close();
  });
});
