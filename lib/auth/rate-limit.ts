import { sql, type Kysely } from "kysely";
import type { Database } from "@/db/schema";
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
export async function isSignInBlocked(db: Kysely<Database>, keys: string[]): Promise<boolean> {
  const row = await db
    .selectFrom("sign_in_attempts")
    .select("key")
    .where("key", "in", keys)
    .where("blocked_until", ">", sql<Date>`now()`)
    .executeTakeFirst();
  return Boolean(row);
}

/** Count one failure against a key; block it once the window's limit is reached. */
export async function recordSignInFailure(
  db: Kysely<Database>,
  key: string,
  limit: { maxFailures: number; windowS: number; blockS: number },
): Promise<void> {
  await sql`
    insert into sign_in_attempts (key, failures, window_start)
    values (${key}, 1, now())
    on conflict (key) do update set
      failures = case when sign_in_attempts.window_start < now() - make_interval(secs => ${limit.windowS})
                      then 1 else sign_in_attempts.failures + 1 end,
      window_start = case when sign_in_attempts.window_start < now() - make_interval(secs => ${limit.windowS})
                      then now() else sign_in_attempts.window_start end`.execute(db);
  await sql`
    update sign_in_attempts set blocked_until = now() + make_interval(secs => ${limit.blockS})
    where key = ${key} and failures >= ${limit.maxFailures}`.execute(db);
}

export async function clearSignInFailures(db: Kysely<Database>, key: string): Promise<void> {
  await db.deleteFrom("sign_in_attempts").where("key", "=", key).execute();
}
