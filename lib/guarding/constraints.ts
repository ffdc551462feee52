// A museum's conditions on a post plan: posts pinned where they must stay, zones where no post may
// stand (exits, evacuation routes, doorways), how far a guard watches well, and double cover for
// high-risk rooms. Checked here so every planner and every answer obeys the same rules.
import type { Point, Ring, Room } from "../geometry/types";
import type { Sightlines } from "../geometry/visibility";

export interface PostConstraints {
  /** Posts that stay exactly where they are given (a desk, a fixed chair). */
  pinned?: Point[];
  /** Polygons (outer rings) where no post may stand, boundary included. */
  forbidden?: Ring[];
  /** Metres a guard watches well; unlimited when absent. */
  sightRange?: number;
  /** Every point seen by two posts. */
  doubleCover?: boolean;
}

export interface ConstraintProblem {
  code: "pinned-outside-room" | "pinned-in-forbidden-zone" | "forbidden-zone-invalid" | "sight-range-invalid";
  message: string;
  at?: Point;
}

function fmt(p: Point): string {
  return `(${+p[0].toFixed(3)}, ${+p[1].toFixed(3)})`;
}

/** Whether p lies in the closed polygon `ring` (inside or on its boundary). */
export function insideClosedRing(p: Point, ring: Ring): boolean {
  const [x, y] = p;
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    // On the edge (within a nanometre): counts as inside, because a zone's boundary is part of it.
    const ex = xi - xj, ey = yi - yj;
    const length2 = ex * ex + ey * ey;
    const t = length2 > 0 ? Math.max(0, Math.min(1, ((x - xj) * ex + (y - yj) * ey) / length2)) : 0;
    if (Math.hypot(x - (xj + t * ex), y - (yj + t * ey)) <= 1e-9) return true;
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** Whether a post may stand at p: not in any forbidden zone. */
export function allowedPost(p: Point, constraints: PostConstraints): boolean {
  return !(constraints.forbidden ?? []).some((zone) => insideClosedRing(p, zone));
}

/** Problems a person can act on: a pinned post outside the room, in a forbidden zone, a bad zone or range. */
export function checkConstraints(room: Room, sightlines: Sightlines, constraints: PostConstraints): ConstraintProblem[] {
  const problems: ConstraintProblem[] = [];
  const range = constraints.sightRange;
  if (range !== undefined && !(Number.isFinite(range) && range > 0)) {
    problems.push({ code: "sight-range-invalid", message: `sight range must be a positive number of metres, not ${range}` });
  }
  (constraints.forbidden ?? []).forEach((zone, i) => {
    const finite = zone.every((p) => Number.isFinite(p[0]) && Number.isFinite(p[1]));
    if (zone.length < 3 || !finite) {
      problems.push({ code: "forbidden-zone-invalid", message: `forbidden zone ${i + 1} needs at least 3 points with finite coordinates`, at: zone[0] });
    }
  });
  (constraints.pinned ?? []).forEach((post, i) => {
    if (!sightlines.contains(post)) {
      problems.push({ code: "pinned-outside-room", message: `pinned post ${i + 1} at ${fmt(post)} is outside the room or inside an obstacle`, at: post });
    } else if (!allowedPost(post, constraints)) {
      problems.push({ code: "pinned-in-forbidden-zone", message: `pinned post ${i + 1} at ${fmt(post)} stands in a forbidden zone`, at: post });
    }
  });
  void room;
  return problems;
}
