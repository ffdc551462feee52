// The curator's edits as pure functions of a room: each returns a new room and leaves the old one
// alone, so the editor can keep history and the worker always sees a consistent room.
import type { Point, Ring, Room } from "@/lib/geometry/types";

/** A vertex by ring (0 = outline, k = obstacle k) and position in that ring. */
export interface VertexRef {
  ring: number;
  index: number;
}

export function ringOf(room: Room, ring: number): Ring {
  return ring === 0 ? room.outline : room.obstacles[ring - 1];
}

function withRing(room: Room, ring: number, next: Ring): Room {
  if (ring === 0) return { outline: next, obstacles: room.obstacles };
  return { outline: room.outline, obstacles: room.obstacles.map((o, i) => (i === ring - 1 ? next : o)) };
}

/** Snap to the centimetre: curators place walls, not floating-point noise. */
export function snap(p: Point): Point {
  return [Math.round(p[0] * 100) / 100, Math.round(p[1] * 100) / 100];
}

export function moveVertex(room: Room, vertex: VertexRef, to: Point): Room {
  const ring = ringOf(room, vertex.ring).map((p, i) => (i === vertex.index ? snap(to) : p));
  return withRing(room, vertex.ring, ring);
}

/** Adds a corner on wall `index` → `index + 1` of a ring, at `at`. */
export function insertVertex(room: Room, wall: VertexRef, at: Point): Room {
  const ring = [...ringOf(room, wall.ring)];
  ring.splice(wall.index + 1, 0, snap(at));
  return withRing(room, wall.ring, ring);
}

/** Removes a corner; a ring keeps at least 3 corners (an obstacle goes as a whole with removeObstacle). */
export function deleteVertex(room: Room, vertex: VertexRef): Room | string {
  const ring = ringOf(room, vertex.ring);
  if (ring.length <= 3) {
    return vertex.ring === 0
      ? "the outline needs at least 3 corners"
      : `obstacle ${vertex.ring} has only 3 corners; remove the whole obstacle instead`;
  }
  return withRing(room, vertex.ring, ring.filter((_, i) => i !== vertex.index));
}

/** A rectangular obstacle (plinth, vitrine) between two opposite corners, clockwise like the seed's. */
export function addRectangleObstacle(room: Room, a: Point, b: Point): Room | string {
  const [x0, x1] = [Math.min(a[0], b[0]), Math.max(a[0], b[0])];
  const [y0, y1] = [Math.min(a[1], b[1]), Math.max(a[1], b[1])];
  if (x1 - x0 < 0.05 || y1 - y0 < 0.05) return "drag a rectangle at least 5 cm on each side";
  const ring: Ring = [snap([x0, y0]), snap([x0, y1]), snap([x1, y1]), snap([x1, y0])];
  return { outline: room.outline, obstacles: [...room.obstacles, ring] };
}

/**
 * A partition wall drawn as a line from `a` to `b` with a thickness: the obstacle is the band of
 * that width around the line (a rectangle along it), clockwise like the other obstacles.
 */
export function partitionWall(a: Point, b: Point, thickness: number): Ring | string {
  const length = Math.hypot(b[0] - a[0], b[1] - a[1]);
  if (length < 0.1) return "draw the partition at least 10 cm long";
  if (!(thickness >= 0.02 && thickness <= 2)) return "a partition is 2 cm to 2 m thick";
  const [nx, ny] = [(-(b[1] - a[1]) / length) * (thickness / 2), ((b[0] - a[0]) / length) * (thickness / 2)];
  const ring: Ring = [snap([a[0] - nx, a[1] - ny]), snap([a[0] + nx, a[1] + ny]), snap([b[0] + nx, b[1] + ny]), snap([b[0] - nx, b[1] - ny])];
  // Clockwise: the area by the shoelace formula is negative.
  const area = ring.reduce((sum, [x, y], i) => sum + x * ring[(i + 1) % 4]![1] - ring[(i + 1) % 4]![0] * y, 0);
  return area > 0 ? [...ring].reverse() : ring;
}

export function addPartition(room: Room, a: Point, b: Point, thickness: number): Room | string {
  const ring = partitionWall(a, b, thickness);
  if (typeof ring === "string") return ring;
  return { outline: room.outline, obstacles: [...room.obstacles, ring] };
}

export function removeObstacle(room: Room, obstacle: number): Room {
  return { outline: room.outline, obstacles: room.obstacles.filter((_, i) => i !== obstacle - 1) };
}

/** The point of segment a-b nearest to p, and its distance. */
export function nearestOnSegment(p: Point, a: Point, b: Point): { at: Point; distance: number } {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const length2 = dx * dx + dy * dy;
  const t = length2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / length2));
  const at: Point = [a[0] + t * dx, a[1] + t * dy];
  return { at, distance: Math.hypot(p[0] - at[0], p[1] - at[1]) };
}

/** The wall nearest to p (within `reach` metres), as the index of its first corner. */
export function nearestWall(room: Room, p: Point, reach: number): { wall: VertexRef; at: Point } | null {
  let best: { wall: VertexRef; at: Point; distance: number } | null = null;
  [room.outline, ...room.obstacles].forEach((ring, r) => {
    ring.forEach((a, i) => {
      const hit = nearestOnSegment(p, a, ring[(i + 1) % ring.length]);
      if (hit.distance <= reach && (!best || hit.distance < best.distance)) best = { wall: { ring: r, index: i }, at: hit.at, distance: hit.distance };
    });
  });
  return best ? { wall: (best as { wall: VertexRef }).wall, at: (best as { at: Point }).at } : null;
}

/** A rectangle as a ring, counter-clockwise (forbidden zones). */
export function rectangle(a: Point, b: Point): Ring {
  const [x0, x1] = [Math.min(a[0], b[0]), Math.max(a[0], b[0])];
  const [y0, y1] = [Math.min(a[1], b[1]), Math.max(a[1], b[1])];
  return [snap([x0, y0]), snap([x1, y0]), snap([x1, y1]), snap([x0, y1])];
}
