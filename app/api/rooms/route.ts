// POST: a new room on a floor (curators and admins): walls checked by lib/geometry like every
// save, or a width × depth rectangle to start from; kept as version 1 in the room's history.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { createRoom, floorById, roomNameTaken } from "@/db/queries/galleries";
import { roomCreateSchema } from "@/lib/api/galleries";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { normaliseRoom, validateRoom } from "@/lib/geometry/room";
import type { Ring } from "@/lib/geometry/types";
import { recordAudit } from "@/lib/audit/record";

export const POST = route(async (request: NextRequest) => {
  const user = await requireRole(request, "rooms:edit");
  const body = await parseBody(request, roomCreateSchema);
  const outline: Ring = body.outline ?? [
    [0, 0],
    [body.width!, 0],
    [body.width!, body.depth!],
    [0, body.depth!],
  ];
  const problems = validateRoom({ outline, obstacles: body.obstacles });
  if (problems.length > 0) {
    throw new ApiProblem(422, "invalid-room", `The room cannot be saved: ${problems[0].message}.`, { problems });
  }
  const walls = normaliseRoom({ outline, obstacles: body.obstacles });
  const room = await db.transaction().execute(async (trx) => {
    if (!(await floorById(trx, body.floorId))) throw new ApiProblem(422, "invalid-input", `There is no floor ${body.floorId}; reload the page.`, { field: "floorId" });
    if (await roomNameTaken(trx, body.floorId, body.name)) {
      throw new ApiProblem(409, "name-taken", `The floor already has a room called ${body.name}; choose another name.`, { field: "name" });
    }
    const created = await createRoom(trx, { floor_id: body.floorId, name: body.name, ...walls }, user.id);
    await recordAudit(trx, user, { action: "room.create", subject: { type: "room", id: created.id, label: body.name }, summary: `added the room ${body.name}`, changes: { floorId: body.floorId, corners: walls.outline.length, obstacles: walls.obstacles.length } });
    return created;
  });
  return NextResponse.json({ room }, { status: 201 });
});
