/**
 * A worker: pg-boss polling every queue of lib/jobs/queues.ts and running its handler. Run it as its own
 * process (scripts/worker.ts; `npm start` starts one, more scale out on the same database). Heavy jobs
 * are CPU-bound and synchronous, so one worker process runs one at a time; the web process never runs
 * them. The integration tests start workers in-process or as child processes.
 */
import PgBoss from "pg-boss";
import type { Kysely } from "kysely";
import { liveJobSingletonKeys } from "@/db/queries/jobs";
import type { Database } from "@/db/schema";
import { openResultRows, type ResultKind } from "@/db/queries/results";
import { pendingMailIds } from "@/db/queries/outbox";
import type { MailTransport } from "@/lib/mail/transport";
import { BOSS_SCHEMA, ensureQueues, sendJob } from "./boss";
import { recordDeadJob, runApiAnalysisJob, runCleanup, runMailJob, runScenarioResultJob } from "./handlers";
import { CLEANUP_CRON, maintenanceIntervalS, QUEUES, type JobData, type QueueName } from "./queues";

export interface WorkerOptions {
  connectionString: string;
  db: Kysely<Database>;
  transport: MailTransport;
  log?: (line: string) => void;
  /** Seconds between polls of the analysis queues (a save waits for its result). */
  analysisPollS?: number;
  /** Work only on these queues (tests); all of them by default. */
  queues?: QueueName[];
  /** Re-submit open work at start (default true). */
  resubmit?: boolean;
}

export interface RunningWorker {
  boss: PgBoss;
  stop(): Promise<void>;
}

function dataOf<T extends JobData["kind"]>(
  job: PgBoss.Job<unknown>,
  kind: T,
): Extract<JobData, { kind: T }> | null {
  const d = job.data as Partial<JobData> | null;
  return d && d.kind === kind ? (d as Extract<JobData, { kind: T }>) : null;
}

/**
 * Re-submit what waits without a live job: result rows queued before this worker started (the old
 * in-process queue's rows, a job lost with its worker before it was retried) and pending e-mails. The
 * 'short' policy and the mail job ids keep this from creating repeats.
 */
export async function resubmitOpenWork(db: Kysely<Database>): Promise<{ results: number; mail: number }> {
  const liveKeys = await liveJobSingletonKeys(db, BOSS_SCHEMA);
  let results = 0;
  for (const row of await openResultRows(db)) {
    if (liveKeys.has(row.id)) continue;
    const queue = (row.kind as ResultKind) === "full" ? QUEUES.scenarioAnalysis : QUEUES.monteCarlo;
    if (await sendJob(db, queue, { kind: "scenarioResult", resultId: row.id }, { singletonKey: row.id }))
      results++;
  }
  let mail = 0;
  for (const id of await pendingMailIds(db)) {
    if (await sendJob(db, QUEUES.mail, { kind: "mail", outboxId: id }, { id })) mail++;
  }
  return { results, mail };
}

export async function startWorker(opts: WorkerOptions): Promise<RunningWorker> {
  const log = opts.log ?? ((line: string) => console.log(line));
  const boss = new PgBoss({
    connectionString: opts.connectionString,
    schema: BOSS_SCHEMA,
    max: 4,
    application_name: "loopledger-worker",
    migrate: true,
    supervise: true,
    schedule: true,
    maintenanceIntervalSeconds: maintenanceIntervalS(),
  });
  // A lost database is reported and retried by pg-boss's own loops; it must not end the process.
  boss.on("error", (err) =>
    log(`[worker] queue error: ${err instanceof Error ? err.message : JSON.stringify(err)}`),
  );
  await boss.start();
  await ensureQueues(boss);
  if (opts.resubmit ?? true) {
    const resubmitted = await resubmitOpenWork(opts.db);
    if (resubmitted.results || resubmitted.mail)
      log(`[worker] re-submitted ${resubmitted.results} analyses and ${resubmitted.mail} e-mails`);
  }
  const on = (q: QueueName) => !opts.queues || opts.queues.includes(q);

  const analysisOptions = { batchSize: 1, pollingIntervalSeconds: opts.analysisPollS ?? 0.5 };
  for (const queue of [QUEUES.scenarioAnalysis, QUEUES.monteCarlo].filter(on)) {
    await boss.work(queue, analysisOptions, async ([job]) => {
      const d = job && dataOf(job, "scenarioResult");
      if (!d) return { outcome: "ignored" };
      const t0 = performance.now();
      const outcome = await runScenarioResultJob(opts.db, d.resultId);
      log(`[worker] ${queue} ${d.resultId}: ${outcome} in ${Math.round(performance.now() - t0)} ms`);
      return { outcome };
    });
  }
  if (on(QUEUES.apiAnalysis))
    await boss.work(QUEUES.apiAnalysis, analysisOptions, async ([job]) => {
      const d = job && dataOf(job, "apiAnalysis");
      if (!d) return { outcome: "ignored" };
      const t0 = performance.now();
      const outcome = await runApiAnalysisJob(opts.db, d.analysisId);
      log(
        `[worker] ${QUEUES.apiAnalysis} ${d.analysisId}: ${outcome} in ${Math.round(performance.now() - t0)} ms`,
      );
      return { outcome };
    });
  if (on(QUEUES.mail)) {
    // Up to ten messages per fetch, each settled on its own: a failed one is handed back for a retry
    // (pg-boss completes the rest when the handler returns).
    await boss.work(
      QUEUES.mail,
      { batchSize: 10, pollingIntervalSeconds: 1, includeMetadata: true },
      async (jobs) => {
        for (const job of jobs) {
          const d = dataOf(job, "mail");
          if (!d) continue;
          try {
            const outcome = await runMailJob(opts.db, opts.transport, d.outboxId, {
              retryCount: job.retryCount,
              retryLimit: job.retryLimit,
              retryDelayS: job.retryDelay,
            });
            log(`[worker] mail ${d.outboxId}: ${outcome}`);
          } catch (err) {
            const message = err instanceof Error ? err.message : String(err);
            log(`[worker] mail ${d.outboxId}: retry later (${message})`);
            await boss.fail(QUEUES.mail, job.id, { message });
          }
        }
      },
    );
  }
  if (on(QUEUES.cleanup))
    await boss.work(QUEUES.cleanup, { batchSize: 1, pollingIntervalSeconds: 30 }, async () => {
      const report = await runCleanup(opts.db);
      log(`[worker] cleanup: ${JSON.stringify(report)}`);
      return report;
    });
  if (on(QUEUES.deadLetter))
    await boss.work(QUEUES.deadLetter, { batchSize: 1, pollingIntervalSeconds: 5 }, async ([job]) => {
      if (job) await recordDeadJob(opts.db, job.data);
      return { recorded: true };
    });
  if (on(QUEUES.cleanup)) await boss.schedule(QUEUES.cleanup, CLEANUP_CRON, { kind: "cleanup" });

  return {
    boss,
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}
