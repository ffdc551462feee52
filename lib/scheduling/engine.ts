// The staffing engine: demand -> covering program (how many guards per shift pattern) -> guards to shifts -> guards to posts
// slot by slot -> local repair -> explanations, totals and the rule check.
import { assignDay, loadsFromShifts, newLoads, type ShiftInstance } from "./assign";
import { solveCover } from "./cover";
import { buildDemand, type Demand } from "./demand";
import { explainUnfilled } from "./explain";
import { fillGaps } from "./gapFill";
import { placeDay } from "./placement";
import { spreadToEmptyRooms } from "./spread";
import { compareShifts, type Roster, type Shift, type Violation } from "./roster";
import { checkRoster, ruleContext } from "./rules";
import type { Scenario } from "./scenario";
import { HOUR } from "./time";
export { unfilledWithReasons };
import { computeTotals, type Totals } from "./totals";

export interface RosterResult {
  roster: Roster;
  totals: Totals;
  violations: Violation[];
  stats: { coverStatus: string; coverObjective: number; ms: { cover: number; assign: number; place: number; repair: number; check: number; total: number } };
}

export async function buildRoster(scenario: Scenario, options: { timeLimit?: number } = {}): Promise<RosterResult> {
  const began = performance.now();
  const demand = buildDemand(scenario);
  const cover = await solveCover(scenario, demand, options);
  const t1 = performance.now();

  // Shift instances in a fixed order so the same input gives the same roster.
  const instances: ShiftInstance[] = [];
  const sorted = [...cover.shifts].sort(
    (a, b) => a.day - b.day || a.pattern.first - b.pattern.first || a.pattern.length - b.pattern.length || a.pattern.breakOffsets.join(",").localeCompare(b.pattern.breakOffsets.join(",")) || a.skillClass.key.localeCompare(b.skillClass.key),
  );
  for (const s of sorted) for (let k = 0; k < s.count; k++) instances.push({ day: s.day, pattern: s.pattern, skillClass: s.skillClass, guard: null });
  const loads = newLoads(scenario, Math.ceil(scenario.days / 7));
  // Each day is one exact assignment over all its shifts, so their order inside the day does not bias it.
  const byDay = demand.days.map((d) => instances.filter((i) => i.day === d.day));
  for (const dayInstances of byDay) assignDay(scenario, demand, dayInstances, loads);
  const t2 = performance.now();

  const guards = new Map(scenario.guards.map((g) => [g.id, g]));
  const shifts: Shift[] = [];
  const empty = new Map<number, string[]>();
  for (const d of demand.days) {
    if (d.open === null) continue;
    const placement = placeDay(scenario, demand, d.day, byDay[d.day], guards);
    byDay[d.day].forEach((inst, k) => {
      if (inst.guard === null) return;
      const shift = shiftFromPlacement(scenario, demand, inst, placement.posts[k]);
      if (shift) shifts.push(shift);
    });
    for (const e of placement.empty) empty.set(e.slot, [...(empty.get(e.slot) ?? []), e.post]);
  }
  // Trimming and dropping idle time changes loads: rebuild them from the shifts before repair.
  const repairLoads = loadsFromShifts(scenario, demand, shifts);
  const t3 = performance.now();
  fillGaps(scenario, demand, shifts, empty, repairLoads);
  // Rooms first, last pass: a guard who is a room's second moves into a room left empty.
  spreadToEmptyRooms(scenario, demand, shifts, empty);
  const t4 = performance.now();

  shifts.sort(compareShifts);
  const unfilled = unfilledWithReasons(scenario, demand, shifts, empty);
  const roster: Roster = { shifts, unfilled };
  const violations = checkRoster(scenario, roster, ruleContext(scenario, demand));
  const totals = computeTotals(scenario, demand, roster);
  const t5 = performance.now();
  return {
    roster,
    totals,
    violations,
    stats: { coverStatus: cover.status, coverObjective: cover.objective, ms: { cover: t1 - began, assign: t2 - t1, place: t3 - t2, repair: t4 - t3, check: t5 - t4, total: t5 - began } },
  };
}

/** Turns one placed shift instance into a shift: idle ends are trimmed while the shift stays long enough, idle inside becomes break. */
function shiftFromPlacement(scenario: Scenario, demand: Demand, inst: ShiftInstance, posts: (string | null)[]): Shift | null {
  if (!posts.some((p) => p !== null)) return null;
  const slots = demand.days[inst.day].slots.slice(inst.pattern.first, inst.pattern.first + inst.pattern.length).map((i) => demand.slots[i]);
  let lo = 0;
  let hi = posts.length - 1;
  const minMs = scenario.rules.minShiftHours * HOUR - 1000;
  while (posts[lo] === null && slots[hi].end - slots[lo + 1].start >= minMs) lo++;
  while (posts[hi] === null && slots[hi - 1].end - slots[lo].start >= minMs) hi--;
  const shift: Shift = { guard: inst.guard!, start: slots[lo].start, end: slots[hi].end, segments: [], breaks: [] };
  for (let i = lo; i <= hi; i++) {
    const post = posts[i];
    const slot = slots[i];
    if (post) {
      const last = shift.segments[shift.segments.length - 1];
      if (last && last.post === post && last.end === slot.start) last.end = slot.end;
      else shift.segments.push({ post, start: slot.start, end: slot.end });
    } else {
      const last = shift.breaks[shift.breaks.length - 1];
      if (last && last.end === slot.start) last.end = slot.end;
      else shift.breaks.push({ start: slot.start, end: slot.end });
    }
  }
  return shift;
}

function unfilledWithReasons(scenario: Scenario, demand: Demand, shifts: Shift[], empty: Map<number, string[]>): Roster["unfilled"] {
  const unfilled: Roster["unfilled"] = [];
  const postOrder = new Map(scenario.posts.map((p, i) => [p.id, i]));
  for (const slotIndex of [...empty.keys()].sort((a, b) => a - b)) {
    const slot = demand.slots[slotIndex];
    for (const post of [...empty.get(slotIndex)!].sort((a, b) => postOrder.get(a)! - postOrder.get(b)!))
      unfilled.push({ post, start: slot.start, end: slot.end, reason: explainUnfilled(scenario, demand, shifts, post, slot.start, slot.end) });
  }
  return unfilled;
}
