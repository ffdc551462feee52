// The roster command end to end (scripts/README.md): one JSON document on stdout, exit 0 for valid input, 2 naming the field otherwise.
import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";

// The first case goes through npx as a user would; the rest load tsx into node directly (npx start-up is slow).
function run(args: string[], input?: string, viaNpx = false) {
  const [command, prefix] = viaNpx ? ["npx", ["tsx"]] : [process.execPath, ["--import", "tsx"]];
  const out = spawnSync(command, [...prefix, "scripts/roster.ts", ...args], { encoding: "utf8", input, timeout: 120_000 });
  return { code: out.status, stdout: out.stdout, stderr: out.stderr };
}

describe("npm run roster", () => {
  it("staffs the textile week: shifts, unfilled with reasons, totals and no violations", () => {
    const { code, stdout } = run(["tests/fixtures/scenarios/textile-week.json"], undefined, true);
    expect(code).toBe(0);
    const answer = JSON.parse(stdout);
    expect(answer.violations).toEqual([]);
    expect(answer.totals.postHours).toBe(138);
    expect(answer.totals.lowerBoundCost).toBeLessThanOrEqual(answer.totals.cost);
    for (const key of ["postHours", "paidHours", "overtimeHours", "cost", "lowerBoundCost"]) expect(typeof answer.totals[key]).toBe("number");
    const shift = answer.shifts[0];
    expect(shift.start).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/);
    expect(Array.isArray(shift.segments) && Array.isArray(shift.breaks)).toBe(true);
    // G1 is on leave all Tuesday (fixture).
    expect(answer.shifts.some((s: { guard: string; start: string }) => s.guard === "G1" && s.start.startsWith("2027-03-23"))).toBe(false);
    for (const u of answer.unfilled) expect(u.reason).toMatch(/no guard/);
  });

  it("reads standard input with -", () => {
    const { code, stdout } = run(["-"], readFileSync("tests/fixtures/scenarios/no-skilled-guard.json", "utf8"));
    expect(code).toBe(0);
    const answer = JSON.parse(stdout);
    expect(answer.unfilled.filter((u: { post: string }) => u.post === "P1")).toHaveLength(12);
    expect(answer.unfilled[0].reason).toContain("no guard has skill high-value");
  });

  it("answers a malformed scenario with exit 2 and the field", () => {
    const { code, stdout } = run(["tests/fixtures/scenarios/malformed-guard.json"]);
    expect(code).toBe(2);
    expect(JSON.parse(stdout).errors[0].field).toBe("guards.0.maxHours");
  });

  it("answers text that is not JSON with exit 2", () => {
    const { code, stdout } = run(["-"], "{ not json");
    expect(code).toBe(2);
    expect(JSON.parse(stdout).errors[0].field).toBe("(json)");
  });
});
