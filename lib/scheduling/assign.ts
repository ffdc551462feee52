// Guards to shifts, day by day: an exact minimum-cost assignment per day under rest, weekly maximum, skills and availability,
// with costs for overtime, contract hours and a fair spread of late and weekend shifts.
import type { SkillClass } from "./cover";
import { hasSkills, isUnavailable, type Demand } from "./demand";
import { assignMinCost, FORBIDDEN } from "./hungarian";
import type { ShiftPattern } from "./patterns";
import type { Guard, Scenario } from "./scenario";
import { formatClock, HOUR, weekdayIndex } from "./time";

export interface ShiftInstance {
  day: number;
  pattern: ShiftPattern;
  skillClass: SkillClass;
  guard: string | null;
}

/** What the engine knows of a guard while building the roster. */
export interface GuardLoad {
  guard: Guard;
  /** Assigned shifts as [start, end, paid ms]. */
  shifts: { start: number; end: number; paidMs: number }[];
  weekMs: number[];
  late: number;
  weekend: number;
}

export function newLoads(scenario: Scenario, weeks: number): Map<string, GuardLoad> {
  return new Map(scenario.guards.map((g) => [g.id, { guard: g, shifts: [], weekMs: new Array(weeks).fill(0), late: 0, weekend: 0 }]));
}

/** Late = ends at 20:00 or later local time; weekend = Saturday or Sunday (common practice for fairness counts). */
export function shiftKind(scenario: Scenario, demand: Demand, start: number, end: number, day: number): { late: boolean; weekend: boolean } {
  const endClock = formatClock(scenario.timezone, end);
  const startDate = demand.days[day].date;
  return { late: endClock >= "20:00" || end - start > 0 && endClock < formatClock(scenario.timezone, start), weekend: weekdayIndex(scenario.timezone, startDate) >= 5 };
}

/** Why a guard cannot take [start, end) with `paidMs` paid, or null when they can (rest, weekly max, availability, overlap). */
export function blockerFor(scenario: Scenario, demand: Demand, load: GuardLoad, start: number, end: number, paidMs: number): string | null {
  const rules = scenario.rules;
  if (isUnavailable(demand, load.guard.id, start, end)) return "leave";
  for (const s of load.shifts) {
    if (s.start < end && start < s.end) return "busy";
    if (s.end <= start && start - s.end < rules.minRestHours * HOUR - 1000) return "rest";
    if (end <= s.start && s.start - end < rules.minRestHours * HOUR - 1000) return "rest";
  }
  // Conservative 7-day check: every shift ending within 7 days before this one starts counts in full.
  const from = start - 7 * 24 * HOUR;
  const to = end + 7 * 24 * HOUR;
  const before = load.shifts.filter((s) => s.end > from && s.start < start).reduce((sum, s) => sum + s.paidMs, 0);
  const after = load.shifts.filter((s) => s.start >= end && s.start < to).reduce((sum, s) => sum + s.paidMs, 0);
  if (Math.max(before, after) + paidMs > load.guard.maxHours * HOUR + 1000) return "weekly";
  return null;
}

export function commitShift(load: GuardLoad, week: number, start: number, end: number, paidMs: number, kind: { late: boolean; weekend: boolean }) {
  load.shifts.push({ start, end, paidMs });
  load.shifts.sort((a, b) => a.start - b.start);
  load.weekMs[week] += paidMs;
  if (kind.late) load.late++;
  if (kind.weekend) load.weekend++;
}

/** Assigns the day's shift instances to guards at least cost; instances nobody can take keep guard null. */
export function assignDay(scenario: Scenario, demand: Demand, instances: ShiftInstance[], loads: Map<string, GuardLoad>): void {
  if (instances.length === 0) return;
  const rules = scenario.rules;
  const guards = [...loads.values()];
  const relevant = new Set(scenario.posts.flatMap((p) => p.skills));
  const unassignedCost = FORBIDDEN / 10;
  const cost = instances.map((inst) => {
    const paidMs = inst.pattern.workMs + (rules.paidBreaks ? inst.pattern.breakMs : 0);
    const week = Math.floor(inst.day / 7);
    const kind = shiftKind(scenario, demand, inst.pattern.start, inst.pattern.end, inst.day);
    const row = guards.map((load) => {
      if (!hasSkills(load.guard.skills, inst.skillClass.skills)) return FORBIDDEN;
      if (blockerFor(scenario, demand, load, inst.pattern.start, inst.pattern.end, paidMs)) return FORBIDDEN;
      const hoursBefore = load.weekMs[week] / HOUR;
      const paid = paidMs / HOUR;
      const overtime = Math.max(0, hoursBefore + paid - Math.max(hoursBefore, rules.overtimeAfterHours));
      let c = overtime * rules.hourlyRate * (rules.overtimeFactor - 1);
      // Balance work against contract hours: the fuller a guard's week, the dearer another shift.
      const contract = Math.max(1, load.guard.contractHours);
      c += rules.contractWeight * rules.hourlyRate * 0.5 * ((hoursBefore + paid / 2) / contract);
      if (hoursBefore + paid > load.guard.contractHours) c += rules.contractWeight * rules.hourlyRate * 0.1 * (hoursBefore + paid - load.guard.contractHours);
      if (kind.late) c += rules.fairnessWeight * load.late;
      if (kind.weekend) c += rules.fairnessWeight * load.weekend;
      // Keep guards with rare skills for the shifts that need them.
      const extra = load.guard.skills.filter((s) => relevant.has(s) && !inst.skillClass.skills.includes(s)).length;
      c += extra * rules.hourlyRate * 0.25;
      return c;
    });
    // One "nobody" column per instance keeps the assignment feasible when guards run out.
    for (let k = 0; k < instances.length; k++) row.push(unassignedCost);
    return row;
  });
  const choice = assignMinCost(cost, guards.length + instances.length);
  instances.forEach((inst, r) => {
    const col = choice[r];
    if (col < 0 || col >= guards.length) return;
    const load = guards[col];
    const paidMs = inst.pattern.workMs + (rules.paidBreaks ? inst.pattern.breakMs : 0);
    inst.guard = load.guard.id;
    commitShift(load, Math.floor(inst.day / 7), inst.pattern.start, inst.pattern.end, paidMs, shiftKind(scenario, demand, inst.pattern.start, inst.pattern.end, inst.day));
  });
}
