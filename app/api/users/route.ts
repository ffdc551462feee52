import type { NextRequest } from "next/server";
import { NextResponse } from "next/server";
import { db } from "@/db";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { parseBody } from "@/lib/api/parse";
import { ApiProblem } from "@/lib/api/problem";
import { inviteSchema } from "@/lib/api/accounts";
import { createInvitedUser, listUsers, userByEmailAddress } from "@/db/queries/accounts";
import { sendAccountLink } from "@/lib/auth/account-links";
import { recordAudit } from "@/lib/audit/record";

/** GET /api/users: every account with its role, whether it is disabled or still invited, and its last sign-in (admins only). */
export const GET = route(async (request: NextRequest) => {
  await requireRole(request, "users:manage");
  return NextResponse.json({ users: await listUsers(db) });
});

/**
 * POST /api/users { name, email, role }: invites a person. The account has no password until they
 * choose one through the mailed single-use link (7 days). 409 for an address already in use.
 */
export const POST = route(async (request: NextRequest) => {
  const admin = await requireRole(request, "users:manage");
  const body = await parseBody(request, inviteSchema);
  if (await userByEmailAddress(db, body.email)) {
    throw new ApiProblem(409, "email-taken", `There is already an account for ${body.email}; send that person a reset link instead.`, { field: "email" });
  }
  const user = await createInvitedUser(db, body);
  await recordAudit(db, admin, { action: "user.invite", subject: { type: "user", id: user.id, label: body.email }, summary: `invited ${body.name} (${body.email}) as ${body.role}`, changes: { ...body } });
  const sent = await sendAccountLink(db, user, "invite", admin.id);
  return NextResponse.json(
    {
      user,
      invitation: { expiresAt: sent.expiresAt.toISOString(), mailed: sent.mailed },
      ...(sent.mailed ? {} : { warning: `The account was made but the mail did not go out (${sent.mailError}); it waits in the outbox as failed: resend it from Mail once the mail server answers.` }),
    },
    { status: 201 },
  );
});
