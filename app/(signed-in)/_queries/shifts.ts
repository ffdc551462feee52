import "server-only";
import { db } from "@/db";
import { latestPublishedRosters } from "@/db/queries/rosters";
import type { ShiftBreak, ShiftSegment } from "@/db/schema";

export interface GuardShift {
  id: number;
  starts_at: Date;
  ends_at: Date;
  segments: ShiftSegment[];
  breaks: ShiftBreak[];
  roster_version: number;
}

/** The guard record linked to a user account, if any. */
export async function guardForUser(userId: number) {
  return (
    (await db
      .selectFrom("guards")
      .select(["id", "name", "site_id", "contract_hours", "skills"])
      .where("user_id", "=", userId)
      .executeTakeFirst()) ?? null
  );
}

// A guard sees published rosters only (a draft may still change under them), and of each week only
// the latest published version, the one My shifts and the calendar feed show too.
function publishedShiftsOf(guardId: number) {
  return db
    .selectFrom("shifts")
    .innerJoin(latestPublishedRosters(db).as("roster"), "roster.id", "shifts.roster_id")
    .select([
      "shifts.id",
      "shifts.starts_at",
      "shifts.ends_at",
      "shifts.segments",
      "shifts.breaks",
      "roster.version as roster_version",
    ])
    .where("shifts.guard_id", "=", guardId);
}

/** A guard's shifts in the current version of each week, ending after `from`, earliest first. */
export async function shiftsOfGuard(guardId: number, from: Date, limit = 200): Promise<GuardShift[]> {
  return publishedShiftsOf(guardId).where("shifts.ends_at", ">", from).orderBy("shifts.starts_at").limit(limit).execute();
}

/** The guard's next (or current) shift in the current version of its week, or null. */
export async function nextShiftOfGuard(guardId: number, now: Date = new Date()): Promise<GuardShift | null> {
  return (await publishedShiftsOf(guardId).where("shifts.ends_at", ">", now).orderBy("shifts.starts_at").limit(1).executeTakeFirst()) ?? null;
}
