/**
 * The background queues (pg-boss, in PostgreSQL's `pgboss` schema) and their retry and expiry rules.
 * Workers (scripts/worker.ts) create or update every queue with these settings when they start, so a
 * change here takes effect with the next worker start. No framework imports: the worker runs outside Next.
 */

export const QUEUES = {
  /** The deterministic result of a saved scenario (physics, LCC, tornado, break-evens). */
  scenarioAnalysis: "scenario-analysis",
  /** The Monte Carlo of a saved scenario. */
  monteCarlo: "scenario-monte-carlo",
  /** A queued request of the analysis API (POST /api/v1/analyses answered 202). */
  apiAnalysis: "api-analysis",
  /** One e-mail of the outbox (invitations, comment notifications). */
  mail: "mail",
  /** Periodic cleanup of expired tokens, stale throttle rows and old API results. */
  cleanup: "cleanup",
  /** Jobs that failed every retry: the handler records the failure on the row the job was about. */
  deadLetter: "job-dead-letter",
} as const;

export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

/** Data of every job: which row it is about. Nothing else (no tokens, no bodies) sits in the queue. */
export type JobData =
  | { kind: "scenarioResult"; resultId: string }
  | { kind: "apiAnalysis"; analysisId: string }
  | { kind: "mail"; outboxId: string }
  | { kind: "cleanup" };

function envSeconds(name: string, fallback: number, min: number, max: number): number {
  const v = Number(process.env[name]);
  return Number.isFinite(v) && v >= min && v <= max ? v : fallback;
}

/** Hard time budget of one analysis in a worker (ANALYSIS_BUDGET_S, 5–600 s, default 120 s). */
export function analysisBudgetS(): number {
  return envSeconds("ANALYSIS_BUDGET_S", 120, 5, 600);
}

/**
 * An analysis job whose worker vanished (killed, machine lost) is retried once it has been active for
 * this long: the budget plus a quarter and 5 s, so a live worker is never overtaken by its own retry
 * (the engine stops itself at the budget).
 */
export function analysisExpireS(): number {
  return Math.ceil(analysisBudgetS() * 1.25) + 5;
}

/** How often a worker runs pg-boss maintenance (expiry of vanished jobs, archiving): WORKER_MAINTENANCE_S. */
export function maintenanceIntervalS(): number {
  return envSeconds("WORKER_MAINTENANCE_S", 30, 1, 600);
}

/** First retry of a failed e-mail after MAIL_RETRY_DELAY_S (default 30 s), doubling (with jitter) after that. */
export function mailRetryDelayS(): number {
  return envSeconds("MAIL_RETRY_DELAY_S", 30, 1, 3600);
}

/** Attempts of one e-mail before it is marked failed (the first try and nine retries). */
export const MAIL_ATTEMPTS = 10;

export interface QueueSettings {
  name: QueueName;
  policy: "standard" | "short" | "singleton" | "stately";
  retryLimit: number;
  retryDelay: number;
  retryBackoff: boolean;
  expireInSeconds: number;
  deadLetter?: QueueName;
}

/**
 * Analysis queues use the 'short' policy with the result row's id as singleton key: at most one waiting
 * job per row, so re-submitting a row (a worker start, a repeated page view) never piles up work, while a
 * job that is running or waiting for a retry does not block a new one. Retries cover a worker that died
 * or lost the database; an analysis that fails on its own (invalid input, over budget) records the failure
 * and is not retried. Whatever runs twice stores its result once (the handlers write only unfinished rows).
 */
export function queueSettings(): QueueSettings[] {
  const analysis = {
    policy: "short" as const,
    retryLimit: 2,
    retryDelay: 5,
    retryBackoff: true,
    expireInSeconds: analysisExpireS(),
    deadLetter: QUEUES.deadLetter,
  };
  return [
    { name: QUEUES.scenarioAnalysis, ...analysis },
    { name: QUEUES.monteCarlo, ...analysis },
    { name: QUEUES.apiAnalysis, ...analysis },
    {
      name: QUEUES.mail,
      policy: "standard",
      retryLimit: MAIL_ATTEMPTS - 1,
      retryDelay: mailRetryDelayS(),
      retryBackoff: true,
      expireInSeconds: 120,
      deadLetter: QUEUES.deadLetter,
    },
    { name: QUEUES.cleanup, policy: "singleton", retryLimit: 1, retryDelay: 60, retryBackoff: false, expireInSeconds: 300 },
    { name: QUEUES.deadLetter, policy: "standard", retryLimit: 5, retryDelay: 10, retryBackoff: true, expireInSeconds: 60 },
  ];
}

/** Every ten minutes (cron, UTC). */
export const CLEANUP_CRON = "*/10 * * * *";
