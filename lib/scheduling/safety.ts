// What a roster leaves unguarded and whom it works past their contract, for the publish review and
// the staffing page: rooms open to visitors with no guard at any of their posts (by the minute, in
// stretches), unfilled post-hours per room, and paid hours per guard against contract and limits.
import { buildDemand, isPostClosed, type Demand } from "./demand";
import { paidMs, type Roster } from "./roster";
import type { Scenario } from "./scenario";
import { formatClock, HOUR, weekdayIndex } from "./time";
import { weeklyLimitHours } from "./rules/weeklyMax";

export type Risk = "standard" | "high";

/** A stretch of time in which a room open to visitors has no guard at any of its posts. */
export interface EmptyRoomStretch {
  room: string;
  risk: Risk;
  start: number;
  end: number;
}

export interface RoomShortfall {
  room: string;
  risk: Risk;
  /** Unfilled post-hours of the room's posts. */
  postHours: number;
  /** Hours the room stands empty while open. */
  emptyHours: number;
}

export interface GuardHours {
  guard: string;
  contractHours: number;
  /** Contract plus the extra hours the guard accepts (or the legal maximum when smaller). */
  limitHours: number;
  maxHours: number;
  /** The most paid hours in one roster week (7 scenario days). */
  plannedHours: number;
}

interface Interval {
  start: number;
  end: number;
}

function merge(intervals: Interval[]): Interval[] {
  const sorted = [...intervals].sort((a, b) => a.start - b.start);
  const out: Interval[] = [];
  for (const i of sorted) {
    const last = out[out.length - 1];
    if (last && i.start <= last.end) last.end = Math.max(last.end, i.end);
    else out.push({ ...i });
  }
  return out;
}

function subtract(from: Interval[], minus: Interval[]): Interval[] {
  const out: Interval[] = [];
  for (const a of from) {
    let pieces = [{ ...a }];
    for (const b of minus) {
      pieces = pieces.flatMap((p) => {
        if (b.end <= p.start || b.start >= p.end) return [p];
        const kept: Interval[] = [];
        if (b.start > p.start) kept.push({ start: p.start, end: b.start });
        if (b.end < p.end) kept.push({ start: b.end, end: p.end });
        return kept;
      });
    }
    out.push(...pieces);
  }
  return out.filter((i) => i.end - i.start > 1000);
}

/** The posts of each room (a post without a room name is a room of its own). */
export function roomsOf(scenario: Scenario): Map<string, { risk: Risk; posts: string[] }> {
  const rooms = new Map<string, { risk: Risk; posts: string[] }>();
  for (const post of scenario.posts) {
    const name = post.room || post.id;
    const room = rooms.get(name) ?? { risk: "standard" as Risk, posts: [] };
    room.posts.push(post.id);
    if (post.risk === "high") room.risk = "high";
    rooms.set(name, room);
  }
  return rooms;
}

/**
 * Every stretch in which a room is open (some post of it is open) and no guard stands at any of its
 * posts, high-risk rooms first, then by room and time.
 */
export function emptyRoomStretches(scenario: Scenario, roster: Roster, demand: Demand = buildDemand(scenario)): EmptyRoomStretch[] {
  const out: EmptyRoomStretch[] = [];
  for (const [room, { risk, posts }] of roomsOf(scenario)) {
    const open = merge(demand.slots.filter((slot) => posts.some((p) => !isPostClosed(demand, p, slot.start, slot.end))).map((s) => ({ start: s.start, end: s.end })));
    const postSet = new Set(posts);
    const guarded = merge(roster.shifts.flatMap((shift) => shift.segments.filter((s) => postSet.has(s.post)).map((s) => ({ start: s.start, end: s.end }))));
    for (const gap of subtract(open, guarded)) out.push({ room, risk, ...gap });
  }
  return out.sort((a, b) => (a.risk === b.risk ? 0 : a.risk === "high" ? -1 : 1) || a.room.localeCompare(b.room) || a.start - b.start);
}

/** Unfilled post-hours and empty hours per room, only rooms with either; high-risk rooms first. */
export function roomShortfalls(scenario: Scenario, roster: Roster, empty: EmptyRoomStretch[]): RoomShortfall[] {
  const rooms = roomsOf(scenario);
  const roomOfPost = new Map<string, string>();
  for (const [name, room] of rooms) for (const p of room.posts) roomOfPost.set(p, name);
  const byRoom = new Map<string, RoomShortfall>();
  const entry = (room: string) => {
    const found = byRoom.get(room) ?? { room, risk: rooms.get(room)?.risk ?? "standard", postHours: 0, emptyHours: 0 };
    byRoom.set(room, found);
    return found;
  };
  for (const u of roster.unfilled) entry(roomOfPost.get(u.post) ?? u.post).postHours += (u.end - u.start) / HOUR;
  for (const e of empty) entry(e.room).emptyHours += (e.end - e.start) / HOUR;
  return [...byRoom.values()].sort((a, b) => (a.risk === b.risk ? 0 : a.risk === "high" ? -1 : 1) || b.postHours - a.postHours || a.room.localeCompare(b.room));
}

/** Paid hours of each guard on the roster in their busiest roster week, with their contract and limits. */
export function guardHours(scenario: Scenario, roster: Roster, demand: Demand = buildDemand(scenario)): GuardHours[] {
  const weeks = Math.max(1, Math.ceil(scenario.days / 7));
  const perWeek = new Map<string, number[]>();
  for (const shift of roster.shifts) {
    const day = demand.dayStarts.filter((start) => start <= shift.start).length - 1;
    const week = Math.min(weeks - 1, Math.max(0, Math.floor(day / 7)));
    const hours = perWeek.get(shift.guard) ?? new Array<number>(weeks).fill(0);
    hours[week] += paidMs(shift, scenario.rules.paidBreaks) / HOUR;
    perWeek.set(shift.guard, hours);
  }
  return scenario.guards.map((g) => ({
    guard: g.id,
    contractHours: g.contractHours,
    limitHours: weeklyLimitHours(g),
    maxHours: g.maxHours,
    plannedHours: Math.round(Math.max(0, ...(perWeek.get(g.id) ?? [0])) * 100) / 100,
  }));
}

/** One guard's week as the staffing page's table shows it. */
export interface GuardWeek extends GuardHours {
  /** Hours past overtimeAfterHours, summed over roster weeks. */
  overtimeHours: number;
  /** Shifts ending at 20:00 or later (or past midnight). */
  lateShifts: number;
  /** Saturdays and Sundays worked. */
  weekendDays: number;
  /** The longest run of consecutive days worked. */
  daysInARow: number;
  /** Plain-word flags: over contract, over the limit, at the legal maximum, six or more days in a row. */
  flags: string[];
}

/** Every guard of the scenario with their hours, overtime, late shifts, weekend days and longest run. */
export function guardWeeks(scenario: Scenario, roster: Roster, demand: Demand = buildDemand(scenario)): GuardWeek[] {
  const zone = scenario.timezone;
  const rules = scenario.rules;
  const weeks = Math.max(1, Math.ceil(scenario.days / 7));
  const dayOf = (instant: number) => Math.max(0, demand.dayStarts.filter((start) => start <= instant).length - 1);
  return guardHours(scenario, roster, demand).map((hours) => {
    const own = roster.shifts.filter((s) => s.guard === hours.guard);
    const perWeek = new Array<number>(weeks).fill(0);
    const days = new Set<number>();
    let late = 0;
    for (const shift of own) {
      const day = dayOf(shift.start);
      perWeek[Math.min(weeks - 1, Math.floor(day / 7))] += paidMs(shift, rules.paidBreaks) / HOUR;
      days.add(day);
      const endClock = formatClock(zone, shift.end);
      if (endClock >= "20:00" || endClock < formatClock(zone, shift.start)) late++;
    }
    const dates = [...days].sort((a, b) => a - b);
    let run = 0;
    let longest = 0;
    dates.forEach((d, i) => {
      run = i > 0 && d === dates[i - 1]! + 1 ? run + 1 : 1;
      longest = Math.max(longest, run);
    });
    const weekendDays = dates.filter((d) => {
      const date = demand.days[d]?.date;
      return date !== undefined && weekdayIndex(zone, date) >= 5;
    }).length;
    const overtime = perWeek.reduce((sum, h) => sum + Math.max(0, h - rules.overtimeAfterHours), 0);
    const flags: string[] = [];
    if (hours.plannedHours > hours.limitHours + 1e-6) flags.push("over the limit");
    else if (hours.plannedHours > hours.contractHours + 1e-6) flags.push("over contract");
    if (hours.plannedHours >= hours.maxHours - 1e-6) flags.push("at the legal maximum");
    if (longest >= 6) flags.push(`${longest} days in a row`);
    return { ...hours, overtimeHours: Math.round(overtime * 100) / 100, lateShifts: late, weekendDays, daysInARow: longest, flags };
  });
}
