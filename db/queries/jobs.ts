// Background jobs kept in PostgreSQL: a job row outlives any process, so a restart loses nothing.
// Every function takes the handle to use (the app's `db`, a transaction, or a test's own handle).
import { sql, type Kysely, type Transaction } from "kysely";
import type { Database, Job } from "../schema";
import { toJson } from "../schema";

type Handle = Kysely<Database> | Transaction<Database>;

export interface NewJob {
  kind: string;
  payload: unknown;
  createdBy?: number | null;
}

/** Queues a job; inside a transaction it only becomes visible to workers when that commits. */
export async function enqueueJob(handle: Handle, job: NewJob): Promise<Job> {
  return handle
    .insertInto("jobs")
    .values({ kind: job.kind, payload: toJson(job.payload ?? {}), created_by: job.createdBy ?? null })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/**
 * Takes the oldest queued job (of `kinds`, when given) for this worker: FOR UPDATE SKIP LOCKED
 * lets many workers claim at once without waiting on, or taking, each other's rows.
 */
export async function claimNextJob(handle: Handle, kinds?: readonly string[]): Promise<Job | null> {
  const kindFilter = kinds && kinds.length > 0 ? sql`and kind in (${sql.join(kinds)})` : sql``;
  const result = await sql<Job>`
    update jobs
       set status = 'running', locked_at = now(), attempts = attempts + 1, message = 'started'
     where id = (
       select id from jobs
        where status = 'queued' and run_after <= now() ${kindFilter}
        order by id
        limit 1
        for update skip locked)
    returning *`.execute(handle);
  return result.rows[0] ?? null;
}

/** Records progress (0..1) and a message a person can read; also renews the job's lock. */
export async function reportJobProgress(handle: Handle, id: number, progress: number, message: string, result?: unknown): Promise<void> {
  const clamped = Math.min(1, Math.max(0, progress));
  await handle
    .updateTable("jobs")
    .set({
      progress: clamped,
      message,
      locked_at: sql<Date>`now()`,
      ...(result === undefined ? {} : { result: toJson(result) }),
    })
    .where("id", "=", id)
    .where("status", "=", "running")
    .execute();
}

export async function finishJob(handle: Handle, id: number, result: unknown, message = "done"): Promise<void> {
  await handle
    .updateTable("jobs")
    .set({ status: "done", progress: 1, message, result: toJson(result ?? null), locked_at: null, finished_at: sql<Date>`now()` })
    .where("id", "=", id)
    .execute();
}

export async function failJob(handle: Handle, id: number, message: string): Promise<void> {
  await handle
    .updateTable("jobs")
    .set({ status: "failed", message, locked_at: null, finished_at: sql<Date>`now()` })
    .where("id", "=", id)
    .execute();
}

/**
 * Puts a job that failed for a passing reason back in the queue, to be claimed no sooner than
 * `delaySeconds` from now; its result so far (e.g. which guards were already mailed) is kept.
 */
export async function retryJobLater(handle: Handle, id: number, delaySeconds: number, message: string): Promise<void> {
  await handle
    .updateTable("jobs")
    .set({ status: "queued", locked_at: null, message, run_after: sql<Date>`now() + make_interval(secs => ${delaySeconds})` })
    .where("id", "=", id)
    .execute();
}

/**
 * Jobs left 'running' by a process that died (no progress for `staleAfterSeconds`) go back to the
 * queue, or fail once they have had `maxAttempts` tries, so one poisonous job cannot loop forever.
 * Returns the ids re-queued and failed.
 */
export async function requeueStaleJobs(
  handle: Handle,
  staleAfterSeconds: number,
  maxAttempts = 3,
): Promise<{ requeued: number[]; failed: number[] }> {
  const stale = sql<boolean>`locked_at < now() - make_interval(secs => ${staleAfterSeconds})`;
  const requeued = await handle
    .updateTable("jobs")
    .set({ status: "queued", locked_at: null, message: sql<string>`'re-queued: its worker stopped answering (attempt ' || attempts || ' of ' || ${maxAttempts} || ')'` })
    .where("status", "=", "running")
    .where(stale)
    .where("attempts", "<", maxAttempts)
    .returning("id")
    .execute();
  const failed = await handle
    .updateTable("jobs")
    .set({
      status: "failed",
      locked_at: null,
      finished_at: sql<Date>`now()`,
      message: sql<string>`'failed: its worker stopped answering ' || attempts || ' times'`,
    })
    .where("status", "=", "running")
    .where(stale)
    .where("attempts", ">=", maxAttempts)
    .returning("id")
    .execute();
  return { requeued: requeued.map((row) => row.id), failed: failed.map((row) => row.id) };
}

export async function jobById(handle: Handle, id: number): Promise<Job | null> {
  return (await handle.selectFrom("jobs").selectAll().where("id", "=", id).executeTakeFirst()) ?? null;
}

/** The latest job of a kind whose payload contains `match` (jsonb @>), e.g. the build of one week. */
export async function latestJobMatching(handle: Handle, kind: string, match: Record<string, unknown>): Promise<Job | null> {
  return (
    (await handle
      .selectFrom("jobs")
      .selectAll()
      .where("kind", "=", kind)
      .where(sql<boolean>`payload @> ${toJson(match)}::jsonb`)
      .orderBy("id", "desc")
      .limit(1)
      .executeTakeFirst()) ?? null
  );
}
