// The plan preview's core (POST /api/post-plans/preview without the server): the answer has the
// `posts` command's room shape (scripts/README.md), bad rooms give 422 with the reason.
import { describe, expect, it } from "vitest";
import { previewPostPlan } from "@/lib/guarding/fewest-preview";

const lShaped = {
  type: "Feature",
  properties: { name: "east-gallery" },
  geometry: { type: "Polygon", coordinates: [[[0, 0], [8, 0], [8, 3], [3, 3], [3, 9], [0, 9], [0, 0]]] },
};

describe("plan preview", () => {
  it("answers the room JSON of the posts command with a proven fewest plan", () => {
    const answer = previewPostPlan({ room: lShaped, timeLimit: 2 });
    expect(answer.status).toBe(200);
    if (answer.status !== 200) return;
    const room = answer.body.room;
    expect(room.name).toBe("east-gallery");
    expect(room.vertices).toBe(6);
    expect(room.triangles).toBe(4); // n + 2h - 2 (scripts/README.md)
    expect(room.bound).toBe(2); // floor((n + 2h) / 3)
    expect(room.fewest?.posts).toHaveLength(1); // an L-shaped room is seen from its reflex corner
    expect(room.fewest?.proven).toBe(true);
    expect(room.fewest?.covered).toBe(1);
    expect(room.fewest?.uncovered).toEqual([]);
  });
  it("accepts a bare Polygon with constraints beside it, and keeps pinned posts", () => {
    const answer = previewPostPlan({ ...lShaped.geometry, pinned: [[7, 1]], doubleCover: true, timeLimit: 2 });
    expect(answer.status).toBe(200);
    if (answer.status === 200) {
      expect(answer.body.room.fewest?.posts).toContainEqual([7, 1]);
      expect(answer.body.room.fewest?.posts.length).toBeGreaterThanOrEqual(2);
    }
  });
  it("a bow-tie room is refused with 422, the crossing walls and where they cross", () => {
    const answer = previewPostPlan({ type: "Polygon", coordinates: [[[0, 0], [4, 4], [4, 0], [0, 4], [0, 0]]] });
    expect(answer.status).toBe(422);
    if (answer.status === 422) {
      expect(answer.body.error.code).toBeTruthy();
      expect(answer.body.error.message).toMatch(/cross|touch/);
      expect(answer.body.error.at).toBeDefined();
    }
  });
  it("a body that is not a room is refused with 422 naming the field", () => {
    const answer = previewPostPlan({ room: { type: "Polygon", coordinates: "nope" } });
    expect(answer.status).toBe(422);
    if (answer.status === 422) expect(answer.body.error.code).toBe("invalid-input");
  });
  it("a pinned post outside the room is refused with 422 and its location", () => {
    const answer = previewPostPlan({ room: lShaped, pinned: [[20, 20]] });
    expect(answer.status).toBe(422);
    if (answer.status === 422) {
      expect(answer.body.error.code).toBe("pinned-outside-room");
      expect(answer.body.error.at).toEqual([20, 20]);
    }
  });
});
