// GET /api/me/shifts: the signed-in guard's own published shifts between two dates of the site.
import { z } from "zod";
import type { Kysely } from "kysely";
import type { Database, ShiftBreak } from "@/db/schema";
import { publishedShiftsOfGuardBetween } from "@/db/queries/guard-shifts";
import { siteById } from "@/db/queries/rosters";
import { addLocalDays, localToInstant } from "@/lib/scheduling/time";
import { postLabel, roomsOfScenario } from "./shift-events";

import { FIRST_YEAR, LAST_YEAR } from "./schemas";

export const MAX_RANGE_DAYS = 93;

const isoDate = (field: string) =>
  z
    .string({ error: `${field} is required, a date like 2027-03-22` })
    .regex(/^\d{4}-\d{2}-\d{2}$/, `${field} must be a date like 2027-03-22`)
    .refine((date) => {
      const day = new Date(`${date}T00:00:00Z`);
      return !Number.isNaN(day.getTime()) && day.toISOString().slice(0, 10) === date;
    }, "no such day in the calendar")
    .refine((date) => {
      const year = Number(date.slice(0, 4));
      return year >= FIRST_YEAR && year <= LAST_YEAR;
    }, `${field}: pick a date between ${FIRST_YEAR} and ${LAST_YEAR}`);

const daysFromTo = (from: string, to: string) => (Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000 + 1;

/**
 * ?from=&to=, both inclusive site dates, at most 93 days. Strict: no guard id can be passed, so a
 * guard asks only for their own shifts.
 */
export const myShiftsQuerySchema = z
  .strictObject({ from: isoDate("from"), to: isoDate("to") }, { error: (issue) => (issue.code === "unrecognized_keys" ? `only from and to are accepted; you see your own shifts only` : undefined) })
  .refine((q) => q.to >= q.from, { path: ["to"], message: "to cannot be before from" })
  .refine((q) => daysFromTo(q.from, q.to) <= MAX_RANGE_DAYS, { path: ["to"], message: `ask for at most ${MAX_RANGE_DAYS} days at once` });
export type MyShiftsQuery = z.output<typeof myShiftsQuerySchema>;

export interface MyShift {
  id: number;
  start: string;
  end: string;
  rosterId: number;
  rosterVersion: number;
  weekOf: string;
  segments: { post: string; label: string; start: string; end: string }[];
  breaks: ShiftBreak[];
}

/** The guard's shifts from the latest published rosters overlapping the site dates [from, to]. */
export async function myShifts(db: Kysely<Database>, guard: { id: number; site_id: number }, query: MyShiftsQuery) {
  const site = await siteById(db, guard.site_id);
  const zone = site?.time_zone ?? "UTC";
  const from = new Date(localToInstant(zone, query.from));
  const to = new Date(localToInstant(zone, addLocalDays(zone, query.to, 1)));
  const rows = await publishedShiftsOfGuardBetween(db, guard.id, from, to);
  const shifts: MyShift[] = rows.map((row) => {
    const rooms = roomsOfScenario(row.scenario);
    return {
      id: row.id,
      start: row.starts_at.toISOString(),
      end: row.ends_at.toISOString(),
      rosterId: row.roster_id,
      rosterVersion: row.roster_version,
      weekOf: row.starts_on,
      segments: row.segments.map((s) => ({ post: s.post, label: postLabel(s.post, rooms), start: s.start, end: s.end })),
      breaks: row.breaks,
    };
  });
  return { timeZone: zone, from: query.from, to: query.to, shifts };
}
