import { NextResponse, type NextRequest } from "next/server";
import { ROOM_BODY_LIMIT, readJsonBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { previewPostPlan } from "@/lib/guarding/fewest-preview";

/**
 * POST /api/post-plans/preview: a GeoJSON room with optional { sightRange, pinned, forbidden,
 * doubleCover, timeLimit } in, the `posts` command's room JSON out; nothing is stored.
 * 401 signed out, 403 for roles that do not see galleries (guards), 422 for a bad room.
 */
export const POST = route(async (request: NextRequest) => {
  await requireRole(request, "galleries:view");
  const body = await readJsonBody(request, { limit: ROOM_BODY_LIMIT });
  const answer = previewPostPlan(body);
  return NextResponse.json(answer.body, { status: answer.status });
});
