// Generated halls for the planning tests (invented shapes, not benchmark data).
import type { Point, Room } from "@/lib/geometry/types";

/**
 * A long hall whose north wall is a saw of `teeth` teeth, with rows × cols square vitrines: about
 * 2·teeth + 4 corners and rows·cols obstacles, large enough that the fewest plan runs for seconds.
 */
export function sawHall(teeth: number, rows: number, cols: number): Room {
  const width = teeth * 2;
  const depth = 40;
  const outline: Point[] = [[0, 0], [width, 0]];
  for (let i = teeth; i > 0; i--) outline.push([i * 2, depth], [i * 2 - 1, depth + 3]);
  outline.push([0, depth]);
  const obstacles: Point[][] = [];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      const x = ((c + 0.5) * width) / cols;
      const y = ((r + 0.5) * depth) / rows;
      obstacles.push([[x - 0.4, y - 0.4], [x - 0.4, y + 0.4], [x + 0.4, y + 0.4], [x + 0.4, y - 0.4]]);
    }
  }
  return { outline, obstacles };
}

/** The room as a GeoJSON Polygon (outline first, then obstacles). */
export const polygonOf = (room: Room) => ({ type: "Polygon", coordinates: [room.outline, ...room.obstacles] });
