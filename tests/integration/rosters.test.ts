// Rosters against the real PostgreSQL and the local mail fake (npm test starts both): a week built
// by the engine from the seeded demo museum, stored as a draft; published as version 1; published
// again as version 2, which supersedes version 1 while version 1 stays exactly as it was; every
// guard e-mailed with an iCalendar attachment (read back from MAIL_DIR); the personal feed answers
// one guard's shifts of the latest version only.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql, type Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { enqueueJob } from "@/db/queries/jobs";
import { runNextJob } from "@/lib/jobs/worker";
import { listCaughtMail, readCaughtMail } from "@/lib/mail";
import { postsForWeek } from "@/lib/rosters/build";
import { reassignInDraft } from "@/lib/rosters/edit";
import { calendarFeed } from "@/lib/rosters/feed";
import { rosterJobHandlers } from "@/lib/rosters/jobs";
import { RosterProblem } from "@/lib/rosters/problem";
import { publishDraft, ROSTER_BUILD_JOB, ROSTER_MAIL_JOB } from "@/lib/rosters/publish";
import { requireDatabaseUrl } from "./support/database";
import { mondayAhead } from "./support/rosters";
import { SITE } from "@/db/seed/museum";
import { parseLocal } from "@/lib/scheduling/time";
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";

/**
 * A Monday four to five weeks ahead whose week has no dated opening exception: inside the seeded
 * exhibition (which runs 26 weeks past the seeding day) and clear of the browser tests' week (one
 * to two weeks ahead), which share this database.
 */
function quietWeekAhead(): string {
  const day = new Date(`${mondayAhead(28)}T00:00:00Z`);
  const dated = Object.keys(SITE.opening_hours.dates ?? {});
  const iso = (d: Date) => d.toISOString().slice(0, 10);
  const weekOf = (monday: Date) => Array.from({ length: 7 }, (_, i) => iso(new Date(monday.getTime() + i * 86_400_000)));
  while (weekOf(day).some((d) => dated.includes(d))) day.setUTCDate(day.getUTCDate() + 7);
  return iso(day);
}
const WEEK = quietWeekAhead();
/** The date `days` after WEEK's Monday. */
const dayOf = (days: number) => new Date(Date.parse(`${WEEK}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
let db: Kysely<Database>;
let siteId: number;
let draftId: number;
let maraGuardId: number;

function requireMailFake(): void {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) {
    throw new Error("SMTP_PORT and MAIL_DIR are not set: this test needs the mail fake that `npm test` starts");
  }
}

async function shiftsOf(rosterId: number) {
  return db
    .selectFrom("shifts")
    .select(["guard_id", "starts_at", "ends_at", "segments", "breaks"])
    .where("roster_id", "=", rosterId)
    .orderBy("starts_at")
    .orderBy("guard_id")
    .execute();
}

async function expectRefusal(work: Promise<unknown>, status: number, code: string): Promise<RosterProblem> {
  const error = await work.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(RosterProblem);
  expect((error as RosterProblem).status).toBe(status);
  expect((error as RosterProblem).code).toBe(code);
  return error as RosterProblem;
}

const vevents = (ics: string) => ics.split("\r\n").filter((line) => line === "BEGIN:VEVENT").length;

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 4 });
  const site = await db.selectFrom("sites").select(["id"]).orderBy("id").executeTakeFirstOrThrow();
  siteId = site.id;
  const mara = await db.selectFrom("guards").innerJoin("users", "users.id", "guards.user_id").select("guards.id").where("users.email", "=", "guard@example.org").executeTakeFirstOrThrow();
  maraGuardId = mara.id;
  // A re-run on the same database starts from a clean week (published rows may be deleted, never changed).
  await db.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "=", WEEK).execute();
  await db.deleteFrom("time_off").where("guard_id", "=", maraGuardId).where("note", "=", "rosters integration test").execute();
});

afterAll(async () => {
  await db?.destroy();
});

describe("building, publishing and mailing a week", () => {
  it("builds a draft from approved posts, guards and approved time off, keeping every rule", async () => {
    // Mara is off Tuesday and Wednesday (approved); a declined request must not count.
    await db
      .insertInto("time_off")
      .values([
        { guard_id: maraGuardId, starts_on: dayOf(1), ends_on: dayOf(2), note: "rosters integration test", status: "approved" },
        { guard_id: maraGuardId, starts_on: dayOf(4), ends_on: dayOf(4), note: "rosters integration test", status: "declined" },
      ])
      .execute();
    const queued = await enqueueJob(db, { kind: ROSTER_BUILD_JOB, payload: { siteId, startsOn: WEEK, userId: null } });
    const job = await runNextJob(db, rosterJobHandlers);
    expect(job).toMatchObject({ id: queued.id, status: "done", progress: 1 });
    const result = job!.result as { rosterId: number; shifts: number; violations: number };
    draftId = result.rosterId;

    const draft = await db.selectFrom("rosters").selectAll().where("id", "=", draftId).executeTakeFirstOrThrow();
    expect(draft).toMatchObject({ site_id: siteId, starts_on: WEEK, days: 7, status: "draft", published_at: null });
    expect(draft.violations).toEqual([]);
    const shifts = await shiftsOf(draftId);
    expect(shifts.length).toBe(result.shifts);
    expect(shifts.length).toBeGreaterThan(0);

    // Demand = posts x opening hours (README.md): the seeded week opens Tue-Sat 10-18 with Thursday
    // to 21, Sunday 11-18, Monday closed: 4 x 8 + 11 + 7 = 50 hours.
    const posts = await postsForWeek(db, siteId, "Europe/Berlin", WEEK);
    expect(posts.length).toBeGreaterThan(0);
    expect(draft.totals!.postHours).toBe(50 * posts.length);
    // Every post-hour is either staffed by one guard or listed as unfilled with a reason.
    const staffedHours = shifts.flatMap((s) => s.segments).reduce((sum, s) => sum + (Date.parse(s.end) - Date.parse(s.start)) / 3_600_000, 0);
    expect(staffedHours + draft.unfilled.length).toBeCloseTo(draft.totals!.postHours, 6);
    for (const u of draft.unfilled) expect(u.reason.length).toBeGreaterThan(10);
    const postIds = new Set(posts.map((p) => p.id));
    for (const shift of shifts) for (const segment of shift.segments) expect(postIds.has(segment.post)).toBe(true);

    // Approved time off is unavailability: nothing for Mara from Tuesday 00:00 to Thursday 00:00 in Berlin.
    const off = { start: parseLocal("Europe/Berlin", `${dayOf(1)}T00:00`), end: parseLocal("Europe/Berlin", `${dayOf(3)}T00:00`) };
    const maras = shifts.filter((s) => s.guard_id === maraGuardId);
    for (const s of maras) expect(s.ends_at.getTime() <= off.start || s.starts_at.getTime() >= off.end).toBe(true);
  });

  it("refuses a manual edit that breaks a rule, with the rule's message, writing nothing", async () => {
    const before = await shiftsOf(draftId);
    const revision = (await db.selectFrom("rosters").select("revision").where("id", "=", draftId).executeTakeFirstOrThrow()).revision;
    // A guard with no shift that day gets a one-hour stretch: shorter than the 4-hour minimum shift.
    const shift = before[0]!;
    const segment = shift.segments[0]!;
    const day = shift.starts_at.getTime();
    const busy = new Set(before.filter((s) => Math.abs(s.starts_at.getTime() - day) < 24 * 3_600_000).map((s) => s.guard_id));
    const idle = await db.selectFrom("guards").select("id").where("site_id", "=", siteId).where("id", "not in", [...busy]).orderBy("id").executeTakeFirst();
    expect(idle, "a guard free that day").toBeDefined();
    const problem = await expectRefusal(
      reassignInDraft(db, { rosterId: draftId, revision, from: { guardId: shift.guard_id, post: segment.post, start: segment.start }, toGuardId: idle!.id }),
      422,
      "breaks-rule",
    );
    expect(problem.message).toMatch(/shorter than the minimum 4 h|without a break|rest|hours in 7 days|skill/);
    expect(await shiftsOf(draftId)).toEqual(before);
    expect((await db.selectFrom("rosters").select("revision").where("id", "=", draftId).executeTakeFirstOrThrow()).revision).toBe(revision);

    // An edit against a revision the draft no longer has is a conflict, whatever it asks.
    await expectRefusal(
      reassignInDraft(db, { rosterId: draftId, revision: revision + 5, from: { guardId: shift.guard_id, post: segment.post, start: segment.start }, toGuardId: idle!.id }),
      409,
      "roster-changed",
    );
  });

  let version1Id: number;
  let version1Row: unknown;
  let version1Shifts: Awaited<ReturnType<typeof shiftsOf>>;

  it("publishes the draft as version 1 and queues the e-mail in the same transaction", async () => {
    const draft = await db.selectFrom("rosters").select(["revision"]).where("id", "=", draftId).executeTakeFirstOrThrow();
    await expectRefusal(publishDraft(db, { rosterId: draftId, revision: draft.revision + 1, userId: null }), 409, "roster-changed");
    expect(await db.selectFrom("rosters").select("id").where("starts_on", "=", WEEK).where("status", "=", "published").execute()).toEqual([]);

    const publication = await publishDraft(db, { rosterId: draftId, revision: draft.revision, userId: null });
    expect(publication.roster).toMatchObject({ status: "published", version: 1, supersedes: null, starts_on: WEEK });
    expect(publication.supersedes).toBeNull();
    version1Id = publication.roster.id;
    version1Row = await db.selectFrom("rosters").selectAll().where("id", "=", version1Id).executeTakeFirstOrThrow();
    version1Shifts = await shiftsOf(version1Id);
    expect(version1Shifts).toEqual(await shiftsOf(draftId));
    const mailJob = await db.selectFrom("jobs").selectAll().where("id", "=", publication.mailJobId).executeTakeFirstOrThrow();
    expect(mailJob).toMatchObject({ kind: ROSTER_MAIL_JOB, status: "queued", payload: { rosterId: version1Id } });
  });

  it("e-mails every guard with shifts their own shifts and an .ics attachment", async () => {
    requireMailFake();
    // Mail caught before this run (a re-run on the same MAIL_DIR) does not count.
    const since = new Date(Date.now() - 1000).toISOString();
    const job = await runNextJob(db, rosterJobHandlers);
    expect(job).toMatchObject({ kind: ROSTER_MAIL_JOB, status: "done" });
    const guardIds = [...new Set(version1Shifts.map((s) => s.guard_id))];
    expect((job!.result as { sent: number[] }).sent.sort((a, b) => a - b)).toEqual([...guardIds].sort((a, b) => a - b));
    const guards = await db.selectFrom("guards").select(["id", "email", "name"]).where("id", "in", guardIds).execute();
    for (const guard of guards) {
      const caught = (await listCaughtMail({ to: guard.email })).filter((m) => m.receivedAt >= since && m.subject.includes(`week of ${format(new TZDate(`${WEEK}T12:00:00Z`, "Europe/Berlin"), "d MMM yyyy")} (version 1)`));
      expect(caught, guard.email).toHaveLength(1);
      const mail = (await readCaughtMail(caught[0]!.id))!;
      expect(mail.text).toContain(`Hello ${guard.name}`);
      expect(mail.text).toContain("Europe/Berlin");
      expect(mail.attachments).toHaveLength(1);
      const attachment = mail.attachments[0]!;
      expect(attachment.filename).toBe("shifts.ics");
      expect(attachment.contentType).toMatch(/^text\/calendar/);
      const ics = Buffer.from(attachment.content!, "base64").toString("utf8");
      expect(ics.startsWith("BEGIN:VCALENDAR\r\nVERSION:2.0\r\n")).toBe(true);
      const own = version1Shifts.filter((s) => s.guard_id === guard.id);
      expect(vevents(ics)).toBe(own.length);
      // RFC 5545 §3.3.5 UTC form of each shift's start.
      for (const s of own) expect(ics).toContain(`DTSTART:${s.starts_at.toISOString().replace(/[-:]/g, "").replace(/\.\d{3}/, "")}`);
    }
  });

  it("publishes a rebuilt draft as version 2, superseding version 1, which stays exactly as it was", async () => {
    const published = await db.selectFrom("rosters").select(["revision"]).where("id", "=", draftId).executeTakeFirstOrThrow();
    // The revision version 1 was made from is published once; a rebuild makes a new revision.
    await expectRefusal(publishDraft(db, { rosterId: draftId, revision: published.revision, userId: null }), 409, "already-published");
    await enqueueJob(db, { kind: ROSTER_BUILD_JOB, payload: { siteId, startsOn: WEEK, userId: null } });
    expect(await runNextJob(db, rosterJobHandlers)).toMatchObject({ kind: ROSTER_BUILD_JOB, status: "done" });
    const draft = await db.selectFrom("rosters").select(["revision"]).where("id", "=", draftId).executeTakeFirstOrThrow();
    expect(draft.revision).toBe(published.revision + 1);
    const publication = await publishDraft(db, { rosterId: draftId, revision: draft.revision, userId: null });
    expect(publication.roster).toMatchObject({ version: 2, supersedes: version1Id });
    expect(publication.supersedes).toEqual({ id: version1Id, version: 1 });
    expect(await db.selectFrom("rosters").selectAll().where("id", "=", version1Id).executeTakeFirstOrThrow()).toEqual(version1Row);
    expect(await shiftsOf(version1Id)).toEqual(version1Shifts);

    // The database itself refuses to change a published version or its shifts.
    await expect(sql`update rosters set days = 6 where id = ${version1Id}`.execute(db)).rejects.toThrow(/published and never changes/);
    await expect(sql`update shifts set guard_id = guard_id where roster_id = ${version1Id}`.execute(db)).rejects.toThrow(/never change/);
    await expect(
      db.insertInto("shifts").values({ roster_id: version1Id, guard_id: maraGuardId, starts_at: `${dayOf(6)}T10:00:00Z`, ends_at: `${dayOf(6)}T15:00:00Z` }).execute(),
    ).rejects.toThrow(/never change/);
    const mail = await runNextJob(db, rosterJobHandlers);
    expect(mail).toMatchObject({ kind: ROSTER_MAIL_JOB, status: "done" });
  });

  it("rebuilds the week into the same draft with a new revision, so a page holding the old one gets 409", async () => {
    const before = await db.selectFrom("rosters").select(["id", "revision"]).where("id", "=", draftId).executeTakeFirstOrThrow();
    await enqueueJob(db, { kind: ROSTER_BUILD_JOB, payload: { siteId, startsOn: WEEK, userId: null } });
    const job = await runNextJob(db, rosterJobHandlers);
    expect(job).toMatchObject({ status: "done", result: { rosterId: draftId, revision: before.revision + 1 } });
    await expectRefusal(publishDraft(db, { rosterId: draftId, revision: before.revision, userId: null }), 409, "roster-changed");
    const versions = await db.selectFrom("rosters").select("version").where("starts_on", "=", WEEK).where("status", "=", "published").orderBy("version").execute();
    expect(versions.map((v) => v.version)).toEqual([1, 2]);
  });

  it("serves a guard's feed with their shifts of the latest version only", async () => {
    const latest = await db.selectFrom("rosters").select("id").where("starts_on", "=", WEEK).where("status", "=", "published").where("version", "=", 2).executeTakeFirstOrThrow();
    const shifts = await shiftsOf(latest.id);
    const guardId = shifts[0]!.guard_id;
    const { calendar_token: token } = await db.selectFrom("guards").select("calendar_token").where("id", "=", guardId).executeTakeFirstOrThrow();
    const ics = (await calendarFeed(db, token, new Date(`${WEEK}T00:00:00Z`)))!;
    const own = shifts.filter((s) => s.guard_id === guardId);
    // Only this guard's events, and this week's once although versions 1 and 2 both hold them
    // (other weeks of the same database may add events of their own).
    const uids = ics.split("\r\n").filter((line) => line.startsWith("UID:"));
    for (const uid of uids) expect(uid.startsWith(`UID:shift-${guardId}-`)).toBe(true);
    const weekDays = Array.from({ length: 7 }, (_, i) => dayOf(i).replace(/-/g, ""));
    const thisWeek = ics.split("\r\n").filter((line) => weekDays.some((d) => line.startsWith(`DTSTART:${d}T`)));
    expect(thisWeek.sort()).toEqual(own.map((s) => `DTSTART:${s.starts_at.toISOString().replace(/[-:]/g, "").replace(/\.\d{3}/, "")}`).sort());
    expect(ics).toContain("SEQUENCE:2");
    expect(await calendarFeed(db, "0".repeat(64))).toBeNull();
  });
});
