// The bodies of the room and post-plan API, as zod schemas: the route handlers parse with them and
// the room page builds its requests from the same types, so the two cannot disagree.
import { z } from "zod";
import { bodyId, counter, idParam } from "@/lib/api/ids";
import { CORNER_LIMIT } from "../geometry/room";

const coordinate = z.number({ error: "coordinates must be numbers (metres)" }).refine(Number.isFinite, "coordinates must be finite numbers");
export const pointSchema = z.tuple([coordinate, coordinate], { error: "a point is [x, y] in metres" });
export const ringSchema = z.array(pointSchema).max(CORNER_LIMIT, `a ring may have at most ${CORNER_LIMIT.toLocaleString("en")} points`);

/** PUT /api/rooms/[roomId]: new walls, checked against the version the editor started from. */
export const roomWallsSchema = z.object({
  name: z.string().trim().min(1, "the room needs a name").max(120, "keep the name under 120 characters").optional(),
  outline: ringSchema,
  obstacles: z.array(ringSchema).max(2_000, "a room may have at most 2,000 obstacles"),
  version: counter("version"),
});
export type RoomWalls = z.infer<typeof roomWallsSchema>;

/** POST /api/rooms/[roomId]/post-plans: compute and store a proposed plan. */
export const postPlanRequestSchema = z.object({
  /** The exhibition the plan is for; its room settings give the default sight range and double cover. */
  exhibitionId: bodyId("exhibitionId").nullable().optional(),
  /** The room version the person was looking at; 409 when the walls changed since. */
  roomVersion: counter("roomVersion"),
  method: z.enum(["fewest", "guaranteed"]).optional(),
  /** Metres a guard watches well; null = unlimited; absent = the exhibition room's setting. */
  sightRange: z.number().positive("sight range must be more than 0 metres").max(1_000).nullable().optional(),
  doubleCover: z.boolean().optional(),
  pinned: z.array(pointSchema).max(100, "pin at most 100 posts").default([]),
  forbidden: z.array(ringSchema.min(3, "a forbidden zone needs at least 3 corners")).max(100, "at most 100 forbidden zones").default([]),
});
export type PostPlanRequest = z.input<typeof postPlanRequestSchema>;

/** POST /api/post-plans/preview (the sightlines engineer's route) answers at least these fields. */
export interface FewestPreview {
  posts: [number, number][];
  lowerBound?: number;
  proven?: boolean;
  covered?: number;
  uncovered?: [number, number][][][] | [number, number][][];
}

export const roomIdParams = z.object({ roomId: idParam("roomId") });
export const planIdParams = z.object({ planId: idParam("planId") });
