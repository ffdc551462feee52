// Demand in real time: slots from the weekly pattern and dated exceptions, days of 23 and 25 hours at the clock changes.
import { describe, expect, it } from "vitest";
import { buildDemand, demandPostHours, openingOf } from "@/lib/scheduling/demand";
import { parseScenario, type Scenario } from "@/lib/scheduling/scenario";
import { addLocalDays, formatLocal, localToInstant } from "@/lib/scheduling/time";

function scenario(extra: Record<string, unknown>): Scenario {
  const parsed = parseScenario({ timezone: "Europe/Berlin", start: "2027-03-22", days: 7, opening: { weekly: {} }, posts: [{ id: "P1" }, { id: "P2" }], guards: [], ...extra });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
  return parsed.scenario;
}

describe("clock changes in Europe/Berlin (EU summer time: last Sundays of March and October; IANA tz data in Node Intl)", () => {
  it("2027-03-28 has 23 real hours and 2027-10-31 has 25", () => {
    const z = "Europe/Berlin";
    const hours = (date: string) => (localToInstant(z, addLocalDays(z, date, 1)) - localToInstant(z, date)) / 3_600_000;
    expect(hours("2027-03-28")).toBe(23);
    expect(hours("2027-10-31")).toBe(25);
    expect(hours("2027-03-27")).toBe(24);
  });

  it("a site open around the clock has 23 hourly slots on the spring day and 25 on the autumn day", () => {
    const spring = buildDemand(scenario({ start: "2027-03-28", days: 1, opening: { weekly: { sun: ["00:00", "24:00"] } } }));
    expect(spring.slots).toHaveLength(23);
    // Wall clock jumps from 01:00 to 03:00.
    expect(spring.slots.slice(0, 3).map((s) => formatLocal("Europe/Berlin", s.start).slice(11))).toEqual(["00:00", "01:00", "03:00"]);
    const autumn = buildDemand(scenario({ start: "2027-10-31", days: 1, opening: { weekly: { sun: ["00:00", "24:00"] } } }));
    expect(autumn.slots).toHaveLength(25);
    expect(demandPostHours(autumn)).toBe(50);
  });
});

describe("opening hours", () => {
  it("a dated exception wins over the weekly pattern, null closes", () => {
    const s = scenario({ opening: { weekly: { fri: ["10:00", "18:00"], sat: ["10:00", "18:00"] }, dates: { "2027-03-26": null, "2027-03-27": ["10:00", "23:00"] } } });
    expect(openingOf(s, "2027-03-26")).toBeNull();
    expect(openingOf(s, "2027-03-27")).toEqual(["10:00", "23:00"]);
    const demand = buildDemand(s);
    expect(demand.days.map((d) => d.slots.length)).toEqual([0, 0, 0, 0, 0, 13, 0]);
  });

  it("30-minute slots double the slot count, not the post-hours", () => {
    const hourly = buildDemand(scenario({ opening: { weekly: { tue: ["10:00", "18:00"] } } }));
    const half = buildDemand(scenario({ opening: { weekly: { tue: ["10:00", "18:00"] } }, rules: { slotMinutes: 30 } }));
    expect(half.slots.length).toBe(2 * hourly.slots.length);
    expect(demandPostHours(half)).toBe(demandPostHours(hourly));
    expect(demandPostHours(hourly)).toBe(16);
  });

  it("a night opening past midnight into the autumn change counts real hours, and an overlapping next day is not demanded twice", () => {
    // Saturday 2027-10-30 18:00 to Sunday 04:00 spans the 03:00 -> 02:00 change: 11 real hours; Sunday then opens at 04:00.
    const demand = buildDemand(scenario({ start: "2027-10-30", days: 2, opening: { weekly: { sat: ["18:00", "04:00"], sun: ["00:00", "24:00"] } } }));
    expect(demand.days[0].slots).toHaveLength(11);
    expect(demand.days[1].slots).toHaveLength(20);
    const starts = demand.slots.map((s) => s.start);
    expect(new Set(starts).size).toBe(starts.length);
    expect(formatLocal("Europe/Berlin", demand.slots[demand.days[1].slots[0]].start)).toBe("2027-10-31T04:00");
  });
});
