// Rooms first and contracts kept. The checks are written here, independent of the engine's
// placement: (1) no room open to visitors stands empty in an hour when a guard who may stand at one
// of its posts is the second (or later) guard of another room, or idle on duty; high-risk rooms are
// never left for a standard room's second guard (common practice for security staffing: one guard in
// every open room before a second in any); (2) no guard is paid more in a week than contract plus the
// extra hours they accept, nor over the legal weekly maximum (EU Directive 2003/88/EC, Art. 6); the
// rule check refuses a roster that does; (3) the review's empty-room stretches agree with a
// minute-by-minute count of guards per room.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { buildRoster } from "@/lib/scheduling/engine";
import { buildDemand } from "@/lib/scheduling/demand";
import { checkRoster } from "@/lib/scheduling/rules";
import { emptyRoomStretches, guardHours } from "@/lib/scheduling/safety";
import { scenarioSchema, type Scenario } from "@/lib/scheduling/scenario";
import type { Roster } from "@/lib/scheduling/roster";

const HOUR = 3_600_000;

/** A week with rooms of 1-4 posts, some high-risk (their posts need high-value), few skilled guards. */
function week(o: { rooms: number[]; high: boolean[]; guards: number; skilled: number; contract: number[]; extra: number }): Scenario {
  const open: [string, string] = ["10:00", "18:00"];
  const posts = o.rooms.flatMap((count, r) =>
    Array.from({ length: count }, (_, k) => ({ id: `R${r + 1}-P${k + 1}`, room: `Room ${r + 1}`, skills: o.high[r] ? ["high-value"] : [], risk: o.high[r] ? "high" : "standard" })),
  );
  return scenarioSchema.parse({
    timezone: "Europe/Berlin",
    start: "2027-03-01",
    days: 7,
    opening: { weekly: { mon: open, tue: open, wed: open, thu: open, fri: open, sat: open, sun: null } },
    posts,
    guards: Array.from({ length: o.guards }, (_, i) => ({
      id: `G${i + 1}`,
      name: `Guard ${i + 1}`,
      contractHours: o.contract[i % o.contract.length],
      maxHours: 48,
      extraHours: o.extra,
      skills: i < o.skilled ? ["high-value"] : [],
    })),
  });
}

/** Per slot of the demand: which guard stands at which post (from the roster's segments). */
function standing(scenario: Scenario, roster: Roster) {
  const demand = buildDemand(scenario);
  return demand.slots.map((slot) => {
    const at = new Map<string, string>();
    const onDuty = new Set<string>();
    for (const shift of roster.shifts) {
      const onBreak = shift.breaks.some((b) => b.start < slot.end && slot.start < b.end);
      if (shift.start <= slot.start && shift.end >= slot.end && !onBreak) onDuty.add(shift.guard);
      for (const s of shift.segments) if (s.start <= slot.start && s.end >= slot.end) at.set(s.post, shift.guard);
    }
    return { slot, at, onDuty };
  });
}

/**
 * Rooms-first, checked slot by slot: returns the first breach found, or null. A guard may stand at a
 * post in a slot when qualified and when their unbroken time there, this slot included, stays within
 * maxHoursAtOnePost (the rotation rule).
 */
function roomsFirstBreach(scenario: Scenario, roster: Roster): string | null {
  const skills = new Map(scenario.guards.map((g) => [g.id, g.skills]));
  const segmentsOf = (guard: string) => roster.shifts.filter((s) => s.guard === guard).flatMap((s) => s.segments);
  const stayAround = (guard: string, post: string, start: number, end: number) => {
    const at = segmentsOf(guard).filter((s) => s.post === post);
    let from = start, to = end;
    for (let found = true; found; ) {
      const before = at.find((s) => s.end === from);
      const after = at.find((s) => s.start === to);
      found = Boolean(before || after);
      if (before) from = before.start;
      if (after) to = after.end;
    }
    return to - from;
  };
  const limit = scenario.rules.maxHoursAtOnePost * HOUR;
  let slotStart = 0, slotEnd = 0;
  const may = (guard: string, post: Scenario["posts"][number]) =>
    post.skills.every((s) => skills.get(guard)!.includes(s)) && stayAround(guard, post.id, slotStart, slotEnd) <= limit + 1000;
  for (const { slot, at, onDuty } of standing(scenario, roster)) {
    slotStart = slot.start;
    slotEnd = slot.end;
    const guardsIn = new Map<string, string[]>();
    for (const post of scenario.posts) if (at.has(post.id)) guardsIn.set(post.room, [...(guardsIn.get(post.room) ?? []), at.get(post.id)!]);
    const placed = new Set(at.values());
    for (const post of scenario.posts) {
      if ((guardsIn.get(post.room) ?? []).length > 0) continue;
      // The room is empty: nobody who may stand here is idle on duty (not on a break) or a second guard elsewhere.
      const idle = [...onDuty].filter((g) => !placed.has(g) && may(g, post));
      if (idle.length) return `${post.room} empty at ${new Date(slot.start).toISOString()} while ${idle[0]} is on duty and free`;
      for (const [room, guards] of guardsIn) {
        if (guards.length < 2) continue;
        const spare = guards.find((g) => may(g, post));
        if (spare) return `${post.room} empty at ${new Date(slot.start).toISOString()} while ${room} has ${guards.length} guards, ${spare} among them`;
      }
    }
  }
  return null;
}

describe("rooms first", () => {
  it("keeps a guard in every room whenever one can be there, on random short-staffed weeks", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.integer({ min: 1, max: 4 }), { minLength: 2, maxLength: 4 }),
        fc.array(fc.boolean(), { minLength: 4, maxLength: 4 }),
        fc.integer({ min: 3, max: 9 }),
        fc.integer({ min: 1, max: 4 }),
        async (rooms, high, guards, skilled) => {
          const scenario = week({ rooms, high, guards, skilled: Math.min(skilled, guards), contract: [40, 32, 24], extra: 8 });
          const { roster } = await buildRoster(scenario, { timeLimit: 5 });
          expect(roomsFirstBreach(scenario, roster)).toBeNull();
        },
      ),
      { numRuns: 40, seed: 20261204 },
    );
  }, 120_000);

  it("says exactly when a room stands empty (minute by minute against the stretches)", async () => {
    const scenario = week({ rooms: [3, 2, 2], high: [true, false, false, false], guards: 4, skilled: 1, contract: [40], extra: 8 });
    const { roster } = await buildRoster(scenario, { timeLimit: 5 });
    const stretches = emptyRoomStretches(scenario, roster);
    for (const { slot, at } of standing(scenario, roster)) {
      for (const room of new Set(scenario.posts.map((p) => p.room))) {
        const guarded = scenario.posts.some((p) => p.room === room && at.has(p.id));
        const reported = stretches.some((s) => s.room === room && s.start <= slot.start && s.end >= slot.end);
        expect(reported, `${room} at ${new Date(slot.start).toISOString()}`).toBe(!guarded);
      }
    }
    // Four guards for seven posts over six days: the week cannot keep all three rooms guarded.
    expect(stretches.length).toBeGreaterThan(0);
    expect(stretches.every((s) => s.end > s.start)).toBe(true);
  }, 60_000);
});

describe("contracts kept", () => {
  it("never pays a guard more than contract plus accepted extra, nor over the weekly maximum", async () => {
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 0, max: 10 }), fc.array(fc.integer({ min: 8, max: 40 }), { minLength: 1, maxLength: 4 }), async (extra, contract) => {
        const scenario = week({ rooms: [3, 3, 2], high: [false, false, false, false], guards: 8, skilled: 0, contract, extra });
        const { roster } = await buildRoster(scenario, { timeLimit: 5 });
        for (const g of guardHours(scenario, roster)) {
          expect(g.plannedHours, g.guard).toBeLessThanOrEqual(Math.min(g.contractHours + extra, 48) + 1e-6);
        }
        expect(checkRoster(scenario, roster).filter((v) => v.rule === "contract-hours" || v.rule === "weekly-max")).toEqual([]);
      }),
      { numRuns: 8, seed: 4 },
    );
  }, 120_000);

  it("the contract rule refuses a week over contract plus extra, naming the guard and both figures", () => {
    const scenario = week({ rooms: [1], high: [false, false, false, false], guards: 1, skilled: 0, contract: [20], extra: 4 });
    const day = (d: number, from: number, to: number) => Date.parse(`2027-03-0${d + 1}T${String(from - 1).padStart(2, "0")}:00:00Z`) + 0 * to;
    // Five 6-hour days (30 h) against 20 h + 4 h.
    const shifts = [0, 1, 2, 3, 4].map((d) => {
      const start = day(d, 10, 16);
      return { guard: "G1", start, end: start + 6 * HOUR, segments: [{ post: "R1-P1", start, end: start + 6 * HOUR }], breaks: [] };
    });
    const violations = checkRoster(scenario, { shifts, unfilled: [] }).filter((v) => v.rule === "contract-hours");
    expect(violations).toHaveLength(1);
    expect(violations[0]!.message).toMatch(/G1 is paid for 30 h .* contract of 20 h plus the 4 h extra/);
  });
});
