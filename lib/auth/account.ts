import { z } from "zod";
import { text } from "@/lib/validation/text";
import { inTransaction } from "@/db/transaction";
import { defineAction } from "@/lib/actions/define";
import { hashPassword, passwordProblems, verifyPassword } from "./password";
import { SIGN_IN_LIMITS, clearSignInFailures, isSignInBlocked, recordSignInFailure, signInKeys } from "./rate-limit";
import { findPasswordHash, passwordChangedAt, setPasswordHash } from "@/db/queries/users";
import { writeAudit } from "@/db/queries/audit";
import { fail, invalid, ok, type Result } from "@/lib/result";

/** The password form's rules, with the policy checked against the viewer's own address. */
export function passwordChangeSchema(email: string) {
  return z
    .object({
      currentPassword: text().min(1, "Enter your current password.").max(200),
      newPassword: text().max(200, "Use at most 200 characters."),
      confirmPassword: text().max(200),
    })
    .superRefine((v, ctx) => {
      for (const message of passwordProblems(v.newPassword, email)) ctx.addIssue({ code: "custom", path: ["newPassword"], message });
      if (v.newPassword !== v.confirmPassword) ctx.addIssue({ code: "custom", path: ["confirmPassword"], message: "The two new passwords differ." });
      if (v.newPassword === v.currentPassword) {
        ctx.addIssue({ code: "custom", path: ["newPassword"], message: "Choose a password different from the current one." });
      }
    });
}

/**
 * Change the viewer's password. Input: `{ currentPassword, newPassword, confirmPassword }`. The current
 * password is required and counts against the same per-account limit as sign-in (a stolen session must
 * not become a password-guessing oracle). The new password_changed_at voids every session signed before
 * it (lib/auth/session-rules.ts), this one included: the caller signs in again with the new password.
 */
export const changePassword = defineAction({
  gate: "signedIn",
  schema: ({ viewer }) => passwordChangeSchema(viewer.email),
  invalidMessage: "Check the highlighted fields.",
  run: async (db, { viewer }, input): Promise<Result<{ changedAt: Date; email: string }>> => {
    const key = signInKeys(viewer.email, "").account;
    if (await isSignInBlocked(db, [key])) {
      return fail(429, "Too many wrong passwords for this account. Wait 15 minutes and try again.");
    }
    if (!(await verifyPassword(input.currentPassword, await findPasswordHash(db, viewer.id)))) {
      await recordSignInFailure(db, key, SIGN_IN_LIMITS.account);
      return invalid({ currentPassword: ["That is not your current password."] }, "Check the highlighted fields.");
    }
    const hash = await hashPassword(input.newPassword);
    const changedAt = await inTransaction(db, async (trx) => {
      await setPasswordHash(trx, viewer.id, hash);
      await writeAudit(trx, { actorId: viewer.id, action: "user.passwordChange" });
      return passwordChangedAt(trx, viewer.id);
    });
    await clearSignInFailures(db, key);
    return ok({ changedAt, email: viewer.email });
  },
});
