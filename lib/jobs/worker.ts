// The job worker: claims one queued job at a time from PostgreSQL, runs its handler, records
// progress and the outcome. It runs inside the Next.js server process (instrumentation.ts) and in
// tests (runNextJob); several processes may run it at once, SKIP LOCKED keeps them apart.
import type { Kysely } from "kysely";
import type { Database, Job } from "@/db/schema";
import { claimNextJob, failJob, finishJob, reportJobProgress, requeueStaleJobs, retryJobLater } from "@/db/queries/jobs";
import { DEFAULT_RETRY, RetryLater, describeDelay, retryDelaySeconds, type RetryPolicy } from "./retry";

export interface JobContext {
  db: Kysely<Database>;
  job: Job;
  /** Progress 0..1 with a message a person can read; `partial` replaces the job's result so far. */
  progress(fraction: number, message: string, partial?: unknown): Promise<void>;
}

/** Runs one job; its answer becomes the job's result. Throw an Error with a message a person can act on. */
export type JobHandler = (context: JobContext) => Promise<unknown>;

export type JobHandlers = Record<string, JobHandler>;

/** A job with no progress for this long lost its worker (the roster engine reports at least every few seconds). */
export const STALE_AFTER_SECONDS = 120;

/**
 * Claims and runs the oldest queued job with a handler; returns it as finished (or queued again,
 * when it threw RetryLater with attempts left), or null when nothing was queued.
 */
export async function runNextJob(db: Kysely<Database>, handlers: JobHandlers, retry: RetryPolicy = DEFAULT_RETRY): Promise<Job | null> {
  const job = await claimNextJob(db, Object.keys(handlers));
  if (!job) return null;
  const handler = handlers[job.kind]!;
  const context: JobContext = {
    db,
    job,
    progress: (fraction, message, partial) => reportJobProgress(db, job.id, fraction, message, partial),
  };
  try {
    const result = await handler(context);
    await finishJob(db, job.id, result ?? null, doneMessage(result));
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    if (error instanceof RetryLater && job.attempts < retry.maxAttempts) {
      const delay = retryDelaySeconds(job.attempts, retry);
      console.warn(`[jobs] job ${job.id} (${job.kind}) will try again in ${describeDelay(delay)}: ${message}`);
      await retryJobLater(db, job.id, delay, `${message}; trying again in ${describeDelay(delay)} (attempt ${job.attempts} of ${retry.maxAttempts})`);
    } else {
      console.error(`[jobs] job ${job.id} (${job.kind}) failed:`, error);
      await failJob(db, job.id, error instanceof RetryLater ? `${message}; gave up after ${job.attempts} attempts` : message);
    }
  }
  return (await db.selectFrom("jobs").selectAll().where("id", "=", job.id).executeTakeFirst()) ?? job;
}

function doneMessage(result: unknown): string {
  const summary = (result as { summary?: unknown } | null)?.summary;
  return typeof summary === "string" ? summary : "done";
}

export interface WorkerOptions {
  pollMs?: number;
  staleAfterSeconds?: number;
}

export interface RunningWorker {
  stop(): Promise<void>;
}

/**
 * Polls for jobs every `pollMs` (default 1 s) until stopped; after a job it looks again at once.
 * Stale 'running' jobs (their process died) go back to the queue about every 30 s.
 */
export function startWorker(db: Kysely<Database>, handlers: JobHandlers, options: WorkerOptions = {}): RunningWorker {
  const pollMs = options.pollMs ?? 1000;
  const staleAfter = options.staleAfterSeconds ?? STALE_AFTER_SECONDS;
  let stopped = false;
  let lastRequeue = 0;
  let wake: (() => void) | null = null;
  let failuresInARow = 0;

  const loop = async () => {
    while (!stopped) {
      let worked = false;
      try {
        if (Date.now() - lastRequeue > 30_000) {
          lastRequeue = Date.now();
          const { requeued, failed } = await requeueStaleJobs(db, staleAfter);
          if (requeued.length || failed.length) console.warn(`[jobs] re-queued stale jobs ${requeued.join(", ") || "none"}; failed ${failed.join(", ") || "none"}`);
        }
        worked = (await runNextJob(db, handlers)) !== null;
        failuresInARow = 0;
      } catch (error) {
        // PostgreSQL down or restarting: say so once in a while and keep polling, slower.
        failuresInARow++;
        if (failuresInARow === 1 || failuresInARow % 60 === 0) console.error("[jobs] cannot poll for jobs:", (error as Error).message);
      }
      if (!worked && !stopped) {
        await new Promise<void>((resolve) => {
          const timer = setTimeout(resolve, failuresInARow > 0 ? Math.min(30_000, pollMs * 5) : pollMs);
          timer.unref?.();
          wake = () => {
            clearTimeout(timer);
            resolve();
          };
        });
        wake = null;
      }
    }
  };
  const done = loop();
  return {
    async stop() {
      stopped = true;
      wake?.();
      await done;
    },
  };
}
