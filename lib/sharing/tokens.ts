import { createHash, randomBytes } from "node:crypto";

/** How long an invitation link stays usable. */
export const INVITATION_TTL_DAYS = 7;

/**
 * A fresh invitation token: 32 random bytes (256 bits) written base64url, and its SHA-256 (hex), which is
 * all the database keeps. The token itself travels only in the e-mail.
 */
export function newInvitationToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashInvitationToken(token) };
}

export function hashInvitationToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

/** 32 bytes in base64url are 43 characters; anything else is not one of ours and is not looked up. */
export function isWellFormedToken(token: unknown): token is string {
  return typeof token === "string" && /^[A-Za-z0-9_-]{43}$/.test(token);
}

export function invitationUrl(appUrl: string, token: string): string {
  return `${appUrl.replace(/\/+$/, "")}/invite/${token}`;
}

export function invitationExpiry(now: Date, ttlDays = INVITATION_TTL_DAYS): Date {
  return new Date(now.getTime() + ttlDays * 24 * 60 * 60 * 1000);
}
