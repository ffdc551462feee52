// colleaguesOnFloor against the real PostgreSQL: who else is on the guard's floor during a shift,
// from the latest published version only (never a superseded version or a draft), at the same time
// as one of the guard's own stretches there (not during the guard's break), never another floor.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { colleaguesOnFloor, currentShiftsOfGuard } from "@/db/queries/rosters";
import { calendarShifts } from "@/app/(signed-in)/my-shifts/calendar-shifts";
import { requireDatabaseUrl } from "./support/database";
import { mondayAhead } from "./support/rosters";
import { postOf, publishWeek } from "./support/published-week";

// A week far ahead that no other test of this database builds or publishes.
const WEEK = mondayAhead(133);
const TUESDAY = new Date(Date.parse(`${WEEK}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);
const at = (hhmm: string) => new Date(`${TUESDAY}T${hhmm}:00Z`);
const stretch = (post: string, start: string, end: string) => ({ post, start: at(start).toISOString(), end: at(end).toISOString() });

let db: Kysely<Database>;
let mara: number;
let others: { id: number; name: string }[];
let rooms: Record<"textile" | "furniture" | "glass", { id: number; name: string; floor: string }>;
let siteId: number;

async function room(name: string) {
  return db
    .selectFrom("rooms")
    .innerJoin("floors", "floors.id", "rooms.floor_id")
    .select(["rooms.id", "rooms.name", "floors.name as floor"])
    .where("rooms.name", "=", name)
    .executeTakeFirstOrThrow();
}

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  const guards = await db.selectFrom("guards").leftJoin("users", "users.id", "guards.user_id").select(["guards.id", "guards.name", "guards.site_id", "users.email"]).orderBy("guards.id").execute();
  const maraRow = guards.find((g) => g.email === "guard@example.org")!;
  mara = maraRow.id;
  siteId = maraRow.site_id;
  others = guards.filter((g) => g.id !== mara && g.site_id === siteId).slice(0, 6);
  expect(others).toHaveLength(6);
  // Textile and Furniture Gallery are on the ground floor, the Glass Gallery on the first (db/seed/museum.ts).
  rooms = { textile: await room("Textile Gallery"), furniture: await room("Furniture Gallery"), glass: await room("Glass Gallery") };
  expect(rooms.textile.floor).toBe(rooms.furniture.floor);
  expect(rooms.glass.floor).not.toBe(rooms.textile.floor);

  const posts = Object.values(rooms).map((r) => ({ id: postOf(r.id), room: r.name }));
  const [x, y, z, v, w, u] = others;
  // Mara: Textile 10–13, break 13–13:30, Furniture 13:30–18.
  const maraShift = {
    guardId: mara,
    starts_at: at("10:00"),
    ends_at: at("18:00"),
    segments: [stretch(postOf(rooms.textile.id), "10:00", "13:00"), stretch(postOf(rooms.furniture.id), "13:30", "18:00")],
    breaks: [{ start: at("13:00").toISOString(), end: at("13:30").toISOString() }],
  };
  const v1 = await publishWeek(db, { siteId, startsOn: WEEK, version: 1, posts }, [
    maraShift,
    // Only in version 1, which version 2 supersedes.
    { guardId: w!.id, starts_at: at("10:00"), ends_at: at("18:00"), segments: [stretch(postOf(rooms.textile.id, 2), "10:00", "18:00")], breaks: [] },
  ]);
  await publishWeek(db, { siteId, startsOn: WEEK, version: 2, supersedes: v1, posts }, [
    maraShift,
    // Same floor, overlapping: listed, cut to Mara's shift.
    { guardId: x!.id, starts_at: at("09:00"), ends_at: at("17:00"), segments: [stretch(postOf(rooms.furniture.id, 2), "09:00", "17:00")], breaks: [] },
    // Another floor at the same time.
    { guardId: y!.id, starts_at: at("10:00"), ends_at: at("18:00"), segments: [stretch(postOf(rooms.glass.id), "10:00", "18:00")], breaks: [] },
    // Same floor, after Mara has gone.
    { guardId: z!.id, starts_at: at("18:00"), ends_at: at("22:00"), segments: [stretch(postOf(rooms.textile.id), "18:00", "22:00")], breaks: [] },
    // Same floor, but only while Mara is on her break.
    { guardId: v!.id, starts_at: at("13:05"), ends_at: at("13:25"), segments: [stretch(postOf(rooms.textile.id), "13:05", "13:25")], breaks: [] },
  ]);
  // A draft of the same week: drafts may still change, so they never count.
  const draft = await db.insertInto("rosters").values({ site_id: siteId, starts_on: WEEK, days: 7, status: "draft", unfilled: "[]", violations: "[]" }).returning("id").executeTakeFirstOrThrow();
  await db
    .insertInto("shifts")
    .values({ roster_id: draft.id, guard_id: u!.id, starts_at: at("10:00"), ends_at: at("18:00"), segments: JSON.stringify([stretch(postOf(rooms.textile.id, 3), "10:00", "18:00")]), breaks: "[]" })
    .execute();
});

afterAll(async () => {
  await db?.destroy();
});

describe("colleaguesOnFloor", () => {
  it("lists only the guard on the same floor at the same time, from the latest published version", async () => {
    const shifts = (await currentShiftsOfGuard(db, mara, at("00:00"))).filter((s) => s.starts_on === WEEK);
    expect(shifts).toHaveLength(1);
    expect(shifts[0]!.roster_version).toBe(2);
    const rows = await colleaguesOnFloor(db, mara, shifts.map((s) => s.id));
    expect(rows).toEqual([
      {
        shift_id: shifts[0]!.id,
        guard_id: others[0]!.id,
        guard_name: others[0]!.name,
        floor_name: rooms.furniture.floor,
        room_name: rooms.furniture.name,
        post: postOf(rooms.furniture.id, 2),
        starts_at: at("10:00"),
        ends_at: at("17:00"),
      },
    ]);
  });

  it("answers nothing for shifts of another guard or no shifts at all", async () => {
    const shifts = (await currentShiftsOfGuard(db, mara, at("00:00"))).filter((s) => s.starts_on === WEEK);
    expect(await colleaguesOnFloor(db, others[1]!.id, shifts.map((s) => s.id))).toEqual([]);
    expect(await colleaguesOnFloor(db, mara, [])).toEqual([]);
  });

  it("gives the calendar each shift with its posts, breaks and the colleague named by room and post", async () => {
    const shifts = (await currentShiftsOfGuard(db, mara, at("00:00"))).filter((s) => s.starts_on === WEEK);
    const names = new Map([[postOf(rooms.textile.id), rooms.textile.name], [postOf(rooms.furniture.id), rooms.furniture.name]]);
    const [shift] = calendarShifts(shifts, names, await colleaguesOnFloor(db, mara, shifts.map((s) => s.id)));
    expect(shift!.rooms).toEqual([rooms.textile.name, rooms.furniture.name]);
    expect(shift!.posts.map((p) => p.label)).toEqual([`${rooms.textile.name} · post 1`, `${rooms.furniture.name} · post 1`]);
    expect(shift!.breaks).toEqual([{ start: at("13:00").toISOString(), end: at("13:30").toISOString() }]);
    expect(shift!.colleagues).toEqual([
      { name: others[0]!.name, floors: [rooms.furniture.floor], stretches: [{ label: `${rooms.furniture.name} · post 2`, start: at("10:00").toISOString(), end: at("17:00").toISOString() }] },
    ]);
  });
});
