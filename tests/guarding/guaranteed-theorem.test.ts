// The guaranteed plan's coverage said by the theorem, not by a certificate, when nothing is left
// out (no sight range, every corner allowed): every triangle of the triangulation has a corner of
// each colour and a corner sees its convex triangle (Fisk 1978; O'Rourke 1987 for rooms with holes),
// so the smallest colour class sees the floor. Checked against sampled points by the brute-force
// sampler of tests/sightlines (common practice), on AGPLIB rooms with and without obstacles; the
// drawing's region limit leaves the sight regions out of a 2,000-corner room's answer.
import { describe, expect, it } from "vitest";
import { planRoom } from "@/lib/guarding/plan-room";
import type { Point } from "@/lib/geometry/types";
import { agplibRoom } from "../sightlines/rooms";
import { samplePoints, walls, watchers } from "../sightlines/sampler";

describe("the guaranteed plan covered by the theorem", () => {
  for (const name of ["randsimple-100-2", "gB_simple-simple_25_100v-10h_3", "vonkoch-100-1"]) {
    it(`${name}: answered without a certificate, and every sampled point is seen`, () => {
      const room = agplibRoom(name);
      const outcome = planRoom(room, { method: "guaranteed" });
      expect(outcome.ok).toBe(true);
      if (!outcome.ok) return;
      const { plan, ms } = outcome.planned;
      expect(plan).toMatchObject({ covered: 1, coveredBy: "theorem", uncovered: [] });
      expect(ms.certificate).toBeUndefined();
      const wallList = walls(room);
      const unseen = samplePoints(room, 400, 1e-4, 3).filter((p) => watchers(p, plan.posts, room, Infinity, wallList) === 0);
      expect(unseen).toEqual([]);
    });
  }

  it("still certifies with a sight range (the theorem says nothing then)", () => {
    const outcome = planRoom(agplibRoom("randsimple-100-2"), { method: "guaranteed", sightRange: 3 });
    expect(outcome.ok && outcome.planned.plan.coveredBy).toBe("certificate");
    expect(outcome.ok && outcome.planned.ms.certificate).toBeGreaterThanOrEqual(0);
  });

  it("leaves sight regions out past the region limit, and says so", () => {
    const n = 2000;
    const outline: Point[] = Array.from({ length: n }, (_, i) => [50 * Math.cos((2 * Math.PI * i) / n), 50 * Math.sin((2 * Math.PI * i) / n)]);
    const outcome = planRoom({ outline, obstacles: [] }, { method: "guaranteed", withRegions: true, regionLimit: 300 });
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    expect(outcome.planned.plan.posts.length).toBeGreaterThan(300);
    expect(outcome.planned.regions).toBeUndefined();
    expect(outcome.planned.regionsOmitted).toBe(true);
    expect(outcome.planned.plan).toMatchObject({ covered: 1, coveredBy: "theorem" });
    const small = planRoom(agplibRoom("randsimple-100-2"), { method: "guaranteed", withRegions: true, regionLimit: 300 });
    expect(small.ok && small.planned.regions?.length).toBe(small.ok ? small.planned.plan.posts.length : -1);
  });
});
