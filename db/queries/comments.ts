import { sql } from "kysely";
import type { Executor } from "../schema";

/** Serialise one author's comment writes for the rest of the transaction (the rate limit counts, then inserts). */
export async function lockCommentAuthor(db: Executor, authorId: string): Promise<void> {
  await sql`select pg_advisory_xact_lock(hashtext(${"comment:" + authorId}))`.execute(db);
}

/** How many comments an author posted in the last `windowS` seconds (every project). */
export async function countRecentCommentsBy(db: Executor, authorId: string, windowS: number): Promise<number> {
  const row = await db
    .selectFrom("comments")
    .select((eb) => eb.fn.countAll<string>().as("n"))
    .where("author_id", "=", authorId)
    .where("created_at", ">", sql<Date>`now() - make_interval(secs => ${windowS})`)
    .executeTakeFirstOrThrow();
  return Number(row.n);
}


export async function insertComment(db: Executor, c: { versionId: string; projectId: string; authorId: string; body: string }) {
  return db
    .insertInto("comments")
    .values({ version_id: c.versionId, project_id: c.projectId, author_id: c.authorId, body: c.body })
    .returning(["id", "created_at as createdAt"])
    .executeTakeFirstOrThrow();
}

/** Comments on one version, oldest first, with the author's name and their relation at reading time. */
export async function listVersionComments(db: Executor, projectId: string, versionId: string) {
  return db
    .selectFrom("comments")
    .leftJoin("users", "users.id", "comments.author_id")
    .leftJoin("project_access", (j) =>
      j.onRef("project_access.project_id", "=", "comments.project_id").onRef("project_access.user_id", "=", "comments.author_id"),
    )
    .select([
      "comments.id",
      "comments.body",
      "comments.created_at as createdAt",
      "users.id as authorId",
      "users.name as authorName",
      "project_access.role as authorClientRole",
    ])
    .where("comments.project_id", "=", projectId)
    .where("comments.version_id", "=", versionId)
    .orderBy("comments.created_at")
    .orderBy("comments.id")
    .execute();
}

export async function countCommentsByVersion(db: Executor, projectId: string) {
  return db
    .selectFrom("comments")
    .select(["version_id as versionId", (eb) => eb.fn.countAll<number>().as("n")])
    .where("project_id", "=", projectId)
    .groupBy("version_id")
    .execute();
}
