// The floor map: rooms set side by side without overlapping, each approved post's sight region,
// and the unseen floor from the exact coverage certificate. Checked against outside facts: an
// L-shaped room is seen whole from its reflex corner (a star-shaped polygon: its kernel holds that
// corner; the art gallery theorem's bound floor(n/3) = 2 is not needed here), while a post in one
// arm of a U-shaped room leaves the other arm unseen; and the SVG names every post.
import { describe, expect, it } from "vitest";
import { floorMap, floorMapSvg } from "@/lib/galleries/floor-map";

const L = [[0, 0], [12, 0], [12, 5], [5, 5], [5, 10], [0, 10]] as [number, number][];
const U = [[0, 0], [10, 0], [10, 10], [7, 10], [7, 3], [3, 3], [3, 10], [0, 10]] as [number, number][];

describe("the floor map", () => {
  const map = floorMap([
    { id: 1, name: "L Gallery", outline: L, obstacles: [], posts: [[5, 5]], stale: false },
    { id: 2, name: "U Gallery", outline: U, obstacles: [], posts: [[1.5, 8]], stale: true, own: [1] },
    { id: 3, name: "Store", outline: [[0, 0], [4, 0], [4, 4], [0, 4]], obstacles: [], posts: null, stale: false },
  ]);

  it("sets rooms side by side without overlap", () => {
    const boxes = map.rooms.map((r) => ({ x0: r.bounds.minX + r.offset[0], x1: r.bounds.maxX + r.offset[0], y0: r.bounds.minY + r.offset[1], y1: r.bounds.maxY + r.offset[1] }));
    for (let i = 0; i < boxes.length; i++)
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i]!, b = boxes[j]!;
        expect(a.x1 <= b.x0 || b.x1 <= a.x0 || a.y1 <= b.y0 || b.y1 <= a.y0, `${i} and ${j} overlap`).toBe(true);
      }
  });

  it("sees the L-room whole from its reflex corner and leaves one arm of the U-room unseen", () => {
    expect(map.rooms[0]!.covered).toBeCloseTo(1, 6);
    expect(map.rooms[0]!.uncovered).toEqual([]);
    expect(map.rooms[1]!.covered!).toBeLessThan(0.9);
    expect(map.rooms[1]!.uncovered.length).toBeGreaterThan(0);
    expect(map.rooms[2]!.covered).toBeNull();
  });

  it("draws every post numbered, the reader's own marked, stale approvals and rooms without a plan named", () => {
    const svg = floorMapSvg(map, { title: "Brackwater · Ground <floor>", date: "4 Dec 2026", exhibition: "Woven Futures" });
    expect(svg.startsWith("<svg xmlns=\"http://www.w3.org/2000/svg\"")).toBe(true);
    expect(svg.match(/data-post="/g)).toHaveLength(2);
    expect(svg).toContain('data-own="true"');
    expect(svg).toContain("U Gallery · 1 post · approval stale");
    expect(svg).toContain("Store · no approved plan");
    expect(svg).toContain("Brackwater · Ground &lt;floor&gt;");
    expect(svg).toContain("5 m");
  });
});
