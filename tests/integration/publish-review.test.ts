// The publish review on the real PostgreSQL, through the route handlers in-process: a week built for
// the demo museum keeps every high-risk room guarded in every open hour and nobody over contract plus
// accepted extra; a draft that leaves rooms empty (its first day's shifts removed) is refused with
// 422 until the manager types the first empty room's name and gives a note, and nothing is published
// or mailed meanwhile; then the version keeps the review, the typed word and the note. Roles: only
// those who may publish see the review.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the modules.
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { GET as reviewRoute } from "@/app/api/rosters/[id]/review/route";
import { POST as publishRoute } from "@/app/api/rosters/[id]/publish/route";
import { buildDraftRoster } from "@/lib/rosters/build";
import { ROSTER_MAIL_JOB } from "@/lib/rosters/publish";
import type { PublishReview } from "@/lib/rosters/review";
import { rosterView } from "@/lib/rosters/view";
import { requireDatabaseUrl } from "./support/database";
import { mondayAhead } from "./support/rosters";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

/** Fourteen and fifteen weeks ahead: clear of the other roster tests' weeks. */
const WEEK = mondayAhead(98);
const FULL_WEEK = mondayAhead(105);
let db: Kysely<Database>;
let siteId: number;
let draftId: number;
let operations: SignedUser;
let guard: SignedUser;
let curator: SignedUser;

const context = (id: number) => ({ params: Promise.resolve({ id: String(id) }) });

async function review(user: SignedUser, id: number) {
  const response = await reviewRoute(await signedRequest(user, `http://127.0.0.1/api/rosters/${id}/review`), context(id));
  return { status: response.status, body: (await response.json()) as { review: PublishReview } & { error?: { code: string; message: string } } };
}

async function publish(user: SignedUser, id: number, body: Record<string, unknown>) {
  const response = await publishRoute(await signedRequest(user, `http://127.0.0.1/api/rosters/${id}/publish`, body), context(id));
  return { status: response.status, body: (await response.json()) as Record<string, any> };
}

async function revision(id: number) {
  return (await db.selectFrom("rosters").select("revision").where("id", "=", id).executeTakeFirstOrThrow()).revision;
}

async function published(week: string) {
  return db.selectFrom("rosters").selectAll().where("site_id", "=", siteId).where("starts_on", "=", week).where("status", "=", "published").execute();
}

async function mailJobs() {
  return (await db.selectFrom("jobs").select(["payload"]).where("kind", "=", ROSTER_MAIL_JOB).execute()).length;
}

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 3 });
  siteId = (await db.selectFrom("sites").select("id").orderBy("id").executeTakeFirstOrThrow()).id;
  [operations, guard, curator] = await Promise.all([userByEmail(db, "operations@example.org"), userByEmail(db, "guard@example.org"), userByEmail(db, "curator@example.org")]);
  await db.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "in", [WEEK, FULL_WEEK]).execute();
  draftId = (await buildDraftRoster(db, { siteId, startsOn: WEEK, userId: operations.id })).rosterId;
  // Take every shift off the week's first open day: every room stands empty that day.
  const first = await db.selectFrom("shifts").select("starts_at").where("roster_id", "=", draftId).orderBy("starts_at").executeTakeFirstOrThrow();
  const dayAfter = new Date(first.starts_at.getTime() + 20 * 3_600_000);
  await db.deleteFrom("shifts").where("roster_id", "=", draftId).where("starts_at", "<", dayAfter).execute();
}, 120_000);

afterAll(async () => {
  await db?.destroy();
});

describe("the demo museum's week", () => {
  it("keeps every high-risk room guarded in every open hour and nobody over contract plus accepted extra", async () => {
    const built = await buildDraftRoster(db, { siteId, startsOn: FULL_WEEK, userId: null });
    expect(built.violations).toBe(0);
    const { status, body } = await review(operations, built.rosterId);
    expect(status).toBe(200);
    expect(body.review.emptyRooms.filter((r) => r.risk === "high")).toEqual([]);
    for (const g of body.review.overContract) expect(g.plannedHours, g.name).toBeLessThanOrEqual(g.limitHours);
    // The demo contracts plus the default 8 extra hours stay within the 48 h legal maximum.
    for (const g of body.review.overContract) expect(g.limitHours).toBeLessThanOrEqual(48);
    // 8 high-value posts and 8 guards with the skill: the week cannot be fully staffed, and the
    // stored totals say how much at least stays unfilled, and why.
    const totals = (await db.selectFrom("rosters").select("totals").where("id", "=", built.rosterId).executeTakeFirstOrThrow()).totals!;
    expect(totals.unfilledLowerBound).toBeGreaterThan(0);
    expect(totals.unfilledPostHours).toBeGreaterThanOrEqual(totals.unfilledLowerBound!);
    expect(totals.unfilledBoundReason).toMatch(/high-value/);
  }, 120_000);
});

describe("publishing a week that leaves rooms empty", () => {
  it("shows the review only to those who may publish", async () => {
    expect((await review(guard, draftId)).status).toBe(403);
    expect((await review(curator, draftId)).status).toBe(403);
    const { status, body } = await review(operations, draftId);
    expect(status).toBe(200);
    expect(body.review.needsConfirmation).toBe(true);
    // High-risk rooms first: the word to type is the first empty high-risk room.
    expect(body.review.emptyRooms[0]).toMatchObject({ room: "Exhibition Hall East", risk: "high" });
    expect(body.review.confirmationWord).toBe("Exhibition Hall East");
    expect(body.review.emptyRooms.map((r) => r.room).sort()).toEqual(["Exhibition Hall East", "Exhibition Hall West", "Poster Corridor", "Textile Gallery"]);
    for (const room of body.review.emptyRooms) for (const h of room.hours) expect(Date.parse(h.end)).toBeGreaterThan(Date.parse(h.start));
    expect((await review(operations, 2_000_000_000)).status).toBe(404);
  });

  it("the staffing page's view lists the empty rooms by stretch and every guard's week", async () => {
    const view = (await rosterView(db, draftId))!;
    expect([...new Set(view.emptyRooms.map((e) => e.room))].sort()).toEqual(["Exhibition Hall East", "Exhibition Hall West", "Poster Corridor", "Textile Gallery"]);
    expect(view.emptyRooms[0]).toMatchObject({ room: "Exhibition Hall East", risk: "high" });
    const guards = await db.selectFrom("guards").select(["id", "contract_hours"]).where("site_id", "=", siteId).execute();
    expect(view.guardWeeks.map((g) => g.guardId).sort((a, b) => a - b)).toEqual(guards.map((g) => g.id).sort((a, b) => a - b));
    for (const g of view.guardWeeks) {
      expect(g.contractHours).toBe(Number(guards.find((x) => x.id === g.guardId)!.contract_hours));
      expect(g.plannedHours).toBeLessThanOrEqual(g.limitHours);
      expect(g.flags.includes("over contract")).toBe(g.plannedHours > g.contractHours);
      expect(g.daysInARow).toBeLessThanOrEqual(7);
    }
    // Paid hours of the guards add up to the shifts' paid time.
    const shifts = await db.selectFrom("shifts").select(["starts_at", "ends_at", "breaks"]).where("roster_id", "=", draftId).execute();
    const paid = shifts.reduce((sum, s) => sum + (s.ends_at.getTime() - s.starts_at.getTime() - s.breaks.reduce((b, x) => b + Date.parse(x.end) - Date.parse(x.start), 0)), 0) / 3_600_000;
    expect(view.guardWeeks.reduce((sum, g) => sum + g.plannedHours, 0)).toBeCloseTo(paid, 1);
  });

  it("refuses without the typed room name and a note, publishing and mailing nothing", async () => {
    const rev = await revision(draftId);
    const jobsBefore = await mailJobs();
    const none = await publish(operations, draftId, { revision: rev });
    expect(none.status).toBe(422);
    expect(none.body.error.code).toBe("confirmation-needed");
    expect(none.body.error.message).toMatch(/Exhibition Hall East \(high risk\).*type "Exhibition Hall East" and give a note/);
    expect(none.body.error.review.emptyRooms.length).toBe(4);
    const wrong = await publish(operations, draftId, { revision: rev, confirmation: "Textile Gallery", note: "short-staffed" });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.field).toBe("confirmation");
    const noNote = await publish(operations, draftId, { revision: rev, confirmation: "Exhibition Hall East", note: "   " });
    expect(noNote.status).toBe(422);
    expect(noNote.body.error.field).toBe("note");
    const tooLong = await publish(operations, draftId, { revision: rev, confirmation: "x".repeat(201) });
    expect(tooLong.status).toBe(422);
    expect(await published(WEEK)).toEqual([]);
    expect(await mailJobs()).toBe(jobsBefore);
  });

  it("publishes with the room's name typed (any case) and a note, and keeps both with the review", async () => {
    const rev = await revision(draftId);
    const answer = await publish(operations, draftId, { revision: rev, confirmation: "  exhibition hall east ", note: "Hall East closed to visitors on Tuesday; agreed with the director." });
    expect(answer.status).toBe(201);
    // The mail job is the mail tests' business: take it off the queue at once, so no other test's
    // worker picks it up.
    await db.deleteFrom("jobs").where("id", "=", answer.body.mailJob.id).where("status", "=", "queued").execute();
    const [version] = await published(WEEK);
    expect(version).toBeDefined();
    expect(version!.publish_confirmation).toBe("exhibition hall east");
    expect(version!.publish_note).toBe("Hall East closed to visitors on Tuesday; agreed with the director.");
    expect(version!.publish_review).toMatchObject({ revision: rev, needsConfirmation: true, confirmationWord: "Exhibition Hall East" });
    expect(version!.publish_review!.emptyRooms.length).toBe(4);
  });
});
