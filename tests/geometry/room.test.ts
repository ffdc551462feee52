// Rooms: normalisation and validation (lib/geometry/room.ts). Sources: the fixtures in
// tests/fixtures/rooms (hard cases in earcut's fixture style), the AGPLIB benchmark polygons (AGPLIB,
// Univ. of Campinas), and an O(n^2) brute-force validity check written for the tests (oracle.ts).
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { normaliseRoom, prepareRoom, validateRoom, locatePoint } from "@/lib/geometry/room";
import { ringOrientation } from "@/lib/geometry/predicates";
import { bruteForceValid, shoelace, type P } from "./support/oracle";
import { roomFixtures } from "./support/fixtures";
import { agplibPolygons, asRoom } from "./support/agplib";

describe("normaliseRoom", () => {
  it("turns the outline counter-clockwise and obstacles clockwise, drops repeats, keeps collinear corners", () => {
    const room = normaliseRoom({
      outline: [[0, 0], [0, 4], [0, 4], [2, 4], [4, 4], [4, 0], [0, 0]],
      obstacles: [[[1, 1], [2, 1], [2, 2], [1, 2], [1, 1]]],
    });
    expect(shoelace(room.outline)).toBeGreaterThan(0);
    expect(shoelace(room.obstacles[0])).toBeLessThan(0);
    expect(room.outline).toHaveLength(5); // (2, 4) is collinear and stays
    expect(room.outline.some(([x, y]) => x === 2 && y === 4)).toBe(true);
    expect(room.obstacles[0]).toHaveLength(4);
  });

  it("drops a repeat that wraps around the closing point", () => {
    const room = normaliseRoom({ outline: [[0, 0], [3, 0], [3, 3], [0, 0], [0, 0]], obstacles: [] });
    expect(room.outline).toHaveLength(3);
  });
});

describe("validateRoom on the hard-case fixtures", () => {
  for (const fixture of roomFixtures()) {
    it(`${fixture.name}: ${fixture.note}`, () => {
      const input = { outline: fixture.rings[0], obstacles: fixture.rings.slice(1) };
      const problems = validateRoom(input);
      if (fixture.expected.valid) {
        expect(problems).toEqual([]);
        const prepared = prepareRoom(input);
        expect(prepared.ok).toBe(true);
        if (prepared.ok) {
          const n = prepared.room.outline.length + prepared.room.obstacles.reduce((s, o) => s + o.length, 0);
          expect(n).toBe(fixture.expected.vertices);
          expect(prepared.room.obstacles).toHaveLength(fixture.expected.obstacles);
        }
      } else {
        expect(problems.length).toBeGreaterThan(0);
        expect(problems[0].code).toBe(fixture.expected.code);
        expect(problems[0].message).toContain(fixture.expected.message);
        // The brute-force check knows walls, not coordinate limits.
        if (fixture.expected.code !== "out-of-range") {
          expect(bruteForceValid({ outline: fixture.rings[0], obstacles: fixture.rings.slice(1) })).toBe(false);
        }
      }
    });
  }
});

describe("validateRoom messages", () => {
  const square: P[] = [[0, 0], [10, 0], [10, 10], [0, 10]];

  it("names both walls and the point of a crossing, numbering vertices as given", () => {
    // Wall numbering: wall i-j joins vertex i to vertex i + 1, 1-based, in the order drawn.
    const problems = validateRoom({ outline: [[0, 0], [4, 0], [4, 4], [2, -2], [0, 4]], obstacles: [] });
    expect(problems[0]).toMatchObject({ code: "self-intersection" });
    expect(problems[0].message).toMatch(/^walls 1-2 and 4-5 of the outline cross at \(1\.333, 0\.0\)$/);
    expect(problems[0].at![0]).toBeCloseTo(4 / 3, 9);
  });

  it("keeps the curator's numbers when a point was repeated", () => {
    const problems = validateRoom({ outline: [[0, 0], [0, 0], [4, 0], [4, 4], [2, -2], [0, 4]], obstacles: [] });
    expect(problems[0].message).toContain("walls 2-3 and 5-6");
  });

  it("names the walls that meet at a corner drawn twice", () => {
    const problems = validateRoom({ outline: [[0, 0], [4, 0], [2, 2], [4, 4], [0, 4], [2, 2]], obstacles: [] });
    expect(problems[0]).toMatchObject({
      code: "self-intersection",
      message: "walls 3-4 and 6-1 of the outline touch at (2.0, 2.0): vertices 3 and 6 are the same point",
      at: [2, 2],
    });
  });

  it("reports non-finite and far-away coordinates with their vertex", () => {
    expect(validateRoom({ outline: [[0, 0], [NaN, 1], [1, 1]], obstacles: [] })[0]).toMatchObject({
      code: "non-finite",
      message: "vertex 2 of the outline has a coordinate that is not a finite number",
    });
    expect(validateRoom({ outline: [[0, 0], [1, 0], [1, Infinity]], obstacles: [] })[0].code).toBe("non-finite");
    expect(validateRoom({ outline: [[0, 0], [1e7, 0], [1, 1]], obstacles: [] })[0].code).toBe("out-of-range");
  });

  it("refuses rooms over the vertex limit", () => {
    const problems = validateRoom({ outline: square, obstacles: [] }, { maxVertices: 3 });
    expect(problems[0]).toMatchObject({ code: "too-many-vertices", message: "the room has 4 vertices; the limit is 3" });
    expect(validateRoom({ outline: square, obstacles: [] }, { maxVertices: 4 })).toEqual([]);
    // The limit counts corners, not the repeated closing point.
    expect(validateRoom({ outline: [...square, square[0]], obstacles: [] }, { maxVertices: 4 })).toEqual([]);
  });

  it("rejects obstacles crossing the outline, each other, or too small to be rings", () => {
    expect(validateRoom({ outline: square, obstacles: [[[8, 4], [12, 4], [12, 6], [8, 6]]] })[0].code).toBe("obstacle-crossing");
    expect(
      validateRoom({ outline: square, obstacles: [[[1, 1], [5, 1], [5, 5], [1, 5]], [[4, 4], [8, 4], [8, 8], [4, 8]]] })[0].message,
    ).toMatch(/obstacle 2 and wall .* of obstacle 1 cross at/);
    expect(validateRoom({ outline: square, obstacles: [[[1, 1], [2, 2]]] })[0]).toMatchObject({
      code: "too-few-points",
      message: "obstacle 1 has only 2 distinct points; it needs at least 3",
    });
    expect(validateRoom({ outline: square, obstacles: [[[1, 1], [2, 2], [3, 3]]] })[0].code).toBe("zero-area");
  });

  it("rejects a room lying inside its own obstacle", () => {
    const problems = validateRoom({ outline: [[4, 4], [6, 4], [6, 6], [4, 6]], obstacles: [square] });
    expect(problems[0]).toMatchObject({ code: "obstacle-outside", message: "obstacle 1 lies outside the room" });
  });
});

describe("validateRoom on the public benchmark polygons (AGPLIB, Univ. of Campinas)", () => {
  it("accepts all 44 and agrees with the brute-force check", () => {
    const polygons = agplibPolygons();
    expect(polygons).toHaveLength(44);
    for (const polygon of polygons) {
      expect(validateRoom(asRoom(polygon.rings)), polygon.file).toEqual([]);
      expect(bruteForceValid(asRoom(polygon.rings)), polygon.file).toBe(true);
    }
  });
});

describe("validateRoom agrees with the O(n^2) brute-force check (fast-check property)", () => {
  // Small integer grids make touching corners, T-junctions, overlaps and folds common.
  const gridPoint = fc.tuple(fc.integer({ min: 0, max: 6 }), fc.integer({ min: 0, max: 6 })) as fc.Arbitrary<P>;

  it("on random rings", () => {
    fc.assert(
      fc.property(fc.array(gridPoint, { minLength: 3, maxLength: 12 }), (ring) => {
        const room = { outline: ring, obstacles: [] };
        expect(validateRoom(room).length === 0).toBe(bruteForceValid(room));
      }),
      { numRuns: 3000, seed: 20261201 },
    );
  });

  it("on random rooms with random obstacles", () => {
    const obstacle = fc.array(gridPoint, { minLength: 3, maxLength: 5 });
    fc.assert(
      fc.property(fc.array(gridPoint, { minLength: 3, maxLength: 10 }), fc.array(obstacle, { maxLength: 3 }), (outline, obstacles) => {
        const room = { outline: outline.map(([x, y]) => [x * 2, y * 2] as P), obstacles };
        expect(validateRoom(room).length === 0).toBe(bruteForceValid(room));
      }),
      { numRuns: 3000, seed: 7 },
    );
  });

  it("on a valid grid room with obstacles near or on its walls", () => {
    const outline: P[] = [[0, 0], [6, 0], [6, 3], [3, 3], [3, 6], [0, 6]];
    fc.assert(
      fc.property(fc.array(fc.array(gridPoint, { minLength: 3, maxLength: 4 }), { minLength: 1, maxLength: 3 }), (obstacles) => {
        const room = { outline, obstacles };
        expect(validateRoom(room).length === 0).toBe(bruteForceValid(room));
      }),
      { numRuns: 3000, seed: 11 },
    );
  });
});

describe("ringOrientation and locatePoint", () => {
  it("decide orientation exactly even for a sliver", () => {
    expect(ringOrientation([[0, 0], [1, 1e-300], [2, 0], [1, 1]])).toBe(1);
    expect(ringOrientation([[0, 0], [1, 1], [2, 0]])).toBe(-1);
  });

  it("tell floor, wall and obstacle apart (robust-point-in-polygon agrees on the outline)", () => {
    const room = normaliseRoom({ outline: [[0, 0], [10, 0], [10, 10], [0, 10]], obstacles: [[[4, 4], [6, 4], [6, 6], [4, 6]]] });
    expect(locatePoint(room, [1, 1])).toBe("inside");
    expect(locatePoint(room, [10, 5])).toBe("wall");
    expect(locatePoint(room, [5, 4])).toBe("wall");
    expect(locatePoint(room, [5, 5])).toBe("outside");
    expect(locatePoint(room, [11, 5])).toBe("outside");
  });
});
