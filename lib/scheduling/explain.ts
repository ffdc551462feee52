// Why a post-slot is unfilled: counts, for every guard, the first reason they could not stand there, in words a manager can act on.
import { hasSkills, isUnavailable, type Demand } from "./demand";
import type { Shift } from "./roster";
import type { Scenario } from "./scenario";
import { formatClock, HOUR } from "./time";
import { bindingLimit, CONTRACT_HOURS, WEEKLY_MAX } from "./rules/weeklyMax";
import { REST } from "./rules/rest";
import { labourRule } from "./rules/registry";
import { paidMs } from "./roster";

export function explainUnfilled(scenario: Scenario, demand: Demand, shifts: Shift[], postId: string, slotStart: number, slotEnd: number): string {
  const rules = scenario.rules;
  const post = scenario.posts.find((p) => p.id === postId)!;
  const skillText = post.skills.length ? ` with skill ${post.skills.join(" and ")}` : "";
  if (scenario.guards.length === 0) return "no guards in the scenario; add guards";
  const qualified = scenario.guards.filter((g) => hasSkills(g.skills, post.skills));
  if (qualified.length === 0) return `no guard has skill ${post.skills.filter((s) => !scenario.guards.some((g) => g.skills.includes(s))).join(" and ") || post.skills.join(" and ")}; train or hire one, or drop the skill from post ${post.id}`;
  const day = demand.days.find((d) => d.open !== null && d.open <= slotStart && slotStart < d.close!);
  if (day && day.close! - day.open! < rules.minShiftHours * HOUR - 1000)
    return `opening on ${day.date} lasts ${((day.close! - day.open!) / HOUR).toFixed(1)} h, shorter than the minimum shift of ${rules.minShiftHours} h; lower minShiftHours or extend the opening`;
  const counts = new Map<string, number>();
  const restUntil: number[] = [];
  const add = (what: string) => counts.set(what, (counts.get(what) ?? 0) + 1);
  const byGuard = new Map<string, Shift[]>();
  for (const s of shifts) byGuard.set(s.guard, [...(byGuard.get(s.guard) ?? []), s]);
  for (const guard of qualified) {
    const own = byGuard.get(guard.id) ?? [];
    const current = own.find((s) => s.start < slotEnd && slotStart < s.end);
    if (isUnavailable(demand, guard.id, slotStart, slotEnd)) add("on leave");
    else if (current) {
      const onBreak = current.breaks.some((b) => b.start < slotEnd && slotStart < b.end);
      // Off post right after the longest allowed stay here: rotation, not rest, keeps them away.
      const stayEnd = current.segments.filter((x) => x.post === postId && x.end === slotStart);
      const rotated = onBreak && stayEnd.length > 0 && stayLength(current.segments, postId, slotStart) >= rules.maxHoursAtOnePost * HOUR - 1000;
      add(rotated ? `rotating off this post after ${rules.maxHoursAtOnePost} h` : onBreak ? "on a break" : "at other posts");
    } else if (day && own.some((s) => s.start >= day.open! && s.start < day.close!)) add("already on a shift that day");
    else {
      // The rest and weekly rules' own blockers (rules/registry.ts) decide, on the shortest legal
      // shift holding this slot, with paid time counted as the rules count it.
      const rest = rules.minRestHours * HOUR;
      const paid = own.map((s) => ({ start: s.start, end: s.end, paidMs: paidMs(s, rules.paidBreaks) }));
      const shortest = { start: slotStart, end: Math.max(slotEnd, slotStart + rules.minShiftHours * HOUR) };
      const question = { scenario, demand, guard, shifts: paid, ...shortest, paidMs: shortest.end - shortest.start };
      if (labourRule(REST).blocks!({ ...question, start: slotStart, end: slotEnd })) {
        const before = own.filter((s) => s.end <= slotStart && slotStart - s.end < rest);
        if (before.length) {
          add(labourRule(REST).reason!);
          restUntil.push(Math.max(...before.map((s) => s.end + rest)));
        } else add("resting before their next shift");
      } else {
        const limit = bindingLimit(guard) === CONTRACT_HOURS ? labourRule(CONTRACT_HOURS) : labourRule(WEEKLY_MAX);
        if (labourRule(WEEKLY_MAX).blocks!(question) || labourRule(CONTRACT_HOURS).blocks!(question)) add(limit.reason!);
        else add("free but no legal shift fits the gap");
      }
    }
  }
  const parts: string[] = [];
  for (const [what, n] of [...counts.entries()].sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1))) {
    if (what === "resting" && restUntil.length) parts.push(`${n} resting until ${formatClock(scenario.timezone, Math.min(...restUntil))} or later`);
    else parts.push(`${n} ${what}`);
  }
  const unqualified = scenario.guards.length - qualified.length;
  if (post.skills.length && unqualified > 0) parts.push(`${unqualified} without the skill`);
  const advice = counts.has("free but no legal shift fits the gap") ? "; add a short shift or move a break" : "; add a guard or move a shift";
  return `no guard${skillText} is free: ${parts.join(", ")}${advice}`;
}

/** Unbroken time at a post up to `until` (segments back to back at the same post). */
function stayLength(segments: Shift["segments"], post: string, until: number): number {
  let start = until;
  for (;;) {
    const before = segments.find((x) => x.post === post && x.end === start);
    if (!before) return until - start;
    start = before.start;
  }
}
