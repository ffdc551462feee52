// checkRoster: every hard rule of scripts/README.md, shared by the engine, manual edits and the tests.
import type { Roster, Violation } from "../roster";
import type { Scenario } from "../scenario";
import { ruleContext, type RuleContext } from "./context";
import { LABOUR_RULES } from "./registry";

/** Every rule's check by name, from the one registry (rules/registry.ts). */
export const ruleChecks: Record<string, (ctx: RuleContext, roster: Roster) => Violation[]> = Object.fromEntries(LABOUR_RULES.map((rule) => [rule.name, rule.check]));

export function checkRoster(scenario: Scenario, roster: Roster, ctx: RuleContext = ruleContext(scenario)): Violation[] {
  return LABOUR_RULES.flatMap((rule) => rule.check(ctx, roster));
}

export { ruleContext };
export type { RuleContext };
