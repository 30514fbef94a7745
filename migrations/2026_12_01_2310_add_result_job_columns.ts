import { type Kysely, sql } from "kysely";

// Frozen in time: never import application code here.
// Long analyses (Monte Carlo) run as job rows in scenario_results: when a worker claimed the row, when it
// last reported progress (a 'running' row whose heartbeat is old is re-queued), and how often it was tried.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable("scenario_results")
    .addColumn("started_at", "timestamptz")
    .addColumn("heartbeat_at", "timestamptz")
    .addColumn("attempts", "integer", (c) => c.notNull().defaultTo(0))
    .execute();
  await sql`create index scenario_results_jobs_idx on scenario_results (status, created_at) where status in ('queued', 'running')`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists scenario_results_jobs_idx`.execute(db);
  await db.schema.alterTable("scenario_results").dropColumn("started_at").dropColumn("heartbeat_at").dropColumn("attempts").execute();
}
