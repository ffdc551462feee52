// Hard rule: no unbroken stay at one post longer than maxHoursAtOnePost (common practice: rotation keeps guards alert; no published source).
import type { Roster, Violation } from "../roster";
import { HOUR } from "../time";
import { EPSILON_MS, hoursText, type RuleContext } from "./context";

export const ROTATION = "rotation";

export function checkRotation(ctx: RuleContext, roster: Roster): Violation[] {
  const limit = ctx.scenario.rules.maxHoursAtOnePost * HOUR;
  const violations: Violation[] = [];
  for (const shift of roster.shifts) {
    const segments = [...shift.segments].sort((a, b) => a.start - b.start);
    let i = 0;
    while (i < segments.length) {
      let j = i;
      while (j + 1 < segments.length && segments[j + 1].post === segments[i].post && segments[j + 1].start <= segments[j].end + EPSILON_MS) j++;
      const stay = segments[j].end - segments[i].start;
      if (stay > limit + EPSILON_MS)
        violations.push({ rule: ROTATION, guard: shift.guard, post: segments[i].post, start: segments[i].start, end: segments[j].end, message: `${shift.guard} stays ${hoursText(stay)} at post ${segments[i].post} from ${ctx.at(segments[i].start)}; rotate after ${limit / HOUR} h` });
      i = j + 1;
    }
  }
  return violations;
}
