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

/**
 * A new Kysely handle on `url` (tests and scripts; the app uses `db`). Call destroy() when done.
 * `url` may be a function: it is then read when the first query runs, not now.
 */
export function createDb(url: string | (() => string) = databaseUrl, options: DbOptions = {}): Kysely<Database> {
  return new Kysely<Database>({
    dialect: new PostgresDialect({
      // A factory, so the pool (and any connection) only exists once a query runs.
      pool: async () =>
        new pg.Pool({
          connectionString: typeof url === "function" ? url() : url,
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

/**
 * The app's database handle. Building it opens nothing: the pool is made, from DATABASE_URL as it
 * is then, when the first query runs.
 */
export const db: Kysely<Database> = (globalForDb.sightwardDb ??= createDb(databaseUrl, { connectionTimeoutMillis: 3000 }));
