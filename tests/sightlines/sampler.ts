// An independent check written for the tests (common practice: verify a geometric construction by
// brute force): point-in-room and segment visibility by plain floating-point tests against every
// wall, and a grid sampler of the room. Shares no code with lib/geometry's visibility or coverage.
import type { Point, Ring, Room } from "@/lib/geometry/types";

function insideRing(p: Point, ring: Ring): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i], [xj, yj] = ring[j];
    if (yi > p[1] !== yj > p[1] && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

export function insideRoom(p: Point, room: Room): boolean {
  return insideRing(p, room.outline) && !room.obstacles.some((o) => insideRing(p, o));
}

export function walls(room: Room): [Point, Point][] {
  const out: [Point, Point][] = [];
  for (const ring of [room.outline, ...room.obstacles]) for (let i = 0; i < ring.length; i++) out.push([ring[i], ring[(i + 1) % ring.length]]);
  return out;
}

function cross(a: Point, b: Point, c: Point): number {
  return (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
}

/** Distance from p to segment a-b. */
export function distanceToSegment(p: Point, a: Point, b: Point): number {
  const ex = b[0] - a[0], ey = b[1] - a[1];
  const l2 = ex * ex + ey * ey;
  const t = l2 > 0 ? Math.max(0, Math.min(1, ((p[0] - a[0]) * ex + (p[1] - a[1]) * ey) / l2)) : 0;
  return Math.hypot(p[0] - (a[0] + t * ex), p[1] - (a[1] + t * ey));
}

/**
 * Whether the segment from a post to a point stays in the room: it crosses no wall properly and a
 * few points along it lie inside (which rules out running along the outside of a wall).
 */
export function seesPoint(post: Point, q: Point, room: Room, wallList = walls(room)): boolean {
  for (const [a, b] of wallList) {
    const d1 = cross(a, b, post), d2 = cross(a, b, q), d3 = cross(post, q, a), d4 = cross(post, q, b);
    if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return false;
  }
  for (const t of [0.25, 0.5, 0.75]) {
    const m: Point = [post[0] + t * (q[0] - post[0]), post[1] + t * (q[1] - post[1])];
    if (!insideRoom(m, room) && !wallList.some(([a, b]) => distanceToSegment(m, a, b) < 1e-9)) return false;
  }
  return true;
}

/** A jittered grid of points inside the room, kept `margin` metres clear of every wall. */
export function samplePoints(room: Room, count: number, margin = 1e-4, seed = 1): Point[] {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const [x, y] of room.outline) {
    minX = Math.min(minX, x);
    maxX = Math.max(maxX, x);
    minY = Math.min(minY, y);
    maxY = Math.max(maxY, y);
  }
  let state = seed;
  const random = () => ((state = (state * 1103515245 + 12345) % 2147483648) / 2147483648);
  const side = Math.sqrt(((maxX - minX) * (maxY - minY)) / count);
  const wallList = walls(room);
  const out: Point[] = [];
  for (let y = minY + side / 2; y < maxY; y += side) {
    for (let x = minX + side / 2; x < maxX; x += side) {
      const p: Point = [x + (random() - 0.5) * side * 0.5, y + (random() - 0.5) * side * 0.5];
      if (insideRoom(p, room) && wallList.every(([a, b]) => distanceToSegment(p, a, b) > margin)) out.push(p);
    }
  }
  return out;
}

/** How many posts see p (within `range` metres when given). */
export function watchers(p: Point, posts: Point[], room: Room, range = Infinity, wallList = walls(room)): number {
  return posts.filter((post) => Math.hypot(post[0] - p[0], post[1] - p[1]) <= range && seesPoint(post, p, room, wallList)).length;
}

/** Whether p lies in polygon `ring`, and how far it is from its boundary. */
export function inRegion(p: Point, ring: Ring): { inside: boolean; gap: number } {
  let gap = Infinity;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) gap = Math.min(gap, distanceToSegment(p, ring[j], ring[i]));
  return { inside: insideRing(p, ring), gap };
}
