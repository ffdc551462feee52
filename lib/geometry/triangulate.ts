// Triangulation of a room with obstacles over its own vertices, O(n log n) worst case:
// 1. a top-down plane sweep splits the floor into y-monotone pieces (Lee & Preparata 1977; Garey,
//    Johnson, Preparata & Tarjan 1978), classifying corners as start, end, split, merge or regular
//    and keeping the walls that cross the sweep line in an AVL tree (sweep-status.ts); obstacles are just
//    more walls to the same sweep;
// 2. each piece is triangulated in linear time with a stack (Garey et al. 1978).
// Ties in y are broken by x (isAbove), every sign comes from exact predicates, and collinear
// vertices stay corners of strictly positive triangles: n + 2h - 2 triangles in all.
// The sweep runs along y or x, whichever the rings turn back on less often (chooseSweepAxis).
// All working arrays live in one reusable TriangulationWork: a call allocates only its result.
import type { Point, Ring, Room, Triangulation } from "./types";
import { orientXY } from "./predicates";
import { IndexSweepStatus } from "./sweep-status";
import { SweepOrderWork, sortTopDown, sweepsBefore as before } from "./sweep-order";

const enum Corner {
  Start,
  End,
  Split,
  Merge,
  RegularFloorRight,
  RegularFloorLeft,
}

// Shewchuk's first error bound for orient2d (1997), as robust-predicates uses it: a float
// determinant at least this far from zero has the exact sign.
const EPSILON = 1.1102230246251565e-16;
const ORIENT_ERROR_BOUND = (3 + 16 * EPSILON) * EPSILON;

/**
 * orient (predicates.ts) of corners a, b, c read from flat arrays, with the same floating-point
 * filter robust-predicates applies first, here inlined so the common case costs no call; only
 * near-zero determinants (collinear corners) go to the exact adaptive test.
 */
function orientAt(xs: Float64Array, ys: Float64Array, a: number, b: number, c: number): number {
  const ax = xs[a];
  const ay = ys[a];
  const bx = xs[b];
  const by = ys[b];
  const cx = xs[c];
  const cy = ys[c];
  const detLeft = (ay - cy) * (bx - cx);
  const detRight = (ax - cx) * (by - cy);
  const det = detLeft - detRight;
  if (Math.abs(det) >= ORIENT_ERROR_BOUND * Math.abs(detLeft + detRight)) return -det;
  return orientXY(ax, ay, bx, by, cx, cy);
}

/**
 * The working arrays of one triangulation, sized for `capacity` corners. One instance is kept and
 * reused from call to call (JavaScript runs one call at a time and none re-enters): for rooms of a
 * hundred corners, allocating twenty small typed arrays per call cost as much as the sweep itself.
 * Every array is written before it is read within a call, or cleared where a call needs zeros.
 */
class TriangulationWork {
  readonly xs: Float64Array;
  readonly ys: Float64Array;
  /** The ring links: wall v runs from corner v to next[v]. */
  readonly next: Int32Array;
  readonly prev: Int32Array;
  readonly order: Int32Array;
  readonly kind: Uint8Array;
  readonly helper: Int32Array;
  /** Diagonals: corners 2i and 2i + 1 are the ends of diagonal i (at most n: one per split or merge corner). */
  readonly ends: Int32Array;
  /** Edges around corners with diagonals: around[offset[v] .. offset[v + 1]), counter-clockwise. */
  readonly offset: Int32Array;
  readonly around: Int32Array;
  readonly fill: Int32Array;
  /** Walked half-edges: ring walls by their first corner, diagonal half-edges by their slot in `around`. */
  readonly wallDone: Uint8Array;
  readonly slotDone: Uint8Array;
  /** One piece at a time: its corners, then (for the stack) in sweep order with their chains. */
  readonly corners: Int32Array;
  readonly sorted: Int32Array;
  readonly chain: Uint8Array;
  readonly stack: Int32Array;
  readonly orderWork = new SweepOrderWork();
  readonly status = new IndexSweepStatus(0);

  constructor(readonly capacity: number) {
    const n = capacity;
    this.xs = new Float64Array(n);
    this.ys = new Float64Array(n);
    this.next = new Int32Array(n);
    this.prev = new Int32Array(n);
    this.order = new Int32Array(n);
    this.kind = new Uint8Array(n);
    this.helper = new Int32Array(n);
    this.ends = new Int32Array(2 * n);
    this.offset = new Int32Array(n + 1);
    // At most 2 ring edges per corner with diagonals plus both ends of every diagonal: 4n.
    this.around = new Int32Array(4 * n);
    this.fill = new Int32Array(n);
    this.wallDone = new Uint8Array(n);
    this.slotDone = new Uint8Array(4 * n);
    // A piece walks each of its walls once and each of its diagonals at most twice: under 3n.
    this.corners = new Int32Array(3 * n);
    this.sorted = new Int32Array(3 * n);
    this.chain = new Uint8Array(3 * n);
    this.stack = new Int32Array(3 * n);
  }
}

let shared = new TriangulationWork(64);
/** Above this many corners, a much smaller room gives the big arrays back instead of keeping them. */
const KEEP_LARGE_WORK = 1 << 16;

function workFor(n: number): TriangulationWork {
  // Room to grow up to KEEP_LARGE_WORK corners; beyond, exactly the size (about 220 bytes a corner).
  if (n > shared.capacity) shared = new TriangulationWork(Math.max(n, Math.min(2 * shared.capacity, KEEP_LARGE_WORK)));
  else if (shared.capacity > KEEP_LARGE_WORK && 8 * n < shared.capacity) shared = new TriangulationWork(Math.max(64, 2 * n));
  return shared;
}

/** Copy a ring's corners into the work arrays from corner `offset` on, linking them in a cycle. */
function loadRing(ring: Ring, offset: number, work: TriangulationWork, points: Point[]): void {
  const { xs, ys, next, prev } = work;
  const m = ring.length;
  for (let i = 0; i < m; i++) {
    const p = ring[i];
    const v = offset + i;
    points[v] = p;
    xs[v] = p[0];
    ys[v] = p[1];
    next[v] = v + 1;
    prev[v] = v - 1;
  }
  next[offset + m - 1] = offset;
  prev[offset] = offset + m - 1;
}

/**
 * Triangulate a normalised, valid room (see normaliseRoom and validateRoom): outline
 * counter-clockwise, obstacles clockwise. `points` are the outline's vertices then each obstacle's
 * in order; every triangle is counter-clockwise with strictly positive area.
 */
export function triangulate(room: Room): Triangulation {
  const { outline, obstacles } = room;
  let n = outline.length;
  for (let r = 0; r < obstacles.length; r++) n += obstacles[r].length;
  const work = workFor(n);
  // Both result arrays at their final size: growing them by push copied and re-touched their
  // storage several times, which was a large part of big rooms' time.
  const points: Point[] = new Array(n);
  loadRing(outline, 0, work, points);
  for (let r = 0, offset = outline.length; r < obstacles.length; offset += obstacles[r].length, r++) {
    loadRing(obstacles[r], offset, work, points);
  }
  const turns = chooseSweepAxis(work, n);
  const expected = Math.max(0, n + 2 * obstacles.length - 2);
  const triangles: [number, number, number][] = new Array(expected);
  let made: number;
  if (turns === 2 && obstacles.length === 0) {
    // One top and one bottom: the outline is already monotone, a single piece with no sweep.
    for (let v = 0; v < n; v++) work.corners[v] = v;
    made = triangulatePiece(work, n, triangles, 0);
  } else made = triangulatePieces(work, n, sweepDiagonals(work, n), triangles);
  // Only an invalid room makes another count; never hand out holes.
  if (made !== expected) triangles.length = made;
  return { points, triangles };
}

/**
 * Sweep along whichever axis the rings turn back on less often (counted in O(n)): every turn
 * (a corner both of whose neighbours lie on one side) is a start, end, split or merge corner, and
 * split and merge corners are what cost searches and diagonals, so a comb whose teeth point up is
 * swept left to right as one piece. Sweeping along x is the top-down sweep of the corners turned a
 * quarter turn, (x, y) -> (-y, x): negation is exact, so every orientation sign stays the same.
 * Returns the number of turns along the chosen axis.
 */
function chooseSweepAxis(work: TriangulationWork, n: number): number {
  const { xs, ys, next, prev } = work;
  let turnsY = 0;
  let turnsX = 0;
  for (let v = 0; v < n; v++) {
    const p = prev[v];
    const q = next[v];
    if (before(xs, ys, p, v) === before(xs, ys, q, v)) turnsY++;
    // The same order on the turned corners: x descending, ties by y descending.
    const pRight = xs[p] > xs[v] || (xs[p] === xs[v] && ys[p] > ys[v]);
    const qRight = xs[q] > xs[v] || (xs[q] === xs[v] && ys[q] > ys[v]);
    if (pRight === qRight) turnsX++;
  }
  if (turnsX >= turnsY) return turnsY;
  for (let v = 0; v < n; v++) {
    const x = xs[v];
    xs[v] = -ys[v];
    ys[v] = x;
  }
  return turnsX;
}

// The geometry wallLeftOfCorner reads, set at the start of each sweep: one comparison function for
// every sweep keeps the status's call site monomorphic and makes no closure per call.
let sweepXs: Float64Array = new Float64Array(0);
let sweepYs: Float64Array = new Float64Array(0);
let sweepNext: Int32Array = new Int32Array(0);

/** Whether the wall from corner `wall` to the next corner of its ring passes left of corner v. */
function wallLeftOfCorner(wall: number, v: number): boolean {
  return orientAt(sweepXs, sweepYs, wall, sweepNext[wall], v) > 0;
}

/**
 * The sweep of step 1: the diagonals that cut the floor into y-monotone pieces, written to
 * work.ends; returns how many. Walls in the status are those with floor to their right (they run
 * downward in ring order); each has a helper, the lowest corner above the sweep line that sees it
 * horizontally.
 */
function sweepDiagonals(work: TriangulationWork, n: number): number {
  const { xs, ys, next, prev, order, kind, helper, ends, status } = work;
  sortTopDown(xs, ys, n, order, work.orderWork);
  for (let v = 0; v < n; v++) {
    const p = prev[v];
    const q = next[v];
    const prevAbove = before(xs, ys, p, v);
    const nextAbove = before(xs, ys, q, v);
    if (prevAbove === nextAbove) {
      const convex = orientAt(xs, ys, p, v, q) > 0;
      if (!prevAbove) kind[v] = convex ? Corner.Start : Corner.Split;
      else kind[v] = convex ? Corner.End : Corner.Merge;
    } else kind[v] = prevAbove ? Corner.RegularFloorRight : Corner.RegularFloorLeft;
  }

  // Wall w runs from corner w to next[w]; the status holds such walls, keyed by their first corner.
  status.reset(n);
  sweepXs = xs;
  sweepYs = ys;
  sweepNext = next;
  let count = 0;
  for (let k = 0; k < n; k++) {
    const v = order[k];
    switch (kind[v]) {
      case Corner.Start:
        status.insert(v, wallLeftOfCorner, v);
        helper[v] = v;
        break;
      case Corner.End: {
        const ending = prev[v];
        if (kind[helper[ending]] === Corner.Merge) count = join(ends, count, v, helper[ending]);
        status.remove(ending);
        break;
      }
      case Corner.Split: {
        const left = wallLeftOf(status, v);
        count = join(ends, count, v, helper[left]);
        helper[left] = v;
        status.insert(v, wallLeftOfCorner, v);
        helper[v] = v;
        break;
      }
      case Corner.Merge: {
        const ending = prev[v];
        if (kind[helper[ending]] === Corner.Merge) count = join(ends, count, v, helper[ending]);
        status.remove(ending);
        const left = wallLeftOf(status, v);
        if (kind[helper[left]] === Corner.Merge) count = join(ends, count, v, helper[left]);
        helper[left] = v;
        break;
      }
      case Corner.RegularFloorRight: {
        const ending = prev[v];
        if (kind[helper[ending]] === Corner.Merge) count = join(ends, count, v, helper[ending]);
        // The wall from v continues the one ending at v: same place in the status, no search.
        status.replace(ending, v);
        helper[v] = v;
        break;
      }
      case Corner.RegularFloorLeft: {
        const left = wallLeftOf(status, v);
        if (kind[helper[left]] === Corner.Merge) count = join(ends, count, v, helper[left]);
        helper[left] = v;
        break;
      }
    }
  }
  return count;
}

/** The wall just left of corner v on the sweep line. */
function wallLeftOf(status: IndexSweepStatus, v: number): number {
  const wall = status.lastWhere(wallLeftOfCorner, v);
  if (wall < 0) throw new Error(`triangulate: no wall left of corner ${v}; is the room valid and normalised?`);
  return wall;
}

/** Record diagonal a-b as number `count`; returns the new count. */
function join(ends: Int32Array, count: number, a: number, b: number): number {
  ends[2 * count] = a;
  ends[2 * count + 1] = b;
  return count + 1;
}

/** Half-plane then exact orientation: whether direction centre->a comes before centre->b counter-clockwise from +x. */
function angularBefore(xs: Float64Array, ys: Float64Array, centre: number, a: number, b: number): boolean {
  const cx = xs[centre];
  const cy = ys[centre];
  const ha = ys[a] > cy || (ys[a] === cy && xs[a] > cx) ? 0 : 1;
  const hb = ys[b] > cy || (ys[b] === cy && xs[b] > cx) ? 0 : 1;
  if (ha !== hb) return ha < hb;
  return orientAt(xs, ys, centre, a, b) > 0;
}

/**
 * The faces cut out by walls and diagonals, each a counter-clockwise cycle of corners: the
 * y-monotone pieces, each triangulated (step 2) as soon as it is walked. A face is walked by
 * following, at each corner, the next edge clockwise from the one we arrived by (which keeps the
 * face on the left). Only corners with diagonals need their edges in angular order; at any other
 * corner the walk simply goes on along the ring.
 */
function triangulatePieces(work: TriangulationWork, n: number, count: number, out: [number, number, number][]): number {
  const { xs, ys, next, prev, ends, offset, around, fill, wallDone, slotDone } = work;
  // Around each corner with diagonals: its ring neighbours and diagonal ends, counter-clockwise.
  offset.fill(0, 0, n + 1);
  for (let e = 0; e < 2 * count; e++) offset[ends[e] + 1]++;
  for (let v = 0; v < n; v++) offset[v + 1] += offset[v] + (offset[v + 1] > 0 ? 2 : 0);
  fill.fill(0, 0, n);
  for (let d = 0; d < count; d++) {
    const a = ends[2 * d];
    const b = ends[2 * d + 1];
    if (fill[a] === 0) fill[a] = 2;
    if (fill[b] === 0) fill[b] = 2;
    around[offset[a] + fill[a]++] = b;
    around[offset[b] + fill[b]++] = a;
  }
  for (let v = 0; v < n; v++) {
    const from = offset[v];
    const to = offset[v + 1];
    if (from === to) continue;
    around[from] = next[v];
    around[from + 1] = prev[v];
    // Insertion sort: corners rarely have more than a handful of edges; a fan gets an O(k log k) sort.
    if (to - from <= 16) {
      for (let i = from + 1; i < to; i++) {
        const w = around[i];
        let j = i - 1;
        while (j >= from && angularBefore(xs, ys, v, w, around[j])) {
          around[j + 1] = around[j];
          j--;
        }
        around[j + 1] = w;
      }
    } else {
      const sorted = Array.from(around.subarray(from, to)).sort((a, b) =>
        angularBefore(xs, ys, v, a, b) ? -1 : angularBefore(xs, ys, v, b, a) ? 1 : 0,
      );
      around.set(sorted, from);
    }
  }
  wallDone.fill(0, 0, n);
  slotDone.fill(0, 0, offset[n]);
  let made = 0;
  for (let v = 0; v < n; v++) {
    if (!wallDone[v]) made = walkPiece(work, v, next[v], -1, out, made);
    for (let k = offset[v]; k < offset[v + 1]; k++) {
      const w = around[k];
      if (!slotDone[k] && w !== next[v] && w !== prev[v]) made = walkPiece(work, v, w, k, out, made);
    }
  }
  return made;
}

/**
 * Walk the face to the left of half-edge first -> firstTo (firstSlot: its place around `first`,
 * or -1 for a wall) into work.corners, then triangulate it into out[made ..); returns the new
 * number of triangles.
 */
function walkPiece(work: TriangulationWork, first: number, firstTo: number, firstSlot: number, out: [number, number, number][], made: number): number {
  const { next, offset, around, wallDone, slotDone, corners } = work;
  let m = 0;
  let from = first;
  let to = firstTo;
  let slot = firstSlot;
  for (;;) {
    if (slot < 0) {
      if (wallDone[from]) break;
      wallDone[from] = 1;
    } else {
      if (slotDone[slot]) break;
      slotDone[slot] = 1;
    }
    corners[m++] = from;
    // Next edge: the neighbour of `to` just clockwise from `from`.
    const lo = offset[to];
    const hi = offset[to + 1];
    if (lo === hi) {
      from = to;
      to = next[from];
      slot = -1;
    } else {
      let k = lo;
      while (around[k] !== from) {
        k++;
        if (k === hi) throw new Error("triangulate: an edge without its twin; is the room valid?");
      }
      k = k === lo ? hi - 1 : k - 1;
      const w = around[k];
      from = to;
      to = w;
      slot = w === next[from] ? -1 : k;
    }
  }
  return triangulatePiece(work, m, out, made);
}

const LEFT = 1;
const RIGHT = 2;

/**
 * Step 2: triangulate one y-monotone piece (a counter-clockwise cycle of corners) with a stack,
 * in linear time. The stack holds a chain that turns away from the floor (reflex or straight);
 * a corner on the same chain cuts off triangles only while they are strictly positive, so straight
 * runs of collinear corners wait on the stack and are fanned from the opposite chain later.
 * The piece is work.corners[0 .. m).
 */
function triangulatePiece(work: TriangulationWork, m: number, out: [number, number, number][], made: number): number {
  const { xs, ys, corners, sorted, chain, stack } = work;
  if (m < 3) throw new Error(`triangulate: a piece with ${m} corners; is the room valid?`);
  if (m === 3) return putTriangle(xs, ys, out, made, corners[0], corners[1], corners[2]);
  let top = 0;
  let bottom = 0;
  for (let i = 1; i < m; i++) {
    const c = corners[i];
    if (before(xs, ys, c, corners[top])) top = i;
    if (before(xs, ys, corners[bottom], c)) bottom = i;
  }
  // Counter-clockwise from the top runs down the left chain; from the bottom, up the right chain.
  let l = top;
  let r = top === 0 ? m - 1 : top - 1;
  sorted[0] = corners[top];
  chain[0] = LEFT | RIGHT;
  for (let k = 1; k < m; k++) {
    const nl = l + 1 === m ? 0 : l + 1;
    // Merge the two descending chains; the bottom corner closes both.
    if (nl !== bottom && (r === bottom || before(xs, ys, corners[nl], corners[r]))) {
      sorted[k] = corners[nl];
      chain[k] = LEFT;
      l = nl;
    } else if (r !== bottom) {
      sorted[k] = corners[r];
      chain[k] = RIGHT;
      r = r === 0 ? m - 1 : r - 1;
    } else {
      sorted[k] = corners[bottom];
      chain[k] = LEFT | RIGHT;
    }
  }

  stack[0] = 0;
  stack[1] = 1;
  let depth = 2;
  for (let j = 2; j < m - 1; j++) {
    const u = sorted[j];
    const side = chain[j];
    if ((side & chain[stack[depth - 1]]) === 0) {
      // Opposite chains: u sees every corner on the stack; fan them all from u.
      made = fanFrom(xs, ys, out, made, u, side, stack, depth, sorted);
      stack[0] = j - 1;
      stack[1] = j;
      depth = 2;
    } else {
      let last = stack[--depth];
      while (depth > 0) {
        const q = sorted[stack[depth - 1]];
        const p = sorted[last];
        if (side === LEFT) {
          if (!(orientAt(xs, ys, q, p, u) > 0)) break;
          out[made++] = [q, p, u];
        } else {
          if (!(orientAt(xs, ys, u, p, q) > 0)) break;
          out[made++] = [u, p, q];
        }
        last = stack[--depth];
      }
      stack[depth++] = last;
      stack[depth++] = j;
    }
  }
  // The bottom corner sees what is left on the stack.
  const bottomChain = chain[stack[depth - 1]] === LEFT ? RIGHT : LEFT;
  return fanFrom(xs, ys, out, made, sorted[m - 1], bottomChain, stack, depth, sorted);
}

/** Triangles from corner u (on chain `side`) to each consecutive pair of the stacked corners. */
function fanFrom(
  xs: Float64Array,
  ys: Float64Array,
  out: [number, number, number][],
  made: number,
  u: number,
  side: number,
  stack: Int32Array,
  depth: number,
  sorted: Int32Array,
): number {
  for (let i = 0; i + 1 < depth; i++) {
    const upper = sorted[stack[i]];
    const lower = sorted[stack[i + 1]];
    if (side === LEFT) made = putTriangle(xs, ys, out, made, u, lower, upper);
    else made = putTriangle(xs, ys, out, made, u, upper, lower);
  }
  return made;
}

/** Keep the counter-clockwise triangle as out[made]; a non-positive one means the input broke a precondition. */
function putTriangle(xs: Float64Array, ys: Float64Array, out: [number, number, number][], made: number, a: number, b: number, c: number): number {
  const o = orientAt(xs, ys, a, b, c);
  if (!(o > 0)) {
    throw new Error(
      `triangulate: corners ${a}, ${b}, ${c} would make a ${o === 0 ? "flat" : "clockwise"} triangle; is the room valid and normalised?`,
    );
  }
  out[made] = [a, b, c];
  return made + 1;
}
