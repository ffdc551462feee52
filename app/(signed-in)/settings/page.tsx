import type { Metadata } from "next";
import { db } from "@/db";
import type { Weekday } from "@/db/schema";
import { requirePageUser } from "@/lib/auth/session";
import { calendarDate } from "@/components/when";
import { describeOpening } from "../_queries/site";
import { siteSettings } from "@/db/queries/site-settings";
import { SiteSettingsForm } from "./_components/site-settings-form";

export const metadata: Metadata = { title: "Settings" };

const DAYS: Weekday[] = ["mon", "tue", "wed", "thu", "fri", "sat", "sun"];

export default async function SettingsPage() {
  await requirePageUser("settings:manage");
  const sites = await db.selectFrom("sites").selectAll().orderBy("id").execute();
  const settings = new Map(await Promise.all(sites.map(async (site) => [site.id, await siteSettings(db, site.id)] as const)));
  return (
    <div className="space-y-6">
      <div>
        <h1>Settings</h1>
        <p className="text-stone-700">Each site&apos;s time zone, how it shows dates and money, what a guard-hour costs, and its opening hours.</p>
      </div>
      {sites.length === 0 && <p>No sites yet.</p>}
      {sites.map((site) => (
        <section key={site.id} aria-labelledby={`site-${site.id}`} className="card">
          <h2 id={`site-${site.id}`}>{site.name}</h2>
          {settings.get(site.id) && <SiteSettingsForm siteId={site.id} initial={settings.get(site.id)!} />}
          <h3 className="mt-4">Weekly opening</h3>
          <ul className="mt-1 grid grid-cols-2 gap-x-6 text-sm sm:grid-cols-4">
            {DAYS.map((day) => (
              <li key={day}>
                <span className="font-semibold capitalize">{day}</span> {describeOpening(site.opening_hours.weekly[day])}
              </li>
            ))}
          </ul>
          <h3 className="mt-4">Special days</h3>
          <ul className="mt-1 text-sm">
            {Object.entries(site.opening_hours.dates ?? {}).sort(([a], [b]) => a.localeCompare(b)).map(([date, span]) => (
              <li key={date}>
                {calendarDate(date)}: {describeOpening(span)}
              </li>
            ))}
            {Object.keys(site.opening_hours.dates ?? {}).length === 0 && <li>None.</li>}
          </ul>
        </section>
      ))}
    </div>
  );
}
