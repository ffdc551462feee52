// The roster API's input, one zod schema each: they type the route handlers and drive the forms.
import { z } from "zod";
import { isMonday } from "./scenario";
import { bodyId, counter, idParam } from "@/lib/api/ids";

/** Dates the roster side accepts: a museum plans within this century, never year 0 or 9999. */
export const FIRST_YEAR = 2000;
export const LAST_YEAR = 2100;

const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "use a date like 2027-03-22")
  // 2027-02-30 has the right shape but is no day of the calendar.
  .refine((date) => {
    const day = new Date(`${date}T00:00:00Z`);
    return !Number.isNaN(day.getTime()) && day.toISOString().slice(0, 10) === date;
  }, "no such day in the calendar")
  .refine((date) => {
    const year = Number(date.slice(0, 4));
    return year >= FIRST_YEAR && year <= LAST_YEAR;
  }, `pick a date between ${FIRST_YEAR} and ${LAST_YEAR}`);
const monday = isoDate.refine(isMonday, "a roster week starts on a Monday; pick a Monday");
export const rosterIdSchema = z.object({ id: idParam("id") });

export const weekQuerySchema = z.object({ startsOn: monday });

export const buildRequestSchema = z.object({ startsOn: monday });
export type BuildRequestBody = z.infer<typeof buildRequestSchema>;

export const publishRequestSchema = z.object({
  revision: counter("revision"),
  /** Typed to confirm publishing with a room left empty (the room's name, as the review asks). */
  confirmation: z.string().max(200, "confirmation: at most 200 characters").optional(),
  /** Why the week is published anyway; kept with the version. */
  note: z.string().max(2000, "note: at most 2,000 characters").optional(),
});

export const reassignRequestSchema = z.object({
  revision: counter("revision"),
  from: z.object({
    /** Whose segment; null for an unfilled post-slot. */
    guardId: bodyId("guardId").nullable(),
    post: z.string().min(1, "post is required").max(100),
    start: z.iso.datetime({ offset: true, error: "start must be an ISO date-time, e.g. 2027-03-23T09:00:00.000Z" }),
  }),
  toGuardId: bodyId("toGuardId"),
});
export type ReassignRequestBody = z.infer<typeof reassignRequestSchema>;

/** GET /api/rosters/[id]/reassign?post=&start=[&guardId=]: the stretch whose possible guards to list. */
export const reassignOptionsQuerySchema = z.object({
  guardId: idParam("guardId").optional(),
  post: z.string().min(1, "post is required").max(100),
  start: z.iso.datetime({ offset: true, error: "start must be an ISO date-time, e.g. 2027-03-23T09:00:00.000Z" }),
});

/** A guard's request for days off: first and last day, inclusive, and a note for operations. */
export const timeOffRequestSchema = z
  .object({
    startsOn: isoDate,
    endsOn: isoDate,
    note: z.string().trim().max(500, "keep the note under 500 characters").default(""),
  })
  .refine((request) => request.endsOn >= request.startsOn, { path: ["endsOn"], message: "the last day off cannot be before the first" })
  .refine((request) => dayDifference(request.startsOn, request.endsOn) <= 62, { path: ["endsOn"], message: "ask for at most 62 days at once" });
export type TimeOffRequestBody = z.input<typeof timeOffRequestSchema>;

export const timeOffDecisionSchema = z.object({
  status: z.enum(["approved", "declined"], { error: "status must be approved or declined" }),
});

export const calendarTokenSchema = z.object({ token: z.string().regex(/^[0-9a-f]{64}$/, "not a calendar address") });

function dayDifference(from: string, to: string): number {
  return (Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000;
}

const isoInstant = (field: string) => z.iso.datetime({ offset: true, error: `${field} must be an ISO date-time, e.g. 2027-03-23T09:00:00.000Z` });

/** POST /api/rosters/[id]/adjust: one guard's segment moved in time and/or given to another guard. */
export const adjustRequestSchema = z
  .object({
    revision: counter("revision"),
    from: z.object({
      guardId: bodyId("guardId"),
      post: z.string().min(1, "post is required").max(100),
      start: isoInstant("start"),
    }),
    start: isoInstant("start"),
    end: isoInstant("end"),
    /** Another guard to take the segment; the same guard when left out. */
    toGuardId: bodyId("toGuardId").optional(),
    /** Why the change is kept although it breaks a labour rule; stored with who and when. */
    overrideNote: z.string().trim().max(500, "overrideNote: at most 500 characters").optional(),
  })
  .refine((body) => Date.parse(body.end) > Date.parse(body.start), { path: ["end"], message: "the end must come after the start" })
  .refine((body) => Date.parse(body.end) - Date.parse(body.start) <= 24 * 3_600_000, { path: ["end"], message: "a segment lasts at most 24 hours" });
export type AdjustRequestBody = z.input<typeof adjustRequestSchema>;
