// The roster command's JSON (scripts/README.md): wall-clock times in the site's zone, totals and violations.
import type { RosterResult } from "./engine";
import type { Roster, Violation } from "./roster";
import type { Scenario } from "./scenario";
import { formatLocal } from "./time";

export function rosterToJson(scenario: Scenario, roster: Roster) {
  const at = (t: number) => formatLocal(scenario.timezone, t);
  return {
    shifts: roster.shifts.map((s) => ({
      guard: s.guard,
      start: at(s.start),
      end: at(s.end),
      segments: s.segments.map((x) => ({ post: x.post, start: at(x.start), end: at(x.end) })),
      breaks: s.breaks.map((b) => ({ start: at(b.start), end: at(b.end) })),
    })),
    unfilled: roster.unfilled.map((u) => ({ post: u.post, start: at(u.start), end: at(u.end), reason: u.reason })),
  };
}

export function violationsToJson(scenario: Scenario, violations: Violation[]) {
  const at = (t: number) => formatLocal(scenario.timezone, t);
  return violations.map((v) => ({ ...v, start: v.start === undefined ? undefined : at(v.start), end: v.end === undefined ? undefined : at(v.end) }));
}

export function resultToJson(scenario: Scenario, result: RosterResult) {
  return {
    ...rosterToJson(scenario, result.roster),
    totals: result.totals,
    violations: violationsToJson(scenario, result.violations),
    solver: { coverStatus: result.stats.coverStatus, ms: Object.fromEntries(Object.entries(result.stats.ms).map(([k, v]) => [k, Math.round(v)])) },
  };
}
