import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { listOutbox } from "@/db/queries/outbox";
import { outboxQuerySchema } from "@/lib/api/outbox";
import { parseQuery } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";

/** GET /api/mail?kind=&status=&to=&limit=: the outbox, newest first (admins only). */
export const GET = route(async (request: NextRequest) => {
  await requireRole(request, "mail:read");
  const query = parseQuery(request.url, outboxQuerySchema);
  const messages = await listOutbox(db, { kind: query.kind, status: query.status, recipient: query.to, limit: query.limit });
  return NextResponse.json({ messages });
});
