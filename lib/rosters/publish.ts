// Publishing: the draft as it is becomes a new published version of its week (1, 2, ...), which
// supersedes the one before; the earlier version stays exactly as it was. The e-mail to every guard
// on it is queued in the same transaction, so a publication never goes out without its mail job.
import type { Kysely } from "kysely";
import { sql } from "kysely";
import type { Database, Roster as RosterRow } from "@/db/schema";
import { enqueueJob } from "@/db/queries/jobs";
import { publishedVersionOfRevision, publishedVersionOfRevisionOfRoster, publishedVersionsOfWeek } from "@/db/queries/rosters";
import { lockDraft } from "./edit";
import { requireConfirmation, reviewOf } from "./review";
import { guardsOfSite, shiftsOfRoster } from "@/db/queries/rosters";
import { RosterProblem } from "./problem";

export const ROSTER_BUILD_JOB = "roster-build";
export const ROSTER_MAIL_JOB = "roster-publish-mail";

export interface PublishRequest {
  rosterId: number;
  /** The draft's revision the person was looking at: publishing anything else is a 409. */
  revision: number;
  userId: number | null;
  /** What the manager typed and wrote when the review asked for it (a room left empty). */
  confirmation?: string;
  note?: string;
}

export interface Publication {
  roster: RosterRow;
  supersedes: { id: number; version: number } | null;
  mailJobId: number;
}

export async function publishDraft(db: Kysely<Database>, request: PublishRequest): Promise<Publication> {
  try {
    return await db.transaction().execute(async (trx) => {
      const draft = await lockDraft(trx, request.rosterId, request.revision);
      // A second Publish of the same revision waited for the first one's lock; it now sees the version.
      const already = await publishedVersionOfRevision(trx, draft.site_id, draft.starts_on, draft.revision);
      if (already) throw alreadyPublished(draft.revision, already.version, already.id);
      if (draft.violations.length > 0) {
        throw new RosterProblem(409, "breaks-rules", `The draft breaks ${draft.violations.length} rule(s), first: ${draft.violations[0]!.message}. Fix or rebuild it before publishing.`);
      }
      // The review the manager saw, computed again from the locked draft: a room left empty needs
      // the typed confirmation and a note, both kept with the version.
      const [draftShifts, guards] = await Promise.all([shiftsOfRoster(trx, draft.id), guardsOfSite(trx, draft.site_id)]);
      const review = reviewOf(draft, draftShifts, new Map(guards.map((g) => [g.id, g.name])));
      requireConfirmation(review, request.confirmation, request.note);
      const [previous] = await publishedVersionsOfWeek(trx, draft.site_id, draft.starts_on);
      const published = await trx
        .insertInto("rosters")
        .values({
          site_id: draft.site_id,
          starts_on: draft.starts_on,
          days: draft.days,
          status: "published",
          version: (previous?.version ?? 0) + 1,
          // now() is the transaction's time: the shifts trigger lets only this transaction add shifts.
          published_at: sql<Date>`now()`,
          supersedes: previous?.id ?? null,
          revision: draft.revision,
          draft_revision: draft.revision,
          scenario: JSON.stringify(draft.scenario),
          unfilled: JSON.stringify(draft.unfilled),
          totals: draft.totals === null ? null : JSON.stringify(draft.totals),
          violations: JSON.stringify(draft.violations),
          created_by: draft.created_by,
          published_by: request.userId,
          publish_review: JSON.stringify(review),
          publish_confirmation: review.needsConfirmation ? request.confirmation!.trim() : null,
          publish_note: request.note?.trim() ? request.note.trim() : null,
        })
        .returningAll()
        .executeTakeFirstOrThrow();
      await trx
        .insertInto("shifts")
        .columns(["roster_id", "guard_id", "starts_at", "ends_at", "segments", "breaks"])
        .expression((eb) =>
          eb
            .selectFrom("shifts")
            .select([sql.lit(published.id).as("roster_id"), "guard_id", "starts_at", "ends_at", "segments", "breaks"])
            .where("roster_id", "=", draft.id),
        )
        .execute();
      const job = await enqueueJob(trx, { kind: ROSTER_MAIL_JOB, payload: { rosterId: published.id }, createdBy: request.userId });
      return {
        roster: published,
        supersedes: previous ? { id: previous.id, version: previous.version } : null,
        mailJobId: job.id,
      };
    });
  } catch (error) {
    const { code, constraint } = error as { code?: string; constraint?: string };
    // The unique index on the draft revision lets each revision become a version once.
    if (code === "23505" && constraint === "rosters_published_once") {
      const published = await publishedVersionOfRevisionOfRoster(db, request.rosterId, request.revision);
      throw alreadyPublished(request.revision, published?.version ?? null, published?.id ?? null);
    }
    // Two publications of the same week at once: the unique version index lets only one through.
    if (code === "23505") {
      throw new RosterProblem(409, "published-meanwhile", "Someone published this week at the same moment; reload to see the new version.");
    }
    throw error;
  }
}

function alreadyPublished(revision: number, version: number | null, rosterId: number | null): RosterProblem {
  return new RosterProblem(
    409,
    "already-published",
    `Revision ${revision} of this draft is already published${version ? ` as version ${version}` : ""}; nobody was mailed twice. Change the draft (reassign or rebuild) to publish a new version.`,
    { version, rosterId },
  );
}
