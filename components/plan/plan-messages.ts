// What the room page and its plan worker say to each other (plain data, structured-clone safe).
import type { Point, Ring, Room } from "@/lib/geometry/types";
import type { RoomProblem } from "@/lib/geometry/room";

export interface PlanJob {
  id: number;
  room: Room;
  /** Metres a guard watches well; null = unlimited. */
  sightRange: number | null;
  doubleCover: boolean;
  /** Posts whose sight to draw and certify (the fewest plan's, when it is known for this room). */
  shownPosts: Point[] | null;
}

export interface PlanTriangle {
  corners: [Point, Point, Point];
  colours: [number, number, number];
}

export type PlanAnswer =
  | { id: number; ok: false; problems: RoomProblem[] }
  | {
      id: number;
      ok: true;
      /** Vertices n and obstacles h after normalisation. */
      vertices: number;
      obstacles: number;
      area: number;
      bound: number;
      triangles: PlanTriangle[];
      /** doubleCover: the posts are the corners of the two smallest colour classes. */
      guaranteed: { posts: Point[]; colour: number; doubleCover: boolean };
      /** Sight of `shownPosts` (or the guaranteed posts when none were given). */
      sight: {
        posts: Point[];
        regions: Ring[][][];
        covered: number;
        uncovered: Ring[][];
        /** The plan has more posts than the drawing shades (SIGHT_DRAWING_LIMIT): regions is empty. */
        regionsOmitted?: boolean;
      };
      ms: number;
    }
  | { id: number; ok: false; problems: []; failure: string };

/** Sight regions are drawn for plans of up to this many posts; beyond, the drawing would not read. */
export const SIGHT_DRAWING_LIMIT = 300;
