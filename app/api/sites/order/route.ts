// PUT: the order of the sites on the galleries page (every site id, once, in the new order).
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { orderedIds, writeOrder } from "@/db/queries/galleries";
import { orderSchema } from "@/lib/api/galleries";
import { checkSameIds } from "@/lib/galleries/order";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";

export const PUT = route(async (request: NextRequest) => {
  await requireRole(request, "rooms:edit");
  const { ids } = await parseBody(request, orderSchema);
  await db.transaction().execute(async (trx) => {
    checkSameIds("sites", await orderedIds(trx, { table: "sites" }), ids);
    await writeOrder(trx, "sites", ids);
  });
  return NextResponse.json({ ids });
});
