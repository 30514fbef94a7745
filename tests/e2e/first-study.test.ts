import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed";
import { generateSyntheticYear } from "@/lib/engine/climate";
import { tmy3Text } from "../support/tmy3";
import { BASE_URL, launchBrowser, newContext, screenshot } from "./support";

// Issue 11: a new consultant's first study, from an empty project to an issued version, on a weather file
// in the TMY3 layout that the test writes from the documented generator (invented weather, never a station's).
let browser: Browser;
let context: BrowserContext;
let page: Page;
const stamp = Date.now().toString(36);
const dir = mkdtempSync(path.join(tmpdir(), "ll-first-study-"));
const tmy3Path = path.join(dir, `invented-station-${stamp}.csv`);
writeFileSync(tmy3Path, tmy3Text(generateSyntheticYear({ seed: 9011 }), { name: "INVENTED RIDGE", state: "ZZ", elevationM: 310 }));

/** What a person does, counted as the test goes: clicks (and key presses that act) and fields filled or chosen. */
const effort = { clicks: 0, fields: 0, steps: [] as string[] };
const click = async (selector: string) => {
  effort.clicks++;
  await page.click(selector);
};
const fill = async (selector: string, value: string) => {
  effort.fields++;
  await page.fill(selector, value);
};
const shot = async (n: number, name: string) => {
  effort.steps.push(name);
  await screenshot(page, `first-study-${String(n).padStart(2, "0")}-${name}`);
};

/** Text a person should never see in a message: schema paths and a schema library's default wording. */
const LEAKS = [/\b[a-zA-Z]+\.\d+\.[a-zA-Z]/, /\b[a-z]+[A-Z][a-zA-Z]*\.[a-z]+/, /invalid input/i, /expected (number|string)/i, /received (undefined|string|nan)/i];

async function visibleMessages(): Promise<string[]> {
  const summary = await page.locator("[data-testid=form-error-summary]").allInnerTexts();
  const fields = await page.locator("[data-testid=field-error]").allInnerTexts();
  return [...summary, ...fields];
}

beforeAll(async () => {
  browser = await launchBrowser();
  context = await newContext(browser);
  page = await context.newPage();
});

afterAll(async () => {
  await context?.close();
  await browser?.close();
});

describe("first impressions", () => {
  it("serves the favicon and the app icons (no 404)", async () => {
    for (const [p, type] of [
      ["/favicon.ico", /icon/],
      ["/icon.svg", /svg/],
      ["/apple-touch-icon.png", /png/],
      ["/site.webmanifest", /json|manifest/],
    ] as const) {
      const r = await fetch(`${BASE_URL}${p}`);
      expect(r.status, p).toBe(200);
      expect(r.headers.get("content-type") ?? "", p).toMatch(type);
    }
  });

  it("the sign-in button is disabled in the served HTML, and a click as soon as it can be clicked signs in", async () => {
    const html = await (await fetch(`${BASE_URL}/signin`)).text();
    expect(html).toMatch(/<button[^>]*type="submit"[^>]*disabled/);
    const fresh = await newContext(browser);
    const p = await fresh.newPage();
    await p.goto("/signin", { waitUntil: "commit" });
    await p.fill("#email", DEMO_ACCOUNTS.consultant.email);
    await p.fill("#password", DEMO_PASSWORD);
    // Playwright's click waits until the button is enabled, as a person's second click would land.
    await Promise.all([p.waitForURL((u) => !u.pathname.startsWith("/signin"), { timeout: 30_000 }), p.click("button[type=submit]")]);
    expect(new URL(p.url()).pathname).not.toMatch(/signin/);
    expect(p.url()).not.toMatch(/password=/);
    await fresh.close();
  });
});

describe("a first study without a fight", () => {
  it("project → TMY3-layout weather → starter scenario → comparison with first costs missing → first costs → LCC → issued version", async () => {
    const t0 = Date.now();
    // 1. Sign in.
    await page.goto("/signin");
    await fill("#email", DEMO_ACCOUNTS.consultant.email);
    await fill("#password", DEMO_PASSWORD);
    await Promise.all([page.waitForURL((u) => !u.pathname.startsWith("/signin")), click("button[type=submit]")]);

    // 2. A new project (SI; the defaults of the form for the rest).
    await page.goto("/projects/new");
    await fill("#f-clientName", "Invented Ridge Foods");
    await fill("#f-name", `Ridge cold store ${stamp}`);
    await fill("#f-siteName", "Ridge cold store");
    await fill("#f-locationLabel", "Invented ridge");
    await fill("#f-elevationM", "310");
    await fill("#f-currency", "EUR");
    await shot(1, "new-project");
    await Promise.all([page.waitForURL(/\/projects\/[0-9a-f-]{36}$/), click("[data-testid=project-submit]")]);
    const projectUrl = new URL(page.url()).pathname;

    // 3. The TMY3-layout file: recognised without a column mapping.
    await page.goto(`${projectUrl}/climate/import`);
    effort.clicks++; // opening the import page from the project page
    effort.fields++;
    await page.setInputFiles("input[type=file]", tmy3Path);
    await shot(2, "weather-chosen");
    await Promise.all([page.waitForURL(/\/climate\/[0-9a-f-]{36}$/, { timeout: 60_000 }), click("[data-testid=climate-upload-submit]")]);
    const summaryText = await page.locator("body").innerText();
    expect(summaryText).toMatch(/INVENTED RIDGE/);
    expect(summaryText).toMatch(/TMY3/);
    await shot(3, "weather-imported");

    // 4. A scenario from the starter, saved as it is.
    await page.goto(projectUrl);
    effort.clicks++;
    await fill("#new-scenario-name", "Three options, first pass");
    await Promise.all([page.waitForURL(/\/scenarios\/[0-9a-f-]{36}\/edit/), click("[data-testid=new-scenario-form] button[type=submit]")]);
    await page.waitForSelector("[data-testid=scenario-editor]");
    await shot(4, "starter-in-editor");
    await click("[data-testid=save-scenario]");
    await page.locator("[data-testid=banner-saved]").waitFor({ timeout: 90_000 });
    expect(await page.locator("[data-testid=banner-saved]").innerText()).toMatch(/First costs are still missing/);
    await shot(5, "saved-first-costs-missing");

    // 5. The comparison: physics and operating costs now, "first costs missing" where the LCC would be.
    await Promise.all([page.waitForURL(/\/scenarios\/[0-9a-f-]{36}$/), click("[data-testid=banner-saved] a")]);
    await page.waitForSelector("[data-testid=comparison]");
    expect(await page.locator("[data-testid=headline-lead]").innerText()).toMatch(/First costs missing for/);
    expect(await page.locator("[data-testid=lcc-tower-direct]").innerText()).toMatch(/first costs missing/);
    expect(await page.locator("[data-testid=row-makeup] td").first().innerText()).toMatch(/\d/);
    expect(await page.locator("[data-testid=row-lcc]").innerText()).toMatch(/first costs missing/);
    await shot(6, "comparison-first-costs-missing");
    const scenarioUrl = new URL(page.url()).pathname;

    // Issuing is refused in words before the click.
    await page.goto(`${scenarioUrl}/versions`);
    await page.locator("[data-testid=issue-needs-first-costs]").waitFor();

    // 6. First costs: one figure per option (the quote's total as equipment; the other items count as 0), in
    // the options' "First cost and upkeep" part, which stays open from one option to the next.
    await page.goto(`${scenarioUrl}/edit?section=option-1&part=costs`);
    effort.clicks++;
    const quotes = ["410000", "470000", "520000"];
    for (let i = 0; i < 3; i++) {
      if (i > 0) {
        await click(`[data-testid=nav-option-${i + 1}]`);
        await page.waitForURL(new RegExp(`section=option-${i + 1}&part=costs`));
      }
      await fill(`#f-options-${i}-costs-firstCost-equipment`, quotes[i]!);
    }
    await shot(7, "first-costs-entered");
    await click("[data-testid=save-scenario]");
    await page.locator("[data-testid=banner-saved]").waitFor({ timeout: 90_000 });
    expect(await page.locator("[data-testid=banner-saved]").innerText()).not.toMatch(/First costs are still missing/);

    // 7. The life-cycle cost.
    await Promise.all([page.waitForURL(/\/scenarios\/[0-9a-f-]{36}$/), click("[data-testid=banner-saved] a")]);
    await page.waitForSelector("[data-testid=comparison]");
    expect(await page.locator("[data-testid=headline-lead]").innerText()).toMatch(/has the lowest life-cycle cost/);
    expect(await page.locator("[data-testid=lcc-cooler]").innerText()).toMatch(/EUR\s[\d,.]+/);
    await shot(8, "comparison-with-lcc");

    // 8. Issue version 1.
    await page.goto(`${scenarioUrl}/versions`);
    effort.clicks++;
    await page.locator("[data-testid=issue-form]").waitFor();
    // Issuing opens the new version's page.
    await Promise.all([page.waitForURL(/\/versions\/1$/, { timeout: 60_000 }), click("[data-testid=issue-form] button[type=submit]")]);
    await shot(9, "version-issued");

    const seconds = (Date.now() - t0) / 1000;
    // The figure for the report: what a person does, and how long the machine took on this run.
    console.log(`[first-study] ${effort.clicks} clicks, ${effort.fields} fields filled or chosen, ${effort.steps.length} screens; machine time ${seconds.toFixed(1)} s`);
  }, 300_000);

  it("an empty and a nonsense form: every message names the field in words, none shows a path or library wording", async () => {
    await page.goto("/projects");
    const hrefs = await page.locator("a[href^='/projects/']").evaluateAll((as) => as.map((a) => a.getAttribute("href") ?? ""));
    const project = hrefs.find((h) => /^\/projects\/[0-9a-f-]{36}$/.test(h))!;
    await page.goto(project);
    await page.fill("#new-scenario-name", `Nonsense ${stamp}`);
    await Promise.all([page.waitForURL(/\/edit/), page.click("[data-testid=new-scenario-form] button[type=submit]")]);
    await page.waitForSelector("[data-testid=scenario-editor]");

    // Empty: the name and the design duty cleared, then the option's selection fields cleared.
    await page.fill("#f-name", "");
    await page.click("[data-testid=nav-duty]");
    await page.fill("#f-duty-designHeatRejectionKW", "");
    await page.fill("#f-duty-evaporatingC", "");
    await page.click("[data-testid=nav-option-1]");
    await page.fill("#f-options-0-tower-enteringWaterC", "");
    await page.fill("#f-options-0-fan-designPowerKW", "");
    await page.click("[data-testid=save-scenario]");
    await page.locator("[data-testid=form-error-summary]").waitFor();
    const empty = await visibleMessages();
    expect(empty.join("\n")).toMatch(/Scenario name/);
    expect(empty.join("\n")).toMatch(/Option 1: .* › Fans › Fan motor input/);
    await screenshot(page, "first-study-10-empty-form");
    for (const m of empty) for (const leak of LEAKS) expect(m).not.toMatch(leak);

    // Nonsense: letters, far out of range, negative.
    await page.fill("#f-options-0-tower-enteringWaterC", "hot");
    await page.fill("#f-options-0-tower-leavingWaterC", "500");
    await page.fill("#f-options-0-fan-designPowerKW", "-4");
    // An error in a part not shown: option 1's first cost, entered negative, then another part opened.
    await page.click("[data-testid=part-costs]");
    await page.fill("#f-options-0-costs-firstCost-equipment", "-5");
    await page.click("[data-testid=part-pumps]");
    await page.locator("[data-testid=part-costs][data-state=errors]").waitFor();
    expect(await page.locator("[data-testid=part-selection]").getAttribute("data-state")).toBe("errors");
    expect(await page.locator("[data-testid=part-pumps]").getAttribute("data-state")).toBe("complete");
    await page.click("[data-testid=nav-water]");
    await page.fill("#f-water-makeup-ph", "99");
    await page.fill("#f-water-makeup-silicaMgPerL", "1,2,3");
    await page.click("[data-testid=save-scenario]");
    await page.locator("[data-testid=form-error-summary]").waitFor();
    const nonsense = await visibleMessages();
    // The summary (one block listing every problem) and the messages under the open section's fields.
    expect(nonsense.length).toBeGreaterThanOrEqual(3);
    expect((await page.locator("[data-testid=form-error-summary] li").count())).toBeGreaterThanOrEqual(5);
    await screenshot(page, "first-study-11-nonsense-form");
    for (const m of nonsense) for (const leak of LEAKS) expect(m).not.toMatch(leak);
    expect(nonsense.join("\n")).toMatch(/Water › Makeup-water analysis › pH: Enter at most 11/);
    // The nav counts the errors per section.
    expect(await page.locator("[data-testid=nav-option-1]").getAttribute("data-state")).toBe("errors");
    // A summary link opens the field's section and part and puts the cursor in it.
    const leaving = page.locator("[data-testid=form-error-summary] a", { hasText: "Leaving (cold) water" });
    expect(await leaving.getAttribute("href")).toBe("?section=option-1&part=selection#f-options-0-tower-leavingWaterC");
    await leaving.click();
    await page.waitForURL(/section=option-1&part=selection/);
    expect(await page.evaluate(() => document.activeElement?.id)).toBe("f-options-0-tower-leavingWaterC");
    // The first cost's error, in the costs part (not shown now), is reached the same way.
    await page.locator("[data-testid=form-error-summary] a", { hasText: "First cost" }).first().click();
    await page.waitForURL(/section=option-1&part=costs/);
    expect(await page.evaluate(() => document.activeElement?.id)).toBe("f-options-0-costs-firstCost-equipment");
  }, 120_000);
});
