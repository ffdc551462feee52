import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { parseBody, parseParams, parseQuery } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { reassignInDraft, reassignOptions } from "@/lib/rosters/edit";
import { reassignOptionsQuerySchema, reassignRequestSchema, rosterIdSchema } from "@/lib/rosters/schemas";
import { rosterView } from "@/lib/rosters/view";
import { refusalsAsProblems } from "../../_shared/problem";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ id: string }> };

export const dynamic = "force-dynamic";

/**
 * GET /api/rosters/[id]/reassign?post=&start=[&guardId=]: every guard the stretch (a segment of
 * guardId's, or an unfilled post-slot without guardId) could go to, checked by the rules: those who
 * can take it first with their hours so far, then the others with the rule they would break.
 */
export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "rosters:publish");
  const { id } = parseParams(await context.params, rosterIdSchema);
  const query = parseQuery(request.url, reassignOptionsQuerySchema);
  const options = await refusalsAsProblems(() => reassignOptions(db, id, { guardId: query.guardId ?? null, post: query.post, start: query.start }));
  return NextResponse.json({ options });
});

/**
 * POST /api/rosters/[id]/reassign { revision, from: { guardId, post, start }, toGuardId }: gives one
 * segment (or an unfilled post-slot, guardId null) to another guard. 422 with the rule's message when
 * the change would break a rule, 409 when the draft changed since it was loaded; nothing is written then.
 */
export const POST = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "rosters:publish");
  const { id } = parseParams(await context.params, rosterIdSchema);
  const body = await parseBody(request, reassignRequestSchema);
  await refusalsAsProblems(() => reassignInDraft(db, { rosterId: id, revision: body.revision, from: body.from, toGuardId: body.toGuardId }));
  await recordAudit(db, user, { action: "roster.reassign", subject: { type: "roster", id }, summary: `moved a shift of draft roster ${id} to guard ${body.toGuardId}`, changes: { revision: body.revision, from: body.from, toGuardId: body.toGuardId } });
  return NextResponse.json({ roster: await rosterView(db, id) });
});
