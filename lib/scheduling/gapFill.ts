// Local repair after the main pass: give a guard with no shift that day a new legal shift over posts left empty.
// Rooms first, as in placement.ts: a post whose room nobody guards in that slot is taken before a second
// post of a guarded room, high-risk rooms first, and a new shift is chosen by the rooms it keeps guarded.
import { blockerFor, commitShift, shiftKind, type GuardLoad } from "./assign";
import { hasSkills, type Demand } from "./demand";
import type { Shift } from "./roster";
import type { Scenario } from "./scenario";
import { HOUR, MINUTE } from "./time";

/** empty: per global slot index, the posts nobody stands at. Mutates empty, loads and shifts. */
export function fillGaps(scenario: Scenario, demand: Demand, shifts: Shift[], empty: Map<number, string[]>, loads: Map<string, GuardLoad>): number {
  const rules = scenario.rules;
  const postById = new Map(scenario.posts.map((p) => [p.id, p]));
  const maxStretch = Math.floor((rules.breakAfterHours * 60) / rules.slotMinutes);
  const limitSlots = Math.floor((rules.maxHoursAtOnePost * 60) / rules.slotMinutes);
  const roomPosts = new Map<string, string[]>();
  for (const p of scenario.posts) roomPosts.set(p.room || p.id, [...(roomPosts.get(p.room || p.id) ?? []), p.id]);
  /** What staffing `post` in `slot` is worth: 1, plus the room's weight when the room is otherwise unguarded. */
  const worth = (slot: number, post: string): number => {
    const p = postById.get(post)!;
    const gaps = empty.get(slot) ?? [];
    const unguarded = roomPosts.get(p.room || p.id)!.every((q) => gaps.includes(q));
    return 1 + (unguarded ? (p.risk === "high" ? 20 : 10) : 0);
  };
  let added = 0;
  for (const openDay of demand.days) {
    const slots = openDay.slots;
    for (let round = 0; round < 200; round++) {
      if (!slots.some((s) => (empty.get(s)?.length ?? 0) > 0)) break;
      let best: { load: GuardLoad; first: number; plan: (string | null)[]; filled: number; paid: number } | null = null;
      for (const load of [...loads.values()].sort((a, b) => (a.guard.id < b.guard.id ? -1 : 1))) {
        if (load.shifts.some((s) => s.start < openDay.close! && openDay.open! < s.end)) continue;
        for (let first = 0; first < slots.length; first++) {
          if (!(empty.get(slots[first])?.length)) continue;
          for (let last = first; last < slots.length; last++) {
            const start = demand.slots[slots[first]].start;
            const end = demand.slots[slots[last]].end;
            if (end - start > rules.maxShiftHours * HOUR + 1000) break;
            if (end - start < rules.minShiftHours * HOUR - 1000) continue;
            const plan = planWindow(slots.slice(first, last + 1), empty, load, postById, maxStretch, limitSlots, worth);
            const filled = plan.reduce((sum, p, i) => sum + (p === null ? 0 : worth(slots[first + i], p)), 0);
            if (filled === 0) continue;
            const breakMs = plan.reduce((sum, p, i) => sum + (p === null ? demand.slots[slots[first + i]].end - demand.slots[slots[first + i]].start : 0), 0);
            if (end - start > rules.breakAfterHours * HOUR + 1000 && breakMs < rules.breakMinutes * MINUTE - 1000) continue;
            const paid = end - start - (rules.paidBreaks ? 0 : breakMs);
            if (blockerFor(scenario, demand, load, start, end, paid)) continue;
            if (!best || filled > best.filled || (filled === best.filled && paid < best.paid)) best = { load, first, plan, filled, paid };
          }
        }
      }
      if (!best) break;
      const chosen = slots.slice(best.first, best.first + best.plan.length);
      const start = demand.slots[chosen[0]].start;
      const end = demand.slots[chosen[chosen.length - 1]].end;
      const shift: Shift = { guard: best.load.guard.id, start, end, segments: [], breaks: [] };
      best.plan.forEach((post, i) => {
        const slot = demand.slots[chosen[i]];
        if (post) {
          empty.set(chosen[i], (empty.get(chosen[i]) ?? []).filter((p) => p !== post));
          const lastSeg = shift.segments[shift.segments.length - 1];
          if (lastSeg && lastSeg.post === post && lastSeg.end === slot.start) lastSeg.end = slot.end;
          else shift.segments.push({ post, start: slot.start, end: slot.end });
        } else {
          const lastBreak = shift.breaks[shift.breaks.length - 1];
          if (lastBreak && lastBreak.end === slot.start) lastBreak.end = slot.end;
          else shift.breaks.push({ start: slot.start, end: slot.end });
        }
      });
      shifts.push(shift);
      commitShift(best.load, Math.floor(openDay.day / 7), start, end, best.paid, shiftKind(scenario, demand, start, end, openDay.day));
      added++;
    }
  }
  return added;
}

/** Which empty post the guard takes in each slot of a window (null = break), keeping rotation and work-stretch limits. */
function planWindow(
  window: number[],
  empty: Map<number, string[]>,
  load: GuardLoad,
  postById: Map<string, Scenario["posts"][number]>,
  maxStretch: number,
  limitSlots: number,
  worth: (slot: number, post: string) => number,
): (string | null)[] {
  const plan: (string | null)[] = [];
  let stretch = 0;
  let stay = 0;
  let previous: string | null = null;
  for (const slot of window) {
    const options = (empty.get(slot) ?? []).filter((p) => hasSkills(load.guard.skills, postById.get(p)!.skills));
    let post: string | null = null;
    if (stretch < maxStretch && options.length) {
      // The most valuable post (an unguarded room, high-risk first); staying put wins a tie.
      const top = Math.max(...options.map((p) => worth(slot, p)));
      const best = options.filter((p) => worth(slot, p) === top);
      if (previous && best.includes(previous) && stay < limitSlots) post = previous;
      else post = best.find((p) => p !== previous) ?? options.find((p) => p !== previous) ?? null;
    }
    plan.push(post);
    stretch = post ? stretch + 1 : 0;
    stay = post && post === previous ? stay + 1 : post ? 1 : 0;
    previous = post;
  }
  return plan;
}
