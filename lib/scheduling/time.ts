// Wall-clock times of the site's zone <-> real instants (ms since epoch), so durations are real elapsed time across clock changes.
import { TZDate } from "@date-fns/tz";
import { addDays, format } from "date-fns";

export const HOUR = 3_600_000;
export const MINUTE = 60_000;

/** The instant of a local wall-clock time; a time skipped by a spring change moves forward (02:30 -> 03:30). */
export function localToInstant(zone: string, date: string, clock = "00:00"): number {
  const [y, m, d] = date.split("-").map(Number);
  const [hh, mm] = clock.split(":").map(Number);
  if (hh === 24) return localToInstant(zone, addLocalDays(zone, date, 1), `00:${String(mm).padStart(2, "0")}`);
  return new TZDate(y, m - 1, d, hh, mm, zone).getTime();
}

/** Parses `YYYY-MM-DDTHH:mm` in the zone. */
export function parseLocal(zone: string, local: string): number {
  return localToInstant(zone, local.slice(0, 10), local.slice(11, 16));
}

/** Formats an instant as the zone's wall clock `YYYY-MM-DDTHH:mm` (scripts/README.md output form). */
export function formatLocal(zone: string, instant: number): string {
  return format(new TZDate(instant, zone), "yyyy-MM-dd'T'HH:mm");
}

/** `HH:mm` of an instant in the zone, for messages. */
export function formatClock(zone: string, instant: number): string {
  return format(new TZDate(instant, zone), "HH:mm");
}

/** The calendar date `days` after `date` in the zone (a wall-clock day, 23, 24 or 25 real hours). */
export function addLocalDays(zone: string, date: string, days: number): string {
  const [y, m, d] = date.split("-").map(Number);
  return format(addDays(new TZDate(y, m - 1, d, 12, 0, zone), days), "yyyy-MM-dd");
}

/** 0 = Monday ... 6 = Sunday. */
export function weekdayIndex(zone: string, date: string): number {
  const [y, m, d] = date.split("-").map(Number);
  return (new TZDate(y, m - 1, d, 12, 0, zone).getDay() + 6) % 7;
}

/** Real hours between two instants. */
export function hoursBetween(start: number, end: number): number {
  return (end - start) / HOUR;
}
