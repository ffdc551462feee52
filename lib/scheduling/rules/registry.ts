// The labour rules, one entry each: the check that judges a roster (the engine's own answer, manual
// edits and the tests), the blocker the engine asks before it gives a guard a shift, and the words
// an unfilled hour's explanation uses when the rule keeps a guard away. The engine (assign.ts,
// gapFill.ts, repair.ts), the checks (index.ts) and the explanations (explain.ts) read them from here.
import type { Demand } from "../demand";
import type { Roster, Violation } from "../roster";
import type { Guard, Scenario } from "../scenario";
import { AVAILABILITY, availabilityBlocks, checkAvailability } from "./availability";
import { checkBreaks } from "./breaks";
import type { RuleContext } from "./context";
import { checkCoverage } from "./coverage";
import { checkOnePlace } from "./onePlace";
import { checkRest, REST, restBlocks } from "./rest";
import { checkRotation } from "./rotation";
import { checkShiftLength } from "./shiftLength";
import { checkSkills } from "./skills";
import { CONTRACT_HOURS, checkContractHours, checkWeeklyMax, WEEKLY_MAX, weeklyBlocks, weeklyLimitHours } from "./weeklyMax";

/** What a blocker is asked: may this guard, with these shifts so far, take [start, end) paid paidMs? */
export interface BlockerQuestion {
  scenario: Scenario;
  demand: Demand;
  guard: Guard;
  shifts: readonly { start: number; end: number; paidMs: number }[];
  start: number;
  end: number;
  paidMs: number;
}

export interface LabourRule {
  name: string;
  check: (ctx: RuleContext, roster: Roster) => Violation[];
  /** True when the rule forbids the shift; rules the engine keeps by construction have none. */
  blocks?: (q: BlockerQuestion) => boolean;
  /** How an unfilled hour's explanation counts a guard this rule keeps away. */
  reason?: string;
}

const overlaps = (q: BlockerQuestion) => q.shifts.some((s) => s.start < q.end && q.start < s.end);

// In the order the checks have always reported in (the first violation is the one a page shows).
export const LABOUR_RULES: readonly LabourRule[] = [
  { name: "coverage", check: checkCoverage },
  {
    name: "one-place",
    check: checkOnePlace,
    blocks: overlaps,
    reason: "already on a shift then",
  },
  { name: "shift-length", check: checkShiftLength },
  {
    name: REST,
    check: checkRest,
    blocks: (q) => restBlocks(q.scenario.rules.minRestHours, q.shifts, q.start, q.end),
    reason: "resting",
  },
  {
    name: WEEKLY_MAX,
    check: checkWeeklyMax,
    blocks: (q) => weeklyBlocks({ ...q.guard, extraHours: undefined }, q.shifts, q.start, q.end, q.paidMs),
    reason: "at their weekly maximum",
  },
  {
    name: CONTRACT_HOURS,
    check: checkContractHours,
    blocks: (q) => q.guard.extraHours !== undefined && weeklyLimitHours(q.guard) < q.guard.maxHours && weeklyBlocks(q.guard, q.shifts, q.start, q.end, q.paidMs),
    reason: "at their contract hours plus accepted extra",
  },
  { name: "breaks", check: checkBreaks },
  { name: "rotation", check: checkRotation },
  { name: "skills", check: checkSkills },
  {
    name: AVAILABILITY,
    check: checkAvailability,
    blocks: (q) => availabilityBlocks(q.demand.unavailable.get(q.guard.id), q.start, q.end),
    reason: "on leave",
  },
];

/** The rule of this name (a typo in the code is caught at once). */
export function labourRule(name: string): LabourRule {
  const rule = LABOUR_RULES.find((r) => r.name === name);
  if (!rule) throw new Error(`no labour rule named ${name}`);
  return rule;
}
