// The rule check of a manual edit, pure so the browser (week builder) and the server run the same
// code: the edited roster goes through the engine's checkRoster, and only rules it newly breaks count.
import { buildDemand, type Demand } from "@/lib/scheduling/demand";
import { checkRoster, ruleContext, type RuleContext } from "@/lib/scheduling/rules";
import type { Roster, Violation } from "@/lib/scheduling/roster";
import type { Scenario } from "@/lib/scheduling/scenario";
import type { RosterViolation } from "@/db/schema";
import { adjust, type ReassignOutcome } from "./reassign";
import { guardKey } from "./scenario";
import { storedViolations, withGuardNames } from "./stored";

export interface EditCheckContext {
  scenario: Scenario;
  demand: Demand;
  context: RuleContext;
  before: Roster;
  /** Violations the roster already had (rule|message): an edit is judged only by what it adds. */
  known: Set<string>;
  names: Map<number, string>;
  labels: Map<string, string>;
}

export type EditCheck =
  | { ok: true; roster: Roster; after: Violation[] }
  | { ok: false; code: "cannot-reassign"; message: string; violations?: undefined }
  // The roster as the edit would leave it rides along, for a change kept with an override note.
  | { ok: false; code: "breaks-rule"; message: string; violations: RosterViolation[]; roster: Roster; after: Violation[] };

/**
 * Rules a change is never kept against, even with a note: they keep the roster readable (a post
 * held by one guard, or listed unfilled; a guard in one place at a time).
 */
export const RULES_NEVER_OVERRIDDEN: readonly string[] = ["coverage", "one-place"];

/** The reason an unfilled post-slot gets when a change by hand leaves it open. */
export const VACATED_REASON = "left open by a change in the week builder; give it to a guard";

export function editCheckContext(scenario: Scenario, before: Roster, names: Map<number, string>, labels: Map<string, string>): EditCheckContext {
  const demand = buildDemand(scenario);
  const context = ruleContext(scenario, demand);
  return { scenario, demand, context, before, known: new Set(checkRoster(scenario, before, context).map((v) => `${v.rule}|${v.message}`)), names, labels };
}

/** The same checks the engine's rules make, on the roster as the edit leaves it. */
export function checkOutcome(edit: EditCheckContext, outcome: ReassignOutcome): EditCheck {
  if (!outcome.ok) return { ok: false, code: "cannot-reassign", message: withGuardNames(outcome.message, edit.names, edit.labels) };
  const after = checkRoster(edit.scenario, outcome.roster, edit.context);
  const broken = after.filter((v) => !edit.known.has(`${v.rule}|${v.message}`));
  if (broken.length > 0) {
    const violations = storedViolations(broken, edit.names, edit.labels);
    // Name every rule the edit would break (a person fixes them together), the first three in full.
    const named = violations.slice(0, 3).map((v) => `${v.message} (rule ${v.rule})`);
    const more = violations.length > 3 ? `; and ${violations.length - 3} more` : "";
    return { ok: false, code: "breaks-rule", message: `Not changed: ${named.join("; ")}${more}.`, violations, roster: outcome.roster, after };
  }
  return { ok: true, roster: outcome.roster, after };
}

/** A week-builder change as the API takes it: whose segment, and where it goes. */
export interface AdjustChange {
  from: { guardId: number; post: string; start: string };
  start: string;
  end: string;
  toGuardId: number;
}

/** Checks a move/resize/reassign of one segment; the browser calls it before sending, the server again. */
export function checkAdjust(edit: EditCheckContext, change: AdjustChange): EditCheck {
  const toKey = guardKey(change.toGuardId);
  if (!edit.scenario.guards.some((g) => g.id === toKey)) {
    return { ok: false, code: "cannot-reassign", message: `Guard ${change.toGuardId} is not on this roster's staff list; rebuild the roster to include new guards.` };
  }
  const outcome = adjust(
    edit.before,
    {
      guard: guardKey(change.from.guardId),
      post: change.from.post,
      start: new Date(change.from.start).getTime(),
      newStart: new Date(change.start).getTime(),
      newEnd: new Date(change.end).getTime(),
      toGuard: toKey,
    },
    edit.scenario.rules.minRestHours,
    edit.demand.slots,
    VACATED_REASON,
  );
  return checkOutcome(edit, outcome);
}

/** True when every broken rule may be kept with a note. */
export function overridable(violations: readonly { rule: string }[]): boolean {
  return violations.length > 0 && violations.every((v) => !RULES_NEVER_OVERRIDDEN.includes(v.rule));
}

/** The violations to store on the roster: all it breaks but those kept on purpose with a note. */
export function unacceptedViolations(violations: RosterViolation[], accepted: readonly RosterViolation[]): RosterViolation[] {
  const keys = new Set(accepted.map((v) => `${v.rule}|${v.message}`));
  return violations.filter((v) => !keys.has(`${v.rule}|${v.message}`));
}
