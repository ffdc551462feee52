import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { decideTimeOff } from "@/db/queries/rosters";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { rosterIdSchema, timeOffDecisionSchema } from "@/lib/rosters/schemas";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ id: string }> };

/**
 * PATCH /api/time-off/[id] { status: approved | declined }: operations decides an open request.
 * Approved time off is unavailability in the next roster build. 409 when it was already decided.
 */
export const PATCH = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "time-off:decide");
  const { id } = parseParams(await context.params, rosterIdSchema);
  const { status } = await parseBody(request, timeOffDecisionSchema);
  const decided = await decideTimeOff(db, id, status, user.id);
  if (!decided) {
    const exists = await db.selectFrom("time_off").select(["status"]).where("id", "=", id).executeTakeFirst();
    if (!exists) throw new ApiProblem(404, "not-found", `No time-off request with id ${id}.`);
    throw new ApiProblem(409, "already-decided", `This request was already ${exists.status}; it cannot be decided again.`);
  }
  await recordAudit(db, user, { action: "time-off.decide", subject: { type: "time-off", id }, summary: `${status} time-off request ${id}`, changes: { status } });
  return NextResponse.json({ request: decided });
});
