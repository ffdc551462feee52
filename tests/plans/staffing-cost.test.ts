// Staffing-cost maths against values worked out by hand (shown beside each check).
import { describe, expect, it } from "vitest";
import {
  DEFAULT_CONTRACT_HOURS,
  DEFAULT_RELIEF_FACTOR,
  minutesOf,
  openHoursOfDay,
  staffingCost,
  staffingCostChange,
  weeklyOpenHours,
  type WeeklyOpening,
} from "@/lib/guarding/staffing-cost";

// The weekly pattern of scripts/README.md's `opening` example.
const INTERFACES_WEEK: WeeklyOpening = {
  mon: null,
  tue: ["10:00", "18:00"],
  wed: ["10:00", "18:00"],
  thu: ["10:00", "21:00"],
  fri: ["10:00", "18:00"],
  sat: ["10:00", "18:00"],
  sun: ["11:00", "17:00"],
};

describe("opening hours → open hours", () => {
  it("reads HH:mm, including 24:00 as the end of the day", () => {
    expect(minutesOf("09:30")).toBe(570); // 9 × 60 + 30
    expect(minutesOf("24:00")).toBe(1440);
    expect(() => minutesOf("9.30")).toThrow(/HH:mm/);
    expect(() => minutesOf("25:00")).toThrow(/between 00:00 and 24:00/);
    expect(() => minutesOf("10:60")).toThrow();
  });

  it("counts one day, closed days as 0 and openings past midnight", () => {
    expect(openHoursOfDay(["10:00", "18:00"])).toBe(8);
    expect(openHoursOfDay(["10:15", "17:45"])).toBe(7.5);
    expect(openHoursOfDay(null)).toBe(0);
    expect(openHoursOfDay(["18:00", "02:00"])).toBe(8); // 6 h before midnight + 2 after
    expect(openHoursOfDay(["00:00", "24:00"])).toBe(24);
  });

  it("sums the weekly pattern: 8 + 8 + 11 + 8 + 8 + 6 = 49 hours for scripts/README.md's example", () => {
    expect(weeklyOpenHours(INTERFACES_WEEK)).toBe(49);
  });

  it("treats days left out of the pattern as closed", () => {
    expect(weeklyOpenHours({ sat: ["10:00", "16:00"], sun: ["10:00", "16:00"] })).toBe(12);
    expect(weeklyOpenHours({})).toBe(0);
  });

  it("a site open round the clock has 7 × 24 = 168 hours", () => {
    const always: WeeklyOpening = Object.fromEntries(["mon", "tue", "wed", "thu", "fri", "sat", "sun"].map((d) => [d, ["00:00", "24:00"]]));
    expect(weeklyOpenHours(always)).toBe(168);
  });
});

describe("staffing cost of a plan", () => {
  it("uses a 40-hour week and a relief factor of 1.2 by default (common practice, no published source)", () => {
    expect(DEFAULT_CONTRACT_HOURS).toBe(40);
    expect(DEFAULT_RELIEF_FACTOR).toBe(1.2);
  });

  it("3 posts, 49 open hours, rate 22: hand-computed", () => {
    const cost = staffingCost({ posts: 3, weeklyOpenHours: 49, hourlyRate: 22 });
    expect(cost.postHoursPerWeek).toBe(147); // 3 × 49
    expect(cost.fte).toBeCloseTo(4.41, 10); // 147 / 40 × 1.2
    expect(cost.paidHoursPerWeek).toBeCloseTo(176.4, 10); // 4.41 × 40
    expect(cost.costPerWeek).toBeCloseTo(3880.8, 8); // 176.4 × 22
    expect(cost.costPerYear).toBeCloseTo(201801.6, 6); // 3880.8 × 52
  });

  it("honours a set contract week and relief factor", () => {
    const cost = staffingCost({ posts: 2, weeklyOpenHours: 50, hourlyRate: 20, contractHours: 37.5, reliefFactor: 1.25 });
    expect(cost.postHoursPerWeek).toBe(100); // 2 × 50
    expect(cost.fte).toBeCloseTo(10 / 3, 10); // 100 / 37.5 × 1.25
    expect(cost.costPerWeek).toBeCloseTo(2500, 8); // 100 × 1.25 × 20
  });

  it("no posts cost nothing", () => {
    const cost = staffingCost({ posts: 0, weeklyOpenHours: 49, hourlyRate: 22 });
    expect(cost).toMatchObject({ postHoursPerWeek: 0, fte: 0, costPerWeek: 0 });
  });

  it("one post fewer saves exactly one post's hours", () => {
    const four = staffingCost({ posts: 4, weeklyOpenHours: 49, hourlyRate: 22 });
    const three = staffingCost({ posts: 3, weeklyOpenHours: 49, hourlyRate: 22 });
    const change = staffingCostChange(four, three);
    expect(change.postHoursPerWeek).toBe(-49);
    expect(change.fte).toBeCloseTo(-1.47, 10); // 49 / 40 × 1.2
    expect(change.costPerWeek).toBeCloseTo(-1293.6, 8); // 49 × 1.2 × 22
  });

  it("refuses inputs that make no sense, saying which", () => {
    expect(() => staffingCost({ posts: 2, weeklyOpenHours: 49, hourlyRate: 22, reliefFactor: 0.8 })).toThrow(/relief factor/);
    expect(() => staffingCost({ posts: 2, weeklyOpenHours: 49, hourlyRate: 22, contractHours: 0 })).toThrow(/contract hours/);
    expect(() => staffingCost({ posts: 1.5, weeklyOpenHours: 49, hourlyRate: 22 })).toThrow(/whole number/);
    expect(() => staffingCost({ posts: 1, weeklyOpenHours: 200, hourlyRate: 22 })).toThrow(/168/);
    expect(() => staffingCost({ posts: 1, weeklyOpenHours: 49, hourlyRate: -1 })).toThrow(/hourly rate/);
  });
});
