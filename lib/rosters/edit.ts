// Manual edits of a draft roster, checked with the engine's rule checks as they are made: an edit
// that breaks a rule the draft kept is refused with that rule's message, and nothing is written.
import type { Kysely } from "kysely";
import { sql } from "kysely";
import type { Database, Roster as RosterRow, RosterViolation } from "@/db/schema";
import { toJson } from "@/db/schema";
import { guardsOfSite, insertShifts, shiftsOfRoster } from "@/db/queries/rosters";
import { parseScenario, type Scenario } from "@/lib/scheduling/scenario";
import { computeTotals } from "@/lib/scheduling/totals";
import { paidMs, type Roster, type Violation } from "@/lib/scheduling/roster";
import { currentOverridesOfRoster, insertRosterOverride } from "@/db/queries/roster-overrides";
import { checkAdjust, checkOutcome, editCheckContext, overridable, RULES_NEVER_OVERRIDDEN, unacceptedViolations, type AdjustChange, type EditCheck, type EditCheckContext } from "./edit-check";
import { RosterProblem } from "./problem";
import { postLabels } from "./shift-events";
import { reassign, type ReassignSource } from "./reassign";
import { guardIdOfKey, guardKey } from "./scenario";
import { engineRoster, storedRoster, storedTotals, storedViolations, withGuardNames } from "./stored";

export interface ReassignRequest {
  rosterId: number;
  /** The draft's revision the person was looking at. */
  revision: number;
  /** Whose segment (guard id) at which post from when; or an unfilled post-slot when guardId is null. */
  from: { guardId: number | null; post: string; start: string };
  toGuardId: number;
}

/** The scenario a roster was built from, as the engine reads it. */
export function rosterScenario(roster: Pick<RosterRow, "id" | "scenario">): Scenario {
  const parsed = parseScenario(roster.scenario);
  if (!parsed.ok) throw new Error(`roster ${roster.id} keeps no valid scenario: ${parsed.errors[0]?.message ?? "missing"}`);
  return parsed.scenario;
}

/** Locks the draft for an edit or publication; refuses anything but the draft at the expected revision. */
export async function lockDraft(trx: Kysely<Database>, rosterId: number, revision: number): Promise<RosterRow> {
  const roster = await trx.selectFrom("rosters").selectAll().where("id", "=", rosterId).forUpdate().executeTakeFirst();
  if (!roster) throw new RosterProblem(404, "not-found", `No roster with id ${rosterId}.`);
  if (roster.status !== "draft") {
    throw new RosterProblem(409, "not-a-draft", `Roster ${rosterId} is published version ${roster.version}; a published version never changes. Edit the week's draft instead.`);
  }
  if (roster.revision !== revision) {
    throw new RosterProblem(409, "roster-changed", `The draft changed since you loaded it (now revision ${roster.revision}, you had ${revision}); reload it and try again.`, {
      revision: roster.revision,
    });
  }
  return roster;
}

/** What a reassignment would do: the new roster and its violations, or why it cannot be made. */
type ReassignCheck = EditCheck;

type EditContext = EditCheckContext;

function sourceOf(from: ReassignRequest["from"]): ReassignSource {
  const start = new Date(from.start).getTime();
  return from.guardId === null ? { kind: "unfilled", post: from.post, start } : { kind: "segment", guard: guardKey(from.guardId), post: from.post, start };
}

/** The same checks the engine's rules make, on the roster as it would be after the change. */
function checkReassign(edit: EditContext, source: ReassignSource, toKey: string): ReassignCheck {
  return checkOutcome(edit, reassign(edit.before, source, toKey, edit.scenario.rules.minRestHours));
}

async function editContext(trx: Kysely<Database>, roster: RosterRow): Promise<EditContext> {
  const scenario = rosterScenario(roster);
  const guards = await guardsOfSite(trx, roster.site_id);
  const rows = await shiftsOfRoster(trx, roster.id);
  const before = engineRoster({ shifts: rows, unfilled: roster.unfilled });
  return editCheckContext(scenario, before, new Map(guards.map((g) => [g.id, g.name])), postLabels(scenario));
}

/** A guard the stretch could go to: whether the rules allow it, and if not, the rule and why. */
export interface ReassignOption {
  guardId: number;
  name: string;
  /** Paid hours on this roster so far (before the change). */
  hoursSoFar: number;
  contractHours: number;
  ok: boolean;
  /** The rule that matters most of those the change would break (skills before shift length, …). */
  rule: string | null;
  reason: string | null;
  /** Every rule the change would break. */
  rules: string[];
}

/** Which broken rule to name first: what the person is, then when they may work, then shapes of shifts. */
const RULE_ORDER = ["skills", "availability", "rest", "contract-hours", "weekly-max", "one-place", "shift-length", "breaks", "rotation", "coverage"];
const ruleRank = (rule: string) => (RULE_ORDER.indexOf(rule) === -1 ? RULE_ORDER.length : RULE_ORDER.indexOf(rule));

/**
 * Every guard on the roster's staff but the stretch's own, checked as if the stretch were given to
 * them: those who can take it first (fewest hours so far first), then the others with the first rule
 * they would break.
 */
export async function reassignOptions(db: Kysely<Database>, rosterId: number, from: ReassignRequest["from"]): Promise<ReassignOption[]> {
  const roster = await db.selectFrom("rosters").selectAll().where("id", "=", rosterId).executeTakeFirst();
  if (!roster) throw new RosterProblem(404, "not-found", `No roster with id ${rosterId}.`);
  if (roster.status !== "draft") throw new RosterProblem(409, "not-a-draft", `Roster ${rosterId} is published version ${roster.version}; a published version never changes. Edit the week's draft instead.`);
  const edit = await editContext(db, roster);
  const source = sourceOf(from);
  const paid = new Map<string, number>();
  for (const shift of edit.before.shifts) paid.set(shift.guard, (paid.get(shift.guard) ?? 0) + paidMs(shift, edit.scenario.rules.paidBreaks) / 3_600_000);
  const options = edit.scenario.guards
    .filter((g) => from.guardId === null || g.id !== guardKey(from.guardId))
    .map((g) => {
      const guardId = guardIdOfKey(g.id) ?? 0;
      const check = checkReassign(edit, source, g.id);
      const broken = check.ok ? [] : [...(check.violations ?? [])].sort((a, b) => ruleRank(a.rule) - ruleRank(b.rule));
      const first = broken[0];
      return {
        guardId,
        name: edit.names.get(guardId) ?? g.id,
        hoursSoFar: Math.round((paid.get(g.id) ?? 0) * 100) / 100,
        contractHours: g.contractHours,
        ok: check.ok,
        // A guard already standing elsewhere then breaks "one place at a time" before anything else.
        rule: check.ok ? null : (first?.rule ?? "one-place"),
        reason: check.ok ? null : (first?.message ?? check.message),
        rules: check.ok ? [] : broken.length ? [...new Set(broken.map((v) => v.rule))] : ["one-place"],
      };
    });
  return options.sort((a, b) => Number(b.ok) - Number(a.ok) || a.hoursSoFar - b.hoursSoFar || a.name.localeCompare(b.name));
}

export async function reassignInDraft(db: Kysely<Database>, request: ReassignRequest): Promise<{ revision: number }> {
  return db.transaction().execute(async (trx) => {
    const roster = await lockDraft(trx, request.rosterId, request.revision);
    const toKey = guardKey(request.toGuardId);
    const edit = await editContext(trx, roster);
    const { scenario, demand, names, labels } = edit;
    if (!scenario.guards.some((g) => g.id === toKey)) {
      throw new RosterProblem(422, "unknown-guard", `Guard ${request.toGuardId} is not on this roster's staff list; rebuild the roster to include new guards.`, { field: "toGuardId" });
    }
    const outcome = checkReassign(edit, sourceOf(request.from), toKey);
    if (!outcome.ok) throw new RosterProblem(422, outcome.code, outcome.message, outcome.violations ? { violations: outcome.violations } : {});
    return saveEdit(trx, roster.id, edit, outcome.roster, outcome.after, []);
  });
}

/** Writes an edited draft: its shifts, unfilled slots, totals and the violations not kept on purpose. */
async function saveEdit(trx: Kysely<Database>, rosterId: number, edit: EditContext, after: Roster, violations: Violation[], accepted: RosterViolation[]): Promise<{ revision: number }> {
  const { scenario, demand, names, labels } = edit;
  const kept = [...(await currentOverridesOfRoster(trx, rosterId)).flatMap((o) => o.violations), ...accepted];
  const stored = storedRoster(after, (text) => withGuardNames(text, names, labels));
  await trx.deleteFrom("shifts").where("roster_id", "=", rosterId).execute();
  await insertShifts(trx, rosterId, stored.shifts);
  const updated = await trx
    .updateTable("rosters")
    .set({
      revision: sql<number>`revision + 1`,
      unfilled: toJson(stored.unfilled),
      totals: toJson(storedTotals(computeTotals(scenario, demand, after))),
      violations: toJson(unacceptedViolations(storedViolations(violations, names, labels), kept)),
    })
    .where("id", "=", rosterId)
    .returning("revision")
    .executeTakeFirstOrThrow();
  return { revision: updated.revision };
}

export interface AdjustRequest extends AdjustChange {
  rosterId: number;
  revision: number;
  /** Why the change is kept although it breaks a rule; without it such a change is refused. */
  overrideNote?: string;
  user: { id: number; name: string };
}

/**
 * Moves one segment of the draft in time and/or to another guard (the week builder), checked with
 * the engine's rules; a change that breaks one is refused naming it, or kept with an override note.
 */
export async function adjustInDraft(db: Kysely<Database>, request: AdjustRequest): Promise<{ revision: number; overridden: RosterViolation[] }> {
  return db.transaction().execute(async (trx) => {
    const roster = await lockDraft(trx, request.rosterId, request.revision);
    const edit = await editContext(trx, roster);
    if (!edit.scenario.guards.some((g) => g.id === guardKey(request.toGuardId))) {
      throw new RosterProblem(422, "unknown-guard", `Guard ${request.toGuardId} is not on this roster's staff list; rebuild the roster to include new guards.`, { field: "toGuardId" });
    }
    const check = checkAdjust(edit, request);
    const note = request.overrideNote?.trim() ?? "";
    if (check.ok) return { ...(await saveEdit(trx, roster.id, edit, check.roster, check.after, [])), overridden: [] };
    if (check.code !== "breaks-rule" || note === "") throw new RosterProblem(422, check.code, check.message, check.violations ? { violations: check.violations } : {});
    const broken = check.violations;
    if (!overridable(broken)) {
      const rules = [...new Set(broken.filter((v) => RULES_NEVER_OVERRIDDEN.includes(v.rule)).map((v) => v.rule))].join(", ");
      throw new RosterProblem(422, "not-overridable", `${check.message} A note cannot keep a change against rule ${rules}.`, { violations: broken });
    }
    // Kept against the rules on purpose: apply the change and remember why, who and when.
    const saved = await saveEdit(trx, roster.id, edit, check.roster, check.after, broken);
    await insertRosterOverride(trx, {
      rosterId: roster.id,
      revision: saved.revision,
      guardId: request.toGuardId,
      post: request.from.post,
      startsAt: new Date(request.start),
      endsAt: new Date(request.end),
      violations: broken,
      note,
      createdBy: request.user,
    });
    return { ...saved, overridden: broken };
  });
}
