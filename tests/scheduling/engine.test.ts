// The staffing engine: its rosters keep every hard rule, totals recompute from the shifts, the lower bound never
// exceeds the cost, the same input gives the same roster, and what cannot be filled comes back with reasons.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { buildDemand } from "@/lib/scheduling/demand";
import { buildRoster } from "@/lib/scheduling/engine";
import { generateScenario } from "@/lib/scheduling/generate";
import { resultToJson } from "@/lib/scheduling/output";
import { paidMs, type Shift } from "@/lib/scheduling/roster";
import { checkRoster } from "@/lib/scheduling/rules";
import { parseScenario, type Scenario } from "@/lib/scheduling/scenario";
import { lowerBound } from "@/lib/scheduling/totals";

const HOUR = 3_600_000;

function parse(input: unknown): Scenario {
  const parsed = parseScenario(input);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
  return parsed.scenario;
}

/** Totals recomputed here from the shifts alone, the way scripts/README.md defines them. */
function recompute(s: Scenario, shifts: Shift[]) {
  const paid = shifts.reduce((sum, sh) => sum + paidMs(sh, s.rules.paidBreaks), 0) / HOUR;
  const weekStart = buildDemand(s).dayStarts;
  const perGuardWeek = new Map<string, number>();
  for (const sh of shifts) {
    const week = weekStart.filter((t, i) => i % 7 === 0 && i > 0 && t <= sh.start).length;
    const key = `${sh.guard}/${week}`;
    perGuardWeek.set(key, (perGuardWeek.get(key) ?? 0) + paidMs(sh, s.rules.paidBreaks) / HOUR);
  }
  const overtime = [...perGuardWeek.values()].reduce((sum, h) => sum + Math.max(0, h - s.rules.overtimeAfterHours), 0);
  return { paid, overtime, cost: s.rules.hourlyRate * (paid + (s.rules.overtimeFactor - 1) * overtime) };
}

describe("engine on generated scenarios (fast-check, few runs to keep time modest)", () => {
  it("every roster passes every rule check; totals recompute; bound <= cost; every unfilled slot has a reason", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.record({
          posts: fc.integer({ min: 1, max: 4 }),
          guards: fc.integer({ min: 0, max: 9 }),
          skilledPosts: fc.integer({ min: 0, max: 2 }),
          skilledGuards: fc.integer({ min: 0, max: 4 }),
          openHour: fc.integer({ min: 7, max: 11 }),
          openLength: fc.integer({ min: 3, max: 13 }),
          paidBreaks: fc.boolean(),
          slotMinutes: fc.constantFrom(60 as const, 30 as const),
          days: fc.integer({ min: 1, max: 3 }),
          leaveEvery: fc.option(fc.integer({ min: 2, max: 4 }), { nil: undefined }),
        }),
        async (o) => {
          const close = o.openHour + o.openLength;
          const s = generateScenario({
            ...o,
            // Saturday 2027-03-27 to Monday: crosses the spring clock change.
            start: "2027-03-27",
            open: [`${String(o.openHour).padStart(2, "0")}:00`, `${String(close).padStart(2, "0")}:00`],
          });
          const result = await buildRoster(s);
          expect(result.violations).toEqual([]);
          expect(checkRoster(s, result.roster)).toEqual([]);
          const again = recompute(s, result.roster.shifts);
          expect(result.totals.paidHours).toBeCloseTo(again.paid, 2);
          expect(result.totals.overtimeHours).toBeCloseTo(again.overtime, 2);
          expect(result.totals.cost).toBeCloseTo(again.cost, 1);
          expect(result.totals.lowerBoundCost).toBeLessThanOrEqual(result.totals.cost + 1e-6);
          // Filled + unfilled = demand, every unfilled slot says why.
          expect(result.totals.filledPostHours + result.totals.unfilledPostHours).toBeCloseTo(result.totals.postHours, 6);
          for (const u of result.roster.unfilled) expect(u.reason.length).toBeGreaterThan(10);
        },
      ),
      { numRuns: 12, seed: 2027 },
    );
  });
});

describe("engine on fixed cases", () => {
  it("a week of 6 posts and 16 guards is fully staffed at its lower bound", async () => {
    const s = generateScenario({ posts: 6, guards: 16 });
    const result = await buildRoster(s);
    expect(result.violations).toEqual([]);
    expect(result.roster.unfilled).toEqual([]);
    expect(result.totals.postHours).toBe(6 * 12 * 7);
    expect(result.totals.cost).toBeGreaterThanOrEqual(result.totals.lowerBoundCost);
    // Bound = rate x post-hours when breaks are unpaid and no overtime is forced (16 x 40 h > 504 h).
    expect(result.totals.lowerBoundCost).toBe(22 * 504);
  });

  it("the same input gives the same roster", async () => {
    const s = generateScenario({ posts: 3, guards: 7, skilledPosts: 1, skilledGuards: 3 });
    const a = resultToJson(s, await buildRoster(s));
    const b = resultToJson(s, await buildRoster(s));
    expect(JSON.stringify({ ...a, solver: null })).toBe(JSON.stringify({ ...b, solver: null }));
  });

  it("a post needing a skill nobody has comes back unfilled slot by slot, with the reason", async () => {
    const s = generateScenario({ posts: 3, guards: 4, skilledPosts: 1, skilledGuards: 0, days: 2, open: ["10:00", "16:00"] });
    const result = await buildRoster(s);
    const p1 = result.roster.unfilled.filter((u) => u.post === "P1");
    expect(p1).toHaveLength(2 * 6);
    for (const u of p1) expect(u.reason).toContain("no guard has skill high-value");
    // The other posts are still staffed.
    expect(result.roster.unfilled.filter((u) => u.post !== "P1")).toEqual([]);
    expect(result.violations).toEqual([]);
  });

  it("no guards at all: every slot unfilled, answered without a crash", async () => {
    const s = generateScenario({ posts: 2, guards: 0, days: 1, open: ["10:00", "14:00"] });
    const result = await buildRoster(s);
    expect(result.roster.shifts).toEqual([]);
    expect(result.roster.unfilled).toHaveLength(8);
    expect(result.roster.unfilled[0].reason).toContain("no guards");
    expect(result.totals.cost).toBe(0);
  });

  it("an opening shorter than the minimum shift is explained", async () => {
    const s = generateScenario({ posts: 1, guards: 3, days: 1, open: ["10:00", "12:00"] });
    const result = await buildRoster(s);
    expect(result.roster.unfilled).toHaveLength(2);
    expect(result.roster.unfilled[0].reason).toContain("shorter than the minimum shift of 4 h");
  });

  it("guards at their weekly maximum are counted in the reason", async () => {
    // One guard allowed 8 h for a 2-day, 6 h/day post: the second day cannot be staffed.
    const s = parse({
      timezone: "Europe/Berlin", start: "2027-03-23", days: 2,
      opening: { weekly: { tue: ["10:00", "16:00"], wed: ["10:00", "16:00"] } },
      posts: [{ id: "P1" }],
      guards: [{ id: "G1", maxHours: 8 }],
      rules: { maxHoursAtOnePost: 8 },
    });
    const result = await buildRoster(s);
    expect(result.violations).toEqual([]);
    expect(result.roster.unfilled.length).toBeGreaterThan(0);
    expect(result.roster.unfilled.some((u) => u.reason.includes("1 at their weekly maximum"))).toBe(true);
  });

  it("the Saturday before the spring change ends at 23:00; nobody who closes works Sunday 10:00", async () => {
    const s = parse({
      timezone: "Europe/Berlin", start: "2027-03-27", days: 2,
      opening: { weekly: { sat: ["13:00", "23:00"], sun: ["10:00", "18:00"] } },
      posts: [{ id: "P1" }, { id: "P2" }],
      guards: Array.from({ length: 8 }, (_, i) => ({ id: `G${i + 1}` })),
    });
    const result = await buildRoster(s);
    expect(result.violations).toEqual([]);
    expect(result.roster.unfilled).toEqual([]);
    const closers = new Set(result.roster.shifts.filter((sh) => sh.end === Date.parse("2027-03-27T22:00:00Z")).map((sh) => sh.guard));
    const openers = result.roster.shifts.filter((sh) => sh.start === Date.parse("2027-03-28T08:00:00Z")).map((sh) => sh.guard);
    expect(closers.size).toBeGreaterThan(0);
    for (const g of openers) expect(closers.has(g)).toBe(false);
  });

  it("lowerBound is the filled post-hours at the hourly rate when breaks are unpaid and no overtime is forced", async () => {
    const s = generateScenario({ posts: 2, guards: 5, days: 2 });
    const result = await buildRoster(s);
    const filled = result.roster.shifts.reduce((sum, sh) => sum + sh.segments.reduce((a, x) => a + x.end - x.start, 0), 0) / HOUR;
    expect(lowerBound(s, buildDemand(s), result.roster)).toBeCloseTo(22 * filled, 6);
  });

  it("a guard's wish for weekends off and no late shifts is honoured when others are free", async () => {
    const base = generateScenario({ posts: 2, guards: 8 });
    const isWeekendOrLate = (sh: Shift) => {
      const local = new Date(sh.start).toLocaleString("en-GB", { timeZone: "Europe/Berlin", weekday: "short" });
      const endHour = Number(new Date(sh.end).toLocaleString("en-GB", { timeZone: "Europe/Berlin", hour: "2-digit", hour12: false }));
      return local === "Sat" || local === "Sun" || endHour >= 20;
    };
    const without = await buildRoster(base);
    // The control: with no wish, G001 gets weekend or late work (so the check below can fail).
    expect(without.roster.shifts.filter((sh) => sh.guard === "G001").some(isWeekendOrLate)).toBe(true);
    const wishing = { ...base, guards: base.guards.map((g) => (g.id === "G001" ? { ...g, prefers: { daysOff: ["sat", "sun"] as ("sat" | "sun")[], noLateShifts: true } } : g)) };
    const withWish = await buildRoster(wishing);
    expect(withWish.violations).toEqual([]);
    expect(withWish.roster.shifts.filter((sh) => sh.guard === "G001").some(isWeekendOrLate)).toBe(false);
  });

  it("short-staffed week: gap-filling shifts between assigned days keep every 7-day window within 48 h", async () => {
    // 12 posts x 12 h x 7 d = 1008 post-hours against 15 guards x 48 h = 720: at least 288 h must stay empty.
    const s = generateScenario({ posts: 12, guards: 15 });
    const result = await buildRoster(s);
    expect(result.violations).toEqual([]);
    expect(result.totals.unfilledPostHours).toBeGreaterThanOrEqual(1008 - 720);
    expect(result.roster.unfilled.every((u) => u.reason.startsWith("no guard is free"))).toBe(true);
  });
});
