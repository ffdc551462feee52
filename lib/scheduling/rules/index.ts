// checkRoster: every hard rule of scripts/README.md, shared by the engine, manual edits and the tests.
import type { Roster, Violation } from "../roster";
import type { Scenario } from "../scenario";
import { checkAvailability } from "./availability";
import { checkBreaks } from "./breaks";
import { ruleContext, type RuleContext } from "./context";
import { checkCoverage } from "./coverage";
import { checkOnePlace } from "./onePlace";
import { checkRest } from "./rest";
import { checkRotation } from "./rotation";
import { checkShiftLength } from "./shiftLength";
import { checkSkills } from "./skills";
import { checkContractHours, checkWeeklyMax } from "./weeklyMax";

export const ruleChecks: Record<string, (ctx: RuleContext, roster: Roster) => Violation[]> = {
  coverage: checkCoverage,
  "one-place": checkOnePlace,
  "shift-length": checkShiftLength,
  rest: checkRest,
  "weekly-max": checkWeeklyMax,
  "contract-hours": checkContractHours,
  breaks: checkBreaks,
  rotation: checkRotation,
  skills: checkSkills,
  availability: checkAvailability,
};

export function checkRoster(scenario: Scenario, roster: Roster, ctx: RuleContext = ruleContext(scenario)): Violation[] {
  return Object.values(ruleChecks).flatMap((check) => check(ctx, roster));
}

export { ruleContext };
export type { RuleContext };
