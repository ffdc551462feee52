import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { reviewOfRoster } from "@/lib/rosters/review";
import { rosterIdSchema } from "@/lib/rosters/schemas";
import { refusalsAsProblems } from "../../_shared/problem";

type Context = { params: Promise<{ id: string }> };

export const dynamic = "force-dynamic";

/**
 * GET /api/rosters/[id]/review: what publishing this roster would put in guards' hands, as the
 * manager must see it first: unfilled post-hours by room and risk, rooms empty by hour, guards over
 * contract, and whether publishing needs a typed confirmation and a note.
 */
export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "rosters:publish");
  const { id } = parseParams(await context.params, rosterIdSchema);
  const review = await refusalsAsProblems(() => reviewOfRoster(db, id));
  return NextResponse.json({ review });
});
