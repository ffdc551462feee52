// Totals of a roster (recomputed from its shifts) and the proven lower bound on the cost of any roster filling the same slots.
import { shiftKind } from "./assign";
import { demandPostHours, type Demand } from "./demand";
import { paidMs, type Roster } from "./roster";
import type { Scenario } from "./scenario";
import { HOUR } from "./time";
import { weeklyLimitHours } from "./rules/weeklyMax";
import { unfilledLowerBound } from "./unfilled-bound";

export interface Totals {
  postHours: number;
  filledPostHours: number;
  unfilledPostHours: number;
  paidHours: number;
  overtimeHours: number;
  cost: number;
  lowerBoundCost: number;
  /** (cost - lowerBoundCost) / lowerBoundCost. */
  gap: number;
  /** No roster of this scenario leaves fewer post-hours unfilled (unfilled-bound.ts). */
  unfilledLowerBound: number;
  /** Why, in words; null when the bound is 0. */
  unfilledBoundReason: string | null;
  /** Guards paid fewer hours than their contract, per week block. */
  contractUnderuse: { guard: string; week: number; paidHours: number; contractHours: number }[];
  /** Spread of late (ending 20:00 or later) and weekend shifts over the guards who work: fewest and most per guard. */
  fairness: { lateShifts: { fewest: number; most: number }; weekendShifts: { fewest: number; most: number } };
}

const round = (x: number, digits = 2) => Math.round(x * 10 ** digits) / 10 ** digits;

/** Splits paid time of every guard into week blocks of 7 scenario days (overtime counts per guard per block). */
export function paidByGuardWeek(scenario: Scenario, demand: Demand, roster: Roster): Map<string, number[]> {
  const weeks = Math.ceil(scenario.days / 7);
  const bounds = Array.from({ length: weeks + 1 }, (_, w) => demand.dayStarts[Math.min(7 * w, scenario.days)]);
  bounds[0] = -Infinity;
  bounds[weeks] = Infinity;
  const map = new Map<string, number[]>(scenario.guards.map((g) => [g.id, new Array(weeks).fill(0)]));
  for (const shift of roster.shifts) {
    const row = map.get(shift.guard) ?? new Array(weeks).fill(0);
    map.set(shift.guard, row);
    for (const part of [...shift.segments, ...(scenario.rules.paidBreaks ? shift.breaks : [])])
      for (let w = 0; w < weeks; w++) row[w] += Math.max(0, Math.min(part.end, bounds[w + 1]) - Math.max(part.start, bounds[w]));
  }
  return map;
}

export function computeTotals(scenario: Scenario, demand: Demand, roster: Roster): Totals {
  const rules = scenario.rules;
  const postHours = demandPostHours(demand);
  const unfilledPostHours = roster.unfilled.reduce((sum, u) => sum + (u.end - u.start), 0) / HOUR;
  const filledMs = roster.shifts.reduce((sum, s) => sum + paidMs(s, false), 0);
  const paidHours = roster.shifts.reduce((sum, s) => sum + paidMs(s, rules.paidBreaks), 0) / HOUR;
  const byWeek = paidByGuardWeek(scenario, demand, roster);
  let overtimeHours = 0;
  const contractUnderuse: Totals["contractUnderuse"] = [];
  const guardById = new Map(scenario.guards.map((g) => [g.id, g]));
  for (const [guard, weeks] of byWeek) {
    weeks.forEach((ms, week) => {
      overtimeHours += Math.max(0, ms / HOUR - rules.overtimeAfterHours);
      const contract = guardById.get(guard)?.contractHours ?? 0;
      const fullWeek = Math.min(7, scenario.days - 7 * week) === 7;
      if (fullWeek && ms / HOUR < contract - 1e-6) contractUnderuse.push({ guard, week, paidHours: round(ms / HOUR), contractHours: contract });
    });
  }
  const cost = rules.hourlyRate * (paidHours + (rules.overtimeFactor - 1) * overtimeHours);
  const lowerBoundCost = lowerBound(scenario, demand, roster);
  return {
    postHours: round(postHours),
    filledPostHours: round(filledMs / HOUR),
    unfilledPostHours: round(unfilledPostHours),
    paidHours: round(paidHours),
    overtimeHours: round(overtimeHours),
    cost: round(cost),
    lowerBoundCost: round(lowerBoundCost),
    gap: lowerBoundCost > 0 ? round((cost - lowerBoundCost) / lowerBoundCost, 4) : 0,
    ...(() => {
      const bound = unfilledLowerBound(scenario, demand);
      return { unfilledLowerBound: bound.postHours, unfilledBoundReason: bound.reason };
    })(),
    contractUnderuse,
    fairness: fairnessOf(scenario, demand, roster),
  };
}

function fairnessOf(scenario: Scenario, demand: Demand, roster: Roster): Totals["fairness"] {
  const late = new Map<string, number>();
  const weekend = new Map<string, number>();
  for (const shift of roster.shifts) {
    const day = Math.max(0, demand.dayStarts.findIndex((t, i) => t <= shift.start && shift.start < (demand.dayStarts[i + 1] ?? Infinity)));
    const kind = shiftKind(scenario, demand, shift.start, shift.end, Math.min(day, demand.days.length - 1));
    late.set(shift.guard, (late.get(shift.guard) ?? 0) + (kind.late ? 1 : 0));
    weekend.set(shift.guard, (weekend.get(shift.guard) ?? 0) + (kind.weekend ? 1 : 0));
  }
  const spread = (m: Map<string, number>) => (m.size ? { fewest: Math.min(...m.values()), most: Math.max(...m.values()) } : { fewest: 0, most: 0 });
  return { lateShifts: spread(late), weekendShifts: spread(weekend) };
}

/**
 * A lower bound on the cost of every roster that fills the same post-slots, for any shift placement:
 * 1. paid hours >= filled post-hours: each filled post-slot is one guard's time at a post, and time at a post is paid;
 *    a guard is in one place at a time, so no hour is counted twice (unpaid breaks add nothing, paid ones only more);
 * 2. in each week block, a guard is paid at most min(maxHours, overtimeAfterHours) hours before overtime starts
 *    (the block lies inside 7 days, so the weekly maximum caps it), hence the block's overtime is at least
 *    filled hours of the block minus the sum of those caps over all guards.
 * cost = rate x (paid + (factor - 1) x overtime) is increasing in both, so rate x (1. + (factor - 1) x 2.) bounds it.
 */
export function lowerBound(scenario: Scenario, demand: Demand, roster: Roster): number {
  const rules = scenario.rules;
  const weeks = Math.ceil(scenario.days / 7);
  const filledByWeek = new Array(weeks).fill(0);
  const starts = demand.dayStarts;
  for (const shift of roster.shifts)
    for (const s of shift.segments) {
      for (let w = 0; w < weeks; w++) {
        const from = w === 0 ? -Infinity : starts[7 * w];
        const to = w === weeks - 1 ? Infinity : starts[7 * (w + 1)];
        filledByWeek[w] += Math.max(0, Math.min(s.end, to) - Math.max(s.start, from)) / HOUR;
      }
    }
  const plainCapacity = scenario.guards.reduce((sum, g) => sum + Math.min(weeklyLimitHours(g), rules.overtimeAfterHours), 0);
  const filled = filledByWeek.reduce((a, b) => a + b, 0);
  const overtime = filledByWeek.reduce((sum, h) => sum + Math.max(0, h - plainCapacity), 0);
  return rules.hourlyRate * (filled + (rules.overtimeFactor - 1) * overtime);
}
