import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { readOutboxMail } from "@/lib/mail/outbox";
import { resendOutboxMail } from "@/lib/mail/resend";
import { outboxIdSchema } from "@/lib/api/outbox";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit/record";

const STATUS = { unknown: 404, "no-account": 409, disabled: 409, "password-set": 409, "not-sent": 503 } as const;

/** POST /api/mail/[id]/resend: one more attempt (a set-password mail gets a new link); admins only. */
export const POST = route<{ params: Promise<{ id: string }> }>(async (request: NextRequest, context) => {
  const admin = await requireRole(request, "mail:resend");
  const { id } = parseParams(await context.params, outboxIdSchema);
  const result = await resendOutboxMail(db, id, admin.id);
  if (!result.ok) throw new ApiProblem(STATUS[result.reason], result.reason === "not-sent" ? "mail-unavailable" : result.reason, result.message);
  const message = await readOutboxMail(db, id);
  await recordAudit(db, admin, { action: "mail.resend", subject: { type: "outbox", id, label: message?.recipient }, summary: `sent "${message?.subject ?? id}" to ${message?.recipient ?? "its recipient"} again` });
  return NextResponse.json({ message });
});
