// Repair of a published roster: a guard sick for a day, a room closing early. Few changes to others, who is affected listed.
import { describe, expect, it } from "vitest";
import { buildRoster } from "@/lib/scheduling/engine";
import { generateScenario } from "@/lib/scheduling/generate";
import { repairRoster } from "@/lib/scheduling/repair";
import type { Shift } from "@/lib/scheduling/roster";
import { checkRoster, ruleContext } from "@/lib/scheduling/rules";
import { parseLocal } from "@/lib/scheduling/time";

const key = (s: Shift) => JSON.stringify(s);

describe("repairRoster", () => {
  it("a guard sick on Tuesday: one stand-in takes the shift unchanged, nobody else moves", async () => {
    const s = generateScenario({ posts: 4, guards: 12 });
    const published = (await buildRoster(s)).roster;
    const tuesdayStart = parseLocal(s.timezone, "2027-03-23T00:00");
    const sick = published.shifts.find((sh) => sh.start >= tuesdayStart)!;
    const repaired = repairRoster(s, published, { kind: "guard-absent", guard: sick.guard, start: "2027-03-23T00:00", end: "2027-03-24T00:00" });
    expect(repaired.violations).toEqual([]);
    expect(repaired.roster.unfilled).toEqual([]);
    expect(repaired.roster.shifts.some((sh) => sh.guard === sick.guard && sh.start >= tuesdayStart && sh.start < tuesdayStart + 24 * 3_600_000)).toBe(false);
    const changedGuards = new Set(repaired.affected.map((a) => a.guard));
    expect(changedGuards.size).toBe(2);
    expect(changedGuards.has(sick.guard)).toBe(true);
    // Every shift not of the two affected guards is exactly as published.
    const untouched = (list: Shift[]) => list.filter((sh) => !changedGuards.has(sh.guard)).map(key).sort();
    expect(untouched(repaired.roster.shifts)).toEqual(untouched(published.shifts));
  });

  it("when nobody can stand in, the lost hours come back unfilled with reasons", async () => {
    // One guard, one post open 6 h a day: when the only guard is sick, nobody can stand in.
    const s = generateScenario({ posts: 1, guards: 1, days: 2, open: ["10:00", "16:00"] });
    const published = (await buildRoster(s)).roster;
    const repaired = repairRoster(s, published, { kind: "guard-absent", guard: "G001", start: "2027-03-22T00:00", end: "2027-03-23T00:00" });
    expect(repaired.violations).toEqual([]);
    expect(repaired.roster.unfilled.length).toBeGreaterThan(published.unfilled.length);
    const monday = repaired.roster.unfilled.filter((u) => u.start < parseLocal(s.timezone, "2027-03-23T00:00"));
    expect(monday.length).toBe(6);
    expect(monday[0].reason).toContain("1 on leave");
  });

  it("a room closing at 15:00: its posts leave the demand, only guards standing there are affected", async () => {
    const s = generateScenario({ posts: 6, guards: 16, days: 2 });
    const published = (await buildRoster(s)).roster;
    const room = s.posts[0].room;
    const closing = parseLocal(s.timezone, "2027-03-22T15:00");
    const closedPosts = new Set(s.posts.filter((p) => p.room === room).map((p) => p.id));
    const repaired = repairRoster(s, published, { kind: "room-closes", room, at: "2027-03-22T15:00" });
    expect(repaired.violations).toEqual([]);
    expect(checkRoster(repaired.scenario, repaired.roster, ruleContext(repaired.scenario, repaired.demand))).toEqual([]);
    for (const sh of repaired.roster.shifts)
      for (const seg of sh.segments) if (closedPosts.has(seg.post)) expect(seg.end <= closing || seg.start >= parseLocal(s.timezone, "2027-03-23T00:00")).toBe(true);
    const standingThere = new Set(published.shifts.filter((sh) => sh.segments.some((x) => closedPosts.has(x.post) && x.end > closing && x.start < parseLocal(s.timezone, "2027-03-22T21:00"))).map((sh) => sh.guard));
    expect(new Set(repaired.affected.map((a) => a.guard))).toEqual(standingThere);
  });
});
