// POST: a new floor on a site (curators and admins), placed last; names are unique per site.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { createFloor, floorNameTaken, siteExists } from "@/db/queries/galleries";
import { floorCreateSchema } from "@/lib/api/galleries";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";

export const POST = route(async (request: NextRequest) => {
  await requireRole(request, "rooms:edit");
  const body = await parseBody(request, floorCreateSchema);
  const floor = await db.transaction().execute(async (trx) => {
    if (!(await siteExists(trx, body.siteId))) throw new ApiProblem(422, "invalid-input", `There is no site ${body.siteId}; reload the page.`, { field: "siteId" });
    if (await floorNameTaken(trx, body.siteId, body.name)) {
      throw new ApiProblem(409, "name-taken", `The site already has a floor called ${body.name}; choose another name.`, { field: "name" });
    }
    return createFloor(trx, { site_id: body.siteId, name: body.name, level: body.level });
  });
  return NextResponse.json({ floor }, { status: 201 });
});
