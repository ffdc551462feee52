// Museum constraints on the fewest plan: forbidden zones, pinned posts, sight range, double cover,
// obstacles. Each plan is confirmed by the independent sampler in ./sampler.ts.
import { describe, expect, it } from "vitest";
import { planFewest } from "@/lib/guarding/fewest";
import { comb } from "@/lib/guarding/comb";
import { insideClosedRing } from "@/lib/guarding/constraints";
import type { Point, Ring } from "@/lib/geometry/types";
import { prepared } from "./rooms";
import { samplePoints, seesPoint } from "./sampler";
import { expectSeen } from "./expect-seen";

const hall = prepared({ outline: [[0, 0], [12, 0], [12, 8], [0, 8]], obstacles: [[[5, 3], [7, 3], [7, 5], [5, 5]]] });

describe("obstacles block sight", () => {
  it("a hall with a central vitrine needs two posts, and the lower bound proves it", () => {
    // Common practice (hand check): any single point sees around at most three sides of the vitrine.
    const plan = planFewest(hall, { timeLimit: 3 });
    expect(plan.posts.length).toBe(2);
    expect(plan.lowerBound).toBe(2);
    expectSeen(hall, plan);
    // No post inside the vitrine.
    for (const post of plan.posts) expect(post[0] > 5 && post[0] < 7 && post[1] > 3 && post[1] < 5).toBe(false);
  });
});

describe("forbidden zones", () => {
  // An exit along the bottom wall and an evacuation corridor through the middle of an L-shaped room.
  const room = prepared({ outline: [[0, 0], [10, 0], [10, 4], [4, 4], [4, 10], [0, 10]], obstacles: [] });
  const zones: Ring[] = [
    [[2, -1], [11, -1], [11, 5], [2, 5]],
    [[-1, 3], [5, 3], [5, 5], [-1, 5]],
  ];
  it("no post stands in a forbidden zone, boundary included, and the room is still seen", () => {
    const plan = planFewest(room, { forbidden: zones, timeLimit: 3 });
    expect(plan.covered).toBe(1);
    for (const post of plan.posts) for (const zone of zones) expect(insideClosedRing(post, zone), `post ${post}`).toBe(false);
    expectSeen(room, plan);
  });
});

describe("pinned posts", () => {
  it("a pinned post is kept exactly where it was given, and the rest is planned around it", () => {
    const pinned: Point = [11, 7];
    const plan = planFewest(hall, { pinned: [pinned], timeLimit: 3 });
    expect(plan.posts).toContainEqual(pinned);
    expect(plan.covered).toBe(1);
    expect(plan.lowerBound).toBeGreaterThanOrEqual(1);
    expectSeen(hall, plan);
  });
  // Chvátal (1975): no point sees the tips of two prongs of a comb, so a comb with k prongs needs k
  // posts whatever is pinned inside one prong each; the planner must reach k and prove it.
  for (const pins of [[[1, 9]], [[1, 9], [4, 8]], [[5, 0.5]]] as Point[][]) {
    it(`comb with 5 prongs, pinned ${pins.map((p) => `(${p[0]}, ${p[1]})`).join(" and ")}: 5 posts, bound 5 (Chvátal 1975)`, () => {
      const room = prepared(comb(5));
      const plan = planFewest(room, { pinned: pins, timeLimit: 5 });
      for (const pin of pins) expect(plan.posts).toContainEqual(pin);
      expect(plan.posts).toHaveLength(5);
      expect(plan.lowerBound).toBe(5);
      expect(plan.proven).toBe(true);
      expectSeen(room, plan);
      // The bound counts the pinned posts plus witnesses none of them sees (else it would count
      // twice); checked with the sampler's own sightlines.
      for (const w of plan.boundWitnesses) for (const pin of pins) expect(seesPoint(pin, w, room), `pin ${pin} sees bound witness ${w}`).toBe(false);
      expect(plan.boundWitnesses.length).toBeGreaterThanOrEqual(5 - pins.length);
    });
  }
  it("a pinned post outside the room is reported, not silently used", () => {
    const plan = planFewest(hall, { pinned: [[20, 20]], timeLimit: 1 });
    expect(plan.problems.map((p) => p.code)).toContain("pinned-outside-room");
    expect(plan.posts).not.toContainEqual([20, 20]);
  });
});

describe("sight range", () => {
  it("a 30 m corridor with 6 m sight range: every point within 6 m of a post that sees it", () => {
    const corridor = prepared({ outline: [[0, 0], [30, 0], [30, 3], [0, 3]], obstacles: [] });
    const plan = planFewest(corridor, { sightRange: 6, timeLimit: 4 });
    expect(plan.covered).toBe(1);
    // A disc of radius 6 covers at most 12 m of a 3 m wide corridor, so 30 m needs at least 3 posts.
    expect(plan.posts.length).toBeGreaterThanOrEqual(3);
    expect(plan.lowerBound).toBeLessThanOrEqual(plan.posts.length);
    expectSeen(corridor, plan, 1, 6);
    // Without a range a convex corridor needs one post (convexity).
    expect(planFewest(corridor, { timeLimit: 2 }).posts).toHaveLength(1);
  });
});

describe("double cover", () => {
  it("every sampled point of an L-shaped room is seen by two posts, and the bound counts two per witness", () => {
    const room = prepared({ outline: [[0, 0], [8, 0], [8, 3], [3, 3], [3, 9], [0, 9]], obstacles: [] });
    const plan = planFewest(room, { doubleCover: true, timeLimit: 4 });
    expect(plan.covered).toBe(1);
    expect(plan.posts.length).toBeGreaterThanOrEqual(2);
    expect(plan.lowerBound).toBe(2);
    expectSeen(room, plan, 2);
  });
  it("double cover of a comb with 3 prongs needs 6 posts, and the bound proves it (Chvátal 1975, twice)", () => {
    const outline: Point[] = [[0, 0], [8, 0], [7, 10], [6, 1], [5, 1], [4, 10], [3, 1], [2, 1], [1, 10]];
    const room = prepared({ outline, obstacles: [] });
    const plan = planFewest(room, { doubleCover: true, timeLimit: 5 });
    expect(plan.posts.length).toBe(6);
    expect(plan.lowerBound).toBe(6);
    expectSeen(room, plan, 2, Infinity, 300);
    // The sampler agrees that no post sees two tips.
    const tips: Point[] = [[1, 9.9], [4, 9.9], [7, 9.9]];
    for (const post of plan.posts) expect(tips.filter((t) => seesPoint(post, t, room)).length).toBeLessThanOrEqual(1);
    expect(samplePoints(room, 50).length).toBeGreaterThan(0);
  });
});
