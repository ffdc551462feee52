// PUT: the order of a site's floors on the galleries page (every floor id of the site, once).
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { orderedIds, siteExists, writeOrder } from "@/db/queries/galleries";
import { orderSchema, siteIdParams } from "@/lib/api/galleries";
import { checkSameIds } from "@/lib/galleries/order";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ siteId: string }> };

export const PUT = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "rooms:edit");
  const { siteId } = parseParams(await context.params, siteIdParams);
  const { ids } = await parseBody(request, orderSchema);
  await db.transaction().execute(async (trx) => {
    if (!(await siteExists(trx, siteId))) throw new ApiProblem(404, "not-found", `There is no site ${siteId}; reload the page.`);
    const before = await orderedIds(trx, { table: "floors", siteId });
    checkSameIds("floors", before, ids);
    await writeOrder(trx, "floors", ids);
    await recordAudit(trx, user, { action: "floor.reorder", subject: { type: "site", id: siteId }, siteId, summary: "changed the order of the floors", changes: { order: { from: before, to: ids } } });
  });
  return NextResponse.json({ ids });
});
