// A guard's own published shifts in a period: what GET /api/me/shifts answers.
import type { Kysely, Transaction } from "kysely";
import type { Database } from "../schema";
import { GUARD_SHIFT_COLUMNS, publishedShiftsOfGuard } from "./rosters";

type Handle = Kysely<Database> | Transaction<Database>;

/**
 * The guard's shifts in the latest published version of each week that overlap [from, to),
 * earliest first, with the scenario of their roster (for post names). Drafts never show.
 */
export async function publishedShiftsOfGuardBetween(handle: Handle, guardId: number, from: Date, to: Date) {
  return publishedShiftsOfGuard(handle, guardId)
    .select([
      ...GUARD_SHIFT_COLUMNS,
      "roster.scenario",
    ])
    .where("shifts.ends_at", ">", from)
    .where("shifts.starts_at", "<", to)
    .orderBy("shifts.starts_at")
    .execute();
}
