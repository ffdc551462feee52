// Hard rule: at least minRestHours of real time between a guard's shifts (EU Directive 2003/88/EC, Art. 3: 11 consecutive hours per 24).
import type { Roster, Violation } from "../roster";
import { HOUR } from "../time";
import { EPSILON_MS, hoursText, type RuleContext } from "./context";

export const REST = "rest";

/** The engine's test: would [start, end) leave less than minRestHours after or before another shift? */
export function restBlocks(minRestHours: number, shifts: readonly { start: number; end: number }[], start: number, end: number): boolean {
  const rest = minRestHours * HOUR - EPSILON_MS;
  return shifts.some((s) => (s.end <= start && start - s.end < rest) || (end <= s.start && s.start - end < rest));
}

export function checkRest(ctx: RuleContext, roster: Roster): Violation[] {
  const minRest = ctx.scenario.rules.minRestHours * HOUR;
  const violations: Violation[] = [];
  for (const [guard, shifts] of shiftsByGuard(roster)) {
    for (let i = 1; i < shifts.length; i++) {
      const gap = shifts[i].start - shifts[i - 1].end;
      // Overlapping shifts are the one-place rule's business.
      if (gap >= 0 && gap < minRest - EPSILON_MS)
        violations.push({ rule: REST, guard, start: shifts[i - 1].end, end: shifts[i].start, message: `${guard} rests only ${hoursText(gap)} between the shift ending ${ctx.at(shifts[i - 1].end)} and the one starting ${ctx.at(shifts[i].start)}; at least ${ctx.scenario.rules.minRestHours} h are required` });
    }
  }
  return violations;
}

/** Each guard's shifts in time order. */
export function shiftsByGuard(roster: Roster): Map<string, Roster["shifts"]> {
  const map = new Map<string, Roster["shifts"]>();
  for (const shift of roster.shifts) {
    const list = map.get(shift.guard) ?? [];
    list.push(shift);
    map.set(shift.guard, list);
  }
  for (const list of map.values()) list.sort((a, b) => a.start - b.start);
  return map;
}
