// Dates and times as the site's people read them: in the site's own time zone.
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";

export function siteTime(instant: Date | string, timeZone: string, pattern = "EEE d MMM, HH:mm"): string {
  return format(new TZDate(new Date(instant), timeZone), pattern);
}

/** "YYYY-MM-DD" as "d MMM yyyy" without moving the day. */
export function calendarDate(date: string): string {
  const [y, m, d] = date.split("-").map(Number);
  return format(new Date(y!, m! - 1, d!), "d MMM yyyy");
}
