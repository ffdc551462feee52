// Malformed scenario files are answered with errors that name the field (scripts/README.md: exit 2, valid part still answered).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseScenario } from "@/lib/scheduling/scenario";

const fixture = (name: string) => JSON.parse(readFileSync(`tests/fixtures/scenarios/${name}`, "utf8"));

describe("parseScenario", () => {
  it("accepts the scripts/README.md example and fills every rule default", () => {
    const parsed = parseScenario(fixture("textile-week.json"));
    expect(parsed.ok).toBe(true);
    const bare = parseScenario({ timezone: "Europe/Berlin", start: "2027-03-22", opening: { weekly: {} }, posts: [], guards: [] });
    if (!bare.ok) throw new Error("bare scenario rejected");
    // Defaults as scripts/README.md lists them.
    expect(bare.scenario.rules).toMatchObject({ slotMinutes: 60, minShiftHours: 4, maxShiftHours: 10, minRestHours: 11, breakAfterHours: 6, breakMinutes: 60, maxHoursAtOnePost: 2, overtimeAfterHours: 40, overtimeFactor: 1.5, hourlyRate: 22, paidBreaks: false });
    expect(bare.scenario.days).toBe(7);
  });

  it("names the field of a wrong type", () => {
    const parsed = parseScenario(fixture("malformed-guard.json"));
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(parsed.errors.map((e) => e.field)).toEqual(["guards.0.maxHours"]);
  });

  it("names an unknown time zone, a bad clock time and a 45-minute slot", () => {
    const parsed = parseScenario({
      timezone: "Europe/Atlantis",
      start: "2027-03-22",
      opening: { weekly: { mon: ["10:00", "25:00"] } },
      posts: [],
      guards: [{ id: "G1" }, { id: "G1" }],
      rules: { slotMinutes: 45 },
    });
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    const fields = parsed.errors.map((e) => e.field);
    expect(fields).toContain("timezone");
    expect(fields).toContain("opening.weekly.mon.1");
    expect(fields).toContain("rules.slotMinutes");
  });

  it("names a duplicate guard id", () => {
    const parsed = parseScenario({ timezone: "UTC", start: "2027-03-22", opening: { weekly: {} }, posts: [], guards: [{ id: "G1" }, { id: "G1" }] });
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(parsed.errors).toEqual([{ field: "guards.1.id", message: "duplicate guard id G1" }]);
  });
});

describe("the labour-rule defaults Settings offers", () => {
  it("are the engine's own defaults, one set of numbers", async () => {
    const { ENGINE_LABOUR_DEFAULTS, LABOUR_DEFAULT_KEYS } = await import("@/lib/scheduling/labour-defaults");
    const { rulesSchema } = await import("@/lib/scheduling/scenario");
    const engine = rulesSchema.parse({});
    for (const key of LABOUR_DEFAULT_KEYS) expect(ENGINE_LABOUR_DEFAULTS[key], key).toBe(engine[key]);
  });
});
