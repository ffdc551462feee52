// The seeded random families of the triangulation benchmark (tests/geometry/support/shapes.ts), at
// small sizes and several seeds, with and without obstacles, checked against references outside
// lib/geometry: counts from the triangulation theorem, areas from the shoelace formula, signs from
// robust-predicates, containment from robust-point-in-polygon and areas from earcut (all npm).
import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import earcut, { deviation, flatten } from "earcut";
import { orient2d } from "robust-predicates";
import { prepareRoom } from "@/lib/geometry/room";
import { triangulate } from "@/lib/geometry/triangulate";
import type { Room } from "@/lib/geometry/types";
import { seededRandom, triangulationFaults, type P, type PlainRoom } from "./support/oracle";
import { alternatingStarRoom, jitteredOrthogonalRoom, nearConvexRoom, obstaclesInTriangles, unevenCombRoom } from "./support/shapes";

// robust-point-in-polygon ships no types: -1 inside, 0 on the boundary, 1 outside.
const classifyPoint = createRequire(import.meta.url)("robust-point-in-polygon") as (loop: P[], point: P) => -1 | 0 | 1;

/** Twice the signed area (Gauss's shoelace formula), summed in the ring's own order. */
function shoelaceArea(ring: P[]): number {
  let s = 0;
  for (let i = 0; i < ring.length; i++) {
    const [ax, ay] = ring[i];
    const [bx, by] = ring[(i + 1) % ring.length];
    s += ax * by - bx * ay;
  }
  return s / 2;
}

const triangleArea = (a: P, b: P, c: P) => ((b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0])) / 2;

const families: { name: string; make: (random: () => number, n: number) => PlainRoom }[] = [
  { name: "star with random alternating radii", make: alternatingStarRoom },
  { name: "comb with random teeth", make: (random, n) => unevenCombRoom(random, n) },
  { name: "comb with random teeth, turned", make: (random, n) => unevenCombRoom(random, n, 0.3 + random()) },
  { name: "jittered orthogonal room", make: (random, n) => jitteredOrthogonalRoom(random, n) },
  { name: "near-convex ring", make: nearConvexRoom },
];

function prepared(input: PlainRoom): Room | null {
  const result = prepareRoom(input);
  return result.ok ? result.room : null;
}

/** The room of a seed, with `holes` small obstacles dropped into earcut's triangles (the reference's, not ours). */
function roomOf(make: (random: () => number, n: number) => PlainRoom, n: number, seed: number, holes: number): Room {
  for (let attempt = 0; ; attempt++) {
    const random = seededRandom(7919 * seed + 104_729 * attempt + n);
    const base = prepared(make(random, n));
    if (base === null) continue;
    if (holes === 0) return base;
    const data = flatten([base.outline]);
    const cut = earcut(data.vertices, data.holes, data.dimensions);
    const triangles: [number, number, number][] = [];
    for (let i = 0; i < cut.length; i += 3) triangles.push([cut[i], cut[i + 1], cut[i + 2]]);
    // The largest triangles: their shrunken copies stay well away from the walls.
    const picks = triangles
      .map((t, k) => ({ k, area: Math.abs(triangleArea(...(t.map((i) => base.outline[i]) as [P, P, P]))) }))
      .sort((a, b) => b.area - a.area)
      .slice(0, holes)
      .map((t) => t.k);
    const withHoles = prepared({ outline: base.outline as P[], obstacles: obstaclesInTriangles(base.outline as P[], triangles, picks) });
    if (withHoles !== null) return withHoles;
  }
}

describe("triangulate the benchmark's random families against outside references", () => {
  for (const { name, make } of families) {
    for (const n of [12, 60, 250]) {
      for (const holes of [0, 2]) {
        it(`${name}, about ${n} corners, ${holes} obstacles, seeds 1-6`, () => {
          for (let seed = 1; seed <= 6; seed++) {
            const room = roomOf(make, n, seed, holes);
            const t = triangulate(room);
            const points = t.points as P[];
            const corners = points.length;
            const h = room.obstacles.length;
            // A simple polygon with n vertices has n - 2 triangles: de Berg et al., Computational
            // Geometry, Thm 3.1; with h holes, n + 2h - 2 (O'Rourke, Computational Geometry in C, as recalled).
            expect(t.triangles).toHaveLength(corners + 2 * h - 2);
            // Every triangle strictly counter-clockwise: Shewchuk's orient2d (npm robust-predicates; its sign is negated).
            for (const [a, b, c] of t.triangles) expect(-orient2d(...points[a], ...points[b], ...points[c])).toBeGreaterThan(0);
            // Every triangle inside: its centroid strictly inside the outline and outside every obstacle (npm robust-point-in-polygon).
            for (const [a, b, c] of t.triangles) {
              const g: P = [(points[a][0] + points[b][0] + points[c][0]) / 3, (points[a][1] + points[b][1] + points[c][1]) / 3];
              expect(classifyPoint(room.outline as P[], g)).toBe(-1);
              for (const obstacle of room.obstacles) expect(classifyPoint(obstacle as P[], g)).toBe(1);
            }
            // Total area equals the floor's shoelace area (outline minus obstacles; Gauss's area formula).
            const floor = Math.abs(shoelaceArea(room.outline as P[])) - room.obstacles.reduce((s, o) => s + Math.abs(shoelaceArea(o as P[])), 0);
            const ours = t.triangles.reduce((s, [a, b, c]) => s + triangleArea(points[a], points[b], points[c]), 0);
            expect(Math.abs(ours - floor)).toBeLessThanOrEqual(1e-9 * floor);
            // The same area as earcut's triangulation of the same rings (npm earcut, reference library),
            // and earcut's own deviation measure finds ours exact.
            const data = flatten([room.outline, ...room.obstacles]);
            const theirs = earcut(data.vertices, data.holes, data.dimensions);
            let theirArea = 0;
            for (let i = 0; i < theirs.length; i += 3) theirArea += Math.abs(triangleArea(points[theirs[i]], points[theirs[i + 1]], points[theirs[i + 2]]));
            expect(Math.abs(ours - theirArea)).toBeLessThanOrEqual(1e-9 * floor);
            expect(deviation(data.vertices, data.holes, data.dimensions, t.triangles.flat())).toBeLessThan(1e-9);
            // Edges pair up and walls are used once: the combinatorial check of ./support/oracle.ts.
            expect(triangulationFaults(room as PlainRoom, points, t.triangles)).toEqual([]);
          }
        });
      }
    }
  }
});
