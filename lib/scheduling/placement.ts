// Guards on duty to posts, slot by slot: stay while rotation allows, otherwise an exact minimum-cost matching of
// movers to free posts (relief cover for breaks falls out of it: whoever is on duty and free takes the post).
// Rooms first: when not every post can be staffed, each room nobody guards yet has a lead post (the one
// the most guards qualify for) whose gap costs far more than another post's, high-risk rooms most, so
// the matching keeps one guard in every room it can before a second in any room.
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
    let result = matchMovers(movers, freePosts, where, guards, false, emptyCosts(scenario, taken, working, guards));
    // When movers cannot fill every free post, re-match everybody on duty (a staying guard may swap to
    // free a skilled post, or to keep another room guarded).
    if (result.unmatchedPosts > 0 && result.idleMovers < working.length) {
      const all = matchMovers(working, posts, where, guards, true, emptyCosts(scenario, new Map(), working, guards), slot.end, limitMs);
      if (all.gapCost < result.gapCost || (all.gapCost === result.gapCost && all.unmatchedPosts < result.unmatchedPosts)) {
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

/** What leaving a post empty costs in the matching: a plain post 1000. */
export const EMPTY_POST_COST = 1000;
/** A room's lead post when nobody else guards the room: 10 plain gaps, 20 in a high-risk room. */
export const EMPTY_ROOM_COST = { standard: 10 * EMPTY_POST_COST, high: 20 * EMPTY_POST_COST } as const;

/**
 * The cost of leaving each post empty this slot: EMPTY_POST_COST, except the lead post of every room
 * no staying guard covers, which costs EMPTY_ROOM_COST by the room's risk. The lead is the room's
 * post that the most guards on duty qualify for (then the first listed).
 */
function emptyCosts(scenario: Scenario, taken: Map<string, ShiftInstance>, working: ShiftInstance[], guards: Map<string, Guard>): Map<string, number> {
  const costs = new Map<string, number>();
  for (const post of scenario.posts) costs.set(post.id, EMPTY_POST_COST);
  for (const room of roomGroups(scenario)) {
    if (room.posts.some((p) => taken.has(p.id))) continue;
    let lead = room.posts[0]!;
    if (room.mixedSkills) {
      let qualified = -1;
      for (const post of room.posts) {
        const n = working.filter((i) => hasSkills(guards.get(i.guard!)!.skills, post.skills)).length;
        if (n > qualified) [lead, qualified] = [post, n];
      }
    }
    costs.set(lead.id, EMPTY_ROOM_COST[room.risk]);
  }
  return costs;
}

const groupsOf = new WeakMap<Scenario, { posts: Scenario["posts"]; risk: "standard" | "high"; mixedSkills: boolean }[]>();

/** The scenario's posts by room (a post without a room is a room of its own), computed once. */
function roomGroups(scenario: Scenario) {
  let groups = groupsOf.get(scenario);
  if (!groups) {
    const rooms = new Map<string, Scenario["posts"]>();
    for (const post of scenario.posts) {
      const name = post.room || post.id;
      rooms.set(name, [...(rooms.get(name) ?? []), post]);
    }
    groups = [...rooms.values()].map((posts) => ({
      posts,
      risk: posts.some((p) => p.risk === "high") ? ("high" as const) : ("standard" as const),
      mixedSkills: new Set(posts.map((p) => [...p.skills].sort().join(","))).size > 1,
    }));
    groupsOf.set(scenario, groups);
  }
  return groups;
}

/** Minimum-cost matching of guards to posts: skills required; staying allowed only within the rotation limit. */
function matchMovers(
  movers: ShiftInstance[],
  freePosts: Scenario["posts"],
  where: Map<ShiftInstance, { post: string; sinceMs: number } | null>,
  guards: Map<string, Guard>,
  everyone: boolean,
  gapCosts: Map<string, number>,
  slotEnd = 0,
  limitMs = 0,
): { pairs: [ShiftInstance, string][]; unmatchedPosts: number; idleMovers: number; gapCost: number } {
  const gapOf = (post: Scenario["posts"][number]) => gapCosts.get(post.id) ?? EMPTY_POST_COST;
  if (movers.length === 0 || freePosts.length === 0) {
    return { pairs: [], unmatchedPosts: freePosts.length, idleMovers: movers.length, gapCost: freePosts.reduce((sum, p) => sum + gapOf(p), 0) };
  }
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
    for (let k = 0; k < freePosts.length; k++) row.push(gapOf(post));
    return row;
  });
  const choice = assignMinCost(cost, movers.length + freePosts.length);
  const pairs: [ShiftInstance, string][] = [];
  let unmatchedPosts = 0;
  let gapCost = 0;
  choice.forEach((col, r) => {
    if (col >= 0 && col < movers.length) pairs.push([movers[col], freePosts[r].id]);
    else {
      unmatchedPosts++;
      gapCost += gapOf(freePosts[r]);
    }
  });
  return { pairs, unmatchedPosts, idleMovers: movers.length - pairs.length, gapCost };
}
