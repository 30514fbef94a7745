import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { sql } from "kysely";
import { testDb, uniq } from "../support/db";
import { buildWorld, WORLD_PASSWORD, type World } from "./sharing-fixtures";
import { loadProjectAccess, loadViewer } from "@/lib/auth/access";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { createInvitation, revokeInvitation, accessOverview, INVITATION_MAIL_KIND } from "@/lib/sharing/invitations";
import { acceptAsNewAccount, acceptAsViewer, inspectInvitation, LINK_MESSAGES } from "@/lib/sharing/acceptance";
import { revokeViewerAccess } from "@/lib/sharing/access";
import { issueScenario, listIssuedVersions, openIssuedVersion, scenarioVersions } from "@/lib/sharing/versions";
import { addComment, versionComments, COMMENT_MAIL_KIND } from "@/lib/sharing/comments";
import { projectAuditTrail } from "@/lib/sharing/audit";
import { hashInvitationToken } from "@/lib/sharing/tokens";
import type { CurrentResultResolver } from "@/lib/sharing/current-result";

const db = testDb();
const APP = "http://127.0.0.1:3999";
let w: World;
let worldHash = "";

// Every test gets a world of its own (two firms, their people, projects and version 1 of a scenario), so
// no test relies on rows another test made and the file passes in any order (`--sequence.shuffle`).
beforeAll(async () => {
  worldHash = await hashPassword(WORLD_PASSWORD);
});
beforeEach(async () => {
  w = await buildWorld(db, worldHash);
});
afterAll(() => db.destroy());

/** The token is only in the queued e-mail: read it back the way the recipient would, from the link. */
async function tokenFromOutbox(invitationId: string): Promise<string> {
  const row = await db
    .selectFrom("mail_outbox")
    .select(["text_body", "html_body"])
    .where("kind", "=", INVITATION_MAIL_KIND)
    .where("ref_id", "=", invitationId)
    .executeTakeFirstOrThrow();
  const m = /\/invite\/([A-Za-z0-9_-]{43})\b/.exec(row.text_body);
  expect(m, "the invitation e-mail carries the link").not.toBeNull();
  return m![1]!;
}

async function invite(email: string, role: "owner" | "finance" = "owner") {
  const r = await createInvitation(db, await w.viewer("consultant"), { projectId: w.P.id, email, role }, { appUrl: APP });
  if (!r.ok) throw new Error(r.error);
  return { ...r.value, token: await tokenFromOutbox(r.value.invitationId) };
}

describe("invitations", () => {
  it("stores only the SHA-256 of a 256-bit token, expires in 7 days, queues the e-mail and audits, in one go", async () => {
    const email = `${uniq("inv")}@example.test`;
    const before = Date.now();
    const inv = await invite(email, "finance");
    const row = await db.selectFrom("invitations").selectAll().where("id", "=", inv.invitationId).executeTakeFirstOrThrow();
    expect(row.token_hash).toBe(hashInvitationToken(inv.token));
    expect(row.token_hash).toMatch(/^[0-9a-f]{64}$/);
    // The plain token appears in no column of the invitation.
    expect(JSON.stringify(row)).not.toContain(inv.token);
    expect(row.role).toBe("finance");
    const days = (row.expires_at.getTime() - before) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThan(7.01);
    const mail = await db.selectFrom("mail_outbox").selectAll().where("id", "=", inv.mailId).executeTakeFirstOrThrow();
    expect(mail.status).toBe("pending");
    expect(mail.to_address).toBe(email);
    expect(mail.text_body).toContain(`${APP}/invite/${inv.token}`);
    const audit = await db.selectFrom("audit_events").selectAll().where("target_id", "=", inv.invitationId).execute();
    expect(audit.map((a) => a.action)).toContain("invitation.create");
  });

  it("validates the address and role and refuses members of the firm and people who already have access", async () => {
    const consultant = await w.viewer("consultant");
    const bad = await createInvitation(db, consultant, { projectId: w.P.id, email: "not-an-address", role: "boss" }, { appUrl: APP });
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.status).toBe(422);
      expect(Object.keys(bad.fieldErrors ?? {}).sort()).toEqual(["email", "role"]);
    }
    const member = await createInvitation(db, consultant, { projectId: w.P.id, email: w.users.admin.email, role: "owner" }, { appUrl: APP });
    expect(member.ok || member.status).toBe(409);
    const already = await createInvitation(db, consultant, { projectId: w.P.id, email: w.users.owner.email, role: "finance" }, { appUrl: APP });
    expect(already.ok || already.status).toBe(409);
  });

  it("only a consultant or admin of the project's firm can invite", async () => {
    for (const role of ["owner", "finance", "consultantOther", "ownerOther", "anonymous"] as const) {
      const r = await createInvitation(db, await w.viewer(role), { projectId: w.P.id, email: `${uniq()}@example.test`, role: "owner" }, { appUrl: APP });
      expect(r.ok ? 200 : r.status, role).toBe({ owner: 403, finance: 403, consultantOther: 404, ownerOther: 404, anonymous: 401 }[role]);
    }
    const admin = await createInvitation(db, await w.viewer("admin"), { projectId: w.P.id, email: `${uniq()}@example.test`, role: "owner" }, { appUrl: APP });
    expect(admin.ok).toBe(true);
  });

  it("a new invitation to the same address withdraws the older one and cancels its unsent e-mail", async () => {
    const email = `${uniq("again")}@example.test`;
    const first = await invite(email);
    const second = await invite(email);
    expect((await inspectInvitation(db, null, first.token)).state).toBe("revoked");
    expect((await inspectInvitation(db, null, second.token)).state).toBe("open");
    const firstMail = await db.selectFrom("mail_outbox").selectAll().where("id", "=", first.mailId).executeTakeFirstOrThrow();
    expect(firstMail.status).toBe("failed");
    expect(firstMail.text_body).toBe("");
  });

  it("a new person sets a name and a password under the policy, gets exactly the invited role, and the link is spent", async () => {
    const email = `${uniq("new")}@example.test`;
    const inv = await invite(email, "finance");
    const link = await inspectInvitation(db, null, inv.token);
    expect(link).toMatchObject({ state: "open", email, role: "finance", projectName: w.P.name, accountExists: false });

    const weak = await acceptAsNewAccount(db, null, { token: inv.token, name: "", password: email, confirmPassword: "x" });
    expect(weak.ok).toBe(false);
    if (!weak.ok) {
      expect(weak.fieldErrors?.name).toBeDefined();
      expect(weak.fieldErrors?.confirmPassword).toBeDefined();
      expect(weak.fieldErrors?.password?.join(" ")).toMatch(/e-mail/);
    }
    expect((await inspectInvitation(db, null, inv.token)).state).toBe("open");

    const ok = await acceptAsNewAccount(db, null, { token: inv.token, name: "Nia New", password: "a long enough passphrase", confirmPassword: "a long enough passphrase" });
    expect(ok.ok).toBe(true);
    const user = await db.selectFrom("users").selectAll().where("email", "=", email).executeTakeFirstOrThrow();
    expect(user.password_hash).toMatch(/^\$2[aby]\$/);
    expect(await verifyPassword("a long enough passphrase", user.password_hash)).toBe(true);
    const grants = await db.selectFrom("project_access").selectAll().where("user_id", "=", user.id).execute();
    expect(grants.map((g) => [g.project_id, g.role])).toEqual([[w.P.id, "finance"]]);
    const access = await loadProjectAccess(db, (await loadViewer(db, user.id))!, w.P.id);
    expect(access?.relation).toBe("finance");
    expect(await loadProjectAccess(db, (await loadViewer(db, user.id))!, w.Q.id)).toBeNull();

    // Reuse: refused with the message a person can act on.
    const again = await acceptAsNewAccount(db, null, { token: inv.token, name: "X", password: "another long passphrase", confirmPassword: "another long passphrase" });
    expect(again.ok).toBe(false);
    if (!again.ok) {
      expect(again.status).toBe(410);
      expect(again.error).toBe(LINK_MESSAGES.accepted);
    }
    expect(await acceptAsViewer(db, await loadViewer(db, user.id), { token: inv.token })).toMatchObject({ ok: false, status: 410 });
  });

  it("an expired link is refused and says when it expired", async () => {
    const inv = await invite(`${uniq("exp")}@example.test`);
    await db.updateTable("invitations").set({ expires_at: sql`now() - interval '1 minute'` }).where("id", "=", inv.invitationId).execute();
    const link = await inspectInvitation(db, null, inv.token);
    expect(link.state).toBe("expired");
    if (link.state === "expired") expect(link.message).toMatch(/expired on \d{4}-\d{2}-\d{2}/);
    const r = await acceptAsNewAccount(db, null, { token: inv.token, name: "Late", password: "a long enough passphrase", confirmPassword: "a long enough passphrase" });
    expect(r).toMatchObject({ ok: false, status: 410 });
  });

  it("a withdrawn link is refused; a made-up token is unknown", async () => {
    const inv = await invite(`${uniq("rev")}@example.test`);
    const owner = await revokeInvitation(db, await w.viewer("owner"), { projectId: w.P.id, invitationId: inv.invitationId });
    expect(owner).toMatchObject({ ok: false, status: 403 });
    const other = await revokeInvitation(db, await w.viewer("consultantOther"), { projectId: w.C.id, invitationId: inv.invitationId });
    expect(other).toMatchObject({ ok: false, status: 404 });
    expect((await revokeInvitation(db, await w.viewer("consultant"), { projectId: w.P.id, invitationId: inv.invitationId })).ok).toBe(true);
    expect(await inspectInvitation(db, null, inv.token)).toEqual({ state: "revoked", message: LINK_MESSAGES.revoked });
    expect((await inspectInvitation(db, null, "A".repeat(43))).state).toBe("unknown");
    expect((await inspectInvitation(db, null, "short")).state).toBe("unknown");
  });

  it("an existing account accepts only when signed in as the invited address", async () => {
    const inv = await invite(w.users.ownerOther.email, "finance");
    expect(await inspectInvitation(db, null, inv.token)).toMatchObject({ state: "open", accountExists: true });
    const asNew = await acceptAsNewAccount(db, null, { token: inv.token, name: "X", password: "a long enough passphrase", confirmPassword: "a long enough passphrase" });
    expect(asNew).toMatchObject({ ok: false, status: 409 });
    expect(await acceptAsViewer(db, await w.viewer("owner"), { token: inv.token })).toMatchObject({ ok: false, status: 403 });
    expect(await acceptAsViewer(db, null, { token: inv.token })).toMatchObject({ ok: false, status: 401 });
    const ok = await acceptAsViewer(db, await w.viewer("ownerOther"), { token: inv.token });
    expect(ok).toEqual({ ok: true, value: { projectId: w.P.id, role: "finance" } });
    expect((await loadProjectAccess(db, (await w.viewer("ownerOther"))!, w.P.id))?.relation).toBe("finance");
    // Their grant on Q is untouched.
    expect((await loadProjectAccess(db, (await w.viewer("ownerOther"))!, w.Q.id))?.relation).toBe("owner");
  });

  it("two acceptances of one link at the same moment: exactly one succeeds", async () => {
    const inv = await invite(w.users.financeOther.email, "owner");
    const v = await w.viewer("financeOther");
    const results = await Promise.all([acceptAsViewer(db, v, { token: inv.token }), acceptAsViewer(db, v, { token: inv.token }), acceptAsViewer(db, v, { token: inv.token })]);
    expect(results.filter((r) => r.ok)).toHaveLength(1);
  });

  it("the access overview lists viewers and invitations with their state and mail status, never a token hash", async () => {
    // This test's own invitations, one in each state: open, accepted (a new finance viewer), withdrawn, expired.
    await invite(`${uniq("open")}@example.test`);
    const accepted = await invite(`${uniq("acc")}@example.test`, "finance");
    const acc = await acceptAsNewAccount(db, null, { token: accepted.token, name: "Ada Accepted", password: "a long enough passphrase", confirmPassword: "a long enough passphrase" });
    expect(acc.ok).toBe(true);
    const withdrawn = await invite(`${uniq("wd")}@example.test`);
    expect((await revokeInvitation(db, await w.viewer("consultant"), { projectId: w.P.id, invitationId: withdrawn.invitationId })).ok).toBe(true);
    const expired = await invite(`${uniq("old")}@example.test`);
    await db.updateTable("invitations").set({ expires_at: sql`now() - interval '1 minute'` }).where("id", "=", expired.invitationId).execute();

    const r = await accessOverview(db, await w.viewer("consultant"), w.P.id);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.viewers.map((v) => v.role).sort()).toEqual(["finance", "finance", "owner"]);
    const states = new Set(r.value.invitations.map((i) => i.state));
    for (const s of ["pending", "accepted", "revoked", "expired"]) expect(states.has(s as never), s).toBe(true);
    expect(JSON.stringify(r.value)).not.toMatch(/token|[0-9a-f]{64}|\$2[aby]\$/);
    expect((await accessOverview(db, await w.viewer("finance"), w.P.id)).ok).toBe(false);
  });
});

describe("revoking access", () => {
  it("takes effect at the viewer's next read of their access, and is audited", async () => {
    const inv = await invite(`${uniq("gone")}@example.test`, "owner");
    const acc = await acceptAsNewAccount(db, null, { token: inv.token, name: "Gone Soon", password: "a long enough passphrase", confirmPassword: "a long enough passphrase" });
    if (!acc.ok) throw new Error(acc.error);
    const viewer = (await loadViewer(db, acc.value.userId))!;
    expect(await loadProjectAccess(db, viewer, w.P.id)).not.toBeNull();
    expect(await revokeViewerAccess(db, await w.viewer("finance"), { projectId: w.P.id, userId: acc.value.userId })).toMatchObject({ ok: false, status: 403 });
    expect(await revokeViewerAccess(db, await w.viewer("consultantOther"), { projectId: w.P.id, userId: acc.value.userId })).toMatchObject({ ok: false, status: 404 });
    expect((await revokeViewerAccess(db, await w.viewer("consultant"), { projectId: w.P.id, userId: acc.value.userId })).ok).toBe(true);
    // The same Viewer object (as a request that started before the revocation would hold) is refused now.
    expect(await loadProjectAccess(db, viewer, w.P.id)).toBeNull();
    expect(await listIssuedVersions(db, viewer, w.P.id)).toMatchObject({ ok: false, status: 404 });
    const trail = await projectAuditTrail(db, await w.viewer("consultant"), w.P.id);
    expect(trail.ok && trail.value.some((e) => e.action === "access.revoke" && e.summary.includes("Gone Soon"))).toBe(true);
  });
});

describe("issued versions", () => {
  const frozenResult = { headline: "option B lowest", lccUsd: [1234567.5, 1200000.25] };
  // Freezes whatever the draft holds at issue time (the real resolver builds the engine input from it).
  const stub: CurrentResultResolver = async (_db, draft) => ({ engineVersion: "9.9.9", inputsHash: "h".repeat(64), input: draft.input, result: frozenResult });
  const none: CurrentResultResolver = async () => null;

  it("issuing needs scenario.issue and a current result", async () => {
    expect(await issueScenario(db, await w.viewer("owner"), { projectId: w.P.id, scenarioId: w.P.scenarioId }, { resolveResult: stub })).toMatchObject({ ok: false, status: 403 });
    expect(await issueScenario(db, await w.viewer("consultantOther"), { projectId: w.P.id, scenarioId: w.P.scenarioId }, { resolveResult: stub })).toMatchObject({ ok: false, status: 404 });
    // Another firm's scenario under this project's id: not found, nothing issued.
    expect(await issueScenario(db, await w.viewer("consultant"), { projectId: w.P.id, scenarioId: w.C.scenarioId }, { resolveResult: stub })).toMatchObject({ ok: false, status: 404 });
    const r = await issueScenario(db, await w.viewer("consultant"), { projectId: w.P.id, scenarioId: w.P.scenarioId }, { resolveResult: none });
    expect(r).toMatchObject({ ok: false, status: 409 });
  });

  it("freezes the inputs and result; a later edit makes a new draft and never alters what was issued", async () => {
    const consultant = await w.viewer("consultant");
    const issued = await issueScenario(db, consultant, { projectId: w.P.id, scenarioId: w.P.scenarioId, note: "For the board" }, { resolveResult: stub });
    expect(issued.ok).toBe(true);
    if (!issued.ok) return;
    // The world holds version 1; this is the next.
    expect(issued.value.versionNumber).toBe(2);
    const before = await db.selectFrom("scenario_versions").selectAll().where("id", "=", issued.value.versionId).executeTakeFirstOrThrow();
    expect(before.input).toEqual({ marker: `Scenario of P ${w.tag}` });
    expect(before.result).toEqual(frozenResult);
    expect(before.note).toBe("For the board");

    // The draft is edited (input, name, revision) after issuing.
    await db
      .updateTable("scenarios")
      .set({ input: JSON.stringify({ marker: "edited after issue" }), name: "Renamed draft", revision: sql`revision + 1` })
      .where("id", "=", w.P.scenarioId)
      .execute();
    const after = await db.selectFrom("scenario_versions").selectAll().where("id", "=", issued.value.versionId).executeTakeFirstOrThrow();
    expect(after).toEqual(before);
    const opened = await openIssuedVersion(db, await w.viewer("finance"), w.P.id, w.P.scenarioId, 2);
    expect(opened.ok && opened.value.version.input).toEqual({ marker: `Scenario of P ${w.tag}` });
    expect(opened.ok && opened.value.version.name).toBe(`Scenario of P ${w.tag}`);

    // Issuing again freezes the edited draft as version 3; version 2 still holds the old one.
    const third = await issueScenario(db, consultant, { projectId: w.P.id, scenarioId: w.P.scenarioId }, { resolveResult: stub });
    expect(third.ok && third.value.versionNumber).toBe(3);
    const v3 = await db.selectFrom("scenario_versions").select(["input", "name", "scenario_revision"]).where("scenario_id", "=", w.P.scenarioId).where("version_number", "=", 3).executeTakeFirstOrThrow();
    expect(v3.input).toEqual({ marker: "edited after issue" });
    expect(v3.name).toBe("Renamed draft");
    expect(v3.scenario_revision).toBe(before.scenario_revision + 1);
  });

  it("two issues at the same moment take two numbers", async () => {
    const consultant = await w.viewer("consultant");
    const rs = await Promise.all([1, 2, 3].map(() => issueScenario(db, consultant, { projectId: w.P.id, scenarioId: w.P.scenarioId }, { resolveResult: stub })));
    const numbers = rs.map((r) => (r.ok ? r.value.versionNumber : -1)).sort();
    // The world holds version 1: the three take 2, 3 and 4.
    expect(numbers).toEqual([2, 3, 4]);
  });

  it("client viewers open issued versions of their project only, and their views are audited", async () => {
    const finance = await w.viewer("finance");
    expect((await openIssuedVersion(db, finance, w.P.id, w.P.scenarioId, 1)).ok).toBe(true);
    expect(await openIssuedVersion(db, finance, w.C.id, w.C.scenarioId, 1)).toMatchObject({ ok: false, status: 404 });
    // IDOR: this project's id with another project's scenario.
    expect(await openIssuedVersion(db, finance, w.P.id, w.C.scenarioId, 1)).toMatchObject({ ok: false, status: 404 });
    expect(await openIssuedVersion(db, await w.viewer("ownerOther"), w.P.id, w.P.scenarioId, 1)).toMatchObject({ ok: false, status: 404 });
    const views = await db.selectFrom("audit_events").selectAll().where("project_id", "=", w.P.id).where("action", "=", "version.view").execute();
    expect(views.some((v) => v.actor_id === w.users.finance.id)).toBe(true);
  });

  it("a client viewer does not learn of a scenario with nothing issued", async () => {
    const s = await db.insertInto("scenarios").values({ project_id: w.P.id, name: "Unissued draft", input: "{}" }).returning("id").executeTakeFirstOrThrow();
    expect(await scenarioVersions(db, await w.viewer("owner"), w.P.id, s.id)).toMatchObject({ ok: false, status: 404 });
    const firm = await scenarioVersions(db, await w.viewer("consultant"), w.P.id, s.id);
    expect(firm.ok && firm.value.draft?.name).toBe("Unissued draft");
  });
});

describe("comments", () => {
  it("owner and finance comment on an issued version; every firm member but the author gets an e-mail", async () => {
    const r = await addComment(db, await w.viewer("owner"), { projectId: w.P.id, versionId: w.P.versionId, body: "  Why is the cooler's spray water so high in July?  " }, { appUrl: APP });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.notified).toBe(2);
    const mails = await db.selectFrom("mail_outbox").selectAll().where("kind", "=", COMMENT_MAIL_KIND).where("ref_id", "=", r.value.commentId).execute();
    expect(mails.map((m) => m.to_address).sort()).toEqual([w.users.admin.email, w.users.consultant.email].sort());
    expect(mails[0]!.text_body).toContain("Why is the cooler's spray water so high in July?");
    expect(mails[0]!.text_body).toContain(`${APP}/projects/${w.P.id}/scenarios/${w.P.scenarioId}/versions/1#comments`);

    const list = await versionComments(db, await w.viewer("consultant"), w.P.id, w.P.versionId);
    expect(list.ok && list.value.at(-1)).toMatchObject({ body: "Why is the cooler's spray water so high in July?", authorClientRole: "owner" });
  });

  it("refuses empty comments, other projects' versions and people without the right", async () => {
    expect(await addComment(db, await w.viewer("finance"), { projectId: w.P.id, versionId: w.P.versionId, body: "   " }, { appUrl: APP })).toMatchObject({ ok: false, status: 422 });
    expect(await addComment(db, await w.viewer("finance"), { projectId: w.P.id, versionId: w.C.versionId, body: "hi" }, { appUrl: APP })).toMatchObject({ ok: false, status: 404 });
    expect(await addComment(db, await w.viewer("ownerOther"), { projectId: w.P.id, versionId: w.P.versionId, body: "hi" }, { appUrl: APP })).toMatchObject({ ok: false, status: 404 });
    expect(await addComment(db, await w.viewer("consultantOther"), { projectId: w.C.id, versionId: w.P.versionId, body: "hi" }, { appUrl: APP })).toMatchObject({ ok: false, status: 404 });
    expect(await addComment(db, null, { projectId: w.P.id, versionId: w.P.versionId, body: "hi" }, { appUrl: APP })).toMatchObject({ ok: false, status: 401 });
  });
});

describe("audit trail", () => {
  it("is for the firm only and reads as who did what", async () => {
    // This test's own history: an invitation accepted, one withdrawn, the new viewer's access revoked,
    // a version issued, opened by finance and commented on by the owner.
    const consultant = await w.viewer("consultant");
    const accepted = await invite(`${uniq("aud")}@example.test`, "owner");
    const acc = await acceptAsNewAccount(db, null, { token: accepted.token, name: "Otto Owner", password: "a long enough passphrase", confirmPassword: "a long enough passphrase" });
    if (!acc.ok) throw new Error(acc.error);
    const withdrawn = await invite(`${uniq("aud")}@example.test`);
    expect((await revokeInvitation(db, consultant, { projectId: w.P.id, invitationId: withdrawn.invitationId })).ok).toBe(true);
    expect((await revokeViewerAccess(db, consultant, { projectId: w.P.id, userId: acc.value.userId })).ok).toBe(true);
    const stub: CurrentResultResolver = async (_db, draft) => ({ engineVersion: "9.9.9", inputsHash: "h".repeat(64), input: draft.input, result: { marker: "audit" } });
    expect((await issueScenario(db, consultant, { projectId: w.P.id, scenarioId: w.P.scenarioId }, { resolveResult: stub })).ok).toBe(true);
    expect((await openIssuedVersion(db, await w.viewer("finance"), w.P.id, w.P.scenarioId, 1)).ok).toBe(true);
    expect((await addComment(db, await w.viewer("owner"), { projectId: w.P.id, versionId: w.P.versionId, body: "Noted." }, { appUrl: APP })).ok).toBe(true);

    for (const role of ["owner", "finance"] as const) {
      expect(await projectAuditTrail(db, await w.viewer(role), w.P.id)).toMatchObject({ ok: false, status: 403 });
    }
    expect(await projectAuditTrail(db, await w.viewer("consultantOther"), w.P.id)).toMatchObject({ ok: false, status: 404 });
    const r = await projectAuditTrail(db, await w.viewer("admin"), w.P.id);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const actions = new Set(r.value.map((e) => e.action));
    for (const a of ["invitation.create", "invitation.accept", "invitation.revoke", "access.revoke", "version.issue", "version.view", "comment.create"]) {
      expect(actions.has(a), a).toBe(true);
    }
    expect(r.value.find((e) => e.action === "version.view")?.actorName).toBe(`Finance ${w.tag}`);
  });
});

