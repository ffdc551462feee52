// Visibility regions checked against an independent ray-cast sampler (common practice: brute force
// against a fast construction) and against the visibility-polygon npm package on rooms without
// obstacles, on hand-made hard cases and on AGPLIB polygons (AGPLIB, Univ. of Campinas).
import { describe, expect, it } from "vitest";
import { orient2d } from "robust-predicates";
import { compute, convertToSegments, breakIntersections } from "visibility-polygon";
import { triangulate } from "@/lib/geometry/triangulate";
import { createSightlines } from "@/lib/geometry/visibility";
import { clipToSightRange, discCorners, CHORD_ERROR } from "@/lib/geometry/visibility-range";
import { ringArea, regionArea } from "@/lib/geometry/coverage";
import type { Point, Room } from "@/lib/geometry/types";
import { inRegion, samplePoints, seesPoint, walls } from "./sampler";
import { agplibRoom, prepared } from "./rooms";

// Hand-made hard cases (earcut-style named fixtures): collinear runs, a post on a wall, at a
// corner, sightlines grazing reflex corners, obstacles lined up with each other.
const fixtures: Record<string, Room> = {
  "U with notch and pillar": prepared({ outline: [[0, 0], [10, 0], [10, 10], [6, 10], [6, 4], [4, 4], [4, 10], [0, 10]], obstacles: [[[1, 1], [2, 1], [2, 2], [1, 2]]] }),
  "collinear runs": prepared({ outline: [[0, 0], [2, 0], [4, 0], [6, 0], [6, 2], [6, 4], [4, 4], [4, 2], [2, 2], [2, 4], [0, 4], [0, 2]], obstacles: [] }),
  "aligned pillars": prepared({
    outline: [[0, 0], [12, 0], [12, 6], [0, 6]],
    obstacles: [[[2, 2], [3, 2], [3, 3], [2, 3]], [[5, 2], [6, 2], [6, 3], [5, 3]], [[8, 2], [9, 2], [9, 3], [8, 3]]],
  }),
  "grazing comb": prepared({ outline: [[0, 0], [8, 0], [8, 2], [7, 2], [7, 6], [6, 2], [5, 2], [4, 6], [3, 2], [2, 2], [1, 6], [0, 2]], obstacles: [] }),
};

/** Posts to test from: every corner, wall midpoints that are exactly on their wall, sampled interior points. */
function postsFor(room: Room, interior: number): Point[] {
  const out: Point[] = [];
  for (const [a, b] of walls(room)) {
    const middle: Point = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
    // A rounded midpoint can sit a hair outside its wall; only exactly collinear ones are wall posts.
    out.push(a, ...(orient2d(a[0], a[1], b[0], b[1], middle[0], middle[1]) === 0 ? [middle] : []));
  }
  return out.concat(samplePoints(room, interior, 1e-3, 7));
}

function checkAgainstSampler(room: Room, posts: Point[], samples: Point[]) {
  const sightlines = createSightlines(room, triangulate(room));
  const wallList = walls(room);
  let checked = 0;
  for (const post of posts) {
    const answer = sightlines.regionOf(post);
    expect(answer.ok, `post ${post}`).toBe(true);
    if (!answer.ok) continue;
    expect(ringArea(answer.region)).toBeGreaterThan(0);
    for (const q of samples) {
      const { inside, gap } = inRegion(q, answer.region);
      if (gap < 1e-6) continue; // on the region's edge: the sampler cannot decide by floating point
      expect(inside, `post ${post} and point ${q}`).toBe(seesPoint(post, q, room, wallList));
      checked++;
    }
  }
  expect(checked).toBeGreaterThan(posts.length * samples.length * 0.9);
}

describe("visibility region against an independent ray-cast sampler", () => {
  for (const [name, room] of Object.entries(fixtures)) {
    it(`fixture: ${name}`, () => checkAgainstSampler(room, postsFor(room, 20), samplePoints(room, 300, 1e-4, 3)));
  }
  for (const name of ["randsimple-40-1", "random-40-2", "gB_simple-simple_25_100v-10h_1"]) {
    it(`AGPLIB ${name} (AGPLIB, Univ. of Campinas)`, () => {
      const room = agplibRoom(name);
      checkAgainstSampler(room, postsFor(room, 10).filter((_, i) => i % 3 === 0), samplePoints(room, 250, 1e-4, 5));
    });
  }
});

describe("visibility region against the visibility-polygon package (rooms without obstacles)", () => {
  for (const name of ["randsimple-20-1", "randsimple-60-2", "randsimple-200-1", "random-100-1", "vonkoch-100-1"]) {
    it(`AGPLIB ${name}: same area from interior posts (AGPLIB, Univ. of Campinas)`, () => {
      const room = agplibRoom(name);
      const sightlines = createSightlines(room, triangulate(room));
      const segments = breakIntersections(convertToSegments([room.outline]));
      for (const post of samplePoints(room, 15, 1e-3, 11)) {
        const ours = sightlines.regionOf(post);
        if (!ours.ok) throw new Error("post outside");
        const theirs = compute(post, segments) as Point[];
        const a = ringArea(ours.region), b = Math.abs(ringArea(theirs));
        expect(Math.abs(a - b)).toBeLessThan(1e-7 * Math.max(1, b));
      }
    });
  }
});

describe("special posts and blocked sight", () => {
  const room = fixtures["U with notch and pillar"];
  const sightlines = createSightlines(room, triangulate(room));
  it("a post at the pillar's corner sees exactly the strips below and left of it (area 19)", () => {
    const answer = sightlines.regionOf([1, 1]);
    expect(answer.ok && ringArea(answer.region)).toBeCloseTo(19, 12);
  });
  it("a post on the pillar's bottom wall sees only the strip below it (area 10)", () => {
    const answer = sightlines.regionOf([1.5, 1]);
    expect(answer.ok && ringArea(answer.region)).toBeCloseTo(10, 12);
  });
  it("the pillar blocks sight: (0.5, 1.5) is hidden from (3, 1.5) behind it", () => {
    const answer = sightlines.regionOf([3, 1.5]);
    expect(answer.ok).toBe(true);
    if (answer.ok) expect(inRegion([0.5, 1.5], answer.region).inside).toBe(false);
    expect(seesPoint([3, 1.5], [0.5, 1.5], room)).toBe(false);
  });
  it("a post inside an obstacle is refused with a reason", () => {
    const answer = sightlines.regionOf([1.5, 1.5]);
    expect(answer.ok).toBe(false);
    if (!answer.ok) expect(answer.message).toMatch(/inside an obstacle/);
  });
});

describe("sight range", () => {
  it("the disc polygon keeps its chord error within 1 cm (sagitta r(1 - cos(pi/k)), geometry)", () => {
    for (const r of [0.5, 3, 10, 50, 400]) expect(r * (1 - Math.cos(Math.PI / discCorners(r)))).toBeLessThanOrEqual(CHORD_ERROR);
  });
  it("a post in a large empty hall sees a disc of area within 2 cm x circumference of pi r^2", () => {
    const hall = prepared({ outline: [[0, 0], [100, 0], [100, 100], [0, 100]], obstacles: [] });
    const answer = createSightlines(hall, triangulate(hall)).regionOf([50, 50]);
    if (!answer.ok) throw new Error("post outside");
    const area = regionArea(clipToSightRange(answer.region, [50, 50], 8));
    expect(area).toBeLessThanOrEqual(Math.PI * 64);
    expect(area).toBeGreaterThan(Math.PI * 64 - 2 * Math.PI * 8 * CHORD_ERROR);
  });
});
