// POST: a new floor on a site (curators and admins), placed last; names are unique per site.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { createFloor, floorNameTaken, siteExists } from "@/db/queries/galleries";
import { floorCreateSchema } from "@/lib/api/galleries";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit/record";

export const POST = route(async (request: NextRequest) => {
  const user = await requireRole(request, "rooms:edit");
  const body = await parseBody(request, floorCreateSchema);
  const floor = await db.transaction().execute(async (trx) => {
    if (!(await siteExists(trx, body.siteId))) throw new ApiProblem(422, "invalid-input", `There is no site ${body.siteId}; reload the page.`, { field: "siteId" });
    if (await floorNameTaken(trx, body.siteId, body.name)) {
      throw new ApiProblem(409, "name-taken", `The site already has a floor called ${body.name}; choose another name.`, { field: "name" });
    }
    const created = await createFloor(trx, { site_id: body.siteId, name: body.name, level: body.level });
    await recordAudit(trx, user, { action: "floor.create", subject: { type: "floor", id: created.id, label: body.name }, siteId: body.siteId, summary: `added the floor ${body.name}`, changes: { name: body.name, level: body.level } });
    return created;
  });
  return NextResponse.json({ floor }, { status: 201 });
});
