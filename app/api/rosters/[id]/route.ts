import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { rosterIdSchema } from "@/lib/rosters/schemas";
import { rosterView } from "@/lib/rosters/view";

type Context = { params: Promise<{ id: string }> };

/** GET /api/rosters/[id]: one roster in full, draft or published (operations). */
export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "staffing:view");
  const { id } = parseParams(await context.params, rosterIdSchema);
  const roster = await rosterView(db, id);
  if (!roster) throw new ApiProblem(404, "not-found", `No roster with id ${id}.`);
  return NextResponse.json({ roster });
});
