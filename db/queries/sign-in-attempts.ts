import { sql } from "kysely";
import type { Executor } from "../schema";

/** Sign-in throttling rows (lib/auth/rate-limit.ts decides the limits). */

/** Whether any of the keys is blocked now. */
export async function anySignInKeyBlocked(ex: Executor, keys: string[]): Promise<boolean> {
  const row = await ex
    .selectFrom("sign_in_attempts")
    .select("key")
    .where("key", "in", keys)
    .where("blocked_until", ">", sql<Date>`now()`)
    .executeTakeFirst();
  return Boolean(row);
}

/** Count one failure against a key in its window (a new window once the old one is over); block it at the limit. */
export async function addSignInFailure(ex: Executor, key: string, limit: { maxFailures: number; windowS: number; blockS: number }): Promise<void> {
  await sql`
    insert into sign_in_attempts (key, failures, window_start)
    values (${key}, 1, now())
    on conflict (key) do update set
      failures = case when sign_in_attempts.window_start < now() - make_interval(secs => ${limit.windowS})
                      then 1 else sign_in_attempts.failures + 1 end,
      window_start = case when sign_in_attempts.window_start < now() - make_interval(secs => ${limit.windowS})
                      then now() else sign_in_attempts.window_start end`.execute(ex);
  await sql`
    update sign_in_attempts set blocked_until = now() + make_interval(secs => ${limit.blockS})
    where key = ${key} and failures >= ${limit.maxFailures}`.execute(ex);
}

export async function deleteSignInAttempts(ex: Executor, key: string): Promise<void> {
  await ex.deleteFrom("sign_in_attempts").where("key", "=", key).execute();
}

/** Delete throttle rows whose window started over a day ago and whose block (if any) has passed. */
export async function deleteStaleSignInAttempts(ex: Executor): Promise<number> {
  const r = await ex
    .deleteFrom("sign_in_attempts")
    .where("window_start", "<", sql<Date>`now() - interval '1 day'`)
    .where((eb) => eb.or([eb("blocked_until", "is", null), eb("blocked_until", "<", sql<Date>`now()`)]))
    .executeTakeFirst();
  return Number(r.numDeletedRows);
}
