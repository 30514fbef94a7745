import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { createDb } from "@/db/client";
import { hashPassword } from "@/lib/auth/password";
import { SIGN_IN_LIMITS } from "@/lib/auth/rate-limit";
import { encode } from "next-auth/jwt";
import { uniq } from "../support/db";
import { BASE_URL, launchBrowser, newContext, screenshot, signIn } from "./support";
import { signInHttp } from "./http-session";

/**
 * Account safety against the running app: the sign-in limit applies through the real credentials endpoint
 * (per account and per address, stored in PostgreSQL), and a password change ends every older session.
 */
const db = createDb(process.env.DATABASE_URL!, 2);
let browser: Browser;
const PASSWORD = "copper-basin-ledger-2026";

async function makeUser(label: string) {
  const email = `${label}.${uniq()}@example.test`;
  await db.insertInto("users").values({ email, name: `Test ${label}`, password_hash: await hashPassword(PASSWORD) }).execute();
  return email;
}
/**
 * A client address of its own for each scenario (a documentation-range prefix, RFC 5737, plus a unique
 * suffix: the limiter only keys on the text), so these attempts never count against other tests' sign-ins.
 */
function address(): string {
  return `198.51.100.7-${uniq()}`;
}
const from = (a: string) => ({ "x-forwarded-for": a });

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

describe("sign-in rate limit through /api/auth/callback/credentials", () => {
  it(`blocks an account after ${SIGN_IN_LIMITS.account.maxFailures} failures, even with the right password from elsewhere`, async () => {
    const email = await makeUser("limit");
    expect(await signInHttp(email, PASSWORD, from(address()))).not.toBeNull();
    const a = address();
    for (let i = 0; i < SIGN_IN_LIMITS.account.maxFailures; i++) {
      expect(await signInHttp(email, `wrong-password-${i}`, from(a))).toBeNull();
    }
    expect(await signInHttp(email, PASSWORD, from(address()))).toBeNull();
    const row = await db.selectFrom("sign_in_attempts").selectAll().where("key", "=", `acct:${email}`).executeTakeFirstOrThrow();
    expect(row.failures).toBe(SIGN_IN_LIMITS.account.maxFailures);
    const blockedForS = (row.blocked_until!.getTime() - Date.now()) / 1000;
    expect(blockedForS).toBeGreaterThan(SIGN_IN_LIMITS.account.blockS - 60);
  });

  it(`blocks an address after ${SIGN_IN_LIMITS.address.maxFailures} failures across accounts; prefixed X-Forwarded-For entries do not escape it`, async () => {
    const a = address();
    for (let i = 0; i < SIGN_IN_LIMITS.address.maxFailures; i++) {
      expect(await signInHttp(`nobody-${i}.${uniq()}@example.test`, "whatever-it-is", from(a))).toBeNull();
    }
    const email = await makeUser("addr");
    expect(await signInHttp(email, PASSWORD, from(a))).toBeNull();
    expect(await signInHttp(email, PASSWORD, from(`203.0.113.9, ${a}`))).toBeNull();
    // The same account from another address signs in: the block was the address's, not the account's.
    expect(await signInHttp(email, PASSWORD, from(address()))).not.toBeNull();
  });
});

describe("sessions", () => {
  it("a password change signs out every older session, and the new password works", async () => {
    const email = await makeUser("pwchange");
    const older = await signInHttp(email, PASSWORD, from(address()));
    expect(older).not.toBeNull();
    const page0 = await fetch(`${BASE_URL}/account`, { headers: { cookie: older! }, redirect: "manual" });
    expect(page0.status).toBe(200);

    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    await signIn(page, email, PASSWORD);
    await page.goto("/account");
    await page.fill("#pw-current", "not-my-password-at-all");
    await page.fill("#pw-new", "a-new-long-passphrase-2026");
    await page.fill("#pw-confirm", "a-new-long-passphrase-2026");
    await page.click("[data-testid=password-form] button[type=submit]");
    await expect(page.getByTestId("currentPassword-error").innerText()).resolves.toMatch(/not your current password/);
    await page.fill("#pw-current", PASSWORD);
    await page.fill("#pw-new", "a-new-long-passphrase-2026");
    await page.fill("#pw-confirm", "a-new-long-passphrase-2026");
    await page.click("[data-testid=password-form] button[type=submit]");
    await page.getByTestId("password-message").filter({ hasText: /Password changed/ }).waitFor({ timeout: 15_000 });
    // The form signs this browser in again with the new password and then says so.
    await page.getByText("You stay signed in here with the new password.").waitFor({ timeout: 15_000 });
    // This browser signed in again with the new password and stays in.
    expect((await page.goto("/account"))?.status()).toBe(200);
    expect(new URL(page.url()).pathname).toBe("/account");
    await screenshot(page, "account-password-changed");

    // The session from before the change no longer counts: the page sends it to sign-in.
    const after = await fetch(`${BASE_URL}/account`, { headers: { cookie: older! }, redirect: "manual" });
    expect([302, 303, 307]).toContain(after.status);
    expect(after.headers.get("location") ?? "").toMatch(/\/signin/);
    expect(await signInHttp(email, PASSWORD, from(address()))).toBeNull();
    expect(await signInHttp(email, "a-new-long-passphrase-2026", from(address()))).not.toBeNull();
    await ctx.close();
  });

  it("a session older than SESSION_MAX_AGE_S is refused even while its cookie is still valid", async () => {
    const email = await makeUser("aged");
    const user = await db.selectFrom("users").select(["id", "password_changed_at"]).where("email", "=", email).executeTakeFirstOrThrow();
    const maxAgeS = Number(process.env.SESSION_MAX_AGE_S ?? 8 * 3600);
    // A token signed with the app's secret, as next-auth would have issued it, whose sign-in is one hour past the limit.
    const mint = (authAtMs: number) =>
      encode({
        secret: process.env.NEXTAUTH_SECRET!,
        maxAge: maxAgeS,
        token: { userId: user.id, email, name: "Test aged", authAtMs, pwdAtMs: user.password_changed_at.getTime(), firmRoles: [], clientRoles: [] },
      });
    const fresh = await fetch(`${BASE_URL}/account`, { headers: { cookie: `next-auth.session-token=${await mint(Date.now() - 60_000)}` }, redirect: "manual" });
    expect(fresh.status).toBe(200);
    const aged = await fetch(`${BASE_URL}/account`, { headers: { cookie: `next-auth.session-token=${await mint(Date.now() - (maxAgeS + 3600) * 1000)}` }, redirect: "manual" });
    expect(aged.status).toBe(307);
    expect(aged.headers.get("location") ?? "").toMatch(/\/signin/);
  });
});
