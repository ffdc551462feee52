// The witness-cell lower bound never exceeds a known minimum, and reaches it: the comb with k prongs needs exactly k
// posts (Chvátal 1975), a convex or L-shaped room exactly one (convexity; the reflex corner sees an
// L). Fed with many witnesses at once, it may claim no more.
import { describe, expect, it } from "vitest";
import { triangulate } from "@/lib/geometry/triangulate";
import { createSightlines } from "@/lib/geometry/visibility";
import { comb } from "@/lib/guarding/comb";
import { arrangementBound } from "@/lib/guarding/lower-bound-arrangement";
import type { Point, Room } from "@/lib/geometry/types";
import { prepared } from "./rooms";
import { samplePoints, walls } from "./sampler";

/** Corners, wall midpoints and sampled interior points, with their visibility regions. */
function witnessesOf(room: Room, interior: number) {
  const sightlines = createSightlines(room, triangulate(room));
  const points: Point[] = [...walls(room).map(([a]) => a), ...samplePoints(room, interior, 1e-3, 5)];
  return points.flatMap((point) => {
    const answer = sightlines.regionOf(point);
    return answer.ok ? [{ point, region: [[answer.region]], weight: 1 }] : [];
  });
}

const known: [string, Room, number][] = [
  ["comb with 4 prongs (Chvátal 1975)", prepared(comb(4)), 4],
  ["comb with 6 prongs (Chvátal 1975)", prepared(comb(6)), 6],
  ["L-shaped room (seen from its reflex corner)", prepared({ outline: [[0, 0], [8, 0], [8, 3], [3, 3], [3, 9], [0, 9]], obstacles: [] }), 1],
  ["convex room (convexity)", prepared({ outline: [[0, 0], [6, 0], [7, 5], [1, 6]], obstacles: [] }), 1],
];

describe("lower bounds never exceed a known minimum", () => {
  for (const [name, room, minimum] of known) {
    it(`${name}: the witness cells give exactly ${minimum}`, () => {
      const witnesses = witnessesOf(room, 40);
      const cells = arrangementBound(room, witnesses.map((w) => w.region), { seconds: 20 });
      expect(cells.witnesses).toBe(witnesses.length);
      expect(cells.bound).toBe(minimum);
    });
    // Double cover: every point seen by two posts. The comb needs 2k (no post sees two tips, each
    // tip needs two; Chvátal 1975 twice); an L-shaped or convex room two (two points at the reflex
    // corner, or anywhere). The cells offer each cell twice, so the bound must reach exactly that.
    it(`${name}, double cover: the witness cells give exactly ${2 * minimum}`, () => {
      const witnesses = witnessesOf(room, 40);
      const cells = arrangementBound(room, witnesses.map((w) => w.region), { seconds: 20, demand: 2 });
      expect(cells.bound).toBe(2 * minimum);
    });
  }
});
