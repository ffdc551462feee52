import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { enqueueJob } from "@/db/queries/jobs";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { ROSTER_BUILD_JOB } from "@/lib/rosters/publish";
import { buildRequestSchema } from "@/lib/rosters/schemas";
import { sql } from "kysely";
import { rosterSite } from "../_shared/site";
import { recordAudit } from "@/lib/audit/record";

/**
 * POST /api/rosters/build { startsOn }: queues a roster-build job for the week (202); while one for
 * the same week is still queued or running, answers that one instead of queueing a second.
 */
export const POST = route(async (request: NextRequest) => {
  const user = await requireRole(request, "rosters:publish");
  const { startsOn } = await parseBody(request, buildRequestSchema);
  const site = await rosterSite();
  const payload = { siteId: site.id, startsOn, userId: user.id };
  const job = await db.transaction().execute(async (trx) => {
    // One build per week at a time: the lock makes the look-then-queue atomic.
    await sql`select pg_advisory_xact_lock(hashtext('sightward roster build'), ${site.id})`.execute(trx);
    const pending = await trx
      .selectFrom("jobs")
      .selectAll()
      .where("kind", "=", ROSTER_BUILD_JOB)
      .where("status", "in", ["queued", "running"])
      .where(sql<boolean>`payload @> ${JSON.stringify({ siteId: site.id, startsOn })}::jsonb`)
      .orderBy("id", "desc")
      .executeTakeFirst();
    if (pending) return pending;
    const queued = await enqueueJob(trx, { kind: ROSTER_BUILD_JOB, payload, createdBy: user.id });
    await recordAudit(trx, user, { action: "roster.build", subject: { type: "roster-week", label: "roster week" }, siteId: site.id, summary: "asked for a new roster of a week (see the week in the changes)", changes: { startsOn, jobId: queued.id } });
    return queued;
  });
  return NextResponse.json({ job: { id: job.id, status: job.status, progress: job.progress, message: job.message } }, { status: 202 });
});
