import { type Kysely, sql } from "kysely";

// Frozen in time: never import application code here.
// Background work moves to pg-boss (its own `pgboss` schema, installed by scripts/migrate.ts and by every
// worker at start). What stays in our tables is the record of the work, not the queue:
//  - scenario_results keeps status/progress/result; the hand-written claim columns (heartbeat_at,
//    attempts) and their index go. A 'running' row belonged to the old in-process worker and
//    is queued again (the worker re-submits every queued row at start). New: who asked (per-user limits)
//    and how many Monte Carlo draws the row stands for.
//  - mail_outbox keeps each message and its delivery state (shown on the access page); its claim index
//    goes, next_attempt_at becomes the earliest next try the queue will make (information only).
//  - api_analyses: the analysis API's queued requests (input, state, result), polled by their owner.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists scenario_results_jobs_idx`.execute(db);
  await sql`update scenario_results set status = 'queued' where status = 'running'`.execute(db);
  await db.schema
    .alterTable("scenario_results")
    .dropColumn("heartbeat_at")
    .dropColumn("attempts")
    .addColumn("requested_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("draws", "integer", (c) => c.notNull().defaultTo(0))
    .execute();
  await sql`create index scenario_results_open_idx on scenario_results (requested_by) where status in ('queued', 'running')`.execute(db);

  await sql`drop index if exists mail_outbox_due_idx`.execute(db);
  await sql`create index mail_outbox_pending_idx on mail_outbox (created_at) where status = 'pending'`.execute(db);

  await db.schema
    .createTable("api_analyses")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("status", "text", (c) => c.notNull().defaultTo("queued").check(sql`status in ('queued', 'running', 'done', 'failed')`))
    .addColumn("draws", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("inputs_hash", "text", (c) => c.notNull())
    .addColumn("input", "jsonb")
    .addColumn("result", "jsonb")
    .addColumn("error", "text")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("started_at", "timestamptz")
    .addColumn("finished_at", "timestamptz")
    .execute();
  await sql`create index api_analyses_open_idx on api_analyses (user_id) where status in ('queued', 'running')`.execute(db);
  await db.schema.createIndex("api_analyses_created_idx").on("api_analyses").column("created_at").execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("api_analyses").ifExists().execute();
  await sql`drop index if exists mail_outbox_pending_idx`.execute(db);
  await db.schema.createIndex("mail_outbox_due_idx").on("mail_outbox").columns(["status", "next_attempt_at"]).execute();
  await sql`drop index if exists scenario_results_open_idx`.execute(db);
  await db.schema
    .alterTable("scenario_results")
    .dropColumn("requested_by")
    .dropColumn("draws")
    .addColumn("heartbeat_at", "timestamptz")
    .addColumn("attempts", "integer", (c) => c.notNull().defaultTo(0))
    .execute();
  await sql`create index scenario_results_jobs_idx on scenario_results (status, created_at) where status in ('queued', 'running')`.execute(db);
}
