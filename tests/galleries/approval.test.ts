// The cost of a wall change against the approved plan: posts x weekly open hours, FTE = post-hours
// / contract hours x relief factor (40 h and 1.2 by default, common practice), money = paid hours x
// rate; worked by hand below. And the words for a stale approval.
import { describe, expect, it } from "vitest";
import { costDifference, postsChange, signed, staleApprovalText } from "@/lib/galleries/approval";

describe("what a change costs", () => {
  it("one more post over a 63-hour week at 20 an hour: +63 post-hours, +1.89 FTE, +1,512 a week", () => {
    const d = costDifference(1, 2, 63, 20);
    expect(d.posts).toBe(1);
    expect(d.postHoursPerWeek).toBeCloseTo(63, 9);
    expect(d.fte).toBeCloseTo((63 / 40) * 1.2, 9);
    expect(d.costPerWeek).toBeCloseTo(63 * 1.2 * 20, 9);
  });

  it("fewer posts save money, and no change is no change", () => {
    expect(costDifference(3, 1, 50, 10).costPerWeek).toBeCloseTo(-2 * 50 * 1.2 * 10, 9);
    expect(costDifference(2, 2, 50, 10)).toEqual({ posts: 0, postHoursPerWeek: 0, fte: 0, costPerWeek: 0 });
  });

  it("says changes with their sign", () => {
    expect(postsChange(1)).toBe("+1 post");
    expect(postsChange(-2)).toBe("−2 posts");
    expect(postsChange(0)).toBe("no change in posts");
    expect(signed(1.5, String)).toBe("+1.5");
    expect(signed(-3, String)).toBe("−3");
    expect(signed(0, String)).toBe("±0");
  });

  it("names the versions and what to do when an approval is stale", () => {
    const text = staleApprovalText({ roomName: "Textile Gallery", exhibitionName: "Woven Futures", planId: 7, planRoomVersion: 2, roomVersion: 3 });
    expect(text).toMatch(/^Textile Gallery: plan 7 for Woven Futures was approved for version 2 of the walls, which are at version 3 now\./);
    expect(text).toMatch(/compute a new plan for the room and approve it/);
  });
});
