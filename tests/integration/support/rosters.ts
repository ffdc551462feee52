// Roster helpers shared by the integration tests: weeks relative to today, and a roster published
// straight into the database the way publishDraft stores one.
import { sql, type Kysely } from "kysely";
import type { Database } from "@/db/schema";

/** The Monday on or after `days` days from today (UTC), as YYYY-MM-DD. */
export function mondayAhead(days: number, now: Date = new Date()): string {
  const day = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + days));
  while (day.getUTCDay() !== 1) day.setUTCDate(day.getUTCDate() + 1);
  return day.toISOString().slice(0, 10);
}

/**
 * Publishes a version of a week the way publishDraft does: roster and shifts in one transaction
 * (the shifts trigger accepts shifts of a published roster only from the publishing transaction).
 */
export async function publishRosterDirectly(
  db: Kysely<Database>,
  roster: { siteId: number; startsOn: string; version: number; supersedes?: number | null },
  shifts: { guardId: number; starts_at: Date; ends_at: Date }[],
): Promise<number> {
  return db.transaction().execute(async (trx) => {
    const { id } = await trx
      .insertInto("rosters")
      .values({
        site_id: roster.siteId,
        starts_on: roster.startsOn,
        days: 7,
        status: "published",
        version: roster.version,
        published_at: sql<Date>`now()`,
        supersedes: roster.supersedes ?? null,
        unfilled: "[]",
        violations: "[]",
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    for (const shift of shifts) {
      await trx
        .insertInto("shifts")
        .values({ roster_id: id, guard_id: shift.guardId, starts_at: shift.starts_at, ends_at: shift.ends_at, segments: "[]", breaks: "[]" })
        .execute();
    }
    return id;
  });
}

/**
 * Runs one queued job by its id, the way the worker would (claimed, handled, finished), so a test
 * runs exactly its own job even while other test files run theirs from the same queue.
 */
export async function runQueuedJob(
  db: Kysely<Database>,
  jobId: number,
  handler: (job: { id: number; payload: unknown; result: unknown }) => Promise<unknown>,
): Promise<unknown> {
  const job = await db
    .updateTable("jobs")
    .set({ status: "running", locked_at: sql<Date>`now()`, attempts: sql<number>`attempts + 1` })
    .where("id", "=", jobId)
    .where("status", "=", "queued")
    .returning(["id", "payload", "result"])
    .executeTakeFirst();
  if (!job) throw new Error(`job ${jobId} is not queued (another worker took it?)`);
  const result = await handler(job);
  await db
    .updateTable("jobs")
    .set({ status: "done", progress: 1, result: JSON.stringify(result ?? null), locked_at: null, finished_at: sql<Date>`now()` })
    .where("id", "=", jobId)
    .execute();
  return result;
}
