// Fewest plans against known minima and published bounds, each plan's coverage confirmed by the
// independent sampler in ./sampler.ts (never by the certificate it is testing).
import { describe, expect, it } from "vitest";
import { comb } from "@/lib/guarding/comb";
import { planFewest, type FewestPlan } from "@/lib/guarding/fewest";
import { planGuaranteed } from "@/lib/guarding/guaranteed";
import { certifyCoverage } from "@/lib/geometry/coverage";
import { triangulate } from "@/lib/geometry/triangulate";
import { createSightlines } from "@/lib/geometry/visibility";
import type { Point, Room } from "@/lib/geometry/types";
import { expectSeen } from "./expect-seen";
import { agplibRoom, prepared } from "./rooms";

describe("known minima", () => {
  // Chvátal (1975): the comb with k prongs needs k posts; no point sees the tips of two prongs.
  for (const k of [2, 3, 5, 8]) {
    it(`a comb with ${k} prongs gets ${k} posts and the lower bound proves ${k} (Chvátal 1975)`, () => {
      const room = prepared(comb(k));
      const plan = planFewest(room, { timeLimit: 5 });
      expect(plan.posts).toHaveLength(k);
      expect(plan.lowerBound).toBe(k);
      expect(plan.proven).toBe(true);
      expect(plan.covered).toBe(1);
      expectSeen(room, plan);
    });
  }
  const one: Record<string, Room> = {
    // A convex room is seen from any point (definition of convexity).
    "convex hexagon": { outline: [[0, 0], [4, -1], [8, 0], [9, 4], [4, 7], [-1, 4]], obstacles: [] },
    // A star-shaped room is seen from its kernel (definition of star-shapedness).
    "five-pointed star": {
      outline: Array.from({ length: 10 }, (_, i) => {
        const r = i % 2 === 0 ? 10 : 4;
        const a = Math.PI / 2 + (i * Math.PI) / 5;
        return [r * Math.cos(a), r * Math.sin(a)] as Point;
      }),
      obstacles: [],
    },
    // An L-shaped room is seen from its reflex corner (common practice: the classic example).
    "L-shaped room": { outline: [[0, 0], [8, 0], [8, 3], [3, 3], [3, 9], [0, 9]], obstacles: [] },
  };
  for (const [name, shape] of Object.entries(one)) {
    it(`a ${name} needs exactly one post, proven`, () => {
      const room = prepared(shape);
      const plan = planFewest(room, { timeLimit: 3 });
      expect(plan.posts).toHaveLength(1);
      expect(plan.lowerBound).toBe(1);
      expect(plan.proven).toBe(true);
      expectSeen(room, plan);
    });
  }
});

describe("AGPLIB polygons (AGPLIB, Univ. of Campinas)", () => {
  // Orthogonal rooms: floor(n/4) posts always suffice (Kahn, Klawe & Kleitman 1983).
  for (const name of ["random-20-1", "random-20-3", "random-40-2", "random-40-4"]) {
    it(`${name}: covered, within floor(n/4), no worse than the guaranteed plan`, () => {
      const room = agplibRoom(name);
      const plan = planFewest(room, { timeLimit: 4 });
      expect(plan.covered).toBe(1);
      expect(plan.posts.length).toBeLessThanOrEqual(Math.floor(room.outline.length / 4));
      expect(plan.posts.length).toBeLessThanOrEqual(planGuaranteed(room).posts.length);
      expect(plan.lowerBound).toBeLessThanOrEqual(plan.posts.length);
      expectSeen(room, plan);
    });
  }
  for (const name of ["randsimple-40-3", "gB_simple-simple_25_100v-10h_2"]) {
    it(`${name}: covered, no worse than the guaranteed plan, confirmed by sampling`, () => {
      const room = agplibRoom(name);
      const plan = planFewest(room, { timeLimit: 4 });
      expect(plan.covered).toBe(1);
      expect(plan.posts.length).toBeLessThanOrEqual(planGuaranteed(room).posts.length);
      expect(plan.lowerBound).toBeLessThanOrEqual(plan.posts.length);
      expectSeen(room, plan, 1, Infinity, 300);
    });
  }
});

describe("coverage certificate", () => {
  it("an L-shaped room seen from the end of its foot: exact seen area 4 + 1/12 of 7 (hand computation)", () => {
    // The post (4, 0.5) sees the 4 x 1 foot and, past the reflex corner (1, 1), the triangle
    // (1, 1), (0, 1), (0, 1 + 1/6): the ray through the corner climbs 1/6 over the last metre.
    const room = prepared({ outline: [[0, 0], [4, 0], [4, 1], [1, 1], [1, 4], [0, 4]], obstacles: [] });
    const answer = createSightlines(room, triangulate(room)).regionOf([4, 0.5]);
    if (!answer.ok) throw new Error("post outside");
    const certificate = certifyCoverage(room, [[[answer.region]]]);
    // Exact up to Clipper's integer grid (2^-25 of the largest coordinate; see coverage.ts).
    expect(certificate.covered).toBeCloseTo((4 + 1 / 12) / 7, 6);
    expect(certificate.uncoveredArea).toBeCloseTo(3 - 1 / 12, 6);
    expect(certificate.uncovered).toHaveLength(1);
  });
  it("the lower bound never exceeds the known minimum of a comb, whatever the time limit (Chvátal 1975)", () => {
    const room = prepared(comb(4));
    for (const seconds of [0.3, 2]) expect(planFewest(room, { timeLimit: seconds }).lowerBound).toBeLessThanOrEqual(4);
  });
});
