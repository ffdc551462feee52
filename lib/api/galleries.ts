// The bodies of the sites, floors and rooms API as zod schemas: the route handlers parse with them
// and the galleries forms validate with the same ones (react-hook-form + zodResolver).
import { z } from "zod";
import { bodyId, counter, idParam } from "@/lib/api/ids";
import { pointSchema, ringSchema } from "@/lib/api/plan-input";
import { isCurrency, isTimeZone } from "@/lib/format";

const name = (what: string) =>
  z.string({ error: `give the ${what} a name` }).trim().min(1, `give the ${what} a name`).max(120, "keep the name under 120 characters");

export const siteCreateSchema = z.object({
  name: name("site"),
  timeZone: z.string().trim().refine(isTimeZone, "use an IANA time zone such as Europe/Berlin"),
  // ISO 4217: three capital letters that Intl.NumberFormat knows.
  currency: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, "use a three-letter ISO 4217 code such as EUR")
    .refine(isCurrency, "that is not an ISO 4217 currency code"),
  hourlyRate: z.coerce.number({ error: "the hourly rate is a number" }).min(0, "the hourly rate cannot be negative").max(10_000, "the hourly rate looks too high"),
});
export type SiteCreate = z.infer<typeof siteCreateSchema>;
export type SiteCreateInput = z.input<typeof siteCreateSchema>;

export const renameSchema = z.object({ name: name("item") });
export type Rename = z.infer<typeof renameSchema>;

export const floorCreateSchema = z.object({
  siteId: bodyId("siteId"),
  name: name("floor"),
  level: z.coerce.number({ error: "the level is a whole number, 0 for the ground floor" }).int("the level is a whole number, 0 for the ground floor").min(-20).max(200),
});
export type FloorCreateInput = z.input<typeof floorCreateSchema>;

export const floorUpdateSchema = z
  .object({
    name: name("floor").optional(),
    level: z.coerce.number().int("the level is a whole number, 0 for the ground floor").min(-20).max(200).optional(),
  })
  .refine((v) => v.name !== undefined || v.level !== undefined, "send a new name or level");

/** A new room: a name and walls; without walls it starts as a rectangle `width` × `depth` metres. */
export const roomCreateSchema = z
  .object({
    floorId: bodyId("floorId"),
    name: name("room"),
    outline: ringSchema.optional(),
    obstacles: z.array(ringSchema).max(2_000).default([]),
    width: z.coerce.number().positive("the width is more than 0 m").max(1_000, "keep the width under 1,000 m").optional(),
    depth: z.coerce.number().positive("the depth is more than 0 m").max(1_000, "keep the depth under 1,000 m").optional(),
  })
  .refine((v) => v.outline !== undefined || (v.width !== undefined && v.depth !== undefined), {
    message: "give the room an outline, or a width and depth in metres",
    path: ["width"],
  });
export type RoomCreateInput = z.input<typeof roomCreateSchema>;

export const roomPlaceSchema = z
  .object({ name: name("room").optional(), floorId: bodyId("floorId").optional() })
  .refine((v) => v.name !== undefined || v.floorId !== undefined, "send a new name or floor");

export const orderSchema = z.object({
  ids: z.array(bodyId("ids")).min(1, "send the ids in their new order").max(10_000),
});

/** DELETE …?confirm=yes deletes even a room in use. */
export const deleteQuerySchema = z.object({ confirm: z.enum(["yes"]).optional() });

export const restoreSchema = z.object({
  /** The room version the person was looking at; 409 when someone saved since. */
  currentVersion: counter("currentVersion"),
});

export const siteIdParams = z.object({ siteId: idParam("siteId") });
export const floorIdParams = z.object({ floorId: idParam("floorId") });
export const roomVersionParams = z.object({ roomId: idParam("roomId"), version: idParam("version") });

export { pointSchema };
