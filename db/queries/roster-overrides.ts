// Changes to a draft kept against labour rules (0110): the note, who and when.
import type { Kysely, Transaction } from "kysely";
import type { Database, RosterViolation } from "../schema";
import { toJson } from "../schema";

type Handle = Kysely<Database> | Transaction<Database>;

export interface NewRosterOverride {
  rosterId: number;
  revision: number;
  guardId: number | null;
  post: string;
  startsAt: Date;
  endsAt: Date;
  violations: RosterViolation[];
  note: string;
  createdBy: { id: number; name: string };
}

export async function insertRosterOverride(handle: Handle, o: NewRosterOverride) {
  return handle
    .insertInto("roster_overrides")
    .values({
      roster_id: o.rosterId,
      revision: o.revision,
      guard_id: o.guardId,
      post: o.post,
      starts_at: o.startsAt,
      ends_at: o.endsAt,
      rules: [...new Set(o.violations.map((v) => v.rule))],
      violations: toJson(o.violations),
      note: o.note,
      created_by: o.createdBy.id,
      created_by_name: o.createdBy.name,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** The overrides made since the draft was last built (a rebuild starts from the rules again). */
export async function currentOverridesOfRoster(handle: Handle, rosterId: number) {
  return handle
    .selectFrom("roster_overrides")
    .innerJoin("rosters", "rosters.id", "roster_overrides.roster_id")
    .selectAll("roster_overrides")
    .where("roster_overrides.roster_id", "=", rosterId)
    .whereRef("roster_overrides.created_at", ">=", "rosters.created_at")
    .orderBy("roster_overrides.created_at")
    .orderBy("roster_overrides.id")
    .execute();
}
