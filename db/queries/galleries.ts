// Sites, floors and rooms as curators run them: the galleries tree in page order, create, rename,
// reorder, delete (refused while a room is in an exhibition or has an approved plan, unless the
// caller confirms), and each room's outline versions (room_versions, written by a trigger).
import { sql, type Kysely, type Transaction } from "kysely";
import { toJson, type Database, type OpeningHours } from "../schema";
import type { Ring } from "../../lib/geometry/types";

type Db = Kysely<Database> | Transaction<Database>;

/** Marks the transaction's room writes as `userId`'s (read by the room_versions trigger). */
export async function setSaver(trx: Transaction<Database>, userId: number | null): Promise<void> {
  await sql`select set_config('sightward.user_id', ${userId == null ? "" : String(userId)}, true)`.execute(trx);
}

export interface GalleryRoom {
  id: number;
  name: string;
  position: number;
  outline: Ring;
  obstacles: Ring[];
  version: number;
  /** Names of the exhibitions the room is part of. */
  exhibitions: string[];
  /** Approved post plans of the room (any exhibition). */
  approvedPlans: number;
  /** Approved plans computed for an older version of the walls. */
  staleApprovals: number;
}

export interface GalleryFloor {
  id: number;
  site_id: number;
  name: string;
  level: number;
  position: number;
  rooms: GalleryRoom[];
}

export interface GallerySite {
  id: number;
  name: string;
  time_zone: string;
  currency: string;
  position: number;
  floors: GalleryFloor[];
}

/** Every site with its floors and rooms, each in page order (position, then id). */
export async function galleriesTree(db: Db): Promise<GallerySite[]> {
  const sites = await db.selectFrom("sites").select(["id", "name", "time_zone", "currency", "position"]).orderBy("position").orderBy("id").execute();
  const floors = await db.selectFrom("floors").select(["id", "site_id", "name", "level", "position"]).orderBy("position").orderBy("id").execute();
  const rooms = await db
    .selectFrom("rooms")
    .select(["id", "floor_id", "name", "position", "outline", "obstacles", "version"])
    .orderBy("position")
    .orderBy("id")
    .execute();
  const usage = await roomUsage(db, rooms.map((r) => r.id));
  const floorsOf = new Map<number, GalleryFloor[]>();
  const roomsOf = new Map<number, GalleryRoom[]>();
  for (const room of rooms) {
    const use = usage.get(room.id);
    const list = roomsOf.get(room.floor_id) ?? [];
    list.push({
      id: room.id,
      name: room.name,
      position: room.position,
      outline: room.outline,
      obstacles: room.obstacles ?? [],
      version: room.version,
      exhibitions: use?.exhibitions ?? [],
      approvedPlans: use?.approvedPlans ?? 0,
      staleApprovals: use?.staleApprovals ?? 0,
    });
    roomsOf.set(room.floor_id, list);
  }
  for (const floor of floors) {
    const list = floorsOf.get(floor.site_id) ?? [];
    list.push({ ...floor, rooms: roomsOf.get(floor.id) ?? [] });
    floorsOf.set(floor.site_id, list);
  }
  return sites.map((site) => ({ ...site, floors: floorsOf.get(site.id) ?? [] }));
}

export interface RoomUsage {
  exhibitions: string[];
  approvedPlans: number;
  staleApprovals: number;
}

/** What ties rooms down: the exhibitions they are in and their approved plans. */
export async function roomUsage(db: Db, roomIds: number[]): Promise<Map<number, RoomUsage>> {
  const usage = new Map<number, RoomUsage>();
  if (roomIds.length === 0) return usage;
  const of = (id: number) => {
    let u = usage.get(id);
    if (!u) usage.set(id, (u = { exhibitions: [], approvedPlans: 0, staleApprovals: 0 }));
    return u;
  };
  const shows = await db
    .selectFrom("exhibition_rooms")
    .innerJoin("exhibitions", "exhibitions.id", "exhibition_rooms.exhibition_id")
    .select(["exhibition_rooms.room_id", "exhibitions.name"])
    .where("exhibition_rooms.room_id", "in", roomIds)
    .orderBy("exhibitions.starts_on", "desc")
    .execute();
  for (const row of shows) of(row.room_id).exhibitions.push(row.name);
  const plans = await db
    .selectFrom("post_plans")
    .innerJoin("rooms", "rooms.id", "post_plans.room_id")
    .select((eb) => [
      "post_plans.room_id",
      eb.fn.countAll<string>().as("approved"),
      eb.fn.sum<string>(eb.case().when("post_plans.room_version", "<", eb.ref("rooms.version")).then(1).else(0).end()).as("stale"),
    ])
    .where("post_plans.status", "=", "approved")
    .where("post_plans.room_id", "in", roomIds)
    .groupBy("post_plans.room_id")
    .execute();
  for (const row of plans) {
    of(row.room_id).approvedPlans = Number(row.approved);
    of(row.room_id).staleApprovals = Number(row.stale);
  }
  return usage;
}

/** In-use rooms among `roomIds`, for a refusal that names them. */
export async function roomsInUse(db: Db, roomIds: number[]): Promise<{ id: number; name: string; exhibitions: string[]; approvedPlans: number }[]> {
  if (roomIds.length === 0) return [];
  const usage = await roomUsage(db, roomIds);
  const names = await db.selectFrom("rooms").select(["id", "name"]).where("id", "in", roomIds).orderBy("position").orderBy("id").execute();
  return names
    .map((room) => ({ ...room, exhibitions: usage.get(room.id)?.exhibitions ?? [], approvedPlans: usage.get(room.id)?.approvedPlans ?? 0 }))
    .filter((room) => room.exhibitions.length > 0 || room.approvedPlans > 0);
}

async function nextPosition(db: Db, table: "sites" | "floors" | "rooms", parent?: { column: "site_id" | "floor_id"; id: number }): Promise<number> {
  let query = db.selectFrom(table).select((eb) => eb.fn.max<number | null>("position").as("top"));
  if (parent) query = query.where(sql.ref(parent.column), "=", parent.id);
  const row = await query.executeTakeFirst();
  return (row?.top ?? 0) + 1;
}

// ── sites ───────────────────────────────────────────────────────────────────

/** Opening hours a new site starts with until Settings changes them: daily 10:00–18:00. */
export const DEFAULT_OPENING_HOURS: OpeningHours = {
  weekly: { mon: ["10:00", "18:00"], tue: ["10:00", "18:00"], wed: ["10:00", "18:00"], thu: ["10:00", "18:00"], fri: ["10:00", "18:00"], sat: ["10:00", "18:00"], sun: ["10:00", "18:00"] },
  dates: {},
};

export async function createSite(db: Db, site: { name: string; time_zone: string; currency: string; hourly_rate: number }) {
  const position = await nextPosition(db, "sites");
  return db
    .insertInto("sites")
    .values({ ...site, opening_hours: toJson(DEFAULT_OPENING_HOURS), position })
    .returning(["id", "name", "time_zone", "currency", "position"])
    .executeTakeFirstOrThrow();
}

export async function renameSite(db: Db, siteId: number, name: string) {
  return db.updateTable("sites").set({ name }).where("id", "=", siteId).returning(["id", "name"]).executeTakeFirst();
}

export async function siteExists(db: Db, siteId: number): Promise<boolean> {
  return (await db.selectFrom("sites").select("id").where("id", "=", siteId).executeTakeFirst()) !== undefined;
}

export async function roomIdsOfSite(db: Db, siteId: number): Promise<number[]> {
  const rows = await db.selectFrom("rooms").innerJoin("floors", "floors.id", "rooms.floor_id").select("rooms.id").where("floors.site_id", "=", siteId).execute();
  return rows.map((r) => r.id);
}

export async function deleteSite(db: Db, siteId: number): Promise<boolean> {
  return (await db.deleteFrom("sites").where("id", "=", siteId).executeTakeFirst()).numDeletedRows > 0n;
}

// ── floors ──────────────────────────────────────────────────────────────────

export async function floorById(db: Db, floorId: number) {
  return db.selectFrom("floors").select(["id", "site_id", "name", "level", "position"]).where("id", "=", floorId).executeTakeFirst();
}

export async function floorNameTaken(db: Db, siteId: number, name: string, exceptId?: number): Promise<boolean> {
  let query = db.selectFrom("floors").select("id").where("site_id", "=", siteId).where(sql`lower(name)`, "=", name.toLowerCase());
  if (exceptId) query = query.where("id", "<>", exceptId);
  return (await query.executeTakeFirst()) !== undefined;
}

export async function createFloor(db: Db, floor: { site_id: number; name: string; level: number }) {
  const position = await nextPosition(db, "floors", { column: "site_id", id: floor.site_id });
  return db.insertInto("floors").values({ ...floor, position }).returning(["id", "site_id", "name", "level", "position"]).executeTakeFirstOrThrow();
}

export async function updateFloor(db: Db, floorId: number, change: { name?: string; level?: number }) {
  return db.updateTable("floors").set(change).where("id", "=", floorId).returning(["id", "site_id", "name", "level", "position"]).executeTakeFirst();
}

export async function roomIdsOfFloor(db: Db, floorId: number): Promise<number[]> {
  return (await db.selectFrom("rooms").select("id").where("floor_id", "=", floorId).execute()).map((r) => r.id);
}

export async function deleteFloor(db: Db, floorId: number): Promise<boolean> {
  return (await db.deleteFrom("floors").where("id", "=", floorId).executeTakeFirst()).numDeletedRows > 0n;
}

// ── rooms ───────────────────────────────────────────────────────────────────

export async function roomBasics(db: Db, roomId: number) {
  return db
    .selectFrom("rooms")
    .innerJoin("floors", "floors.id", "rooms.floor_id")
    .select(["rooms.id", "rooms.name", "rooms.floor_id", "rooms.version", "rooms.position", "floors.site_id"])
    .where("rooms.id", "=", roomId)
    .executeTakeFirst();
}

export async function roomNameTaken(db: Db, floorId: number, name: string, exceptId?: number): Promise<boolean> {
  let query = db.selectFrom("rooms").select("id").where("floor_id", "=", floorId).where(sql`lower(name)`, "=", name.toLowerCase());
  if (exceptId) query = query.where("id", "<>", exceptId);
  return (await query.executeTakeFirst()) !== undefined;
}

/** A new room at version 1; the trigger keeps version 1 with `savedBy` as its author. */
export async function createRoom(trx: Transaction<Database>, room: { floor_id: number; name: string; outline: Ring; obstacles: Ring[] }, savedBy: number | null) {
  await setSaver(trx, savedBy);
  const position = await nextPosition(trx, "rooms", { column: "floor_id", id: room.floor_id });
  return trx
    .insertInto("rooms")
    .values({ floor_id: room.floor_id, name: room.name, outline: toJson(room.outline), obstacles: toJson(room.obstacles), position })
    .returning(["id", "floor_id", "name", "version", "position"])
    .executeTakeFirstOrThrow();
}

/** Rename a room or move it to another floor (of the same site); the walls and version stay. */
export async function updateRoomPlace(db: Db, roomId: number, change: { name?: string; floor_id?: number }) {
  const set: { name?: string; floor_id?: number; position?: number } = { ...change };
  if (change.floor_id !== undefined) set.position = await nextPosition(db, "rooms", { column: "floor_id", id: change.floor_id });
  return db.updateTable("rooms").set(set).where("id", "=", roomId).returning(["id", "floor_id", "name", "version", "position"]).executeTakeFirst();
}

export async function deleteRoom(db: Db, roomId: number): Promise<boolean> {
  return (await db.deleteFrom("rooms").where("id", "=", roomId).executeTakeFirst()).numDeletedRows > 0n;
}

// ── order ───────────────────────────────────────────────────────────────────

export type OrderScope = { table: "sites" } | { table: "floors"; siteId: number } | { table: "rooms"; floorId: number };

/** The ids under a scope, in page order. */
export async function orderedIds(db: Db, scope: OrderScope): Promise<number[]> {
  let query = db.selectFrom(scope.table).select("id");
  if (scope.table === "floors") query = query.where(sql.ref("site_id"), "=", scope.siteId);
  if (scope.table === "rooms") query = query.where(sql.ref("floor_id"), "=", scope.floorId);
  return (await query.orderBy("position").orderBy("id").execute()).map((r) => r.id);
}

/** Writes positions 1..n in the order given; `ids` must be exactly the scope's ids (checked by the caller). */
export async function writeOrder(trx: Transaction<Database>, table: OrderScope["table"], ids: number[]): Promise<void> {
  for (const [i, id] of ids.entries()) {
    await trx.updateTable(table).set({ position: i + 1 }).where("id", "=", id).execute();
  }
}

// ── outline versions ────────────────────────────────────────────────────────

export interface RoomVersionSummary {
  version: number;
  corners: number;
  holes: number;
  area: number;
  saved_at: string;
  saved_by: { id: number; name: string } | null;
}

export interface RoomVersionDetail extends RoomVersionSummary {
  outline: Ring;
  obstacles: Ring[];
}

/** Every kept version of a room, newest first. */
export async function roomVersions(db: Db, roomId: number): Promise<RoomVersionSummary[]> {
  const rows = await db
    .selectFrom("room_versions")
    .leftJoin("users", "users.id", "room_versions.saved_by")
    .select(["room_versions.version", "room_versions.corners", "room_versions.holes", "room_versions.area", "room_versions.saved_at", "users.id as user_id", "users.name as user_name"])
    .where("room_versions.room_id", "=", roomId)
    .orderBy("room_versions.version", "desc")
    .execute();
  return rows.map((r) => ({
    version: r.version,
    corners: r.corners,
    holes: r.holes,
    area: r.area,
    saved_at: r.saved_at.toISOString(),
    saved_by: r.user_id != null && r.user_name != null ? { id: r.user_id, name: r.user_name } : null,
  }));
}

export async function roomVersion(db: Db, roomId: number, version: number): Promise<RoomVersionDetail | null> {
  const r = await db
    .selectFrom("room_versions")
    .leftJoin("users", "users.id", "room_versions.saved_by")
    .select([
      "room_versions.version",
      "room_versions.outline",
      "room_versions.obstacles",
      "room_versions.corners",
      "room_versions.holes",
      "room_versions.area",
      "room_versions.saved_at",
      "users.id as user_id",
      "users.name as user_name",
    ])
    .where("room_versions.room_id", "=", roomId)
    .where("room_versions.version", "=", version)
    .executeTakeFirst();
  if (!r) return null;
  return {
    version: r.version,
    outline: r.outline,
    obstacles: r.obstacles,
    corners: r.corners,
    holes: r.holes,
    area: r.area,
    saved_at: r.saved_at.toISOString(),
    saved_by: r.user_id != null && r.user_name != null ? { id: r.user_id, name: r.user_name } : null,
  };
}

/** The rooms of a floor with their versions, for matching uploaded rooms by name. */
export async function roomsOfFloorByName(db: Db, floorId: number) {
  return db.selectFrom("rooms").select(["id", "name", "version"]).where("floor_id", "=", floorId).orderBy("position").execute();
}

/** The floors (id, name, level) that hold any of these rooms, lowest level first. */
export async function floorsOfRooms(db: Db, roomIds: number[]) {
  if (roomIds.length === 0) return [];
  return db
    .selectFrom("rooms")
    .innerJoin("floors", "floors.id", "rooms.floor_id")
    .select(["floors.id", "floors.name", "floors.level"])
    .distinct()
    .where("rooms.id", "in", roomIds)
    .orderBy("floors.level")
    .execute();
}
