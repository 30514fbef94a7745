import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import type { Database } from "./schema";
import { markDatabaseSuspect } from "../lib/health/probe";

// numeric → number (money columns are numeric(14, 2)); bigint counts → number.
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));

/** Create a Kysely instance for a connection string (scripts and tests; the app uses db/index.ts). */
export function createDb(connectionString: string, max = 10): Kysely<Database> {
  const pool = new pg.Pool({ connectionString, max });
  // A connection cut while idle (the server stopped or restarted) is reported here; without a listener it
  // would end the process. The next query opens a new connection, and the proxy's probe looks again at once.
  pool.on("error", () => markDatabaseSuspect());
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
}
