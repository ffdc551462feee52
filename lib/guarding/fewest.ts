// The fewest plan for a room: the public entry point (see fewest-core.ts for the method and
// lower-bound-arrangement.ts for the proof of how few posts suffice).
import type { Point, Room, Triangulation } from "../geometry/types";
import { triangulate } from "../geometry/triangulate";
import { planGuaranteed } from "./guaranteed";
import { planFewestOver, type FewestOptions, type FewestPlan } from "./fewest-core";

export type { FewestOptions, FewestPlan } from "./fewest-core";

/**
 * Plans the fewest posts for a normalised, valid room (prepareRoom's output). Never worse than the
 * guaranteed plan: that plan is the first upper bound whenever it meets the constraints.
 */
export function planFewest(
  room: Room,
  options: FewestOptions & { triangulation?: Triangulation; guaranteedPosts?: Point[] } = {},
): FewestPlan {
  const triangulation = options.triangulation ?? triangulate(room);
  const guaranteedPosts = options.guaranteedPosts ?? planGuaranteed(room, triangulation).posts;
  return planFewestOver(room, triangulation, { ...options, startingPlan: guaranteedPosts });
}

/** The `fewest` object of the `posts` command's room (scripts/README.md), with a few extra fields. */
export function fewestReport(plan: FewestPlan) {
  return {
    posts: plan.posts,
    lowerBound: plan.lowerBound,
    proven: plan.proven,
    covered: plan.covered,
    uncovered: plan.uncovered.map((polygon) => polygon[0]),
    lowerBoundProof:
      "witness cells: no set of fewer points sees all bound witnesses (overlay of their visibility regions, exact integer program)",
    boundWitnesses: plan.boundWitnesses,
    stoppedBy: plan.stoppedBy,
    ...(plan.problems.length ? { problems: plan.problems } : {}),
  };
}
