// Scenario assembly from database rows (lib/rosters/scenario.ts) against the roster command's
// input contract (scripts/README.md) and the engine's own parser; and a manual reassignment checked by
// the engine's rule checks.
import { describe, expect, it } from "vitest";
import { assembleScenario, DEFAULT_ACCEPTED_EXTRA_HOURS, guardIdOfKey, guardKey, isMonday, type ScenarioRows } from "@/lib/rosters/scenario";
import { reassign } from "@/lib/rosters/reassign";
import { engineRoster, storedRoster, withGuardNames } from "@/lib/rosters/stored";
import { buildDemand } from "@/lib/scheduling/demand";
import { checkRoster, ruleContext } from "@/lib/scheduling/rules";
import type { Roster } from "@/lib/scheduling/roster";
import { parseLocal } from "@/lib/scheduling/time";

const site = {
  id: 1,
  time_zone: "Europe/Berlin",
  hourly_rate: 23.5,
  opening_hours: {
    weekly: { mon: null, tue: ["10:00", "18:00"], wed: ["10:00", "18:00"], thu: ["10:00", "21:00"], fri: ["10:00", "18:00"], sat: ["10:00", "18:00"], sun: ["11:00", "17:00"] },
    dates: { "2027-03-26": null },
  },
} as ScenarioRows["site"];

const rows: ScenarioRows = {
  site,
  // The week of the EU's 2027 spring clock change (last Sunday of March: 28 March, Directive 2000/84/EC).
  startsOn: "2027-03-22",
  posts: [
    { id: "R4-P1", room: "Textile Gallery", skills: ["high-value"], risk: "high" },
    { id: "R4-P2", room: "Textile Gallery", skills: [], risk: "standard" },
  ],
  guards: [
    { id: 12, name: "Jonas Okafor", email: "jonas.okafor@example.org", contract_hours: 40, max_hours: 48, skills: [], accepted_extra_hours: 4 },
    { id: 3, name: "Mara Lindqvist", email: "guard@example.org", contract_hours: 32, max_hours: 40, skills: ["high-value"] },
  ],
  timeOff: [
    { guard_id: 3, starts_on: "2027-03-24", ends_on: "2027-03-25" },
    // Outside the week: left out.
    { guard_id: 3, starts_on: "2027-04-05", ends_on: "2027-04-06" },
    // Reaches into the week from before it: kept.
    { guard_id: 12, starts_on: "2027-03-15", ends_on: "2027-03-22" },
    // The last day off is the clock-change Sunday: unavailable until the Monday's midnight.
    { guard_id: 12, starts_on: "2027-03-28", ends_on: "2027-03-28" },
  ],
};

describe("assembleScenario", () => {
  const scenario = assembleScenario(rows);

  it("carries the site's zone, week, opening hours and hourly rate, with the default rules otherwise (scripts/README.md)", () => {
    expect(scenario.timezone).toBe("Europe/Berlin");
    expect(scenario.start).toBe("2027-03-22");
    expect(scenario.days).toBe(7);
    expect(scenario.opening.weekly.thu).toEqual(["10:00", "21:00"]);
    expect(scenario.opening.dates).toEqual({ "2027-03-26": null });
    expect(scenario.rules.hourlyRate).toBe(23.5);
    // scripts/README.md: "Every rule has the default shown."
    expect(scenario.rules).toMatchObject({ slotMinutes: 60, minShiftHours: 4, maxShiftHours: 10, minRestHours: 11, breakAfterHours: 6, breakMinutes: 60, maxHoursAtOnePost: 2, overtimeAfterHours: 40, overtimeFactor: 1.5 });
  });

  it("names guards G<id> in id order, with contract, maximum and skills", () => {
    expect(scenario.guards.map((g) => g.id)).toEqual(["G3", "G12"]);
    expect(scenario.guards[0]).toMatchObject({ name: "Mara Lindqvist", contractHours: 32, maxHours: 40, skills: ["high-value"] });
    expect(guardIdOfKey(guardKey(12))).toBe(12);
    expect(guardIdOfKey("P1")).toBeNull();
  });

  it("turns approved time off into whole local days of unavailability, inside the week only", () => {
    const mara = scenario.guards.find((g) => g.id === "G3")!;
    expect(mara.unavailable).toEqual([{ start: "2027-03-24T00:00", end: "2027-03-26T00:00" }]);
    const jonas = scenario.guards.find((g) => g.id === "G12")!;
    expect(jonas.unavailable).toEqual([
      { start: "2027-03-15T00:00", end: "2027-03-23T00:00" },
      { start: "2027-03-28T00:00", end: "2027-03-29T00:00" },
    ]);
    // The clock-change Sunday has 23 real hours in Berlin (CET to CEST at 02:00).
    const sunday = jonas.unavailable[1]!;
    expect((parseLocal("Europe/Berlin", sunday.end) - parseLocal("Europe/Berlin", sunday.start)) / 3_600_000).toBe(23);
  });

  it("keeps posts with their rooms, skills and risk", () => {
    expect(scenario.posts).toEqual(rows.posts);
  });

  it("gives each guard the extra hours they accept: their own, else the site's default, else the product's", () => {
    expect(scenario.guards.find((g) => g.id === "G12")!.extraHours).toBe(4);
    expect(scenario.guards.find((g) => g.id === "G3")!.extraHours).toBe(DEFAULT_ACCEPTED_EXTRA_HOURS);
    const withSiteDefault = assembleScenario({ ...rows, site: { ...rows.site, labour_rules: { acceptedExtraHours: 2 } } });
    expect(withSiteDefault.guards.find((g) => g.id === "G3")!.extraHours).toBe(2);
    expect(withSiteDefault.guards.find((g) => g.id === "G12")!.extraHours).toBe(4);
  });

  it("refuses rows the engine would not accept, naming the field", () => {
    expect(() => assembleScenario({ ...rows, site: { ...site, time_zone: "Mars/Olympus" } })).toThrow(/timezone: unknown IANA time zone/);
    expect(() => assembleScenario({ ...rows, posts: [rows.posts[0]!, rows.posts[0]!] })).toThrow(/duplicate post id R4-P1/);
  });

  it("knows a Monday", () => {
    expect(isMonday("2027-03-22")).toBe(true);
    expect(isMonday("2027-03-23")).toBe(false);
    expect(isMonday("2027-02-30")).toBe(false);
    expect(isMonday("22.03.2027")).toBe(false);
  });
});

describe("reassigning a segment, checked by the engine's rules", () => {
  // Two posts on Tuesday 23 March 2027, 10:00-18:00 in Berlin (UTC+1 then); the period is Monday (closed) and Tuesday.
  const scenario = assembleScenario({ ...rows, timeOff: [], posts: [{ id: "R4-P1", room: "Textile Gallery", skills: [] }, { id: "R4-P2", room: "Textile Gallery", skills: [] }], guards: [
    { id: 1, name: "Ada", email: "ada@example.org", contract_hours: 40, max_hours: 48, skills: [] },
    { id: 2, name: "Ben", email: "ben@example.org", contract_hours: 40, max_hours: 48, skills: [] },
    { id: 3, name: "Cem", email: "cem@example.org", contract_hours: 40, max_hours: 48, skills: [] },
  ], days: 2 });
  const at = (hhmm: string) => parseLocal("Europe/Berlin", `2027-03-23T${hhmm}`);
  // Ada and Ben rotate between the posts every two hours; Cem relieves each for an hour's break.
  const roster: Roster = {
    shifts: [
      { guard: "G1", start: at("10:00"), end: at("18:00"), segments: [
        { post: "R4-P1", start: at("10:00"), end: at("12:00") }, { post: "R4-P2", start: at("12:00"), end: at("13:00") },
        { post: "R4-P1", start: at("14:00"), end: at("16:00") }, { post: "R4-P2", start: at("16:00"), end: at("18:00") },
      ], breaks: [{ start: at("13:00"), end: at("14:00") }] },
      { guard: "G2", start: at("10:00"), end: at("18:00"), segments: [
        { post: "R4-P2", start: at("10:00"), end: at("12:00") }, { post: "R4-P1", start: at("12:00"), end: at("14:00") },
        { post: "R4-P2", start: at("15:00"), end: at("16:00") }, { post: "R4-P1", start: at("16:00"), end: at("18:00") },
      ], breaks: [{ start: at("14:00"), end: at("15:00") }] },
      // Cem stands at P2 13:00-15:00 while Ada, then Ben, is on a break.
      { guard: "G3", start: at("12:00"), end: at("16:00"), segments: [{ post: "R4-P2", start: at("13:00"), end: at("15:00") }],
        breaks: [{ start: at("12:00"), end: at("13:00") }, { start: at("15:00"), end: at("16:00") }] },
    ],
    // The period is Monday (closed) and Tuesday: nothing left unfilled.
    unfilled: [],
  };
  const context = ruleContext(scenario, buildDemand(scenario));

  it("starts from a roster that keeps every rule", () => {
    expect(checkRoster(scenario, roster, context)).toEqual([]);
  });

  it("moves a segment to a guard on a break at that time, keeping every rule", () => {
    // Ben's last P1 stretch 16:00-18:00 cannot go to Cem (his shift would run 12-18 with 2 h of breaks: allowed),
    // but Ada's 14:00-16:00 at P1 to Ben would put Ben in two places: refused by the edit itself.
    const clash = reassign(roster, { kind: "segment", guard: "G1", post: "R4-P1", start: at("14:00") }, "G2", 11);
    expect(clash).toEqual({ ok: false, message: "G2 is already at post R4-P2 then" });

    const moved = reassign(roster, { kind: "segment", guard: "G2", post: "R4-P1", start: at("16:00") }, "G3", 11);
    expect(moved.ok).toBe(true);
    if (!moved.ok) return;
    const cem = moved.roster.shifts.find((s) => s.guard === "G3")!;
    expect([cem.start, cem.end]).toEqual([at("12:00"), at("18:00")]);
    const ben = moved.roster.shifts.find((s) => s.guard === "G2")!;
    expect(ben.end).toBe(at("16:00"));
    expect(checkRoster(scenario, moved.roster, context)).toEqual([]);
  });

  it("lets the rule checks catch what the edit breaks: a one-hour shift is shorter than the minimum", () => {
    // Ada's 12:00-13:00 at P2 to Cem: Cem's shift becomes 12-16 all the same, Ada keeps 10-18: fine.
    // But a brand-new shift for someone not working that day breaks minShiftHours (4 h).
    const scenarioWithDan = assembleScenario({ ...rows, timeOff: [], posts: scenario.posts, days: 2, guards: [
      ...[1, 2, 3].map((id) => ({ id, name: String(id), email: `${id}@example.org`, contract_hours: 40, max_hours: 48, skills: [] })),
      { id: 4, name: "Dan", email: "dan@example.org", contract_hours: 40, max_hours: 48, skills: [] },
    ] });
    const moved = reassign(roster, { kind: "segment", guard: "G1", post: "R4-P2", start: at("12:00") }, "G4", 11);
    expect(moved.ok).toBe(true);
    if (!moved.ok) return;
    const violations = checkRoster(scenarioWithDan, moved.roster, ruleContext(scenarioWithDan));
    expect(violations.map((v) => v.rule)).toContain("shift-length");
    // Ada's hole became a break, not a gap: her shift is still one unbroken period.
    const ada = moved.roster.shifts.find((s) => s.guard === "G1")!;
    expect(ada.breaks).toEqual([{ start: at("12:00"), end: at("14:00") }]);
    expect(violations.filter((v) => v.rule === "one-place")).toEqual([]);
    expect(withGuardNames(violations.find((v) => v.rule === "shift-length")!.message, new Map([[4, "Dan"]]))).toMatch(/^Dan's shift .* shorter than the minimum 4 h/);
  });

  it("survives the trip through the database's shape unchanged", () => {
    const stored = storedRoster(roster);
    expect(stored.shifts[0]!.guard_id).toBe(1);
    expect(stored.shifts[0]!.segments[0]).toEqual({ post: "R4-P1", start: "2027-03-23T09:00:00.000Z", end: "2027-03-23T11:00:00.000Z" });
    expect(engineRoster(stored)).toEqual(roster);
  });
});

describe("the roster API's input schemas", () => {
  it("takes a week only from a Monday, and time off only on real days in order", async () => {
    const { buildRequestSchema, timeOffRequestSchema } = await import("@/lib/rosters/schemas");
    expect(buildRequestSchema.safeParse({ startsOn: "2027-03-22" }).success).toBe(true);
    const tuesday = buildRequestSchema.safeParse({ startsOn: "2027-03-23" });
    expect(tuesday.success).toBe(false);
    expect(tuesday.error!.issues[0]!.message).toMatch(/Monday/);
    expect(timeOffRequestSchema.safeParse({ startsOn: "2027-02-27", endsOn: "2027-03-01" }).data).toEqual({ startsOn: "2027-02-27", endsOn: "2027-03-01", note: "" });
    for (const [startsOn, endsOn, field] of [
      ["2027-02-30", "2027-03-01", "startsOn"],
      ["2027-13-01", "2027-13-02", "startsOn"],
      ["2027-03-05", "2027-03-04", "endsOn"],
    ] as const) {
      const parsed = timeOffRequestSchema.safeParse({ startsOn, endsOn });
      expect(parsed.success, `${startsOn}..${endsOn}`).toBe(false);
      expect(parsed.error!.issues[0]!.path).toEqual([field]);
    }
  });
});
