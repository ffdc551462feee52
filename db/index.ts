// The database handle. Nothing connects at import time (next build imports this module): the
// pool is created on the first query, from DATABASE_URL as it is then.
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import type { Database } from "./schema";

export type { Database } from "./schema";
export { toJson } from "./schema";

export const DEFAULT_DATABASE_URL = "postgres://sightward@127.0.0.1:5544/sightward";

/** The connection string the app and scripts use. */
export function databaseUrl(): string {
  return process.env.DATABASE_URL || DEFAULT_DATABASE_URL;
}

const NUMERIC_OID = 1700;
const DATE_OID = 1082;

// numeric -> number (amounts and hours here are small; float precision is plenty);
// date -> "YYYY-MM-DD" text (a JavaScript Date would move the day with the process time zone).
const typeParsers = {
  getTypeParser(oid: number, format?: "text" | "binary") {
    if (oid === NUMERIC_OID) return (value: string) => (value === null ? null : parseFloat(value));
    if (oid === DATE_OID) return (value: string) => value;
    return format === "binary"
      ? pg.types.getTypeParser(oid, "binary")
      : pg.types.getTypeParser(oid, "text");
  },
} as pg.CustomTypesConfig;

export interface DbOptions {
  /** Give up connecting after this many milliseconds (default 5000). */
  connectionTimeoutMillis?: number;
  /** Pool size (default 10). */
  max?: number;
}

/** A new Kysely handle on `url` (tests and scripts; the app uses `db`). Call destroy() when done. */
export function createDb(url: string = databaseUrl(), options: DbOptions = {}): Kysely<Database> {
  return new Kysely<Database>({
    dialect: new PostgresDialect({
      // A factory, so the pool (and any connection) only exists once a query runs.
      pool: async () =>
        new pg.Pool({
          connectionString: url,
          max: options.max ?? 10,
          connectionTimeoutMillis: options.connectionTimeoutMillis ?? 5000,
          idleTimeoutMillis: 30_000,
          types: typeParsers,
        }),
    }),
  });
}

// One handle per process, kept on globalThis so Next.js dev reloads do not pile up pools.
const globalForDb = globalThis as unknown as { sightwardDb?: Kysely<Database> };

function sharedDb(): Kysely<Database> {
  globalForDb.sightwardDb ??= createDb(databaseUrl(), { connectionTimeoutMillis: 3000 });
  return globalForDb.sightwardDb;
}

/**
 * The app's database handle. A proxy: the real Kysely instance is built on first use, so importing
 * this module reads no environment and opens nothing.
 */
export const db: Kysely<Database> = new Proxy({} as Kysely<Database>, {
  get(_target, property) {
    const real = sharedDb();
    const value = Reflect.get(real, property, real);
    return typeof value === "function" ? value.bind(real) : value;
  },
});
