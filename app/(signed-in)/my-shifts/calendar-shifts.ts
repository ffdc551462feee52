// What the week view gets of each shift: plain data a server page hands to the client calendar,
// with posts named by room and the other guards on the same floor already worked out.
import type { ShiftBreak, ShiftSegment } from "@/db/schema";
import type { FloorColleagueStretch } from "@/db/queries/rosters";
import { DEFAULT_FORMAT, siteDate } from "@/lib/format";
import { postLabel } from "@/lib/rosters/shift-events";

/** A stretch at a post, instants as ISO text. */
export interface CalendarStretch {
  label: string;
  start: string;
  end: string;
}

/** Another guard on a floor the guard works on during the shift. */
export interface FloorColleague {
  name: string;
  floors: string[];
  stretches: CalendarStretch[];
}

export interface CalendarShift {
  id: string;
  start: string;
  end: string;
  /** The rooms of the shift, for the calendar's own event title. */
  title: string;
  rooms: string[];
  posts: CalendarStretch[];
  breaks: { start: string; end: string }[];
  rosterVersion: number;
  colleagues: FloorColleague[];
}

interface ShiftRow {
  id: number;
  starts_at: Date;
  ends_at: Date;
  segments: ShiftSegment[];
  breaks: ShiftBreak[];
  roster_version: number;
}

const byStart = <T extends { start: string }>(a: T, b: T) => Date.parse(a.start) - Date.parse(b.start);

/** The shifts as the calendar shows them; `rooms` maps post ids to room names (roster scenarios). */
export function calendarShifts(shifts: readonly ShiftRow[], rooms: ReadonlyMap<string, string>, colleagues: readonly FloorColleagueStretch[]): CalendarShift[] {
  // The colleague rows name their rooms from the rooms table, so their posts read like the guard's own.
  const colleagueRooms = new Map(colleagues.map((row) => [row.post, row.room_name]));
  return shifts.map((shift) => {
    const roomNames = [...new Set(shift.segments.map((segment) => rooms.get(segment.post) || segment.post))];
    const others = new Map<number, FloorColleague>();
    for (const row of colleagues) {
      if (row.shift_id !== shift.id) continue;
      let other = others.get(row.guard_id);
      if (!other) others.set(row.guard_id, (other = { name: row.guard_name, floors: [], stretches: [] }));
      if (!other.floors.includes(row.floor_name)) other.floors.push(row.floor_name);
      other.stretches.push({ label: postLabel(row.post, colleagueRooms), start: row.starts_at.toISOString(), end: row.ends_at.toISOString() });
    }
    return {
      id: String(shift.id),
      start: shift.starts_at.toISOString(),
      end: shift.ends_at.toISOString(),
      title: roomNames.join(", ") || "Shift",
      rooms: roomNames,
      posts: shift.segments.map((segment) => ({ label: postLabel(segment.post, rooms), start: segment.start, end: segment.end })).sort(byStart),
      breaks: shift.breaks.map((b) => ({ start: b.start, end: b.end })).sort(byStart),
      rosterVersion: shift.roster_version,
      colleagues: [...others.values()].sort((a, b) => byStart(a.stretches[0]!, b.stretches[0]!) || a.name.localeCompare(b.name)),
    };
  });
}

/** The site-local date the calendar opens on: the day of the next (or current) shift, else today. */
export function openingDate(shifts: readonly Pick<ShiftRow, "starts_at" | "ends_at">[], timeZone: string, now: Date = new Date()): string {
  const next = shifts.find((shift) => shift.ends_at.getTime() > now.getTime());
  return siteDate({ ...DEFAULT_FORMAT, timeZone }, next ? next.starts_at : now);
}
