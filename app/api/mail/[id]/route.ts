import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { readOutboxMail } from "@/lib/mail/outbox";
import { outboxIdSchema } from "@/lib/api/outbox";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";

/** GET /api/mail/[id]: one outbox message, links masked (admins only). */
export const GET = route<{ params: Promise<{ id: string }> }>(async (request: NextRequest, context) => {
  await requireRole(request, "mail:read");
  const { id } = parseParams(await context.params, outboxIdSchema);
  const message = await readOutboxMail(db, id);
  if (!message) throw new ApiProblem(404, "not-found", `No message ${id} in the outbox.`);
  return NextResponse.json({ message });
});
