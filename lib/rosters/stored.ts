// A roster as the engine holds it (instants in ms) <-> as the database keeps it (timestamptz
// columns, ISO text inside jsonb), and the engine's messages with guard names instead of ids.
import type { Roster, Shift as EngineShift, Violation } from "@/lib/scheduling/roster";
import type { Totals } from "@/lib/scheduling/totals";
import type { RosterTotals, RosterUnfilled, RosterViolation, ShiftBreak, ShiftSegment } from "@/db/schema";
import { guardIdOfKey, guardKey } from "./scenario";

export interface StoredShift {
  guard_id: number;
  starts_at: Date;
  ends_at: Date;
  segments: ShiftSegment[];
  breaks: ShiftBreak[];
}

export interface StoredRoster {
  shifts: StoredShift[];
  unfilled: RosterUnfilled[];
}

const iso = (instant: number) => new Date(instant).toISOString();
const ms = (text: string | Date) => new Date(text).getTime();

export function storedShift(shift: EngineShift): StoredShift {
  const guardId = guardIdOfKey(shift.guard);
  if (guardId === null) throw new Error(`the engine returned a shift for ${shift.guard}, which is not a guard of this site`);
  return {
    guard_id: guardId,
    starts_at: new Date(shift.start),
    ends_at: new Date(shift.end),
    segments: shift.segments.map((s) => ({ post: s.post, start: iso(s.start), end: iso(s.end) })),
    breaks: shift.breaks.map((b) => ({ start: iso(b.start), end: iso(b.end) })),
  };
}

/** The roster as stored; `words` turns the engine's ids in unfilled reasons into names (withGuardNames). */
export function storedRoster(roster: Roster, words: (text: string) => string = (text) => text): StoredRoster {
  return {
    shifts: roster.shifts.map(storedShift),
    unfilled: roster.unfilled.map((u) => ({ post: u.post, start: iso(u.start), end: iso(u.end), reason: words(u.reason) })),
  };
}

export function engineShift(shift: StoredShift): EngineShift {
  return {
    guard: guardKey(shift.guard_id),
    start: ms(shift.starts_at),
    end: ms(shift.ends_at),
    segments: shift.segments.map((s) => ({ post: s.post, start: ms(s.start), end: ms(s.end) })),
    breaks: shift.breaks.map((b) => ({ start: ms(b.start), end: ms(b.end) })),
  };
}

export function engineRoster(roster: StoredRoster): Roster {
  return {
    shifts: roster.shifts.map(engineShift),
    unfilled: roster.unfilled.map((u) => ({ post: u.post, start: ms(u.start), end: ms(u.end), reason: u.reason })),
  };
}

/**
 * Replaces engine guard ids ("G12") in a message with the guard's name, and post ids ("R12-P1", also
 * "post R12-P1") with the post as the floor map names it ("Exhibition Hall West · post 1").
 */
export function withGuardNames(message: string, names: ReadonlyMap<number, string>, posts: ReadonlyMap<string, string> = new Map()): string {
  return message
    .replace(/\bG(\d+)\b/g, (whole, id: string) => names.get(Number(id)) ?? whole)
    .replace(/(?:\bpost )?\b(R\d+-P\d+)\b/g, (whole, id: string) => posts.get(id) ?? whole);
}

export function storedViolations(violations: Violation[], names: ReadonlyMap<number, string>, posts: ReadonlyMap<string, string> = new Map()): RosterViolation[] {
  return violations.map((v) => ({
    rule: v.rule,
    message: withGuardNames(v.message, names, posts),
    ...(v.guard ? { guard: v.guard } : {}),
    ...(v.post ? { post: v.post } : {}),
    ...(v.start !== undefined ? { start: iso(v.start) } : {}),
    ...(v.end !== undefined ? { end: iso(v.end) } : {}),
  }));
}

export function storedTotals(totals: Totals): RosterTotals {
  const { contractUnderuse: _perGuard, ...rest } = totals;
  return { ...rest, underusedGuards: totals.contractUnderuse.length };
}
