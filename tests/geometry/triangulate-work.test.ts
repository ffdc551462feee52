// The parts the triangulation's speed work added, each checked against a model outside them:
// - the sweep order (lib/geometry/sweep-order.ts: merge sort, radix sort, runs of equal y) against
//   JavaScript's own Array sort with the order the issue fixes for the sweep: y descending, ties
//   in y broken by x (the lexicographic tie-break of Lee & Preparata 1977, as the issue states);
// - (the reusable sweep status is checked in sweep-status.test.ts);
// - triangulations made with reused work arrays (after bigger rooms and after calls that failed
//   half-way) against the independent oracle in ./support/oracle.ts (n + 2h - 2 strictly positive
//   triangles pairing up edge for edge and summing to the floor's area: the textbook count,
//   O'Rourke, Computational Geometry in C, 1998, as recalled) and earcut's `deviation` (npm earcut,
//   the reference library).
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { deviation, flatten } from "earcut";
import { sweepOrder } from "@/lib/geometry/sweep-order";
import { prepareRoom } from "@/lib/geometry/room";
import { triangulate } from "@/lib/geometry/triangulate";
import { comb } from "@/lib/guarding/comb";
import type { Room } from "@/lib/geometry/types";
import { seededRandom, triangulationFaults, type P, type PlainRoom } from "./support/oracle";
import { agplibPolygons, asRoom } from "./support/agplib";
import { orthogonalRoom, spiralRoom, starRoom } from "./support/shapes";

/** The model: corner numbers sorted by Array#sort, y descending, then x ascending. */
function modelOrder(points: P[]): number[] {
  return points.map((_, i) => i).sort((a, b) => points[b][1] - points[a][1] || points[a][0] - points[b][0]);
}

function ourOrder(points: P[]): number[] {
  return Array.from(sweepOrder(Float64Array.from(points, (p) => p[0]), Float64Array.from(points, (p) => p[1])));
}

/** Distinct points (-0 and 0 are the same coordinate), as a valid room's corners are. */
function distinct(points: P[]): P[] {
  const seen = new Set<string>();
  return points.filter(([x, y]) => {
    const key = `${x + 0},${y + 0}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

function prepared(input: PlainRoom): Room {
  const result = prepareRoom(input, { maxVertices: 1e6 });
  if (!result.ok) throw new Error(result.problems[0].message);
  return result.room;
}

function faultsOf(room: Room): string[] {
  const t = triangulate(room);
  const faults = triangulationFaults(room as PlainRoom, t.points as P[], t.triangles);
  // No holes in the result: every triangle is a real array (the result is allocated at its size).
  for (let i = 0; i < t.triangles.length; i++) if (!Array.isArray(t.triangles[i])) faults.push(`triangle ${i} missing`);
  const data = flatten([room.outline, ...room.obstacles]);
  const d = deviation(data.vertices, data.holes, data.dimensions, t.triangles.flat());
  if (!(d < 1e-9)) faults.push(`earcut deviation ${d}`);
  return faults;
}

describe("sweep order (lib/geometry/sweep-order.ts) against Array#sort", () => {
  // Coordinates with many ties (a small grid), any doubles, signed zeros and tiny numbers, and y
  // values one unit in the last place apart (they share the radix sort's 32 high bits).
  const coordinate = fc.oneof(
    fc.integer({ min: -12, max: 12 }),
    fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }),
    fc.constantFrom(0, -0, 5e-324, -5e-324, 1e-300, 0.1, 0.1 + 2 ** -56, 0.1 - 2 ** -56, 1, 1 + 2 ** -20, 1 - 2 ** -21, -1 - 2 ** -20, 100, 100 + 2 ** -46),
  );
  it("small and medium rooms (merge sort below 256 corners, radix sort with 8-bit digits above)", () => {
    fc.assert(
      // size "max": lengths spread up to 1,500 (the default would keep them near 10).
      fc.property(fc.array(fc.tuple(coordinate, coordinate), { maxLength: 1500, size: "max" }), (raw) => {
        const points = distinct(raw as P[]);
        expect(ourOrder(points)).toEqual(modelOrder(points));
      }),
      // No shrinking on failure: shrinking arrays of 1,500 points takes minutes; the seed reproduces it.
      { numRuns: 300, seed: 21, endOnFailure: true },
    );
  });

  it("large rooms (radix sort with 11-bit digits): random doubles, a grid, a comb's reversed rows", () => {
    const random = seededRandom(8);
    const cases: P[][] = [
      Array.from({ length: 20_000 }, () => [random() * 2000 - 1000, random() * 2000 - 1000] as P),
      distinct(Array.from({ length: 30_000 }, () => [Math.floor(random() * 300), Math.floor(random() * 40)] as P)),
      comb(7000).outline as P[],
      orthogonalRoom(seededRandom(3), 2000, { everyMetre: true, height: 8 }).outline,
    ];
    for (const points of cases) {
      expect(points.length).toBeGreaterThan(8192);
      expect(ourOrder(points)).toEqual(modelOrder(points));
    }
  });
});

describe("triangulate with reused work arrays", () => {
  it("gives the same valid triangles before and after bigger rooms and failed calls", () => {
    const small = [
      ...agplibPolygons()
        .slice(0, 8)
        .map((p) => prepared(asRoom(p.rings))),
      prepared(comb(5)),
      prepared(spiralRoom(60)),
      prepared(orthogonalRoom(seededRandom(4), 6, { everyMetre: true })),
    ];
    const first = small.map((room) => triangulate(room).triangles);
    // A big room grows the shared arrays; two invalid rooms stop it half-way: in the pieces
    // (an obstacle outside the comb, to its right) and in the sweep (one to its left).
    const big = prepared(comb(4000));
    expect(faultsOf(big)).toEqual([]);
    const combOutline = comb(300).outline;
    expect(() => triangulate({ outline: combOutline, obstacles: [[[1000, 2], [1000, 8], [1004, 8], [1004, 2]]] })).toThrow(/triangulate:/);
    expect(() => triangulate({ outline: combOutline, obstacles: [[[-10, 2], [-10, 8], [-6, 8], [-6, 2]]] })).toThrow(/triangulate:/);
    small.forEach((room, i) => {
      expect(faultsOf(room)).toEqual([]);
      expect(triangulate(room).triangles).toEqual(first[i]);
    });
  });

  it("large rooms: a comb of 20,000 prongs, a 20,000-corner star, a spiral (the benchmark's adversarial shapes)", () => {
    const rooms = [prepared(comb(20_000)), prepared(spiralRoom(20_000, 35))];
    for (let seed = 20_000; rooms.length < 3; seed++) {
      const result = prepareRoom(starRoom(seededRandom(seed), 20_000), { maxVertices: 1e6 });
      if (result.ok) rooms.push(result.room);
    }
    for (const room of rooms) expect(faultsOf(room)).toEqual([]);
  });
});
