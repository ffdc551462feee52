// A guard's shifts as people read them: lines for an e-mail and events for a calendar, in the
// site's locale and time zone, posts named by room.
import type { ShiftBreak, ShiftSegment } from "@/db/schema";
import type { CalendarEvent } from "@/lib/calendar/ics";
import { formatSpan, formatTimeRange, type SiteFormat } from "@/lib/format";

export interface ShiftForPeople {
  guard_id: number;
  starts_at: Date;
  ends_at: Date;
  segments: ShiftSegment[];
  breaks: ShiftBreak[];
  roster_version: number;
}

/** "Textile Gallery · post 2" from the post id "R7-P2" and the room's name (post plan convention). */
export function postLabel(postId: string, rooms: ReadonlyMap<string, string>): string {
  const room = rooms.get(postId);
  const number = /-P(\d+)$/.exec(postId)?.[1];
  return room ? (number ? `${room} · post ${number}` : room) : postId;
}

/** Post id -> the post as the floor map names it ("Textile Gallery · post 2"). */
export function postLabels(scenario: unknown): Map<string, string> {
  const rooms = roomsOfScenario(scenario);
  return new Map([...rooms.keys()].map((id) => [id, postLabel(id, rooms)]));
}

/** Post id -> room name, from the posts of a roster's scenario. */
export function roomsOfScenario(scenario: unknown): Map<string, string> {
  const posts = (scenario as { posts?: { id: string; room?: string }[] } | null)?.posts ?? [];
  return new Map(posts.map((p) => [p.id, p.room ?? ""]));
}

/** "Tue, 8 Dec 2026, 10:00–18:00" (en-GB) in the site's zone. */
export function shiftWhen(shift: Pick<ShiftForPeople, "starts_at" | "ends_at">, site: SiteFormat): string {
  return formatSpan(site, shift.starts_at, shift.ends_at);
}

/** The shift's plan, one stretch per line: "10:00–12:00 Textile Gallery · post 1", "14:00–15:00 break". */
export function shiftPlan(shift: ShiftForPeople, site: SiteFormat, rooms: ReadonlyMap<string, string>): string[] {
  const parts = [
    ...shift.segments.map((s) => ({ start: s.start, text: `${formatTimeRange(site, s.start, s.end)} ${postLabel(s.post, rooms)}` })),
    ...shift.breaks.map((b) => ({ start: b.start, text: `${formatTimeRange(site, b.start, b.end)} break` })),
  ];
  return parts.sort((a, b) => new Date(a.start).getTime() - new Date(b.start).getTime()).map((p) => p.text);
}

/**
 * One calendar event per shift. The UID names guard and start, so a later version of the same
 * shift replaces it in the guard's calendar (SEQUENCE = roster version). Start and end stay
 * machine instants; only the description is written the site's way.
 */
export function shiftEvents(shifts: readonly ShiftForPeople[], site: SiteFormat, siteName: string, rooms: ReadonlyMap<string, string>): CalendarEvent[] {
  return shifts.map((shift) => {
    const posts = [...new Set(shift.segments.map((s) => postLabel(s.post, rooms)))];
    return {
      uid: `shift-${shift.guard_id}-${new Date(shift.starts_at).toISOString()}@sightward.example.org`,
      start: new Date(shift.starts_at),
      end: new Date(shift.ends_at),
      summary: `Shift: ${posts.slice(0, 2).join(", ")}${posts.length > 2 ? ` and ${posts.length - 2} more` : ""}`,
      description: [`Times in ${site.timeZone}.`, ...shiftPlan(shift, site, rooms), `Roster version ${shift.roster_version}.`].join("\n"),
      location: siteName,
      sequence: shift.roster_version,
    };
  });
}
