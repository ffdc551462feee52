// The curator's edits as pure functions, checked by hand-computed areas (shoelace formula) and by
// the room validator: each edit gives a new room and leaves the old one as it was.
import { describe, expect, it } from "vitest";
import { addRectangleObstacle, deleteVertex, insertVertex, moveVertex, nearestWall, removeObstacle } from "@/components/plan/room-edits";
import { roomArea, normaliseRoom, validateRoom } from "@/lib/geometry/room";
import type { Room } from "@/lib/geometry/types";

// 12 × 9 m with a 4 × 2 m table: 108 − 8 = 100 m².
const printRoom = (): Room => ({ outline: [[0, 0], [12, 0], [12, 9], [0, 9]], obstacles: [[[4, 3], [4, 5], [8, 5], [8, 3]]] });

describe("room edits", () => {
  it("moves a corner, snapped to the centimetre, without touching the old room", () => {
    const room = printRoom();
    const moved = moveVertex(room, { ring: 0, index: 2 }, [14.004, 9.0049]);
    expect(moved.outline[2]).toEqual([14, 9]);
    expect(room.outline[2]).toEqual([12, 9]);
    // Trapezoid (0,0) (12,0) (14,9) (0,9): (12 + 14) / 2 × 9 = 117 m², less the table's 8.
    expect(roomArea(normaliseRoom(moved))).toBeCloseTo(109, 9);
  });

  it("adds a corner on the wall nearest the click, then pulling it out adds floor", () => {
    const room = printRoom();
    const hit = nearestWall(room, [6, 0.2], 0.5);
    expect(hit).toEqual({ wall: { ring: 0, index: 0 }, at: [6, 0] });
    const added = insertVertex(room, hit!.wall, hit!.at);
    expect(added.outline).toEqual([[0, 0], [6, 0], [12, 0], [12, 9], [0, 9]]);
    // A triangle of base 12 and height 3 below the old wall: 18 m² more.
    expect(roomArea(normaliseRoom(moveVertex(added, { ring: 0, index: 1 }, [6, -3])))).toBeCloseTo(118, 9);
    expect(nearestWall(room, [6, 4], 0.5)).toBeNull();
  });

  it("deletes a corner but never below three, and removes a whole obstacle", () => {
    const room = printRoom();
    expect(deleteVertex(room, { ring: 0, index: 0 })).toMatchObject({ outline: [[12, 0], [12, 9], [0, 9]] });
    const triangle: Room = { outline: [[0, 0], [4, 0], [0, 3]], obstacles: [] };
    expect(deleteVertex(triangle, { ring: 0, index: 1 })).toBe("the outline needs at least 3 corners");
    const pillar: Room = { outline: room.outline, obstacles: [[[1, 1], [2, 1], [1, 2]]] };
    expect(deleteVertex(pillar, { ring: 1, index: 0 })).toMatch(/remove the whole obstacle/);
    expect(removeObstacle(room, 1).obstacles).toEqual([]);
  });

  it("adds a rectangular obstacle from any two opposite corners, which validates", () => {
    const room = printRoom();
    const added = addRectangleObstacle(room, [10, 8], [9, 6.5]);
    if (typeof added === "string") throw new Error(added);
    expect(added.obstacles[1]).toEqual([[9, 6.5], [9, 8], [10, 8], [10, 6.5]]);
    expect(validateRoom(added)).toEqual([]);
    expect(roomArea(normaliseRoom(added))).toBeCloseTo(98.5, 9); // 100 − 1 × 1.5
    expect(addRectangleObstacle(room, [1, 1], [1.01, 3])).toMatch(/at least 5 cm/);
    // Dragged across the outline: the validator names the problem and where.
    const outside = addRectangleObstacle(room, [11, 8], [13, 10]);
    if (typeof outside === "string") throw new Error(outside);
    expect(validateRoom(outside)[0].code).toBe("obstacle-crossing");
  });
});

describe("partition walls", () => {
  // Shoelace formula (Meister 1769, Gauss): signed area, negative for a clockwise ring.
  const signedArea = (ring: [number, number][]) => ring.reduce((sum, [x, y], i) => sum + x * ring[(i + 1) % ring.length]![1] - ring[(i + 1) % ring.length]![0] * y, 0) / 2;

  it("turns a line and a thickness into a clockwise band of length x thickness", async () => {
    const { partitionWall } = await import("@/components/plan/room-edits");
    const band = partitionWall([1, 2], [5, 2], 0.2) as [number, number][];
    expect(band).toHaveLength(4);
    expect(signedArea(band)).toBeCloseTo(-0.8, 9);
    expect(Math.min(...band.map((p) => p[1]))).toBeCloseTo(1.9, 9);
    expect(Math.max(...band.map((p) => p[1]))).toBeCloseTo(2.1, 9);
    const slanted = partitionWall([0, 0], [3, 4], 0.5) as [number, number][];
    expect(Math.abs(signedArea(slanted))).toBeCloseTo(5 * 0.5, 2);
    expect(signedArea(slanted)).toBeLessThan(0);
  });

  it("refuses a line too short or a thickness out of range, and adds a good one as an obstacle", async () => {
    const { addPartition, partitionWall } = await import("@/components/plan/room-edits");
    expect(partitionWall([0, 0], [0.05, 0], 0.2)).toMatch(/at least 10 cm/);
    expect(partitionWall([0, 0], [3, 0], 3)).toMatch(/2 cm to 2 m/);
    const room = { outline: [[0, 0], [10, 0], [10, 8], [0, 8]] as [number, number][], obstacles: [] };
    const next = addPartition(room, [2, 4], [8, 4], 0.2);
    expect(typeof next).toBe("object");
    expect((next as typeof room).obstacles).toHaveLength(1);
  });
});
