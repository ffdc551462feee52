import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { guardByUserId } from "@/db/queries/rosters";
import { ApiProblem } from "@/lib/api/problem";
import { parseQuery } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { myShifts, myShiftsQuerySchema } from "@/lib/rosters/my-shifts";

/**
 * GET /api/me/shifts?from=YYYY-MM-DD&to=YYYY-MM-DD: the signed-in guard's own shifts from the
 * latest published rosters, dates inclusive in the site's time zone, at most 93 days. The guard
 * comes from the session only; nobody can name another guard here.
 */
export const GET = route(async (request: NextRequest) => {
  const user = await requireRole(request, "shifts:own");
  const query = parseQuery(request.url, myShiftsQuerySchema);
  const guard = await guardByUserId(db, user.id);
  if (!guard) throw new ApiProblem(409, "no-guard-record", "Your account is not linked to a guard record; ask operations to link it.");
  const answer = await myShifts(db, guard, query);
  return NextResponse.json({ guard: { id: guard.id, name: guard.name }, ...answer });
});
