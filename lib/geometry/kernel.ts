// The kernel of a room: the points that see all of it. For a simple polygon it is the intersection
// of the inner half-planes of its walls (Lee & Preparata, "An optimal algorithm for finding the
// kernel of a polygon", J. ACM 26(3), 1979); a point on the inner side of every wall sees every
// point of the polygon. Computed here by the half-plane intersection of the walls sorted by
// direction (O(n log n)); the candidate point it gives is then checked exactly with the robust
// orientation predicate against every wall, so rounding in the construction can only lose a
// kernel, never claim a false one.
// A room with an obstacle has no such point: from any point p, the ray from p through the
// obstacle's inside leaves the obstacle again into floor that the obstacle hides from p.
import { orientXY } from "./predicates";
import type { Point, Ring, Room } from "./types";

interface HalfPlane {
  /** A point on the boundary line and the line's direction; the kept side is on the left. */
  px: number;
  py: number;
  dx: number;
  dy: number;
  angle: number;
}

const cross = (ax: number, ay: number, bx: number, by: number) => ax * by - ay * bx;

function leftOf(h: HalfPlane, x: number, y: number): number {
  return cross(h.dx, h.dy, x - h.px, y - h.py);
}

function meet(a: HalfPlane, b: HalfPlane): Point {
  const d = cross(a.dx, a.dy, b.dx, b.dy);
  const t = cross(b.px - a.px, b.py - a.py, b.dx, b.dy) / d;
  return [a.px + t * a.dx, a.py + t * a.dy];
}

/**
 * The kernel of a counter-clockwise simple ring as a convex counter-clockwise ring (floating point),
 * or an empty ring when the half-planes leave no area. Sort by direction, keep the innermost of
 * parallel walls, sweep with a double-ended queue.
 */
export function kernelRing(outline: Ring): Ring {
  const n = outline.length;
  if (n < 3) return [];
  const planes: HalfPlane[] = [];
  for (let i = 0; i < n; i++) {
    const a = outline[i], b = outline[(i + 1) % n];
    const dx = b[0] - a[0], dy = b[1] - a[1];
    if (dx === 0 && dy === 0) continue;
    planes.push({ px: a[0], py: a[1], dx, dy, angle: Math.atan2(dy, dx) });
  }
  planes.sort((a, b) => a.angle - b.angle);
  // Of walls with the same direction only the innermost constrains.
  const lines: HalfPlane[] = [];
  for (const h of planes) {
    const last = lines[lines.length - 1];
    if (last && cross(last.dx, last.dy, h.dx, h.dy) === 0 && last.dx * h.dx + last.dy * h.dy > 0) {
      if (leftOf(last, h.px, h.py) > 0) lines[lines.length - 1] = h;
      continue;
    }
    lines.push(h);
  }
  const queue: HalfPlane[] = new Array(lines.length);
  const corners: Point[] = new Array(lines.length);
  let head = 0, tail = -1;
  for (const h of lines) {
    while (tail - head >= 1 && leftOf(h, corners[tail - 1][0], corners[tail - 1][1]) <= 0) tail--;
    while (tail - head >= 1 && leftOf(h, corners[head][0], corners[head][1]) <= 0) head++;
    queue[++tail] = h;
    if (tail - head >= 1) {
      const prev = queue[tail - 1];
      // Two consecutive walls turning by half a turn or more: nothing lies on the inner side of both.
      if (cross(prev.dx, prev.dy, h.dx, h.dy) <= 0) return [];
      corners[tail - 1] = meet(prev, h);
    }
  }
  while (tail - head >= 2 && leftOf(queue[head], corners[tail - 1][0], corners[tail - 1][1]) <= 0) tail--;
  if (tail - head < 2) return [];
  if (cross(queue[tail].dx, queue[tail].dy, queue[head].dx, queue[head].dy) <= 0) return [];
  corners[tail] = meet(queue[tail], queue[head]);
  const ring = corners.slice(head, tail + 1);
  return signedArea(ring) > 0 ? ring : [];
}

function signedArea(ring: Ring): number {
  let twice = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) twice += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
  return twice / 2;
}

/** The area centroid of a convex ring: strictly inside it when its area is positive. */
function centroid(ring: Ring): Point {
  let cx = 0, cy = 0, twice = 0;
  const [ox, oy] = ring[0];
  for (let i = 1; i + 1 < ring.length; i++) {
    const ax = ring[i][0] - ox, ay = ring[i][1] - oy, bx = ring[i + 1][0] - ox, by = ring[i + 1][1] - oy;
    const w = ax * by - ay * bx;
    twice += w;
    cx += w * (ax + bx);
    cy += w * (ay + by);
  }
  return [ox + cx / (3 * twice), oy + cy / (3 * twice)];
}

/** Exact: p lies strictly on the inner side of every wall of the counter-clockwise ring. */
export function strictlyInKernel(p: Point, outline: Ring): boolean {
  for (let i = 0, n = outline.length; i < n; i++) {
    const a = outline[i], b = outline[(i + 1) % n];
    if (orientXY(a[0], a[1], b[0], b[1], p[0], p[1]) <= 0) return false;
  }
  return true;
}

export interface RoomKernel {
  /** The kernel (floating point, convex, counter-clockwise). */
  ring: Ring;
  /** Kernel points checked exactly: each sees the whole room. */
  points: Point[];
}

/**
 * Points that see the whole room, or null when the room has none (an obstacle, or an outline that
 * is not star-shaped, or a kernel too thin to hold a checked point). `count` points are wanted
 * (two for double cover); `accept` may refuse points (a forbidden zone, out of sight range).
 */
export function roomKernel(room: Room, options: { count?: number; accept?: (p: Point) => boolean } = {}): RoomKernel | null {
  if (room.obstacles.length > 0) return null;
  const ring = kernelRing(room.outline);
  if (ring.length < 3) return null;
  const count = options.count ?? 1;
  const accept = options.accept ?? (() => true);
  const middle = centroid(ring);
  // The centroid first, then points a short, a middle and a long way towards the kernel's corners
  // (near the centroid for a sight range, apart from it for a second post).
  const tries: Point[] = [middle];
  const step = Math.max(1, Math.floor(ring.length / 16));
  for (const share of [0.05, 0.25, 0.5]) {
    for (let i = 0; i < ring.length; i += step) tries.push([middle[0] + share * (ring[i][0] - middle[0]), middle[1] + share * (ring[i][1] - middle[1])]);
  }
  const points: Point[] = [];
  for (const p of tries) {
    if (points.some((q) => q[0] === p[0] && q[1] === p[1])) continue;
    if (!strictlyInKernel(p, room.outline) || !accept(p)) continue;
    points.push(p);
    if (points.length === count) return { ring, points };
  }
  return null;
}
