import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { publishDraft } from "@/lib/rosters/publish";
import { publishRequestSchema, rosterIdSchema } from "@/lib/rosters/schemas";
import { refusalsAsProblems } from "../../_shared/problem";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ id: string }> };

/**
 * POST /api/rosters/[id]/publish { revision, confirmation?, note? }: the draft becomes the week's
 * next published version and every guard on it is mailed (a queued job). 409 when the draft changed
 * since it was loaded; 422 confirmation-needed (with the review) when a room stands empty in an open
 * hour and the room's name was not typed or no note given.
 */
export const POST = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "rosters:publish");
  const { id } = parseParams(await context.params, rosterIdSchema);
  const { revision, confirmation, note } = await parseBody(request, publishRequestSchema);
  const publication = await refusalsAsProblems(() => publishDraft(db, { rosterId: id, revision, userId: user.id, confirmation, note }));
  await recordAudit(db, user, {
    action: "roster.publish",
    subject: { type: "roster", id: publication.roster.id, label: `version ${publication.roster.version}` },
    siteId: publication.roster.site_id,
    summary: `published version ${publication.roster.version} of the roster${publication.supersedes ? `, replacing roster ${publication.supersedes}` : ""}${note ? ` with the note: ${note}` : ""}`,
    changes: { draftId: id, version: publication.roster.version, supersedes: publication.supersedes, ...(confirmation ? { confirmation } : {}), ...(note ? { note } : {}) },
  });
  return NextResponse.json(
    {
      roster: { id: publication.roster.id, version: publication.roster.version, publishedAt: publication.roster.published_at },
      supersedes: publication.supersedes,
      mailJob: { id: publication.mailJobId },
    },
    { status: 201 },
  );
});
