import { z } from "zod";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import type { Viewer } from "./access";
import { hashPassword, passwordProblems, verifyPassword } from "./password";
import { SIGN_IN_LIMITS, clearSignInFailures, isSignInBlocked, recordSignInFailure, signInKeys } from "./rate-limit";
import { setPasswordHash } from "@/db/queries/users";
import { writeAudit } from "@/db/queries/audit";
import { failure, fieldErrorsOf, success, type Outcome } from "@/lib/sharing/outcome";

export const passwordChangeSchema = z
  .object({
    currentPassword: z.string().min(1, "Enter your current password.").max(200),
    newPassword: z.string().max(200, "Use at most 200 characters."),
    confirmPassword: z.string(),
  })
  .refine((v) => v.newPassword === v.confirmPassword, { path: ["confirmPassword"], message: "The two new passwords differ." })
  .refine((v) => v.newPassword !== v.currentPassword, { path: ["newPassword"], message: "Choose a password different from the current one." });

/**
 * Change the viewer's password. The current password is required and counts against the same per-account
 * limit as sign-in (a stolen session must not become a password-guessing oracle). The new
 * password_changed_at voids every session signed before it (lib/auth/session-rules.ts), this one included:
 * the caller signs in again with the new password.
 */
export async function changePassword(
  db: Kysely<Database>,
  viewer: Viewer | null,
  raw: unknown,
): Promise<Outcome<{ changedAt: Date }>> {
  if (!viewer) return failure(401, "Sign in first.");
  const parsed = passwordChangeSchema.safeParse(raw);
  const fieldErrors = parsed.success ? {} : fieldErrorsOf(parsed.error.issues);
  const next = typeof (raw as { newPassword?: unknown })?.newPassword === "string" ? (raw as { newPassword: string }).newPassword : "";
  const policy = passwordProblems(next, viewer.email);
  if (policy.length) fieldErrors.newPassword = [...(fieldErrors.newPassword ?? []), ...policy];
  if (!parsed.success || policy.length) return failure(400, "Check the highlighted fields.", fieldErrors);

  const key = signInKeys(viewer.email, "").account;
  if (await isSignInBlocked(db, [key])) {
    return failure(429, "Too many wrong passwords for this account. Wait 15 minutes and try again.");
  }
  const row = await db.selectFrom("users").select(["password_hash"]).where("id", "=", viewer.id).executeTakeFirst();
  if (!(await verifyPassword(parsed.data.currentPassword, row?.password_hash))) {
    await recordSignInFailure(db, key, SIGN_IN_LIMITS.account);
    return failure(400, "Check the highlighted fields.", { currentPassword: ["That is not your current password."] });
  }
  const hash = await hashPassword(parsed.data.newPassword);
  const changedAt = await db.transaction().execute(async (trx) => {
    await setPasswordHash(trx, viewer.id, hash);
    await writeAudit(trx, { actorId: viewer.id, action: "user.passwordChange" });
    const r = await trx.selectFrom("users").select("password_changed_at").where("id", "=", viewer.id).executeTakeFirstOrThrow();
    return r.password_changed_at;
  });
  await clearSignInFailures(db, key);
  return success({ changedAt });
}
