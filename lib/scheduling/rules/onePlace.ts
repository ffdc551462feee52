// Hard rule: a guard is in one place at a time, and a shift is the unbroken union of its segments and breaks.
import type { Roster, Violation } from "../roster";
import { EPSILON_MS, type RuleContext } from "./context";

export const ONE_PLACE = "one-place";

export function checkOnePlace(ctx: RuleContext, roster: Roster): Violation[] {
  const violations: Violation[] = [];
  const byGuard = new Map<string, typeof roster.shifts>();
  for (const shift of roster.shifts) {
    if (!ctx.guards.has(shift.guard)) {
      violations.push({ rule: ONE_PLACE, guard: shift.guard, start: shift.start, end: shift.end, message: `shift from ${ctx.at(shift.start)} belongs to ${shift.guard}, who is not in the scenario` });
      continue;
    }
    const parts = [...shift.segments.map((s) => ({ ...s, what: `post ${s.post}` })), ...shift.breaks.map((b) => ({ ...b, what: "break" }))].sort((a, b) => a.start - b.start);
    let cursor = shift.start;
    let problem: string | null = null;
    for (const part of parts) {
      if (part.end <= part.start) problem = `an empty ${part.what} at ${ctx.at(part.start)}`;
      else if (part.start < cursor - EPSILON_MS) problem = `${part.what} at ${ctx.at(part.start)} overlaps the time before it`;
      else if (part.start > cursor + EPSILON_MS) problem = `a gap from ${ctx.at(cursor)} to ${ctx.at(part.start)} that is neither at a post nor a break`;
      if (problem) break;
      cursor = part.end;
    }
    if (!problem && Math.abs(cursor - shift.end) > EPSILON_MS)
      problem = parts.length === 0 ? "no segments or breaks" : `its parts end at ${ctx.at(cursor)} but the shift ends at ${ctx.at(shift.end)}`;
    if (problem)
      violations.push({ rule: ONE_PLACE, guard: shift.guard, start: shift.start, end: shift.end, message: `${shift.guard}'s shift from ${ctx.at(shift.start)} has ${problem}` });
    const list = byGuard.get(shift.guard) ?? [];
    list.push(shift);
    byGuard.set(shift.guard, list);
  }
  for (const [guard, shifts] of byGuard) {
    const sorted = [...shifts].sort((a, b) => a.start - b.start);
    for (let i = 1; i < sorted.length; i++)
      if (sorted[i].start < sorted[i - 1].end - EPSILON_MS)
        violations.push({ rule: ONE_PLACE, guard, start: sorted[i].start, end: sorted[i - 1].end, message: `${guard} has two shifts at once: from ${ctx.at(sorted[i - 1].start)} and from ${ctx.at(sorted[i].start)}; remove one` });
  }
  return violations;
}
