// Each hard rule of scripts/README.md against a hand-made roster that breaks it exactly once: the check catches it, and only it.
import { describe, expect, it } from "vitest";
import type { Roster, Shift } from "@/lib/scheduling/roster";
import { checkRoster } from "@/lib/scheduling/rules";
import { parseScenario, type Scenario } from "@/lib/scheduling/scenario";
import { parseLocal } from "@/lib/scheduling/time";

// One treasury post needing "high-value", open Tuesday 2027-03-23 10:00-16:00 in Berlin; Wednesday closed.
function scenario(rules: Record<string, unknown> = {}, guards: Record<string, Record<string, unknown>> = {}): Scenario {
  const parsed = parseScenario({
    timezone: "Europe/Berlin",
    start: "2027-03-23",
    days: 2,
    opening: { weekly: { tue: ["10:00", "16:00"] } },
    posts: [{ id: "P1", room: "Treasury", skills: ["high-value"] }],
    guards: [
      { id: "G1", skills: ["high-value"], ...guards.G1 },
      { id: "G2", skills: ["high-value"], ...guards.G2 },
      { id: "G3", skills: [], ...guards.G3 },
    ],
    rules: { minShiftHours: 2, ...rules },
  });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
  return parsed.scenario;
}

const t = (clock: string, date = "2027-03-23") => parseLocal("Europe/Berlin", `${date}T${clock}`);
const seg = (post: string, from: string, to: string) => ({ post, start: t(from), end: t(to) });
const brk = (from: string, to: string) => ({ start: t(from), end: t(to) });

// G1 guards P1 10-12 and 14-16 with a break between; G2 relieves 12-14 (rotation every 2 h: common practice).
function validRoster(): Roster {
  const g1: Shift = { guard: "G1", start: t("10:00"), end: t("16:00"), segments: [seg("P1", "10:00", "12:00"), seg("P1", "14:00", "16:00")], breaks: [brk("12:00", "14:00")] };
  const g2: Shift = { guard: "G2", start: t("12:00"), end: t("14:00"), segments: [seg("P1", "12:00", "14:00")], breaks: [] };
  return { shifts: [g1, g2], unfilled: [] };
}

function rulesBroken(s: Scenario, roster: Roster): string[] {
  return checkRoster(s, roster).map((v) => v.rule);
}

describe("hand-made roster", () => {
  it("keeps every rule as made", () => {
    expect(checkRoster(scenario(), validRoster())).toEqual([]);
  });
});

describe("each rule caught exactly once", () => {
  it("coverage: a staffed slot also listed as unfilled", () => {
    const roster = validRoster();
    roster.unfilled.push({ post: "P1", start: t("10:00"), end: t("11:00"), reason: "test" });
    expect(rulesBroken(scenario(), roster)).toEqual(["coverage"]);
  });

  it("coverage: an empty slot not listed as unfilled", () => {
    const roster = validRoster();
    // G2 is on break instead of at the post from 13:00: one slot is left unstaffed.
    roster.shifts[1].segments = [seg("P1", "12:00", "13:00")];
    roster.shifts[1].breaks = [brk("13:00", "14:00")];
    const violations = checkRoster(scenario(), roster);
    expect(violations.map((v) => v.rule)).toEqual(["coverage"]);
    expect(violations[0].message).toContain("has no guard at 2027-03-23T13:00");
  });

  it("one place at a time: a shift whose parts do not make its time", () => {
    const roster = validRoster();
    roster.shifts[0].start = t("10:30");
    expect(rulesBroken(scenario(), roster)).toEqual(["one-place"]);
  });

  it("one place at a time: two shifts at once", () => {
    const roster = validRoster();
    roster.shifts.push({ guard: "G2", start: t("13:00"), end: t("15:00"), segments: [], breaks: [brk("13:00", "15:00")] });
    expect(rulesBroken(scenario(), roster)).toEqual(["one-place"]);
  });

  it("shift length: a 2-hour shift under a 3-hour minimum", () => {
    expect(rulesBroken(scenario({ minShiftHours: 3 }), validRoster())).toEqual(["shift-length"]);
  });

  it("shift length: a 6-hour shift over a 5-hour maximum", () => {
    expect(rulesBroken(scenario({ maxShiftHours: 5 }), validRoster())).toEqual(["shift-length"]);
  });

  it("rest: 2 hours between shifts where 11 are required (2003/88/EC Art. 3)", () => {
    const roster = validRoster();
    roster.shifts.push({ guard: "G2", start: t("16:00"), end: t("18:00"), segments: [], breaks: [brk("16:00", "18:00")] });
    const violations = checkRoster(scenario(), roster);
    expect(violations.map((v) => v.rule)).toEqual(["rest"]);
    expect(violations[0].message).toContain("rests only 2 h");
  });

  it("weekly maximum: 4 paid hours for a guard allowed 3 (2003/88/EC Art. 6)", () => {
    const violations = checkRoster(scenario({}, { G1: { maxHours: 3 } }), validRoster());
    expect(violations.map((v) => v.rule)).toEqual(["weekly-max"]);
    expect(violations[0].guard).toBe("G1");
  });

  it("breaks: 2 hours of break where 3 are asked (2003/88/EC Art. 4, length from the rule set)", () => {
    const violations = checkRoster(scenario({ breakAfterHours: 3, breakMinutes: 180 }), validRoster());
    expect(violations.map((v) => v.rule)).toEqual(["breaks"]);
  });

  it("breaks: a work stretch longer than breakAfterHours", () => {
    // G2 relieves 11-13 instead, so G1 works 13-16 in one 3 h stretch; the rule set allows 2.5 h (and 4 h at one post).
    const roster = validRoster();
    roster.shifts[0] = { guard: "G1", start: t("10:00"), end: t("16:00"), segments: [seg("P1", "10:00", "11:00"), seg("P1", "13:00", "16:00")], breaks: [brk("11:00", "13:00")] };
    roster.shifts[1] = { guard: "G2", start: t("11:00"), end: t("13:00"), segments: [seg("P1", "11:00", "13:00")], breaks: [] };
    const violations = checkRoster(scenario({ breakAfterHours: 2.5, breakMinutes: 30, maxHoursAtOnePost: 4 }), roster);
    expect(violations.map((v) => v.rule)).toEqual(["breaks"]);
    expect(violations[0].message).toContain("works 3 h without a break");
  });

  it("rotation: 4 hours at one post where 2 are allowed (common practice)", () => {
    const roster = validRoster();
    roster.shifts[0] = { guard: "G1", start: t("10:00"), end: t("14:00"), segments: [seg("P1", "10:00", "12:00")], breaks: [brk("12:00", "14:00")] };
    roster.shifts[1] = { guard: "G2", start: t("12:00"), end: t("16:00"), segments: [seg("P1", "12:00", "16:00")], breaks: [] };
    const violations = checkRoster(scenario(), roster);
    expect(violations.map((v) => v.rule)).toEqual(["rotation"]);
    expect(violations[0].message).toContain("stays 4 h at post P1");
  });

  it("skills: a guard without high-value at the treasury post", () => {
    const roster = validRoster();
    roster.shifts[1].guard = "G3";
    const violations = checkRoster(scenario(), roster);
    expect(violations.map((v) => v.rule)).toEqual(["skills"]);
    expect(violations[0].message).toContain("lacks skill high-value");
  });

  it("availability: a shift during declared leave", () => {
    const s = scenario({}, { G2: { unavailable: [{ start: "2027-03-23T12:30", end: "2027-03-23T13:00" }] } });
    expect(rulesBroken(s, validRoster())).toEqual(["availability"]);
  });
});

describe("real elapsed time across the spring clock change (IANA tz data via Node Intl)", () => {
  // Europe/Berlin: 2027-03-28 02:00 CET -> 03:00 CEST (EU summer time, last Sunday of March).
  function springScenario(): Scenario {
    const parsed = parseScenario({
      timezone: "Europe/Berlin",
      start: "2027-03-27",
      days: 2,
      opening: { weekly: { sat: ["10:00", "23:00"], sun: ["10:00", "17:00"] } },
      posts: [{ id: "P1", room: "Hall" }],
      guards: [{ id: "G1" }],
      rules: { maxHoursAtOnePost: 24, breakAfterHours: 24 },
    });
    if (!parsed.ok) throw new Error("bad");
    return parsed.scenario;
  }

  it("Saturday 23:00 to Sunday 10:00 is 10 real hours, so one guard may not work both shifts", () => {
    const s = springScenario();
    const sat = { guard: "G1", start: t("17:00", "2027-03-27"), end: t("23:00", "2027-03-27"), segments: [{ post: "P1", start: t("17:00", "2027-03-27"), end: t("23:00", "2027-03-27") }], breaks: [] };
    const sun = { guard: "G1", start: t("10:00", "2027-03-28"), end: t("14:00", "2027-03-28"), segments: [{ post: "P1", start: t("10:00", "2027-03-28"), end: t("14:00", "2027-03-28") }], breaks: [] };
    expect((sun.start - sat.end) / 3_600_000).toBe(10);
    const violations = checkRoster(s, { shifts: [sat, sun], unfilled: [] }).filter((v) => v.rule === "rest");
    expect(violations).toHaveLength(1);
    expect(violations[0].message).toContain("rests only 10 h");
  });

  it("a shift 01:00-05:00 wall clock on the change night lasts 3 real hours", () => {
    const s = springScenario();
    const night = { guard: "G1", start: t("01:00", "2027-03-28"), end: t("05:00", "2027-03-28"), segments: [], breaks: [{ start: t("01:00", "2027-03-28"), end: t("05:00", "2027-03-28") }] };
    const violations = checkRoster({ ...s, rules: { ...s.rules, minShiftHours: 4 } }, { shifts: [night], unfilled: [] }).filter((v) => v.rule === "shift-length");
    expect(violations).toHaveLength(1);
    expect(violations[0].message).toContain("lasts 3 h");
  });
});
