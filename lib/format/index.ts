// The one way Sightward shows dates, times, durations and money: through the site's locale (BCP 47),
// time zone (IANA) and currency (ISO 4217), with the platform's Intl. Pure: pages, client
// components, mails and tests import the same functions. Notes: lib/format/README.md.

/** What every formatter needs to know about the site; plain data, so a server page can hand it to a client component. */
export interface SiteFormat {
  locale: string;
  timeZone: string;
  currency: string;
}

export const DEFAULT_FORMAT: SiteFormat = { locale: "en-GB", timeZone: "UTC", currency: "EUR" };

/** A site row (or anything with its three columns) as a SiteFormat. */
export function siteFormat(site: { locale?: string | null; time_zone?: string | null; currency?: string | null } | null | undefined): SiteFormat {
  return {
    locale: site?.locale || DEFAULT_FORMAT.locale,
    timeZone: site?.time_zone || DEFAULT_FORMAT.timeZone,
    currency: site?.currency || DEFAULT_FORMAT.currency,
  };
}

// ---- validation (settings forms and routes) ----

export function isTimeZone(value: string): boolean {
  if (!value || !/^[A-Za-z_+\-/0-9]+$/.test(value)) return false;
  try {
    new Intl.DateTimeFormat("en", { timeZone: value });
    return true;
  } catch {
    return false;
  }
}

export function isLocale(value: string): boolean {
  if (!value || !/^[A-Za-z]{2,3}(-[A-Za-z0-9]{2,8})*$/.test(value)) return false;
  try {
    return Intl.DateTimeFormat.supportedLocalesOf([value]).length === 1;
  } catch {
    return false;
  }
}

/** An ISO 4217 code the platform knows (Intl.supportedValuesOf lists them). */
export function isCurrency(value: string): boolean {
  if (!/^[A-Z]{3}$/.test(value)) return false;
  const known = (Intl as unknown as { supportedValuesOf?: (key: string) => string[] }).supportedValuesOf?.("currency");
  return known ? known.includes(value) : true;
}

// ---- calendar dates and instants ----

const CALENDAR_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** True for a "YYYY-MM-DD" calendar date that exists. */
export function isCalendarDate(value: string): boolean {
  const match = CALENDAR_DATE.exec(value);
  if (!match) return false;
  const [y, m, d] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const date = new Date(Date.UTC(y, m - 1, d));
  return date.getUTCFullYear() === y && date.getUTCMonth() === m - 1 && date.getUTCDate() === d;
}

// A "YYYY-MM-DD" string is a calendar date: formatted at UTC noon in UTC so its day never moves.
// Anything else is an instant, formatted in the site's time zone.
function pointOf(value: Date | string | number, f: SiteFormat): { at: Date; timeZone: string } {
  if (typeof value === "string" && CALENDAR_DATE.test(value)) return { at: new Date(`${value}T12:00:00Z`), timeZone: "UTC" };
  return { at: value instanceof Date ? value : new Date(value), timeZone: f.timeZone };
}

const cache = new Map<string, Intl.DateTimeFormat | Intl.NumberFormat>();
function dateTimeFormat(locale: string, timeZone: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `d|${locale}|${timeZone}|${JSON.stringify(options)}`;
  let found = cache.get(key) as Intl.DateTimeFormat | undefined;
  if (!found) {
    found = new Intl.DateTimeFormat(locale, { ...options, timeZone });
    cache.set(key, found);
  }
  return found;
}
function numberFormat(locale: string, options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = `n|${locale}|${JSON.stringify(options)}`;
  let found = cache.get(key) as Intl.NumberFormat | undefined;
  if (!found) {
    found = new Intl.NumberFormat(locale, options);
    cache.set(key, found);
  }
  return found;
}

const DATE: Intl.DateTimeFormatOptions = { day: "numeric", month: "short", year: "numeric" };
const DAY: Intl.DateTimeFormatOptions = { weekday: "short", day: "numeric", month: "short", year: "numeric" };
const SHORT_DAY: Intl.DateTimeFormatOptions = { weekday: "short", day: "numeric", month: "short" };
const TIME: Intl.DateTimeFormatOptions = { hour: "2-digit", minute: "2-digit" };
const DATE_TIME: Intl.DateTimeFormatOptions = { ...DAY, ...TIME };

function formatWith(f: SiteFormat, value: Date | string | number, options: Intl.DateTimeFormatOptions): string {
  const { at, timeZone } = pointOf(value, f);
  if (Number.isNaN(at.getTime())) return "—";
  return dateTimeFormat(f.locale, timeZone, options).format(at);
}

/** A date: "2 Dec 2026" (en-GB), "Dec 2, 2026" (en-US). */
export function formatDate(f: SiteFormat, value: Date | string | number): string {
  return formatWith(f, value, DATE);
}

/** A date with its weekday: "Wed, 2 Dec 2026". */
export function formatDay(f: SiteFormat, value: Date | string | number): string {
  return formatWith(f, value, DAY);
}

/** A day within a known week (grid and calendar headers): "Wed, 2 Dec". */
export function formatShortDay(f: SiteFormat, value: Date | string | number): string {
  return formatWith(f, value, SHORT_DAY);
}

/** A clock time at the site: "09:05" (en-GB), "09:05 AM" (en-US). */
export function formatTime(f: SiteFormat, value: Date | string | number): string {
  return formatWith(f, value, TIME);
}

/** An instant at the site: "Wed, 2 Dec 2026, 09:05". */
export function formatDateTime(f: SiteFormat, value: Date | string | number): string {
  return formatWith(f, value, DATE_TIME);
}

/** Two clock times: "09:00–17:00". */
export function formatTimeRange(f: SiteFormat, start: Date | string | number, end: Date | string | number): string {
  return `${formatTime(f, start)}–${formatTime(f, end)}`;
}

/** A stretch of time: "Wed, 2 Dec 2026, 09:00–17:00" (the end's date added when it is another day). */
export function formatSpan(f: SiteFormat, start: Date | string | number, end: Date | string | number): string {
  const sameDay = siteDate(f, start) === siteDate(f, end);
  return sameDay ? `${formatDateTime(f, start)}–${formatTime(f, end)}` : `${formatDateTime(f, start)} – ${formatDateTime(f, end)}`;
}

/** Two calendar dates: "2 Dec 2026 – 11 Jan 2027". */
export function formatDateRange(f: SiteFormat, first: Date | string, last: Date | string): string {
  return `${formatDate(f, first)} – ${formatDate(f, last)}`;
}

/** The site's calendar date of an instant, "YYYY-MM-DD" (for comparisons and storage, not for people). */
export function siteDate(f: SiteFormat, value: Date | string | number): string {
  const { at, timeZone } = pointOf(value, f);
  const parts = dateTimeFormat("en-CA", timeZone, { year: "numeric", month: "2-digit", day: "2-digit" }).formatToParts(at);
  const part = (type: string) => parts.find((p) => p.type === type)?.value ?? "";
  return `${part("year")}-${part("month")}-${part("day")}`;
}

/** The site's local wall-clock time of an instant, "HH:mm" 24-hour (for inputs and storage, not for people). */
export function siteClock(f: SiteFormat, value: Date | string | number): string {
  const { at, timeZone } = pointOf(value, f);
  const parts = dateTimeFormat("en-GB", timeZone, { hour: "2-digit", minute: "2-digit", hourCycle: "h23" }).formatToParts(at);
  const part = (type: string) => parts.find((p) => p.type === type)?.value ?? "";
  return `${part("hour")}:${part("minute")}`;
}

/** A stored "HH:mm" wall-clock time shown the site's way: "09:00", or "9:00 AM" for en-US. */
export function formatClock(f: SiteFormat, hhmm: string): string {
  const match = /^(\d{2}):(\d{2})$/.exec(hhmm);
  if (!match) return hhmm;
  if (hhmm === "24:00") return formatWith({ ...f, timeZone: "UTC" }, new Date(Date.UTC(2000, 0, 1, 0, 0)), TIME).replace(/^00/, "24");
  return formatWith({ ...f, timeZone: "UTC" }, new Date(Date.UTC(2000, 0, 1, Number(match[1]), Number(match[2]))), TIME);
}

// ---- numbers, durations, money ----

/** A number in the site's locale: "1,234.5" (en-GB), "1.234,5" (de-DE). */
export function formatNumber(f: SiteFormat, value: number, maximumFractionDigits = 1): string {
  return numberFormat(f.locale, { maximumFractionDigits }).format(value);
}

/** Hours as a quantity: "7.5 h". */
export function formatHours(f: SiteFormat, hours: number, maximumFractionDigits = 1): string {
  return `${formatNumber(f, hours, maximumFractionDigits)} h`;
}

/** A duration in minutes: "45 min", "7 h", "7 h 30 min". */
export function formatDuration(f: SiteFormat, minutes: number): string {
  const whole = Math.round(minutes);
  const h = Math.trunc(whole / 60);
  const m = Math.abs(whole % 60);
  if (h === 0) return `${formatNumber(f, m, 0)} min`;
  return m === 0 ? `${formatNumber(f, h, 0)} h` : `${formatNumber(f, h, 0)} h ${formatNumber(f, m, 0)} min`;
}

/** An amount in the site's currency: "€1,234.50" (en-GB, EUR), "1.234,50 €" (de-DE). `whole` drops the cents. */
export function formatMoney(f: SiteFormat, amount: number, options: { whole?: boolean } = {}): string {
  const digits = options.whole ? { minimumFractionDigits: 0, maximumFractionDigits: 0 } : {};
  return numberFormat(f.locale, { style: "currency", currency: f.currency, ...digits }).format(amount);
}

// ---- date inputs in the locale's own order ----

export interface DateInputShape {
  /** Field order of the locale's numeric date, e.g. ["day", "month", "year"] for en-GB. */
  order: Array<"day" | "month" | "year">;
  separator: string;
  /** What to type: "dd/mm/yyyy" (en-GB), "mm/dd/yyyy" (en-US), "dd.mm.yyyy" (de-DE). */
  placeholder: string;
  /** An HTML pattern attribute for the text input. */
  pattern: string;
}

/** How a person of this locale writes a date with digits, read from Intl. */
export function dateInputShape(locale: string): DateInputShape {
  const parts = dateTimeFormat(locale, "UTC", { day: "2-digit", month: "2-digit", year: "numeric" }).formatToParts(new Date(Date.UTC(2026, 11, 2)));
  const order = parts.filter((p) => p.type === "day" || p.type === "month" || p.type === "year").map((p) => p.type as "day" | "month" | "year");
  const separator = parts.find((p) => p.type === "literal")?.value.trim().charAt(0) || "/";
  const names = { day: "dd", month: "mm", year: "yyyy" } as const;
  const placeholder = order.map((t) => names[t]).join(separator);
  const digits = { day: "\\d{1,2}", month: "\\d{1,2}", year: "\\d{4}" } as const;
  const sep = separator.replace(/[.*+?^${}()|[\]\\/-]/g, "\\$&");
  const pattern = order.map((t) => digits[t]).join(`\\s*${sep}\\s*`) + (separator === "." ? "\\.?" : "");
  return { order, separator, placeholder, pattern };
}

/** "YYYY-MM-DD" as the locale writes it in a date field: "02/12/2026" for en-GB. */
export function toDateInput(locale: string, date: string): string {
  const match = CALENDAR_DATE.exec(date);
  if (!match) return "";
  const shape = dateInputShape(locale);
  const values = { year: match[1], month: match[2], day: match[3] };
  return shape.order.map((t) => values[t]).join(shape.separator);
}

/** What a person typed in a date field, in their locale's order, as "YYYY-MM-DD"; null when it is no real date. */
export function parseDateInput(locale: string, text: string): string | null {
  const trimmed = text.trim();
  if (CALENDAR_DATE.test(trimmed)) return isCalendarDate(trimmed) ? trimmed : null;
  const shape = dateInputShape(locale);
  const pieces = trimmed.split(/\s*[./\-\s]\s*/).filter(Boolean);
  if (pieces.length !== 3 || pieces.some((p) => !/^\d+$/.test(p))) return null;
  const value: Record<string, string> = {};
  shape.order.forEach((t, i) => (value[t] = pieces[i]!));
  if (value.year!.length !== 4 || value.day!.length > 2 || value.month!.length > 2) return null;
  const iso = `${value.year}-${value.month!.padStart(2, "0")}-${value.day!.padStart(2, "0")}`;
  return isCalendarDate(iso) ? iso : null;
}
