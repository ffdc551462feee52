// Hard rule: a guard works a post only with all of the post's skills.
import { hasSkills } from "../demand";
import type { Roster, Violation } from "../roster";
import type { RuleContext } from "./context";

export const SKILLS = "skills";

export function checkSkills(ctx: RuleContext, roster: Roster): Violation[] {
  const violations: Violation[] = [];
  for (const shift of roster.shifts) {
    const guard = ctx.guards.get(shift.guard);
    if (!guard) continue;
    for (const s of shift.segments) {
      const post = ctx.posts.get(s.post);
      if (!post || hasSkills(guard.skills, post.skills)) continue;
      const missing = post.skills.filter((k) => !guard.skills.includes(k));
      violations.push({ rule: SKILLS, guard: guard.id, post: post.id, start: s.start, end: s.end, message: `${guard.id} lacks skill ${missing.join(", ")} for post ${post.id} from ${ctx.at(s.start)}; place a qualified guard there` });
    }
  }
  return violations;
}
