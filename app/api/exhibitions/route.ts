// POST (operations): a new exhibition on a site, with its rooms and each room's risk level, sight
// range and double cover. 422 naming the field for bad input (a room of another site, a closing
// before the opening), 409 for a name the site already uses; nothing is written then.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { createExhibition, exhibitionNameTaken, roomsNotOnSite } from "@/db/queries/exhibitions";
import { siteExists } from "@/db/queries/galleries";
import { exhibitionCreateSchema } from "@/lib/api/exhibitions";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit/record";

export const POST = route(async (request: NextRequest) => {
  const user = await requireRole(request, "exhibitions:edit");
  const body = await parseBody(request, exhibitionCreateSchema);
  const exhibition = await db.transaction().execute(async (trx) => {
    if (!(await siteExists(trx, body.siteId))) throw new ApiProblem(422, "invalid-input", `There is no site ${body.siteId}; reload the page.`, { field: "siteId" });
    const foreign = await roomsNotOnSite(trx, body.siteId, body.rooms.map((r) => r.roomId));
    if (foreign.length > 0) throw new ApiProblem(422, "invalid-input", `Room ${foreign[0]} is not a room of this site; choose the rooms from the list.`, { field: "rooms" });
    if (await exhibitionNameTaken(trx, body.siteId, body.name)) throw new ApiProblem(409, "name-taken", `The site already has an exhibition called ${body.name}; choose another name.`, { field: "name" });
    const created = await createExhibition(trx, body);
    await recordAudit(trx, user, { action: "exhibition.create", subject: { type: "exhibition", id: created.id, label: body.name }, siteId: body.siteId, summary: `created the exhibition ${body.name}`, changes: { ...body } });
    return created;
  });
  return NextResponse.json({ exhibition }, { status: 201 });
});
