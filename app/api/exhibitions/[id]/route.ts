// GET: one exhibition with its rooms. PUT (operations): replace its name, dates and rooms (a
// room's approved plan stays with the exhibition while the room stays in it). Errors as for POST.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { exhibitionById, exhibitionNameTaken, roomsNotOnSite, updateExhibition } from "@/db/queries/exhibitions";
import { exhibitionIdParams, exhibitionUpdateSchema } from "@/lib/api/exhibitions";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { changedFields, recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ id: string }> };

export const dynamic = "force-dynamic";

export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "exhibitions:view");
  const { id } = parseParams(await context.params, exhibitionIdParams);
  const exhibition = await exhibitionById(db, id);
  if (!exhibition) throw new ApiProblem(404, "not-found", `There is no exhibition ${id}; reload the page.`);
  return NextResponse.json({ exhibition });
});

export const PUT = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "exhibitions:edit");
  const { id } = parseParams(await context.params, exhibitionIdParams);
  const body = await parseBody(request, exhibitionUpdateSchema);
  const exhibition = await db.transaction().execute(async (trx) => {
    const current = await exhibitionById(trx, id);
    if (!current) throw new ApiProblem(404, "not-found", `There is no exhibition ${id}; reload the page.`);
    const foreign = await roomsNotOnSite(trx, current.siteId, body.rooms.map((r) => r.roomId));
    if (foreign.length > 0) throw new ApiProblem(422, "invalid-input", `Room ${foreign[0]} is not a room of this site; choose the rooms from the list.`, { field: "rooms" });
    if (await exhibitionNameTaken(trx, current.siteId, body.name, id)) throw new ApiProblem(409, "name-taken", `The site already has an exhibition called ${body.name}; choose another name.`, { field: "name" });
    const { id: _id, siteId: _site, ...before } = current;
    await recordAudit(trx, user, { action: "exhibition.update", subject: { type: "exhibition", id, label: body.name }, siteId: current.siteId, summary: `changed the exhibition ${current.name}`, changes: changedFields(before, body) });
    return updateExhibition(trx, id, body);
  });
  return NextResponse.json({ exhibition });
});
