// PATCH: rename a floor or change its level. DELETE: remove it with its rooms; refused (409,
// naming the rooms) while a room is in an exhibition or has an approved plan, unless ?confirm=yes.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { deleteFloor, floorById, floorNameTaken, roomIdsOfFloor, roomsInUse, updateFloor } from "@/db/queries/galleries";
import { deleteQuerySchema, floorIdParams, floorUpdateSchema } from "@/lib/api/galleries";
import { inUseProblem } from "@/lib/galleries/in-use";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams, parseQuery } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { changedFields, recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ floorId: string }> };

const missing = (id: number) => new ApiProblem(404, "not-found", `There is no floor ${id}; reload the page.`);

export const PATCH = route<Context>(async (request, context) => {
  const user = await requireRole(request, "rooms:edit");
  const { floorId } = parseParams(await context.params, floorIdParams);
  const change = await parseBody(request, floorUpdateSchema);
  const floor = await db.transaction().execute(async (trx) => {
    const current = await floorById(trx, floorId);
    if (!current) throw missing(floorId);
    if (change.name !== undefined && (await floorNameTaken(trx, current.site_id, change.name, floorId))) {
      throw new ApiProblem(409, "name-taken", `The site already has a floor called ${change.name}; choose another name.`, { field: "name" });
    }
    const updated = await updateFloor(trx, floorId, change);
    await recordAudit(trx, user, { action: "floor.update", subject: { type: "floor", id: floorId, label: change.name ?? current.name }, siteId: current.site_id, summary: `changed the floor ${current.name}`, changes: changedFields({ name: current.name, level: current.level }, change) });
    return updated;
  });
  return NextResponse.json({ floor });
});

export const DELETE = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "rooms:edit");
  const { floorId } = parseParams(await context.params, floorIdParams);
  const { confirm } = parseQuery(request.url, deleteQuerySchema);
  await db.transaction().execute(async (trx) => {
    const floor = await floorById(trx, floorId);
    if (!floor) throw missing(floorId);
    const inUse = await roomsInUse(trx, await roomIdsOfFloor(trx, floorId));
    if (inUse.length > 0 && confirm !== "yes") throw inUseProblem(`the floor ${floor.name}`, inUse);
    await deleteFloor(trx, floorId);
    await recordAudit(trx, user, { action: "floor.delete", subject: { type: "floor", id: floorId, label: floor.name }, siteId: floor.site_id, summary: `deleted the floor ${floor.name}${inUse.length > 0 ? ` with ${inUse.length} room(s) in use, confirmed` : ""}` });
  });
  return NextResponse.json({ deleted: floorId });
});
