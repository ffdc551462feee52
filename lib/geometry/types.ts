// Shared shapes of the geometry core: every module in lib/geometry and lib/guarding speaks these.

/** A point in the building's planar frame, metres: [x, y]. */
export type Point = [number, number];

/** A closed ring of points; the closing point is not repeated. */
export type Ring = Point[];

/** A gallery: its outline (ring 0) and its obstacles (holes: vitrines, plinths, pillars, partitions). */
export interface Room {
  outline: Ring;
  obstacles: Ring[];
}

/**
 * A room's triangulation over its own vertices. `points` lists the outline's vertices first, then
 * each obstacle's in order; `triangles` index into `points`, counter-clockwise.
 */
export interface Triangulation {
  points: Point[];
  triangles: [number, number, number][];
}
