// What the week builder needs besides the roster view: the scenario the draft was built from (so
// the browser runs the engine's rule checks itself) and the changes kept against a rule.
import type { Kysely } from "kysely";
import type { Database, RosterViolation } from "@/db/schema";
import { currentOverridesOfRoster } from "@/db/queries/roster-overrides";
import type { Scenario } from "@/lib/scheduling/scenario";
import { rosterScenario } from "./edit";
import { RosterProblem } from "./problem";

export interface RosterOverrideView {
  id: number;
  revision: number;
  guardId: number | null;
  post: string;
  start: string;
  end: string;
  rules: string[];
  violations: RosterViolation[];
  note: string;
  by: string;
  at: string;
}

export interface BuilderData {
  rosterId: number;
  revision: number;
  scenario: Scenario;
  overrides: RosterOverrideView[];
}

export async function builderData(db: Kysely<Database>, rosterId: number): Promise<BuilderData> {
  const roster = await db.selectFrom("rosters").select(["id", "revision", "scenario"]).where("id", "=", rosterId).executeTakeFirst();
  if (!roster) throw new RosterProblem(404, "not-found", `No roster with id ${rosterId}.`);
  const overrides = await currentOverridesOfRoster(db, rosterId);
  return {
    rosterId: roster.id,
    revision: roster.revision,
    // The checks need no e-mail addresses; they stay on the server.
    scenario: (({ guards, ...rest }) => ({ ...rest, guards: guards.map(({ email: _email, ...g }) => g) }))(rosterScenario(roster)),
    overrides: overrides.map((o) => ({
      id: o.id,
      revision: o.revision,
      guardId: o.guard_id,
      post: o.post,
      start: o.starts_at.toISOString(),
      end: o.ends_at.toISOString(),
      rules: o.rules,
      violations: o.violations,
      note: o.note,
      by: o.created_by_name,
      at: o.created_at.toISOString(),
    })),
  };
}
