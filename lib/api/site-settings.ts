// The site settings form and PUT /api/sites/[siteId]/settings share this schema (pure zod).
import { z } from "zod";
import { isCurrency, isLocale, isTimeZone } from "@/lib/format";

export const siteSettingsSchema = z.object({
  timeZone: z.string().trim().refine(isTimeZone, "use an IANA time zone such as Europe/Berlin"),
  locale: z.string().trim().refine(isLocale, "use a language tag such as en-GB or de-DE"),
  currency: z.string().trim().toUpperCase().refine(isCurrency, "use an ISO 4217 currency code such as EUR or GBP"),
  hourlyRate: z.number({ error: "the hourly rate must be a number" }).min(0, "the hourly rate cannot be negative").max(10_000, "the hourly rate is at most 10,000"),
  acceptedExtraHours: z
    .number({ error: "accepted extra hours must be a number" })
    .min(0, "accepted extra hours cannot be negative")
    .max(40, "at most 40 extra hours a week")
    .nullable(),
});
export type SiteSettingsInput = z.infer<typeof siteSettingsSchema>;

export const saveSiteSettingsSchema = z.object({
  /** The values the person saw: the save is refused (409) when the site holds other values now. */
  previous: siteSettingsSchema,
  settings: siteSettingsSchema,
});
