// POST (operations): a new guard on a site, with an account to sign in with: the guard is mailed a
// single-use link to choose a password (the same invitation the Users page sends). An address the
// site's staff already uses gets 409; bad input gets 422 naming the field; nothing is written then.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { siteExists } from "@/db/queries/galleries";
import { guardCreateSchema } from "@/lib/api/guards";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { addGuardWithAccount, inviteNewGuard } from "@/lib/people/add-guard";
import { recordAudit } from "@/lib/audit/record";

export const POST = route(async (request: NextRequest) => {
  const manager = await requireRole(request, "people:edit");
  const { siteId, ...fields } = await parseBody(request, guardCreateSchema);
  const added = await db.transaction().execute(async (trx) => {
    if (!(await siteExists(trx, siteId))) throw new ApiProblem(422, "invalid-input", `There is no site ${siteId}; reload the page.`, { field: "siteId" });
    const result = await addGuardWithAccount(trx, siteId, fields);
    if (!result.ok) throw new ApiProblem(409, "email-taken", `${result.message}; edit that guard or use another address.`, { field: "email" });
    return result;
  });
  await recordAudit(db, manager, { action: "guard.add", subject: { type: "guard", id: added.guard.id, label: fields.name }, siteId, summary: `added the guard ${fields.name}`, changes: { ...fields } });
  const sent = await inviteNewGuard(db, added, manager.id);
  return NextResponse.json(
    {
      guard: added.guard,
      invitation: sent ? { expiresAt: sent.expiresAt.toISOString(), mailed: sent.mailed } : null,
      ...(sent && !sent.mailed ? { warning: `The guard was added but the invitation did not go out (${sent.mailError}); an administrator can send a new link from Users.` } : {}),
    },
    { status: 201 },
  );
});
