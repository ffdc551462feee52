// Rosters, their shifts and versions, guards' calendar tokens and time-off requests.
// A week has at most one draft (edited, rebuilt) and any number of published versions, 1, 2, ...;
// the latest published version is the one that counts for guards.
import { sql, type Kysely, type Transaction } from "kysely";
import type { Database, Roster, RosterTotals, RosterUnfilled, RosterViolation, TimeOffStatus } from "../schema";
import { toJson } from "../schema";

type Handle = Kysely<Database> | Transaction<Database>;

export async function siteById(handle: Handle, siteId: number) {
  return (await handle.selectFrom("sites").selectAll().where("id", "=", siteId).executeTakeFirst()) ?? null;
}

/** The guards a new roster staffs: the site's guards still on the staff (not deactivated). */
export async function activeGuardsOfSite(handle: Handle, siteId: number) {
  return handle
    .selectFrom("guards")
    .select(["id", "name", "email", "contract_hours", "max_hours", "accepted_extra_hours", "skills", "user_id"])
    .where("site_id", "=", siteId)
    .where("active", "=", true)
    .orderBy("id")
    .execute();
}

/** Every guard of the site, deactivated ones too (names in rosters and their history). */
export async function guardsOfSite(handle: Handle, siteId: number) {
  return handle
    .selectFrom("guards")
    .select(["id", "name", "email", "contract_hours", "max_hours", "accepted_extra_hours", "skills", "user_id"])
    .where("site_id", "=", siteId)
    .orderBy("id")
    .execute();
}

/** Approved time off of the site's guards overlapping [from, to] (inclusive dates). */
export async function approvedTimeOff(handle: Handle, siteId: number, from: string, to: string) {
  return handle
    .selectFrom("time_off")
    .innerJoin("guards", "guards.id", "time_off.guard_id")
    .select(["time_off.guard_id", "time_off.starts_on", "time_off.ends_on"])
    .where("guards.site_id", "=", siteId)
    .where("time_off.status", "=", "approved")
    .where("time_off.starts_on", "<=", to)
    .where("time_off.ends_on", ">=", from)
    .orderBy("time_off.starts_on")
    .execute();
}

export async function rosterById(handle: Handle, rosterId: number): Promise<Roster | null> {
  return (await handle.selectFrom("rosters").selectAll().where("id", "=", rosterId).executeTakeFirst()) ?? null;
}

export async function draftOfWeek(handle: Handle, siteId: number, startsOn: string): Promise<Roster | null> {
  return (
    (await handle
      .selectFrom("rosters")
      .selectAll()
      .where("site_id", "=", siteId)
      .where("starts_on", "=", startsOn)
      .where("status", "=", "draft")
      .executeTakeFirst()) ?? null
  );
}

/** Published versions of a week, newest first. */
export async function publishedVersionsOfWeek(handle: Handle, siteId: number, startsOn: string) {
  return handle
    .selectFrom("rosters")
    .select(["id", "version", "published_at", "supersedes", "revision", "draft_revision", "publish_note", "publish_confirmation", "published_by"])
    .where("site_id", "=", siteId)
    .where("starts_on", "=", startsOn)
    .where("status", "=", "published")
    .orderBy("version", "desc")
    .execute();
}

/** The published version made from a revision of the week's draft, if any. */
export async function publishedVersionOfRevision(handle: Handle, siteId: number, startsOn: string, revision: number) {
  return (
    (await handle
      .selectFrom("rosters")
      .select(["id", "version"])
      .where("site_id", "=", siteId)
      .where("starts_on", "=", startsOn)
      .where("status", "=", "published")
      .where("draft_revision", "=", revision)
      .executeTakeFirst()) ?? null
  );
}

/** The published version made from a revision of the draft with this id, if any. */
export async function publishedVersionOfRevisionOfRoster(handle: Handle, draftId: number, revision: number) {
  return (
    (await handle
      .selectFrom("rosters as draft")
      .innerJoin("rosters as published", (join) =>
        join.onRef("published.site_id", "=", "draft.site_id").onRef("published.starts_on", "=", "draft.starts_on"),
      )
      .select(["published.id", "published.version"])
      .where("draft.id", "=", draftId)
      .where("published.status", "=", "published")
      .where("published.draft_revision", "=", revision)
      .executeTakeFirst()) ?? null
  );
}

/** Every roster of a site, newest week first, with its shift count. */
export async function rostersOfSite(handle: Handle, siteId: number) {
  return handle
    .selectFrom("rosters")
    .leftJoin("shifts", "shifts.roster_id", "rosters.id")
    .select((eb) => [
      "rosters.id",
      "rosters.starts_on",
      "rosters.days",
      "rosters.status",
      "rosters.version",
      "rosters.revision",
      "rosters.published_at",
      "rosters.supersedes",
      "rosters.draft_revision",
      "rosters.publish_note",
      eb.fn.count<string>("shifts.id").as("shifts"),
    ])
    .where("rosters.site_id", "=", siteId)
    .groupBy("rosters.id")
    .orderBy("rosters.starts_on", "desc")
    .orderBy("rosters.status")
    .orderBy("rosters.version", "desc")
    .execute();
}

export async function shiftsOfRoster(handle: Handle, rosterId: number) {
  return handle
    .selectFrom("shifts")
    .innerJoin("guards", "guards.id", "shifts.guard_id")
    .select(["shifts.id", "shifts.guard_id", "guards.name as guard_name", "shifts.starts_at", "shifts.ends_at", "shifts.segments", "shifts.breaks"])
    .where("shifts.roster_id", "=", rosterId)
    .orderBy("shifts.starts_at")
    .orderBy("shifts.guard_id")
    .execute();
}

export interface DraftContent {
  siteId: number;
  startsOn: string;
  days: number;
  scenario: unknown;
  shifts: { guard_id: number; starts_at: Date; ends_at: Date; segments: unknown[]; breaks: unknown[] }[];
  unfilled: RosterUnfilled[];
  totals: RosterTotals;
  violations: RosterViolation[];
  createdBy: number | null;
}

/**
 * Replaces the content of the week's draft (or creates it); call inside a transaction. The draft
 * keeps its id and its revision goes up, so a page still holding the old draft gets a 409 when it
 * tries to edit or publish it.
 */
export async function replaceDraft(trx: Transaction<Database>, content: DraftContent): Promise<Roster> {
  const values = {
    days: content.days,
    scenario: toJson(content.scenario),
    unfilled: toJson(content.unfilled),
    totals: toJson(content.totals),
    violations: toJson(content.violations),
    created_by: content.createdBy,
    created_at: sql<Date>`now()`,
  };
  const existing = await trx
    .selectFrom("rosters")
    .select("id")
    .where("site_id", "=", content.siteId)
    .where("starts_on", "=", content.startsOn)
    .where("status", "=", "draft")
    .forUpdate()
    .executeTakeFirst();
  let roster: Roster;
  if (existing) {
    await trx.deleteFrom("shifts").where("roster_id", "=", existing.id).execute();
    roster = await trx
      .updateTable("rosters")
      .set({ ...values, revision: sql<number>`revision + 1` })
      .where("id", "=", existing.id)
      .returningAll()
      .executeTakeFirstOrThrow();
  } else {
    roster = await trx
      .insertInto("rosters")
      .values({ ...values, site_id: content.siteId, starts_on: content.startsOn, status: "draft" })
      .returningAll()
      .executeTakeFirstOrThrow();
  }
  await insertShifts(trx, roster.id, content.shifts);
  return roster;
}

export async function insertShifts(trx: Handle, rosterId: number, shifts: DraftContent["shifts"]): Promise<void> {
  if (shifts.length === 0) return;
  await trx
    .insertInto("shifts")
    .values(
      shifts.map((s) => ({
        roster_id: rosterId,
        guard_id: s.guard_id,
        starts_at: s.starts_at,
        ends_at: s.ends_at,
        segments: toJson(s.segments),
        breaks: toJson(s.breaks),
      })),
    )
    .execute();
}

/** The latest published version of every week of a site (the versions guards go by). */
export function latestPublishedRosters(handle: Handle) {
  return handle
    .selectFrom("rosters")
    .selectAll()
    .where("status", "=", "published")
    .where(({ not, exists, selectFrom }) =>
      not(
        exists(
          selectFrom("rosters as later")
            .select("later.id")
            .whereRef("later.site_id", "=", "rosters.site_id")
            .whereRef("later.starts_on", "=", "rosters.starts_on")
            .where("later.status", "=", "published")
            .whereRef("later.version", ">", "rosters.version"),
        ),
      ),
    );
}

/**
 * A guard's shifts in the latest published version of each week (a draft may still change under
 * them): the one query home, My shifts and the calendar feed build on.
 */
export function publishedShiftsOfGuard(handle: Handle, guardId: number) {
  return handle
    .selectFrom("shifts")
    .innerJoin(latestPublishedRosters(handle).as("roster"), "roster.id", "shifts.roster_id")
    .where("shifts.guard_id", "=", guardId);
}

/** The columns of a guard's shift over publishedShiftsOfGuard, shared by every view of them. */
export const GUARD_SHIFT_COLUMNS = [
  "shifts.id",
  "shifts.starts_at",
  "shifts.ends_at",
  "shifts.segments",
  "shifts.breaks",
  "roster.id as roster_id",
  "roster.version as roster_version",
  "roster.starts_on",
] as const;

/** A guard's shifts in the latest published version of each week, ending after `from`, earliest first. */
export async function currentShiftsOfGuard(handle: Handle, guardId: number, from?: Date) {
  let query = publishedShiftsOfGuard(handle, guardId)
    .innerJoin("sites", "sites.id", "roster.site_id")
    .select([
      ...GUARD_SHIFT_COLUMNS,
      "sites.name as site_name",
      "sites.time_zone",
    ]);
  if (from) query = query.where("shifts.ends_at", ">", from);
  return query.orderBy("shifts.starts_at").execute();
}

/** A stretch another guard is at a post on the same floor while the guard is there too. */
export interface FloorColleagueStretch {
  /** The guard's own shift this stretch overlaps. */
  shift_id: number;
  guard_id: number;
  guard_name: string;
  floor_name: string;
  room_name: string;
  post: string;
  /** The other guard's stretch, cut to the guard's own shift. */
  starts_at: Date;
  ends_at: Date;
}

/**
 * Who else is on the floor during the guard's shifts `shiftIds`: other guards' post stretches in
 * rooms on a floor where the guard has a stretch at the same time, earliest first. Only the latest
 * published version of each week counts. A post id names its room ("R12-P1" is in room 12).
 */
export async function colleaguesOnFloor(handle: Handle, guardId: number, shiftIds: readonly number[]): Promise<FloorColleagueStretch[]> {
  if (shiftIds.length === 0) return [];
  const latest = latestPublishedRosters(handle).clearSelect().select("rosters.id");
  const { rows } = await sql<FloorColleagueStretch>`
    with latest as ${latest},
    own as (
      select shifts.id, shifts.starts_at, shifts.ends_at
      from shifts join latest on latest.id = shifts.roster_id
      where shifts.guard_id = ${guardId} and shifts.id = any(${[...shiftIds]}::int[])
    ),
    stretch as (
      select shifts.id as shift_id, shifts.guard_id, segment.value ->> 'post' as post,
        (segment.value ->> 'start')::timestamptz as starts_at, (segment.value ->> 'end')::timestamptz as ends_at,
        rooms.name as room_name, rooms.floor_id
      from shifts
      join latest on latest.id = shifts.roster_id
      cross join lateral jsonb_array_elements(shifts.segments) as segment(value)
      join rooms on rooms.id = substring(segment.value ->> 'post' from '^R([0-9]{1,9})-P[0-9]+$')::int
      where shifts.starts_at < (select max(ends_at) from own) and shifts.ends_at > (select min(starts_at) from own)
    )
    select distinct mine.shift_id, other.guard_id, guards.name as guard_name, floors.name as floor_name, other.room_name, other.post,
      greatest(own.starts_at, other.starts_at) as starts_at, least(own.ends_at, other.ends_at) as ends_at
    from stretch mine
    join own on own.id = mine.shift_id
    join stretch other on other.floor_id = mine.floor_id and other.guard_id <> mine.guard_id
      and other.starts_at < mine.ends_at and other.ends_at > mine.starts_at
    join guards on guards.id = other.guard_id
    join floors on floors.id = mine.floor_id
    order by shift_id, starts_at, guard_name, post`.execute(handle);
  return rows;
}

export async function guardByUserId(handle: Handle, userId: number) {
  return (
    (await handle
      .selectFrom("guards")
      .select(["id", "name", "email", "site_id", "calendar_token"])
      .where("user_id", "=", userId)
      .executeTakeFirst()) ?? null
  );
}

export async function guardByCalendarToken(handle: Handle, token: string) {
  return (
    (await handle
      .selectFrom("guards")
      .select(["id", "name", "email", "site_id"])
      .where("calendar_token", "=", token)
      .executeTakeFirst()) ?? null
  );
}

/** Gives the guard a new random calendar token (the column's default); the old feed address stops working. */
export async function resetCalendarToken(handle: Handle, guardId: number): Promise<string> {
  const row = await handle
    .updateTable("guards")
    .set({ calendar_token: sql<string>`default` })
    .where("id", "=", guardId)
    .returning("calendar_token")
    .executeTakeFirstOrThrow();
  return row.calendar_token;
}

export async function timeOffOfGuard(handle: Handle, guardId: number) {
  return handle
    .selectFrom("time_off")
    .select(["id", "starts_on", "ends_on", "note", "status", "decided_at", "created_at"])
    .where("guard_id", "=", guardId)
    .orderBy("starts_on", "desc")
    .execute();
}

/** Time-off requests of a site's guards, open requests first, then by start. */
export async function timeOffOfSite(handle: Handle, siteId: number) {
  return handle
    .selectFrom("time_off")
    .innerJoin("guards", "guards.id", "time_off.guard_id")
    .select(["time_off.id", "time_off.guard_id", "guards.name as guard_name", "time_off.starts_on", "time_off.ends_on", "time_off.note", "time_off.status", "time_off.decided_at", "time_off.created_at"])
    .where("guards.site_id", "=", siteId)
    .orderBy(sql`time_off.status = 'requested'`, "desc")
    .orderBy("time_off.starts_on")
    .execute();
}

export async function insertTimeOff(handle: Handle, request: { guardId: number; startsOn: string; endsOn: string; note: string }) {
  return handle
    .insertInto("time_off")
    .values({ guard_id: request.guardId, starts_on: request.startsOn, ends_on: request.endsOn, note: request.note })
    .returning(["id", "guard_id", "starts_on", "ends_on", "note", "status", "created_at"])
    .executeTakeFirstOrThrow();
}

/** Approves or declines an open request; null when there is no such open request. */
export async function decideTimeOff(handle: Handle, id: number, status: Exclude<TimeOffStatus, "requested">, userId: number) {
  return (
    (await handle
      .updateTable("time_off")
      .set({ status, decided_by: userId, decided_at: sql<Date>`now()` })
      .where("id", "=", id)
      .where("status", "=", "requested")
      .returning(["id", "guard_id", "starts_on", "ends_on", "note", "status", "decided_at"])
      .executeTakeFirst()) ?? null
  );
}
