// What a post sees: the exact visibility region of a point in a room with obstacles, by triangular
// expansion over the room's triangulation (Bungiu, Hemmer, Hershberger, Huang & Kröller, "Efficient
// computation of visibility polygons", EuroCG 2014). Every sign decision is an exact orientation
// test (robust-predicates) on input coordinates; only the far ends of shadow edges are constructed
// in floating point. The region is the closure of the visible interior (sightlines that only graze a
// reflex corner add no area and are not drawn as zero-width spikes).
import { orient2d } from "robust-predicates";
import type { Point, Ring, Room, Triangulation } from "./types";

/** Where a post stands relative to the triangulation: which triangle, and whether on an edge or corner. */
type Location =
  | { kind: "inside"; triangle: number }
  | { kind: "edge"; triangle: number; edge: number }
  | { kind: "corner"; vertex: number; triangle: number };

export type VisibilityAnswer =
  | { ok: true; region: Ring }
  | { ok: false; code: "post-outside-room"; message: string; at: Point };

/** A room prepared for many visibility queries: the triangulation with its neighbour table. */
export interface Sightlines {
  room: Room;
  triangulation: Triangulation;
  /** The visibility region of `post` (a counter-clockwise ring), or why there is none. */
  regionOf(post: Point): VisibilityAnswer;
  /** Whether a point lies in the closed room (inside, or on a wall); exact. */
  contains(point: Point): boolean;
}

/** Counter-clockwise positive orientation, exact: > 0 when c lies left of a→b. */
function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return -orient2d(ax, ay, bx, by, cx, cy);
}

/** Builds the neighbour table once so each query walks triangles in time proportional to what it sees. */
export function createSightlines(room: Room, triangulation: Triangulation): Sightlines {
  const { points, triangles } = triangulation;
  const xs = new Float64Array(points.length);
  const ys = new Float64Array(points.length);
  points.forEach(([x, y], i) => {
    xs[i] = x;
    ys[i] = y;
  });
  const corners = new Int32Array(triangles.length * 3);
  triangles.forEach((t, i) => {
    corners[3 * i] = t[0];
    corners[3 * i + 1] = t[1];
    corners[3 * i + 2] = t[2];
  });
  // neighbour[3t+e] is the triangle across edge e = (corner e, corner e+1) of t, or -1 at a wall.
  const neighbour = new Int32Array(triangles.length * 3).fill(-1);
  const halfEdges = new Map<number, number>();
  const count = points.length;
  for (let h = 0; h < corners.length; h++) {
    const a = corners[h];
    const b = corners[h - (h % 3) + ((h % 3) + 1) % 3];
    const twin = halfEdges.get(b * count + a);
    if (twin !== undefined) {
      neighbour[h] = (twin / 3) | 0;
      neighbour[twin] = (h / 3) | 0;
      halfEdges.delete(b * count + a);
    } else {
      halfEdges.set(a * count + b, h);
    }
  }
  // A triangle at each vertex, to start the fan walk for a post standing on a corner.
  const triangleAt = new Int32Array(points.length).fill(-1);
  for (let h = 0; h < corners.length; h++) if (triangleAt[corners[h]] < 0) triangleAt[corners[h]] = (h / 3) | 0;

  function locate(px: number, py: number): Location | null {
    for (let t = 0; t < triangles.length; t++) {
      const a = corners[3 * t], b = corners[3 * t + 1], c = corners[3 * t + 2];
      const o0 = orient(xs[a], ys[a], xs[b], ys[b], px, py);
      if (o0 < 0) continue;
      const o1 = orient(xs[b], ys[b], xs[c], ys[c], px, py);
      if (o1 < 0) continue;
      const o2 = orient(xs[c], ys[c], xs[a], ys[a], px, py);
      if (o2 < 0) continue;
      const zeros = (o0 === 0 ? 1 : 0) + (o1 === 0 ? 1 : 0) + (o2 === 0 ? 1 : 0);
      if (zeros === 0) return { kind: "inside", triangle: t };
      if (zeros >= 2) {
        // Two edges through the point: it is their shared corner.
        const vertex = o0 === 0 && o1 === 0 ? b : o1 === 0 && o2 === 0 ? c : a;
        return { kind: "corner", vertex, triangle: t };
      }
      return { kind: "edge", triangle: t, edge: o0 === 0 ? 0 : o1 === 0 ? 1 : 2 };
    }
    return null;
  }

  function regionOf(post: Point): VisibilityAnswer {
    const [qx, qy] = post;
    const where = locate(qx, qy);
    if (!where) {
      return {
        ok: false,
        code: "post-outside-room",
        message: `post (${qx}, ${qy}) is outside the room or inside an obstacle`,
        at: post,
      };
    }
    const out: number[] = [];
    const push = (x: number, y: number) => {
      const n = out.length;
      if (n >= 2 && out[n - 2] === x && out[n - 1] === y) return;
      out.push(x, y);
    };

    // Where the ray from the post through (rx, ry) meets the wall a-b (the ray is known to hit it).
    function hit(r: number, a: number, b: number) {
      if (r === a) return push(xs[a], ys[a]);
      if (r === b) return push(xs[b], ys[b]);
      const dx = xs[r] - qx, dy = ys[r] - qy;
      const ex = xs[b] - xs[a], ey = ys[b] - ys[a];
      const denominator = dx * ey - dy * ex;
      const t = ((xs[a] - qx) * ey - (ys[a] - qy) * ex) / denominator;
      push(qx + t * dx, qy + t * dy);
    }

    // Cones waiting to leave a triangle, as (triangle, exit edge, right ray point, left ray point).
    // The post is on the triangle's side of the exit edge, so the edge's first corner is its right
    // end. A last-in-first-out stack that takes right parts first keeps the output counter-clockwise.
    const stack: number[] = [];
    function expand(triangle: number, edge: number) {
      const h0 = 3 * triangle + edge;
      stack.push(triangle, edge, corners[h0], corners[3 * triangle + ((edge + 1) % 3)]);
      while (stack.length) {
        const l = stack.pop()!, r = stack.pop()!, e = stack.pop()!, t = stack.pop()!;
        const h = 3 * t + e;
        const eR = corners[h], eL = corners[3 * t + ((e + 1) % 3)];
        const next = neighbour[h];
        if (next < 0) {
          hit(r, eR, eL);
          hit(l, eR, eL);
          continue;
        }
        // In the next triangle the shared edge runs eL→eR (index k); then eR→v (k+1) and v→eL (k+2).
        let k = 0;
        while (corners[3 * next + k] !== eL) k++;
        const v = corners[3 * next + ((k + 2) % 3)];
        if (orient(qx, qy, xs[r], ys[r], xs[v], ys[v]) <= 0) {
          // v lies on or right of the right ray: the cone leaves through edge v→eL.
          stack.push(next, (k + 2) % 3, r, l);
        } else if (orient(qx, qy, xs[l], ys[l], xs[v], ys[v]) >= 0) {
          // v lies on or left of the left ray: the cone leaves through edge eR→v.
          stack.push(next, (k + 1) % 3, r, l);
        } else {
          // v splits the cone: the left part waits while the right part goes first.
          stack.push(next, (k + 2) % 3, v, l);
          stack.push(next, (k + 1) % 3, r, v);
        }
      }
    }

    let postIsCorner = false;
    if (where.kind === "inside") {
      const t = where.triangle;
      for (let e = 0; e < 3; e++) expand(t, e);
    } else if (where.kind === "edge") {
      const t = where.triangle, e = where.edge;
      const other = neighbour[3 * t + e];
      expand(t, (e + 1) % 3);
      expand(t, (e + 2) % 3);
      if (other >= 0) {
        const a = corners[3 * t + e];
        let k = 0;
        while (corners[3 * other + k] !== a) k++;
        // In the other triangle the shared edge is b→a, index (k+2)%3.
        const shared = (k + 2) % 3;
        expand(other, (shared + 1) % 3);
        expand(other, (shared + 2) % 3);
      } else {
        postIsCorner = true;
      }
    } else {
      postIsCorner = true;
      const p = where.vertex;
      // Walk clockwise around p to a wall (or all the way round), then fan counter-clockwise.
      let start = where.triangle;
      for (let guard = 0; guard < triangles.length; guard++) {
        let k = 0;
        while (corners[3 * start + k] !== p) k++;
        const before = neighbour[3 * start + k]; // across p→(next corner): clockwise neighbour
        if (before < 0 || before === where.triangle) break;
        start = before;
      }
      let t = start;
      for (let guard = 0; guard < triangles.length; guard++) {
        let k = 0;
        while (corners[3 * t + k] !== p) k++;
        expand(t, (k + 1) % 3);
        const after = neighbour[3 * t + ((k + 2) % 3)]; // across (previous corner)→p
        if (after < 0 || after === start) break;
        t = after;
      }
    }

    const ring: Ring = [];
    if (postIsCorner) ring.push([qx, qy]);
    for (let i = 0; i < out.length; i += 2) {
      const x = out[i], y = out[i + 1];
      const last = ring[ring.length - 1];
      if (last && last[0] === x && last[1] === y) continue;
      ring.push([x, y]);
    }
    while (ring.length > 1 && ring[0][0] === ring[ring.length - 1][0] && ring[0][1] === ring[ring.length - 1][1]) ring.pop();
    return { ok: true, region: ring };
  }

  function contains(point: Point): boolean {
    return locate(point[0], point[1]) !== null;
  }

  return { room, triangulation, regionOf, contains };
}
