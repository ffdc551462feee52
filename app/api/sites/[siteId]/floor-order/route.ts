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

type Context = { params: Promise<{ siteId: string }> };

export const PUT = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "rooms:edit");
  const { siteId } = parseParams(await context.params, siteIdParams);
  const { ids } = await parseBody(request, orderSchema);
  await db.transaction().execute(async (trx) => {
    if (!(await siteExists(trx, siteId))) throw new ApiProblem(404, "not-found", `There is no site ${siteId}; reload the page.`);
    checkSameIds("floors", await orderedIds(trx, { table: "floors", siteId }), ids);
    await writeOrder(trx, "floors", ids);
  });
  return NextResponse.json({ ids });
});
