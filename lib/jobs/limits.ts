/**
 * Per-user limits on background work: how many analyses one person may have waiting or running at once,
 * and how many Monte Carlo draws those stand for. Checked in the transaction that queues the work, under
 * a per-user advisory lock, so two requests at the same moment cannot both slip under the limit.
 */
import type { Transaction } from "kysely";
import { lockAndCountOpenWorkOfUser } from "@/db/queries/jobs";
import type { Database } from "@/db/schema";

export const JOB_LIMITS = {
  /** Analyses (saved-scenario runs and API requests) waiting or running per user. */
  openJobsPerUser: 6,
  /** Monte Carlo draws waiting or running per user (a single run may have up to 200,000). */
  openDrawsPerUser: 400_000,
} as const;

export interface OpenWork {
  jobs: number;
  draws: number;
}

/** Take the user's job lock for the rest of the transaction and count what is open. */
export function lockAndCountOpenWork(trx: Transaction<Database>, userId: string): Promise<OpenWork> {
  return lockAndCountOpenWorkOfUser(trx, userId);
}

export type LimitCheck = { ok: true } | { ok: false; message: string };

/** Whether one more job of `draws` Monte Carlo draws fits under the user's limits. */
export function fitsLimits(open: OpenWork, draws: number): LimitCheck {
  if (open.jobs + 1 > JOB_LIMITS.openJobsPerUser) {
    return {
      ok: false,
      message: `You already have ${open.jobs} analyses waiting or running (at most ${JOB_LIMITS.openJobsPerUser} at once); try again when one has finished.`,
    };
  }
  if (draws > 0 && open.draws + draws > JOB_LIMITS.openDrawsPerUser) {
    return {
      ok: false,
      message: `Your waiting and running analyses already use ${open.draws.toLocaleString("en-US")} Monte Carlo draws; with ${draws.toLocaleString("en-US")} more you would pass the ${JOB_LIMITS.openDrawsPerUser.toLocaleString("en-US")} allowed at once. Try again when one has finished, or use fewer draws.`,
    };
  }
  return { ok: true };
}
