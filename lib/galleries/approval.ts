// What a change of walls costs against the approved plan, and what a stale approval means, in the
// words every page uses (room page, exhibitions, staffing). Pure: server pages and the editor share it.
import { staffingCost } from "../guarding/staffing-cost";

export interface CostDifference {
  posts: number;
  postHoursPerWeek: number;
  fte: number;
  costPerWeek: number;
}

/** The difference `now - approved` in posts, post-hours a week, FTE and money a week (defaults for contract and relief). */
export function costDifference(approvedPosts: number, nowPosts: number, weeklyOpenHours: number, hourlyRate: number): CostDifference {
  const before = staffingCost({ posts: approvedPosts, weeklyOpenHours, hourlyRate });
  const after = staffingCost({ posts: nowPosts, weeklyOpenHours, hourlyRate });
  return {
    posts: nowPosts - approvedPosts,
    postHoursPerWeek: after.postHoursPerWeek - before.postHoursPerWeek,
    fte: after.fte - before.fte,
    costPerWeek: after.costPerWeek - before.costPerWeek,
  };
}

/** "+1 post", "−2 posts", "no change in posts". */
export function postsChange(difference: number): string {
  if (difference === 0) return "no change in posts";
  return `${difference > 0 ? "+" : "−"}${Math.abs(difference)} post${Math.abs(difference) === 1 ? "" : "s"}`;
}

/** A signed amount: "+63", "−1.9", "±0", formatted by `format` (the site's locale). */
export function signed(value: number, format: (n: number) => string): string {
  if (Math.abs(value) < 1e-9) return `±${format(0)}`;
  return `${value > 0 ? "+" : "−"}${format(Math.abs(value))}`;
}

export interface StaleApproval {
  roomName: string;
  exhibitionName: string;
  planId: number | null;
  planRoomVersion: number | null;
  roomVersion: number;
}

/** What is stale and what to do, without the room's name (for a line that names the room already). */
export function staleApprovalDetail(s: Omit<StaleApproval, "roomName">): string {
  return `plan ${s.planId} for ${s.exhibitionName} was approved for version ${s.planRoomVersion} of the walls, which are at version ${s.roomVersion} now. Rosters still staff the approved posts; operations should compute a new plan for the room and approve it.`;
}

/** One sentence saying what is stale and what to do. */
export function staleApprovalText(s: StaleApproval): string {
  return `${s.roomName}: ${staleApprovalDetail(s)}`;
}
