// PATCH: rename a site. DELETE: remove it with its floors and rooms; refused (409, naming the
// rooms) while any room is in an exhibition or has an approved plan, unless ?confirm=yes.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { deleteSite, renameSite, roomIdsOfSite, roomsInUse, siteExists } from "@/db/queries/galleries";
import { deleteQuerySchema, renameSchema, siteIdParams } from "@/lib/api/galleries";
import { inUseProblem } from "@/lib/galleries/in-use";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams, parseQuery } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ siteId: string }> };

export const PATCH = route<Context>(async (request, context) => {
  const user = await requireRole(request, "rooms:edit");
  const { siteId } = parseParams(await context.params, siteIdParams);
  const { name } = await parseBody(request, renameSchema);
  const site = await renameSite(db, siteId, name);
  if (!site) throw new ApiProblem(404, "not-found", `There is no site ${siteId}; reload the page.`);
  await recordAudit(db, user, { action: "site.rename", subject: { type: "site", id: siteId, label: name }, siteId, summary: `renamed a site to ${name}`, changes: { name: { to: name } } });
  return NextResponse.json({ site });
});

export const DELETE = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "rooms:edit");
  const { siteId } = parseParams(await context.params, siteIdParams);
  const { confirm } = parseQuery(request.url, deleteQuerySchema);
  await db.transaction().execute(async (trx) => {
    if (!(await siteExists(trx, siteId))) throw new ApiProblem(404, "not-found", `There is no site ${siteId}; reload the page.`);
    const inUse = await roomsInUse(trx, await roomIdsOfSite(trx, siteId));
    if (inUse.length > 0 && confirm !== "yes") throw inUseProblem("the site", inUse);
    await deleteSite(trx, siteId);
    await recordAudit(trx, user, { action: "site.delete", subject: { type: "site", id: siteId }, siteId, summary: `deleted site ${siteId}${inUse.length > 0 ? ` with ${inUse.length} room(s) in use, confirmed` : ""}` });
  });
  return NextResponse.json({ deleted: siteId });
});
