// Every room of the demo museum is a valid gallery: a simple polygon (no repeated points, no zero
// area, no two walls crossing or touching except neighbours at their shared corner) whose
// obstacles are simple too, lie strictly inside the outline and touch neither a wall nor each
// other. The checks here are independent of lib/geometry: orientation signs come from
// robust-predicates (Shewchuk's adaptive-precision predicates, npm reference library) and
// containment from robust-point-in-polygon (npm reference library).
import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";
import earcut from "earcut";
import { orient2d } from "robust-predicates";
import type { Point, Ring } from "@/lib/geometry/types";
import { EXHIBITION, FLOORS, GUARDS, SITE, SKILLS, exhibitionDates } from "@/db/seed/museum";
import { DEMO_ACCOUNTS } from "@/db/seed/accounts";

const require = createRequire(import.meta.url);
// -1 inside, 0 on the boundary, 1 outside (exact arithmetic).
const classifyPoint = require("robust-point-in-polygon") as (loop: Point[], point: Point) => -1 | 0 | 1;

function orientation(a: Point, b: Point, c: Point): number {
  return Math.sign(orient2d(a[0], a[1], b[0], b[1], c[0], c[1]));
}

function onSegment(a: Point, b: Point, p: Point): boolean {
  return (
    orientation(a, b, p) === 0 &&
    Math.min(a[0], b[0]) <= p[0] && p[0] <= Math.max(a[0], b[0]) &&
    Math.min(a[1], b[1]) <= p[1] && p[1] <= Math.max(a[1], b[1])
  );
}

/** True when closed segments ab and cd share any point (crossing, touching or overlapping). */
function segmentsMeet(a: Point, b: Point, c: Point, d: Point): boolean {
  const o1 = orientation(a, b, c);
  const o2 = orientation(a, b, d);
  const o3 = orientation(c, d, a);
  const o4 = orientation(c, d, b);
  if (o1 !== o2 && o3 !== o4 && o1 * o2 <= 0 && o3 * o4 <= 0 && !(o1 === 0 && o2 === 0)) return true;
  return onSegment(a, b, c) || onSegment(a, b, d) || onSegment(c, d, a) || onSegment(c, d, b);
}

function edges(ring: Ring): [Point, Point, number][] {
  return ring.map((p, i) => [p, ring[(i + 1) % ring.length], i] as [Point, Point, number]);
}

function signedArea(ring: Ring): number {
  let twice = 0;
  for (const [p, q] of edges(ring)) twice += p[0] * q[1] - q[0] * p[1];
  return twice / 2;
}

/** Problems that make a ring not a simple polygon, as sentences. */
function ringProblems(ring: Ring, label: string): string[] {
  const problems: string[] = [];
  if (ring.length < 3) return [`${label} has ${ring.length} points; a ring needs at least 3`];
  for (let i = 0; i < ring.length; i++) {
    if (!ring[i].every(Number.isFinite)) problems.push(`${label} point ${i} is not a finite number pair`);
    for (let j = i + 1; j < ring.length; j++) {
      if (ring[i][0] === ring[j][0] && ring[i][1] === ring[j][1]) problems.push(`${label} repeats point ${i} as ${j}`);
    }
  }
  if (signedArea(ring) === 0) problems.push(`${label} has zero area`);
  const n = ring.length;
  for (const [a, b, i] of edges(ring)) {
    for (const [c, d, j] of edges(ring)) {
      if (j <= i) continue;
      const adjacent = j === i + 1 || (i === 0 && j === n - 1);
      if (adjacent) {
        // Neighbours share exactly one corner: the far end of one must not lie on the other.
        const [shared, farOfFirst, farOfSecond] = j === i + 1 ? [b, a, d] : [a, b, c];
        const first: [Point, Point] = [a, b];
        const second: [Point, Point] = [c, d];
        if (onSegment(second[0], second[1], farOfFirst) || onSegment(first[0], first[1], farOfSecond)) {
          problems.push(`${label} walls ${i} and ${j} fold back over each other at (${shared.join(", ")})`);
        }
      } else if (segmentsMeet(a, b, c, d)) {
        problems.push(`${label} walls ${i} and ${j} cross or touch`);
      }
    }
  }
  return problems;
}

/** Problems with a whole room: rings simple, obstacles strictly inside and apart. */
function roomProblems(outline: Ring, obstacles: Ring[]): string[] {
  const problems = ringProblems(outline, "outline");
  obstacles.forEach((obstacle, k) => {
    problems.push(...ringProblems(obstacle, `obstacle ${k}`));
    obstacle.forEach((p, i) => {
      if (classifyPoint(outline, p) !== -1) problems.push(`obstacle ${k} point ${i} (${p.join(", ")}) is not strictly inside the outline`);
    });
    for (const [a, b, i] of edges(obstacle)) {
      for (const [c, d, j] of edges(outline)) {
        if (segmentsMeet(a, b, c, d)) problems.push(`obstacle ${k} edge ${i} meets outline wall ${j}`);
      }
    }
    obstacles.forEach((other, m) => {
      if (m <= k) return;
      for (const [a, b, i] of edges(obstacle)) {
        for (const [c, d, j] of edges(other)) {
          if (segmentsMeet(a, b, c, d)) problems.push(`obstacles ${k} and ${m} touch (edges ${i} and ${j})`);
        }
      }
      if (other.some((p) => classifyPoint(obstacle, p) !== 1) || obstacle.some((p) => classifyPoint(other, p) !== 1)) {
        problems.push(`obstacles ${k} and ${m} overlap`);
      }
    });
  });
  return problems;
}

const rooms = FLOORS.flatMap((floor) => floor.rooms.map((room) => ({ floor: floor.name, ...room })));

describe("the checker itself rejects broken rooms", () => {
  const square: Ring = [[0, 0], [10, 0], [10, 10], [0, 10]];
  it("accepts a square with a pillar in the middle", () => {
    expect(roomProblems(square, [[[4, 4], [4, 6], [6, 6], [6, 4]]])).toEqual([]);
  });
  it("rejects a bow-tie outline", () => {
    expect(roomProblems([[0, 0], [10, 10], [10, 0], [0, 10]], [])).toContain("outline walls 0 and 2 cross or touch");
  });
  it("rejects a repeated point and a spike folding back", () => {
    expect(roomProblems([[0, 0], [10, 0], [10, 10], [10, 0]], []).join("; ")).toMatch(/repeats point/);
    expect(roomProblems([[0, 0], [10, 0], [5, 0], [5, 5]], []).join("; ")).toMatch(/fold back/);
  });
  it("rejects an obstacle touching a wall, one outside, and two obstacles touching", () => {
    expect(roomProblems(square, [[[0, 4], [0, 6], [2, 6], [2, 4]]]).join("; ")).toMatch(/not strictly inside|meets outline/);
    expect(roomProblems(square, [[[12, 4], [12, 6], [14, 6], [14, 4]]]).join("; ")).toMatch(/not strictly inside/);
    expect(
      roomProblems(square, [[[2, 2], [2, 4], [4, 4], [4, 2]], [[4, 3], [4, 5], [6, 5], [6, 3]]]).join("; "),
    ).toMatch(/touch/);
  });
  it("rejects an obstacle nested inside another", () => {
    expect(roomProblems(square, [[[2, 2], [2, 8], [8, 8], [8, 2]], [[4, 4], [4, 5], [5, 5], [5, 4]]]).join("; ")).toMatch(/overlap/);
  });
});

describe("demo museum rooms", () => {
  it("has 2-3 floors and 10-15 rooms with unique names", () => {
    expect(FLOORS.length).toBeGreaterThanOrEqual(2);
    expect(FLOORS.length).toBeLessThanOrEqual(3);
    expect(rooms.length).toBeGreaterThanOrEqual(10);
    expect(rooms.length).toBeLessThanOrEqual(15);
    expect(new Set(rooms.map((r) => r.name)).size).toBe(rooms.length);
  });

  it.each(rooms.map((room) => [room.name, room] as const))("%s is a simple polygon with obstacles strictly inside", (_name, room) => {
    expect(roomProblems(room.outline, room.obstacles)).toEqual([]);
  });

  it("includes a non-orthogonal room, a non-convex room and rooms with obstacles", () => {
    const nonOrthogonal = rooms.filter((room) =>
      edges(room.outline).some(([a, b]) => a[0] !== b[0] && a[1] !== b[1]),
    );
    const nonConvex = rooms.filter((room) => {
      const signs = room.outline.map((p, i, ring) => orientation(ring[(i + ring.length - 1) % ring.length], p, ring[(i + 1) % ring.length]));
      return signs.some((s) => s > 0) && signs.some((s) => s < 0);
    });
    expect(nonOrthogonal.length).toBeGreaterThanOrEqual(1);
    expect(nonConvex.length).toBeGreaterThanOrEqual(2);
    expect(rooms.filter((room) => room.obstacles.length > 0).length).toBeGreaterThanOrEqual(8);
  });

  // earcut (npm reference library) triangulates the room with its obstacles as holes; the
  // triangles must cover exactly the floor area (outline area less obstacle areas), which fails
  // when an obstacle pokes outside the room or two obstacles overlap.
  it.each(rooms.map((room) => [room.name, room] as const))("%s triangulates to exactly its floor area", (_name, room) => {
    const rings = [room.outline, ...room.obstacles];
    const flat = rings.flat(2);
    const holeStarts: number[] = [];
    let count = room.outline.length;
    for (const obstacle of room.obstacles) {
      holeStarts.push(count);
      count += obstacle.length;
    }
    const triangles = earcut(flat, holeStarts);
    expect(triangles.length).toBeGreaterThan(0);
    let area = 0;
    for (let t = 0; t < triangles.length; t += 3) {
      const [a, b, c] = [triangles[t], triangles[t + 1], triangles[t + 2]].map((i) => [flat[2 * i], flat[2 * i + 1]] as Point);
      area += Math.abs(signedArea([a, b, c]));
    }
    const floorArea = Math.abs(signedArea(room.outline)) - room.obstacles.reduce((sum, o) => sum + Math.abs(signedArea(o)), 0);
    expect(area).toBeCloseTo(floorArea, 6);
  });
});

describe("demo museum data", () => {
  it("opens Tuesday to Sunday with a late Thursday and dated exceptions", () => {
    const { weekly, dates } = SITE.opening_hours;
    expect(weekly.mon).toBeNull();
    for (const day of ["tue", "wed", "fri", "sat", "sun"] as const) expect(weekly[day]).not.toBeNull();
    expect(weekly.thu?.[1]).toBe("21:00");
    expect(Object.values(dates).some((span) => span === null)).toBe(true);
    expect(Object.values(dates).some((span) => span !== null && span[1] > "21:00")).toBe(true);
  });

  it("runs one current exhibition over existing rooms, from a Monday weeks ago to a Sunday months ahead", () => {
    const today = new Date().toISOString().slice(0, 10);
    expect(EXHIBITION.starts_on <= today && today <= EXHIBITION.ends_on).toBe(true);
    // Whatever day it is seeded on (every weekday, across a year end and a leap day).
    for (const day of ["2026-12-01", "2026-12-06", "2026-12-07", "2027-12-31", "2028-02-29", "2031-06-15"]) {
      const { starts_on, ends_on } = exhibitionDates(new Date(`${day}T12:00:00Z`));
      expect(new Date(`${starts_on}T00:00:00Z`).getUTCDay(), `${day}: opens on a Monday`).toBe(1);
      expect(new Date(`${ends_on}T00:00:00Z`).getUTCDay(), `${day}: closes on a Sunday`).toBe(0);
      const weeksBefore = (Date.parse(day) - Date.parse(starts_on)) / (7 * 86_400_000);
      const weeksAfter = (Date.parse(ends_on) - Date.parse(day)) / (7 * 86_400_000);
      expect(weeksBefore, day).toBeGreaterThanOrEqual(7);
      expect(weeksBefore, day).toBeLessThan(8);
      expect(weeksAfter, day).toBeGreaterThanOrEqual(26);
    }
    const names = new Set(rooms.map((r) => r.name));
    for (const entry of EXHIBITION.rooms) expect(names.has(entry.room)).toBe(true);
  });

  it("has about 25 guards with varied contracts, known skills and example.org addresses", () => {
    expect(GUARDS.length).toBe(25);
    expect(new Set(GUARDS.map((g) => g.contract_hours))).toEqual(new Set([40, 32, 24, 20]));
    expect(new Set(GUARDS.map((g) => g.email)).size).toBe(GUARDS.length);
    for (const g of GUARDS) {
      expect(g.email).toMatch(/^[a-z.]+@example\.org$/);
      expect(g.max_hours).toBe(48);
      for (const skill of g.skills) expect(SKILLS).toContain(skill);
    }
    const guardAccount = DEMO_ACCOUNTS.find((a) => a.role === "guard");
    expect(GUARDS.some((g) => g.email === guardAccount?.email)).toBe(true);
  });
});
