// Hard rule: a guard's paid hours in any 7 days stay within maxHours (EU Directive 2003/88/EC, Art. 6: 48 hours on average).
import { paidMs, type Roster, type Violation } from "../roster";
import { HOUR } from "../time";
import { EPSILON_MS, hoursText, type RuleContext } from "./context";
import { shiftsByGuard } from "./rest";

export const WEEKLY_MAX = "weekly-max";
const WEEK = 7 * 24 * HOUR;

/** Paid intervals of a guard's shifts (segments, plus breaks when paid). */
export function paidIntervals(shifts: Roster["shifts"], paidBreaks: boolean): { start: number; end: number }[] {
  return shifts.flatMap((s) => [...s.segments, ...(paidBreaks ? s.breaks : [])]).map((p) => ({ start: p.start, end: p.end }));
}

/** The largest paid time in any window of 7 x 24 real hours; the maximum is reached with the window starting at an interval's start or ending at one's end. */
export function maxPaidInAnyWeek(intervals: { start: number; end: number }[]): { ms: number; from: number } {
  let best = { ms: 0, from: intervals[0]?.start ?? 0 };
  const anchors = [...intervals.map((i) => i.start), ...intervals.map((i) => i.end - WEEK)];
  for (const from of anchors) {
    const to = from + WEEK;
    let ms = 0;
    for (const i of intervals) ms += Math.max(0, Math.min(i.end, to) - Math.max(i.start, from));
    if (ms > best.ms) best = { ms, from };
  }
  return best;
}

export function checkWeeklyMax(ctx: RuleContext, roster: Roster): Violation[] {
  const violations: Violation[] = [];
  for (const [guard, shifts] of shiftsByGuard(roster)) {
    const limit = (ctx.guards.get(guard)?.maxHours ?? 48) * HOUR;
    const worst = maxPaidInAnyWeek(paidIntervals(shifts, ctx.scenario.rules.paidBreaks));
    if (worst.ms > limit + EPSILON_MS)
      violations.push({ rule: WEEKLY_MAX, guard, start: worst.from, end: worst.from + WEEK, message: `${guard} is paid for ${hoursText(worst.ms)} in the 7 days from ${ctx.at(worst.from)}, above their maximum ${limit / HOUR} h; move a shift to another guard` });
  }
  return violations;
}
