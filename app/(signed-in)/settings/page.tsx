import type { Metadata } from "next";
import { db } from "@/db";
import { requirePageUser } from "@/lib/auth/session";
import { siteSettings } from "@/db/queries/site-settings";
import { SiteFormatProvider } from "@/components/site-format";
import { siteFormat } from "@/lib/format";
import { SiteSettingsForm } from "./_components/site-settings-form";

export const metadata: Metadata = { title: "Settings" };

export default async function SettingsPage() {
  await requirePageUser("settings:manage");
  const sites = await db.selectFrom("sites").selectAll().orderBy("id").execute();
  const settings = new Map(await Promise.all(sites.map(async (site) => [site.id, await siteSettings(db, site.id)] as const)));
  return (
    <div className="space-y-6">
      <div>
        <h1>Settings</h1>
        <p className="text-stone-700">Each site&apos;s time zone, how it shows dates and money, what a guard-hour costs, its opening hours and special days, and its labour-rule defaults.</p>
      </div>
      {sites.length === 0 && <p>No sites yet.</p>}
      {sites.map((site) => (
        <section key={site.id} aria-labelledby={`site-${site.id}`} className="card">
          <h2 id={`site-${site.id}`}>{site.name}</h2>
          {/* Each site's dates in its own format, not the main site's. */}
          {settings.get(site.id) && (
            <SiteFormatProvider value={siteFormat(site)}>
              <SiteSettingsForm siteId={site.id} initial={settings.get(site.id)!} />
            </SiteFormatProvider>
          )}
        </section>
      ))}
    </div>
  );
}
