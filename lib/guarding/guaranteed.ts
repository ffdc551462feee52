// The guaranteed plan: posts from a triangulation and a 3-colouring of its corners, never more than
// floor((n + 2h) / 3) for n vertices and h obstacles. Without obstacles this is Fisk's (1978) proof
// of Chvátal's (1975) art gallery theorem; with obstacles the dual graph has cycles, so h of its
// edges are left out and each left-out diagonal is cut open, which turns the room into one
// triangulated disk with n + 2h corner copies (O'Rourke, Art Gallery Theorems and Algorithms, 1987,
// ch. 5, as recalled). The smallest colour class of the copies holds at most floor((n + 2h) / 3)
// copies, every triangle has one corner of each colour, and a post at a corner sees its whole
// (convex) triangle; a point present as two copies of that colour is one post.
import type { Point, Room, Triangulation } from "../geometry/types";
import { triangulate } from "../geometry/triangulate";

export interface GuaranteedPlan {
  /** Post positions (corners of the room), at most `bound` of them. */
  posts: Point[];
  /** Indices of the posts in `points`. */
  postIndices: number[];
  points: Point[];
  /** Counter-clockwise triangles over `points`. */
  triangles: [number, number, number][];
  /**
   * Colour (0, 1 or 2) per point index. A corner split by a cut has one colour per copy; it shows
   * the posts' colour when any of its copies has it, otherwise the colour of its first copy.
   */
  colours: number[];
  /** Colour of each triangle's three corners (the exact colouring of the copies), for drawing. */
  cornerColours: [number, number, number][];
  /** The colour whose corners became posts. */
  postColour: number;
  /** Spanning tree of the dual graph: pairs of triangle indices sharing a diagonal. */
  dualTree: [number, number][];
  /** Diagonals left out of the tree (one per obstacle), as point-index pairs: the cuts. */
  cuts: [number, number][];
  /** Number of corner copies after the cuts: n + 2h. */
  copies: number;
  /** floor((n + 2h) / 3). */
  bound: number;
}

/** Plan guaranteed posts for a normalised, valid room; reuses a triangulation when given one. */
export function planGuaranteed(room: Room, triangulation?: Triangulation): GuaranteedPlan {
  const { points, triangles } = triangulation ?? triangulate(room);
  const n = points.length;
  const h = room.obstacles.length;
  const t = triangles.length;

  // Triangles sharing each diagonal: key the edge by its smaller and larger corner.
  const firstSide = new Map<number, number>();
  const neighbours: [number, number, number, number][] = []; // triangle, triangle, corner a, corner b
  for (let i = 0; i < t; i++) {
    const tri = triangles[i];
    for (let k = 0; k < 3; k++) {
      const a = tri[k];
      const b = tri[(k + 1) % 3];
      const key = a < b ? a * n + b : b * n + a;
      const other = firstSide.get(key);
      if (other === undefined) firstSide.set(key, i);
      else neighbours.push([other, i, a, b]);
    }
  }
  const adjacency: number[][] = Array.from({ length: t }, () => []);
  neighbours.forEach(([x, y], e) => {
    adjacency[x].push(e);
    adjacency[y].push(e);
  });

  // Spanning tree of the dual graph by breadth-first search; the other diagonals are cuts.
  const inTree = new Uint8Array(neighbours.length);
  const reached = new Uint8Array(t);
  const order: number[] = [];
  const arrivedBy = new Int32Array(t).fill(-1);
  // Start the walk at a leaf of the dual graph (an ear) when there is one, as Fisk's proof does.
  let root = 0;
  for (let i = 0; i < t; i++) {
    if (adjacency[i].length <= 1) {
      root = i;
      break;
    }
  }
  if (t > 0) {
    reached[root] = 1;
    order.push(root);
  }
  for (let q = 0; q < order.length; q++) {
    const x = order[q];
    for (const e of adjacency[x]) {
      const [p, r] = neighbours[e];
      const y = p === x ? r : p;
      if (reached[y]) continue;
      reached[y] = 1;
      inTree[e] = 1;
      arrivedBy[y] = e;
      order.push(y);
    }
  }
  if (order.length !== t) throw new Error("guaranteed plan: the triangles do not form one connected floor");

  // Corner copies: a corner of a triangle is the same copy as that corner of a tree neighbour.
  const parent = Int32Array.from({ length: 3 * t }, (_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]];
      i = parent[i];
    }
    return i;
  };
  const cornerSlot = (tri: number, vertex: number) => {
    const c = triangles[tri];
    return 3 * tri + (c[0] === vertex ? 0 : c[1] === vertex ? 1 : 2);
  };
  const dualTree: [number, number][] = [];
  const cuts: [number, number][] = [];
  neighbours.forEach(([x, y, a, b], e) => {
    if (!inTree[e]) {
      cuts.push([a, b]);
      return;
    }
    dualTree.push([x, y]);
    parent[find(cornerSlot(x, a))] = find(cornerSlot(y, a));
    parent[find(cornerSlot(x, b))] = find(cornerSlot(y, b));
  });
  let copies = 0;
  for (let i = 0; i < 3 * t; i++) if (find(i) === i) copies++;
  if (copies !== n + 2 * h) {
    throw new Error(`guaranteed plan: ${copies} corner copies where n + 2h = ${n + 2 * h}; is the triangulation complete?`);
  }

  // Walk the tree: each newly reached triangle's third corner takes the colour its shared edge lacks.
  const colourOf = new Int8Array(3 * t).fill(-1);
  const paint = (slot: number, colour: number) => {
    const root = find(slot);
    if (colourOf[root] === -1) colourOf[root] = colour;
    else if (colourOf[root] !== colour) throw new Error("guaranteed plan: inconsistent 3-colouring (internal error)");
  };
  if (t > 0) for (let k = 0; k < 3; k++) paint(3 * root + k, k);
  for (let q = 1; q < order.length; q++) {
    const y = order[q];
    const [, , a, b] = neighbours[arrivedBy[y]];
    const ca = colourOf[find(cornerSlot(y, a))];
    const cb = colourOf[find(cornerSlot(y, b))];
    const third = triangles[y].find((v) => v !== a && v !== b)!;
    paint(cornerSlot(y, third), 3 - ca - cb);
  }

  // The colour with the fewest distinct points (never more than its copies, at most (n + 2h) / 3).
  const copiesOf = [0, 0, 0];
  const pointsOf: Set<number>[] = [new Set(), new Set(), new Set()];
  const cornerColours: [number, number, number][] = triangles.map((tri, i) => {
    const cs = [0, 1, 2].map((k) => colourOf[find(3 * i + k)]) as [number, number, number];
    for (let k = 0; k < 3; k++) pointsOf[cs[k]].add(tri[k]);
    return cs;
  });
  for (let i = 0; i < 3 * t; i++) if (find(i) === i) copiesOf[colourOf[i]]++;
  let postColour = 0;
  for (let c = 1; c < 3; c++) {
    const better =
      pointsOf[c].size < pointsOf[postColour].size ||
      (pointsOf[c].size === pointsOf[postColour].size && copiesOf[c] < copiesOf[postColour]);
    if (better) postColour = c;
  }
  const postIndices = [...pointsOf[postColour]].sort((a, b) => a - b);

  const colours = new Array<number>(n).fill(-1);
  triangles.forEach((tri, i) => {
    for (let k = 0; k < 3; k++) {
      const v = tri[k];
      if (colours[v] === -1 || cornerColours[i][k] === postColour) colours[v] = cornerColours[i][k];
    }
  });

  return {
    posts: postIndices.map((i) => [points[i][0], points[i][1]] as Point),
    postIndices,
    points,
    triangles,
    colours,
    cornerColours,
    postColour,
    dualTree,
    cuts,
    copies,
    bound: Math.floor((n + 2 * h) / 3),
  };
}
