import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit/record";
import { builderData } from "@/lib/rosters/builder";
import { adjustInDraft } from "@/lib/rosters/edit";
import { adjustRequestSchema, rosterIdSchema } from "@/lib/rosters/schemas";
import { rosterView } from "@/lib/rosters/view";
import { refusalsAsProblems } from "@/app/api/rosters/_shared/problem";

type Context = { params: Promise<{ id: string }> };

export const dynamic = "force-dynamic";

/** GET /api/rosters/[id]/adjust: the draft's scenario (the browser checks changes by the same rules) and its kept overrides. */
export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "rosters:publish");
  const { id } = parseParams(await context.params, rosterIdSchema);
  return NextResponse.json({ builder: await refusalsAsProblems(() => builderData(db, id)) });
});

/**
 * POST /api/rosters/[id]/adjust { revision, from: { guardId, post, start }, start, end, toGuardId?,
 * overrideNote? }: moves one segment in time and/or to another guard. 422 naming the rule when the
 * change breaks one (kept instead when overrideNote says why), 409 when the draft changed or is
 * published; nothing is written then.
 */
export const POST = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "rosters:publish");
  const { id } = parseParams(await context.params, rosterIdSchema);
  const body = await parseBody(request, adjustRequestSchema);
  const toGuardId = body.toGuardId ?? body.from.guardId;
  const note = body.overrideNote ? body.overrideNote : undefined;
  const result = await refusalsAsProblems(() =>
    adjustInDraft(db, { rosterId: id, revision: body.revision, from: body.from, start: body.start, end: body.end, toGuardId, overrideNote: note, user: { id: user.id, name: user.name } }),
  );
  const rules = [...new Set(result.overridden.map((v) => v.rule))];
  await recordAudit(db, user, {
    action: "roster.adjust",
    subject: { type: "roster", id },
    summary: `moved a shift segment of draft roster ${id}${toGuardId !== body.from.guardId ? ` to guard ${toGuardId}` : ""}${rules.length ? `, kept against rule ${rules.join(", ")}` : ""}`,
    changes: { revision: body.revision, from: body.from, start: body.start, end: body.end, toGuardId, ...(rules.length ? { overriddenRules: rules, overrideNote: note } : {}) },
  });
  return NextResponse.json({ roster: await rosterView(db, id), revision: result.revision, overridden: result.overridden });
});
