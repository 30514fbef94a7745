import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "kysely";
import type { Browser, Page } from "playwright-core";
import { createDb } from "@/db/client";
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_PROJECT } from "@/db/seed";
import { startCaptureServer, firstLink, type CaptureServer } from "@/lib/mail/capture";
import { LINK_MESSAGES } from "@/lib/sharing/acceptance";
import { uniq } from "../support/db";
import { BASE_URL, launchBrowser, newContext, screenshot, signIn } from "./support";
import { projectWithAnalysedScenario } from "./invite-support";

/**
 * The sharing flow end to end, against the running app: the consultant issues a scenario and invites an
 * address; the e-mail is caught by an in-process SMTP server (the app sends to SMTP_PORT); the link is
 * followed in a fresh browser profile; the new viewer sees the issued comparison and nothing else; a
 * reused or expired link is refused; a revoked viewer is shut out at the next request.
 */
const db = createDb(process.env.DATABASE_URL!, 2);
const SMTP_PORT = Number(process.env.SMTP_PORT ?? process.env.TEST_SMTP_PORT ?? 2626);
let browser: Browser;
let smtp: CaptureServer;
const tag = uniq("e2e");
const draftOnlyName = `Unissued draft ${tag}`;
let fx: Awaited<ReturnType<typeof projectWithAnalysedScenario>>;
const viewerEmail = `fern.finance.${tag}@example.test`;
const viewerPassword = "brass-valve-ledger-2026";
let inviteLink = "";
let consultantPage: Page;

beforeAll(async () => {
  smtp = await startCaptureServer({ port: SMTP_PORT });
  browser = await launchBrowser();
  fx = await projectWithAnalysedScenario(db, tag, { draftOnlyName });
  const ctx = await newContext(browser);
  consultantPage = await ctx.newPage();
  consultantPage.on("dialog", (d) => void d.accept());
  await signIn(consultantPage, DEMO_ACCOUNTS.consultant.email, DEMO_PASSWORD);
});

afterAll(async () => {
  await browser?.close();
  await smtp?.close();
  await db.destroy();
});

async function invite(page: Page, email: string, role: "owner" | "finance") {
  await page.goto(`/projects/${fx.projectId}/access`);
  await page.fill("#invite-email", email);
  await page.selectOption("#invite-role", role);
  await page.click("[data-testid=invite-form] button[type=submit]");
  await expect(page.getByTestId("invite-message").innerText()).resolves.toContain(`Invitation for ${email}`);
}

describe("invitation flow in a real browser", () => {
  it("the consultant issues the scenario as version 1", async () => {
    const page = consultantPage;
    const res = await page.goto(`/projects/${fx.projectId}/scenarios/${fx.scenarioId}/versions`);
    expect(res?.status()).toBe(200);
    await page.fill("#issue-note", "First issue for the capital request.");
    await Promise.all([page.waitForURL(/\/versions\/1$/), page.click("[data-testid=issue-form] button[type=submit]")]);
    await expect(page.getByTestId("version-frozen-note").innerText()).resolves.toMatch(/frozen/);
    await expect(page.getByTestId("version-note").innerText()).resolves.toBe("First issue for the capital request.");
    await screenshot(page, "invite-01-issued-version");
  });

  it("the consultant invites an address; the e-mail arrives with a single-use link", async () => {
    await invite(consultantPage, viewerEmail, "finance");
    const mail = await smtp.waitFor((m) => m.envelopeTo.includes(viewerEmail), 30_000);
    expect(mail.subject).toContain(fx.projectName);
    expect(mail.text).toContain("Finance (client viewer)");
    inviteLink = firstLink(mail.text) ?? "";
    expect(inviteLink.startsWith(`${BASE_URL}/invite/`)).toBe(true);
    expect(inviteLink).toMatch(/\/invite\/[A-Za-z0-9_-]{43}$/);
    // The HTML part carries the same link.
    expect(mail.html).toContain(inviteLink);
    // The access page shows the invitation as waiting, its e-mail as sent.
    await consultantPage.reload();
    const row = consultantPage.locator(`[data-testid=access-invitation-row][data-email="${viewerEmail}"]`);
    await expect(row.getByTestId("invitation-state").innerText()).resolves.toBe("Waiting for acceptance");
    await expect(row.getByTestId("invitation-mail").innerText()).resolves.toMatch(/^Sent /);
    // No token or token hash on the consultant's page.
    const html = await consultantPage.content();
    expect(html).not.toContain(inviteLink.split("/invite/")[1]!);
    const hashes = await db.selectFrom("invitations").select("token_hash").where("project_id", "=", fx.projectId).execute();
    for (const h of hashes) expect(html).not.toContain(h.token_hash);
    await screenshot(consultantPage, "invite-02-access-page");
  });

  it("a new person follows the link in a fresh profile, sets a password and sees the issued comparison only", async () => {
    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    await page.goto(inviteLink);
    await expect(page.getByTestId("invite-intro").innerText()).resolves.toContain(fx.projectName);
    // The policy is enforced on the server: the e-mail as password is refused with the reason.
    await page.fill("#invite-name", "Fern Okafor");
    await page.fill("#invite-password", viewerEmail);
    await page.fill("#invite-confirm", viewerEmail);
    await page.click("[data-testid=invite-new-account] button[type=submit]");
    await expect(page.getByTestId("password-error").innerText()).resolves.toMatch(/e-mail address/);
    await screenshot(page, "invite-03-policy-refused");

    await page.fill("#invite-password", viewerPassword);
    await page.fill("#invite-confirm", viewerPassword);
    await Promise.all([
      page.waitForURL((u) => u.pathname === `/projects/${fx.projectId}`, { timeout: 30_000 }),
      page.click("[data-testid=invite-new-account] button[type=submit]"),
    ]);
    await expect(page.getByTestId("viewer-name").innerText()).resolves.toBe("Fern Okafor");
    const list = page.getByTestId("issued-comparisons");
    await expect(list.innerText()).resolves.toContain("version 1");
    const projectHtml = await page.content();
    expect(projectHtml).not.toContain(draftOnlyName);
    expect(projectHtml).not.toContain("Audit trail");
    await screenshot(page, "invite-04-viewer-project");

    // The issued version opens, with the comparison.
    await Promise.all([page.waitForURL(/\/versions\/1$/), list.locator("a").first().click()]);
    const versionHtml = await page.content();
    expect(versionHtml).toMatch(/data-testid="(comparison|version-summary)"/);
    expect(versionHtml).not.toContain(draftOnlyName);
    await screenshot(page, "invite-05-viewer-version");

    // Nothing else. The draft's address sends a client viewer to the issued versions, never to the draft.
    const toDraft = await page.goto(`/projects/${fx.projectId}/scenarios/${fx.scenarioId}`);
    expect(new URL(page.url()).pathname).toBe(`/projects/${fx.projectId}/scenarios/${fx.scenarioId}/versions`);
    expect(toDraft?.status()).toBe(200);
    expect(await page.locator("[data-testid=issue-form]").count()).toBe(0);
    // A scenario with nothing issued does not exist for them, under either address.
    for (const path of [`/projects/${fx.projectId}/scenarios/${fx.draftOnlyId}`, `/projects/${fx.projectId}/scenarios/${fx.draftOnlyId}/versions`]) {
      const r = await page.goto(path);
      expect(r?.status(), path).toBe(404);
      expect(await page.content()).not.toContain(draftOnlyName);
    }
    expect((await page.goto(`/projects/${fx.projectId}/access`))?.status()).toBe(403);
    const demoId = (await db.selectFrom("projects").select("id").where("name", "=", DEMO_PROJECT.name).executeTakeFirstOrThrow()).id;
    expect((await page.goto(`/projects/${demoId}`))?.status()).toBe(404);
    await page.goto("/projects");
    await expect(page.getByTestId("projects-shared").innerText()).resolves.toContain(fx.projectName);
    expect(await page.getByTestId("projects-shared").locator("tbody tr").count()).toBe(1);

    // The grant is exactly the invited role on exactly this project.
    const grants = await db
      .selectFrom("project_access")
      .innerJoin("users", "users.id", "project_access.user_id")
      .select(["project_access.project_id", "project_access.role"])
      .where("users.email", "=", viewerEmail)
      .execute();
    expect(grants).toEqual([{ project_id: fx.projectId, role: "finance" }]);
    await ctx.close();
  });

  it("the viewer comments; the consultant sees it and gets an e-mail", async () => {
    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    await signIn(page, viewerEmail, viewerPassword);
    await page.goto(`/projects/${fx.projectId}/scenarios/${fx.scenarioId}/versions/1`);
    const body = `Which water price does the ${tag} comparison assume?`;
    await page.fill("#comment-body", body);
    await page.click("[data-testid=comment-form] button[type=submit]");
    await expect(page.getByTestId("comment-message").innerText()).resolves.toMatch(/Comment posted/);
    const mail = await smtp.waitFor((m) => m.envelopeTo.includes(DEMO_ACCOUNTS.consultant.email) && m.text.includes(body), 30_000);
    expect(mail.subject).toMatch(/^New comment on /);
    await consultantPage.goto(`/projects/${fx.projectId}/scenarios/${fx.scenarioId}/versions/1`);
    await expect(consultantPage.getByTestId("comment-list").innerText()).resolves.toContain(body);
    await ctx.close();
  });

  it("the used link is refused with a clear message", async () => {
    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    await page.goto(inviteLink);
    await expect(page.getByTestId("invite-refused").innerText()).resolves.toBe(LINK_MESSAGES.accepted);
    await screenshot(page, "invite-06-link-reused");
    await ctx.close();
  });

  it("an expired link is refused with a clear message", async () => {
    const email = `late.${tag}@example.test`;
    await invite(consultantPage, email, "owner");
    const mail = await smtp.waitFor((m) => m.envelopeTo.includes(email), 30_000);
    await db
      .updateTable("invitations")
      .set({ expires_at: sql`now() - interval '1 hour'` })
      .where("project_id", "=", fx.projectId)
      .where("email", "=", email)
      .execute();
    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    await page.goto(firstLink(mail.text)!);
    await expect(page.getByTestId("invite-refused").innerText()).resolves.toMatch(/^This invitation expired on \d{4}-\d{2}-\d{2}\. .*new one\.$/);
    expect(await page.locator("form").count()).toBe(0);
    await screenshot(page, "invite-07-link-expired");
    await ctx.close();
  });

  it("a revoked viewer is shut out at the next request", async () => {
    const ctx = await newContext(browser);
    const page = await ctx.newPage();
    await signIn(page, viewerEmail, viewerPassword);
    const versionPath = `/projects/${fx.projectId}/scenarios/${fx.scenarioId}/versions/1`;
    expect((await page.goto(versionPath))?.status()).toBe(200);

    await consultantPage.goto(`/projects/${fx.projectId}/access`);
    await consultantPage.click(`[data-testid="revoke-${viewerEmail}"]`);
    await consultantPage.locator(`[data-testid="revoke-${viewerEmail}"]`).waitFor({ state: "detached", timeout: 15_000 });

    // Same browser, same session cookie: the very next request is refused.
    const again = await page.goto(versionPath);
    expect(again?.status()).toBe(404);
    expect(await page.content()).not.toContain(fx.scenarioName);
    expect((await page.goto(`/projects/${fx.projectId}`))?.status()).toBe(404);
    const api = await page.request.get(`/api/projects/${fx.projectId}/comments?versionId=00000000-0000-4000-8000-000000000000`);
    expect(api.status()).toBe(404);
    await page.goto("/projects");
    expect(await page.content()).not.toContain(fx.projectName);
    await screenshot(page, "invite-08-revoked");

    // The firm sees all of it in the audit trail.
    await consultantPage.goto(`/projects/${fx.projectId}`);
    const actions = await consultantPage.locator("[data-testid=audit-row]").evaluateAll((rows) => rows.map((r) => r.getAttribute("data-action")));
    for (const a of ["version.issue", "invitation.create", "invitation.accept", "version.view", "comment.create", "access.revoke"]) {
      expect(actions, a).toContain(a);
    }
    await screenshot(consultantPage, "invite-09-audit-trail");
    await ctx.close();
  });
});
