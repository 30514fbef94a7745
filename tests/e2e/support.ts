import { mkdirSync } from "node:fs";
import path from "node:path";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";

export const BASE_URL = process.env.E2E_BASE_URL ?? "http://127.0.0.1:3100";
export const ARTIFACTS = path.resolve(__dirname, "../../test-results/screenshots");
mkdirSync(ARTIFACTS, { recursive: true });

/** Debian's chromium, headless, with the background-networking flags this offline machine needs. */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
}

/** A fresh browser profile (its own cookies). */
export async function newContext(browser: Browser): Promise<BrowserContext> {
  return browser.newContext({ baseURL: BASE_URL, viewport: { width: 1280, height: 900 } });
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto("/signin");
  await page.fill("#email", email);
  await page.fill("#password", password);
  await Promise.all([page.waitForURL((u) => !u.pathname.startsWith("/signin"), { timeout: 30_000 }), page.click("button[type=submit]")]);
}

export async function screenshot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(ARTIFACTS, `${name}.png`), fullPage: true });
}
