import "server-only";
import { db } from "@/db";
import { publishedShiftsOfGuard } from "@/db/queries/rosters";
import type { ShiftBreak, ShiftSegment } from "@/db/schema";

export interface GuardShift {
  id: number;
  starts_at: Date;
  ends_at: Date;
  segments: ShiftSegment[];
  breaks: ShiftBreak[];
  roster_version: number;
}

function publishedShiftsOf(guardId: number) {
  return publishedShiftsOfGuard(db, guardId).select([
    "shifts.id",
    "shifts.starts_at",
    "shifts.ends_at",
    "shifts.segments",
    "shifts.breaks",
    "roster.version as roster_version",
  ]);
}

/** A guard's shifts in the current version of each week, ending after `from`, earliest first. */
export async function shiftsOfGuard(guardId: number, from: Date, limit = 200): Promise<GuardShift[]> {
  return publishedShiftsOf(guardId).where("shifts.ends_at", ">", from).orderBy("shifts.starts_at").limit(limit).execute();
}

/** The guard's next (or current) shift in the current version of its week, or null. */
export async function nextShiftOfGuard(guardId: number, now: Date = new Date()): Promise<GuardShift | null> {
  return (await publishedShiftsOf(guardId).where("shifts.ends_at", ">", now).orderBy("shifts.starts_at").limit(1).executeTakeFirst()) ?? null;
}
