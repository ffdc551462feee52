// PUT: the order of the sites on the galleries page (every site id, once, in the new order).
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { orderedIds, writeOrder } from "@/db/queries/galleries";
import { orderSchema } from "@/lib/api/galleries";
import { checkSameIds } from "@/lib/galleries/order";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit/record";

export const PUT = route(async (request: NextRequest) => {
  const user = await requireRole(request, "rooms:edit");
  const { ids } = await parseBody(request, orderSchema);
  await db.transaction().execute(async (trx) => {
    const before = await orderedIds(trx, { table: "sites" });
    checkSameIds("sites", before, ids);
    await writeOrder(trx, "sites", ids);
    await recordAudit(trx, user, { action: "site.reorder", subject: { type: "site", label: "all sites" }, summary: "changed the order of the sites", changes: { order: { from: before, to: ids } } });
  });
  return NextResponse.json({ ids });
});
