// GET: every site with its floors and rooms in page order (what the galleries page shows).
// POST: a new site (curators and admins), placed last.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { createSite, galleriesTree } from "@/db/queries/galleries";
import { siteCreateSchema } from "@/lib/api/galleries";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit/record";

export const dynamic = "force-dynamic";

export const GET = route(async (request: NextRequest) => {
  await requireRole(request, "galleries:view");
  return NextResponse.json({ sites: await galleriesTree(db) });
});

export const POST = route(async (request: NextRequest) => {
  const user = await requireRole(request, "rooms:edit");
  const body = await parseBody(request, siteCreateSchema);
  const site = await createSite(db, { name: body.name, time_zone: body.timeZone, currency: body.currency, hourly_rate: body.hourlyRate });
  await recordAudit(db, user, { action: "site.create", subject: { type: "site", id: site.id, label: body.name }, siteId: site.id, summary: `created the site ${body.name}`, changes: { name: body.name, timeZone: body.timeZone, currency: body.currency, hourlyRate: body.hourlyRate } });
  return NextResponse.json({ site }, { status: 201 });
});
