import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { parseQuery } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { weekQuerySchema } from "@/lib/rosters/schemas";
import { weekOverview } from "@/lib/rosters/view";
import { rosterSite } from "./_shared/site";

/** GET /api/rosters?startsOn=YYYY-MM-DD: the week's draft, published versions and latest build job. */
export const GET = route(async (request: NextRequest) => {
  await requireRole(request, "staffing:view");
  const { startsOn } = parseQuery(request.url, weekQuerySchema);
  const site = await rosterSite();
  return NextResponse.json({ week: await weekOverview(db, site.id, startsOn) });
});
