// POST /api/users/[id]/reset: an admin mails the person a single-use link to set a new password
// (24 hours; for an account still waiting for its first password, a new 7-day invitation).
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { NO_PASSWORD, accountForLink } from "@/db/queries/accounts";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { userIdSchema } from "@/lib/api/user-role";
import { sendAccountLink } from "@/lib/auth/account-links";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ id: string }> };

export const POST = route<Context>(async (request: NextRequest, context) => {
  const admin = await requireRole(request, "users:manage");
  const { id } = parseParams(await context.params, userIdSchema);
  const user = await accountForLink(db, id);
  if (!user) throw new ApiProblem(404, "not-found", `No user with id ${id}.`);
  if (user.disabled_at) throw new ApiProblem(409, "account-disabled", `${user.name}'s account is disabled; enable it before sending a link.`);
  const purpose = user.password_hash === NO_PASSWORD ? "invite" : "reset";
  const sent = await sendAccountLink(db, user, purpose, admin.id);
  await recordAudit(db, admin, { action: "user.send-link", subject: { type: "user", id, label: user.email }, summary: `sent ${user.name} a new ${purpose === "invite" ? "invitation" : "password reset"} link${sent.mailed ? "" : " (the mail did not go out)"}`, changes: { purpose, mailed: sent.mailed } });
  if (!sent.mailed) throw new ApiProblem(503, "mail-unavailable", `The mail server did not take the message (${sent.mailError}); try again shortly.`);
  return NextResponse.json({ link: { purpose, expiresAt: sent.expiresAt.toISOString(), mailed: true } });
});
