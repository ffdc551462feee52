import type { NextRequest } from "next/server";
import { db } from "@/db";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { rosterCsv } from "@/lib/rosters/export";
import { rosterIdSchema } from "@/lib/rosters/schemas";
import { rosterView } from "@/lib/rosters/view";

type Context = { params: Promise<{ id: string }> };

/**
 * GET /api/rosters/[id]/csv: the roster as a CSV download, one row per assignment (date, start,
 * end, guard, post, room, break) in the site's time zone, cells safe to open in a spreadsheet.
 */
export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "staffing:view");
  const { id } = parseParams(await context.params, rosterIdSchema);
  const roster = await rosterView(db, id);
  if (!roster) throw new ApiProblem(404, "not-found", `No roster with id ${id}; pick a week on the Staffing page.`);
  const name = `roster-${roster.startsOn}-${roster.status === "draft" ? `draft-${roster.revision}` : `v${roster.version}`}.csv`;
  return new Response(rosterCsv(roster), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${name}"`,
      "cache-control": "private, no-store",
    },
  });
});
