// Triangulation of a room with obstacles over its own vertices, O(n log n) worst case:
// 1. a top-down plane sweep splits the floor into y-monotone pieces (Lee & Preparata 1977; Garey,
//    Johnson, Preparata & Tarjan 1978), classifying corners as start, end, split, merge or regular
//    and keeping the walls that cross the sweep line in an ordered skip list; obstacles are just
//    more walls to the same sweep;
// 2. each piece is triangulated in linear time with a stack (Garey et al. 1978).
// Ties in y are broken by x (isAbove), every sign comes from exact predicates, and collinear
// vertices stay corners of strictly positive triangles: n + 2h - 2 triangles in all.
import type { Point, Room, Triangulation } from "./types";
import { isAbove, orient, orientXY } from "./predicates";
import { SweepStatus, type StatusNode } from "./sweep-status";

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
}

function roomGraph(room: Room): RoomGraph {
  const rings = [room.outline, ...room.obstacles];
  const n = rings.reduce((sum, ring) => sum + ring.length, 0);
  const points: Point[] = new Array(n);
  const next = new Int32Array(n);
  const prev = new Int32Array(n);
  let offset = 0;
  for (const ring of rings) {
    const m = ring.length;
    for (let i = 0; i < m; i++) {
      points[offset + i] = ring[i];
      next[offset + i] = offset + ((i + 1) % m);
      prev[offset + i] = offset + ((i - 1 + m) % m);
    }
    offset += m;
  }
  return { points, next, prev };
}

/**
 * Triangulate a normalised, valid room (see normaliseRoom and validateRoom): outline
 * counter-clockwise, obstacles clockwise. `points` are the outline's vertices then each obstacle's
 * in order; every triangle is counter-clockwise with strictly positive area.
 */
export function triangulate(room: Room): Triangulation {
  const graph = roomGraph(room);
  const diagonals = monotoneDiagonals(graph);
  const pieces = monotonePieces(graph, diagonals);
  const triangles: [number, number, number][] = [];
  // One scratch buffer for all pieces: allocating per piece dominated small rooms.
  let longest = 0;
  for (const piece of pieces) if (piece.length > longest) longest = piece.length;
  const scratch = { sorted: new Int32Array(longest), chain: new Uint8Array(longest) };
  for (const piece of pieces) triangulateMonotonePiece(graph.points, piece, triangles, scratch);
  return { points: graph.points, triangles };
}

/**
 * The sweep of step 1: the diagonals that cut the floor into y-monotone pieces. Walls in the
 * status are those with floor to their right (they run downward in ring order); each has a helper,
 * the lowest corner above the sweep line that sees it horizontally.
 */
export function monotoneDiagonals(graph: RoomGraph): [number, number][] {
  const { points, next, prev } = graph;
  const n = points.length;
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  for (let v = 0; v < n; v++) {
    xs[v] = points[v][0];
    ys[v] = points[v][1];
  }
  const order = sweepOrder(xs, ys);
  const kind = new Uint8Array(n);
  for (let v = 0; v < n; v++) {
    const prevAbove = isAbove(points[prev[v]], points[v]);
    const nextAbove = isAbove(points[next[v]], points[v]);
    const convex = orient(points[prev[v]], points[v], points[next[v]]) > 0;
    if (!prevAbove && !nextAbove) kind[v] = convex ? Corner.Start : Corner.Split;
    else if (prevAbove && nextAbove) kind[v] = convex ? Corner.End : Corner.Merge;
    else kind[v] = prevAbove ? Corner.RegularFloorRight : Corner.RegularFloorLeft;
  }

  // Wall w runs from corner w to next[w]; the status holds such walls, keyed by their first corner.
  const status = new SweepStatus<number>();
  const nodeOf: (StatusNode<number> | null)[] = new Array(n).fill(null);
  const helper = new Int32Array(n).fill(-1);
  const diagonals: [number, number][] = [];
  // One comparison function for the whole sweep (no closure per corner): is this wall left of v?
  // Coordinates from flat typed arrays: the status search is memory-bound on big rooms.
  const leftOf = (wall: number, v: number) => {
    const w = next[wall];
    return orientXY(xs[wall], ys[wall], xs[w], ys[w], xs[v], ys[v]) > 0;
  };
  const wallLeftOf = (v: number): number => {
    const node = status.lastWhere(leftOf, v);
    if (node === null) throw new Error(`triangulate: no wall left of corner ${v}; is the room valid and normalised?`);
    return node.item;
  };
  const insertWall = (v: number) => {
    nodeOf[v] = status.insert(v, leftOf, v);
    helper[v] = v;
  };
  const removeWall = (wall: number) => {
    status.remove(nodeOf[wall]!);
    nodeOf[wall] = null;
  };
  const joinIfMerge = (v: number, wall: number) => {
    if (kind[helper[wall]] === Corner.Merge) diagonals.push([v, helper[wall]]);
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
        diagonals.push([v, helper[left]]);
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
        removeWall(prev[v]);
        insertWall(v);
        break;
      case Corner.RegularFloorLeft: {
        const left = wallLeftOf(v);
        joinIfMerge(v, left);
        helper[left] = v;
        break;
      }
    }
  }
  return diagonals;
}

/** 0 for directions from the centre in the upper half-plane (with +x), 1 for the lower (with -x). */
function halfPlane(centre: Point, p: Point): number {
  return p[1] > centre[1] || (p[1] === centre[1] && p[0] > centre[0]) ? 0 : 1;
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

/** Half-plane then exact orientation: sorts directions around a centre counter-clockwise from +x. */
function angularCompare(centre: Point, a: Point, b: Point): number {
  const ha = halfPlane(centre, a);
  const hb = halfPlane(centre, b);
  if (ha !== hb) return ha - hb;
  return -orient(centre, a, b);
}

/**
 * The faces cut out by walls and diagonals, each a counter-clockwise cycle of corners: the
 * y-monotone pieces. Built from the planar graph by following, at each corner, the next edge
 * clockwise from the one we arrived by (which keeps the face on the left).
 */
export function monotonePieces(graph: RoomGraph, diagonals: [number, number][]): number[][] {
  const { points, next } = graph;
  const n = points.length;
  const degree = new Int32Array(n + 1);
  for (let v = 0; v < n; v++) {
    degree[v]++;
    degree[next[v]]++;
  }
  for (let d = 0; d < diagonals.length; d++) {
    degree[diagonals[d][0]]++;
    degree[diagonals[d][1]]++;
  }
  const offset = new Int32Array(n + 1);
  for (let v = 0; v < n; v++) offset[v + 1] = offset[v] + degree[v];
  const fill = offset.slice(0, n);
  const target = new Int32Array(offset[n]);
  const add = (a: number, b: number) => {
    target[fill[a]++] = b;
    target[fill[b]++] = a;
  };
  for (let v = 0; v < n; v++) add(v, next[v]);
  for (let d = 0; d < diagonals.length; d++) add(diagonals[d][0], diagonals[d][1]);

  // Sort each corner's neighbours counter-clockwise.
  const source = new Int32Array(offset[n]);
  for (let v = 0; v < n; v++) {
    const from = offset[v];
    const to = offset[v + 1];
    source.fill(v, from, to);
    if (to - from <= 2) {
      // Two edges: the walk takes "the other one" either way; no order needed.
    } else if (to - from <= 12) {
      // Insertion sort: corners rarely have more than a handful of edges.
      const centre = points[v];
      for (let i = from + 1; i < to; i++) {
        const w = target[i];
        let j = i - 1;
        while (j >= from && angularCompare(centre, points[target[j]], points[w]) > 0) {
          target[j + 1] = target[j];
          j--;
        }
        target[j + 1] = w;
      }
    } else {
      const around = Array.from(target.subarray(from, to)).sort((a, b) => angularCompare(points[v], points[a], points[b]));
      target.set(around, from);
    }
  }
  // Twin of each half-edge (the same edge walked the other way): a scan of the far corner's few
  // neighbours; corners with many (a fan of diagonals) get a lookup table so this stays linear.
  const twin = new Int32Array(offset[n]);
  const wide = new Map<number, Map<number, number>>();
  const slotOf = (v: number, u: number): number => {
    const from = offset[v];
    const to = offset[v + 1];
    if (to - from <= 16) {
      for (let k = from; k < to; k++) if (target[k] === u) return k;
      throw new Error("triangulate: an edge without its twin; is the room valid?");
    }
    let table = wide.get(v);
    if (table === undefined) {
      table = new Map();
      for (let k = from; k < to; k++) table.set(target[k], k);
      wide.set(v, table);
    }
    return table.get(u)!;
  };
  for (let e = 0; e < offset[n]; e++) twin[e] = slotOf(target[e], source[e]);

  const visited = new Uint8Array(offset[n]);
  // The far side of every wall is outside the floor: mark half-edges running against ring order.
  for (let e = 0; e < offset[n]; e++) if (next[target[e]] === source[e]) visited[e] = 1;
  const pieces: number[][] = [];
  for (let v = 0; v < n; v++) {
    for (let k = offset[v]; k < offset[v + 1]; k++) {
      if (visited[k]) continue;
      const piece: number[] = [];
      let from = v;
      let edge = k;
      while (!visited[edge]) {
        visited[edge] = 1;
        piece.push(from);
        const to = target[edge];
        // Next edge: the neighbour of `to` just clockwise from `from`.
        const back = twin[edge];
        const nextEdge = back === offset[to] ? offset[to + 1] - 1 : back - 1;
        from = to;
        edge = nextEdge;
      }
      pieces.push(piece);
    }
  }
  return pieces;
}

const LEFT = 1;
const RIGHT = 2;

/**
 * Step 2: triangulate one y-monotone piece (a counter-clockwise cycle of corners) with a stack,
 * in linear time. The stack holds a chain that turns away from the floor (reflex or straight);
 * a corner on the same chain cuts off triangles only while they are strictly positive, so straight
 * runs of collinear corners wait on the stack and are fanned from the opposite chain later.
 */
export function triangulateMonotonePiece(
  points: Point[],
  piece: number[],
  out: [number, number, number][],
  scratch?: { sorted: Int32Array; chain: Uint8Array },
): void {
  const m = piece.length;
  if (m < 3) throw new Error(`triangulate: a piece with ${m} corners; is the room valid?`);
  if (m === 3) {
    pushTriangle(points, out, piece[0], piece[1], piece[2]);
    return;
  }
  let top = 0;
  let bottom = 0;
  for (let i = 1; i < m; i++) {
    if (isAbove(points[piece[i]], points[piece[top]])) top = i;
    if (isAbove(points[piece[bottom]], points[piece[i]])) bottom = i;
  }
  // Counter-clockwise from the top runs down the left chain; from the bottom, up the right chain.
  const sorted = scratch && scratch.sorted.length >= m ? scratch.sorted : new Int32Array(m);
  const chain = scratch && scratch.chain.length >= m ? scratch.chain : new Uint8Array(m);
  let l = top;
  let r = (top - 1 + m) % m;
  sorted[0] = piece[top];
  chain[0] = LEFT | RIGHT;
  for (let k = 1; k < m; k++) {
    const nl = (l + 1) % m;
    // Merge the two descending chains; the bottom corner closes both.
    if (nl !== bottom && (r === bottom || isAbove(points[piece[nl]], points[piece[r]]))) {
      sorted[k] = piece[nl];
      chain[k] = LEFT;
      l = nl;
    } else if (r !== bottom) {
      sorted[k] = piece[r];
      chain[k] = RIGHT;
      r = (r - 1 + m) % m;
    } else {
      sorted[k] = piece[bottom];
      chain[k] = LEFT | RIGHT;
    }
  }

  const stack: number[] = [0, 1];
  for (let j = 2; j < m - 1; j++) {
    const u = sorted[j];
    const topIndex = stack[stack.length - 1];
    if ((chain[j] & chain[topIndex]) === 0) {
      // Opposite chains: u sees every corner on the stack; fan them all from u.
      fanFrom(points, out, u, chain[j], stack, sorted);
      stack.length = 0;
      stack.push(j - 1, j);
    } else {
      let last = stack.pop()!;
      while (stack.length > 0) {
        const q = sorted[stack[stack.length - 1]];
        const p = sorted[last];
        const positive = chain[j] === LEFT ? orient(points[q], points[p], points[u]) > 0 : orient(points[u], points[p], points[q]) > 0;
        if (!positive) break;
        if (chain[j] === LEFT) out.push([q, p, u]);
        else out.push([u, p, q]);
        last = stack.pop()!;
      }
      stack.push(last, j);
    }
  }
  // The bottom corner sees what is left on the stack.
  const lastOnStack = stack[stack.length - 1];
  const bottomChain = chain[lastOnStack] === LEFT ? RIGHT : LEFT;
  fanFrom(points, out, sorted[m - 1], bottomChain, stack, sorted);
}

/** Triangles from corner u (on chain `side`) to each consecutive pair of the stacked corners. */
function fanFrom(
  points: Point[],
  out: [number, number, number][],
  u: number,
  side: number,
  stack: number[],
  sorted: Int32Array,
): void {
  for (let i = 0; i + 1 < stack.length; i++) {
    const upper = sorted[stack[i]];
    const lower = sorted[stack[i + 1]];
    if (side === LEFT) pushTriangle(points, out, u, lower, upper);
    else pushTriangle(points, out, u, upper, lower);
  }
}

/** Keep the counter-clockwise triangle; a non-positive one means the input broke a precondition. */
function pushTriangle(points: Point[], out: [number, number, number][], a: number, b: number, c: number): void {
  const o = orient(points[a], points[b], points[c]);
  if (!(o > 0)) {
    throw new Error(
      `triangulate: corners ${a}, ${b}, ${c} would make a ${o === 0 ? "flat" : "clockwise"} triangle; is the room valid and normalised?`,
    );
  }
  out.push([a, b, c]);
}
