// Minimum-cost assignment (Kuhn 1955, Munkres 1957) against brute force over every assignment of small random matrices.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { assignMinCost } from "@/lib/scheduling/hungarian";

function bruteForce(cost: number[][], columns: number): number {
  let best = Infinity;
  const used = new Array(columns).fill(false);
  const walk = (row: number, sum: number) => {
    if (row === cost.length) return void (best = Math.min(best, sum));
    for (let c = 0; c < columns; c++) {
      if (used[c]) continue;
      used[c] = true;
      walk(row + 1, sum + cost[row][c]);
      used[c] = false;
    }
  };
  walk(0, 0);
  return best;
}

describe("assignMinCost", () => {
  it("matches brute force on random rectangular matrices", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 5 }).chain((rows) =>
          fc.integer({ min: rows, max: 6 }).chain((cols) => fc.tuple(fc.constant(cols), fc.array(fc.array(fc.integer({ min: 0, max: 50 }), { minLength: cols, maxLength: cols }), { minLength: rows, maxLength: rows }))),
        ),
        ([cols, cost]) => {
          const choice = assignMinCost(cost, cols);
          expect(new Set(choice).size).toBe(choice.length);
          const total = choice.reduce((sum, c, r) => sum + cost[r][c], 0);
          expect(total).toBe(bruteForce(cost, cols));
        },
      ),
      { numRuns: 200, seed: 5 },
    );
  });
});
