/**
 * When a signed session stops counting, decided on every request (pure; unit-tested).
 * The JWT's own `exp` already ends idle sessions; these rules add what a cookie cannot know by itself:
 * an absolute lifetime from the moment of sign-in, and "a password change signs out every older session".
 */
export interface SessionClaims {
  /** Milliseconds since the epoch when the user signed in with their password. */
  authAtMs?: number;
  /** The account's password_changed_at (ms) as it was at sign-in. */
  pwdAtMs?: number;
}

export function sessionIsCurrent(
  claims: SessionClaims,
  account: { passwordChangedAt: Date },
  maxAgeS: number,
  nowMs: number,
): boolean {
  const { authAtMs, pwdAtMs } = claims;
  // A session without the claims predates them; it is treated as expired rather than trusted.
  if (typeof authAtMs !== "number" || typeof pwdAtMs !== "number") return false;
  if (!Number.isFinite(authAtMs) || authAtMs > nowMs + 60_000) return false;
  if (nowMs - authAtMs > maxAgeS * 1000) return false;
  return account.passwordChangedAt.getTime() <= pwdAtMs;
}
