// A guard's personal calendar feed: their shifts in the latest published version of every week,
// so a calendar subscribed to it follows each new publication.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { currentShiftsOfGuard, guardByCalendarToken } from "@/db/queries/rosters";
import { calendarText } from "@/lib/calendar/ics";
import { siteFormat } from "@/lib/format";
import { roomsOfScenario, shiftEvents } from "./shift-events";

/** How far back the feed reaches: calendars keep what they already have. */
const FEED_PAST_DAYS = 60;

/** The feed's iCalendar text, or null when no guard has this token (reset or never issued). */
export async function calendarFeed(db: Kysely<Database>, token: string, now = new Date()): Promise<string | null> {
  const guard = await guardByCalendarToken(db, token);
  if (!guard) return null;
  const site = await db.selectFrom("sites").select(["name", "time_zone", "locale", "currency"]).where("id", "=", guard.site_id).executeTakeFirst();
  const shifts = await currentShiftsOfGuard(db, guard.id, new Date(now.getTime() - FEED_PAST_DAYS * 86_400_000));
  const rosterIds = [...new Set(shifts.map((s) => s.roster_id))];
  const scenarios = rosterIds.length
    ? await db.selectFrom("rosters").select(["id", "scenario"]).where("id", "in", rosterIds).execute()
    : [];
  const rooms = new Map<string, string>();
  for (const row of scenarios) for (const [post, room] of roomsOfScenario(row.scenario)) rooms.set(post, room);
  const shown = siteFormat(site);
  const zone = shown.timeZone;
  const events = shiftEvents(
    shifts.map((s) => ({ ...s, guard_id: guard.id })),
    shown,
    site?.name ?? "",
    rooms,
  );
  return calendarText(events, { name: `${guard.name}: shifts`, timeZone: zone, method: "PUBLISH", stamp: now });
}
