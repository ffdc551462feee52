// POST (operations): a new guard on a site, with an account to sign in with: the guard is mailed a
// single-use link to choose a password (the same invitation the Users page sends). An address the
// site's staff already uses gets 409; bad input gets 422 naming the field; nothing is written then.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { createInvitedUser, userByEmailAddress } from "@/db/queries/accounts";
import { guardEmailTaken, insertGuard } from "@/db/queries/guards";
import { siteExists } from "@/db/queries/galleries";
import { guardCreateSchema } from "@/lib/api/guards";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { sendAccountLink } from "@/lib/auth/account-links";

export const POST = route(async (request: NextRequest) => {
  const manager = await requireRole(request, "people:edit");
  const body = await parseBody(request, guardCreateSchema);
  const created = await db.transaction().execute(async (trx) => {
    if (!(await siteExists(trx, body.siteId))) throw new ApiProblem(422, "invalid-input", `There is no site ${body.siteId}; reload the page.`, { field: "siteId" });
    if (await guardEmailTaken(trx, body.siteId, body.email)) throw new ApiProblem(409, "email-taken", `A guard of this site already uses ${body.email}; edit that guard instead.`, { field: "email" });
    // An existing account with this address (say, a former guard) is linked; otherwise one is made.
    const existing = await userByEmailAddress(trx, body.email);
    if (existing && existing.role !== "guard") throw new ApiProblem(409, "email-taken", `${body.email} belongs to a ${existing.role} account; use another address for the guard.`, { field: "email" });
    const user = existing ?? (await createInvitedUser(trx, { email: body.email, name: body.name, role: "guard" }));
    const guard = await insertGuard(trx, { ...body, siteId: body.siteId, userId: user.id });
    return { guard, user, invite: !existing };
  });
  const sent = created.invite ? await sendAccountLink(db, created.user, "invite", manager.id) : null;
  return NextResponse.json(
    {
      guard: created.guard,
      invitation: sent ? { expiresAt: sent.expiresAt.toISOString(), mailed: sent.mailed } : null,
      ...(sent && !sent.mailed ? { warning: `The guard was added but the invitation did not go out (${sent.mailError}); an administrator can send a new link from Users.` } : {}),
    },
    { status: 201 },
  );
});
