// Exact predicates (lib/geometry/predicates.ts) and the sweep status (lib/geometry/sweep-status.ts).
// Reference: exact rational arithmetic with BigInt (every double is a dyadic rational), the ground
// truth that Shewchuk's adaptive predicates (1997; npm robust-predicates) promise to reproduce; the
// sweep status (an AVL tree) is compared with a sorted array.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { orient, orientSign, segmentsMeet, isAbove, compareTopDown } from "@/lib/geometry/predicates";
import { IndexSweepStatus, SweepStatus } from "@/lib/geometry/sweep-status";
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

describe("SweepStatus (AVL tree)", () => {
  it("keeps order, neighbours and removals like a sorted array", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.boolean(), fc.integer({ min: 0, max: 200 })), { maxLength: 300 }), (operations) => {
        const status = new SweepStatus<number>();
        const model: number[] = [];
        const nodes = new Map<number, ReturnType<typeof status.insert>>();
        for (const [add, value] of operations) {
          if (add && !nodes.has(value)) {
            nodes.set(value, status.insert(value, (other) => other < value));
            model.push(value);
            model.sort((a, b) => a - b);
          } else if (!add && nodes.has(value)) {
            const node = nodes.get(value)!;
            const i = model.indexOf(value);
            expect(status.before(node)?.item ?? null).toBe(i > 0 ? model[i - 1] : null);
            expect(status.after(node)?.item ?? null).toBe(i + 1 < model.length ? model[i + 1] : null);
            status.remove(node);
            nodes.delete(value);
            model.splice(i, 1);
          }
          expect(status.items()).toEqual(model);
          expect(status.size).toBe(model.length);
          const probe = value + 0.5;
          const below = model.filter((v) => v < probe);
          expect(status.lastWhere((v) => v < probe)?.item ?? null).toBe(below.length ? below[below.length - 1] : null);
        }
      }),
      { numRuns: 200, seed: 2 },
    );
  });
});

describe("IndexSweepStatus (AVL tree over typed arrays)", () => {
  it("keeps order and removals like a sorted array (the model: a plain sorted array)", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.boolean(), fc.integer({ min: 0, max: 200 })), { maxLength: 300 }), (operations) => {
        const status = new IndexSweepStatus(402);
        const model: number[] = [];
        for (const [add, value] of operations) {
          if (add && !model.includes(value)) {
            status.insert(value, (other, probe) => other < probe, value);
            model.push(value);
            model.sort((a, b) => a - b);
          } else if (!add && model.includes(value)) {
            // Half the removals replace the entry in place by a fresh one (value + 201) and remove that.
            if (value % 2 === 0) {
              status.replace(value, value + 201);
              const inPlace = model.map((v) => (v === value ? value + 201 : v));
              expect(status.items()).toEqual(inPlace);
              status.remove(value + 201);
            } else status.remove(value);
            model.splice(model.indexOf(value), 1);
          }
          expect(status.items()).toEqual(model);
          expect(status.size).toBe(model.length);
          const probe = value + 0.5;
          const below = model.filter((v) => v < probe);
          expect(status.lastWhere((v, p) => v < p, probe)).toBe(below.length ? below[below.length - 1] : -1);
        }
      }),
      { numRuns: 200, seed: 3 },
    );
  });

  it("refuses entries outside its capacity and removal of absent entries", () => {
    const status = new IndexSweepStatus(4);
    expect(() => status.insert(4, () => false, 0)).toThrow(RangeError);
    expect(() => status.remove(2)).toThrow(RangeError);
  });
});
