// Runs the migrations in db/migrations (files NNNN_name.ts, applied in name order by Kysely's
// Migrator). The files are found like Kysely's FileMigrationProvider does, but imported from here,
// so the same code runs under tsx, vitest and Next.js (a dynamic import inside node_modules could
// not load TypeScript under vitest).
import { promises as fs } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { Migrator, type Kysely, type Migration, type MigrationProvider, type MigrationResultSet } from "kysely";

export const MIGRATION_FOLDER = path.join(path.dirname(fileURLToPath(import.meta.url)), "migrations");

/** Every NNNN_name.ts file in the folder, keyed by its name without extension. */
export class MigrationFolderProvider implements MigrationProvider {
  constructor(private readonly folder: string = MIGRATION_FOLDER) {}

  async getMigrations(): Promise<Record<string, Migration>> {
    const migrations: Record<string, Migration> = {};
    const files = (await fs.readdir(this.folder))
      .filter((name) => /^\d{4}_[\w-]+\.(ts|js|mjs)$/.test(name) && !name.endsWith(".d.ts"))
      .sort();
    for (const file of files) {
      const loaded = (await import(pathToFileURL(path.join(this.folder, file)).href)) as Partial<Migration> & {
        default?: Partial<Migration>;
      };
      const migration = loaded.up ? loaded : loaded.default;
      if (!migration?.up) throw new Error(`migration ${file} exports no up() function`);
      migrations[file.replace(/\.(ts|js|mjs)$/, "")] = migration as Migration;
    }
    return migrations;
  }
}

export function migratorFor(db: Kysely<any>): Migrator {
  // Several engineers add migrations at once, so a database may have run 0004 before 0003 landed:
  // apply whatever is missing instead of refusing (each migration must stand on its own).
  return new Migrator({ db, provider: new MigrationFolderProvider(), allowUnorderedMigrations: true });
}

/** Applies every pending migration; throws with the failing migration's name and reason. */
export async function migrateToLatest(db: Kysely<any>): Promise<MigrationResultSet> {
  const resultSet = await migratorFor(db).migrateToLatest();
  if (resultSet.error) {
    const failed = resultSet.results?.find((result) => result.status === "Error");
    const reason = resultSet.error instanceof Error ? resultSet.error.message : String(resultSet.error);
    throw new Error(`migration ${failed?.migrationName ?? "(unknown)"} failed: ${reason}`);
  }
  return resultSet;
}
