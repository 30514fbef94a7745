import type { Transaction } from "kysely";
import type { Database, Executor } from "./schema";

/** Run `fn` in a transaction: a new one on the app's instance, or the caller's when it already is one. */
export async function inTransaction<T>(
  db: Executor,
  fn: (trx: Transaction<Database>) => Promise<T>,
): Promise<T> {
  if (db.isTransaction) return fn(db as Transaction<Database>);
  return db.transaction().execute(fn);
}
