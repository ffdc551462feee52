import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { guardByUserId, insertTimeOff, timeOffOfGuard } from "@/db/queries/rosters";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { timeOffRequestSchema } from "@/lib/rosters/schemas";
import { recordAudit } from "@/lib/audit/record";

async function signedInGuard(request: NextRequest) {
  const user = await requireRole(request, "shifts:own");
  const guard = await guardByUserId(db, user.id);
  if (!guard) throw new ApiProblem(409, "no-guard-record", "Your account is not linked to a guard record; ask operations to link it.");
  return { ...guard, user };
}

/** GET /api/time-off: the signed-in guard's own requests, latest first. */
export const GET = route(async (request: NextRequest) => {
  const guard = await signedInGuard(request);
  return NextResponse.json({ requests: await timeOffOfGuard(db, guard.id) });
});

/** POST /api/time-off { startsOn, endsOn, note }: the signed-in guard asks for days off (201). */
export const POST = route(async (request: NextRequest) => {
  const guard = await signedInGuard(request);
  const body = await parseBody(request, timeOffRequestSchema);
  const created = await insertTimeOff(db, { guardId: guard.id, startsOn: body.startsOn, endsOn: body.endsOn, note: body.note });
  await recordAudit(db, guard.user, { action: "time-off.request", subject: { type: "time-off", id: created.id, label: guard.name }, siteId: guard.site_id, summary: "asked for time off (the days are in the changes)", changes: { startsOn: body.startsOn, endsOn: body.endsOn } });
  return NextResponse.json({ request: created }, { status: 201 });
});
