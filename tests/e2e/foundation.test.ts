import { existsSync, readFileSync } from "node:fs";
import { connect } from "node:net";
import { networkInterfaces } from "node:os";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed";
import { createDb } from "@/db/client";
import { hashPassword } from "@/lib/auth/password";
import { BASE_URL, launchBrowser, newContext, screenshot, signIn } from "./support";

let browser: Browser;
let otherProjectId: string;
let demoProjectId: string;
const db = createDb(process.env.DATABASE_URL!, 2);

beforeAll(async () => {
  browser = await launchBrowser();
  // A second firm with a project the demo client users have no grant on.
  const firm = await db.insertInto("firms").values({ name: "Elsewhere Engineering (test)" }).returning("id").executeTakeFirstOrThrow();
  const p = await db
    .insertInto("projects")
    .values({ firm_id: firm.id, name: "Secret rival project", client_name: "Rival Foods", site_name: "Hidden Site" })
    .returning("id")
    .executeTakeFirstOrThrow();
  otherProjectId = p.id;
  demoProjectId = (await db.selectFrom("projects").select("id").where("name", "like", "Harrowgate Flats%").executeTakeFirstOrThrow()).id;
  void hashPassword;
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

const expectedNav: Record<keyof typeof DEMO_ACCOUNTS, { has: string[]; hasNot: string[] }> = {
  admin: { has: ["Projects", "Firm members", "Account"], hasNot: [] },
  consultant: { has: ["Projects", "Account"], hasNot: ["Firm members"] },
  owner: { has: ["Projects", "Account"], hasNot: ["Firm members"] },
  finance: { has: ["Projects", "Account"], hasNot: ["Firm members"] },
};

describe("sign-in and roles in a real browser", () => {
  for (const role of Object.keys(DEMO_ACCOUNTS) as (keyof typeof DEMO_ACCOUNTS)[]) {
    it(`${role} signs in and sees the right navigation`, async () => {
      const ctx = await newContext(browser);
      const page = await ctx.newPage();
      await signIn(page, DEMO_ACCOUNTS[role].email, DEMO_PASSWORD);
      expect(new URL(page.url()).pathname).toBe("/projects");
      const nav = await page.locator("[data-testid=main-nav] a").allInnerTexts();
      for (const label of expectedNav[role].has) expect(nav).toContain(label);
      for (const label of expectedNav[role].hasNot) expect(nav).not.toContain(label);
      await expect(page.getByTestId("viewer-name").innerText()).resolves.toBe(DEMO_ACCOUNTS[role].name);
      // Every demo role sees the demo project, under the heading that fits its relation.
      const list = role === "admin" || role === "consultant" ? "projects-mine" : "projects-shared";
      await expect(page.getByTestId(list).innerText()).resolves.toContain("Harrowgate Flats");
      await screenshot(page, `foundation-projects-${role}`);
      await ctx.close();
    });
  }

  it("an anonymous visitor is redirected to sign-in", async () => {
    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    await page.goto(`/projects/${demoProjectId}`);
    expect(new URL(page.url()).pathname).toBe("/signin");
    expect(await page.content()).not.toContain("Harrowgate Flats cold store");
    await ctx.close();
  });

  it("a client user cannot open a project not shared with them (404, nothing of it in the HTML)", async () => {
    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    await signIn(page, DEMO_ACCOUNTS.owner.email, DEMO_PASSWORD);
    const res = await page.goto(`/projects/${otherProjectId}`);
    expect(res?.status()).toBe(404);
    const html = await page.content();
    expect(html).not.toContain("Secret rival project");
    expect(html).not.toContain("Rival Foods");
    // The consultant of another firm is shut out the same way.
    const ctx2 = await newContext(browser);
    const page2 = await ctx2.newPage();
    await signIn(page2, DEMO_ACCOUNTS.consultant.email, DEMO_PASSWORD);
    const res2 = await page2.goto(`/projects/${otherProjectId}`);
    expect(res2?.status()).toBe(404);
    expect(await page2.content()).not.toContain("Hidden Site");
    // And the shared one opens.
    const ok = await page.goto(`/projects/${demoProjectId}`);
    expect(ok?.status()).toBe(200);
    await ctx.close();
    await ctx2.close();
  });

  it("a wrong password shows the one generic message", async () => {
    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    await page.goto("/signin");
    await page.fill("#email", DEMO_ACCOUNTS.finance.email);
    await page.fill("#password", "not-the-password");
    await page.click("button[type=submit]");
    const msg = await page.getByTestId("signin-error").innerText();
    expect(msg).toMatch(/did not match an account/);
    // The same message for an address with no account: nothing reveals which accounts exist.
    await page.fill("#email", "nobody-here@example.test");
    // Wait for the second attempt's answer, then for the form to be idle again with its message shown
    // (the form clears the message when it submits, so the one read below is the new one).
    const answered = page.waitForResponse((r) => r.url().includes("/api/auth/callback/credentials"));
    await page.click("button[type=submit]");
    await answered;
    await page.locator("button[type=submit]:not([disabled])").waitFor();
    await page.getByTestId("signin-error").waitFor();
    expect(await page.getByTestId("signin-error").innerText()).toBe(msg);
    expect(new URL(page.url()).pathname).toBe("/signin");
    await screenshot(page, "foundation-signin-error");
    await ctx.close();
  });

  it("the server listens on loopback only (its listening sockets, and a refused connection on a non-loopback address)", async () => {
    const port = Number(new URL(BASE_URL).port);
    // /proc/net/tcp{,6}: local_address is hex IP:port; state 0A is LISTEN (Linux proc(5)).
    const listening: string[] = [];
    for (const file of ["/proc/net/tcp", "/proc/net/tcp6"]) {
      if (!existsSync(file)) continue;
      for (const line of readFileSync(file, "utf8").split("\n").slice(1)) {
        const cols = line.trim().split(/\s+/);
        if (cols.length < 4 || cols[3] !== "0A") continue;
        const [ip, portHex] = cols[1]!.split(":");
        if (parseInt(portHex!, 16) === port) listening.push(ip!);
      }
    }
    expect(listening.length).toBeGreaterThan(0);
    // 127.0.0.1 is 0100007F (little-endian); ::1 is 00000000000000000000000001000000.
    for (const ip of listening) expect(["0100007F", "00000000000000000000000001000000"]).toContain(ip);
    // And from outside loopback: every non-internal IPv4 address of this machine refuses the port.
    const outside = Object.values(networkInterfaces())
      .flat()
      .filter((a) => a && a.family === "IPv4" && !a.internal)
      .map((a) => a!.address);
    for (const address of outside) {
      const outcome = await new Promise<string>((resolve) => {
        const sock = connect({ host: address, port, timeout: 3000 });
        sock.once("connect", () => {
          sock.destroy();
          resolve("connected");
        });
        sock.once("timeout", () => {
          sock.destroy();
          resolve("timeout");
        });
        sock.once("error", (e: NodeJS.ErrnoException) => resolve(e.code ?? "error"));
      });
      expect(outcome, `${address}:${port}`).not.toBe("connected");
    }
  });
});
