import { type Kysely, sql } from "kysely";

// Frozen in time: never import application code here.
// Climate datasets, scenarios with optimistic concurrency, stored results keyed by engine version + inputs
// hash, issued versions (frozen inputs + results), comments, invitations and the mail outbox.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("climate_datasets")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("project_id", "uuid", (c) => c.notNull().references("projects.id").onDelete("cascade"))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("source_kind", "text", (c) => c.notNull().check(sql`source_kind in ('epw', 'csv', 'wetBulbBins', 'dryBulbBins')`))
    .addColumn("file_name", "text")
    .addColumn("provenance", "jsonb", (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn("record_count", "integer", (c) => c.notNull())
    .addColumn("missing_count", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("hours_total", "double precision", (c) => c.notNull())
    .addColumn("data", "jsonb", (c) => c.notNull())
    .addColumn("summary", "jsonb", (c) => c.notNull())
    .addColumn("created_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex("climate_datasets_project_idx").on("climate_datasets").column("project_id").execute();

  await db.schema
    .createTable("scenarios")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("project_id", "uuid", (c) => c.notNull().references("projects.id").onDelete("cascade"))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("climate_dataset_id", "uuid", (c) => c.references("climate_datasets.id").onDelete("set null"))
    .addColumn("input", "jsonb", (c) => c.notNull())
    .addColumn("input_version", "integer", (c) => c.notNull().defaultTo(1))
    .addColumn("revision", "integer", (c) => c.notNull().defaultTo(1))
    .addColumn("created_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("updated_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("archived_at", "timestamptz")
    .execute();
  await db.schema.createIndex("scenarios_project_idx").on("scenarios").column("project_id").execute();

  await db.schema
    .createTable("scenario_results")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("scenario_id", "uuid", (c) => c.notNull().references("scenarios.id").onDelete("cascade"))
    .addColumn("engine_version", "text", (c) => c.notNull())
    .addColumn("inputs_hash", "text", (c) => c.notNull())
    .addColumn("kind", "text", (c) => c.notNull().defaultTo("full").check(sql`kind in ('full', 'monteCarlo')`))
    .addColumn("status", "text", (c) => c.notNull().check(sql`status in ('queued', 'running', 'done', 'failed')`))
    .addColumn("progress", "double precision", (c) => c.notNull().defaultTo(0))
    .addColumn("result", "jsonb")
    .addColumn("error", "text")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("finished_at", "timestamptz")
    .addUniqueConstraint("scenario_results_key", ["scenario_id", "engine_version", "inputs_hash", "kind"])
    .execute();

  await db.schema
    .createTable("scenario_versions")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("scenario_id", "uuid", (c) => c.notNull().references("scenarios.id").onDelete("cascade"))
    .addColumn("project_id", "uuid", (c) => c.notNull().references("projects.id").onDelete("cascade"))
    .addColumn("version_number", "integer", (c) => c.notNull())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("note", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("input", "jsonb", (c) => c.notNull())
    .addColumn("input_version", "integer", (c) => c.notNull())
    .addColumn("result", "jsonb", (c) => c.notNull())
    .addColumn("engine_version", "text", (c) => c.notNull())
    .addColumn("inputs_hash", "text", (c) => c.notNull())
    .addColumn("scenario_revision", "integer", (c) => c.notNull())
    .addColumn("issued_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("issued_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint("scenario_versions_number_key", ["scenario_id", "version_number"])
    .execute();
  await db.schema.createIndex("scenario_versions_project_idx").on("scenario_versions").column("project_id").execute();

  await db.schema
    .createTable("comments")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("version_id", "uuid", (c) => c.notNull().references("scenario_versions.id").onDelete("cascade"))
    .addColumn("project_id", "uuid", (c) => c.notNull().references("projects.id").onDelete("cascade"))
    .addColumn("author_id", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("body", "text", (c) => c.notNull().check(sql`length(body) between 1 and 4000`))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex("comments_version_idx").on("comments").columns(["version_id", "created_at"]).execute();

  await db.schema
    .createTable("invitations")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("project_id", "uuid", (c) => c.notNull().references("projects.id").onDelete("cascade"))
    .addColumn("email", "text", (c) => c.notNull())
    .addColumn("role", "text", (c) => c.notNull().check(sql`role in ('owner', 'finance')`))
    .addColumn("token_hash", "text", (c) => c.notNull().unique())
    .addColumn("expires_at", "timestamptz", (c) => c.notNull())
    .addColumn("invited_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("accepted_at", "timestamptz")
    .addColumn("accepted_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("revoked_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex("invitations_project_idx").on("invitations").column("project_id").execute();

  await db.schema
    .createTable("mail_outbox")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("kind", "text", (c) => c.notNull())
    .addColumn("ref_id", "text")
    .addColumn("to_address", "text", (c) => c.notNull())
    .addColumn("subject", "text", (c) => c.notNull())
    .addColumn("text_body", "text", (c) => c.notNull())
    .addColumn("html_body", "text")
    .addColumn("status", "text", (c) => c.notNull().defaultTo("pending").check(sql`status in ('pending', 'sent', 'failed')`))
    .addColumn("attempts", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("last_error", "text")
    .addColumn("next_attempt_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("sent_at", "timestamptz")
    .execute();
  await db.schema.createIndex("mail_outbox_due_idx").on("mail_outbox").columns(["status", "next_attempt_at"]).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of ["mail_outbox", "invitations", "comments", "scenario_versions", "scenario_results", "scenarios", "climate_datasets"]) {
    await db.schema.dropTable(t).ifExists().execute();
  }
}
