// Rooms as curators draw them: normalise the rings and reject what cannot be a gallery floor, with
// messages a curator can act on and the place on the drawing where the problem is.
//
// Numbering used in every message: vertices are numbered from 1 in the order the ring was given.
// Wall i-j joins vertex i to vertex j = i + 1; the last wall of a ring with m vertices is "m-1".
// A point repeated right after itself is one corner: walls leaving it use its last number and
// walls reaching it its first ([a, b, b, c] has walls 1-2 and 3-4). The outline is ring 0;
// obstacles are numbered from 1 in the order given.
import type { Point, Ring, Room } from "./types";
import {
  compareLeftRight,
  meetingPoint,
  onSegmentIfCollinear,
  orient,
  orientSign,
  ringOrientation,
  samePoint,
  segmentsMeet,
} from "./predicates";
import { SweepStatus, type StatusNode } from "./sweep-status";

/** One reason a room cannot be planned, with the place on the drawing where it shows. */
export interface RoomProblem {
  /** Machine-readable kind: too-few-points, zero-area, non-finite, out-of-range, self-intersection,
   *  obstacle-outside, obstacle-inside-obstacle, obstacle-crossing, too-many-vertices. */
  code: string;
  message: string;
  at?: Point;
}

export interface ValidateOptions {
  /** Largest total vertex count accepted (outline plus obstacles); default 50,000. */
  maxVertices?: number;
}

/** Coordinates beyond this many metres from the origin are refused (float precision and sanity). */
export const COORDINATE_LIMIT = 1e6;
/** The most corners (outline plus obstacles) a room may have: the API, the editor and uploads all refuse more. */
export const CORNER_LIMIT = 50_000;
export const DEFAULT_MAX_VERTICES = CORNER_LIMIT;

/** A ring with repeated points removed, remembering each kept point's 1-based number in the input. */
interface CleanRing {
  points: Point[];
  numbers: number[];
  lastNumbers: number[];
}

/** Drop the closing point and points equal to their predecessor; keep collinear points. */
function cleanRing(ring: Ring): CleanRing {
  const points: Point[] = [];
  const numbers: number[] = [];
  const lastNumbers: number[] = [];
  for (let i = 0; i < ring.length; i++) {
    const p = ring[i];
    if (points.length > 0 && samePoint(points[points.length - 1], p)) {
      lastNumbers[lastNumbers.length - 1] = i + 1;
      continue;
    }
    points.push([p[0], p[1]]);
    numbers.push(i + 1);
    lastNumbers.push(i + 1);
  }
  while (points.length > 1 && samePoint(points[0], points[points.length - 1])) {
    points.pop();
    numbers.pop();
    lastNumbers.pop();
  }
  return { points, numbers, lastNumbers };
}

/**
 * The room in the shape the planners expect: outline counter-clockwise, obstacles clockwise (the
 * floor is always on the left of a wall walked in ring order), closing and repeated consecutive
 * points dropped, collinear vertices kept (they are real corners a curator placed).
 */
export function normaliseRoom(room: Room): Room {
  const orientAs = (ring: Ring, wanted: 1 | -1): Ring => {
    const { points } = cleanRing(ring);
    return ringOrientation(points) === -wanted ? points.reverse() : points;
  };
  return {
    outline: orientAs(room.outline, 1),
    obstacles: room.obstacles.map((obstacle) => orientAs(obstacle, -1)),
  };
}

/** "the outline" or "obstacle 2", as the curator sees them. */
export function ringName(ringIndex: number): string {
  return ringIndex === 0 ? "the outline" : `obstacle ${ringIndex}`;
}

/** Short coordinates for messages: (5.0, 2.5), (1.234, 7.0). */
export function formatPoint(p: Point): string {
  const f = (v: number) => {
    const s = String(Number(v.toFixed(3)));
    return s.includes(".") || s.includes("e") ? s : `${s}.0`;
  };
  return `(${f(p[0])}, ${f(p[1])})`;
}

/** One wall of the room for the crossing sweep: its ring, its number and its ends left to right. */
interface Wall {
  ring: number;
  index: number; // 0-based position of its first vertex in the cleaned ring
  ringSize: number;
  left: Point;
  right: Point;
}

/**
 * Validate a room. Returns every problem found by the cheap checks, or the first crossing found
 * by the sweep (one at a time: a crossing usually invalidates what a second report would say).
 * Works on the room as given (orientation does not matter); numbering follows the input.
 */
export function validateRoom(room: Room, options: ValidateOptions = {}): RoomProblem[] {
  const maxVertices = options.maxVertices ?? DEFAULT_MAX_VERTICES;
  const problems: RoomProblem[] = [];
  const rawRings: Ring[] = [room.outline, ...room.obstacles];

  // Numbers first: nothing below is meaningful with NaN, infinities or far-away coordinates.
  rawRings.forEach((ring, r) => {
    ring.forEach((p, i) => {
      if (!Array.isArray(p) || p.length < 2 || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
        problems.push({
          code: "non-finite",
          message: `vertex ${i + 1} of ${ringName(r)} has a coordinate that is not a finite number`,
        });
      } else if (Math.abs(p[0]) > COORDINATE_LIMIT || Math.abs(p[1]) > COORDINATE_LIMIT) {
        problems.push({
          code: "out-of-range",
          message: `vertex ${i + 1} of ${ringName(r)} lies at ${formatPoint(p)}, beyond ±1,000,000 m from the origin`,
          at: [p[0], p[1]],
        });
      }
    });
  });
  if (problems.length > 0) return problems;
  // The limit counts corners as planned: after repeated and closing points are dropped.
  const rings = rawRings.map(cleanRing);
  const corners = rings.reduce((sum, ring) => sum + ring.points.length, 0);
  if (corners > maxVertices) {
    return [
      {
        code: "too-many-vertices",
        message: `the room has ${corners.toLocaleString("en")} vertices; the limit is ${maxVertices.toLocaleString("en")}`,
      },
    ];
  }

  rings.forEach((ring, r) => {
    const name = ringName(r);
    if (ring.points.length < 3) {
      const n = ring.points.length;
      problems.push({
        code: "too-few-points",
        message: `${name} has only ${n} distinct point${n === 1 ? "" : "s"}; it needs at least 3`,
        at: n > 0 ? ring.points[0] : undefined,
      });
    } else if (allCollinear(ring.points)) {
      problems.push({
        code: "zero-area",
        message: `the ${ring.points.length} points of ${name} all lie on one line, so it encloses no floor`,
        at: ring.points[0],
      });
    }
  });
  if (problems.length > 0) return problems;

  return findCrossingsAndStrayObstacles(rings);
}

/** Whether every point lies on the line through the first two (which differ after cleaning). */
function allCollinear(points: Point[]): boolean {
  for (let k = 2; k < points.length; k++) if (orient(points[0], points[1], points[k]) !== 0) return false;
  return true;
}

function wallName(rings: CleanRing[], wall: Wall): string {
  const ring = rings[wall.ring];
  const from = ring.lastNumbers[wall.index];
  const to = ring.numbers[(wall.index + 1) % wall.ringSize];
  return `${from}-${to}`;
}

/** A message naming both walls, e.g. "walls 3-4 and 7-8 of the outline cross at (5.0, 2.5)". */
function crossingProblem(rings: CleanRing[], a: Wall, b: Wall, at: Point, proper: boolean): RoomProblem {
  const verb = proper ? "cross" : "touch";
  if (a.ring === b.ring) {
    const [first, second] = a.index < b.index ? [a, b] : [b, a];
    return {
      code: a.ring === 0 ? "self-intersection" : "obstacle-crossing",
      message: `walls ${wallName(rings, first)} and ${wallName(rings, second)} of ${ringName(a.ring)} ${verb} at ${formatPoint(at)}`,
      at,
    };
  }
  const [first, second] = a.ring < b.ring ? [a, b] : [b, a];
  return {
    code: "obstacle-crossing",
    message: `wall ${wallName(rings, second)} of ${ringName(second.ring)} and wall ${wallName(rings, first)} of ${ringName(first.ring)} ${verb} at ${formatPoint(at)}`,
    at,
  };
}

/** Walls that follow each other in one ring share their common corner legitimately. */
function areNeighbours(a: Wall, b: Wall): boolean {
  if (a.ring !== b.ring) return false;
  const m = a.ringSize;
  return (a.index + 1) % m === b.index || (b.index + 1) % m === a.index;
}

/** Whether two walls share a point they must not share; exact. */
function meetBadly(a: Wall, b: Wall): boolean {
  if (areNeighbours(a, b)) {
    // Consecutive walls may share only their corner: bad when they fold back onto each other.
    const shared = samePoint(a.left, b.left) || samePoint(a.left, b.right) ? a.left : a.right;
    const aFar = samePoint(shared, a.left) ? a.right : a.left;
    const bFar = samePoint(shared, b.left) ? b.right : b.left;
    if (orient(shared, aFar, bFar) !== 0) return false;
    return onSegmentIfCollinear(shared, aFar, bFar) || onSegmentIfCollinear(shared, bFar, aFar);
  }
  return segmentsMeet(a.left, a.right, b.left, b.right);
}

function isProperCrossing(a: Wall, b: Wall): boolean {
  return (
    orientSign(a.left, a.right, b.left) * orientSign(a.left, a.right, b.right) < 0 &&
    orientSign(b.left, b.right, a.left) * orientSign(b.left, b.right, a.right) < 0
  );
}

/** Whether a wall in the status passes below point p (p is left of its left-to-right direction). */
function wallBelow(wall: Wall, p: Point): boolean {
  return orient(wall.left, wall.right, p) > 0;
}

/** Thrown inside the sweep to stop at the first bad pair. */
class CrossingFound {
  constructor(readonly a: Wall, readonly b: Wall) {}
}

/**
 * Shamos & Hoey (1976) sweep, left to right in lexicographic (x, y) order with exact predicates:
 * walls in an ordered status (AVL tree), each wall checked against its neighbours whenever they
 * become adjacent; stops at the first pair that crosses, touches or overlaps. O(n log n).
 * When no walls meet, the same sweep tells which ring directly contains each ring (the first wall
 * below a ring's leftmost vertex), so obstacles outside the outline or inside another obstacle are
 * found without a second pass.
 */
function findCrossingsAndStrayObstacles(rings: CleanRing[]): RoomProblem[] {
  // Corners at the same place (other than a wall's own two ends) are touching walls.
  const corners: { p: Point; ring: number; index: number }[] = [];
  rings.forEach((ring, r) => ring.points.forEach((p, index) => corners.push({ p, ring: r, index })));
  corners.sort((a, b) => compareLeftRight(a.p, b.p));
  for (let k = 1; k < corners.length; k++) {
    const a = corners[k - 1];
    const b = corners[k];
    if (!samePoint(a.p, b.p)) continue;
    if (a.ring === b.ring) {
      const [i, j] = a.index < b.index ? [a.index, b.index] : [b.index, a.index];
      const ring = rings[a.ring];
      const m = ring.points.length;
      const leaving = (k: number) => `${ring.lastNumbers[k]}-${ring.numbers[(k + 1) % m]}`;
      return [
        {
          code: a.ring === 0 ? "self-intersection" : "obstacle-crossing",
          message: `walls ${leaving(i)} and ${leaving(j)} of ${ringName(a.ring)} touch at ${formatPoint(a.p)}: vertices ${ring.numbers[i]} and ${ring.numbers[j]} are the same point`,
          at: a.p,
        },
      ];
    }
    const [first, second] = a.ring < b.ring ? [a, b] : [b, a];
    return [
      {
        code: "obstacle-crossing",
        message: `vertex ${rings[second.ring].numbers[second.index]} of ${ringName(second.ring)} touches vertex ${rings[first.ring].numbers[first.index]} of ${ringName(first.ring)} at ${formatPoint(a.p)}`,
        at: a.p,
      },
    ];
  }

  // Events: each wall starts at its left end and ends at its right end.
  const walls: Wall[] = [];
  rings.forEach((ring, r) => {
    const m = ring.points.length;
    for (let i = 0; i < m; i++) {
      const p = ring.points[i];
      const q = ring.points[(i + 1) % m];
      const pFirst = compareLeftRight(p, q) < 0;
      walls.push({ ring: r, index: i, ringSize: m, left: pFirst ? p : q, right: pFirst ? q : p });
    }
  });
  interface SweepEvent {
    at: Point;
    starts: boolean;
    wall: Wall;
  }
  const events: SweepEvent[] = [];
  for (const wall of walls) {
    events.push({ at: wall.left, starts: true, wall });
    events.push({ at: wall.right, starts: false, wall });
  }
  // Ends before starts at the same point: a wall ending where another begins is not in the way.
  events.sort((a, b) => compareLeftRight(a.at, b.at) || Number(a.starts) - Number(b.starts));

  const status = new SweepStatus<Wall>();
  const nodes = new Map<Wall, StatusNode<Wall>>();
  const container = new Array<number>(rings.length).fill(-2); // -2 unknown, -1 none
  const interiorAbove = new Map<Wall, boolean>();
  const ringTurn = rings.map((ring) => ringOrientation(ring.points));

  const check = (a: StatusNode<Wall> | null, b: StatusNode<Wall> | null) => {
    if (a !== null && b !== null && meetBadly(a.item, b.item)) throw new CrossingFound(a.item, b.item);
  };

  try {
    for (const event of events) {
      const wall = event.wall;
      if (!event.starts) {
        const node = nodes.get(wall)!;
        const below = status.before(node);
        const above = status.after(node);
        status.remove(node);
        nodes.delete(wall);
        check(below, above);
        continue;
      }
      const from = wall.left;
      if (container[wall.ring] === -2) {
        // The ring's leftmost corner: the nearest wall below tells which ring holds it.
        const under = status.lastWhere(wallBelow, from);
        if (under === null) container[wall.ring] = -1;
        else {
          const u = under.item;
          let above = interiorAbove.get(u);
          if (above === undefined) {
            // The floor of ring u lies left of its walls in ring order when the ring runs
            // counter-clockwise; a wall running left-to-right then has its floor above it.
            const ring = rings[u.ring].points;
            const runsRight = samePoint(ring[u.index], u.left);
            above = runsRight === (ringTurn[u.ring] > 0);
            interiorAbove.set(u, above);
          }
          container[wall.ring] = above ? u.ring : container[u.ring];
        }
      }
      const node = status.insert(wall, (other) => {
        let side: number;
        if (samePoint(other.left, from)) {
          // The other wall of the same corner: order by direction; collinear means they overlap.
          side = orient(from, wall.right, other.right);
          if (side === 0) throw new CrossingFound(wall, other);
          return side < 0;
        }
        side = orient(other.left, other.right, from);
        if (side === 0) throw new CrossingFound(wall, other);
        return side > 0;
      });
      nodes.set(wall, node);
      check(status.before(node), node);
      check(node, status.after(node));
    }
  } catch (found) {
    if (!(found instanceof CrossingFound)) throw found;
    const at = meetingPoint(found.a.left, found.a.right, found.b.left, found.b.right);
    return [crossingProblem(rings, found.a, found.b, at, isProperCrossing(found.a, found.b))];
  }

  const problems: RoomProblem[] = [];
  for (let r = 1; r < rings.length; r++) {
    if (container[r] === 0) continue;
    const at = rings[r].points[0];
    if (container[r] > 0) {
      problems.push({
        code: "obstacle-inside-obstacle",
        message: `${ringName(r)} lies inside ${ringName(container[r])}; draw it as one obstacle`,
        at,
      });
    } else {
      problems.push({ code: "obstacle-outside", message: `${ringName(r)} lies outside the room`, at });
    }
  }
  return problems;
}

export type PreparedRoom = { ok: true; room: Room } | { ok: false; problems: RoomProblem[] };

/** Validate, then normalise: the one entry point for rooms coming from curators or files. */
export function prepareRoom(input: Room, options: ValidateOptions = {}): PreparedRoom {
  const problems = validateRoom(input, options);
  if (problems.length > 0) return { ok: false, problems };
  return { ok: true, room: normaliseRoom(input) };
}

/** Vertex count n and obstacle count h of a normalised room. */
export function roomCounts(room: Room): { vertices: number; obstacles: number } {
  return {
    vertices: room.outline.length + room.obstacles.reduce((sum, o) => sum + o.length, 0),
    obstacles: room.obstacles.length,
  };
}

/** Floor area of a normalised room in square metres: the outline's area less its obstacles'. */
export function roomArea(room: Room): number {
  const ringAbs = (ring: Ring) => {
    let sum = 0;
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      sum += (ring[j][0] - ring[i][0]) * (ring[j][1] + ring[i][1]);
    }
    return Math.abs(sum) / 2;
  };
  return ringAbs(room.outline) - room.obstacles.reduce((sum, o) => sum + ringAbs(o), 0);
}

/**
 * Where a point lies in a valid room, decided exactly: "inside" the floor, on a "wall" (outline or
 * obstacle boundary), or "outside" (beyond the outline or inside an obstacle). O(n).
 */
export function locatePoint(room: Room, p: Point): "inside" | "wall" | "outside" {
  const inRing = (ring: Ring): "in" | "on" | "out" => {
    let inside = false;
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const a = ring[j];
      const b = ring[i];
      if (orient(a, b, p) === 0 && onSegmentIfCollinear(a, b, p)) return "on";
      // Half-open rule on y so a ray through a vertex counts once.
      if (a[1] > p[1] !== b[1] > p[1]) {
        const s = orient(a, b, p);
        if (b[1] > a[1] ? s > 0 : s < 0) inside = !inside;
      }
    }
    return inside ? "in" : "out";
  };
  const outer = inRing(room.outline);
  if (outer === "out") return "outside";
  if (outer === "on") return "wall";
  for (const obstacle of room.obstacles) {
    const o = inRing(obstacle);
    if (o === "on") return "wall";
    if (o === "in") return "outside";
  }
  return "inside";
}
