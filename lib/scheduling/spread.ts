// The last pass of rooms first (after placement.ts and gapFill.ts): where a room open to visitors
// stands empty in a slot while another room has two or more guards, one of those guards who may
// stand at the empty room's post moves there for that slot, high-risk rooms first. Each move leaves
// one fewer room empty and empties none (the guard's own room keeps another guard); a move that would
// keep the guard at one post past maxHoursAtOnePost is not made. The post the guard leaves joins the
// unfilled posts of that slot, so the unfilled count stays the same.
import { hasSkills, type Demand } from "./demand";
import type { Shift } from "./roster";
import type { Scenario } from "./scenario";

/** Moves guards into empty rooms slot by slot; mutates shifts and empty. Returns the number of moves. */
export function spreadToEmptyRooms(scenario: Scenario, demand: Demand, shifts: Shift[], empty: Map<number, string[]>): number {
  const postById = new Map(scenario.posts.map((p) => [p.id, p]));
  const roomOf = (post: string) => postById.get(post)?.room || post;
  const roomPosts = new Map<string, string[]>();
  for (const p of scenario.posts) roomPosts.set(roomOf(p.id), [...(roomPosts.get(roomOf(p.id)) ?? []), p.id]);
  const skills = new Map(scenario.guards.map((g) => [g.id, g.skills]));
  const limitSlots = Math.floor((scenario.rules.maxHoursAtOnePost * 60) / scenario.rules.slotMinutes);

  // Each shift as the slots it spans (one open day's consecutive slots) and the post in each (null: break).
  const plans = shifts.map((shift) => {
    const day = demand.days.find((d) => d.open !== null && d.slots.some((i) => demand.slots[i].start >= shift.start && demand.slots[i].end <= shift.end));
    const slots = (day?.slots ?? []).filter((i) => demand.slots[i].start >= shift.start && demand.slots[i].end <= shift.end);
    const posts = slots.map((i) => shift.segments.find((s) => s.start <= demand.slots[i].start && s.end >= demand.slots[i].end)?.post ?? null);
    return { shift, slots, posts, changed: false };
  });
  const standing = new Map<number, { plan: (typeof plans)[number]; at: number }[]>();
  for (const plan of plans) plan.slots.forEach((slot, at) => plan.posts[at] && standing.set(slot, [...(standing.get(slot) ?? []), { plan, at }]));

  let moves = 0;
  for (const [slot, here] of [...standing.entries()].sort((a, b) => a[0] - b[0])) {
    const gaps = empty.get(slot) ?? [];
    if (gaps.length === 0) continue;
    const emptyRooms = [...roomPosts.entries()]
      .filter(([, posts]) => posts.every((p) => gaps.includes(p)))
      .sort(([a, pa], [b, pb]) => Number(pb.some((p) => postById.get(p)!.risk === "high")) - Number(pa.some((p) => postById.get(p)!.risk === "high")) || a.localeCompare(b));
    for (const [, posts] of emptyRooms) {
      const count = new Map<string, number>();
      for (const h of here) count.set(roomOf(h.plan.posts[h.at]!), (count.get(roomOf(h.plan.posts[h.at]!)) ?? 0) + 1);
      let moved = false;
      for (const h of here) {
        if (moved) break;
        const from = h.plan.posts[h.at]!;
        if ((count.get(roomOf(from)) ?? 0) < 2) continue;
        for (const to of posts) {
          if (!hasSkills(skills.get(h.plan.shift.guard) ?? [], postById.get(to)!.skills)) continue;
          // Unbroken time at `to` if the guard moves there for this slot.
          let stay = 1;
          for (let k = h.at - 1; k >= 0 && h.plan.posts[k] === to; k--) stay++;
          for (let k = h.at + 1; k < h.plan.posts.length && h.plan.posts[k] === to; k++) stay++;
          if (stay > limitSlots) continue;
          h.plan.posts[h.at] = to;
          h.plan.changed = true;
          empty.set(slot, [...gaps.filter((p) => p !== to), from]);
          gaps.splice(0, gaps.length, ...empty.get(slot)!);
          moves++;
          moved = true;
          break;
        }
      }
    }
  }

  for (const plan of plans) {
    if (!plan.changed) continue;
    const segments: Shift["segments"] = [];
    plan.slots.forEach((slot, at) => {
      const post = plan.posts[at];
      if (!post) return;
      const { start, end } = demand.slots[slot];
      const last = segments[segments.length - 1];
      if (last && last.post === post && last.end === start) last.end = end;
      else segments.push({ post, start, end });
    });
    plan.shift.segments = segments;
  }
  return moves;
}
