import type { Executor } from "@/db/schema";
import { addSignInFailure, anySignInKeyBlocked, deleteSignInAttempts } from "@/db/queries/sign-in-attempts";
import { clientAddress as addressOf } from "@/lib/http/client-address";

/** Sign-in throttling, stored in PostgreSQL so every app server sees the same counts. */
export const SIGN_IN_LIMITS = {
  account: { maxFailures: 5, windowS: 15 * 60, blockS: 15 * 60 },
  address: { maxFailures: 20, windowS: 15 * 60, blockS: 15 * 60 },
} as const;

/**
 * The address a sign-in attempt came from: the connection's peer, or the forwarded client when the peer is
 * a proxy named in TRUSTED_PROXIES (lib/http/client-address.ts). A client's own X-Forwarded-For counts
 * for nothing otherwise, so inventing header values does not step around the limit.
 */
export function clientAddress(headers: Record<string, unknown> | undefined): string {
  return addressOf((name) => {
    const v = headers?.[name];
    return typeof v === "string" ? v : Array.isArray(v) ? v.join(",") : undefined;
  });
}

export function signInKeys(email: string, address: string): { account: string; address: string } {
  return { account: `acct:${email.trim().toLowerCase()}`, address: `addr:${address || "unknown"}` };
}

/** True when either key is currently blocked. */
export function isSignInBlocked(db: Executor, keys: string[]): Promise<boolean> {
  return anySignInKeyBlocked(db, keys);
}

/** Count one failure against a key; block it once the window's limit is reached. */
export function recordSignInFailure(db: Executor, key: string, limit: { maxFailures: number; windowS: number; blockS: number }): Promise<void> {
  return addSignInFailure(db, key, limit);
}

export function clearSignInFailures(db: Executor, key: string): Promise<void> {
  return deleteSignInAttempts(db, key);
}
