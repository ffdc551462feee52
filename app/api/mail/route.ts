import { NextResponse, type NextRequest } from "next/server";
import { z } from "zod";
import { listCaughtMail } from "@/lib/mail/caught";
import { parseQuery } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";

const mailQuerySchema = z.object({
  to: z.string().trim().toLowerCase().email("to must be an e-mail address").optional(),
  limit: z.coerce.number().int().min(1, "limit must be at least 1").max(500, "limit must be at most 500").optional(),
});

/** GET /api/mail?to=&limit=: messages the local mail fake caught, newest first (admins only). */
export const GET = route(async (request: NextRequest) => {
  await requireRole(request, "mail:read");
  const query = parseQuery(request.url, mailQuerySchema);
  const messages = await listCaughtMail(query);
  return NextResponse.json({ messages });
});
