import "server-only";
import { db } from "@/db";
import type { Executor } from "@/db/schema";
import { currentViewer } from "@/lib/auth/session";
import type { Viewer } from "@/lib/auth/access";
import { REFUSALS, type Refusal } from "@/lib/result";

/**
 * Call a data-access function (executor first, viewer second) as the request's signed-in viewer, with the
 * app's database. Pages, server actions and route handlers use this instead of importing `db` themselves.
 */
export async function perform<A extends unknown[], R>(
  fn: (db: Executor, viewer: Viewer | null, ...args: A) => Promise<R>,
  ...args: A
): Promise<R> {
  return fn(db, await currentViewer(), ...args);
}

/** 401 before anything else is read (a route reads its body only for a signed-in caller). */
export async function anonymousRefusal(): Promise<Refusal | null> {
  return (await currentViewer()) ? null : REFUSALS.anonymous;
}
