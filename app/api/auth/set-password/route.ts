// POST /api/auth/set-password { token, password }: the person chooses a password through the link
// they were mailed (an invitation or a reset). The link works once and expires; an unknown, used
// or expired link gets 410 with what to do. No sign-in needed: the link is the proof.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { useAccountLink } from "@/db/queries/accounts";
import { newPasswordSchema } from "@/lib/api/accounts";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody } from "@/lib/api/parse";
import { route } from "@/lib/api/route";
import { tokenHash } from "@/lib/auth/account-links";
import { hashPassword } from "@/lib/auth/passwords";
import { recordAudit } from "@/lib/audit/record";

const REFUSED = {
  unknown: "This link is not valid; open the newest mail you got, or ask an administrator for a new link.",
  used: "This link was already used (or a newer one was sent); ask an administrator for a new link.",
  expired: "This link has expired; ask an administrator for a new link.",
  disabled: "This account is disabled; ask an administrator to enable it.",
} as const;

export const POST = route(async (request: NextRequest) => {
  const { token, password } = await parseBody(request, newPasswordSchema);
  const used = await useAccountLink(db, tokenHash(token), await hashPassword(password));
  if (!used.ok) throw new ApiProblem(410, `link-${used.reason}`, REFUSED[used.reason]);
  await recordAudit(db, { id: used.userId, name: used.email, role: "account owner" }, { action: "user.set-password", subject: { type: "user", id: used.userId, label: used.email }, summary: "set their password through a mailed link" });
  return NextResponse.json({ email: used.email });
});
