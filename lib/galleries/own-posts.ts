// A guard's own posts, from their current and coming published shifts: post ids ("R12-P2", room
// 12's second post) and the floors of their rooms, for the floor maps a guard may open.
import type { Kysely } from "kysely";
import type { Database, ShiftSegment } from "@/db/schema";
import { currentShiftsOfGuard } from "@/db/queries/rosters";
import { floorsOfRooms } from "@/db/queries/galleries";

/** From shifts already read (only those not over by `from` count). */
export async function ownPostsOfShifts(db: Kysely<Database>, shifts: { ends_at: Date; segments: ShiftSegment[] }[], from: Date = new Date()) {
  const posts = [...new Set(shifts.filter((s) => s.ends_at > from).flatMap((s) => s.segments.map((segment) => segment.post)))];
  const roomIds = [...new Set(posts.map((post) => /^R(\d+)-P\d+$/.exec(post)?.[1]).filter((id): id is string => id !== undefined).map(Number))];
  return { posts, floors: await floorsOfRooms(db, roomIds) };
}

export async function ownPostsAndFloors(db: Kysely<Database>, guardId: number, from: Date = new Date()) {
  return ownPostsOfShifts(db, await currentShiftsOfGuard(db, guardId, from), from);
}
