// GET: one room with its site, exhibitions and plans, for the room page. PUT: new walls from the
// curator, validated by lib/geometry and saved only over the version the curator edited (kept in
// the room's history as the saver's). PATCH: rename or move to another floor of the site.
// DELETE: refused (409) while the room is in an exhibition or has an approved plan, unless
// ?confirm=yes.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { roomDetail, saveRoomWalls } from "@/db/queries/rooms";
import { postPlansForRoom } from "@/db/queries/post-plans";
import { ApiProblem } from "@/lib/api/problem";
import { ROOM_BODY_LIMIT, parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { normaliseRoom, validateRoom } from "@/lib/geometry/room";
import { roomIdParams, roomWallsSchema } from "@/lib/api/plan-input";
import { deleteRoom, floorById, roomBasics, roomNameTaken, roomsInUse, updateRoomPlace } from "@/db/queries/galleries";
import { deleteQuerySchema, roomPlaceSchema } from "@/lib/api/galleries";
import { inUseProblem } from "@/lib/galleries/in-use";
import { parseQuery } from "@/lib/api/parse";
import { changedFields, recordAudit } from "@/lib/audit/record";

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
  const user = await requireRole(request, "rooms:edit");
  const { roomId } = parseParams(await context.params, roomIdParams);
  const body = await parseBody(request, roomWallsSchema, { limit: ROOM_BODY_LIMIT });
  const problems = validateRoom({ outline: body.outline, obstacles: body.obstacles });
  if (problems.length > 0) {
    throw new ApiProblem(422, "invalid-room", `The room cannot be saved: ${problems[0].message}.`, { problems });
  }
  const walls = normaliseRoom({ outline: body.outline, obstacles: body.obstacles });
  const saved = await saveRoomWalls(roomId, { name: body.name, ...walls }, body.version, db, user.id);
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
  await recordAudit(db, user, {
    action: "room.save-walls",
    subject: { type: "room", id: roomId, label: room?.name },
    siteId: room?.site.id,
    summary: `saved the walls of ${room?.name ?? `room ${roomId}`} (version ${saved.version})`,
    changes: { version: { from: body.version, to: saved.version }, corners: walls.outline.length, obstacles: walls.obstacles.length, ...(body.name ? { name: body.name } : {}) },
  });
  return NextResponse.json({ room });
});

export const PATCH = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "rooms:edit");
  const { roomId } = parseParams(await context.params, roomIdParams);
  const change = await parseBody(request, roomPlaceSchema);
  const room = await db.transaction().execute(async (trx) => {
    const current = await roomBasics(trx, roomId);
    if (!current) throw new ApiProblem(404, "not-found", `There is no room ${roomId}.`);
    const floorId = change.floorId ?? current.floor_id;
    if (change.floorId !== undefined && change.floorId !== current.floor_id) {
      const floor = await floorById(trx, change.floorId);
      if (!floor || floor.site_id !== current.site_id) {
        throw new ApiProblem(422, "invalid-input", `Floor ${change.floorId} is not a floor of this room's site; pick one of the site's floors.`, { field: "floorId" });
      }
    }
    const name = change.name ?? current.name;
    if (await roomNameTaken(trx, floorId, name, roomId)) {
      throw new ApiProblem(409, "name-taken", `That floor already has a room called ${name}; choose another name.`, { field: "name" });
    }
    await recordAudit(trx, user, { action: "room.update", subject: { type: "room", id: roomId, label: name }, siteId: current.site_id, summary: `changed the room ${current.name}`, changes: changedFields({ name: current.name, floorId: current.floor_id }, { name: change.name, floorId: change.floorId }) });
    return updateRoomPlace(trx, roomId, {
      ...(change.name !== undefined ? { name: change.name } : {}),
      ...(change.floorId !== undefined && change.floorId !== current.floor_id ? { floor_id: change.floorId } : {}),
    });
  });
  return NextResponse.json({ room });
});

export const DELETE = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "rooms:edit");
  const { roomId } = parseParams(await context.params, roomIdParams);
  const { confirm } = parseQuery(request.url, deleteQuerySchema);
  await db.transaction().execute(async (trx) => {
    const room = await roomBasics(trx, roomId);
    if (!room) throw new ApiProblem(404, "not-found", `There is no room ${roomId}.`);
    const inUse = await roomsInUse(trx, [roomId]);
    if (inUse.length > 0 && confirm !== "yes") throw inUseProblem("this room", inUse);
    await deleteRoom(trx, roomId);
    await recordAudit(trx, user, { action: "room.delete", subject: { type: "room", id: roomId, label: room.name }, siteId: room.site_id, summary: `deleted the room ${room.name}${inUse.length > 0 ? " while in use, confirmed" : ""}` });
  });
  return NextResponse.json({ deleted: roomId });
});
