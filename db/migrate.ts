import { promises as fs } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { Migrator, type Kysely, type Migration, type MigrationProvider } from "kysely";

const MIGRATIONS_DIR = path.resolve(__dirname, "../migrations");

/**
 * Reads migrations/*.ts. Our own provider rather than Kysely's FileMigrationProvider: its import() runs
 * outside the TypeScript loader that tsx and vitest install, and cannot load .ts files.
 */
class TsFileMigrationProvider implements MigrationProvider {
  async getMigrations(): Promise<Record<string, Migration>> {
    const files = (await fs.readdir(MIGRATIONS_DIR)).filter((f) => /^\d{4}_\d{2}_\d{2}_\d{4}_.+\.ts$/.test(f)).sort();
    const out: Record<string, Migration> = {};
    for (const f of files) {
      const mod = (await import(pathToFileURL(path.join(MIGRATIONS_DIR, f)).href)) as Partial<Migration> & { default?: Migration };
      const migration = typeof mod.up === "function" ? (mod as Migration) : mod.default;
      if (!migration) throw new Error(`migration ${f} exports no up()`);
      out[f.replace(/\.ts$/, "")] = migration;
    }
    return out;
  }
}

/** Run every pending migration with Kysely's Migrator; throws on failure. Returns the names applied. */
export async function migrateToLatest(db: Kysely<any>): Promise<string[]> {
  const migrator = new Migrator({ db, provider: new TsFileMigrationProvider() });
  const { error, results } = await migrator.migrateToLatest();
  const applied = (results ?? []).filter((r) => r.status === "Success").map((r) => r.migrationName);
  const failed = (results ?? []).find((r) => r.status === "Error");
  if (error || failed) {
    throw new Error(`migration failed${failed ? ` at ${failed.migrationName}` : ""}: ${String(error)}`);
  }
  return applied;
}
