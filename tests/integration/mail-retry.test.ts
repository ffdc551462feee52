// A publication's e-mail survives a mail server that is away for a while: the mail job fails with
// a passing reason, waits (run_after) and tries again, and every guard gets exactly one message.
// Against the real PostgreSQL and the mail fake that npm test starts. Passing versus permanent SMTP
// answers: 4xx is a "transient negative completion", 5xx "permanent" (RFC 5321, section 4.2.1).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import net from "node:net";
import { sql, type Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { claimNextJob, enqueueJob, jobById } from "@/db/queries/jobs";
import { runNextJob } from "@/lib/jobs/worker";
import { RetryLater } from "@/lib/jobs/retry";
import { listCaughtMail } from "@/lib/mail";
import { sendMail } from "@/lib/mail/transport";
import { isPassingMailFailure } from "@/lib/rosters/mail";
import { rosterJobHandlers } from "@/lib/rosters/jobs";
import { ROSTER_MAIL_JOB } from "@/lib/rosters/publish";
import { requireDatabaseUrl } from "./support/database";
import { publishRosterDirectly } from "./support/rosters";

// A past week of its own (the other tests publish weeks ahead of today) and two guards of its own.
const WEEK = "2026-02-09";
const EMAILS = ["mail-retry-a@example.org", "mail-retry-b@example.org"];
let db: Kysely<Database>;
let siteId: number;
let rosterId: number;
const realPort = process.env.SMTP_PORT;

/** A loopback port nothing listens on: bound, read, and released. */
async function closedPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const port = (server.address() as net.AddressInfo).port;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

beforeAll(async () => {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) throw new Error("SMTP_PORT and MAIL_DIR are not set: this test needs the mail fake that `npm test` starts");
  db = createDb(requireDatabaseUrl(), { max: 2 });
  siteId = (await db.selectFrom("sites").select("id").orderBy("id").executeTakeFirstOrThrow()).id;
  await db.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "=", WEEK).execute();
  await db.deleteFrom("guards").where("email", "in", EMAILS).execute();
  const guards = await db
    .insertInto("guards")
    .values(EMAILS.map((email, i) => ({ site_id: siteId, name: `Mail retry guard ${i + 1}`, email, contract_hours: 30, max_hours: 40 })))
    .returning("id")
    .execute();
  rosterId = await publishRosterDirectly(
    db,
    { siteId, startsOn: WEEK, version: 1 },
    guards.map((guard) => ({ guardId: guard.id, starts_at: new Date(`${WEEK}T09:00:00Z`), ends_at: new Date(`${WEEK}T17:00:00Z`) })),
  );
});

afterAll(async () => {
  process.env.SMTP_PORT = realPort;
  await db?.deleteFrom("jobs").where("kind", "=", ROSTER_MAIL_JOB).where(sql<boolean>`payload @> ${JSON.stringify({ rosterId })}::jsonb`).execute();
  await db?.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "=", WEEK).execute();
  await db?.deleteFrom("guards").where("email", "in", EMAILS).execute();
  await db?.destroy();
});

describe("mail failures that pass", () => {
  it("tells a refused connection and SMTP 4xx (try again) from SMTP 5xx (permanent)", async () => {
    const port = await closedPort();
    process.env.SMTP_PORT = String(port);
    try {
      const refused = await sendMail({ to: "nobody@example.org", subject: "probe", text: "probe" }).then(() => null, (error: unknown) => error);
      expect(refused).toBeInstanceOf(Error);
      expect(isPassingMailFailure(refused)).toBe(true);
    } finally {
      process.env.SMTP_PORT = realPort;
    }
    expect(isPassingMailFailure(Object.assign(new Error("451 try later"), { responseCode: 451 }))).toBe(true);
    expect(isPassingMailFailure(Object.assign(new Error("550 no such mailbox"), { responseCode: 550 }))).toBe(false);
    expect(isPassingMailFailure(new Error("roster 4 is not a published roster"))).toBe(false);
  });

  it("queues the mail job again while the mail server is away, and mails each guard once when it is back", async () => {
    const since = new Date().toISOString();
    const job = await enqueueJob(db, { kind: ROSTER_MAIL_JOB, payload: { rosterId } });
    process.env.SMTP_PORT = String(await closedPort());
    let waiting;
    try {
      waiting = await runNextJob(db, rosterJobHandlers);
    } finally {
      process.env.SMTP_PORT = realPort;
    }
    expect(waiting).toMatchObject({ id: job.id, status: "queued", attempts: 1, locked_at: null });
    expect(waiting!.message).toMatch(/did not take the message .*0 of 2 guards mailed so far.*trying again in 30 s \(attempt 1 of 6\)/);
    expect(waiting!.run_after.getTime()).toBeGreaterThan(Date.now() + 20_000);
    // Not before its time: the queue has nothing to claim for this kind yet.
    expect(await claimNextJob(db, [ROSTER_MAIL_JOB])).toBeNull();
    expect(await listCaughtMail({ to: EMAILS[0] })).toEqual([]);
    // The outbox holds the failed attempt with the server's reason.
    const failed = await db.selectFrom("outbox").select(["status", "attempts", "last_error"]).where("roster_id", "=", rosterId).where("created_at", ">=", new Date(since)).execute();
    expect(failed).toHaveLength(1);
    expect(failed[0]).toMatchObject({ status: "failed", attempts: 1 });
    expect(failed[0]!.last_error).toMatch(/ECONNREFUSED|connect/i);

    // The pause is over (moved, not waited for) and the mail server answers again.
    await db.updateTable("jobs").set({ run_after: sql<Date>`now()` }).where("id", "=", job.id).execute();
    const done = await runNextJob(db, rosterJobHandlers);
    expect(done).toMatchObject({ id: job.id, status: "done", attempts: 2 });
    for (const email of EMAILS) {
      const caught = (await listCaughtMail({ to: email })).filter((m) => m.receivedAt >= since);
      expect(caught, email).toHaveLength(1);
    }
    // One row per guard: the retried one sent on its second attempt, not recorded twice.
    const rows = await db.selectFrom("outbox").select(["recipient", "status", "attempts"]).where("roster_id", "=", rosterId).where("created_at", ">=", new Date(since)).orderBy("id").execute();
    expect(rows.map((r) => r.recipient).sort()).toEqual([...EMAILS].sort());
    expect(rows.every((r) => r.status === "sent")).toBe(true);
    expect(rows.map((r) => r.attempts).sort()).toEqual([1, 2]);
  });

  it("gives up with the reason after the last attempt, and fails at once on a permanent error", async () => {
    const handlers = {
      "test-mail-away": async () => {
        throw new RetryLater("the mail server at 127.0.0.1:1 did not take the message");
      },
      "test-broken": async () => {
        throw new Error("roster 999 is not a published roster; nothing to mail");
      },
    };
    const away = await enqueueJob(db, { kind: "test-mail-away", payload: {} });
    const policy = { maxAttempts: 2, firstDelaySeconds: 60, maxDelaySeconds: 60 };
    try {
      expect(await runNextJob(db, handlers, policy)).toMatchObject({ id: away.id, status: "queued", attempts: 1 });
      await db.updateTable("jobs").set({ run_after: sql<Date>`now()` }).where("id", "=", away.id).execute();
      const last = await runNextJob(db, handlers, policy);
      expect(last).toMatchObject({ id: away.id, status: "failed", attempts: 2 });
      expect(last!.message).toBe("the mail server at 127.0.0.1:1 did not take the message; gave up after 2 attempts");

      const broken = await enqueueJob(db, { kind: "test-broken", payload: {} });
      expect(await runNextJob(db, handlers, policy)).toMatchObject({ id: broken.id, status: "failed", attempts: 1 });
      expect((await jobById(db, broken.id))!.message).toBe("roster 999 is not a published roster; nothing to mail");
    } finally {
      await db.deleteFrom("jobs").where("kind", "in", Object.keys(handlers)).execute();
    }
  });
});
