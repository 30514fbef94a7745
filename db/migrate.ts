import { promises as fs } from "node:fs";
import path from "node:path";
import { FileMigrationProvider, Migrator, type Kysely } from "kysely";

/** Run every pending migration in migrations/ with Kysely's Migrator; throws on failure. */
export async function migrateToLatest(db: Kysely<any>): Promise<string[]> {
  const migrator = new Migrator({
    db,
    provider: new FileMigrationProvider({ fs, path, migrationFolder: path.resolve(__dirname, "../migrations") }),
  });
  const { error, results } = await migrator.migrateToLatest();
  const applied = (results ?? []).filter((r) => r.status === "Success").map((r) => r.migrationName);
  const failed = (results ?? []).find((r) => r.status === "Error");
  if (error || failed) {
    throw new Error(`migration failed${failed ? ` at ${failed.migrationName}` : ""}: ${String(error)}`);
  }
  return applied;
}
