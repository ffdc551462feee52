import type { NextRequest } from "next/server";
import { db } from "@/db";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { route } from "@/lib/api/route";
import { calendarFeed } from "@/lib/rosters/feed";
import { calendarTokenSchema } from "@/lib/rosters/schemas";

type Context = { params: Promise<{ token: string }> };

/**
 * GET /api/calendar/[token]: a guard's personal iCalendar feed (text/calendar). Calendar apps
 * cannot sign in, so the secret token in the address is the key; it answers only that guard's
 * shifts, from the latest published version of each week.
 */
export const GET = route<Context>(async (_request: NextRequest, context) => {
  const { token } = parseParams(await context.params, calendarTokenSchema);
  const feed = await calendarFeed(db, token);
  if (feed === null) throw new ApiProblem(404, "not-found", "No calendar at this address; the guard may have reset the link. Copy the new one from My shifts.");
  return new Response(feed, {
    headers: {
      "content-type": "text/calendar; charset=utf-8",
      "content-disposition": 'inline; filename="shifts.ics"',
      "cache-control": "private, no-store",
    },
  });
});
