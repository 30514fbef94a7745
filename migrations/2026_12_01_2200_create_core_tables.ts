import { type Kysely, sql } from "kysely";

// Frozen in time: never import application code here. Role lists mirror lib/auth/roles.ts.
export async function up(db: Kysely<any>): Promise<void> {

  await db.schema
    .createTable("users")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("email", "text", (c) => c.notNull())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("password_hash", "text")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("password_changed_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await sql`create unique index users_email_lower_key on users (lower(email))`.execute(db);

  await db.schema
    .createTable("firms")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable("firm_members")
    .addColumn("firm_id", "uuid", (c) => c.notNull().references("firms.id").onDelete("cascade"))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("role", "text", (c) => c.notNull().check(sql`role in ('admin', 'consultant')`))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("firm_members_pkey", ["firm_id", "user_id"])
    .execute();

  await db.schema
    .createTable("projects")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("firm_id", "uuid", (c) => c.notNull().references("firms.id").onDelete("cascade"))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("client_name", "text", (c) => c.notNull())
    .addColumn("site_name", "text", (c) => c.notNull())
    .addColumn("location_label", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("elevation_m", "double precision", (c) => c.notNull().defaultTo(0))
    .addColumn("unit_system", "text", (c) => c.notNull().defaultTo("SI").check(sql`unit_system in ('SI', 'IP')`))
    .addColumn("currency", "text", (c) => c.notNull().defaultTo("USD").check(sql`currency ~ '^[A-Z]{3}$'`))
    .addColumn("created_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex("projects_firm_idx").on("projects").column("firm_id").execute();

  await db.schema
    .createTable("project_access")
    .addColumn("project_id", "uuid", (c) => c.notNull().references("projects.id").onDelete("cascade"))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("role", "text", (c) => c.notNull().check(sql`role in ('owner', 'finance')`))
    .addColumn("granted_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("project_access_pkey", ["project_id", "user_id"])
    .execute();
  await db.schema.createIndex("project_access_user_idx").on("project_access").column("user_id").execute();

  await db.schema
    .createTable("audit_events")
    .addColumn("id", "bigserial", (c) => c.primaryKey())
    .addColumn("at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("actor_id", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("firm_id", "uuid", (c) => c.references("firms.id").onDelete("cascade"))
    .addColumn("project_id", "uuid", (c) => c.references("projects.id").onDelete("cascade"))
    .addColumn("action", "text", (c) => c.notNull())
    .addColumn("target_type", "text")
    .addColumn("target_id", "text")
    .addColumn("detail", "jsonb", (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .execute();
  await db.schema.createIndex("audit_events_project_idx").on("audit_events").columns(["project_id", "at"]).execute();

  await db.schema
    .createTable("sign_in_attempts")
    .addColumn("key", "text", (c) => c.primaryKey())
    .addColumn("failures", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("window_start", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("blocked_until", "timestamptz")
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of ["sign_in_attempts", "audit_events", "project_access", "projects", "firm_members", "firms", "users"]) {
    await db.schema.dropTable(t).ifExists().execute();
  }
}
