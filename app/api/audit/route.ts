import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { listAuditEvents } from "@/db/queries/audit";
import { auditQuerySchema } from "@/lib/api/audit";
import { parseQuery } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";

/** GET /api/audit?area=&actor=&from=&to=&limit=: who changed what, newest first (admins only). */
export const GET = route(async (request: NextRequest) => {
  await requireRole(request, "audit:read");
  const query = parseQuery(request.url, auditQuerySchema);
  const events = await listAuditEvents(db, { area: query.area, actorId: query.actor, from: query.from, to: query.to, limit: query.limit });
  return NextResponse.json({ events });
});
