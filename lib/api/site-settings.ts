// The site settings form and PUT /api/sites/[siteId]/settings share this schema (pure zod).
import { z } from "zod";
import { isCalendarDate, isCurrency, isLocale, isTimeZone } from "@/lib/format";

const clock = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$|^24:00$/, "use a time such as 10:00");
/** One day's opening, [opens, closes] local time, or null for closed. */
const span = z
  .tuple([clock, clock])
  .nullable()
  .refine((s) => s === null || s[0] < s[1], "a day closes after it opens");
const WEEKDAYS = ["mon", "tue", "wed", "thu", "fri", "sat", "sun"] as const;

export const openingSchema = z.object({
  weekly: z.object(Object.fromEntries(WEEKDAYS.map((d) => [d, span])) as Record<(typeof WEEKDAYS)[number], typeof span>),
  dates: z
    .record(z.string().refine(isCalendarDate, "a special day is a calendar date such as 2027-12-24"), span)
    .refine((d) => Object.keys(d).length <= 366, "at most 366 special days"),
});

/** The site's labour-rule defaults (the engine's rules, lib/scheduling/scenario.ts): local law governs. */
export const labourDefaultsSchema = z.object({
  minRestHours: z.number().min(0, "rest cannot be negative").max(24, "at most 24 h of rest"),
  maxShiftHours: z.number().min(1, "a shift lasts at least 1 h").max(16, "a shift lasts at most 16 h"),
  minShiftHours: z.number().min(1, "a shift lasts at least 1 h").max(16, "a shift lasts at most 16 h"),
  breakAfterHours: z.number().min(1).max(12, "a break comes within 12 h"),
  breakMinutes: z.number().min(0, "a break cannot be negative").max(120, "at most 120 minutes of break"),
}).refine((r) => r.minShiftHours <= r.maxShiftHours, { message: "the shortest shift cannot be longer than the longest", path: ["minShiftHours"] });

// "security@example.org" or "Aldmoor Security <security@example.org>" (RFC 5322 name-addr, kept simple).
const ADDRESS = /^[^\s@<>()",;:]+@[A-Za-z0-9-]+(\.[A-Za-z0-9-]+)+$/;
export function isMailSender(value: string): boolean {
  const named = /^([^<>"\r\n]{1,100}?)\s*<([^<>]+)>$/.exec(value);
  return named ? ADDRESS.test(named[2]!.trim()) : ADDRESS.test(value);
}

export const siteSettingsSchema = z.object({
  /** The museum's (site's) name as pages and mails show it; absent = unchanged. */
  name: z.string().trim().min(1, "give the site a name").max(120, "keep the name under 120 characters").optional(),
  /** From address of the site's mail; null = the app's default sender; absent = unchanged. */
  mailSender: z
    .string()
    .trim()
    .max(200, "keep the sender under 200 characters")
    .refine(isMailSender, 'use an address such as security@example.org, or a name and address: Aldmoor Security <security@example.org>')
    .nullable()
    .optional(),
  timeZone: z.string().trim().refine(isTimeZone, "use an IANA time zone such as Europe/Berlin"),
  locale: z.string().trim().refine(isLocale, "use a language tag such as en-GB or de-DE"),
  currency: z.string().trim().toUpperCase().refine(isCurrency, "use an ISO 4217 currency code such as EUR or GBP"),
  hourlyRate: z.number({ error: "the hourly rate must be a number" }).min(0, "the hourly rate cannot be negative").max(10_000, "the hourly rate is at most 10,000"),
  acceptedExtraHours: z
    .number({ error: "accepted extra hours must be a number" })
    .min(0, "accepted extra hours cannot be negative")
    .max(40, "at most 40 extra hours a week")
    .nullable(),
  opening: openingSchema.optional(),
  rules: labourDefaultsSchema.optional(),
});
export type SiteSettingsInput = z.infer<typeof siteSettingsSchema>;

export const saveSiteSettingsSchema = z.object({
  /** The values the person saw: the save is refused (409) when the site holds other values now. */
  previous: siteSettingsSchema,
  settings: siteSettingsSchema,
});
