// How a site shows dates, times and money, for text written outside a page (mails).
import type { Kysely, Transaction } from "kysely";
import type { Database } from "../schema";
import { siteFormat, type SiteFormat } from "@/lib/format";

type Handle = Kysely<Database> | Transaction<Database>;

/** The site's locale, zone and currency; without an id the main site's (the first by id), as the app shows it. */
export async function siteFormatOf(handle: Handle, siteId?: number): Promise<SiteFormat> {
  let query = handle.selectFrom("sites").select(["locale", "time_zone", "currency"]).orderBy("id").limit(1);
  if (siteId !== undefined) query = query.where("id", "=", siteId);
  return siteFormat(await query.executeTakeFirst());
}
