// The week builder's change of one segment (POST /api/rosters/[id]/adjust), through the route
// handler in-process on the real PostgreSQL: a move that keeps the labour rules is saved (totals
// and unfilled hours follow); one that breaks a rule is refused naming it and writes nothing, or is
// kept with an override note stored with who and when; a stale revision answers 409, a published
// roster is refused, other roles get 403. Candidate changes are found with the same pure checks
// the browser runs (lib/rosters/edit-check.ts), so the test does not depend on one demo week.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the modules.
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { guardsOfSite, shiftsOfRoster } from "@/db/queries/rosters";
import { GET as builderRoute, POST as adjustRoute } from "@/app/api/rosters/[id]/adjust/route";
import { buildDraftRoster } from "@/lib/rosters/build";
import { rosterScenario } from "@/lib/rosters/edit";
import { checkAdjust, editCheckContext, overridable, type AdjustChange } from "@/lib/rosters/edit-check";
import { guardKey } from "@/lib/rosters/scenario";
import { postLabels } from "@/lib/rosters/shift-events";
import { engineRoster } from "@/lib/rosters/stored";
import { paidMs } from "@/lib/scheduling/roster";
import { requireDatabaseUrl } from "./support/database";
import { mondayAhead, publishRosterDirectly } from "./support/rosters";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

/** Twenty weeks ahead: clear of the other roster tests' weeks. */
const WEEK = mondayAhead(140);
const PUBLISHED_WEEK = mondayAhead(168);
const HOUR = 3_600_000;
let db: Kysely<Database>;
let siteId: number;
let draftId: number;
let operations: SignedUser;
let guard: SignedUser;
let curator: SignedUser;

const iso = (ms: number) => new Date(ms).toISOString();
const context = (id = draftId) => ({ params: Promise.resolve({ id: String(id) }) });

async function state() {
  const roster = await db.selectFrom("rosters").selectAll().where("id", "=", draftId).executeTakeFirstOrThrow();
  const rows = await shiftsOfRoster(db, draftId);
  const guards = await guardsOfSite(db, siteId);
  const edit = editCheckContext(rosterScenario(roster), engineRoster({ shifts: rows, unfilled: roster.unfilled }), new Map(guards.map((g) => [g.id, g.name])), postLabels(roster.scenario));
  return { roster, rows, edit };
}

async function adjust(user: SignedUser, body: Record<string, unknown>, id = draftId) {
  const response = await adjustRoute(await signedRequest(user, `http://127.0.0.1/api/rosters/${id}/adjust`, body), context(id));
  return { status: response.status, body: (await response.json()) as Record<string, any> };
}

const bodyOf = (revision: number, change: AdjustChange, overrideNote?: string) => ({
  revision,
  from: change.from,
  start: change.start,
  end: change.end,
  toGuardId: change.toGuardId,
  ...(overrideNote ? { overrideNote } : {}),
});

/** A shorter last segment of a long shift: keeps every rule (the hour left becomes unfilled). */
function keepingMove(edit: Awaited<ReturnType<typeof state>>["edit"]): AdjustChange {
  const slot = edit.scenario.rules.slotMinutes * 60_000;
  for (const shift of edit.before.shifts) {
    const last = [...shift.segments].sort((a, b) => b.start - a.start)[0]!;
    if (last.end - last.start < 2 * slot || shift.end - shift.start < (edit.scenario.rules.minShiftHours + 1) * HOUR) continue;
    const guardId = Number(shift.guard.slice(1));
    const change = { from: { guardId, post: last.post, start: iso(last.start) }, start: iso(last.start), end: iso(last.end - slot), toGuardId: guardId };
    if (checkAdjust(edit, change).ok) return change;
  }
  throw new Error("no segment of the demo week can be shortened within the rules");
}

/** A segment given to the busiest guards first: breaks a labour rule a note may override (weekly hours, rest, …). */
function breakingMove(edit: Awaited<ReturnType<typeof state>>["edit"]): { change: AdjustChange; rules: string[] } {
  const paid = new Map<string, number>();
  for (const s of edit.before.shifts) paid.set(s.guard, (paid.get(s.guard) ?? 0) + paidMs(s, edit.scenario.rules.paidBreaks));
  const busiest = [...edit.scenario.guards].sort((a, b) => (paid.get(b.id) ?? 0) - (paid.get(a.id) ?? 0));
  const preferred = ["weekly-max", "contract-hours", "rest"];
  let fallback: { change: AdjustChange; rules: string[] } | null = null;
  for (const to of busiest.slice(0, 6))
    for (const shift of edit.before.shifts) {
      if (shift.guard === to.id) continue;
      for (const s of shift.segments) {
        const change = { from: { guardId: Number(shift.guard.slice(1)), post: s.post, start: iso(s.start) }, start: iso(s.start), end: iso(s.end), toGuardId: Number(to.id.slice(1)) };
        const check = checkAdjust(edit, change);
        if (check.ok || check.code !== "breaks-rule" || !overridable(check.violations)) continue;
        const rules = [...new Set(check.violations.map((v) => v.rule))];
        if (rules.some((r) => preferred.includes(r))) return { change, rules };
        fallback ??= { change, rules };
      }
    }
  if (!fallback) throw new Error("no change of the demo week breaks only rules a note may override");
  return fallback;
}

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 3 });
  siteId = (await db.selectFrom("sites").select("id").orderBy("id").executeTakeFirstOrThrow()).id;
  [operations, guard, curator] = await Promise.all([userByEmail(db, "operations@example.org"), userByEmail(db, "guard@example.org"), userByEmail(db, "curator@example.org")]);
  await db.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "in", [WEEK, PUBLISHED_WEEK]).execute();
  draftId = (await buildDraftRoster(db, { siteId, startsOn: WEEK, userId: operations.id })).rosterId;
}, 120_000);

afterAll(async () => {
  await db?.destroy();
});

describe("adjusting a draft in the week builder", () => {
  it("saves a move that keeps the rules: the segment, the unfilled hour and the totals follow", async () => {
    const { roster, edit } = await state();
    const change = keepingMove(edit);
    const answer = await adjust(operations, bodyOf(roster.revision, change));
    expect(answer.status, JSON.stringify(answer.body)).toBe(200);
    expect(answer.body.revision).toBe(roster.revision + 1);
    const after = await state();
    expect(after.roster.revision).toBe(roster.revision + 1);
    const mine = after.edit.before.shifts.filter((s) => s.guard === guardKey(change.from.guardId)).flatMap((s) => s.segments);
    expect(mine).toContainEqual({ post: change.from.post, start: Date.parse(change.start), end: Date.parse(change.end) });
    // The hour given up is listed unfilled with the builder's reason, and paid hours drop by it.
    expect(after.roster.unfilled.some((u) => u.post === change.from.post && Date.parse(u.start) === Date.parse(change.end) && /week builder/.test(u.reason))).toBe(true);
    const slotHours = edit.scenario.rules.slotMinutes / 60;
    expect(after.roster.totals!.paidHours).toBeCloseTo(roster.totals!.paidHours - slotHours, 5);
    expect(after.roster.totals!.unfilledPostHours).toBeCloseTo(roster.totals!.unfilledPostHours + slotHours, 5);
    expect(answer.body.roster.totals.paidHours).toBeCloseTo(after.roster.totals!.paidHours, 5);
    const audit = await db.selectFrom("audit_events").select(["action", "actor_id"]).where("action", "=", "roster.adjust").where("subject_id", "=", draftId).execute();
    expect(audit.some((a) => a.actor_id === operations.id)).toBe(true);
  }, 60_000);

  it("refuses a move that breaks a rule, naming the rule, and changes nothing", async () => {
    const { roster, rows, edit } = await state();
    const { change, rules } = breakingMove(edit);
    const answer = await adjust(operations, bodyOf(roster.revision, change));
    expect(answer.status).toBe(422);
    expect(answer.body.error.code).toBe("breaks-rule");
    for (const rule of rules) expect(answer.body.error.message).toContain(`(rule ${rule})`);
    const after = await state();
    expect(after.roster.revision).toBe(roster.revision);
    expect(after.rows.map((r) => [r.guard_id, r.segments])).toEqual(rows.map((r) => [r.guard_id, r.segments]));
    expect(await db.selectFrom("roster_overrides").select("id").where("roster_id", "=", draftId).execute()).toEqual([]);
  }, 120_000);

  it("keeps the same move with an override note, stored with who and when, and lists it", async () => {
    const { roster, edit } = await state();
    const { change, rules } = breakingMove(edit);
    const note = "Covering for a colleague at short notice; agreed with the guard.";
    const before = Date.now();
    const answer = await adjust(operations, bodyOf(roster.revision, change, note));
    expect(answer.status, JSON.stringify(answer.body)).toBe(200);
    const rows = await db.selectFrom("roster_overrides").selectAll().where("roster_id", "=", draftId).execute();
    expect(rows).toHaveLength(1);
    const kept = rows[0]!;
    expect(kept.note).toBe(note);
    expect(kept.created_by).toBe(operations.id);
    expect(kept.created_by_name).toBe(operations.name);
    expect(kept.created_at.getTime()).toBeGreaterThanOrEqual(before - 60_000);
    expect(kept.created_at.getTime()).toBeLessThanOrEqual(Date.now() + 60_000);
    expect([...kept.rules].sort()).toEqual([...rules].sort());
    expect(kept.revision).toBe(roster.revision + 1);
    // The segment moved to the other guard; the accepted violations do not block publishing.
    const after = await state();
    // A stretch touching one of the guard's own at the same post joins it, so look for one covering it.
    const theirs = after.edit.before.shifts.filter((s) => s.guard === guardKey(change.toGuardId)).flatMap((s) => s.segments);
    expect(theirs.some((x) => x.post === change.from.post && x.start <= Date.parse(change.start) && x.end >= Date.parse(change.end))).toBe(true);
    const accepted = new Set(kept.violations.map((v) => `${v.rule}|${v.message}`));
    expect(after.roster.violations.filter((v) => accepted.has(`${v.rule}|${v.message}`))).toEqual([]);
    const listed = await builderRoute(await signedRequest(operations, `http://127.0.0.1/api/rosters/${draftId}/adjust`), context());
    const { builder } = (await listed.json()) as { builder: { overrides: { note: string; by: string; at: string; rules: string[] }[] } };
    expect(builder.overrides).toEqual([expect.objectContaining({ note, by: operations.name, rules: kept.rules })]);
  }, 120_000);

  it("answers 409 for a stale revision and writes nothing", async () => {
    const { roster, edit } = await state();
    const change = keepingMove(edit);
    const answer = await adjust(operations, bodyOf(roster.revision - 1, change));
    expect(answer.status).toBe(409);
    expect(answer.body.error.code).toBe("roster-changed");
    expect((await state()).roster.revision).toBe(roster.revision);
  }, 60_000);

  it("refuses a published roster", async () => {
    const { rows, edit } = await state();
    const change = keepingMove(edit);
    const publishedId = await publishRosterDirectly(db, { siteId, startsOn: PUBLISHED_WEEK, version: 1 }, rows.slice(0, 1).map((r) => ({ guardId: r.guard_id, starts_at: r.starts_at, ends_at: r.ends_at })));
    const answer = await adjust(operations, bodyOf(1, change), publishedId);
    expect(answer.status).toBe(409);
    expect(answer.body.error.code).toBe("not-a-draft");
  }, 60_000);

  it("refuses guards and curators (403) before reading the body", async () => {
    const { roster, edit } = await state();
    const change = keepingMove(edit);
    expect((await adjust(guard, bodyOf(roster.revision, change))).status).toBe(403);
    expect((await adjust(curator, bodyOf(roster.revision, change))).status).toBe(403);
    expect((await state()).roster.revision).toBe(roster.revision);
  }, 60_000);

  it("refuses an override note over 500 characters naming the field", async () => {
    const { roster, edit } = await state();
    const answer = await adjust(operations, bodyOf(roster.revision, keepingMove(edit), "x".repeat(501)));
    expect(answer.status).toBe(422);
    expect(answer.body.error.field).toBe("overrideNote");
  }, 60_000);
});
