// Independent checks written for the tests: brute-force validity, a combinatorial triangulation
// check and a sampling visibility check. They use robust-predicates and robust-point-in-polygon from
// npm directly and share no code with lib/geometry, so a bug there cannot hide itself here.
import { orient2d } from "robust-predicates";
import { createRequire } from "node:module";

// robust-point-in-polygon ships no types: -1 inside, 0 on the boundary, 1 outside.
const classifyPoint = createRequire(import.meta.url)("robust-point-in-polygon") as (loop: P[], point: P) => -1 | 0 | 1;

export type P = [number, number];
export interface PlainRoom {
  outline: P[];
  obstacles: P[][];
}

/** > 0 when a, b, c turn counter-clockwise (robust-predicates' sign is the opposite). */
export function ccw(a: P, b: P, c: P): number {
  return -orient2d(a[0], a[1], b[0], b[1], c[0], c[1]);
}

const sign = (v: number) => (v > 0 ? 1 : v < 0 ? -1 : 0);
const within = (a: P, b: P, p: P) =>
  Math.min(a[0], b[0]) <= p[0] && p[0] <= Math.max(a[0], b[0]) && Math.min(a[1], b[1]) <= p[1] && p[1] <= Math.max(a[1], b[1]);

/** Whether closed segments share a point (textbook four-orientation test, exact). */
export function closedSegmentsMeet(a: P, b: P, c: P, d: P): boolean {
  const d1 = sign(ccw(c, d, a));
  const d2 = sign(ccw(c, d, b));
  const d3 = sign(ccw(a, b, c));
  const d4 = sign(ccw(a, b, d));
  if (d1 * d2 < 0 && d3 * d4 < 0) return true;
  return (
    (d1 === 0 && within(c, d, a)) || (d2 === 0 && within(c, d, b)) || (d3 === 0 && within(a, b, c)) || (d4 === 0 && within(a, b, d))
  );
}

/** Drop the closing point and consecutive repeats, as the product promises to. */
export function cleanRing(ring: P[]): P[] {
  const out: P[] = [];
  for (const p of ring) if (out.length === 0 || out[out.length - 1][0] !== p[0] || out[out.length - 1][1] !== p[1]) out.push(p);
  while (out.length > 1 && out[0][0] === out[out.length - 1][0] && out[0][1] === out[out.length - 1][1]) out.pop();
  return out;
}

/** Strictly inside ring (-1 in robust-point-in-polygon's answer). */
function strictlyInside(ring: P[], p: P): boolean {
  return classifyPoint(ring, p) === -1;
}

/**
 * O(n^2) reference answer to "is this a valid room": every ring has 3+ distinct points and
 * positive area, no two walls share a point other than consecutive walls' common corner, and
 * every obstacle lies strictly inside the outline and outside every other obstacle.
 */
export function bruteForceValid(room: PlainRoom): boolean {
  const rings = [room.outline, ...room.obstacles].map(cleanRing);
  for (const ring of rings) {
    if (ring.length < 3) return false;
    let flat = true;
    for (let k = 2; k < ring.length; k++) if (ccw(ring[0], ring[1], ring[k]) !== 0) flat = false;
    if (flat) return false;
  }
  const walls: { r: number; i: number; m: number; a: P; b: P }[] = [];
  rings.forEach((ring, r) => ring.forEach((a, i) => walls.push({ r, i, m: ring.length, a, b: ring[(i + 1) % ring.length] })));
  for (let x = 0; x < walls.length; x++) {
    for (let y = x + 1; y < walls.length; y++) {
      const s = walls[x];
      const t = walls[y];
      const consecutive = s.r === t.r && ((s.i + 1) % s.m === t.i || (t.i + 1) % t.m === s.i);
      if (consecutive) {
        // Shared corner allowed; folding back along the same line is not.
        const shared = s.b[0] === t.a[0] && s.b[1] === t.a[1] ? s.b : s.a;
        const sFar = shared === s.b ? s.a : s.b;
        const tFar = shared === s.b ? t.b : t.a;
        if (s.m === 3) continue; // a triangle's walls: the third pair is checked the same way
        if (ccw(shared, sFar, tFar) === 0 && (within(shared, sFar, tFar) || within(shared, tFar, sFar))) return false;
        continue;
      }
      if (closedSegmentsMeet(s.a, s.b, t.a, t.b)) return false;
    }
  }
  for (let r = 1; r < rings.length; r++) {
    if (!strictlyInside(rings[0], rings[r][0])) return false;
    for (let o = 1; o < rings.length; o++) if (o !== r && strictlyInside(rings[o], rings[r][0])) return false;
  }
  return true;
}

/** Signed shoelace area. */
export function shoelace(ring: P[]): number {
  let s = 0;
  for (let i = 0; i < ring.length; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % ring.length];
    s += a[0] * b[1] - b[0] * a[1];
  }
  return s / 2;
}

/**
 * What must hold for a triangulation of a room with n corners and h obstacles over its own corners:
 * n + 2h - 2 triangles, each strictly counter-clockwise, every wall used by exactly one triangle
 * on the floor side, every other triangle edge shared by exactly two triangles in opposite
 * directions, and areas summing to the floor area within 1e-9 relative. Returns what failed.
 */
export function triangulationFaults(
  room: PlainRoom,
  points: P[],
  triangles: [number, number, number][],
): string[] {
  const faults: string[] = [];
  const rings = [room.outline, ...room.obstacles];
  const n = rings.reduce((s, r) => s + r.length, 0);
  const h = room.obstacles.length;
  if (points.length !== n) faults.push(`points ${points.length} != n ${n}`);
  if (triangles.length !== n + 2 * h - 2) faults.push(`triangles ${triangles.length} != n + 2h - 2 = ${n + 2 * h - 2}`);
  let area = 0;
  const directed = new Map<string, number>();
  for (const [a, b, c] of triangles) {
    const o = ccw(points[a], points[b], points[c]);
    if (!(o > 0)) faults.push(`triangle ${a},${b},${c} has area ${o / 2}`);
    area += Math.abs(shoelace([points[a], points[b], points[c]]));
    for (const [u, v] of [[a, b], [b, c], [c, a]]) directed.set(`${u},${v}`, (directed.get(`${u},${v}`) ?? 0) + 1);
  }
  const floor = Math.abs(shoelace(room.outline)) - room.obstacles.reduce((s, o) => s + Math.abs(shoelace(o)), 0);
  if (Math.abs(area - floor) > 1e-9 * Math.abs(floor)) faults.push(`area ${area} != floor ${floor}`);
  // Walls in ring order with the floor on their left (outline counter-clockwise, obstacles clockwise).
  const walls = new Set<string>();
  let offset = 0;
  for (const ring of rings) {
    for (let i = 0; i < ring.length; i++) walls.add(`${offset + i},${offset + ((i + 1) % ring.length)}`);
    offset += ring.length;
  }
  for (const w of walls) if (directed.get(w) !== 1) faults.push(`wall ${w} used ${directed.get(w) ?? 0} times`);
  for (const [key, count] of directed) {
    if (count !== 1) faults.push(`edge ${key} used ${count} times in one direction`);
    if (walls.has(key)) continue;
    const [u, v] = key.split(",");
    if (directed.get(`${v},${u}`) !== 1) faults.push(`edge ${key} has no twin`);
  }
  return faults.slice(0, 5);
}

/** Where a point lies: -1 strictly in the floor, 0 on a wall, 1 outside (or inside an obstacle). */
export function classifyInRoom(room: PlainRoom, p: P): -1 | 0 | 1 {
  const outer = classifyPoint(room.outline, p);
  if (outer !== -1) return outer as 0 | 1;
  for (const o of room.obstacles) {
    const c = classifyPoint(o, p);
    if (c === 0) return 0;
    if (c === -1) return 1;
  }
  return -1;
}

/**
 * Whether the segment from a post to a point stays in the closed floor: no wall crosses it
 * properly, and between the corners it grazes every piece of it lies in the floor or on a wall.
 */
export function sees(room: PlainRoom, post: P, target: P): boolean {
  const rings = [room.outline, ...room.obstacles];
  const stops = [0, 1];
  const dx = target[0] - post[0];
  const dy = target[1] - post[1];
  const len2 = dx * dx + dy * dy;
  for (const ring of rings) {
    for (let i = 0; i < ring.length; i++) {
      const a = ring[i];
      const b = ring[(i + 1) % ring.length];
      const d1 = sign(ccw(a, b, post));
      const d2 = sign(ccw(a, b, target));
      const d3 = sign(ccw(post, target, a));
      const d4 = sign(ccw(post, target, b));
      if (d1 * d2 < 0 && d3 * d4 < 0) return false;
      if (d3 === 0 && within(post, target, a) && len2 > 0) stops.push(((a[0] - post[0]) * dx + (a[1] - post[1]) * dy) / len2);
    }
  }
  stops.sort((x, y) => x - y);
  for (let k = 0; k + 1 < stops.length; k++) {
    if (stops[k + 1] - stops[k] < 1e-12) continue;
    const t = (stops[k] + stops[k + 1]) / 2;
    if (classifyInRoom(room, [post[0] + t * dx, post[1] + t * dy]) === 1) return false;
  }
  return true;
}

/** Deterministic pseudo-random numbers for samples (mulberry32). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Sample points strictly inside the floor (uniform in the bounding box, rejected outside) and
 * return those no post sees. Sampling only: it can miss a sliver, never report a false gap.
 */
export function unseenSamples(room: PlainRoom, posts: P[], samples: number, seed = 1): P[] {
  const random = seededRandom(seed);
  const xs = room.outline.map((p) => p[0]);
  const ys = room.outline.map((p) => p[1]);
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const unseen: P[] = [];
  let taken = 0;
  for (let tries = 0; taken < samples && tries < samples * 200; tries++) {
    const p: P = [x0 + random() * (x1 - x0), y0 + random() * (y1 - y0)];
    if (classifyInRoom(room, p) !== -1) continue;
    taken++;
    if (!posts.some((post) => sees(room, post, p))) unseen.push(p);
  }
  return unseen;
}
