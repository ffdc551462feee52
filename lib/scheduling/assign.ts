// Guards to shifts, day by day: an exact minimum-cost assignment per day under rest, weekly maximum, skills and availability,
// with costs for overtime, contract hours and a fair spread of late and weekend shifts.
import type { SkillClass } from "./cover";
import { hasSkills, isUnavailable, type Demand } from "./demand";
import { assignMinCost, FORBIDDEN } from "./hungarian";
import type { ShiftPattern } from "./patterns";
import { weekdayNames, type Guard, type Scenario } from "./scenario";
import { formatClock, HOUR, weekdayIndex } from "./time";
import { LABOUR_RULES } from "./rules/registry";

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
const kindCache = new WeakMap<Demand, Map<string, { late: boolean; weekend: boolean }>>();

export function shiftKind(scenario: Scenario, demand: Demand, start: number, end: number, day: number): { late: boolean; weekend: boolean } {
  const cache = kindCache.get(demand) ?? new Map();
  kindCache.set(demand, cache);
  const key = `${start}-${end}`;
  const known = cache.get(key);
  if (known) return known;
  const kind = computeShiftKind(scenario, demand, start, end, day);
  cache.set(key, kind);
  return kind;
}

function computeShiftKind(scenario: Scenario, demand: Demand, start: number, end: number, day: number): { late: boolean; weekend: boolean } {
  const endClock = formatClock(scenario.timezone, end);
  const startDate = demand.days[day].date;
  return { late: endClock >= "20:00" || end - start > 0 && endClock < formatClock(scenario.timezone, start), weekend: weekdayIndex(scenario.timezone, startDate) >= 5 };
}

/**
 * Which labour rule keeps a guard off [start, end) with `paidMs` paid, or null when none does: the
 * blockers of the rule registry (rules/registry.ts), the same modules whose checks judge the roster.
 */
export function blockerFor(scenario: Scenario, demand: Demand, load: GuardLoad, start: number, end: number, paidMs: number): string | null {
  const blocked = LABOUR_RULES.find((rule) => rule.blocks?.({ scenario, demand, guard: load.guard, shifts: load.shifts, start, end, paidMs }));
  return blocked?.name ?? null;
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
  // Identical instances (same pattern and class) share one cost row; rows differ only in which instance they are.
  const rowCache = new Map<string, number[]>();
  const extraSkills = new Map<string, number>();
  const cost = instances.map((inst) => {
    const key = `${inst.pattern.start}-${inst.pattern.end}-${inst.pattern.breakOffsets.join(",")}-${inst.skillClass.key}`;
    const cached = rowCache.get(key);
    if (cached) return cached;
    const paidMs = inst.pattern.workMs + (rules.paidBreaks ? inst.pattern.breakMs : 0);
    const week = Math.floor(inst.day / 7);
    const kind = shiftKind(scenario, demand, inst.pattern.start, inst.pattern.end, inst.day);
    const weekday = weekdayIndex(scenario.timezone, demand.days[inst.day].date);
    const row: number[] = [];
    for (const load of guards) {
      if (!hasSkills(load.guard.skills, inst.skillClass.skills) || blockerFor(scenario, demand, load, inst.pattern.start, inst.pattern.end, paidMs)) {
        row.push(FORBIDDEN);
        continue;
      }
      const hoursBefore = load.weekMs[week] / HOUR;
      const paid = paidMs / HOUR;
      const overtime = Math.max(0, hoursBefore + paid - Math.max(hoursBefore, rules.overtimeAfterHours));
      let c = overtime * rules.hourlyRate * (rules.overtimeFactor - 1);
      // Balance work against contract hours: the fuller a guard's week, the dearer another shift.
      const contract = Math.max(1, load.guard.contractHours);
      c += rules.contractWeight * rules.hourlyRate * 0.5 * ((hoursBefore + paid / 2) / contract);
      if (hoursBefore + paid > load.guard.contractHours) c += rules.contractWeight * rules.hourlyRate * 0.1 * (hoursBefore + paid - load.guard.contractHours);
      if (kind.late) c += rules.fairnessWeight * load.late;
      if (kind.late && load.guard.prefers.noLateShifts) c += rules.preferenceWeight;
      if (load.guard.prefers.daysOff.includes(weekdayNames[weekday])) c += rules.preferenceWeight;
      if (kind.weekend) c += rules.fairnessWeight * load.weekend;
      // Keep guards with rare skills for the shifts that need them.
      const extraKey = `${load.guard.id}|${inst.skillClass.key}`;
      let extra = extraSkills.get(extraKey);
      if (extra === undefined) {
        extra = load.guard.skills.filter((s) => relevant.has(s) && !inst.skillClass.skills.includes(s)).length;
        extraSkills.set(extraKey, extra);
      }
      row.push(c + extra * rules.hourlyRate * 0.25);
    }
    // One "nobody" column per instance keeps the assignment feasible when guards run out.
    for (let k = 0; k < instances.length; k++) row.push(unassignedCost);
    rowCache.set(key, row);
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

/** Guard loads rebuilt from finished shifts (for repair and gap filling). */
export function loadsFromShifts(scenario: Scenario, demand: Demand, shifts: { guard: string; start: number; end: number; segments: { start: number; end: number }[]; breaks: { start: number; end: number }[] }[]): Map<string, GuardLoad> {
  const loads = newLoads(scenario, Math.ceil(scenario.days / 7));
  for (const s of [...shifts].sort((a, b) => a.start - b.start)) {
    const load = loads.get(s.guard);
    if (!load) continue;
    const paid = s.segments.reduce((a, x) => a + x.end - x.start, 0) + (scenario.rules.paidBreaks ? s.breaks.reduce((a, x) => a + x.end - x.start, 0) : 0);
    const day = Math.max(0, demand.dayStarts.findIndex((t, i) => t <= s.start && s.start < (demand.dayStarts[i + 1] ?? Infinity)));
    commitShift(load, Math.floor(day / 7), s.start, s.end, paid, shiftKind(scenario, demand, s.start, s.end, Math.min(day, demand.days.length - 1)));
  }
  return loads;
}
