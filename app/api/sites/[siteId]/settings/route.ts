// GET: a site's settings. PUT (admins): save them over the values the person saw; 409 with the
// current values when someone saved others meanwhile, 422 naming the field for a bad value.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { publishedWeeksFrom, saveSiteSettings, siteSettings } from "@/db/queries/site-settings";
import { siteIdParams } from "@/lib/api/galleries";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { saveSiteSettingsSchema } from "@/lib/api/site-settings";
import { changedFields, recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ siteId: string }> };

export const dynamic = "force-dynamic";

export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "settings:manage");
  const { siteId } = parseParams(await context.params, siteIdParams);
  const settings = await siteSettings(db, siteId);
  if (!settings) throw new ApiProblem(404, "not-found", `There is no site ${siteId}; reload the page.`);
  return NextResponse.json({ settings });
});

export const PUT = route<Context>(async (request: NextRequest, context) => {
  const admin = await requireRole(request, "settings:manage");
  const { siteId } = parseParams(await context.params, siteIdParams);
  const { previous, settings } = await parseBody(request, saveSiteSettingsSchema);
  const saved = await saveSiteSettings(db, siteId, previous, settings);
  if (saved === null) throw new ApiProblem(404, "not-found", `There is no site ${siteId}; reload the page.`);
  if (saved === "changed") {
    const current = await siteSettings(db, siteId);
    throw new ApiProblem(409, "settings-changed", "Someone saved other settings for this site meanwhile; nothing was changed. Reload to see them, then make your change again.", { current });
  }
  const changes = changedFields(previous as Record<string, unknown>, settings as Record<string, unknown>);
  if (Object.keys(changes).length > 0) {
    await recordAudit(db, admin, { action: "settings.save", subject: { type: "site", id: siteId, label: saved.name ?? "" }, siteId, summary: `changed ${Object.keys(changes).join(", ")} of the site settings`, changes });
  }
  // Published rosters keep the settings they were built with: name the weeks to rebuild.
  const changesRosters =
    JSON.stringify([previous.opening, previous.rules, previous.acceptedExtraHours, previous.hourlyRate]) !==
    JSON.stringify([settings.opening ?? previous.opening, settings.rules ?? previous.rules, settings.acceptedExtraHours, settings.hourlyRate]);
  const today = new Intl.DateTimeFormat("en-CA", { timeZone: saved.timeZone }).format(new Date());
  const rebuild = changesRosters ? await publishedWeeksFrom(db, siteId, today) : [];
  return NextResponse.json({ settings: saved, rebuild });
});
