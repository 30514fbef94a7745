import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { createDb } from "@/db/client";
import { env } from "@/lib/env";
import { deliverDueMail } from "./outbox";
import { smtpTransport } from "./transport";

/**
 * The in-process mail sender: a pass right after something is queued, and a pass on a timer so that
 * messages that failed (mail server down) go out once it is back, also after a restart.
 * State lives on globalThis so that every module instance in the server process shares one sender.
 */
interface MailerState {
  running: Promise<void> | null;
  again: boolean;
  timer: ReturnType<typeof setInterval> | null;
  db: Kysely<Database> | null;
}

const g = globalThis as unknown as { loopledgerMailer?: MailerState };
const state: MailerState = (g.loopledgerMailer ??= { running: null, again: false, timer: null, db: null });

function workerDb(): Kysely<Database> {
  state.db ??= createDb(env().DATABASE_URL, 2);
  return state.db;
}

/** Deliver due mail now, in the background; calls while a pass runs fold into one more pass. */
export function kickMailer(): void {
  if (state.running) {
    state.again = true;
    return;
  }
  state.running = (async () => {
    try {
      do {
        state.again = false;
        await deliverDueMail(workerDb(), smtpTransport());
      } while (state.again);
    } catch (err) {
      console.error("[mail] delivery pass failed:", err instanceof Error ? err.message : err);
    } finally {
      state.running = null;
    }
  })();
}

/** Start the periodic pass once per process (instrumentation.ts calls it at server start). */
export function startMailWorker(intervalMs = 15_000): void {
  if (state.timer) return;
  state.timer = setInterval(kickMailer, intervalMs);
  state.timer.unref?.();
  kickMailer();
}

/** Resolves when the current pass (if any) is done. */
export async function mailerIdle(): Promise<void> {
  while (state.running) await state.running;
}
