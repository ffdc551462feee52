// Repair of a published roster after a change (a guard calls in sick, a room closes early): re-staff with as few
// changes to other people's shifts as possible, and list who is affected.
import { blockerFor, loadsFromShifts } from "./assign";
import { buildDemand, hasSkills, type Demand } from "./demand";
import { unfilledWithReasons } from "./engine";
import { fillGaps } from "./gapFill";
import { compareShifts, paidMs, type Roster, type Shift, type Violation } from "./roster";
import { checkRoster, ruleContext } from "./rules";
import type { Scenario } from "./scenario";
import { formatLocal, HOUR, parseLocal } from "./time";

export type RosterChange =
  /** A guard cannot work from start to end (local wall-clock `YYYY-MM-DDTHH:mm`), e.g. sick for a day. */
  | { kind: "guard-absent"; guard: string; start: string; end: string }
  /** A room (all its posts) closes at `at` until that day's closing. */
  | { kind: "room-closes"; room: string; at: string };

export interface AffectedGuard {
  guard: string;
  change: string;
}

export interface RepairResult {
  roster: Roster;
  affected: AffectedGuard[];
  violations: Violation[];
  /** The scenario and demand the repaired roster answers (absence and closure applied). */
  scenario: Scenario;
  demand: Demand;
}

export function repairRoster(scenario: Scenario, published: Roster, change: RosterChange): RepairResult {
  const zone = scenario.timezone;
  const at = (t: number) => formatLocal(zone, t);
  const affected: AffectedGuard[] = [];
  let next: Scenario = scenario;
  let shifts: Shift[] = published.shifts.map(copyShift);
  const demand = buildDemand(next);

  if (change.kind === "guard-absent") {
    // The absence becomes unavailability, so every rule check knows it.
    next = {
      ...scenario,
      guards: scenario.guards.map((g) => (g.id === change.guard ? { ...g, unavailable: [...g.unavailable, { start: change.start, end: change.end }] } : g)),
    };
    const from = parseLocal(zone, change.start);
    const to = parseLocal(zone, change.end);
    demand.unavailable.set(change.guard, [...(demand.unavailable.get(change.guard) ?? []), { start: from, end: to }]);
    const removed = shifts.filter((s) => s.guard === change.guard && s.start < to && from < s.end);
    shifts = shifts.filter((s) => !removed.includes(s));
    for (const lost of removed) {
      affected.push({ guard: change.guard, change: `shift ${at(lost.start)}–${at(lost.end).slice(11)} removed (absent)` });
      const stand = pickStandIn(next, demand, shifts, lost);
      if (stand) {
        shifts.push({ ...copyShift(lost), guard: stand });
        affected.push({ guard: stand, change: `takes over ${change.guard}'s shift ${at(lost.start)}–${at(lost.end).slice(11)}` });
      }
    }
  } else {
    const posts = scenario.posts.filter((p) => p.room === change.room).map((p) => p.id);
    const from = parseLocal(zone, change.at);
    const day = demand.days.find((d) => d.open !== null && d.open <= from && from < d.close!);
    const to = day ? day.close! : from;
    for (const post of posts) demand.closed.set(post, [...(demand.closed.get(post) ?? []), { start: from, end: to }]);
    shifts = shifts.map((shift) => {
      const touched = shift.segments.some((s) => posts.includes(s.post) && s.end > from && s.start < to);
      if (!touched) return shift;
      const cut = closeSegments(scenario, shift, posts, from, to);
      affected.push({ guard: shift.guard, change: cut.end < shift.end ? `shift now ends at ${at(cut.end).slice(11)} (room ${change.room} closed)` : `time at room ${change.room} after ${at(from).slice(11)} is now a break` });
      return cut;
    });
  }

  // Slots left empty by the change, then new shifts for guards with none that day (nobody else's shift changes).
  const ctx = ruleContext(next, demand);
  const empty = emptySlots(next, demand, shifts);
  const before = new Set(shifts);
  const loads = loadsFromShifts(next, demand, shifts);
  fillGaps(next, demand, shifts, empty, loads);
  for (const s of shifts) if (!before.has(s)) affected.push({ guard: s.guard, change: `new shift ${at(s.start)}–${at(s.end).slice(11)} to cover the gap` });
  shifts.sort(compareShifts);
  const unfilled = unfilledWithReasons(next, demand, shifts, empty);
  const roster: Roster = { shifts, unfilled };
  return { roster, affected, violations: checkRoster(next, roster, ctx), scenario: next, demand };
}

function copyShift(s: Shift): Shift {
  return { ...s, segments: s.segments.map((x) => ({ ...x })), breaks: s.breaks.map((b) => ({ ...b })) };
}

/** The guard who can take a whole lost shift unchanged: qualified, free, rested, under the weekly maximum; least overtime, then most contract hours left. */
function pickStandIn(scenario: Scenario, demand: Demand, shifts: Shift[], lost: Shift): string | null {
  const needs = [...new Set(lost.segments.flatMap((s) => scenario.posts.find((p) => p.id === s.post)?.skills ?? []))];
  const loads = loadsFromShifts(scenario, demand, shifts);
  const paid = paidMs(lost, scenario.rules.paidBreaks);
  let best: { guard: string; score: number } | null = null;
  for (const guard of [...scenario.guards].sort((a, b) => (a.id < b.id ? -1 : 1))) {
    if (guard.id === lost.guard || !hasSkills(guard.skills, needs)) continue;
    const load = loads.get(guard.id)!;
    if (blockerFor(scenario, demand, load, lost.start, lost.end, paid)) continue;
    const weekHours = load.shifts.filter((s) => s.end > lost.start - 7 * 24 * HOUR && s.start < lost.start).reduce((a, s) => a + s.paidMs, 0) / HOUR;
    const overtime = Math.max(0, weekHours + paid / HOUR - scenario.rules.overtimeAfterHours);
    const score = overtime * 1000 + weekHours - guard.contractHours;
    if (!best || score < best.score) best = { guard: guard.id, score };
  }
  return best?.guard ?? null;
}

/** Drops time at closed posts: trims the shift's end when the rest is idle (keeping the minimum length), else turns it into a break. */
function closeSegments(scenario: Scenario, shift: Shift, posts: string[], from: number, to: number): Shift {
  const kept: Shift["segments"] = [];
  const freed: Shift["breaks"] = [];
  for (const s of shift.segments) {
    if (!posts.includes(s.post) || s.end <= from || s.start >= to) {
      kept.push(s);
      continue;
    }
    if (s.start < from) kept.push({ ...s, end: from });
    freed.push({ start: Math.max(s.start, from), end: Math.min(s.end, to) });
    if (s.end > to) kept.push({ ...s, start: to });
  }
  let breaks = mergeIntervals([...shift.breaks, ...freed]);
  let end = shift.end;
  const minEnd = shift.start + scenario.rules.minShiftHours * HOUR;
  const lastWork = Math.max(...kept.map((s) => s.end), shift.start);
  if (kept.length > 0 && lastWork < end) {
    end = Math.max(lastWork, Math.min(end, minEnd));
    breaks = breaks.filter((b) => b.start < end).map((b) => ({ ...b, end: Math.min(b.end, end) }));
  }
  return { ...shift, end, segments: kept, breaks };
}

function mergeIntervals(list: { start: number; end: number }[]): { start: number; end: number }[] {
  const sorted = [...list].sort((a, b) => a.start - b.start);
  const out: { start: number; end: number }[] = [];
  for (const i of sorted) {
    const last = out[out.length - 1];
    if (last && i.start <= last.end) last.end = Math.max(last.end, i.end);
    else out.push({ ...i });
  }
  return out;
}

/** Post-slots nobody stands at (closed posts excluded). */
function emptySlots(scenario: Scenario, demand: Demand, shifts: Shift[]): Map<number, string[]> {
  const empty = new Map<number, string[]>();
  const staffed = new Map<string, { start: number; end: number }[]>();
  for (const s of shifts) for (const seg of s.segments) staffed.set(seg.post, [...(staffed.get(seg.post) ?? []), seg]);
  for (const slot of demand.slots)
    for (const post of scenario.posts) {
      if ((demand.closed.get(post.id) ?? []).some((c) => c.start < slot.end && slot.start < c.end)) continue;
      if ((staffed.get(post.id) ?? []).some((seg) => seg.start <= slot.start && seg.end >= slot.end)) continue;
      empty.set(slot.index, [...(empty.get(slot.index) ?? []), post.id]);
    }
  return empty;
}
