// Integration tests run against the real PostgreSQL that npm test starts (DATABASE_URL). Without
// it they fail with a message saying how to run them; they never skip and never mock.
import { randomBytes } from "node:crypto";
import { sql, type Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";

export function requireDatabaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) {
    throw new Error(
      "DATABASE_URL is not set. Integration tests need the real PostgreSQL: run `npm test`, or start it with " +
        "`npm start` and export DATABASE_URL=postgres://sightward@127.0.0.1:5544/sightward",
    );
  }
  return url;
}

/** The same server as DATABASE_URL, another database. */
export function urlForDatabase(url: string, database: string): string {
  const parsed = new URL(url);
  parsed.pathname = `/${database}`;
  return parsed.toString();
}

/**
 * Creates an empty database next to DATABASE_URL's, hands a Kysely handle on it to `use`, and
 * drops it afterwards, whatever happens.
 */
export async function withScratchDatabase<T>(
  label: string,
  use: (db: Kysely<Database>, url: string) => Promise<T>,
): Promise<T> {
  const url = requireDatabaseUrl();
  const name = `sightward_scratch_${label}_${process.pid}_${randomBytes(3).toString("hex")}`;
  const admin = createDb(url, { max: 1 });
  await sql`create database ${sql.id(name)}`.execute(admin);
  const scratchUrl = urlForDatabase(url, name);
  const scratch = createDb(scratchUrl, { max: 4 });
  try {
    return await use(scratch, scratchUrl);
  } finally {
    await scratch.destroy();
    // The pool's sessions end a moment after destroy(); wait for them so `with (force)` never
    // has to cut one off (a cut-off session raises an error in the closing client).
    for (let waited = 0; waited < 5000; waited += 50) {
      const { rows } = await sql<{ n: string }>`select count(*) as n from pg_stat_activity where datname = ${name}`.execute(admin);
      if (Number(rows[0].n) === 0) break;
      await new Promise((resolve) => setTimeout(resolve, 50));
    }
    await sql`drop database if exists ${sql.id(name)} with (force)`.execute(admin);
    await admin.destroy();
  }
}
