// GET: one room with its site, exhibitions and plans, for the room page. PUT: new walls from the
// curator, validated by lib/geometry and saved only over the version the curator edited.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { roomDetail, saveRoomWalls } from "@/db/queries/rooms";
import { postPlansForRoom } from "@/db/queries/post-plans";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { normaliseRoom, validateRoom } from "@/lib/geometry/room";
import { roomIdParams, roomWallsSchema } from "@/lib/api/plan-input";

type Context = { params: Promise<{ roomId: string }> };

export const dynamic = "force-dynamic";

export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "galleries:view");
  const { roomId } = parseParams(await context.params, roomIdParams);
  const room = await roomDetail(roomId, db);
  if (!room) throw new ApiProblem(404, "not-found", `There is no room ${roomId}.`);
  const plans = await postPlansForRoom(roomId, undefined, db);
  return NextResponse.json({ room, plans });
});

export const PUT = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "rooms:edit");
  const { roomId } = parseParams(await context.params, roomIdParams);
  const body = await parseBody(request, roomWallsSchema);
  const problems = validateRoom({ outline: body.outline, obstacles: body.obstacles });
  if (problems.length > 0) {
    throw new ApiProblem(422, "invalid-room", `The room cannot be saved: ${problems[0].message}.`, { problems });
  }
  const walls = normaliseRoom({ outline: body.outline, obstacles: body.obstacles });
  const saved = await saveRoomWalls(roomId, { name: body.name, ...walls }, body.version, db);
  if (!saved.ok && saved.reason === "not-found") throw new ApiProblem(404, "not-found", `There is no room ${roomId}.`);
  if (!saved.ok) {
    throw new ApiProblem(
      409,
      "stale-version",
      `Someone else saved this room first: you edited version ${body.version}, it is now at version ${saved.currentVersion}. Nothing was saved; reload the room, then make your change again.`,
      { currentVersion: saved.currentVersion, yourVersion: body.version },
    );
  }
  const room = await roomDetail(roomId, db);
  return NextResponse.json({ room });
});
