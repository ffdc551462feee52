// The heading of a shown week or day, in the site's locale (lib/format), not the library's words.
import { formatDate, formatDateRange, formatDay, type SiteFormat } from "@/lib/format";

export type CalendarView = "week" | "day";

export interface PeriodTitle {
  /** "Week of 7 Dec 2026" or "Mon, 7 Dec 2026". */
  title: string;
  /** "7 Dec 2026 – 13 Dec 2026" for a week; empty for a day. */
  range: string;
}

/** A "YYYY-MM-DD" date `days` later (or earlier), counted at noon so no clock change moves it. */
export function addCalendarDays(date: string, days: number): string {
  return new Date(Date.parse(`${date}T12:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

/** The Monday of a "YYYY-MM-DD" date's week (our weeks start on Monday, as rosters do). */
export function mondayOf(date: string): string {
  return addCalendarDays(date, -((new Date(`${date}T12:00:00Z`).getUTCDay() + 6) % 7));
}

/** `first` and `lastExclusive` are "YYYY-MM-DD" dates, as FullCalendar's currentStart/currentEnd. */
export function periodTitle(f: SiteFormat, view: CalendarView, first: string, lastExclusive: string): PeriodTitle {
  if (view === "day") return { title: formatDay(f, first), range: "" };
  return { title: `Week of ${formatDate(f, first)}`, range: formatDateRange(f, first, addCalendarDays(lastExclusive, -1)) };
}
