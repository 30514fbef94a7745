/**
 * pg-boss glue shared by the web process (sending jobs) and the workers (running them).
 * Jobs are sent through the caller's Kysely executor, so a job is created in the same transaction as
 * the row it is about: both commit or neither does (a saved scenario always has its queued analysis, an
 * invitation its e-mail).
 */
import PgBoss from "pg-boss";
import { CompiledQuery } from "kysely";
import type { Executor } from "@/db/schema";
import { queueSettings, type JobData, type QueueName } from "./queues";

/** The pg-boss schema name (its tables live apart from ours). */
export const BOSS_SCHEMA = "pgboss";

/** pg-boss's database interface over a Kysely executor (a transaction, or the pool). */
export function bossDb(executor: Executor): PgBoss.Db {
  return {
    async executeSql(text: string, values: unknown[] = []) {
      const r = await executor.executeQuery(CompiledQuery.raw(text, values));
      return { rows: r.rows as unknown[] };
    },
  };
}

const g = globalThis as unknown as { loopledgerBossSender?: PgBoss };

/**
 * A pg-boss instance used only to build and send jobs: never started (no polling, no maintenance, no
 * pool of its own); every send names the executor it runs on.
 */
function sender(): PgBoss {
  g.loopledgerBossSender ??= new PgBoss({
    schema: BOSS_SCHEMA,
    db: {
      executeSql() {
        throw new Error("pg-boss sender: pass the executor to sendJob");
      },
    },
  });
  return g.loopledgerBossSender;
}

export interface SendOptions {
  /** A fixed job id (the mail queue uses the outbox row's id: one job per message, ever). */
  id?: string;
  /** With the 'short' policy, at most one waiting job per key. */
  singletonKey?: string;
  startAfterS?: number;
}

/** Queue a job on `executor` (pass the transaction that writes the row the job is about). */
export async function sendJob(executor: Executor, queue: QueueName, data: JobData, opts: SendOptions = {}): Promise<string | null> {
  return sender().send(queue, data, {
    db: bossDb(executor),
    ...(opts.id ? { id: opts.id } : {}),
    ...(opts.singletonKey ? { singletonKey: opts.singletonKey } : {}),
    ...(opts.startAfterS ? { startAfter: opts.startAfterS } : {}),
  });
}

/** Create every queue that is missing and bring existing ones to the current settings. */
export async function ensureQueues(boss: PgBoss): Promise<void> {
  const settings = queueSettings();
  // Dead-letter targets first: a queue may only name an existing one.
  const ordered = [...settings].sort((a, b) => Number(Boolean(a.deadLetter)) - Number(Boolean(b.deadLetter)));
  for (const q of ordered) {
    const { name, ...options } = q;
    if (await boss.getQueue(name)) await boss.updateQueue(name, { name, ...options });
    else await boss.createQueue(name, { name, ...options });
  }
}

/**
 * Install or upgrade pg-boss's schema and the queues (scripts/migrate.ts; every worker does it again at
 * start). Opens and closes its own single connection.
 */
export async function installJobQueue(connectionString: string): Promise<void> {
  const boss = new PgBoss({ connectionString, schema: BOSS_SCHEMA, max: 1, supervise: false, schedule: false, migrate: true });
  boss.on("error", (err) => console.error("[queue] install:", err instanceof Error ? err.message : err));
  await boss.start();
  try {
    await ensureQueues(boss);
  } finally {
    await boss.stop({ graceful: false, wait: true });
  }
}
