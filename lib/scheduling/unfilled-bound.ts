// A proven lower bound on the unfilled post-hours of any roster for the scenario, with the binding
// reason in words. Three valid bounds, each a lower bound on the same week's unfilled hours, of
// which the largest counts (the maximum of lower bounds is a lower bound):
//
// 1. Hour by hour: a guard stands at one post at a time, so in a slot at most as many posts are
//    staffed as guards are free then (not on leave); for posts that need a skill, at most as many
//    as free guards with it. Summed over the slots of the week (slots are disjoint).
// 2. Far-apart hours of one day: where the opening lasts no longer than the minimum rest, no guard
//    can work two shifts that both reach into it (the rest between them would not fit), so a guard
//    covers two hours of that day only if one shift spans both; two hours further apart than the
//    longest shift need different guards: staffed(t1) + staffed(t2) <= free guards at either.
//    The best such pair of the day replaces its two hours' terms of bound 1.
// 3. The week's hours: a guard is paid at most their weekly limit (contract plus accepted extra, or
//    the legal maximum; rules/weeklyMax.ts) in any 7 x 24 hours, and every staffed post-hour is a
//    paid hour of one guard; so staffed post-hours <= the sum of the limits of the guards who may
//    stand there (with the skill, for posts that need it). Applied when the week's opening hours fit
//    in one window of 7 x 24 hours.
//
// Per week, for all posts and for the posts of each skill, the largest of these; then the largest
// over those classes (unfilled on a class's posts is part of the week's unfilled); summed over weeks.
import { isPostClosed, type Demand } from "./demand";
import type { Scenario } from "./scenario";
import { formatLocal, HOUR } from "./time";
import { weeklyLimitHours } from "./rules/weeklyMax";

export interface UnfilledBound {
  /** No roster of this scenario leaves fewer post-hours unfilled. */
  postHours: number;
  /** The binding reason of the largest week's bound, in words a manager can act on; null when 0. */
  reason: string | null;
}

const WEEK = 7 * 24 * HOUR;
const round = (h: number) => Math.round(h * 100) / 100;

interface Term {
  hours: number;
  reason: string;
}

export function unfilledLowerBound(scenario: Scenario, demand: Demand): UnfilledBound {
  const rules = scenario.rules;
  const skills = [...new Set(scenario.posts.flatMap((p) => p.skills))].sort();
  // A class of posts and the guards who may stand at them: every post and every guard, or the posts
  // that need a skill and the guards who have it.
  const classes = [
    { label: "posts", skill: null as string | null, posts: scenario.posts, guards: scenario.guards },
    ...skills.map((skill) => ({
      label: `posts needing ${skill}`,
      skill,
      posts: scenario.posts.filter((p) => p.skills.includes(skill)),
      guards: scenario.guards.filter((g) => g.skills.includes(skill)),
    })),
  ];
  const free = (guards: Scenario["guards"], start: number, end: number) =>
    guards.filter((g) => !(demand.unavailable.get(g.id) ?? []).some((u) => u.start < end && start < u.end));
  const demanded = (posts: Scenario["posts"], start: number, end: number) => posts.filter((p) => !isPostClosed(demand, p.id, start, end)).length;

  const weeks = Math.max(1, Math.ceil(scenario.days / 7));
  let total = 0;
  let best: Term | null = null;
  for (let w = 0; w < weeks; w++) {
    const days = demand.days.filter((d) => d.day >= 7 * w && d.day < 7 * (w + 1) && d.open !== null);
    let weekBest: Term | null = null;
    for (const cls of classes) {
      if (cls.posts.length === 0) continue;
      const who = cls.skill ? `guards with ${cls.skill}` : "guards";
      // Bounds 1 and 2, day by day.
      let hourly = 0;
      let hourlyReason: string | null = null;
      let hourlyWorst = 0;
      for (const day of days) {
        const slots = day.slots.map((i) => demand.slots[i]!);
        const single = slots.map((s) => {
          const need = demanded(cls.posts, s.start, s.end);
          const have = free(cls.guards, s.start, s.end).length;
          return { s, need, have, short: Math.max(0, need - have) * ((s.end - s.start) / HOUR) };
        });
        const base = single.reduce((sum, x) => sum + x.short, 0);
        let dayBound = base;
        let dayReason: string | null = null;
        const worst = single.reduce((a, b) => (b.short > a.short ? b : a), single[0]!);
        if (worst && worst.short > 0) dayReason = `at ${formatLocal(scenario.timezone, worst.s.start)}, ${worst.need} ${cls.label} are open and ${worst.have} ${who} are free`;
        const length = (day.close! - day.open!) / HOUR;
        if (length <= rules.minRestHours + 1e-9) {
          for (let i = 0; i < single.length; i++) {
            for (let j = i + 1; j < single.length; j++) {
              const a = single[i]!;
              const b = single[j]!;
              if (b.s.end - a.s.start <= rules.maxShiftHours * HOUR + 1000) continue;
              const either = new Set([...free(cls.guards, a.s.start, a.s.end), ...free(cls.guards, b.s.start, b.s.end)].map((g) => g.id)).size;
              const slotHours = Math.min(a.s.end - a.s.start, b.s.end - b.s.start) / HOUR;
              const pair = Math.max(0, a.need + b.need - either) * slotHours;
              // One pair replaces its own two hours' terms (the other hours keep theirs).
              const withPair = base - a.short - b.short + pair;
              if (withPair > dayBound + 1e-9) {
                dayBound = withPair;
                dayReason = `on ${day.date} the ${formatLocal(scenario.timezone, a.s.start).slice(11)} and ${formatLocal(scenario.timezone, b.s.start).slice(11)} hours lie further apart than the longest shift (${rules.maxShiftHours} h), so they need ${a.need + b.need} different ${who}; ${either} are free`;
              }
            }
          }
        }
        hourly += dayBound;
        if (dayBound > hourlyWorst && dayReason) [hourlyWorst, hourlyReason] = [dayBound, dayReason];
      }
      let term: Term = { hours: hourly, reason: hourlyReason ? `${hourlyReason}: at least ${round(hourly)} post-hours stay unfilled; add guards${cls.skill ? ` with ${cls.skill}` : ""} or shorten the day` : "" };
      // Bound 3, the week's paid hours.
      if (days.length > 0 && days[days.length - 1]!.close! - days[0]!.open! <= WEEK) {
        let need = 0;
        for (const day of days) for (const i of day.slots) need += demanded(cls.posts, demand.slots[i]!.start, demand.slots[i]!.end) * ((demand.slots[i]!.end - demand.slots[i]!.start) / HOUR);
        const capacity = cls.guards.reduce((sum, g) => sum + weeklyLimitHours(g), 0);
        const weekly = Math.max(0, need - capacity);
        if (weekly > term.hours + 1e-9) {
          term = {
            hours: weekly,
            reason: `${cls.label} ask for ${round(need)} post-hours in the week from ${days[0]!.date}; the ${cls.guards.length} ${who} may work at most ${round(capacity)} h (contract plus accepted extra, within the legal maximum): at least ${round(weekly)} post-hours stay unfilled; add guards${cls.skill ? ` with ${cls.skill}` : ""} or let them work more`,
          };
        }
      }
      if (!weekBest || term.hours > weekBest.hours + 1e-9) weekBest = term;
    }
    if (weekBest && weekBest.hours > 0) {
      total += weekBest.hours;
      if (!best || weekBest.hours > best.hours) best = weekBest;
    }
  }
  return { postHours: round(total), reason: best && best.hours > 0 ? best.reason : null };
}
