import { NextResponse, type NextRequest } from "next/server";
import { ROOM_BODY_LIMIT, readJsonBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { previewInPool, readPreviewRequest } from "@/lib/guarding/fewest-preview";

export const dynamic = "force-dynamic";

/**
 * POST /api/post-plans/preview: a GeoJSON room with optional { sightRange, pinned, forbidden,
 * doubleCover, timeLimit } in, the `posts` command's room JSON out; nothing is stored. The request
 * thread only reads the body; the planning runs in the server's planning pool, and a closed tab
 * (an aborted request) ends its job. 401 signed out, 403 for roles that do not see galleries
 * (guards), 422 for a bad room, 503 with Retry-After when every planner is busy.
 */
export const POST = route(async (request: NextRequest) => {
  await requireRole(request, "galleries:view");
  const body = await readJsonBody(request, { limit: ROOM_BODY_LIMIT });
  const read = readPreviewRequest(body);
  const answer = read.ok ? await previewInPool(read.named, read.options, request.signal) : read.answer;
  return NextResponse.json(answer.body, { status: answer.status });
});
