// The fast path for rooms one point sees entirely, the lower bound of at least one post, and
// sight ranges that never make the planner throw.
// Sources: a convex polygon is its own kernel, and a polygon is star-shaped exactly when its kernel
// (the intersection of the inner half-planes of its edges) is non-empty (Lee & Preparata, "An
// optimal algorithm for finding the kernel of a polygon", J. ACM 26(3), 1979). Visibility is checked
// independently here with robust-predicates' orientation test and robust-point-in-polygon.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { orient2d } from "robust-predicates";
import { createRequire } from "node:module";
import { planFewest } from "@/lib/guarding/fewest";
import { roomKernel } from "@/lib/geometry/kernel";
import type { Point, Ring, Room } from "@/lib/geometry/types";
import { prepared, agplibRoom } from "../sightlines/rooms";

const pointInPolygon = createRequire(import.meta.url)("robust-point-in-polygon") as (loop: Point[], point: Point) => -1 | 0 | 1;

const circle = (n: number, r: number): Ring =>
  Array.from({ length: n }, (_, i) => [r * Math.cos((2 * Math.PI * i) / n), r * Math.sin((2 * Math.PI * i) / n)] as Point);

const star = (n: number, inner: number, outer: number): Ring =>
  Array.from({ length: n }, (_, i) => {
    const r = i % 2 === 0 ? outer : inner;
    return [r * Math.cos((2 * Math.PI * i) / n), r * Math.sin((2 * Math.PI * i) / n)] as Point;
  });

/** Proper crossing of segments ab and cd (shared end points and touching do not count). */
function crosses(a: Point, b: Point, c: Point, d: Point): boolean {
  const d1 = orient2d(a[0], a[1], b[0], b[1], c[0], c[1]);
  const d2 = orient2d(a[0], a[1], b[0], b[1], d[0], d[1]);
  const d3 = orient2d(c[0], c[1], d[0], d[1], a[0], a[1]);
  const d4 = orient2d(c[0], c[1], d[0], d[1], b[0], b[1]);
  return d1 * d2 < 0 && d3 * d4 < 0;
}

/** Does p see q inside the simple outline (no wall properly crossed, midpoint inside)? */
function sees(outline: Ring, p: Point, q: Point): boolean {
  for (let i = 0; i < outline.length; i++) {
    if (crosses(p, q, outline[i], outline[(i + 1) % outline.length])) return false;
  }
  return pointInPolygon(outline, [(p[0] + q[0]) / 2, (p[1] + q[1]) / 2]) <= 0;
}

describe("kernel fast path", () => {
  it("gives a convex 5,000-corner room one post, proven, the post inside the room (a convex polygon is its own kernel)", () => {
    const room = prepared({ outline: circle(5000, 40), obstacles: [] });
    const plan = planFewest(room, { timeLimit: 5 });
    expect(plan.posts).toHaveLength(1);
    expect(plan.lowerBound).toBe(1);
    expect(plan.proven).toBe(true);
    expect(plan.proof).toBe("kernel");
    expect(pointInPolygon(room.outline, plan.posts[0])).toBe(-1);
  });

  it("places the post of a star-shaped room where it sees every corner (checked by an independent sight test)", () => {
    const room = prepared({ outline: star(1000, 20, 30), obstacles: [] });
    const plan = planFewest(room, { timeLimit: 5 });
    expect(plan.posts).toHaveLength(1);
    expect(plan.proven).toBe(true);
    for (const corner of room.outline) expect(sees(room.outline, plan.posts[0], corner)).toBe(true);
  });

  it("gives double cover two distinct posts in the kernel, proven", () => {
    const room = prepared({ outline: circle(600, 20), obstacles: [] });
    const plan = planFewest(room, { doubleCover: true, timeLimit: 5 });
    expect(plan.posts).toHaveLength(2);
    expect(plan.lowerBound).toBe(2);
    expect(plan.posts[0]).not.toEqual(plan.posts[1]);
  });

  it("finds no kernel for a comb (one post per tooth is necessary: the comb of the art gallery theorem)", () => {
    // Three teeth of width 1 and height 3 over a base 1 high; no point sees the inside of two tips.
    const comb: Ring = [
      [0, 0], [5, 0], [5, 4], [4, 4], [4, 1], [3, 1], [3, 4], [2, 4], [2, 1], [1, 1], [1, 4], [0, 4],
    ];
    const room = prepared({ outline: comb, obstacles: [] });
    expect(roomKernel(room)).toBeNull();
    const plan = planFewest(room, { timeLimit: 5 });
    expect(plan.lowerBound).toBeGreaterThanOrEqual(3);
    expect(plan.posts.length).toBeGreaterThanOrEqual(plan.lowerBound);
  });

  it("agrees with the general planner on random small star-shaped rooms: both find one post", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 5, max: 12, noNaN: true }), { minLength: 6, maxLength: 14 }), (radii) => {
        const outline = radii.map((r, i) => [r * Math.cos((2 * Math.PI * i) / radii.length), r * Math.sin((2 * Math.PI * i) / radii.length)] as Point);
        const room = prepared({ outline, obstacles: [] });
        const fast = planFewest(room, { timeLimit: 5 });
        expect(fast.posts).toHaveLength(1);
        // The general planner, made to skip the fast path by pinning its own post at the found point.
        const general = planFewest(room, { timeLimit: 5, pinned: fast.posts });
        expect(general.posts).toHaveLength(1);
        expect(general.covered).toBeCloseTo(1, 6);
      }),
      { numRuns: 15, seed: 20261203 },
    );
  });
});

describe("lower bound", () => {
  it("is at least one post for every room, obstacles or not (the floor has area)", () => {
    // AGPLIB rooms with ten obstacles each (tests/fixtures/agplib/SOURCE.md).
    for (const name of ["gB_simple-simple_25_100v-10h_1", "gB_simple-simple_25_100v-10h_2"]) {
      const room: Room = agplibRoom(name);
      expect(planFewest(room, { timeLimit: 5 }).lowerBound).toBeGreaterThanOrEqual(1);
    }
    const withPlinth = prepared({ outline: [[0, 0], [12, 0], [12, 8], [0, 8]], obstacles: [[[5, 3], [7, 3], [7, 5], [5, 5]]] });
    expect(planFewest(withPlinth, { timeLimit: 5 }).lowerBound).toBeGreaterThanOrEqual(1);
  });
});

describe("sight range never throws", () => {
  const square = prepared({ outline: [[0, 0], [10, 0], [10, 10], [0, 10]], obstacles: [] });

  // Ranges where the range circle reaches exactly a wall (5), the far corner from the centre (√50)
  // and in between, in 0.25 m steps from 3 m to 8 m.
  const ranges = [5, Math.SQRT2 * 5, ...Array.from({ length: 21 }, (_, i) => 3 + i * 0.25)];
  it.each(ranges.map((r) => [r]))("plans a 10 m square with a %f m range; every sampled point is within range of a post", (range) => {
    const plan = planFewest(square, { sightRange: range, timeLimit: 5 });
    expect(plan.lowerBound).toBeGreaterThanOrEqual(1);
    expect(plan.lowerBound).toBeLessThanOrEqual(plan.posts.length);
    if (plan.covered < 1) return; // a plan stopped at its limit says so; it must not throw
    // A disc of radius r covers at most π r² of floor, so a covering plan needs 100 / (π r²) posts.
    expect(plan.posts.length).toBeGreaterThanOrEqual(Math.ceil(100 / (Math.PI * range * range)));
    for (let x = 0.05; x < 10; x += 0.5) {
      for (let y = 0.05; y < 10; y += 0.5) {
        const nearest = Math.min(...plan.posts.map((p) => Math.hypot(p[0] - x, p[1] - y)));
        expect(nearest).toBeLessThanOrEqual(range + 1e-6);
      }
    }
  });

  it("plans an L-room and a room with an obstacle at ranges that touch their corners", () => {
    const l = prepared({ outline: [[0, 0], [8, 0], [8, 4], [4, 4], [4, 8], [0, 8]], obstacles: [] });
    const hall = prepared({ outline: [[0, 0], [12, 0], [12, 8], [0, 8]], obstacles: [[[5, 3], [7, 3], [7, 5], [5, 5]]] });
    for (const range of [2, 4, Math.hypot(4, 4), 5, 6.5]) {
      expect(() => planFewest(l, { sightRange: range, timeLimit: 3 })).not.toThrow();
      expect(() => planFewest(hall, { sightRange: range, timeLimit: 3 })).not.toThrow();
    }
  });
});
