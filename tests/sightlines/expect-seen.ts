// The independent coverage check of a plan, shared by the sightlines tests (common practice:
// confirm a certificate by brute-force sampling that shares no code with it).
import { expect } from "vitest";
import type { FewestPlan } from "@/lib/guarding/fewest";
import type { Room } from "@/lib/geometry/types";
import { distanceToSegment, insideRoom, samplePoints, walls, watchers } from "./sampler";

/** Every sampled point is seen by `demand` posts, and every post stands in the room or on a wall. */
export function expectSeen(room: Room, plan: FewestPlan, demand = 1, range = Infinity, samples = 400) {
  const wallList = walls(room);
  for (const post of plan.posts) {
    expect(insideRoom(post, room) || wallList.some(([a, b]) => distanceToSegment(post, a, b) < 1e-9), `post ${post}`).toBe(true);
  }
  for (const p of samplePoints(room, samples, 1e-4, 17)) {
    expect(watchers(p, plan.posts, room, range, wallList), `point ${p}`).toBeGreaterThanOrEqual(demand);
  }
}

