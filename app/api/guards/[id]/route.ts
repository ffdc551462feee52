// PUT (operations): edit a guard's name, e-mail, contract, limits and skills, or take them off the
// staff (active false: kept for history, never rostered again) and back. Errors as for POST.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { guardById, guardEmailTaken, updateGuard } from "@/db/queries/guards";
import { guardIdParams, guardUpdateSchema } from "@/lib/api/guards";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { changedFields, recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ id: string }> };

export const PUT = route<Context>(async (request: NextRequest, context) => {
  const manager = await requireRole(request, "people:edit");
  const { id } = parseParams(await context.params, guardIdParams);
  const body = await parseBody(request, guardUpdateSchema);
  const guard = await db.transaction().execute(async (trx) => {
    const current = await guardById(trx, id);
    if (!current) throw new ApiProblem(404, "not-found", `There is no guard ${id}; reload the page.`);
    if (await guardEmailTaken(trx, current.site_id, body.email, id)) throw new ApiProblem(409, "email-taken", `Another guard of this site uses ${body.email}.`, { field: "email" });
    await recordAudit(trx, manager, {
      action: body.active ? "guard.update" : "guard.retire",
      subject: { type: "guard", id, label: body.name },
      siteId: current.site_id,
      summary: `${body.active ? "changed" : "retired or changed"} the guard ${current.name}`,
      changes: { ...changedFields({ name: current.name, email: current.email }, { name: body.name, email: body.email }), values: body },
    });
    return updateGuard(trx, id, body);
  });
  return NextResponse.json({ guard });
});
