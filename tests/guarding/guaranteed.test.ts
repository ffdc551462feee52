// The guaranteed plan (lib/guarding/guaranteed.ts). Published facts checked here: at most
// floor(n/3) posts for a room without obstacles (Chvátal 1975; Fisk 1978), at most floor((n + 2h)/3)
// with h obstacles (O'Rourke, Art Gallery Theorems and Algorithms, 1987, ch. 5, as recalled), and
// exactly k for Chvátal's comb with k prongs (his lower-bound family). Coverage is confirmed by an
// independent sampling check written for the tests (tests/geometry/support/oracle.ts, using
// robust-point-in-polygon and robust-predicates from npm), and exactly by "every triangle of a
// verified triangulation has a post at a corner" (a triangle is convex, so its corner sees it all).
// Inputs: the AGPLIB benchmark polygons (AGPLIB, Univ. of Campinas), fixtures, random rooms.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { prepareRoom } from "@/lib/geometry/room";
import { triangulate } from "@/lib/geometry/triangulate";
import { planGuaranteed, type GuaranteedPlan } from "@/lib/guarding/guaranteed";
import { comb } from "@/lib/guarding/comb";
import type { Room } from "@/lib/geometry/types";
import { seededRandom, triangulationFaults, unseenSamples, sees, type P, type PlainRoom } from "../geometry/support/oracle";
import { agplibPolygons, asRoom } from "../geometry/support/agplib";
import { roomFixtures } from "../geometry/support/fixtures";
import { obstaclesInTriangles, orthogonalRoom, starRoom } from "../geometry/support/shapes";

function prepared(input: PlainRoom): Room {
  const result = prepareRoom(input);
  if (!result.ok) throw new Error(result.problems[0].message);
  return result.room;
}

/** Everything a guaranteed plan promises, checked without trusting the planner. */
function checkPlan(room: Room, plan: GuaranteedPlan, samples: number): void {
  const n = plan.points.length;
  const h = room.obstacles.length;
  expect(plan.bound).toBe(Math.floor((n + 2 * h) / 3));
  expect(plan.posts.length).toBeLessThanOrEqual(plan.bound);
  expect(new Set(plan.postIndices).size).toBe(plan.postIndices.length);
  expect(triangulationFaults(room as PlainRoom, plan.points as P[], plan.triangles)).toEqual([]);
  const isPost = new Set(plan.postIndices);
  for (const tri of plan.triangles) expect(tri.some((v) => isPost.has(v))).toBe(true);
  // A proper 3-colouring of every triangle's corner copies.
  for (const colours of plan.cornerColours) expect(new Set(colours).size).toBe(3);
  expect(plan.dualTree).toHaveLength(plan.triangles.length - 1);
  expect(plan.cuts).toHaveLength(h);
  expect(plan.copies).toBe(n + 2 * h);
  if (samples > 0) expect(unseenSamples(room as PlainRoom, plan.posts as P[], samples, n)).toEqual([]);
}

describe("the sampling check itself", () => {
  it("finds the unseen prong of a comb when one post is missing (so it can fail)", () => {
    const room = prepared(comb(4));
    const plan = planGuaranteed(room);
    expect(unseenSamples(room as PlainRoom, plan.posts.slice(1) as P[], 2000, 1).length).toBeGreaterThan(0);
  });

  it("knows obstacles block sight", () => {
    const room: PlainRoom = { outline: [[0, 0], [10, 0], [10, 10], [0, 10]], obstacles: [[[4, 4], [4, 6], [6, 6], [6, 4]]] };
    expect(sees(room, [0, 5], [10, 5])).toBe(false);
    expect(sees(room, [0, 0], [10, 0])).toBe(true);
    expect(sees(room, [0, 4], [10, 4])).toBe(true); // along the obstacle's wall: closed floor
  });
});

describe("guaranteed plans on the public benchmark polygons (AGPLIB, Univ. of Campinas)", () => {
  for (const polygon of agplibPolygons()) {
    it(`${polygon.file}: within floor((n + 2h)/3) and sees the whole room`, () => {
      const room = prepared(asRoom(polygon.rings));
      const plan = planGuaranteed(room, triangulate(room));
      checkPlan(room, plan, 300);
    });
  }
});

describe("Chvátal's comb", () => {
  it("with k prongs has 3k corners and gets exactly k posts, one seeing each prong (k = 1..30)", () => {
    for (let k = 1; k <= 30; k++) {
      const room = prepared(comb(k));
      expect(room.outline).toHaveLength(3 * k);
      const plan = planGuaranteed(room);
      expect(plan.posts).toHaveLength(k);
      checkPlan(room, plan, k <= 8 ? 400 : 0);
    }
  });

  it("really needs k: no corner sees two prong tips (sampled just below each tip)", () => {
    const k = 6;
    const room = comb(k);
    const tips = room.outline.filter(([, y]) => y === 10).map(([x]) => [x, 9.9] as P);
    for (const corner of room.outline) {
      const seen = tips.filter((tip) => sees(room as PlainRoom, corner as P, tip));
      expect(seen.length).toBeLessThanOrEqual(1);
    }
  });
});

describe("guaranteed plans on the hard-case fixtures", () => {
  for (const fixture of roomFixtures().filter((f) => f.expected.valid)) {
    it(fixture.name, () => {
      const room = prepared({ outline: fixture.rings[0], obstacles: fixture.rings.slice(1) });
      const plan = planGuaranteed(room);
      checkPlan(room, plan, 400);
      if (fixture.expected.valid) {
        expect(plan.bound).toBe(fixture.expected.bound);
        if (fixture.expected.posts !== undefined) expect(plan.posts).toHaveLength(fixture.expected.posts);
      }
    });
  }
});

describe("guaranteed plans on random rooms (fast-check property)", () => {
  it("rooms without obstacles: at most floor(n/3) (Chvátal 1975; Fisk 1978)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 3, max: 60 }), fc.integer(), fc.boolean(), (n, seed, orthogonal) => {
        const random = seededRandom(seed);
        const input = orthogonal ? orthogonalRoom(random, Math.max(1, n >> 2), { everyMetre: n % 2 === 0 }) : starRoom(random, n);
        const result = prepareRoom(input);
        if (!result.ok) return; // a star with a gap over half a turn can cross itself
        const plan = planGuaranteed(result.room);
        expect(plan.posts.length).toBeLessThanOrEqual(Math.floor(plan.points.length / 3));
        checkPlan(result.room, plan, 60);
      }),
      { numRuns: 150, seed: 8 },
    );
  });

  it("any valid room drawn on a 7 x 7 grid, obstacles included: within the bound, every triangle watched", () => {
    const gridPoint = fc.tuple(fc.integer({ min: 0, max: 6 }), fc.integer({ min: 0, max: 6 })) as fc.Arbitrary<P>;
    fc.assert(
      fc.property(fc.array(gridPoint, { minLength: 3, maxLength: 14 }), fc.array(fc.array(gridPoint, { minLength: 3, maxLength: 4 }), { maxLength: 3 }), (outline, obstacles) => {
        const result = prepareRoom({ outline: outline.map(([x, y]) => [2 * x, 2 * y] as P), obstacles: obstacles.map((o) => o.map(([x, y]) => [x + 3, y + 3] as P)) });
        if (!result.ok) return;
        checkPlan(result.room, planGuaranteed(result.room), 20);
      }),
      { numRuns: 10000, seed: 13 },
    );
  });

  it("rooms with obstacles: at most floor((n + 2h)/3) (O'Rourke 1987, ch. 5, as recalled)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 3, max: 50 }),
        fc.integer(),
        fc.boolean(),
        fc.array(fc.nat(), { minLength: 1, maxLength: 10 }),
        (n, seed, orthogonal, picks) => {
          const random = seededRandom(seed);
          const shape = orthogonal ? orthogonalRoom(random, Math.max(1, n >> 2), { everyMetre: true }) : starRoom(random, n);
          const base = prepareRoom(shape);
          if (!base.ok) return;
          const t = triangulate(base.room);
          const chosen = [...new Set(picks.map((p) => p % t.triangles.length))];
          const room = prepared({ outline: base.room.outline as P[], obstacles: obstaclesInTriangles(t.points as P[], t.triangles, chosen) });
          checkPlan(room, planGuaranteed(room), 60);
        },
      ),
      { numRuns: 150, seed: 9 },
    );
  });
});
