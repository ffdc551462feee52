// Exact geometric predicates: every decision in lib/geometry that depends on a sign goes through here,
// so collinear and nearly collinear input (orthogonal rooms, equal coordinates) is never misjudged.
import { orient2d } from "robust-predicates";
import type { Point } from "./types";

/**
 * Orientation of the triple a, b, c, computed exactly (Shewchuk's adaptive arithmetic via the
 * `robust-predicates` package). Sign convention: > 0 when c lies to the LEFT of the directed line
 * a -> b (a, b, c counter-clockwise), < 0 when to the right (clockwise), exactly 0 when collinear.
 * The magnitude is twice the signed area of the triangle (approximately, when not exactly zero).
 * robust-predicates' own orient2d uses the opposite sign, hence the minus.
 */
export function orient(a: Point, b: Point, c: Point): number {
  return -orient2d(a[0], a[1], b[0], b[1], c[0], c[1]);
}

/** orient on bare coordinates (same sign convention), for hot loops over typed arrays. */
export function orientXY(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return -orient2d(ax, ay, bx, by, cx, cy);
}

/** Sign of orient as -1, 0 or 1. */
export function orientSign(a: Point, b: Point, c: Point): -1 | 0 | 1 {
  const o = orient(a, b, c);
  return o > 0 ? 1 : o < 0 ? -1 : 0;
}

/** Same coordinates exactly. */
export function samePoint(a: Point, b: Point): boolean {
  return a[0] === b[0] && a[1] === b[1];
}

/**
 * Sweep order used by validation and triangulation: a point is "above" another when its y is larger,
 * ties broken by the smaller x (lexicographic), so no two distinct points are ever level.
 */
export function isAbove(a: Point, b: Point): boolean {
  return a[1] > b[1] || (a[1] === b[1] && a[0] < b[0]);
}

/** Comparator for sorting points from the top of the sweep down (see isAbove). */
export function compareTopDown(a: Point, b: Point): number {
  if (a[1] !== b[1]) return b[1] - a[1];
  return a[0] - b[0];
}

/** Lexicographic comparator (x, then y): the left-to-right sweep order of validation. */
export function compareLeftRight(a: Point, b: Point): number {
  if (a[0] !== b[0]) return a[0] - b[0];
  return a[1] - b[1];
}

/**
 * Whether p, known to be collinear with a and b, lies within the closed segment a-b.
 * Exact: only comparisons of the input coordinates.
 */
export function onSegmentIfCollinear(a: Point, b: Point, p: Point): boolean {
  return (
    Math.min(a[0], b[0]) <= p[0] &&
    p[0] <= Math.max(a[0], b[0]) &&
    Math.min(a[1], b[1]) <= p[1] &&
    p[1] <= Math.max(a[1], b[1])
  );
}

/** Whether p lies on the closed segment a-b, exactly. */
export function onSegment(a: Point, b: Point, p: Point): boolean {
  return orient(a, b, p) === 0 && onSegmentIfCollinear(a, b, p);
}

/**
 * Whether closed segments a-b and c-d share at least one point, decided exactly
 * (the classic four-orientation test with collinear special cases).
 */
export function segmentsMeet(a: Point, b: Point, c: Point, d: Point): boolean {
  const o1 = orientSign(a, b, c);
  const o2 = orientSign(a, b, d);
  const o3 = orientSign(c, d, a);
  const o4 = orientSign(c, d, b);
  if (o1 !== o2 && o3 !== o4 && o1 * o2 <= 0 && o3 * o4 <= 0) {
    if (o1 !== 0 || o2 !== 0) return true;
  }
  if (o1 === 0 && onSegmentIfCollinear(a, b, c)) return true;
  if (o2 === 0 && onSegmentIfCollinear(a, b, d)) return true;
  if (o3 === 0 && onSegmentIfCollinear(c, d, a)) return true;
  if (o4 === 0 && onSegmentIfCollinear(c, d, b)) return true;
  return false;
}

/**
 * A point where segments a-b and c-d meet (approximate: for messages and markers only; the
 * decision that they meet is made exactly by segmentsMeet). Collinear overlaps give an endpoint
 * inside the overlap.
 */
export function meetingPoint(a: Point, b: Point, c: Point, d: Point): Point {
  if (onSegment(c, d, a)) return [a[0], a[1]];
  if (onSegment(c, d, b)) return [b[0], b[1]];
  if (onSegment(a, b, c)) return [c[0], c[1]];
  if (onSegment(a, b, d)) return [d[0], d[1]];
  const rx = b[0] - a[0];
  const ry = b[1] - a[1];
  const sx = d[0] - c[0];
  const sy = d[1] - c[1];
  const denom = rx * sy - ry * sx;
  const t = denom === 0 ? 0 : ((c[0] - a[0]) * sy - (c[1] - a[1]) * sx) / denom;
  return [a[0] + t * rx, a[1] + t * ry];
}

/** Twice the signed area of a ring (shoelace): > 0 for counter-clockwise. */
export function ringDoubleArea(ring: readonly Point[]): number {
  let sum = 0;
  const n = ring.length;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    sum += (ring[j][0] - ring[i][0]) * (ring[j][1] + ring[i][1]);
  }
  return sum;
}

/** Signed area of a ring (shoelace), square metres; > 0 for counter-clockwise. */
export function ringArea(ring: readonly Point[]): number {
  return ringDoubleArea(ring) / 2;
}

/**
 * Orientation of a ring: the exact sign of orient at its lowest-leftmost vertex, which is a convex
 * corner of any simple ring; if that corner is degenerate (invalid input), the shoelace sign.
 */
export function ringOrientation(ring: readonly Point[]): -1 | 0 | 1 {
  const n = ring.length;
  if (n < 3) return 0;
  let low = 0;
  for (let i = 1; i < n; i++) {
    const p = ring[i];
    const q = ring[low];
    if (p[1] < q[1] || (p[1] === q[1] && p[0] < q[0])) low = i;
  }
  const s = orientSign(ring[(low - 1 + n) % n], ring[low], ring[(low + 1) % n]);
  if (s !== 0) return s;
  const a = ringDoubleArea(ring);
  return a > 0 ? 1 : a < 0 ? -1 : 0;
}
