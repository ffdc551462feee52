import { NextResponse, type NextRequest } from "next/server";
import { ApiProblem } from "@/lib/api/problem";
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
  let body: unknown;
  try {
    body = await request.json();
  } catch {
    throw new ApiProblem(400, "invalid-json", "The request body must be JSON: a GeoJSON Feature or Polygon.");
  }
  const answer = previewPostPlan(body);
  return NextResponse.json(answer.body, { status: answer.status });
});
