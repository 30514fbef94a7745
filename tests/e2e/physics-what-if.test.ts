/**
 * The physical what-if in a real browser: the demo consultant opens the demo scenario's comparison, moves
 * the load slider and then the climate-shift slider; each move re-runs the physics on the server (the
 * response says so), the headline changes in place, and nothing is saved (the scenario's revision and its
 * stored results stay as they were). Then the demo owner does the same on the issued version through the API.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { createDb } from "@/db/client";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed";
import { DEMO_SCENARIO_NAME } from "@/lib/scenarios/demo";
import { launchBrowser, newContext, screenshot, signIn } from "./support";
import { signInHttp } from "./http-session";
import { BASE_URL } from "./support";

const db = createDb(process.env.DATABASE_URL!, 2);
let browser: Browser;
let scenarioId: string;
let projectId: string;

beforeAll(async () => {
  browser = await launchBrowser();
  const s = await db
    .selectFrom("scenarios")
    .select(["id", "project_id"])
    .where("name", "=", DEMO_SCENARIO_NAME)
    .orderBy("created_at", "asc")
    .executeTakeFirstOrThrow();
  scenarioId = s.id;
  projectId = s.project_id;
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

async function savedState() {
  const row = await db.selectFrom("scenarios").select(["revision", "updated_at"]).where("id", "=", scenarioId).executeTakeFirstOrThrow();
  const results = await db
    .selectFrom("scenario_results")
    .select((eb) => eb.fn.countAll<number>().as("n"))
    .where("scenario_id", "=", scenarioId)
    .executeTakeFirstOrThrow();
  return { revision: row.revision, updatedAt: String(row.updated_at), results: Number(results.n) };
}

/** Press → on a slider until the server answers a physical what-if and the headline text differs from `before`. */
async function moveAndWait(page: Page, testId: string, presses: number, before: string, bodyKey: string) {
  const responded = page.waitForResponse(
    (r) => r.url().includes("/what-if") && r.request().method() === "POST" && (r.request().postData() ?? "").includes(bodyKey),
    { timeout: 30_000 },
  );
  await page.locator(`[data-testid=${testId}]`).focus();
  for (let n = 0; n < presses; n++) await page.keyboard.press("ArrowRight");
  const res = await responded;
  expect(res.status()).toBe(200);
  const json = (await res.json()) as { physicsRerun: boolean; elapsedMs: number };
  expect(json.physicsRerun).toBe(true);
  await page.waitForFunction(
    (b) => document.querySelector("[data-testid=whatif-lead]")?.textContent !== b,
    before,
    { timeout: 15_000 },
  );
  return { text: await page.locator("[data-testid=whatif-lead]").innerText(), serverMs: json.elapsedMs };
}

describe("physical what-if", () => {
  it("the consultant moves the load and the climate shift: the headline follows, nothing is saved", async () => {
    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    await signIn(page, DEMO_ACCOUNTS.consultant.email, DEMO_PASSWORD);
    await page.goto(`/projects/${projectId}/scenarios/${scenarioId}`);
    await page.locator("[data-testid=what-if]").waitFor();
    const saved = await savedState();

    const start = await page.locator("[data-testid=whatif-lead]").innerText();
    const load = await moveAndWait(page, "whatif-load", 4, start, "loadFactor");
    expect(load.text).not.toBe(start);
    expect(await page.locator("[data-testid=whatif-load]").getAttribute("aria-valuetext")).toContain("×1.20");

    const warmer = await moveAndWait(page, "whatif-shift", 4, load.text, "climateShiftK");
    expect(warmer.text).not.toBe(load.text);
    await page.locator("[data-testid=what-if]").screenshot({ path: `test-results/screenshots/physics-what-if.png` });
    console.log(`[physics what-if] server compute: load ${load.serverMs.toFixed(1)} ms, climate shift ${warmer.serverMs.toFixed(1)} ms`);

    expect(await savedState()).toEqual(saved);
    await screenshot(page, "physics-what-if-page");
    await ctx.close();
  });

  it("the owner moves the load on the issued version through the API; out-of-range and unknown options are refused by field", async () => {
    const cookie = await signInHttp(DEMO_ACCOUNTS.owner.email, DEMO_PASSWORD);
    expect(cookie).not.toBeNull();
    const post = (body: unknown) =>
      fetch(`${BASE_URL}/api/scenarios/${scenarioId}/what-if`, {
        method: "POST",
        headers: { "content-type": "application/json", cookie: cookie ?? "" },
        body: JSON.stringify(body),
      });
    const base = (await (await post({ electricityPriceFactor: 1 })).json()) as { options: { lcc: number }[] };
    const heavier = await post({ loadFactor: 1.3 });
    expect(heavier.status).toBe(200);
    const h = (await heavier.json()) as { physicsRerun: boolean; options: { lcc: number }[] };
    expect(h.physicsRerun).toBe(true);
    // More heat to reject costs every option more to run.
    h.options.forEach((o, i) => expect(o.lcc).toBeGreaterThan(base.options[i]?.lcc ?? Infinity));

    const bad = await post({ loadFactor: 7, sizeFactorByOptionId: { "no-such-option": 1.2 } });
    expect(bad.status).toBe(422);
    const badJson = (await bad.json()) as { fieldErrors: Record<string, string[]> };
    expect(Object.keys(badJson.fieldErrors)).toContain("loadFactor");
    const unknown = await post({ sizeFactorByOptionId: { "no-such-option": 1.2 } });
    expect(unknown.status).toBe(422);
    expect(Object.keys(((await unknown.json()) as { fieldErrors: Record<string, string[]> }).fieldErrors)).toEqual(["sizeFactorByOptionId.no-such-option"]);
  });
});
