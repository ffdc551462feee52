// Guards on duty to posts, slot by slot: stay while rotation allows, otherwise an exact minimum-cost matching of
// movers to free posts (relief cover for breaks falls out of it: whoever is on duty and free takes the post).
import type { ShiftInstance } from "./assign";
import { hasSkills, type Demand } from "./demand";
import { assignMinCost, FORBIDDEN } from "./hungarian";
import { worksAt } from "./patterns";
import type { Guard, Scenario } from "./scenario";

export interface DayPlacement {
  /** For each instance, per offset: post id, or null when on break or idle. */
  posts: (string | null)[][];
  /** Slot indices (global) with the posts left empty. */
  empty: { slot: number; post: string }[];
}

export function placeDay(scenario: Scenario, demand: Demand, day: number, instances: ShiftInstance[], guards: Map<string, Guard>): DayPlacement {
  const rules = scenario.rules;
  const openDay = demand.days[day];
  const posts = scenario.posts;
  const onDuty = instances.filter((i) => i.guard !== null);
  const placed: (string | null)[][] = instances.map((i) => new Array(i.pattern.length).fill(null));
  const where = new Map<ShiftInstance, { post: string; sinceMs: number } | null>();
  const empty: DayPlacement["empty"] = [];
  const limitMs = rules.maxHoursAtOnePost * 3_600_000 + 1000;

  openDay.slots.forEach((slotIndex, position) => {
    const slot = demand.slots[slotIndex];
    const working = onDuty.filter((i) => worksAt(i.pattern, position - i.pattern.first));
    const taken = new Map<string, ShiftInstance>();
    const movers: ShiftInstance[] = [];
    for (const inst of working) {
      const here = where.get(inst);
      if (here && slot.end - here.sinceMs <= limitMs && !taken.has(here.post)) taken.set(here.post, inst);
      else movers.push(inst);
    }
    let freePosts = posts.filter((p) => !taken.has(p.id));
    let result = matchMovers(movers, freePosts, where, guards, false);
    // When movers cannot fill every free post, re-match everybody on duty (a staying guard may swap to free a skilled post).
    if (result.unmatchedPosts > 0 && result.idleMovers < working.length) {
      const all = matchMovers(working, posts, where, guards, true, slot.end, limitMs);
      if (all.unmatchedPosts < result.unmatchedPosts) {
        taken.clear();
        result = all;
        freePosts = posts;
      }
    }
    for (const [inst, post] of result.pairs) taken.set(post, inst);
    const nextWhere = new Map<ShiftInstance, { post: string; sinceMs: number } | null>();
    for (const inst of working) {
      const post = [...taken.entries()].find(([, i]) => i === inst)?.[0] ?? null;
      const before = where.get(inst);
      nextWhere.set(inst, post === null ? null : { post, sinceMs: before && before.post === post ? before.sinceMs : slot.start });
      placed[instances.indexOf(inst)][position - inst.pattern.first] = post;
    }
    where.clear();
    for (const [k, v] of nextWhere) where.set(k, v);
    for (const post of posts) if (!taken.has(post.id)) empty.push({ slot: slotIndex, post: post.id });
  });
  return { posts: placed, empty };
}

/** Minimum-cost matching of guards to posts: skills required; staying allowed only within the rotation limit. */
function matchMovers(
  movers: ShiftInstance[],
  freePosts: Scenario["posts"],
  where: Map<ShiftInstance, { post: string; sinceMs: number } | null>,
  guards: Map<string, Guard>,
  everyone: boolean,
  slotEnd = 0,
  limitMs = 0,
): { pairs: [ShiftInstance, string][]; unmatchedPosts: number; idleMovers: number } {
  if (movers.length === 0 || freePosts.length === 0) return { pairs: [], unmatchedPosts: freePosts.length, idleMovers: movers.length };
  // Rows = posts (each must get someone if possible), columns = movers plus one "empty" column per post.
  const cost = freePosts.map((post) => {
    const row = movers.map((inst) => {
      const guard = guards.get(inst.guard!)!;
      if (!hasSkills(guard.skills, post.skills)) return FORBIDDEN;
      const here = where.get(inst);
      if (here && here.post === post.id) {
        if (!everyone || slotEnd - here.sinceMs > limitMs) return FORBIDDEN;
        return 0;
      }
      // Skilled guards go to skilled posts first; a move costs one unit.
      return 1 - 0.01 * post.skills.length + 0.001 * (guard.skills.length - post.skills.length);
    });
    for (let k = 0; k < freePosts.length; k++) row.push(1000);
    return row;
  });
  const choice = assignMinCost(cost, movers.length + freePosts.length);
  const pairs: [ShiftInstance, string][] = [];
  let unmatchedPosts = 0;
  choice.forEach((col, r) => {
    if (col >= 0 && col < movers.length) pairs.push([movers[col], freePosts[r].id]);
    else unmatchedPosts++;
  });
  return { pairs, unmatchedPosts, idleMovers: movers.length - pairs.length };
}
