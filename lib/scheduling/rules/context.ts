// What every rule check needs: the scenario, its demand in real instants, and a way to print times.
import { buildDemand, type Demand } from "../demand";
import type { Guard, Post, Scenario } from "../scenario";
import { formatLocal, HOUR } from "../time";

export interface RuleContext {
  scenario: Scenario;
  demand: Demand;
  guards: Map<string, Guard>;
  posts: Map<string, Post>;
  /** Wall-clock text of an instant in the site's zone. */
  at: (instant: number) => string;
}

export function ruleContext(scenario: Scenario, demand = buildDemand(scenario)): RuleContext {
  return {
    scenario,
    demand,
    guards: new Map(scenario.guards.map((g) => [g.id, g])),
    posts: new Map(scenario.posts.map((p) => [p.id, p])),
    at: (instant) => formatLocal(scenario.timezone, instant),
  };
}

/** Hours to one decimal for messages. */
export function hoursText(ms: number): string {
  const h = Math.round((ms / HOUR) * 100) / 100;
  return `${h} h`;
}

/** Tolerance for comparing instants (1 second), so float sums of minutes do not break rules. */
export const EPSILON_MS = 1000;
