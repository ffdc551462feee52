// Hard rule: each shift lasts between minShiftHours and maxShiftHours of real time.
import type { Roster, Violation } from "../roster";
import { HOUR } from "../time";
import { EPSILON_MS, hoursText, type RuleContext } from "./context";

export const SHIFT_LENGTH = "shift-length";

export function checkShiftLength(ctx: RuleContext, roster: Roster): Violation[] {
  const { minShiftHours, maxShiftHours } = ctx.scenario.rules;
  const violations: Violation[] = [];
  for (const shift of roster.shifts) {
    const length = shift.end - shift.start;
    if (length < minShiftHours * HOUR - EPSILON_MS)
      violations.push({ rule: SHIFT_LENGTH, guard: shift.guard, start: shift.start, end: shift.end, message: `${shift.guard}'s shift from ${ctx.at(shift.start)} lasts ${hoursText(length)}, shorter than the minimum ${minShiftHours} h; lengthen it or give it to a guard already on shift` });
    else if (length > maxShiftHours * HOUR + EPSILON_MS)
      violations.push({ rule: SHIFT_LENGTH, guard: shift.guard, start: shift.start, end: shift.end, message: `${shift.guard}'s shift from ${ctx.at(shift.start)} lasts ${hoursText(length)}, longer than the maximum ${maxShiftHours} h; split it between two guards` });
  }
  return violations;
}
