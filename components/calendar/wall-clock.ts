// FullCalendar runs without a time-zone plugin, in the browser's zone: we hand it the site's
// wall-clock times without offset and read its local dates back as the site's calendar dates.
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";

/** The site's wall-clock time of an instant, without offset, which FullCalendar places as given. */
export function wallClock(instant: string | Date, timeZone: string): string {
  return format(new TZDate(new Date(instant), timeZone), "yyyy-MM-dd'T'HH:mm:ss");
}

/** A date FullCalendar reports (local midnight of a shown day) as the "YYYY-MM-DD" it stands for. */
export function calendarDay(date: Date): string {
  return format(date, "yyyy-MM-dd");
}

/** A time FullCalendar reports (local wall clock) as "HH:mm", for lib/format's formatClock. */
export function calendarClock(date: Date): string {
  return format(date, "HH:mm");
}
