import { type Kysely } from "kysely";

// Frozen in time: never import application code here.
// A project's fields get the same optimistic revision check as a scenario: an edit names the revision it
// started from, and a stale edit is refused instead of silently overwriting the newer one.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable("projects")
    .addColumn("revision", "integer", (c) => c.notNull().defaultTo(1))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable("projects").dropColumn("revision").execute();
}
