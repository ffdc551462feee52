// Hard rule: a guard never works while unavailable (leave, time off, declared unavailability).
import type { Roster, Violation } from "../roster";
import type { RuleContext } from "./context";

export const AVAILABILITY = "availability";

/** The engine's test: is the guard unavailable at any moment of [start, end)? */
export function availabilityBlocks(unavailable: readonly { start: number; end: number }[] | undefined, start: number, end: number): boolean {
  return (unavailable ?? []).some((u) => u.start < end && start < u.end);
}

export function checkAvailability(ctx: RuleContext, roster: Roster): Violation[] {
  const violations: Violation[] = [];
  for (const shift of roster.shifts) {
    const clash = (ctx.demand.unavailable.get(shift.guard) ?? []).find((u) => u.start < shift.end && shift.start < u.end);
    if (clash)
      violations.push({ rule: AVAILABILITY, guard: shift.guard, start: Math.max(clash.start, shift.start), end: Math.min(clash.end, shift.end), message: `${shift.guard} is unavailable from ${ctx.at(clash.start)} to ${ctx.at(clash.end)} but has a shift from ${ctx.at(shift.start)} to ${ctx.at(shift.end)}; give it to another guard` });
  }
  return violations;
}
