// Hard rule: a guard's paid hours in any 7 days stay within maxHours (EU Directive 2003/88/EC, Art. 6: 48 hours on average).
import { paidMs, type Roster, type Violation } from "../roster";
import { HOUR } from "../time";
import { EPSILON_MS, hoursText, type RuleContext } from "./context";
import { shiftsByGuard } from "./rest";
import type { Guard } from "../scenario";

export const WEEKLY_MAX = "weekly-max";
export const CONTRACT_HOURS = "contract-hours";

/**
 * The hours a guard may be paid in any 7 x 24 real hours: the legal maximum (maxHours) and, when
 * the guard states the extra hours they accept, their contract plus that extra. The engine's
 * blocker, the rule checks, the explanations and the cost bound all read it from here.
 */
export function weeklyLimitHours(guard: Pick<Guard, "maxHours" | "contractHours" | "extraHours">): number {
  return guard.extraHours === undefined ? guard.maxHours : Math.min(guard.maxHours, guard.contractHours + guard.extraHours);
}

/** Which limit binds a guard's week: the contract (plus accepted extra) or the legal maximum. */
export function bindingLimit(guard: Pick<Guard, "maxHours" | "contractHours" | "extraHours">): typeof CONTRACT_HOURS | typeof WEEKLY_MAX {
  return guard.extraHours !== undefined && guard.contractHours + guard.extraHours < guard.maxHours ? CONTRACT_HOURS : WEEKLY_MAX;
}
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

/**
 * The engine's test: with `paidMs` more paid time in [start, end), would some window of 7 x 24 real
 * hours holding it pay the guard past weeklyLimitHours? Conservative: each shift the window touches
 * counts in full.
 */
export function weeklyBlocks(guard: Pick<Guard, "maxHours" | "contractHours" | "extraHours">, shifts: readonly { start: number; end: number; paidMs: number }[], start: number, end: number, paidMs: number): boolean {
  const limit = weeklyLimitHours(guard) * HOUR + EPSILON_MS;
  const near = shifts.filter((s) => s.end > end - WEEK && s.start < start + WEEK);
  const anchors = [start, end - WEEK, ...near.map((s) => s.start), ...near.map((s) => s.end - WEEK)].filter((a) => a > end - WEEK - 1 && a <= start);
  for (const from of anchors) {
    const to = from + WEEK;
    const paid = near.reduce((sum, s) => sum + (s.end > from && s.start < to ? s.paidMs : 0), 0);
    if (paid + paidMs > limit) return true;
  }
  return false;
}

/** Hard rule: paid hours in any 7 days stay within the guard's contract plus the extra they accept. */
export function checkContractHours(ctx: RuleContext, roster: Roster): Violation[] {
  const violations: Violation[] = [];
  for (const [guard, shifts] of shiftsByGuard(roster)) {
    const g = ctx.guards.get(guard);
    if (!g || g.extraHours === undefined) continue;
    const limit = (g.contractHours + g.extraHours) * HOUR;
    const worst = maxPaidInAnyWeek(paidIntervals(shifts, ctx.scenario.rules.paidBreaks));
    if (worst.ms > limit + EPSILON_MS)
      violations.push({
        rule: CONTRACT_HOURS,
        guard,
        start: worst.from,
        end: worst.from + WEEK,
        message: `${guard} is paid for ${hoursText(worst.ms)} in the 7 days from ${ctx.at(worst.from)}, above their contract of ${g.contractHours} h plus the ${g.extraHours} h extra they accept; move a shift to another guard`,
      });
  }
  return violations;
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
