import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { guardByUserId, resetCalendarToken } from "@/db/queries/rosters";
import { ApiProblem } from "@/lib/api/problem";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit/record";

/** POST /api/calendar/reset: the signed-in guard gets a new feed address; the old one stops working. */
export const POST = route(async (request: NextRequest) => {
  const user = await requireRole(request, "shifts:own");
  const guard = await guardByUserId(db, user.id);
  if (!guard) throw new ApiProblem(409, "no-guard-record", "Your account is not linked to a guard record; ask operations to link it.");
  const token = await resetCalendarToken(db, guard.id);
  // The new address itself is a secret: the trail says only that it changed.
  await recordAudit(db, user, { action: "calendar.reset", subject: { type: "guard", id: guard.id, label: guard.name }, siteId: guard.site_id, summary: "reset their personal calendar address" });
  return NextResponse.json({ path: `/api/calendar/${token}` });
});
