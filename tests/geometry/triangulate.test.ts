// Triangulation by monotone pieces (lib/geometry/triangulate.ts). What must hold is the textbook
// count of n + 2h - 2 triangles for a polygon with h holes triangulated over its own n vertices
// (O'Rourke, Computational Geometry in C, 1998, as recalled), each strictly positive, tiling the
// floor (checked combinatorially and by area in oracle.ts). Inputs: the AGPLIB benchmark polygons
// (AGPLIB, Univ. of Campinas), the hard-case fixtures, random rooms; cross-checked against earcut
// (npm reference library: its `deviation` measures how far a triangulation's area is from the
// polygon's; earcut drops collinear vertices, so its triangle count may be lower than ours).
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import earcut, { deviation, flatten } from "earcut";
import { prepareRoom } from "@/lib/geometry/room";
import { triangulate } from "@/lib/geometry/triangulate";
import { comb } from "@/lib/guarding/comb";
import type { Room } from "@/lib/geometry/types";
import { seededRandom, triangulationFaults, bruteForceValid, type P, type PlainRoom } from "./support/oracle";
import { agplibPolygons, asRoom } from "./support/agplib";
import { roomFixtures } from "./support/fixtures";
import { obstaclesInTriangles, orthogonalRoom, spiralRoom, starRoom } from "./support/shapes";

function prepared(input: PlainRoom): Room {
  const result = prepareRoom(input);
  if (!result.ok) throw new Error(result.problems[0].message);
  return result.room;
}

function faultsOf(room: Room): string[] {
  const t = triangulate(room);
  return triangulationFaults(room as PlainRoom, t.points as P[], t.triangles);
}

describe("triangulate the public benchmark polygons (AGPLIB, Univ. of Campinas)", () => {
  const polygons = agplibPolygons();
  for (const polygon of polygons) {
    it(polygon.file, () => {
      const room = prepared(asRoom(polygon.rings));
      const t = triangulate(room);
      const n = t.points.length;
      const h = room.obstacles.length;
      expect(triangulationFaults(room as PlainRoom, t.points as P[], t.triangles)).toEqual([]);
      expect(t.triangles).toHaveLength(n + 2 * h - 2);

      // earcut on the same rings: it must accept them (deviation ~ 0) and find the same area.
      const data = flatten([room.outline, ...room.obstacles]);
      const earcutTriangles = earcut(data.vertices, data.holes, data.dimensions);
      expect(deviation(data.vertices, data.holes, data.dimensions, earcutTriangles)).toBeLessThan(1e-9);
      const ours = t.triangles.flat();
      // Our triangles index the same vertex array, so earcut's deviation applies to them directly.
      expect(deviation(data.vertices, data.holes, data.dimensions, ours)).toBeLessThan(1e-9);
      expect(ours.length / 3).toBeGreaterThanOrEqual(earcutTriangles.length / 3);
    });
  }
});

describe("triangulate the hard-case fixtures", () => {
  for (const fixture of roomFixtures().filter((f) => f.expected.valid)) {
    it(`${fixture.name}: ${fixture.note}`, () => {
      const room = prepared({ outline: fixture.rings[0], obstacles: fixture.rings.slice(1) });
      const t = triangulate(room);
      expect(triangulationFaults(room as PlainRoom, t.points as P[], t.triangles)).toEqual([]);
      if (fixture.expected.valid) expect(t.triangles).toHaveLength(fixture.expected.triangles);
    });
  }
});

describe("triangulate adversarial shapes", () => {
  it("combs (Chvátal 1975) with 1 to 40 prongs", () => {
    for (let k = 1; k <= 40; k++) expect(faultsOf(prepared(comb(k))), `comb ${k}`).toEqual([]);
  });

  it("spirals", () => {
    for (const n of [10, 100, 1000]) expect(faultsOf(prepared(spiralRoom(n))), `spiral ${n}`).toEqual([]);
  });

  it("an orthogonal room with every metre marked, 3,000+ corners, in both directions", () => {
    const random = seededRandom(42);
    for (const transpose of [false, true]) {
      const room = orthogonalRoom(random, 300, { everyMetre: true, transpose });
      expect(room.outline.length).toBeGreaterThan(1000);
      expect(faultsOf(prepared(room))).toEqual([]);
    }
  });

  it("a 5,000-corner star room with 200 obstacles", () => {
    const random = seededRandom(5);
    const base = prepared(starRoom(random, 5000));
    const t = triangulate(base);
    const picks = Array.from({ length: 200 }, (_, i) => i * Math.floor(t.triangles.length / 200));
    const room = prepared({ outline: base.outline as P[], obstacles: obstaclesInTriangles(t.points as P[], t.triangles, picks) });
    expect(faultsOf(room)).toEqual([]);
  });
});

describe("triangulate random rooms (fast-check property)", () => {
  it("star-shaped rooms, some snapped to a coarse grid (collinear and equal-y corners)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 3, max: 80 }), fc.integer(), fc.constantFrom(0, 0, 5, 10, 25), (n, seed, grid) => {
        const input = starRoom(seededRandom(seed), n, { grid: grid || undefined });
        const result = prepareRoom(input);
        expect(result.ok).toBe(bruteForceValid(input));
        if (!result.ok) return;
        expect(faultsOf(result.room)).toEqual([]);
      }),
      { numRuns: 600, seed: 3 },
    );
  });

  it("orthogonal rooms with collinear runs, either way round", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 30 }), fc.integer(), fc.boolean(), fc.boolean(), (columns, seed, everyMetre, transpose) => {
        const input = orthogonalRoom(seededRandom(seed), columns, { everyMetre, transpose, height: 8 });
        expect(faultsOf(prepared(input))).toEqual([]);
      }),
      { numRuns: 600, seed: 4 },
    );
  });

  it("rooms with random small obstacles placed inside triangles, far from walls", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 3, max: 60 }),
        fc.integer(),
        fc.boolean(),
        fc.array(fc.nat(), { minLength: 1, maxLength: 12 }),
        (n, seed, orthogonal, picks) => {
          const random = seededRandom(seed);
          const shape = orthogonal ? orthogonalRoom(random, Math.max(1, n >> 2), { everyMetre: true }) : starRoom(random, n);
          const baseResult = prepareRoom(shape);
          if (!baseResult.ok) return; // a star with a gap over half a turn can cross itself
          const base = baseResult.room;
          const t = triangulate(base);
          const chosen = [...new Set(picks.map((p) => p % t.triangles.length))];
          const input = { outline: base.outline as P[], obstacles: obstaclesInTriangles(t.points as P[], t.triangles, chosen) };
          expect(bruteForceValid(input)).toBe(true);
          expect(faultsOf(prepared(input))).toEqual([]);
        },
      ),
      { numRuns: 400, seed: 5 },
    );
  });

  it("any valid room drawn on a 7 x 7 grid, with or without obstacles (the most degenerate input)", () => {
    const gridPoint = fc.tuple(fc.integer({ min: 0, max: 6 }), fc.integer({ min: 0, max: 6 })) as fc.Arbitrary<P>;
    let valid = 0;
    fc.assert(
      fc.property(fc.array(gridPoint, { minLength: 3, maxLength: 14 }), fc.array(fc.array(gridPoint, { minLength: 3, maxLength: 4 }), { maxLength: 2 }), (outline, obstacles) => {
        const input = { outline: outline.map(([x, y]) => [2 * x, 2 * y] as P), obstacles: obstacles.map((o) => o.map(([x, y]) => [x + 3, y + 3] as P)) };
        const result = prepareRoom(input);
        if (!result.ok) return;
        valid++;
        expect(faultsOf(result.room)).toEqual([]);
      }),
      { numRuns: 20000, seed: 12 },
    );
    expect(valid).toBeGreaterThan(500); // enough valid rooms to mean something
  });

  it("orthogonal rooms with square pillars on the grid (obstacles with equal coordinates everywhere)", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.integer({ min: 0, max: 9 }), fc.integer({ min: 0, max: 9 })), { maxLength: 20 }), (cells) => {
        // Pillars of 1 m on a 2 m grid inside a 20 m square: never touching each other or the walls.
        const unique = [...new Set(cells.map(([x, y]) => `${x},${y}`))].map((s) => s.split(",").map(Number));
        const outline: P[] = [];
        for (let x = 0; x < 20; x++) outline.push([x, 0]);
        for (let y = 0; y < 20; y++) outline.push([20, y]);
        for (let x = 20; x > 0; x--) outline.push([x, 20]);
        for (let y = 20; y > 0; y--) outline.push([0, y]);
        const obstacles = unique.map(([x, y]) => [[2 * x + 0.5, 2 * y + 0.5], [2 * x + 1.5, 2 * y + 0.5], [2 * x + 1.5, 2 * y + 1.5], [2 * x + 0.5, 2 * y + 1.5]] as P[]);
        expect(faultsOf(prepared({ outline, obstacles }))).toEqual([]);
      }),
      { numRuns: 200, seed: 6 },
    );
  });
});
