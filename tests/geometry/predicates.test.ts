// Exact predicates (lib/geometry/predicates.ts); the sweep status has its own tests (sweep-status.test.ts).
// Reference: exact rational arithmetic with BigInt (every double is a dyadic rational), the ground
// truth that Shewchuk's adaptive predicates (1997; npm robust-predicates) promise to reproduce.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { orient, orientSign, segmentsMeet, isAbove, compareTopDown } from "@/lib/geometry/predicates";
import type { Point } from "@/lib/geometry/types";

const SCALE = 2n ** 80n;
/** Exact value of a double that is a multiple of 2^-80, scaled to an integer. */
const exact = (x: number) => BigInt(x * 2 ** 80);
function exactOrientSign(a: Point, b: Point, c: Point): number {
  const [ax, ay, bx, by, cx, cy] = [a[0], a[1], b[0], b[1], c[0], c[1]].map(exact);
  const det = (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
  void SCALE;
  return det > 0n ? 1 : det < 0n ? -1 : 0;
}

describe("orient", () => {
  it("is positive for counter-clockwise, negative for clockwise, zero for collinear", () => {
    expect(orient([0, 0], [1, 0], [0, 1])).toBeGreaterThan(0);
    expect(orient([0, 0], [0, 1], [1, 0])).toBeLessThan(0);
    expect(orient([0, 0], [1, 1], [3, 3])).toBe(0);
  });

  it("agrees with exact arithmetic on nearly collinear points, where naive floating point fails", () => {
    // Points on the line y = x nudged by a few units in the last place: the classic failure case.
    const nearLine = fc.tuple(fc.integer({ min: -1000, max: 1000 }), fc.integer({ min: -4, max: 4 })).map(
      ([k, nudge]) => [k / 64 + 0.5, k / 64 + 0.5 + nudge * 2 ** -52] as Point,
    );
    let naiveWrong = 0;
    fc.assert(
      fc.property(nearLine, nearLine, nearLine, (a, b, c) => {
        const truth = exactOrientSign(a, b, c);
        expect(orientSign(a, b, c)).toBe(truth);
        const naive = (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
        if (Math.sign(naive) !== truth) naiveWrong++;
      }),
      { numRuns: 5000, seed: 1 },
    );
    // Not an assertion about us: it shows the test cases are hard enough to matter.
    expect(naiveWrong).toBeGreaterThan(0);
  });

  it("decides segment meetings exactly, including touching ends and collinear overlaps", () => {
    expect(segmentsMeet([0, 0], [2, 2], [0, 2], [2, 0])).toBe(true);
    expect(segmentsMeet([0, 0], [1, 0], [1, 0], [2, 5])).toBe(true);
    expect(segmentsMeet([0, 0], [2, 0], [1, 0], [3, 0])).toBe(true);
    expect(segmentsMeet([0, 0], [1, 0], [2, 0], [3, 0])).toBe(false);
    expect(segmentsMeet([0, 0], [1, 1], [0, 1e-17], [1, 1 + 2 ** -52])).toBe(false); // parallel, one ulp apart
  });

  it("orders the sweep top-down with ties broken by x", () => {
    expect(isAbove([0, 1], [0, 0])).toBe(true);
    expect(isAbove([0, 0], [1, 0])).toBe(true);
    expect(isAbove([1, 0], [0, 0])).toBe(false);
    const sorted = ([[2, 0], [0, 0], [1, 5], [0, 5]] as Point[]).sort(compareTopDown);
    expect(sorted).toEqual([[0, 5], [1, 5], [0, 0], [2, 0]]);
  });
});
