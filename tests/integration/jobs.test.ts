// Background jobs against the real PostgreSQL (a scratch database with every migration applied):
// claiming with FOR UPDATE SKIP LOCKED, progress, finishing and failing, and re-queueing jobs whose
// worker died. PostgreSQL's documented SKIP LOCKED behaviour (SELECT, "The Locking Clause"): rows
// that cannot be locked immediately are skipped, not waited for.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql, type Kysely } from "kysely";
import { randomBytes } from "node:crypto";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { migrateToLatest } from "@/db/migrator";
import { claimNextJob, enqueueJob, jobById, reportJobProgress, requeueStaleJobs } from "@/db/queries/jobs";
import { runNextJob, startWorker } from "@/lib/jobs/worker";
import { requireDatabaseUrl, urlForDatabase } from "./support/database";

let admin: Kysely<Database>;
let db: Kysely<Database>;
let other: Kysely<Database>;
const name = `sightward_scratch_jobs_${process.pid}_${randomBytes(3).toString("hex")}`;

beforeAll(async () => {
  const url = requireDatabaseUrl();
  admin = createDb(url, { max: 1 });
  await sql`create database ${sql.id(name)}`.execute(admin);
  db = createDb(urlForDatabase(url, name), { max: 4 });
  other = createDb(urlForDatabase(url, name), { max: 2 });
  await migrateToLatest(db);
});

afterAll(async () => {
  await other?.destroy();
  await db?.destroy();
  // Closed clients may still be saying goodbye; a forced drop would hit them with an error.
  for (let tries = 0; tries < 50; tries++) {
    const left = await sql<{ n: number }>`select count(*)::int as n from pg_stat_activity where datname = ${name}`.execute(admin);
    if (left.rows[0]!.n === 0) break;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  await sql`drop database if exists ${sql.id(name)} with (force)`.execute(admin);
  await admin.destroy();
});

async function clearJobs() {
  await db.deleteFrom("jobs").execute();
}

describe("claiming jobs", () => {
  it("claims the oldest queued job once, marking it running with an attempt", async () => {
    await clearJobs();
    const first = await enqueueJob(db, { kind: "test-echo", payload: { n: 1 } });
    const second = await enqueueJob(db, { kind: "test-echo", payload: { n: 2 } });
    expect(first.status).toBe("queued");

    const claimed = await claimNextJob(db, ["test-echo"]);
    expect(claimed).toMatchObject({ id: first.id, status: "running", attempts: 1, payload: { n: 1 } });
    expect(claimed!.locked_at).toBeInstanceOf(Date);
    expect((await claimNextJob(db, ["test-echo"]))!.id).toBe(second.id);
    expect(await claimNextJob(db, ["test-echo"])).toBeNull();
  });

  it("only claims kinds it has a handler for", async () => {
    await clearJobs();
    await enqueueJob(db, { kind: "someone-elses", payload: {} });
    expect(await claimNextJob(db, ["test-echo"])).toBeNull();
    expect((await claimNextJob(db, ["someone-elses"]))!.kind).toBe("someone-elses");
  });

  it("skips a job another transaction holds, instead of waiting for it (SKIP LOCKED)", async () => {
    await clearJobs();
    const a = await enqueueJob(db, { kind: "test-echo", payload: { n: "a" } });
    const b = await enqueueJob(db, { kind: "test-echo", payload: { n: "b" } });
    await db.transaction().execute(async (trx) => {
      const mine = await claimNextJob(trx, ["test-echo"]);
      expect(mine!.id).toBe(a.id);
      // The row of `a` stays locked until this transaction ends; a second worker on its own
      // connection must get `b` at once. A 2 s statement timeout turns waiting into a failure.
      const theirs = await other.transaction().execute(async (otherTrx) => {
        await sql`set local statement_timeout = 2000`.execute(otherTrx);
        return claimNextJob(otherTrx, ["test-echo"]);
      });
      expect(theirs!.id).toBe(b.id);
    });
    const rows = await db.selectFrom("jobs").select(["id", "status", "attempts"]).orderBy("id").execute();
    expect(rows).toEqual([
      { id: a.id, status: "running", attempts: 1 },
      { id: b.id, status: "running", attempts: 1 },
    ]);
  });

  it("hands each of many queued jobs to exactly one of several concurrent claimers", async () => {
    await clearJobs();
    for (let i = 0; i < 20; i++) await enqueueJob(db, { kind: "test-echo", payload: { i } });
    const claimers = [db, other, db, other];
    const claimed: number[] = [];
    await Promise.all(
      claimers.map(async (handle) => {
        for (;;) {
          const job = await claimNextJob(handle, ["test-echo"]);
          if (!job) return;
          claimed.push(job.id);
        }
      }),
    );
    expect(claimed).toHaveLength(20);
    expect(new Set(claimed).size).toBe(20);
  });
});

describe("progress and outcome", () => {
  it("records progress and a message, and renews the lock", async () => {
    await clearJobs();
    const job = await enqueueJob(db, { kind: "test-echo", payload: {} });
    await claimNextJob(db, ["test-echo"]);
    await db.updateTable("jobs").set({ locked_at: sql<Date>`now() - interval '10 minutes'` }).where("id", "=", job.id).execute();
    await reportJobProgress(db, job.id, 0.4, "staffing 20 posts", { sent: [3] });
    const after = await jobById(db, job.id);
    expect(after).toMatchObject({ progress: 0.4, message: "staffing 20 posts", result: { sent: [3] }, status: "running" });
    expect(Date.now() - after!.locked_at!.getTime()).toBeLessThan(60_000);
    // Progress is clamped to 0..1 (the column's check would refuse anything else).
    await reportJobProgress(db, job.id, 7, "overshoot");
    expect((await jobById(db, job.id))!.progress).toBe(1);
  });

  it("runs a handler to done with its result, or to failed with its message", async () => {
    await clearJobs();
    const ok = await enqueueJob(db, { kind: "test-echo", payload: { word: "gallery" } });
    const bad = await enqueueJob(db, { kind: "test-fail", payload: {} });
    const handlers = {
      "test-echo": async ({ job, progress }: { job: { payload: unknown }; progress: (f: number, m: string) => Promise<void> }) => {
        await progress(0.5, "half way");
        return { echoed: (job.payload as { word: string }).word, summary: "echoed one word" };
      },
      "test-fail": async () => {
        throw new Error("room 4 has no approved post plan; approve one first");
      },
    };
    const done = await runNextJob(db, handlers);
    expect(done).toMatchObject({ id: ok.id, status: "done", progress: 1, message: "echoed one word", result: { echoed: "gallery" } });
    expect(done!.finished_at).toBeInstanceOf(Date);
    const failed = await runNextJob(db, handlers);
    expect(failed).toMatchObject({ id: bad.id, status: "failed", message: "room 4 has no approved post plan; approve one first" });
    expect(await runNextJob(db, handlers)).toBeNull();
  });

  it("a started worker polls, picks up a job queued later, and stops cleanly", async () => {
    await clearJobs();
    const worker = startWorker(db, { "test-echo": async () => ({ summary: "picked up" }) }, { pollMs: 100 });
    try {
      const job = await enqueueJob(db, { kind: "test-echo", payload: {} });
      const deadline = Date.now() + 10_000;
      let status = "queued";
      while (status !== "done" && Date.now() < deadline) {
        await new Promise((resolve) => setTimeout(resolve, 100));
        status = (await jobById(db, job.id))!.status;
      }
      expect(status).toBe("done");
    } finally {
      await worker.stop();
    }
  });
});

describe("re-queueing jobs whose worker died", () => {
  it("puts a stale running job back in the queue, leaves a fresh one, and fails one out of attempts", async () => {
    await clearJobs();
    const stale = await enqueueJob(db, { kind: "test-echo", payload: { which: "stale" } });
    const fresh = await enqueueJob(db, { kind: "test-echo", payload: { which: "fresh" } });
    const worn = await enqueueJob(db, { kind: "test-echo", payload: { which: "worn" } });
    for (let i = 0; i < 3; i++) await claimNextJob(db, ["test-echo"]);
    // The "stale" and "worn" workers stopped reporting 10 minutes ago; "worn" has had 3 attempts.
    await db.updateTable("jobs").set({ locked_at: sql<Date>`now() - interval '10 minutes'` }).where("id", "in", [stale.id, worn.id]).execute();
    await db.updateTable("jobs").set({ attempts: 3 }).where("id", "=", worn.id).execute();

    const outcome = await requeueStaleJobs(db, 120, 3);
    expect(outcome).toEqual({ requeued: [stale.id], failed: [worn.id] });
    expect(await jobById(db, stale.id)).toMatchObject({ status: "queued", locked_at: null, attempts: 1 });
    expect((await jobById(db, stale.id))!.message).toMatch(/re-queued/);
    expect(await jobById(db, fresh.id)).toMatchObject({ status: "running" });
    expect(await jobById(db, worn.id)).toMatchObject({ status: "failed" });

    // The re-queued job is claimed again, as a second attempt.
    expect(await claimNextJob(db, ["test-echo"])).toMatchObject({ id: stale.id, attempts: 2 });
  });
});
