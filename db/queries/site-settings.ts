// A site's settings: how it shows dates and money, what a guard-hour costs, and its labour-rule
// defaults. Saved only over the values the person saw (compare and set), so two admins editing at
// once cannot overwrite each other unseen.
import { sql, type Kysely, type Transaction } from "kysely";
import type { Database, SiteLabourRules } from "../schema";

type Handle = Kysely<Database> | Transaction<Database>;

export interface SiteSettings {
  timeZone: string;
  locale: string;
  currency: string;
  hourlyRate: number;
  /** Extra hours a week beyond contract a guard accepts unless the guard says otherwise. */
  acceptedExtraHours: number | null;
}

export async function siteSettings(handle: Handle, siteId: number): Promise<(SiteSettings & { id: number; name: string }) | null> {
  const row = await handle.selectFrom("sites").select(["id", "name", "time_zone", "locale", "currency", "hourly_rate", "labour_rules"]).where("id", "=", siteId).executeTakeFirst();
  if (!row) return null;
  const extra = (row.labour_rules as SiteLabourRules | null)?.acceptedExtraHours;
  return {
    id: row.id,
    name: row.name,
    timeZone: row.time_zone,
    locale: row.locale,
    currency: row.currency,
    hourlyRate: Number(row.hourly_rate),
    acceptedExtraHours: typeof extra === "number" ? extra : null,
  };
}

/**
 * Writes `next` when the site still holds `previous`; answers the saved settings, null when the
 * site is gone, or "changed" when someone saved other values meanwhile (nothing is written then).
 */
export async function saveSiteSettings(handle: Kysely<Database>, siteId: number, previous: SiteSettings, next: SiteSettings): Promise<SiteSettings | null | "changed"> {
  return handle.transaction().execute(async (trx) => {
    const current = await trx.selectFrom("sites").select(["id"]).where("id", "=", siteId).forUpdate().executeTakeFirst();
    if (!current) return null;
    const now = await siteSettings(trx, siteId);
    const same = (a: SiteSettings, b: SiteSettings) =>
      a.timeZone === b.timeZone && a.locale === b.locale && a.currency === b.currency && Math.abs(a.hourlyRate - b.hourlyRate) < 1e-9 && a.acceptedExtraHours === b.acceptedExtraHours;
    if (!now || !same(now, previous)) return "changed";
    await trx
      .updateTable("sites")
      .set({
        time_zone: next.timeZone,
        locale: next.locale,
        currency: next.currency,
        hourly_rate: next.hourlyRate,
        // Only the accepted extra hours change in the labour rules; other defaults stay as they are.
        labour_rules:
          next.acceptedExtraHours === null
            ? sql<string>`labour_rules - 'acceptedExtraHours'`
            : sql<string>`jsonb_set(labour_rules, '{acceptedExtraHours}', to_jsonb(${next.acceptedExtraHours}::numeric))`,
      })
      .where("id", "=", siteId)
      .execute();
    return (await siteSettings(trx, siteId))!;
  });
}
