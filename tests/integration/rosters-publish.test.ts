// One version per draft revision, on the real PostgreSQL and the local mail fake (npm test starts
// both): two publications of the same draft at once give one version, one 409 and one mail job,
// which mails each guard once; publishing the same revision again is refused; a changed draft is
// published as the next version; the week's header and the roster list say which version counts
// and whether the draft holds more.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { replaceDraft, rostersOfSite } from "@/db/queries/rosters";
import { listCaughtMail } from "@/lib/mail";
import { buildDraftRoster } from "@/lib/rosters/build";
import { mailPublishedRoster } from "@/lib/rosters/mail";
import { RosterProblem } from "@/lib/rosters/problem";
import { publishDraft, ROSTER_MAIL_JOB } from "@/lib/rosters/publish";
import { weekOverview } from "@/lib/rosters/view";
import { rosterWeeks } from "@/lib/rosters/weeks";
import { requireDatabaseUrl } from "./support/database";
import { mondayAhead, runQueuedJob } from "./support/rosters";

/** Twelve weeks ahead: clear of the other roster tests' weeks (4-5, 10 weeks ahead) and the browser tests' (1-2). */
const WEEK = mondayAhead(84);
let db: Kysely<Database>;
/** A second pool, so the two publications really run on two connections at once. */
let other: Kysely<Database>;
let siteId: number;
let draftId: number;

async function mailJobsOf(rosterIds: number[]) {
  if (rosterIds.length === 0) return [];
  const jobs = await db.selectFrom("jobs").select(["id", "payload", "status"]).where("kind", "=", ROSTER_MAIL_JOB).execute();
  return jobs.filter((job) => rosterIds.includes((job.payload as { rosterId?: number }).rosterId ?? -1));
}

async function publishedOfWeek() {
  return db.selectFrom("rosters").select(["id", "version", "draft_revision"]).where("site_id", "=", siteId).where("starts_on", "=", WEEK).where("status", "=", "published").orderBy("version").execute();
}

async function revisionOfDraft(): Promise<number> {
  return (await db.selectFrom("rosters").select("revision").where("id", "=", draftId).executeTakeFirstOrThrow()).revision;
}

function refusal(outcome: PromiseSettledResult<unknown>): RosterProblem {
  expect(outcome.status).toBe("rejected");
  const reason = (outcome as PromiseRejectedResult).reason as unknown;
  expect(reason).toBeInstanceOf(RosterProblem);
  return reason as RosterProblem;
}

beforeAll(async () => {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) {
    throw new Error("SMTP_PORT and MAIL_DIR are not set: this test needs the mail fake that `npm test` starts");
  }
  db = createDb(requireDatabaseUrl(), { max: 4 });
  other = createDb(requireDatabaseUrl(), { max: 2 });
  siteId = (await db.selectFrom("sites").select("id").orderBy("id").executeTakeFirstOrThrow()).id;
  // A re-run on the same database starts from a clean week (published rows may be deleted, never changed).
  await db.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "=", WEEK).execute();
  const built = await buildDraftRoster(db, { siteId, startsOn: WEEK, userId: null });
  draftId = built.rosterId;
  expect(built.violations).toBe(0);
});

afterAll(async () => {
  await other?.destroy();
  await db?.destroy();
});

describe("one version per draft revision", () => {
  let versionId: number;

  it("two publications of the same revision at once give one version (201) and one refusal (409), one mail job", async () => {
    const revision = await revisionOfDraft();
    const outcomes = await Promise.allSettled([
      publishDraft(db, { rosterId: draftId, revision, userId: null }),
      publishDraft(other, { rosterId: draftId, revision, userId: null }),
    ]);
    const won = outcomes.filter((o) => o.status === "fulfilled");
    expect(won).toHaveLength(1);
    const lost = refusal(outcomes.find((o) => o.status === "rejected")!);
    expect(lost.status).toBe(409);
    expect(lost.code).toBe("already-published");
    expect(lost.message).toContain(`Revision ${revision}`);
    expect(lost.message).toContain("version 1");

    const published = await publishedOfWeek();
    expect(published).toEqual([{ id: expect.any(Number), version: 1, draft_revision: revision }]);
    versionId = published[0]!.id;
    const jobs = await mailJobsOf([versionId]);
    expect(jobs).toHaveLength(1);
    expect(jobs[0]!.status).toBe("queued");
  });

  it("mails every guard on the version exactly once", async () => {
    const since = new Date(Date.now() - 1000).toISOString();
    const [job] = await mailJobsOf([versionId]);
    await runQueuedJob(db, job!.id, () => mailPublishedRoster(db, versionId));
    const guardIds = [...new Set((await db.selectFrom("shifts").select("guard_id").where("roster_id", "=", versionId).execute()).map((s) => s.guard_id))];
    expect(guardIds.length).toBeGreaterThan(0);
    const guards = await db.selectFrom("guards").select(["id", "email"]).where("id", "in", guardIds).execute();
    const week = format(new TZDate(`${WEEK}T12:00:00Z`, "Europe/Berlin"), "d MMM yyyy");
    for (const guard of guards) {
      const caught = (await listCaughtMail({ to: guard.email })).filter((m) => m.receivedAt >= since && m.subject.includes(`week of ${week}`));
      expect(caught, guard.email).toHaveLength(1);
    }
  });

  it("refuses a third publication of the same revision with 409, writing and queueing nothing", async () => {
    const revision = await revisionOfDraft();
    const jobsBefore = (await db.selectFrom("jobs").select("id").where("kind", "=", ROSTER_MAIL_JOB).execute()).length;
    const again = await Promise.allSettled([publishDraft(db, { rosterId: draftId, revision, userId: null })]);
    const problem = refusal(again[0]!);
    expect(problem).toMatchObject({ status: 409, code: "already-published", details: { version: 1, rosterId: versionId } });
    expect(await publishedOfWeek()).toHaveLength(1);
    expect((await db.selectFrom("jobs").select("id").where("kind", "=", ROSTER_MAIL_JOB).execute()).length).toBe(jobsBefore);
  });

  it("says in the week's header that version 1 counts and the draft holds nothing newer", async () => {
    const week = await weekOverview(db, siteId, WEEK);
    expect(week.status).toEqual({ current: { id: versionId, version: 1, publishedAt: expect.any(String) }, draftIsNewer: false });
    expect(week.published.map((p) => [p.version, p.draftRevision])).toEqual([[1, await revisionOfDraft()]]);
  });

  it("publishes a changed draft as version 2, and the header shows a newer draft until then", async () => {
    const draft = await db.selectFrom("rosters").selectAll().where("id", "=", draftId).executeTakeFirstOrThrow();
    const shifts = await db.selectFrom("shifts").select(["guard_id", "starts_at", "ends_at", "segments", "breaks"]).where("roster_id", "=", draftId).execute();
    // The same content stored again is a new revision, as a rebuild makes one.
    const replaced = await db.transaction().execute((trx) =>
      replaceDraft(trx, {
        siteId,
        startsOn: WEEK,
        days: draft.days,
        scenario: draft.scenario,
        shifts,
        unfilled: draft.unfilled,
        totals: draft.totals!,
        violations: draft.violations,
        createdBy: null,
      }),
    );
    expect(replaced.id).toBe(draftId);
    expect(replaced.revision).toBe(draft.revision + 1);
    expect((await weekOverview(db, siteId, WEEK)).status.draftIsNewer).toBe(true);

    const publication = await publishDraft(db, { rosterId: draftId, revision: replaced.revision, userId: null });
    expect(publication.roster).toMatchObject({ version: 2, supersedes: versionId, draft_revision: replaced.revision });
    const week = await weekOverview(db, siteId, WEEK);
    expect(week.status).toMatchObject({ current: { id: publication.roster.id, version: 2 }, draftIsNewer: false });
    // Its mail job belongs to this test alone: run it so no other test's worker picks it up.
    await runQueuedJob(db, publication.mailJobId, () => mailPublishedRoster(db, publication.roster.id));
  });

  it("a draft deleted and built again continues after the published revisions, so it can be published", async () => {
    const before = await db.selectFrom("rosters").selectAll().where("id", "=", draftId).executeTakeFirstOrThrow();
    const shifts = await db.selectFrom("shifts").select(["guard_id", "starts_at", "ends_at", "segments", "breaks"]).where("roster_id", "=", draftId).execute();
    await db.deleteFrom("rosters").where("id", "=", draftId).execute();
    const fresh = await db.transaction().execute((trx) =>
      replaceDraft(trx, { siteId, startsOn: WEEK, days: before.days, scenario: before.scenario, shifts, unfilled: before.unfilled, totals: before.totals!, violations: before.violations, createdBy: null }),
    );
    const highest = Math.max(...(await publishedOfWeek()).map((p) => p.draft_revision ?? 0));
    expect(fresh.revision).toBe(highest + 1);
    draftId = fresh.id;
    expect((await weekOverview(db, siteId, WEEK)).status.draftIsNewer).toBe(true);
  });

  it("lists the week once, with the draft and both versions beneath it, newest first", async () => {
    const weeks = rosterWeeks(await rostersOfSite(db, siteId));
    const ours = weeks.filter((w) => w.startsOn === WEEK);
    expect(ours).toHaveLength(1);
    expect(ours[0]!.rows.map((r) => (r.status === "draft" ? "draft" : `v${r.version}`))).toEqual(["draft", "v2", "v1"]);
    expect(ours[0]!.current?.version).toBe(2);
    expect(ours[0]!.draftIsNewer).toBe(true);
    // Weeks are newest first and each appears once.
    const starts = weeks.map((w) => w.startsOn);
    expect(new Set(starts).size).toBe(starts.length);
    expect([...starts].sort().reverse()).toEqual(starts);
  });
});
