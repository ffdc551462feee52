// Exhibitions as the API and the editor's form accept them (pure zod, shared).
import { z } from "zod";
import { idParam } from "@/lib/api/ids";
import { isCalendarDate } from "@/lib/format";

const date = (what: string) =>
  z
    .string({ error: `give the ${what} date` })
    .refine(isCalendarDate, `the ${what} date must be a day of the calendar, e.g. 2027-03-01`)
    .refine((d) => d >= "2000-01-01" && d <= "2100-12-31", `the ${what} date must lie between 2000 and 2100`);

export const exhibitionRoomSchema = z.object({
  roomId: z.number().int().positive().max(2_147_483_647),
  riskLevel: z.enum(["standard", "high"], { error: "the risk level is standard or high" }),
  /** Metres a guard can watch well; null for no limit. */
  sightRange: z.number().min(0.5, "a sight range is at least 0.5 m").max(200, "a sight range is at most 200 m").nullable(),
  doubleCover: z.boolean(),
});

const fields = {
  name: z.string({ error: "give the exhibition a name" }).trim().min(1, "give the exhibition a name").max(200, "keep the name under 200 characters"),
  startsOn: date("opening"),
  endsOn: date("closing"),
  rooms: z
    .array(exhibitionRoomSchema)
    .max(500, "at most 500 rooms")
    .refine((rooms) => new Set(rooms.map((r) => r.roomId)).size === rooms.length, "a room is listed twice; list each room once"),
};

const ordered = (v: { startsOn: string; endsOn: string }) => v.endsOn >= v.startsOn;
const order = { message: "the exhibition cannot close before it opens", path: ["endsOn"] };

export const exhibitionCreateSchema = z.object({ siteId: z.number().int().positive().max(2_147_483_647), ...fields }).refine(ordered, order);
export const exhibitionUpdateSchema = z.object(fields).refine(ordered, order);
export type ExhibitionUpdate = z.infer<typeof exhibitionUpdateSchema>;

export const exhibitionIdParams = z.object({
  id: idParam("id"),
});
