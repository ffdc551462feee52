// Rooms as the room page and its API read and write them: the walls with the site's opening hours
// and the exhibitions the room is part of, and the optimistic-concurrency save of new walls.
import type { Kysely, Transaction } from "kysely";
import { db as appDb } from "../index";
import { toJson, type Database, type OpeningHours } from "../schema";
import { setSaver } from "./galleries";
import type { Ring } from "../../lib/geometry/types";

export interface RoomExhibition {
  id: number;
  name: string;
  starts_on: string;
  ends_on: string;
  risk_level: "standard" | "high";
  sight_range: number | null;
  double_cover: boolean;
}

export interface RoomDetail {
  id: number;
  name: string;
  outline: Ring;
  obstacles: Ring[];
  version: number;
  updated_at: string;
  floor: { id: number; name: string; level: number };
  site: { id: number; name: string; time_zone: string; locale: string; currency: string; hourly_rate: number; opening_hours: OpeningHours };
  /** Exhibitions that include the room, latest start first. */
  exhibitions: RoomExhibition[];
}

/** One room with its floor, site and exhibitions, or null when there is no such room. */
export async function roomDetail(roomId: number, db: Kysely<Database> = appDb): Promise<RoomDetail | null> {
  const row = await db
    .selectFrom("rooms")
    .innerJoin("floors", "floors.id", "rooms.floor_id")
    .innerJoin("sites", "sites.id", "floors.site_id")
    .select([
      "rooms.id",
      "rooms.name",
      "rooms.outline",
      "rooms.obstacles",
      "rooms.version",
      "rooms.updated_at",
      "floors.id as floor_id",
      "floors.name as floor_name",
      "floors.level as floor_level",
      "sites.id as site_id",
      "sites.name as site_name",
      "sites.time_zone",
      "sites.locale",
      "sites.currency",
      "sites.hourly_rate",
      "sites.opening_hours",
    ])
    .where("rooms.id", "=", roomId)
    .executeTakeFirst();
  if (!row) return null;
  const exhibitions = await db
    .selectFrom("exhibition_rooms")
    .innerJoin("exhibitions", "exhibitions.id", "exhibition_rooms.exhibition_id")
    .select([
      "exhibitions.id",
      "exhibitions.name",
      "exhibitions.starts_on",
      "exhibitions.ends_on",
      "exhibition_rooms.risk_level",
      "exhibition_rooms.sight_range",
      "exhibition_rooms.double_cover",
    ])
    .where("exhibition_rooms.room_id", "=", roomId)
    .orderBy("exhibitions.starts_on", "desc")
    .execute();
  return {
    id: row.id,
    name: row.name,
    outline: row.outline,
    obstacles: row.obstacles ?? [],
    version: row.version,
    updated_at: row.updated_at.toISOString(),
    floor: { id: row.floor_id, name: row.floor_name, level: row.floor_level },
    site: {
      id: row.site_id,
      name: row.site_name,
      time_zone: row.time_zone,
      locale: row.locale,
      currency: row.currency,
      hourly_rate: row.hourly_rate,
      opening_hours: row.opening_hours,
    },
    exhibitions,
  };
}

/** The exhibition running on `date` among a room's exhibitions, else the next to open, else null. */
export function currentRoomExhibition(exhibitions: RoomExhibition[], date: string): RoomExhibition | null {
  const running = exhibitions.find((e) => e.starts_on <= date && date <= e.ends_on);
  if (running) return running;
  return exhibitions.filter((e) => e.starts_on > date).sort((a, b) => a.starts_on.localeCompare(b.starts_on))[0] ?? null;
}

export type RoomSave =
  | { ok: true; version: number; updated_at: string }
  | { ok: false; reason: "not-found" }
  | { ok: false; reason: "stale"; currentVersion: number };

/**
 * Writes new walls only when the room is still at `expectedVersion` (one UPDATE ... WHERE version
 * = expected), bumping the version; otherwise writes nothing and says why. The room_versions
 * trigger keeps the new walls as a version by `savedBy`.
 */
export async function saveRoomWalls(
  roomId: number,
  change: { name?: string; outline: Ring; obstacles: Ring[] },
  expectedVersion: number,
  db: Kysely<Database> = appDb,
  savedBy: number | null = null,
): Promise<RoomSave> {
  // One transaction, so the room_versions trigger sees who saved (setSaver) with the new walls.
  return db.transaction().execute((trx) => writeRoomWalls(trx, roomId, change, expectedVersion, savedBy));
}

/** saveRoomWalls inside a transaction the caller holds (several rooms saved all or nothing). */
export async function writeRoomWalls(
  trx: Transaction<Database>,
  roomId: number,
  change: { name?: string; outline: Ring; obstacles: Ring[] },
  expectedVersion: number,
  savedBy: number | null = null,
): Promise<RoomSave> {
  await setSaver(trx, savedBy);
  const updated = await trx
    .updateTable("rooms")
    .set((eb) => ({
      ...(change.name !== undefined ? { name: change.name } : {}),
      outline: toJson(change.outline),
      obstacles: toJson(change.obstacles),
      version: eb("version", "+", 1),
      updated_at: new Date(),
    }))
    .where("id", "=", roomId)
    .where("version", "=", expectedVersion)
    .returning(["version", "updated_at"])
    .executeTakeFirst();
  if (updated) return { ok: true as const, version: updated.version, updated_at: updated.updated_at.toISOString() };
  const current = await trx.selectFrom("rooms").select("version").where("id", "=", roomId).executeTakeFirst();
  return current ? { ok: false as const, reason: "stale" as const, currentVersion: current.version } : { ok: false as const, reason: "not-found" as const };
}
