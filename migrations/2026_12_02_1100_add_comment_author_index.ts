import { type Kysely } from "kysely";

// Frozen in time: never import application code here.
// Comments are rate-limited per author: the limit counts an author's recent comments.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.createIndex("comments_author_idx").on("comments").columns(["author_id", "created_at"]).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex("comments_author_idx").ifExists().execute();
}
