// PUT: the order of a floor's rooms on the galleries page (every room id of the floor, once).
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { floorById, orderedIds, writeOrder } from "@/db/queries/galleries";
import { floorIdParams, orderSchema } from "@/lib/api/galleries";
import { checkSameIds } from "@/lib/galleries/order";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ floorId: string }> };

export const PUT = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "rooms:edit");
  const { floorId } = parseParams(await context.params, floorIdParams);
  const { ids } = await parseBody(request, orderSchema);
  await db.transaction().execute(async (trx) => {
    const floor = await floorById(trx, floorId);
    if (!floor) throw new ApiProblem(404, "not-found", `There is no floor ${floorId}; reload the page.`);
    const before = await orderedIds(trx, { table: "rooms", floorId });
    checkSameIds("rooms", before, ids);
    await writeOrder(trx, "rooms", ids);
    await recordAudit(trx, user, { action: "room.reorder", subject: { type: "floor", id: floorId, label: floor.name }, siteId: floor.site_id, summary: `changed the order of the rooms on ${floor.name}`, changes: { order: { from: before, to: ids } } });
  });
  return NextResponse.json({ ids });
});
