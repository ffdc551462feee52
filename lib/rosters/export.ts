// A roster as a CSV file (RFC 4180) and as a day's sign-in sheet, in the site's time zone.
// Pure functions over the roster view, so the route, the page and the tests share them.
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";

export const ROSTER_CSV_COLUMNS = ["date", "start", "end", "guard", "post", "room", "break"] as const;
export type RosterCsvRow = Record<(typeof ROSTER_CSV_COLUMNS)[number], string>;

/** What the export needs of a roster (a subset of RosterView). */
export interface ExportableRoster {
  timeZone: string;
  posts: { id: string; label: string; room?: string }[];
  shifts: { guardId: number; guardName: string; start: string; end: string; segments: { post: string; start: string; end: string }[]; breaks: { start: string; end: string }[] }[];
}

// OWASP "CSV Injection": a cell starting with = + - @ tab or carriage return may run as a
// formula in a spreadsheet; a leading apostrophe makes it text.
const FORMULA_START = /^[=+\-@\t\r]/;

/** One cell, safe to open in a spreadsheet and quoted as RFC 4180 asks. */
export function csvCell(value: string): string {
  const safe = FORMULA_START.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

export function toCsv(header: readonly string[], rows: readonly Record<string, string>[]): string {
  const lines = [header.map(csvCell).join(","), ...rows.map((row) => header.map((column) => csvCell(row[column] ?? "")).join(","))];
  return lines.join("\r\n") + "\r\n";
}

const local = (iso: string, zone: string, pattern: string) => format(new TZDate(new Date(iso), zone), pattern);

/**
 * One row per assignment: each stretch a guard stands at a post, and each break (post and room
 * empty, break "yes"), in time order, then by guard name.
 */
export function rosterCsvRows(roster: ExportableRoster): RosterCsvRow[] {
  const zone = roster.timeZone;
  const posts = new Map(roster.posts.map((p) => [p.id, p]));
  const rows: (RosterCsvRow & { at: number })[] = [];
  for (const shift of roster.shifts) {
    for (const s of shift.segments) {
      const post = posts.get(s.post);
      rows.push({
        at: Date.parse(s.start),
        date: local(s.start, zone, "yyyy-MM-dd"),
        start: local(s.start, zone, "HH:mm"),
        end: local(s.end, zone, "HH:mm"),
        guard: shift.guardName,
        post: post?.label ?? s.post,
        room: post?.room ?? "",
        break: "no",
      });
    }
    for (const b of shift.breaks)
      rows.push({
        at: Date.parse(b.start),
        date: local(b.start, zone, "yyyy-MM-dd"),
        start: local(b.start, zone, "HH:mm"),
        end: local(b.end, zone, "HH:mm"),
        guard: shift.guardName,
        post: "",
        room: "",
        break: "yes",
      });
  }
  rows.sort((a, b) => a.at - b.at || a.guard.localeCompare(b.guard));
  return rows.map(({ at: _at, ...row }) => row);
}

export function rosterCsv(roster: ExportableRoster): string {
  return toCsv(ROSTER_CSV_COLUMNS, rosterCsvRows(roster));
}

export interface SignInLine {
  guardName: string;
  start: string;
  end: string;
  firstPost: string;
  breaks: string;
}

/** The guards on duty on a local date, by shift start: the lines of that day's sign-in sheet. */
export function signInLines(roster: ExportableRoster, date: string): SignInLine[] {
  const zone = roster.timeZone;
  const labels = new Map(roster.posts.map((p) => [p.id, p.label]));
  return roster.shifts
    .filter((s) => local(s.start, zone, "yyyy-MM-dd") === date)
    .sort((a, b) => Date.parse(a.start) - Date.parse(b.start) || a.guardName.localeCompare(b.guardName))
    .map((s) => {
      const first = [...s.segments].sort((a, b) => Date.parse(a.start) - Date.parse(b.start))[0];
      return {
        guardName: s.guardName,
        start: local(s.start, zone, "HH:mm"),
        end: local(s.end, zone, "HH:mm"),
        firstPost: first ? (labels.get(first.post) ?? first.post) : "",
        breaks: s.breaks.map((b) => `${local(b.start, zone, "HH:mm")}–${local(b.end, zone, "HH:mm")}`).join(", "),
      };
    });
}
