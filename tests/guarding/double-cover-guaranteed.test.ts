// The guaranteed plan when every point must be seen by two posts. Source: Fisk, "A short proof of
// Chvátal's watchman theorem", J. Combin. Theory B 24 (1978): in a 3-coloured triangulation every
// triangle has one corner of each colour and a corner sees its whole (convex) triangle, so each
// colour class sees the floor and any two classes see every point twice. The two smallest of three
// classes hold at most floor(2n/3) corners. Checked here by the engine's certificate and again by
// an independent sight test (robust-predicates' orientation test, robust-point-in-polygon).
import { describe, expect, it } from "vitest";
import { createRequire } from "node:module";
import { orient2d } from "robust-predicates";
import { planRoom } from "@/lib/guarding/plan-room";
import { certifyCoverage } from "@/lib/geometry/coverage";
import { comb } from "@/lib/guarding/comb";
import type { Point, Ring, Room } from "@/lib/geometry/types";
import { agplibRoom } from "../sightlines/rooms";

const pointInPolygon = createRequire(import.meta.url)("robust-point-in-polygon") as (loop: Point[], point: Point) => -1 | 0 | 1;

function crosses(a: Point, b: Point, c: Point, d: Point): boolean {
  const d1 = orient2d(a[0], a[1], b[0], b[1], c[0], c[1]);
  const d2 = orient2d(a[0], a[1], b[0], b[1], d[0], d[1]);
  const d3 = orient2d(c[0], c[1], d[0], d[1], a[0], a[1]);
  const d4 = orient2d(c[0], c[1], d[0], d[1], b[0], b[1]);
  return d1 * d2 < 0 && d3 * d4 < 0;
}

/** Does p see q inside the simple outline (no wall properly crossed, midpoint inside)? */
function sees(outline: Ring, p: Point, q: Point): boolean {
  for (let i = 0; i < outline.length; i++) if (crosses(p, q, outline[i], outline[(i + 1) % outline.length])) return false;
  return pointInPolygon(outline, [(p[0] + q[0]) / 2, (p[1] + q[1]) / 2]) <= 0;
}

/** Grid points strictly inside the outline. */
function samples(outline: Ring, steps: number): Point[] {
  const xs = outline.map((p) => p[0]);
  const ys = outline.map((p) => p[1]);
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const out: Point[] = [];
  for (let i = 1; i < steps; i++) {
    for (let j = 1; j < steps; j++) {
      const p: Point = [x0 + ((x1 - x0) * (i + 0.37)) / steps, y0 + ((y1 - y0) * (j + 0.61)) / steps];
      if (pointInPolygon(outline, p) === -1) out.push(p);
    }
  }
  return out;
}

function guaranteedFor(room: Room, doubleCover: boolean) {
  const outcome = planRoom(room, { method: "guaranteed", doubleCover, withRegions: true });
  if (!outcome.ok) throw new Error(outcome.problems.map((p) => p.message).join("; "));
  return outcome.planned;
}

const simpleRooms: [string, Room][] = [
  ["a comb of 6 prongs", comb(6)],
  ["a comb of 15 prongs", comb(15)],
  ["the benchmark polygon random-100-1", agplibRoom("random-100-1")],
  ["the benchmark polygon random-100-2", agplibRoom("random-100-2")],
];

describe("double cover: the guaranteed plan is two colour classes", () => {
  it.each(simpleRooms)("%s: every point is seen twice, by at most floor(2n/3) posts", (_name, room) => {
    const planned = guaranteedFor(room, true);
    const n = planned.vertices;
    expect(room.obstacles ?? []).toHaveLength(0);
    expect(planned.plan.posts.length).toBeGreaterThan(planned.guaranteed.posts.length);
    expect(planned.plan.posts.length).toBeLessThanOrEqual(Math.floor((2 * n) / 3));
    // The engine's exact certificate, demand two.
    expect(certifyCoverage(planned.room, planned.regions!, 2).covered).toBe(1);
    expect(planned.plan.covered).toBe(1);
    // And independently: every sampled point sees at least two of the posts.
    const outline = planned.room.outline;
    const points = samples(outline, 30);
    expect(points.length).toBeGreaterThan(50);
    for (const q of points) {
      const seenBy = planned.plan.posts.filter((post) => sees(outline, post, q)).length;
      expect(seenBy, `point ${q.join(", ")}`).toBeGreaterThanOrEqual(2);
    }
  });

  it("one colour class alone does not see a comb twice (why two are needed)", () => {
    const single = guaranteedFor(comb(6), false);
    expect(certifyCoverage(single.room, single.regions!, 1).covered).toBe(1);
    expect(certifyCoverage(single.room, single.regions!, 2).covered).toBeLessThan(1);
  });

  it("rooms with obstacles: the two classes are certified seen twice by the engine", () => {
    const planned = guaranteedFor(agplibRoom("gB_simple-simple_25_100v-10h_1"), true);
    expect(planned.obstacles).toBeGreaterThan(0);
    expect(planned.plan.covered).toBe(1);
    expect(certifyCoverage(planned.room, planned.regions!, 2).covered).toBe(1);
  });
});
