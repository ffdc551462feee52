// A published version of a week with real posts, breaks and the scenario naming the posts' rooms,
// stored the way publishDraft stores one (roster and shifts in one transaction: the shifts trigger
// accepts shifts of a published roster only from the publishing transaction).
import { sql, type Kysely } from "kysely";
import type { Database, ShiftBreak, ShiftSegment } from "@/db/schema";

export interface PublishedShift {
  guardId: number;
  starts_at: Date;
  ends_at: Date;
  segments: ShiftSegment[];
  breaks: ShiftBreak[];
}

/** Posts of room `roomId` follow the post plan convention "R<room>-P<n>". */
export const postOf = (roomId: number, n = 1) => `R${roomId}-P${n}`;

export async function publishWeek(
  db: Kysely<Database>,
  roster: { siteId: number; startsOn: string; version: number; supersedes?: number | null; posts: { id: string; room: string }[] },
  shifts: PublishedShift[],
): Promise<number> {
  return db.transaction().execute(async (trx) => {
    const { id } = await trx
      .insertInto("rosters")
      .values({
        site_id: roster.siteId,
        starts_on: roster.startsOn,
        days: 7,
        status: "published",
        version: roster.version,
        published_at: sql<Date>`now()`,
        supersedes: roster.supersedes ?? null,
        scenario: JSON.stringify({ posts: roster.posts.map((post) => ({ ...post, skills: [], risk: "standard" })) }),
        unfilled: "[]",
        violations: "[]",
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    if (shifts.length > 0) {
      await trx
        .insertInto("shifts")
        .values(
          shifts.map((shift) => ({
            roster_id: id,
            guard_id: shift.guardId,
            starts_at: shift.starts_at,
            ends_at: shift.ends_at,
            segments: JSON.stringify(shift.segments),
            breaks: JSON.stringify(shift.breaks),
          })),
        )
        .execute();
    }
    return id;
  });
}
