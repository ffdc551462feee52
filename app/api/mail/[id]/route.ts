import { NextResponse, type NextRequest } from "next/server";
import { z } from "zod";
import { isCaughtMailId, maskedMail, readCaughtMail } from "@/lib/mail/caught";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";

const mailIdSchema = z.object({
  id: z.string().refine(isCaughtMailId, "id may hold letters, digits, - and _ only"),
});

/** GET /api/mail/[id]: one caught message (admins only). */
export const GET = route<{ params: Promise<{ id: string }> }>(async (request: NextRequest, context) => {
  await requireRole(request, "mail:read");
  const { id } = parseParams(await context.params, mailIdSchema);
  const message = await readCaughtMail(id);
  if (!message) throw new ApiProblem(404, "not-found", `No caught message with id ${id}.`);
  return NextResponse.json({ message: maskedMail(message) });
});
