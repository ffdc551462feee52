// The rule registry on random weeks (fast-check): the engine never plans what the checks refuse
// (its roster passes checkRoster), every shift it planned is one the registry's blockers allow given
// the guard's other shifts, and every unfilled hour's reason is true where it counts people: the
// guards without the skill, on leave, and standing at other posts then, counted here from the
// scenario and the roster alone, and all counts together name every guard once.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { buildRoster } from "@/lib/scheduling/engine";
import { buildDemand } from "@/lib/scheduling/demand";
import { checkRoster } from "@/lib/scheduling/rules";
import { LABOUR_RULES } from "@/lib/scheduling/rules/registry";
import { paidMs } from "@/lib/scheduling/roster";
import { scenarioSchema, type Scenario } from "@/lib/scheduling/scenario";

const days = ["mon", "tue", "wed", "thu", "fri", "sat", "sun"] as const;

const weekArbitrary = fc.record({
  rooms: fc.array(fc.record({ posts: fc.integer({ min: 1, max: 3 }), high: fc.boolean() }), { minLength: 1, maxLength: 3 }),
  guards: fc.array(
    fc.record({ skilled: fc.boolean(), contract: fc.integer({ min: 8, max: 40 }), extra: fc.option(fc.integer({ min: 0, max: 10 }), { nil: undefined }), leaveDay: fc.option(fc.integer({ min: 0, max: 6 }), { nil: undefined }) }),
    { minLength: 2, maxLength: 9 },
  ),
  closed: fc.integer({ min: 0, max: 6 }),
  late: fc.boolean(),
  paidBreaks: fc.boolean(),
});

type Week = typeof weekArbitrary extends fc.Arbitrary<infer T> ? T : never;

function scenarioOf(w: Week): Scenario {
  const start = "2027-03-01";
  const date = (d: number) => `2027-03-0${d + 1}`;
  const open: [string, string] = w.late ? ["10:00", "21:00"] : ["10:00", "18:00"];
  return scenarioSchema.parse({
    timezone: "Europe/Berlin",
    start,
    days: 7,
    opening: { weekly: Object.fromEntries(days.map((d, i) => [d, i === w.closed ? null : open])) },
    posts: w.rooms.flatMap((room, r) =>
      Array.from({ length: room.posts }, (_, k) => ({ id: `R${r + 1}-P${k + 1}`, room: `Room ${r + 1}`, skills: room.high ? ["high-value"] : [], risk: room.high ? "high" : "standard" })),
    ),
    guards: w.guards.map((g, i) => ({
      id: `G${i + 1}`,
      contractHours: g.contract,
      maxHours: 48,
      ...(g.extra !== undefined ? { extraHours: g.extra } : {}),
      skills: g.skilled ? ["high-value"] : [],
      unavailable: g.leaveDay !== undefined ? [{ start: `${date(g.leaveDay)}T00:00`, end: `${date(g.leaveDay)}T23:59` }] : [],
    })),
    rules: { paidBreaks: w.paidBreaks },
  });
}

const count = (reason: string, what: string) => Number(new RegExp(`(\\d+) ${what}`).exec(reason)?.[1] ?? 0);

describe("the rule registry on random weeks", () => {
  it("the engine plans only what the checks accept, and its unfilled reasons count people truly", async () => {
    await fc.assert(
      fc.asyncProperty(weekArbitrary, async (week) => {
        const scenario = scenarioOf(week);
        const demand = buildDemand(scenario);
        const { roster, violations } = await buildRoster(scenario, { timeLimit: 5 });
        expect(violations).toEqual([]);
        expect(checkRoster(scenario, roster)).toEqual([]);

        // Every planned shift passes every blocker, given the guard's other shifts.
        for (const shift of roster.shifts) {
          const guard = scenario.guards.find((g) => g.id === shift.guard)!;
          const others = roster.shifts.filter((s) => s.guard === shift.guard && s !== shift).map((s) => ({ start: s.start, end: s.end, paidMs: paidMs(s, scenario.rules.paidBreaks) }));
          const question = { scenario, demand, guard, shifts: others, start: shift.start, end: shift.end, paidMs: paidMs(shift, scenario.rules.paidBreaks) };
          for (const rule of LABOUR_RULES) expect(rule.blocks?.(question) ?? false, `${rule.name} blocks a planned shift of ${shift.guard}`).toBe(false);
        }

        for (const u of roster.unfilled) {
          const post = scenario.posts.find((p) => p.id === u.post)!;
          if (!/^no guard.* is free: /.test(u.reason)) continue;
          const qualified = scenario.guards.filter((g) => post.skills.every((s) => g.skills.includes(s)));
          const unskilled = scenario.guards.length - qualified.length;
          const onLeave = qualified.filter((g) => (demand.unavailable.get(g.id) ?? []).some((x) => x.start < u.end && u.start < x.end));
          const standing = qualified.filter(
            (g) =>
              !onLeave.includes(g) &&
              roster.shifts.some((s) => s.guard === g.id && s.start < u.end && u.start < s.end && !s.breaks.some((b) => b.start < u.end && u.start < b.end)),
          );
          expect(count(u.reason, "without the skill"), u.reason).toBe(unskilled);
          expect(count(u.reason, "on leave"), u.reason).toBe(onLeave.length);
          expect(count(u.reason, "at other posts"), u.reason).toBe(standing.length);
          // "no guard … is free: 2 at other posts, 1 resting until 07:00 or later, 3 without the skill; advice"
          const parts = u.reason.slice(u.reason.indexOf("is free: ") + 9).split(";")[0]!.split(", ");
          const total = parts.reduce((sum, part) => sum + Number(/^(\d+) /.exec(part)?.[1] ?? NaN), 0);
          expect(total, u.reason).toBe(scenario.guards.length);
        }
      }),
      { numRuns: 30, seed: 15 },
    );
  }, 180_000);
});
