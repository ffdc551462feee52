// The fewest plan's lower bound: witnesses whose visibility regions are pairwise disjoint.
//
// Why it is a proof: a post at point p sees witness w exactly when p lies in w's visibility region
// V(w) (sight is symmetric). If V(w1), ..., V(wk) are pairwise disjoint closed sets, no point lies
// in two of them, so no post sees two of these witnesses and any plan that sees the whole room
// needs at least k posts (2k for double cover; pinned posts counted as below). We pick the largest
// such set among the witnesses we have by an integer program (maximum weight independent set in
// the conflict graph, HiGHS); any independent set it returns, optimal or not, is a valid bound.
//
// Rounding: region corners are constructed in floating point (about 1e-15 of the room's size off),
// so two regions count as disjoint only when they stay more than APART_MARGIN × the room's size
// apart; touching or nearly touching regions conflict. With a sight range the regions are clipped
// to a disc polygon drawn around the true disc (circumscribed), so they are never too small.
import type { Point, Ring } from "../geometry/types";
import type { Region } from "../geometry/coverage";
import { insideClosedRing } from "./constraints";
import { solveBinaryProgram } from "./fewest-solver";

/** Regions closer than this share of the room's size are taken to touch. */
export const APART_MARGIN = 1e-9;

export interface BoundWitness {
  point: Point;
  /** The witness's visibility region, never smaller than the truth. */
  region: Region;
  /** Posts this witness still needs from outside the pinned ones (1, or 2 for double cover). */
  weight: number;
  /**
   * Optional bitset of sample posts known to see this witness. Two witnesses seen from one post
   * conflict for sure, which spares the geometric test; a missed bit only costs that test.
   */
  seenFrom?: Uint32Array;
}

function shareAPost(a: Uint32Array | undefined, b: Uint32Array | undefined): boolean {
  if (!a || !b) return false;
  for (let i = 0, n = Math.min(a.length, b.length); i < n; i++) if ((a[i] & b[i]) !== 0) return true;
  return false;
}

interface Shape {
  rings: Ring[];
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

function ringArea(ring: Ring): number {
  let twice = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) twice += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
  return twice / 2;
}

function shapeOf(region: Region): Shape {
  const rings = region.map((polygon) => polygon[0]);
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const ring of rings) {
    for (const [x, y] of ring) {
      if (x < minX) minX = x;
      if (y < minY) minY = y;
      if (x > maxX) maxX = x;
      if (y > maxY) maxY = y;
    }
  }
  return { rings, minX, minY, maxX, maxY };
}

function segmentGap2(ax: number, ay: number, bx: number, by: number, px: number, py: number): number {
  const ex = bx - ax, ey = by - ay;
  const length2 = ex * ex + ey * ey;
  const t = length2 > 0 ? Math.max(0, Math.min(1, ((px - ax) * ex + (py - ay) * ey) / length2)) : 0;
  const dx = ax + t * ex - px, dy = ay + t * ey - py;
  return dx * dx + dy * dy;
}

function cross(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
}

/** Whether two segments cross or come within `margin` of each other. */
function segmentsNear(a: Point, b: Point, c: Point, d: Point, margin: number): boolean {
  const m2 = margin * margin;
  if (Math.max(a[0], b[0]) + margin < Math.min(c[0], d[0]) || Math.max(c[0], d[0]) + margin < Math.min(a[0], b[0])) return false;
  if (Math.max(a[1], b[1]) + margin < Math.min(c[1], d[1]) || Math.max(c[1], d[1]) + margin < Math.min(a[1], b[1])) return false;
  const d1 = cross(a[0], a[1], b[0], b[1], c[0], c[1]);
  const d2 = cross(a[0], a[1], b[0], b[1], d[0], d[1]);
  const d3 = cross(c[0], c[1], d[0], d[1], a[0], a[1]);
  const d4 = cross(c[0], c[1], d[0], d[1], b[0], b[1]);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return true;
  return (
    segmentGap2(a[0], a[1], b[0], b[1], c[0], c[1]) <= m2 ||
    segmentGap2(a[0], a[1], b[0], b[1], d[0], d[1]) <= m2 ||
    segmentGap2(c[0], c[1], d[0], d[1], a[0], a[1]) <= m2 ||
    segmentGap2(c[0], c[1], d[0], d[1], b[0], b[1]) <= m2
  );
}

/** Whether two closed regions meet or come within `margin`: then one post could see both witnesses. */
export function regionsMeet(p: Shape, q: Shape, margin: number): boolean {
  if (p.maxX + margin < q.minX || q.maxX + margin < p.minX || p.maxY + margin < q.minY || q.maxY + margin < p.minY) return false;
  // One inside the other: a corner of one lies in the other.
  for (const ring of q.rings) if (p.rings.some((r) => insideClosedRing(ring[0], r))) return true;
  for (const ring of p.rings) if (q.rings.some((r) => insideClosedRing(ring[0], r))) return true;
  for (const r of p.rings) {
    for (const s of q.rings) {
      for (let i = 0, j = r.length - 1; i < r.length; j = i++) {
        const a = r[j], b = r[i];
        const lo = Math.min(a[0], b[0]) - margin, hi = Math.max(a[0], b[0]) + margin;
        if (hi < q.minX || lo > q.maxX) continue;
        for (let k = 0, l = s.length - 1; k < s.length; l = k++) {
          if (segmentsNear(a, b, s[l], s[k], margin)) return true;
        }
      }
    }
  }
  return false;
}

export interface LowerBound {
  /** No plan meeting the demand has fewer posts than this. */
  bound: number;
  /** The pairwise independent witnesses that prove it. */
  witnesses: Point[];
}

/**
 * The largest-weight set of witnesses with pairwise disjoint regions (plus the pinned posts, which
 * any plan contains). `scale` is the room's size in metres, for the rounding margin.
 */
export function independentWitnessBound(
  witnesses: BoundWitness[],
  options: { scale: number; pinned: number; seconds: number; maxWitnesses?: number; nodes?: number },
): LowerBound {
  // Smallest regions first: they pack best, and the pool is cut after the first maxWitnesses of
  // them (a count, so the bound is the same on any machine; the clock is only a safety net).
  const sized = witnesses
    .filter((w) => w.weight > 0 && w.region.length > 0)
    .map((w) => ({ w, area: w.region.reduce((sum, polygon) => sum + Math.abs(ringArea(polygon[0])), 0) }))
    .sort((a, b) => a.area - b.area);
  const margin = APART_MARGIN * options.scale;
  const stopAt = performance.now() + 500 * options.seconds;
  const maxWitnesses = options.maxWitnesses ?? Infinity;
  const useful: BoundWitness[] = [];
  const shapes: Shape[] = [];
  const conflicts: number[][] = [];
  for (const { w } of sized) {
    if (useful.length >= maxWitnesses || performance.now() > stopAt) break;
    const shape = shapeOf(w.region);
    const i = useful.length;
    for (let j = 0; j < i; j++) {
      if (shareAPost(useful[j].seenFrom, w.seenFrom) || regionsMeet(shapes[j], shape, margin)) conflicts.push([j, i]);
    }
    useful.push(w);
    shapes.push(shape);
  }
  const answer = solveBinaryProgram({
    sense: "maximise",
    weights: useful.map((w) => w.weight),
    atMostOne: conflicts,
    seconds: Math.max(0.1, (stopAt - performance.now()) / 1000 + options.seconds / 2),
    nodes: options.nodes,
  });
  // Independence is re-checked, so even an unfinished solver answer stays a proof.
  const clash = new Set(conflicts.map(([a, b]) => a * useful.length + b));
  const apart = (i: number, j: number) => !clash.has(Math.min(i, j) * useful.length + Math.max(i, j));
  const solverChoice: number[] = [];
  for (const i of answer.chosen) if (solverChoice.every((j) => apart(i, j))) solverChoice.push(i);
  // A greedy packing (fewest conflicts first) stands in when the solver found nothing in time.
  const degree = new Array(useful.length).fill(0);
  for (const [a, b] of conflicts) {
    degree[a]++;
    degree[b]++;
  }
  const greedy: number[] = [];
  for (const i of useful.map((_, k) => k).sort((a, b) => degree[a] / useful[a].weight - degree[b] / useful[b].weight)) {
    if (greedy.every((j) => apart(i, j))) greedy.push(i);
  }
  const weightOf = (set: number[]) => set.reduce((sum, i) => sum + useful[i].weight, 0);
  const chosen = weightOf(solverChoice) >= weightOf(greedy) ? solverChoice : greedy;
  const bound = options.pinned + chosen.reduce((sum, i) => sum + useful[i].weight, 0);
  return { bound, witnesses: chosen.map((i) => useful[i].point) };
}
