// Applies pending database migrations: `npx tsx scripts/migrate.ts` (uses DATABASE_URL).
// `npx tsx scripts/migrate.ts down` reverts the latest one (development only).
import { createDb, databaseUrl } from "../db/index";
import { migrateToLatest, migratorFor } from "../db/migrator";

function redact(url: string): string {
  return url.replace(/\/\/([^:@/]+):[^@/]*@/, "//$1:***@");
}

async function main(): Promise<number> {
  const url = databaseUrl();
  const db = createDb(url, { max: 1 });
  try {
    if (process.argv[2] === "down") {
      const { error, results } = await migratorFor(db).migrateDown();
      for (const r of results ?? []) console.error(`migrate: ${r.direction} ${r.migrationName}: ${r.status}`);
      if (error) throw error;
      return 0;
    }
    const { results } = await migrateToLatest(db);
    const applied = (results ?? []).filter((r) => r.status === "Success");
    for (const r of applied) console.error(`migrate: applied ${r.migrationName}`);
    if (applied.length === 0) console.error(`migrate: ${redact(url)} is up to date`);
    return 0;
  } catch (error) {
    console.error(`migrate: ${redact(url)}: ${error instanceof Error ? error.message : String(error)}`);
    return 1;
  } finally {
    await db.destroy();
  }
}

process.exitCode = await main();
