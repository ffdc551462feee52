// A guard's own posts, from their current and coming published shifts: post ids ("R12-P2", room
// 12's second post) and the rooms they are in, for the floor maps a guard may open.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { currentShiftsOfGuard } from "@/db/queries/rosters";
import { floorsOfRooms } from "@/db/queries/galleries";

export async function ownPostsAndFloors(db: Kysely<Database>, guardId: number, from: Date = new Date()) {
  const shifts = await currentShiftsOfGuard(db, guardId, from);
  const posts = [...new Set(shifts.flatMap((s) => s.segments.map((segment) => segment.post)))];
  const roomIds = [...new Set(posts.map((post) => /^R(\d+)-P\d+$/.exec(post)?.[1]).filter((id): id is string => id !== undefined).map(Number))];
  return { posts, floors: await floorsOfRooms(db, roomIds) };
}
