// A site's settings: how it shows dates and money, what a guard-hour costs, and its labour-rule
// defaults. Saved only over the values the person saw (compare and set), so two admins editing at
// once cannot overwrite each other unseen.
import { sql, type Kysely, type Transaction } from "kysely";
import type { Database, OpeningHours, SiteLabourRules } from "../schema";

import { ENGINE_LABOUR_DEFAULTS, LABOUR_DEFAULT_KEYS, type LabourDefaults } from "../../lib/scheduling/labour-defaults";

type Handle = Kysely<Database> | Transaction<Database>;

export interface SiteSettings {
  name?: string;
  mailSender?: string | null;
  timeZone: string;
  locale: string;
  currency: string;
  hourlyRate: number;
  /** Extra hours a week beyond contract a guard accepts unless the guard says otherwise. */
  acceptedExtraHours: number | null;
  opening?: OpeningHours;
  rules?: LabourDefaults;
}

function labourDefaults(rules: SiteLabourRules | null): LabourDefaults {
  const out = { ...ENGINE_LABOUR_DEFAULTS };
  for (const key of LABOUR_DEFAULT_KEYS) if (typeof rules?.[key] === "number") out[key] = rules[key] as number;
  return out;
}

export async function siteSettings(handle: Handle, siteId: number): Promise<(SiteSettings & { id: number; name: string }) | null> {
  const row = await handle.selectFrom("sites").select(["id", "name", "time_zone", "locale", "currency", "hourly_rate", "labour_rules", "opening_hours", "mail_sender"]).where("id", "=", siteId).executeTakeFirst();
  if (!row) return null;
  const extra = (row.labour_rules as SiteLabourRules | null)?.acceptedExtraHours;
  return {
    id: row.id,
    name: row.name,
    mailSender: row.mail_sender,
    timeZone: row.time_zone,
    locale: row.locale,
    currency: row.currency,
    hourlyRate: Number(row.hourly_rate),
    acceptedExtraHours: typeof extra === "number" ? extra : null,
    opening: { weekly: row.opening_hours.weekly, dates: row.opening_hours.dates ?? {} },
    rules: labourDefaults(row.labour_rules as SiteLabourRules | null),
  };
}

/** JSON with every object's keys in order (PostgreSQL's jsonb keeps its own key order). */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(",")}]`;
  if (value && typeof value === "object") {
    return `{${Object.keys(value as Record<string, unknown>)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`)
      .join(",")}}`;
  }
  return JSON.stringify(value);
}
const sameJson = (a: unknown, b: unknown) => canonical(a) === canonical(b);

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
      (b.name === undefined || a.name === b.name) &&
      (b.mailSender === undefined || (a.mailSender ?? null) === b.mailSender) &&
      a.timeZone === b.timeZone &&
      a.locale === b.locale &&
      a.currency === b.currency &&
      Math.abs(a.hourlyRate - b.hourlyRate) < 1e-9 &&
      a.acceptedExtraHours === b.acceptedExtraHours &&
      (b.opening === undefined || sameJson(sortDates(a.opening), sortDates(b.opening))) &&
      (b.rules === undefined || sameJson(a.rules, { ...ENGINE_LABOUR_DEFAULTS, ...b.rules }));
    if (!now || !same(now, previous)) return "changed";
    await trx
      .updateTable("sites")
      .set({
        ...(next.name !== undefined ? { name: next.name } : {}),
        ...(next.mailSender !== undefined ? { mail_sender: next.mailSender } : {}),
        time_zone: next.timeZone,
        locale: next.locale,
        currency: next.currency,
        hourly_rate: next.hourlyRate,
        ...(next.opening ? { opening_hours: JSON.stringify({ weekly: next.opening.weekly, dates: Object.fromEntries(Object.entries(next.opening.dates).sort(([a], [b]) => a.localeCompare(b))) }) } : {}),
        // Only the accepted extra hours change in the labour rules; other defaults stay as they are.
        labour_rules:
          next.acceptedExtraHours === null
            ? sql<string>`labour_rules - 'acceptedExtraHours'`
            : sql<string>`jsonb_set(labour_rules, '{acceptedExtraHours}', to_jsonb(${next.acceptedExtraHours}::numeric))`,
      })
      .where("id", "=", siteId)
      .execute();
    if (next.rules) {
      for (const key of LABOUR_DEFAULT_KEYS) {
        await trx
          .updateTable("sites")
          .set({ labour_rules: sql<string>`jsonb_set(labour_rules, ${sql.lit(`{${key}}`)}, to_jsonb(${next.rules[key]}::numeric))` })
          .where("id", "=", siteId)
          .execute();
      }
    }
    return (await siteSettings(trx, siteId))!;
  });
}

function sortDates(opening: OpeningHours | undefined) {
  if (!opening) return opening;
  return { weekly: opening.weekly, dates: Object.fromEntries(Object.entries(opening.dates ?? {}).sort(([a], [b]) => a.localeCompare(b))) };
}

/** Weeks (their Mondays) with a published roster that has not ended by `today`: rebuild them after a change. */
export async function publishedWeeksFrom(handle: Handle, siteId: number, today: string): Promise<string[]> {
  const rows = await handle
    .selectFrom("rosters")
    .select("starts_on")
    .distinct()
    .where("site_id", "=", siteId)
    .where("status", "=", "published")
    .where(sql<boolean>`starts_on + days > ${today}::date`)
    .orderBy("starts_on")
    .execute();
  return rows.map((r) => String(r.starts_on).slice(0, 10));
}
