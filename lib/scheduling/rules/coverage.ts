// Hard rule: each post is staffed by exactly one guard in every open slot, or the slot is listed as unfilled with a reason.
import { isPostClosed } from "../demand";
import type { Roster, Violation } from "../roster";
import type { RuleContext } from "./context";

export const COVERAGE = "coverage";

export function checkCoverage(ctx: RuleContext, roster: Roster): Violation[] {
  const violations: Violation[] = [];
  const byPost = new Map<string, { guard: string; start: number; end: number }[]>();
  for (const shift of roster.shifts)
    for (const s of shift.segments) {
      if (!ctx.posts.has(s.post)) {
        violations.push({ rule: COVERAGE, guard: shift.guard, post: s.post, start: s.start, end: s.end, message: `${shift.guard} is placed at post ${s.post}, which is not in the scenario` });
        continue;
      }
      const list = byPost.get(s.post) ?? [];
      list.push({ guard: shift.guard, start: s.start, end: s.end });
      byPost.set(s.post, list);
    }
  const unfilled = new Set(roster.unfilled.map((u) => `${u.post}@${u.start}`));
  const openSpans = ctx.demand.days.filter((d) => d.open !== null).map((d) => [d.open!, d.close!] as const);
  for (const post of ctx.scenario.posts) {
    const segments = byPost.get(post.id) ?? [];
    for (const s of segments) {
      if (!openSpans.some(([open, close]) => s.start >= open && s.end <= close) || isPostClosed(ctx.demand, post.id, s.start, s.end))
        violations.push({ rule: COVERAGE, guard: s.guard, post: post.id, start: s.start, end: s.end, message: `${s.guard} is placed at post ${post.id} from ${ctx.at(s.start)} to ${ctx.at(s.end)}, outside opening hours` });
    }
    for (const slot of ctx.demand.slots) {
      if (isPostClosed(ctx.demand, post.id, slot.start, slot.end)) continue;
      const here = segments.filter((s) => s.start < slot.end && slot.start < s.end);
      const whole = here.filter((s) => s.start <= slot.start && s.end >= slot.end);
      const isUnfilled = unfilled.has(`${post.id}@${slot.start}`);
      if (here.length === 1 && whole.length === 1 && !isUnfilled) continue;
      if (here.length === 0 && isUnfilled) continue;
      const when = `${ctx.at(slot.start)}–${ctx.at(slot.end).slice(11)}`;
      let message: string;
      if (here.length === 0) message = `post ${post.id} has no guard at ${when} and is not listed as unfilled`;
      else if (isUnfilled) message = `post ${post.id} at ${when} is listed as unfilled but ${here.map((s) => s.guard).join(", ")} stands there`;
      else if (here.length > 1) message = `post ${post.id} has ${here.length} guards at ${when} (${here.map((s) => s.guard).join(", ")}); keep one`;
      else message = `post ${post.id} is staffed only for part of ${when}`;
      violations.push({ rule: COVERAGE, post: post.id, guard: here[0]?.guard, start: slot.start, end: slot.end, message });
    }
  }
  return violations;
}
