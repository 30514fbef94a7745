import { z } from "zod";
import { text } from "@/lib/validation/text";
import type { Transaction } from "kysely";
import type { Database, Executor } from "@/db/schema";
import { inTransaction } from "@/db/transaction";
import { defineAction, rawField } from "@/lib/actions/define";
import type { Viewer } from "@/lib/auth/access";
import type { ProjectRole } from "@/lib/auth/roles";
import { hashPassword, passwordProblems } from "@/lib/auth/password";
import { writeAudit } from "@/db/queries/audit";
import { consumeInvitation, findInvitationByTokenHash } from "@/db/queries/invitations";
import { grantProjectAccess } from "@/db/queries/projects";
import { createUser, findUserByEmail } from "@/db/queries/users";
import { fail, ok, REFUSALS, type Failure, type Result } from "@/lib/result";
import { invitationState } from "./invitations";
import { hashInvitationToken, isWellFormedToken } from "./tokens";

/** What the invitation page may show about a link: enough for the person holding it, nothing else. */
export type InvitationLink =
  | {
      state: "open";
      email: string;
      role: ProjectRole;
      projectName: string;
      firmName: string;
      inviterName: string | null;
      expiresAt: Date;
      accountExists: boolean;
    }
  | { state: "unknown" | "accepted" | "revoked" | "expired"; message: string };

function expiredMessage(expiresAt: Date): string {
  return `This invitation expired on ${expiresAt.toISOString().slice(0, 10)}. Invitation links work for 7 days; ask the consultant who invited you to send a new one.`;
}

export const LINK_MESSAGES = {
  unknown: "This invitation link is not valid. Check that the whole link from the e-mail was opened, or ask the consultant for a new invitation.",
  accepted: "This invitation has already been used: each link works once. Sign in with the account that accepted it, or ask the consultant for a new invitation.",
  revoked: "This invitation was withdrawn by the consulting firm. Ask the consultant if you still need access.",
} as const;

async function lookUp(db: Executor, token: string) {
  if (!isWellFormedToken(token)) return undefined;
  return findInvitationByTokenHash(db, hashInvitationToken(token));
}

function closedLink(state: "unknown" | "accepted" | "revoked" | "expired", expiresAt?: Date): InvitationLink {
  return { state, message: state === "expired" ? expiredMessage(expiresAt!) : LINK_MESSAGES[state] };
}

/** Read a link without spending it. */
export async function inspectInvitation(db: Executor, _viewer: Viewer | null, token: string, now = new Date()): Promise<InvitationLink> {
  const inv = await lookUp(db, token);
  if (!inv) return closedLink("unknown");
  const state = invitationState(inv, now);
  if (state !== "pending") return closedLink(state, inv.expiresAt);
  const account = await findUserByEmail(db, inv.email);
  return {
    state: "open",
    email: inv.email,
    role: inv.role,
    projectName: inv.projectName,
    firmName: inv.firmName,
    inviterName: inv.inviterName,
    expiresAt: inv.expiresAt,
    accountExists: Boolean(account),
  };
}

function linkFailure(link: InvitationLink): Failure {
  return fail(link.state === "unknown" ? 404 : 410, link.state === "open" ? "This invitation cannot be used." : link.message);
}

/** The new-account form's rules, with the password policy checked against the invited address. */
export function newAccountSchema(email: string) {
  return z
    .object({
      name: text().trim().min(1, "Enter your name.").max(120, "Use at most 120 characters."),
      password: text().max(200, "Use at most 200 characters."),
      confirmPassword: text().max(200),
    })
    .superRefine((v, ctx) => {
      for (const message of passwordProblems(v.password, email)) ctx.addIssue({ code: "custom", path: ["password"], message });
      if (v.password !== v.confirmPassword) ctx.addIssue({ code: "custom", path: ["confirmPassword"], message: "The two passwords differ." });
    });
}

/**
 * The gate of both acceptance paths: the input's `token` names an open invitation (the link is the
 * credential); accepting with an existing account needs its session first.
 */
const openLink = (signedIn: boolean) => ({
  custom: async (db: Executor, viewer: Viewer | null, raw: unknown): Promise<Result<{ token: string; link: Extract<InvitationLink, { state: "open" }> }>> => {
    if (signedIn && !viewer) return REFUSALS.anonymous;
    const token = rawField(raw, "token");
    const link = await inspectInvitation(db, null, token);
    if (link.state !== "open") return linkFailure(link);
    return ok({ token, link });
  },
});

/** Raised inside the transaction to roll it back when the link was spent in between. */
class LinkSpent extends Error {}

type OpenInvitation = NonNullable<Awaited<ReturnType<typeof lookUp>>>;

/**
 * Inside the acceptance transaction: spend the link for `userId`, grant exactly the invited role on its
 * project and audit it. Throws LinkSpent (rolling everything back) when the link was spent in between.
 */
async function spendAndGrant(
  trx: Transaction<Database>,
  inv: OpenInvitation,
  userId: string,
  newAccount: boolean,
): Promise<{ projectId: string; role: ProjectRole }> {
  const spent = await consumeInvitation(trx, inv.id, userId);
  if (!spent) throw new LinkSpent();
  await grantProjectAccess(trx, { projectId: spent.projectId, userId, role: spent.role, grantedBy: inv.invitedBy });
  await writeAudit(trx, {
    actorId: userId,
    firmId: inv.firmId,
    projectId: spent.projectId,
    action: "invitation.accept",
    targetType: "invitation",
    targetId: inv.id,
    detail: { email: inv.email, role: spent.role, newAccount },
  });
  return { projectId: spent.projectId, role: spent.role };
}

/**
 * A person without an account accepts. Input: `{ token, name, password, confirmPassword }`. The account
 * (for the invited address only), the grant of exactly the invited role on that project and the spent link
 * are one transaction.
 */
export const acceptAsNewAccount = defineAction({
  gate: openLink(false),
  schema: ({ link }) => newAccountSchema(link.email),
  invalidMessage: "Check the highlighted fields.",
  run: async (db, { token, link }, input): Promise<Result<{ projectId: string; email: string; userId: string }>> => {
    if (link.accountExists) return fail(409, `An account already exists for ${link.email}. Sign in with it to accept the invitation.`);
    const passwordHash = await hashPassword(input.password);
    const inv = (await lookUp(db, token))!;
    try {
      return await inTransaction(db, async (trx) => {
        const user = await createUser(trx, { email: inv.email, name: input.name, passwordHash });
        const { projectId } = await spendAndGrant(trx, inv, user.id, true);
        return ok({ projectId, email: user.email, userId: user.id });
      });
    } catch (err) {
      if (err instanceof LinkSpent) return linkFailure(await inspectInvitation(db, null, token));
      if (/unique|duplicate/i.test(String((err as Error)?.message))) {
        return fail(409, `An account already exists for ${inv.email}. Sign in with it to accept the invitation.`);
      }
      throw err;
    }
  },
});

/** A signed-in person accepts with their existing account, which must be the invited address. Input: `{ token }`. */
export const acceptAsViewer = defineAction({
  gate: openLink(true),
  schema: z.object({}),
  run: async (db, { viewer, token, link }): Promise<Result<{ projectId: string; role: ProjectRole }>> => {
    if (!viewer) return REFUSALS.anonymous;
    if (link.email.toLowerCase() !== viewer.email.toLowerCase()) {
      return fail(403, `This invitation is for ${link.email}, and you are signed in as ${viewer.email}. Sign out and sign in as ${link.email}.`);
    }
    const inv = (await lookUp(db, token))!;
    try {
      return await inTransaction(db, async (trx) => ok(await spendAndGrant(trx, inv, viewer.id, false)));
    } catch (err) {
      if (err instanceof LinkSpent) return linkFailure(await inspectInvitation(db, null, token));
      throw err;
    }
  },
});
