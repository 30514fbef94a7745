import { sql } from "kysely";
import type { Executor } from "../schema";

/**
 * Take the user's job lock for the rest of the transaction (call it inside one) and count the analyses
 * the user has waiting or running, with the Monte Carlo draws they stand for.
 */
export async function lockAndCountOpenWorkOfUser(trx: Executor, userId: string): Promise<{ jobs: number; draws: number }> {
  await sql`select pg_advisory_xact_lock(hashtext(${"loopledger-jobs:" + userId}))`.execute(trx);
  const r = await sql<{ jobs: number; draws: number }>`
    select count(*)::int as jobs, coalesce(sum(draws), 0)::int as draws from (
      select draws from scenario_results where requested_by = ${userId} and status in ('queued', 'running')
      union all
      select draws from api_analyses where user_id = ${userId} and status in ('queued', 'running')
    ) open_work`.execute(trx);
  return r.rows[0] ?? { jobs: 0, draws: 0 };
}

/** Singleton keys of the queue's jobs that are not finished yet (pg-boss keeps them in `schema`.job). */
export async function liveJobSingletonKeys(ex: Executor, schema: string): Promise<Set<string>> {
  const r = await sql<{ key: string }>`
    select singleton_key as key from ${sql.raw(schema)}.job where state < 'completed' and singleton_key is not null`.execute(ex);
  return new Set(r.rows.map((row) => row.key));
}
