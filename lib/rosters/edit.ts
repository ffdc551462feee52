// Manual edits of a draft roster, checked with the engine's rule checks as they are made: an edit
// that breaks a rule the draft kept is refused with that rule's message, and nothing is written.
import type { Kysely } from "kysely";
import { sql } from "kysely";
import type { Database, Roster as RosterRow } from "@/db/schema";
import { toJson } from "@/db/schema";
import { guardsOfSite, insertShifts, shiftsOfRoster } from "@/db/queries/rosters";
import { buildDemand } from "@/lib/scheduling/demand";
import { checkRoster, ruleContext } from "@/lib/scheduling/rules";
import { parseScenario, type Scenario } from "@/lib/scheduling/scenario";
import { computeTotals } from "@/lib/scheduling/totals";
import { RosterProblem } from "./problem";
import { reassign, type ReassignSource } from "./reassign";
import { guardKey } from "./scenario";
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

export async function reassignInDraft(db: Kysely<Database>, request: ReassignRequest): Promise<{ revision: number }> {
  return db.transaction().execute(async (trx) => {
    const roster = await lockDraft(trx, request.rosterId, request.revision);
    const scenario = rosterScenario(roster);
    const toKey = guardKey(request.toGuardId);
    const guards = await guardsOfSite(trx, roster.site_id);
    const names = new Map(guards.map((g) => [g.id, g.name]));
    if (!scenario.guards.some((g) => g.id === toKey)) {
      throw new RosterProblem(422, "unknown-guard", `Guard ${request.toGuardId} is not on this roster's staff list; rebuild the roster to include new guards.`, { field: "toGuardId" });
    }
    const rows = await shiftsOfRoster(trx, roster.id);
    const before = engineRoster({ shifts: rows, unfilled: roster.unfilled });
    const start = new Date(request.from.start).getTime();
    const source: ReassignSource =
      request.from.guardId === null
        ? { kind: "unfilled", post: request.from.post, start }
        : { kind: "segment", guard: guardKey(request.from.guardId), post: request.from.post, start };
    const outcome = reassign(before, source, toKey, scenario.rules.minRestHours);
    if (!outcome.ok) throw new RosterProblem(422, "cannot-reassign", withGuardNames(outcome.message, names));

    const demand = buildDemand(scenario);
    const context = ruleContext(scenario, demand);
    const known = new Set(checkRoster(scenario, before, context).map((v) => `${v.rule}|${v.message}`));
    const after = checkRoster(scenario, outcome.roster, context);
    const broken = after.filter((v) => !known.has(`${v.rule}|${v.message}`));
    if (broken.length > 0) {
      const violations = storedViolations(broken, names);
      // Name every rule the edit would break (a person fixes them together), the first three in full.
      const named = violations.slice(0, 3).map((v) => `${v.message} (rule ${v.rule})`);
      const more = violations.length > 3 ? `; and ${violations.length - 3} more` : "";
      throw new RosterProblem(422, "breaks-rule", `Not changed: ${named.join("; ")}${more}.`, { violations });
    }

    const stored = storedRoster(outcome.roster);
    await trx.deleteFrom("shifts").where("roster_id", "=", roster.id).execute();
    await insertShifts(trx, roster.id, stored.shifts);
    const updated = await trx
      .updateTable("rosters")
      .set({
        revision: sql<number>`revision + 1`,
        unfilled: toJson(stored.unfilled),
        totals: toJson(storedTotals(computeTotals(scenario, demand, outcome.roster))),
        violations: toJson(storedViolations(after, names)),
      })
      .where("id", "=", roster.id)
      .returning("revision")
      .executeTakeFirstOrThrow();
    return { revision: updated.revision };
  });
}
