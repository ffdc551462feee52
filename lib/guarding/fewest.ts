// The fewest plan for a room: the public entry point (see fewest-core.ts for the method and
// lower-bound-arrangement.ts for the proof of how few posts suffice).
import type { Point, Room, Triangulation } from "../geometry/types";
import { triangulate } from "../geometry/triangulate";
import { planGuaranteed } from "./guaranteed";
import { planFewestOver, type FewestOptions, type FewestPlan } from "./fewest-core";
import { roomKernel } from "../geometry/kernel";
import { discCorners } from "../geometry/visibility-range";
import { allowedPost } from "./constraints";

export type { FewestOptions, FewestPlan } from "./fewest-core";

/**
 * Plans the fewest posts for a normalised, valid room (prepareRoom's output). Never worse than the
 * guaranteed plan: that plan is the first upper bound whenever it meets the constraints.
 */
export function planFewest(
  room: Room,
  options: FewestOptions & { triangulation?: Triangulation; guaranteedPosts?: Point[]; guaranteedCovered?: boolean } = {},
): FewestPlan {
  const easy = planFromKernel(room, options);
  if (easy) return easy;
  const triangulation = options.triangulation ?? triangulate(room);
  const guaranteedPosts = options.guaranteedPosts ?? planGuaranteed(room, triangulation).posts;
  return planFewestOver(room, triangulation, { ...options, startingPlan: guaranteedPosts, startingCovered: options.guaranteedCovered });
}

/**
 * The fast path for rooms one point sees entirely (a convex or star-shaped room without obstacles):
 * posts in the kernel (lib/geometry/kernel.ts), one, or two for double cover, each seeing the whole
 * floor. Proven at once: any plan needs at least one post (two for double cover), since the floor
 * has area. Null when the kernel is empty or the constraints rule it out (pinned posts, a sight
 * range the room does not fit in from any tried kernel point, forbidden zones over the tried
 * points, an invalid range): then the general planner decides.
 */
export function planFromKernel(room: Room, options: FewestOptions = {}): FewestPlan | null {
  if (options.pinned && options.pinned.length > 0) return null;
  const range = options.sightRange;
  if (range !== undefined && !(Number.isFinite(range) && range > 0)) return null;
  // Within the inner radius of the disc polygon the certificate draws (visibility-range.ts).
  const reach = range !== undefined ? range * Math.cos(Math.PI / discCorners(range)) * (1 - 1e-9) : Infinity;
  const demand = options.doubleCover ? 2 : 1;
  const kernel = roomKernel(room, {
    count: demand,
    accept: (p) =>
      allowedPost(p, options) && (reach === Infinity || room.outline.every(([x, y]) => Math.hypot(x - p[0], y - p[1]) <= reach)),
  });
  if (!kernel) return null;
  return {
    posts: kernel.points,
    lowerBound: demand,
    proven: true,
    covered: 1,
    uncovered: [],
    boundWitnesses: [kernel.points[0]],
    witnesses: 0,
    rounds: 0,
    stoppedBy: "proven",
    problems: [],
    proof: "kernel",
  };
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
      plan.proof === "kernel"
        ? "kernel: each post stands on the inner side of every wall (exact orientation test), so it sees the whole room; any plan needs at least one post"
        : "witness cells: no set of fewer points sees all bound witnesses (overlay of their visibility regions, exact integer program); any plan needs at least one post",
    boundWitnesses: plan.boundWitnesses,
    stoppedBy: plan.stoppedBy,
    ...(plan.problems.length ? { problems: plan.problems } : {}),
  };
}
