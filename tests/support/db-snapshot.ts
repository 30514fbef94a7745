import { sql, type Kysely } from "kysely";
import type { Database } from "@/db/schema";

/**
 * Row count and checksum (md5 over every row's md5, in order) of every table of the public schema; pg-boss
 * keeps its own schema; `except` leaves tables out. Two equal snapshots: nothing was written, deleted or changed in between.
 */
/**
 * The outbox counts by its messages, not their delivery state: a running worker keeps delivering (or
 * retrying) earlier tests' e-mails while a fuzz runs.
 */
export const MESSAGE_COLUMNS: Record<string, string[]> = {
  mail_outbox: ["id", "kind", "ref_id", "to_address", "subject", "text_body", "created_at"],
};

export async function dbSnapshot(
  db: Kysely<Database>,
  opts: { except?: string[]; columns?: Record<string, string[]> } = {},
): Promise<Record<string, string>> {
  const except = opts.except ?? [];
  const tables = await sql<{ table_name: string }>`select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by table_name`.execute(db);
  const out: Record<string, string> = {};
  for (const { table_name } of tables.rows) {
    if (except.includes(table_name)) continue;
    // `columns`: only these columns of a table count (e.g. the mail outbox's delivery attempts are the worker's).
    const cols = (opts.columns ?? MESSAGE_COLUMNS)[table_name];
    const row = cols ? sql`(${sql.join(cols.map((c) => sql.ref(`t.${c}`)))})::text` : sql`t::text`;
    const r = await sql<{ n: string; h: string | null }>`select count(*)::text as n, md5(string_agg(md5(${row}), '' order by md5(${row}))) as h from ${sql.table(table_name)} t`.execute(db);
    out[table_name] = `${r.rows[0]!.n}:${r.rows[0]!.h ?? "-"}`;
  }
  return out;
}

/** The tables whose snapshot differs. */
export function changedTables(before: Record<string, string>, after: Record<string, string>): string[] {
  return [...new Set([...Object.keys(before), ...Object.keys(after)])].filter((t) => before[t] !== after[t]);
}
