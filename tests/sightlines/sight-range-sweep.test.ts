// Sight range swept in fine steps: from 0.5 m to 20 m every 0.25 m, plus the ranges where a range
// circle meets a wall, a corner or another post's circle exactly (a 10 m x 10 m square with 5 m,
// 10 m, sqrt(50) m and sqrt(200) m among them), over a square, an L-shaped room and rooms with
// obstacles. Every answer must come back (never an internal error), and its certificate must be
// honest: each sampled point outside the parts it reports unseen is seen, within the range, by one
// of its posts, by the brute-force test of sampler.ts (common practice: check a certificate by
// sampling with code it shares nothing with). The fewest plan must then cover the sampled points.
import { describe, expect, it } from "vitest";
import { planRoom } from "@/lib/guarding/plan-room";
import type { Point, Room } from "@/lib/geometry/types";
import { inRegion, samplePoints, walls, watchers } from "./sampler";

const square: Room = { outline: [[0, 0], [10, 0], [10, 10], [0, 10]], obstacles: [] };
const lShaped: Room = { outline: [[0, 0], [8, 0], [8, 3], [3, 3], [3, 9], [0, 9]], obstacles: [] };
// A gallery with two pillars and a vitrine (obstacles listed clockwise or not: the pipeline normalises).
const pillared: Room = {
  outline: [[0, 0], [14, 0], [14, 9], [0, 9]],
  obstacles: [
    [[3, 3], [4, 3], [4, 4], [3, 4]],
    [[9, 3], [10, 3], [10, 4], [9, 4]],
    [[5, 6], [9, 6], [9, 6.5], [5, 6.5]],
  ],
};
// The same two pillars 2r apart for r = 2.5: two posts' circles of that range touch between them.
const touching: Room = { outline: [[0, 0], [12, 0], [12, 6], [0, 6]], obstacles: [[[5.5, 2.5], [6.5, 2.5], [6.5, 3.5], [5.5, 3.5]]] };

const fine: number[] = [];
for (let r = 0.5; r <= 20 + 1e-9; r += 0.25) fine.push(Math.round(r * 100) / 100);
const exact = [5, 10, Math.sqrt(50), Math.sqrt(200), Math.sqrt(2) * 4, 2.5, 3, 6, 8, 9, Math.hypot(8, 9), Math.hypot(14, 9) / 2, Math.hypot(14, 9)];
const ranges = [...new Set([...fine, ...exact])].sort((a, b) => a - b);

/** Whether p lies in a reported unseen part (outer ring minus holes), or too close to call. */
function reportedUnseen(p: Point, uncovered: Point[][][]): boolean {
  return uncovered.some((polygon) => {
    const outer = inRegion(p, polygon[0]);
    if (outer.gap < 1e-6) return true;
    if (!outer.inside) return false;
    return !polygon.slice(1).some((hole) => {
      const h = inRegion(p, hole);
      return h.inside && h.gap >= 1e-6;
    });
  });
}

function checkHonest(room: Room, range: number, method: "guaranteed" | "fewest", samples: number) {
  const outcome = planRoom(room, { method, sightRange: range, timeLimit: 2 });
  expect(outcome.ok, `${method} at ${range} m`).toBe(true);
  if (!outcome.ok) return null;
  const plan = outcome.planned.plan;
  expect(plan.covered, `${method} at ${range} m`).not.toBeNull();
  const wallList = walls(room);
  const missed = samplePoints(room, samples, 1e-4, 5).filter(
    (p) => !reportedUnseen(p, plan.uncovered as Point[][][]) && watchers(p, plan.posts, room, range, wallList) === 0,
  );
  expect(missed, `points the certificate calls seen at ${range} m (${method})`).toEqual([]);
  return plan;
}

describe("sight range sweep", () => {
  for (const [name, room] of [["10 m square", square], ["L-shaped room", lShaped], ["room with pillars and a vitrine", pillared], ["room with one pillar", touching]] as const) {
    it(`the guaranteed plan's certificate is honest at every range in ${name}`, () => {
      for (const range of ranges) checkHonest(room, range, "guaranteed", 150);
    });
  }

  it("the fewest plan covers every sampled point at ranges from 2.5 m up", () => {
    for (const room of [square, lShaped, pillared, touching]) {
      for (const range of ranges.filter((r) => r >= 2.5 && (Number.isInteger(r) || exact.includes(r)))) {
        const plan = checkHonest(room, range, "fewest", 200);
        if (plan) expect(plan.covered, `fewest at ${range} m`).toBe(1);
      }
    }
  }, 120_000);
});
