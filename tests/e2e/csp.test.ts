import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readdirSync, statSync } from "node:fs";
import path from "node:path";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { createDb } from "@/db/client";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed";
import { BASE_URL, launchBrowser, newContext, signIn } from "./support";

/**
 * Every page under app/ (found by scanning the folder, so a new page cannot be skipped), loaded in Chromium
 * with the Content-Security-Policy the proxy sends: no CSP violation reaches the console or the
 * `securitypolicyviolation` event, the policy carries a fresh nonce and no 'unsafe-eval', and the inline
 * scripts of the server's HTML carry that nonce. Also the fixed security headers on pages and APIs.
 */
const db = createDb(process.env.DATABASE_URL!, 2);
const APP_DIR = path.resolve(__dirname, "../../app");

function pagePatterns(dir = APP_DIR, segments: string[] = []): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(dir).sort()) {
    const full = path.join(dir, entry);
    if (statSync(full).isDirectory()) {
      if (entry.startsWith("_") || entry.startsWith("@") || entry === "api") continue;
      const seg = /^\(.*\)$/.test(entry) ? null : entry;
      out.push(...pagePatterns(full, seg ? [...segments, seg] : segments));
    } else if (/^page\.tsx?$/.test(entry)) {
      out.push("/" + segments.join("/"));
    }
  }
  return out;
}

let browser: Browser;
let consultant: BrowserContext;
let anonymous: BrowserContext;
let ids: Record<string, string> = {};

beforeAll(async () => {
  browser = await launchBrowser();
  consultant = await newContext(browser);
  anonymous = await newContext(browser);
  const p = await consultant.newPage();
  await signIn(p, DEMO_ACCOUNTS.consultant.email, DEMO_PASSWORD);
  await p.close();
  const s = await db
    .selectFrom("scenarios")
    .innerJoin("scenario_versions", "scenario_versions.scenario_id", "scenarios.id")
    .select(["scenarios.id as scenarioId", "scenarios.project_id as projectId", "scenarios.climate_dataset_id as datasetId"])
    .where("scenario_versions.version_number", "=", 1)
    .orderBy("scenarios.created_at")
    .executeTakeFirstOrThrow();
  ids = { projectId: s.projectId, scenarioId: s.scenarioId, datasetId: s.datasetId ?? "", version: "1", token: "not-a-real-invitation-token" };
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

interface Visit {
  url: string;
  status: number;
  csp: string;
  violations: string[];
  inlineWithoutNonce: number;
}

async function visit(ctx: BrowserContext, url: string): Promise<Visit> {
  const page: Page = await ctx.newPage();
  const violations: string[] = [];
  page.on("console", (m) => {
    if (/Content Security Policy|Content-Security-Policy|Refused to (execute|load|apply|frame|connect)/i.test(m.text())) violations.push(m.text());
  });
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => {
      (window as unknown as { __csp?: string[] }).__csp ??= [];
      (window as unknown as { __csp: string[] }).__csp.push(`${e.violatedDirective} ${e.blockedURI}`);
    });
  });
  const res = await page.goto(url, { waitUntil: "load" });
  // Hydration and the charts' first draw happen after load: wait for the network to go quiet.
  await page.waitForLoadState("networkidle");
  const events = await page.evaluate(() => (window as unknown as { __csp?: string[] }).__csp ?? []);
  const html = (await res?.text()) ?? "";
  const inlineWithoutNonce = [...html.matchAll(/<script(?![^>]*\bnonce=)(?![^>]*\bsrc=)[^>]*>/g)].length;
  const csp = (await res?.allHeaders())?.["content-security-policy"] ?? "";
  const status = res?.status() ?? 0;
  await page.close();
  return { url, status, csp, violations: [...violations, ...events], inlineWithoutNonce };
}

describe("the Content-Security-Policy holds on every page", () => {
  it("no page violates it, as a consultant (every page) and anonymously (sign-in, invitation, home)", async () => {
    const patterns = pagePatterns();
    expect(patterns.length).toBeGreaterThan(10);
    const urls = patterns.map((p) => p.replace(/\[(\w+)\]/g, (_, name: string) => {
      const v = ids[name];
      if (!v) throw new Error(`csp test: no id for [${name}] in ${p}; add it to ids`);
      return v;
    }));
    const visits: Visit[] = [];
    for (const u of urls) visits.push(await visit(consultant, BASE_URL + u));
    for (const u of ["/signin", "/", `/invite/${ids.token}`]) visits.push(await visit(anonymous, BASE_URL + u));
    const nonces = new Set<string>();
    for (const v of visits) {
      expect(v.violations, `${v.url}: CSP violations`).toEqual([]);
      expect(v.csp, `${v.url}: no policy`).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{20,}' 'strict-dynamic'/);
      expect(v.csp).not.toMatch(/unsafe-eval/);
      expect(v.csp).toMatch(/frame-ancestors 'none'/);
      // Scripts in the server's HTML carry the nonce; chunks those scripts add later need none ('strict-dynamic').
      expect(v.inlineWithoutNonce, `${v.url}: inline scripts in the HTML without the nonce`).toBe(0);
      nonces.add(/'nonce-([^']+)'/.exec(v.csp)![1]!);
    }
    // A fresh nonce on every page load.
    expect(nonces.size).toBe(visits.length);
    console.log(`[csp] ${visits.length} page loads, 0 violations; statuses ${[...new Set(visits.map((v) => v.status))].join(", ")}`);
  });

  it("pages and APIs carry the fixed security headers; an API answer has a policy that allows nothing", async () => {
    for (const url of ["/signin", "/api/health/live", "/api/auth/csrf"]) {
      const res = await fetch(BASE_URL + url);
      const h = res.headers;
      expect(h.get("x-content-type-options"), url).toBe("nosniff");
      expect(h.get("referrer-policy"), url).toBe("strict-origin-when-cross-origin");
      expect(h.get("x-frame-options"), url).toBe("DENY");
      expect(h.get("permissions-policy"), url).toMatch(/camera=\(\)/);
      expect(h.get("content-security-policy"), url).toMatch(/frame-ancestors 'none'/);
      if (url.startsWith("/api/")) expect(h.get("content-security-policy")).toMatch(/default-src 'none'/);
    }
    // The build's static files too (next.config.mjs).
    const html = await (await fetch(`${BASE_URL}/signin`)).text();
    const asset = /\/_next\/static\/[^"']+\.js/.exec(html)?.[0];
    expect(asset).toBeTruthy();
    const res = await fetch(BASE_URL + asset!);
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
  });
});
