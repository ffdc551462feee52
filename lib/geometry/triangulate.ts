// Triangulation of a room with obstacles over its own vertices, O(n log n) worst case:
// 1. a top-down plane sweep splits the floor into y-monotone pieces (Lee & Preparata 1977; Garey,
//    Johnson, Preparata & Tarjan 1978), classifying corners as start, end, split, merge or regular
//    and keeping the walls that cross the sweep line in an ordered skip list; obstacles are just
//    more walls to the same sweep;
// 2. each piece is triangulated in linear time with a stack (Garey et al. 1978).
// Ties in y are broken by x (isAbove), every sign comes from exact predicates, and collinear
// vertices stay corners of strictly positive triangles: n + 2h - 2 triangles in all.
import type { Point, Room, Triangulation } from "./types";
import { orientXY } from "./predicates";
import { IndexSweepStatus } from "./sweep-status";

const enum Corner {
  Start,
  End,
  Split,
  Merge,
  RegularFloorRight,
  RegularFloorLeft,
}

/** The room's corners as one array with ring links; walls run from a corner to its `next`. */
interface RoomGraph {
  points: Point[];
  next: Int32Array;
  prev: Int32Array;
  /** Coordinates as flat arrays (filled by roomGraph): the hot loops read these, not points. */
  xs?: Float64Array;
  ys?: Float64Array;
}

/** The room graph with its flat coordinates, filling them in when a caller built it without. */
interface FlatGraph {
  points: Point[];
  next: Int32Array;
  prev: Int32Array;
  xs: Float64Array;
  ys: Float64Array;
}

function flatGraph(graph: RoomGraph): FlatGraph {
  if (graph.xs !== undefined && graph.ys !== undefined) return graph as FlatGraph;
  const n = graph.points.length;
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  for (let v = 0; v < n; v++) {
    xs[v] = graph.points[v][0];
    ys[v] = graph.points[v][1];
  }
  return { points: graph.points, next: graph.next, prev: graph.prev, xs, ys };
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

function roomGraph(room: Room): RoomGraph {
  const rings = [room.outline, ...room.obstacles];
  const n = rings.reduce((sum, ring) => sum + ring.length, 0);
  const points: Point[] = new Array(n);
  const next = new Int32Array(n);
  const prev = new Int32Array(n);
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  let offset = 0;
  for (const ring of rings) {
    const m = ring.length;
    for (let i = 0; i < m; i++) {
      const p = ring[i];
      points[offset + i] = p;
      xs[offset + i] = p[0];
      ys[offset + i] = p[1];
      next[offset + i] = i + 1 === m ? offset : offset + i + 1;
      prev[offset + i] = i === 0 ? offset + m - 1 : offset + i - 1;
    }
    offset += m;
  }
  return { points, next, prev, xs, ys };
}

/**
 * Triangulate a normalised, valid room (see normaliseRoom and validateRoom): outline
 * counter-clockwise, obstacles clockwise. `points` are the outline's vertices then each obstacle's
 * in order; every triangle is counter-clockwise with strictly positive area.
 */
export function triangulate(room: Room): Triangulation {
  const graph = flatGraph(roomGraph(room));
  const diagonals = sweepDiagonals(graph);
  const triangles: [number, number, number][] = [];
  walkPieces(graph, diagonals, (corners, start, m, scratch) =>
    triangulatePieceAt(graph.xs, graph.ys, corners, start, m, triangles, scratch),
  );
  return { points: graph.points, triangles };
}

/** Diagonals as a flat list: corners 2i and 2i + 1 of the list are the ends of diagonal i. */
interface DiagonalList {
  ends: Int32Array;
  count: number;
}

/**
 * The sweep of step 1: the diagonals that cut the floor into y-monotone pieces. Walls in the
 * status are those with floor to their right (they run downward in ring order); each has a helper,
 * the lowest corner above the sweep line that sees it horizontally.
 */
function sweepDiagonals(graph: FlatGraph): DiagonalList {
  const { next, prev, xs, ys } = graph;
  const n = xs.length;
  const order = sweepOrder(xs, ys);
  const kind = new Uint8Array(n);
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
  const status = new IndexSweepStatus(n);
  const helper = new Int32Array(n).fill(-1);
  // At most one diagonal per split or merge corner and one per end or regular corner below a merge.
  const ends = new Int32Array(2 * n);
  let count = 0;
  // One comparison function for the whole sweep (no closure per corner): is this wall left of v?
  // Coordinates from flat typed arrays: the status search is memory-bound on big rooms.
  const leftOf = (wall: number, v: number) => orientAt(xs, ys, wall, next[wall], v) > 0;
  const wallLeftOf = (v: number): number => {
    const wall = status.lastWhere(leftOf, v);
    if (wall < 0) throw new Error(`triangulate: no wall left of corner ${v}; is the room valid and normalised?`);
    return wall;
  };
  const insertWall = (v: number) => {
    status.insert(v, leftOf, v);
    helper[v] = v;
  };
  const removeWall = (wall: number) => status.remove(wall);
  const join = (a: number, b: number) => {
    ends[2 * count] = a;
    ends[2 * count + 1] = b;
    count++;
  };
  const joinIfMerge = (v: number, wall: number) => {
    if (kind[helper[wall]] === Corner.Merge) join(v, helper[wall]);
  };

  for (let k = 0; k < n; k++) {
    const v = order[k];
    switch (kind[v]) {
      case Corner.Start:
        insertWall(v);
        break;
      case Corner.End:
        joinIfMerge(v, prev[v]);
        removeWall(prev[v]);
        break;
      case Corner.Split: {
        const left = wallLeftOf(v);
        join(v, helper[left]);
        helper[left] = v;
        insertWall(v);
        break;
      }
      case Corner.Merge: {
        joinIfMerge(v, prev[v]);
        removeWall(prev[v]);
        const left = wallLeftOf(v);
        joinIfMerge(v, left);
        helper[left] = v;
        break;
      }
      case Corner.RegularFloorRight:
        joinIfMerge(v, prev[v]);
        // The wall from v continues the one ending at v: same place in the status, no search.
        status.replace(prev[v], v);
        helper[v] = v;
        break;
      case Corner.RegularFloorLeft: {
        const left = wallLeftOf(v);
        joinIfMerge(v, left);
        helper[left] = v;
        break;
      }
    }
  }
  return { ends, count };
}

/** Whether corner a comes before corner b in the top-down sweep (isAbove on coordinate arrays). */
function before(xs: Float64Array, ys: Float64Array, a: number, b: number): boolean {
  return ys[a] > ys[b] || (ys[a] === ys[b] && xs[a] < xs[b]);
}

/**
 * Corner indices in top-down sweep order (y descending, ties by x ascending): a bottom-up merge
 * sort over typed arrays, O(n log n) worst case, several times faster than Array#sort with a
 * comparator on small rooms, where it was the sweep's largest cost.
 */
export function sweepOrder(xs: Float64Array, ys: Float64Array): Int32Array {
  const n = xs.length;
  let a = new Int32Array(n);
  let b = new Int32Array(n);
  for (let v = 0; v < n; v++) a[v] = v;
  const RUN = 12;
  for (let lo = 0; lo < n; lo += RUN) {
    const hi = Math.min(lo + RUN, n);
    for (let i = lo + 1; i < hi; i++) {
      const w = a[i];
      let j = i - 1;
      while (j >= lo && before(xs, ys, w, a[j])) {
        a[j + 1] = a[j];
        j--;
      }
      a[j + 1] = w;
    }
  }
  for (let width = RUN; width < n; width *= 2) {
    for (let lo = 0; lo < n; lo += 2 * width) {
      const mid = Math.min(lo + width, n);
      const hi = Math.min(lo + 2 * width, n);
      let i = lo;
      let j = mid;
      let k = lo;
      while (i < mid && j < hi) b[k++] = before(xs, ys, a[j], a[i]) ? a[j++] : a[i++];
      while (i < mid) b[k++] = a[i++];
      while (j < hi) b[k++] = a[j++];
    }
    const swap = a;
    a = b;
    b = swap;
  }
  return a;
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

/** Scratch buffers of the piece triangulation, sized for the largest piece. */
interface PieceScratch {
  sorted: Int32Array;
  chain: Uint8Array;
  stack: Int32Array;
}

/**
 * The faces cut out by walls and diagonals, each a counter-clockwise cycle of corners: the
 * y-monotone pieces, handed to `visit` one at a time as corners[start .. start + m). Built by
 * following, at each corner, the next edge clockwise from the one we arrived by (which keeps the
 * face on the left). Only corners with diagonals need their edges in angular order; at any other
 * corner the walk simply goes on along the ring.
 */
function walkPieces(
  graph: FlatGraph,
  diagonals: DiagonalList,
  visit: (corners: Int32Array, start: number, m: number, scratch: PieceScratch) => void,
): void {
  const { next, prev, xs, ys } = graph;
  const n = xs.length;
  const { ends, count } = diagonals;
  // Around each corner with diagonals: its ring neighbours and diagonal ends, counter-clockwise.
  const offset = new Int32Array(n + 1);
  for (let e = 0; e < 2 * count; e++) offset[ends[e] + 1]++;
  for (let v = 0; v < n; v++) offset[v + 1] += offset[v] + (offset[v + 1] > 0 ? 2 : 0);
  const around = new Int32Array(offset[n]);
  const fill = new Int32Array(n);
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
  // Walked half-edges: ring walls by their first corner, diagonal half-edges by their slot.
  const wallDone = new Uint8Array(n);
  const slotDone = new Uint8Array(offset[n]);
  // Each wall is walked once and each diagonal twice, so the pieces hold n + 2 * count corners.
  const corners = new Int32Array(n + 2 * count);
  let longest = 3;
  const starts: number[] = [];
  let used = 0;
  // Walk the face to the left of half-edge from -> to (slot: its place around `from`, or -1 for a wall).
  const walk = (first: number, firstTo: number, firstSlot: number) => {
    const start = used;
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
      corners[used++] = from;
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
    const m = used - start;
    if (m > longest) longest = m;
    starts.push(start, m);
  };
  for (let v = 0; v < n; v++) {
    if (!wallDone[v]) walk(v, next[v], -1);
    for (let k = offset[v]; k < offset[v + 1]; k++) {
      const w = around[k];
      if (!slotDone[k] && w !== next[v] && w !== prev[v]) walk(v, w, k);
    }
  }
  const scratch: PieceScratch = { sorted: new Int32Array(longest), chain: new Uint8Array(longest), stack: new Int32Array(longest) };
  for (let i = 0; i < starts.length; i += 2) visit(corners, starts[i], starts[i + 1], scratch);
}

const LEFT = 1;
const RIGHT = 2;

/**
 * Step 2: triangulate one y-monotone piece (a counter-clockwise cycle of corners) with a stack,
 * in linear time. The stack holds a chain that turns away from the floor (reflex or straight);
 * a corner on the same chain cuts off triangles only while they are strictly positive, so straight
 * runs of collinear corners wait on the stack and are fanned from the opposite chain later.
 * The piece is corners[start .. start + m), with coordinates from the flat arrays.
 */
function triangulatePieceAt(
  xs: Float64Array,
  ys: Float64Array,
  corners: Int32Array,
  start: number,
  m: number,
  out: [number, number, number][],
  scratch: PieceScratch,
): void {
  if (m < 3) throw new Error(`triangulate: a piece with ${m} corners; is the room valid?`);
  if (m === 3) {
    pushTriangle(xs, ys, out, corners[start], corners[start + 1], corners[start + 2]);
    return;
  }
  let top = 0;
  let bottom = 0;
  for (let i = 1; i < m; i++) {
    const c = corners[start + i];
    if (before(xs, ys, c, corners[start + top])) top = i;
    if (before(xs, ys, corners[start + bottom], c)) bottom = i;
  }
  // Counter-clockwise from the top runs down the left chain; from the bottom, up the right chain.
  const { sorted, chain, stack } = scratch;
  let l = top;
  let r = top === 0 ? m - 1 : top - 1;
  sorted[0] = corners[start + top];
  chain[0] = LEFT | RIGHT;
  for (let k = 1; k < m; k++) {
    const nl = l + 1 === m ? 0 : l + 1;
    // Merge the two descending chains; the bottom corner closes both.
    if (nl !== bottom && (r === bottom || before(xs, ys, corners[start + nl], corners[start + r]))) {
      sorted[k] = corners[start + nl];
      chain[k] = LEFT;
      l = nl;
    } else if (r !== bottom) {
      sorted[k] = corners[start + r];
      chain[k] = RIGHT;
      r = r === 0 ? m - 1 : r - 1;
    } else {
      sorted[k] = corners[start + bottom];
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
      fanFrom(xs, ys, out, u, side, stack, depth, sorted);
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
          out.push([q, p, u]);
        } else {
          if (!(orientAt(xs, ys, u, p, q) > 0)) break;
          out.push([u, p, q]);
        }
        last = stack[--depth];
      }
      stack[depth++] = last;
      stack[depth++] = j;
    }
  }
  // The bottom corner sees what is left on the stack.
  const bottomChain = chain[stack[depth - 1]] === LEFT ? RIGHT : LEFT;
  fanFrom(xs, ys, out, sorted[m - 1], bottomChain, stack, depth, sorted);
}

/** Triangles from corner u (on chain `side`) to each consecutive pair of the stacked corners. */
function fanFrom(
  xs: Float64Array,
  ys: Float64Array,
  out: [number, number, number][],
  u: number,
  side: number,
  stack: Int32Array,
  depth: number,
  sorted: Int32Array,
): void {
  for (let i = 0; i + 1 < depth; i++) {
    const upper = sorted[stack[i]];
    const lower = sorted[stack[i + 1]];
    if (side === LEFT) pushTriangle(xs, ys, out, u, lower, upper);
    else pushTriangle(xs, ys, out, u, upper, lower);
  }
}

/** Keep the counter-clockwise triangle; a non-positive one means the input broke a precondition. */
function pushTriangle(xs: Float64Array, ys: Float64Array, out: [number, number, number][], a: number, b: number, c: number): void {
  const o = orientAt(xs, ys, a, b, c);
  if (!(o > 0)) {
    throw new Error(
      `triangulate: corners ${a}, ${b}, ${c} would make a ${o === 0 ? "flat" : "clockwise"} triangle; is the room valid and normalised?`,
    );
  }
  out.push([a, b, c]);
}
