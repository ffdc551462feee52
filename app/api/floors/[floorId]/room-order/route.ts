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

type Context = { params: Promise<{ floorId: string }> };

export const PUT = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "rooms:edit");
  const { floorId } = parseParams(await context.params, floorIdParams);
  const { ids } = await parseBody(request, orderSchema);
  await db.transaction().execute(async (trx) => {
    if (!(await floorById(trx, floorId))) throw new ApiProblem(404, "not-found", `There is no floor ${floorId}; reload the page.`);
    checkSameIds("rooms", await orderedIds(trx, { table: "rooms", floorId }), ids);
    await writeOrder(trx, "rooms", ids);
  });
  return NextResponse.json({ ids });
});
