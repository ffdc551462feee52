import "server-only";
import { cache } from "react";
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { db } from "@/db";
import type { OpeningHours, OpeningSpan, Site, Weekday } from "@/db/schema";
import { DEFAULT_FORMAT, formatClock, siteFormat, type SiteFormat } from "@/lib/format";
import type { Ring } from "@/lib/geometry/types";

/** The site the app shows (the demo has one; the first by id when there are several); read once per request. */
export const mainSite = cache(async (): Promise<Site | null> => {
  return (await db.selectFrom("sites").selectAll().orderBy("id").limit(1).executeTakeFirst()) ?? null;
});

/** The main site's locale, zone and currency for the shell; the defaults when the database cannot be read. */
export const mainSiteFormat = cache(async (): Promise<SiteFormat> => {
  try {
    return siteFormat(await mainSite());
  } catch {
    // The page beneath reports the failure itself (its error boundary); the shell still renders.
    return DEFAULT_FORMAT;
  }
});

export interface SiteDay {
  date: string;
  weekday: Weekday;
  opening: OpeningSpan;
  /** True when a dated exception, not the weekly pattern, decides the day. */
  exception: boolean;
}

/** The site's local calendar day at `now` and its opening: a dated exception wins over the weekly pattern. */
export function siteDay(site: Pick<Site, "time_zone" | "opening_hours">, now: Date = new Date()): SiteDay {
  const local = new TZDate(now, site.time_zone);
  const date = format(local, "yyyy-MM-dd");
  const weekday = format(local, "EEE").toLowerCase() as Weekday;
  const hours: OpeningHours = site.opening_hours;
  if (hours.dates && Object.hasOwn(hours.dates, date)) {
    return { date, weekday, opening: hours.dates[date] ?? null, exception: true };
  }
  return { date, weekday, opening: hours.weekly?.[weekday] ?? null, exception: false };
}

/** A day's opening as the site reads it: "10:00–18:00", or "closed". */
export function describeOpening(opening: OpeningSpan, f: SiteFormat): string {
  return opening ? `${formatClock(f, opening[0])}–${formatClock(f, opening[1])}` : "closed";
}

export interface RoomSummary {
  id: number;
  name: string;
  outline: Ring;
  obstacles: Ring[];
  version: number;
}

export interface FloorWithRooms {
  id: number;
  name: string;
  level: number;
  rooms: RoomSummary[];
}

/** Every floor of a site with its rooms, lowest level first. */
export async function floorsWithRooms(siteId: number): Promise<FloorWithRooms[]> {
  const rows = await db
    .selectFrom("floors")
    .leftJoin("rooms", "rooms.floor_id", "floors.id")
    .select([
      "floors.id as floor_id",
      "floors.name as floor_name",
      "floors.level",
      "rooms.id as room_id",
      "rooms.name as room_name",
      "rooms.outline",
      "rooms.obstacles",
      "rooms.version",
    ])
    .where("floors.site_id", "=", siteId)
    .orderBy("floors.level")
    .orderBy("rooms.name")
    .execute();
  const floors = new Map<number, FloorWithRooms>();
  for (const row of rows) {
    let floor = floors.get(row.floor_id);
    if (!floor) {
      floor = { id: row.floor_id, name: row.floor_name, level: row.level, rooms: [] };
      floors.set(row.floor_id, floor);
    }
    if (row.room_id != null && row.room_name != null && row.outline) {
      floor.rooms.push({
        id: row.room_id,
        name: row.room_name,
        outline: row.outline,
        obstacles: row.obstacles ?? [],
        version: row.version ?? 1,
      });
    }
  }
  return [...floors.values()];
}

export interface ExhibitionWithRooms {
  id: number;
  name: string;
  starts_on: string;
  ends_on: string;
  rooms: { id: number; name: string; floor: string; risk_level: string; sight_range: number | null; double_cover: boolean }[];
}

/** Exhibitions of a site, newest start first, each with its rooms. */
export async function exhibitionsWithRooms(siteId: number): Promise<ExhibitionWithRooms[]> {
  const exhibitions = await db
    .selectFrom("exhibitions")
    .select(["id", "name", "starts_on", "ends_on"])
    .where("site_id", "=", siteId)
    .orderBy("starts_on", "desc")
    .execute();
  if (exhibitions.length === 0) return [];
  const rooms = await db
    .selectFrom("exhibition_rooms")
    .innerJoin("rooms", "rooms.id", "exhibition_rooms.room_id")
    .innerJoin("floors", "floors.id", "rooms.floor_id")
    .select([
      "exhibition_rooms.exhibition_id",
      "rooms.id",
      "rooms.name",
      "floors.name as floor",
      "exhibition_rooms.risk_level",
      "exhibition_rooms.sight_range",
      "exhibition_rooms.double_cover",
    ])
    .where("exhibition_rooms.exhibition_id", "in", exhibitions.map((e) => e.id))
    .orderBy("floors.level")
    .orderBy("rooms.name")
    .execute();
  return exhibitions.map((exhibition) => ({
    ...exhibition,
    rooms: rooms
      .filter((room) => room.exhibition_id === exhibition.id)
      .map(({ exhibition_id: _ignored, ...room }) => room),
  }));
}

/** The exhibition running on `date` (YYYY-MM-DD), or the next one to open, or null. */
export function currentExhibition(exhibitions: ExhibitionWithRooms[], date: string): { exhibition: ExhibitionWithRooms; running: boolean } | null {
  const running = exhibitions.find((e) => e.starts_on <= date && date <= e.ends_on);
  if (running) return { exhibition: running, running: true };
  const upcoming = exhibitions.filter((e) => e.starts_on > date).sort((a, b) => a.starts_on.localeCompare(b.starts_on))[0];
  return upcoming ? { exhibition: upcoming, running: false } : null;
}
