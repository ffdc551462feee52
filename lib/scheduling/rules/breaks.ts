// Hard rule: a shift longer than breakAfterHours has breaks of at least breakMinutes, and no stretch of work exceeds breakAfterHours (EU Directive 2003/88/EC, Art. 4; the length is left to national law).
import type { Roster, Violation } from "../roster";
import { HOUR, MINUTE } from "../time";
import { EPSILON_MS, hoursText, type RuleContext } from "./context";

export const BREAKS = "breaks";

/** Longest run of work (segments back to back, no break between) in a shift. */
export function longestWorkStretch(shift: Roster["shifts"][number]): { ms: number; from: number } {
  const parts = [...shift.segments.map((s) => ({ ...s, work: true })), ...shift.breaks.map((b) => ({ ...b, work: false }))].sort((a, b) => a.start - b.start);
  let best = { ms: 0, from: shift.start };
  let runStart: number | null = null;
  let runEnd = 0;
  for (const part of parts) {
    if (!part.work) {
      runStart = null;
      continue;
    }
    if (runStart === null || part.start > runEnd + EPSILON_MS) runStart = part.start;
    runEnd = part.end;
    if (runEnd - runStart > best.ms) best = { ms: runEnd - runStart, from: runStart };
  }
  return best;
}

export function checkBreaks(ctx: RuleContext, roster: Roster): Violation[] {
  const { breakAfterHours, breakMinutes } = ctx.scenario.rules;
  const violations: Violation[] = [];
  for (const shift of roster.shifts) {
    const length = shift.end - shift.start;
    const breakTime = shift.breaks.reduce((sum, b) => sum + (b.end - b.start), 0);
    const stretch = longestWorkStretch(shift);
    if (length > breakAfterHours * HOUR + EPSILON_MS && breakTime < breakMinutes * MINUTE - EPSILON_MS)
      violations.push({ rule: BREAKS, guard: shift.guard, start: shift.start, end: shift.end, message: `${shift.guard}'s ${hoursText(length)} shift from ${ctx.at(shift.start)} has ${Math.round(breakTime / MINUTE)} min of breaks; it needs at least ${breakMinutes} min` });
    else if (stretch.ms > breakAfterHours * HOUR + EPSILON_MS)
      violations.push({ rule: BREAKS, guard: shift.guard, start: stretch.from, end: stretch.from + stretch.ms, message: `${shift.guard} works ${hoursText(stretch.ms)} without a break from ${ctx.at(stretch.from)}; place a break within ${breakAfterHours} h` });
  }
  return violations;
}
