// Failed sign-ins per key ("account:<e-mail>", "address:<client>"), counted in a sliding window and
// locked for a while past a limit (the rules are in lib/auth/throttle.ts).
import { sql, type Kysely } from "kysely";
import type { Database } from "../schema";

/** The latest lock among the keys that is still in force, or null. */
export async function activeSignInLock(db: Kysely<Database>, keys: string[]): Promise<Date | null> {
  if (keys.length === 0) return null;
  const row = await db
    .selectFrom("sign_in_throttle")
    .select(sql<Date | null>`max(locked_until)`.as("until"))
    .where("key", "in", keys)
    .where("locked_until", ">", sql<Date>`now()`)
    .executeTakeFirst();
  return row?.until ? new Date(row.until) : null;
}

/**
 * Counts one failure for `key` (a new window when the old one is over) and, at `limit` failures
 * within the window, locks the key for `lockSeconds` and starts counting afresh. One statement, so
 * concurrent failures are all counted.
 */
export async function recordSignInFailure(
  db: Kysely<Database>,
  key: string,
  rule: { limit: number; windowSeconds: number; lockSeconds: number },
): Promise<{ failures: number; lockedUntil: Date | null }> {
  const { rows } = await sql<{ failures: number; locked_until: Date | null }>`
    insert into sign_in_throttle as t (key, failures, window_started_at, locked_until)
    values (${key}, 1, now(), case when 1 >= ${rule.limit}::int then now() + make_interval(secs => ${rule.lockSeconds}::int) end)
    on conflict (key) do update set
      failures = case
        when t.window_started_at < now() - make_interval(secs => ${rule.windowSeconds}::int) then 1
        else t.failures + 1 end,
      window_started_at = case
        when t.window_started_at < now() - make_interval(secs => ${rule.windowSeconds}::int) then now()
        else t.window_started_at end,
      locked_until = case
        when (case when t.window_started_at < now() - make_interval(secs => ${rule.windowSeconds}::int) then 1 else t.failures + 1 end) >= ${rule.limit}::int
          then now() + make_interval(secs => ${rule.lockSeconds}::int)
        else t.locked_until end
    returning failures, locked_until
  `.execute(db);
  const row = rows[0];
  return { failures: Number(row.failures), lockedUntil: row.locked_until ? new Date(row.locked_until) : null };
}

/** A successful sign-in clears the account's count (never the address's). */
export async function clearSignInFailures(db: Kysely<Database>, key: string): Promise<void> {
  await db.deleteFrom("sign_in_throttle").where("key", "=", key).execute();
}
