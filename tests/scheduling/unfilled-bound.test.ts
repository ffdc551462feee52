// The proven lower bound on unfilled post-hours (lib/scheduling/unfilled-bound.ts): on random
// short-staffed weeks (fast-check) no roster the engine builds leaves fewer hours unfilled than the
// bound says (a bound that is too high fails here); and on weeks computed by hand the bound is
// exactly the count its proof gives, with the binding reason in words.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { buildRoster } from "@/lib/scheduling/engine";
import { buildDemand } from "@/lib/scheduling/demand";
import { unfilledLowerBound } from "@/lib/scheduling/unfilled-bound";
import { scenarioSchema } from "@/lib/scheduling/scenario";

const days = ["mon", "tue", "wed", "thu", "fri", "sat", "sun"] as const;

function scenario(o: { open: [string, string]; openDays: number; posts: { skills: string[] }[]; guards: { skills: string[]; contract: number; extra?: number; max?: number; leaveDay?: number }[]; maxShift?: number }) {
  return scenarioSchema.parse({
    timezone: "Europe/Berlin",
    start: "2027-03-01",
    days: 7,
    opening: { weekly: Object.fromEntries(days.map((d, i) => [d, i < o.openDays ? o.open : null])) },
    posts: o.posts.map((p, i) => ({ id: `P${i + 1}`, room: `Room ${i + 1}`, skills: p.skills })),
    guards: o.guards.map((g, i) => ({
      id: `G${i + 1}`,
      contractHours: g.contract,
      maxHours: g.max ?? 48,
      ...(g.extra !== undefined ? { extraHours: g.extra } : {}),
      skills: g.skills,
      unavailable: g.leaveDay !== undefined ? [{ start: `2027-03-0${g.leaveDay + 1}T00:00`, end: `2027-03-0${g.leaveDay + 2}T00:00` }] : [],
    })),
    rules: o.maxShift ? { maxShiftHours: o.maxShift } : {},
  });
}

describe("the unfilled lower bound", () => {
  it("never exceeds what the engine leaves unfilled, on random short-staffed weeks", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.boolean(), { minLength: 1, maxLength: 6 }),
        fc.array(fc.record({ skilled: fc.boolean(), contract: fc.integer({ min: 8, max: 40 }), extra: fc.integer({ min: 0, max: 8 }), leaveDay: fc.option(fc.integer({ min: 0, max: 5 }), { nil: undefined }) }), { minLength: 1, maxLength: 6 }),
        fc.boolean(),
        async (posts, guards, late) => {
          const s = scenario({
            open: late ? ["10:00", "21:00"] : ["10:00", "18:00"],
            openDays: 6,
            posts: posts.map((skilled) => ({ skills: skilled ? ["high-value"] : [] })),
            guards: guards.map((g) => ({ skills: g.skilled ? ["high-value"] : [], contract: g.contract, extra: g.extra, leaveDay: g.leaveDay })),
            maxShift: late ? 8 : 10,
          });
          const { totals } = await buildRoster(s, { timeLimit: 5 });
          expect(totals.unfilledPostHours).toBeGreaterThanOrEqual(totals.unfilledLowerBound - 1e-6);
          expect(totals.unfilledLowerBound).toBe(unfilledLowerBound(s, buildDemand(s)).postHours);
        },
      ),
      { numRuns: 30, seed: 7 },
    );
  }, 180_000);

  it("counts the week's hours: three skilled posts, one skilled guard with a 10-hour limit", async () => {
    // 3 posts x 8 h x 5 days = 120 post-hours need the skill; the one guard may work 10 h: 110.
    const s = scenario({ open: ["10:00", "18:00"], openDays: 5, posts: [{ skills: ["high-value"] }, { skills: ["high-value"] }, { skills: ["high-value"] }], guards: [{ skills: ["high-value"], contract: 10, extra: 0 }, { skills: [], contract: 40 }] });
    const bound = unfilledLowerBound(s, buildDemand(s));
    expect(bound.postHours).toBe(110);
    expect(bound.reason).toMatch(/posts needing high-value ask for 120 post-hours .* the 1 guards with high-value may work at most 10 h .* at least 110 post-hours stay unfilled/);
    const { totals } = await buildRoster(s, { timeLimit: 5 });
    expect(totals.unfilledPostHours).toBeGreaterThanOrEqual(110);
  });

  it("counts far-apart hours of one day: 10:00 and 20:00 need different guards when shifts last 8 h", async () => {
    // Opening 11 h (no longer than the 11 h rest: one shift a day); 2 posts; 3 guards, plenty of
    // weekly hours. At 10:00 and 20:00, 4 post-hours need 4 different guards; 3 are free: 1 per day.
    const s = scenario({ open: ["10:00", "21:00"], openDays: 6, posts: [{ skills: [] }, { skills: [] }], guards: [{ skills: [], contract: 40, max: 60 }, { skills: [], contract: 40, max: 60 }, { skills: [], contract: 40, max: 60 }], maxShift: 8 });
    const bound = unfilledLowerBound(s, buildDemand(s));
    expect(bound.postHours).toBe(6);
    expect(bound.reason).toMatch(/the 10:00 and 1\d:00 hours lie further apart than the longest shift \(8 h\), so they need 4 different guards; 3 are free/);
    const { totals } = await buildRoster(s, { timeLimit: 5 });
    expect(totals.unfilledPostHours).toBeGreaterThanOrEqual(6);
  });

  it("is 0 with a reason of null when the guards can staff every hour", () => {
    const s = scenario({ open: ["10:00", "18:00"], openDays: 5, posts: [{ skills: [] }], guards: [{ skills: [], contract: 40 }, { skills: [], contract: 40 }] });
    expect(unfilledLowerBound(s, buildDemand(s))).toEqual({ postHours: 0, reason: null });
  });
});
