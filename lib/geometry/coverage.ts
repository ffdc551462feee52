// The coverage certificate of a post plan: the union of the posts' visibility regions by Clipper
// (integer Vatti sweep, coverage-clipper.ts), the seen fraction of the room's area and the unseen
// parts as polygons. Never sampled. (polygon-clipping, tried first, failed on nearly coincident
// shadow edges of rooms with obstacles: "Unable to complete output ring".)
//
// Tolerance, stated once: region corners are constructed in floating point and then rounded to
// Clipper's grid (2^-25 of the largest coordinate: about 3 micrometres in a 100 m room), so two
// regions that share a shadow edge meet along two separately rounded copies of it, leaving
// slivers one or two grid cells wide. An unseen part counts as such a rounding sliver, not a gap,
// only when it is thin everywhere: no disc of diameter SLIVER_CELLS grid cells fits inside it
// (checked by shrinking it by half that on Clipper's grid). Anything wider anywhere is a gap and
// is reported whole, so `covered` is 1 only when every unseen part is thinner than that at every
// point. (An earlier test by mean width, 2 × area / perimeter, and by a share of the room's area
// could average a real gap of several millimetres away when a long rounding sliver touched it.)
import type { Point, Ring, Room } from "./types";
import { clip, gridScale, holdsDisc, type Region } from "./coverage-clipper";

/** Unseen parts in which no disc this many grid cells across fits are rounding slivers, not gaps. */
export const SLIVER_CELLS = 4;

export type { Region };

export interface CoverageCertificate {
  /** Seen share of the room's area, 0..1 (1 means every point is seen by `demand` posts). */
  covered: number;
  /** Unseen (or not seen often enough) parts, each an outer ring then holes; slivers removed. */
  uncovered: Region;
  uncoveredArea: number;
  roomArea: number;
  /** 1 for single cover; 2 when every point must be seen by two posts. */
  demand: 1 | 2;
}

export function ringArea(ring: Ring): number {
  let twice = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) twice += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
  return twice / 2;
}

/** Area of polygons with holes, whatever the rings' orientation. */
export function regionArea(region: Region): number {
  let sum = 0;
  for (const polygon of region) {
    polygon.forEach((ring, i) => {
      const a = Math.abs(ringArea(ring));
      sum += i === 0 ? a : -a;
    });
  }
  return sum;
}

export function roomRegion(room: Room): Region {
  return [[room.outline, ...room.obstacles]];
}

function coordinateSize(regions: Region[]): number {
  let size = 1;
  for (const g of regions) for (const polygon of g) for (const ring of polygon) for (const [x, y] of ring) size = Math.max(size, Math.abs(x), Math.abs(y));
  return size;
}

/**
 * Union of many regions: in one sweep while they are small together, else merged in a tree of
 * sweeps over consecutive batches (in the given order, which callers keep spatially coherent). One
 * sweep over hundreds of large sight regions would meet every crossing of every pair that overlaps
 * (quadratic in the posts for a hall); each partial union has dropped its inner edges, so later
 * sweeps meet only the outlines that remain.
 */
export function unionOf(regions: Region[], scale = gridScale(coordinateSize(regions))): Region {
  let parts = regions.filter((r) => r.length > 0);
  if (parts.length <= 1) return parts[0] ?? [];
  const corners = (region: Region) => region.reduce((sum, polygon) => sum + polygon.reduce((n, ring) => n + ring.length, 0), 0);
  while (parts.length > 1) {
    const next: Region[] = [];
    let batch: Region[] = [];
    let size = 0;
    const flush = () => {
      if (batch.length) next.push(batch.length === 1 ? batch[0] : clip("union", batch, [], scale));
      batch = [];
      size = 0;
    };
    for (const part of parts) {
      const n = corners(part);
      if (batch.length >= 2 && size + n > UNION_SWEEP_CORNERS) flush();
      batch.push(part);
      size += n;
    }
    flush();
    parts = next;
  }
  return parts[0];
}

/** Corners merged per sweep in unionOf (a batch holds at least two regions). */
const UNION_SWEEP_CORNERS = 6000;

/** The parts of the room seen by at least two of the regions: the union of pairwise overlaps. */
export function seenTwice(regions: Region[], scale = gridScale(coordinateSize(regions))): Region {
  let once: Region = [];
  const overlaps: Region[] = [];
  for (const region of regions) {
    if (region.length === 0) continue;
    if (once.length > 0) {
      const overlap = clip("intersection", [once], [region], scale);
      if (overlap.length) overlaps.push(overlap);
      once = clip("union", [once, region], [], scale);
    } else {
      once = region;
    }
  }
  return unionOf(overlaps, scale);
}

/** Certifies how much of the room the regions see (each point once, or twice for double cover). */
export function certifyCoverage(room: Room, regions: Region[], demand: 1 | 2 = 1): CoverageCertificate {
  const whole = roomRegion(room);
  const roomArea = regionArea(whole);
  const scale = gridScale(coordinateSize([whole]));
  const seen = demand === 2 ? seenTwice(regions, scale) : unionOf(regions, scale);
  const unseen = seen.length ? clip("difference", [whole], [seen], scale) : whole;
  const uncovered = unseen.filter((polygon) => holdsDisc(polygon, scale, SLIVER_CELLS / 2));
  const uncoveredArea = regionArea(uncovered);
  const covered = uncovered.length === 0 ? 1 : Math.max(0, Math.min(1, 1 - uncoveredArea / roomArea));
  return { covered, uncovered, uncoveredArea, roomArea, demand };
}

/**
 * A point well inside a polygon with holes: on the horizontal line through the middle of one of its
 * tallest slabs between vertex heights (so the line meets no corner), the middle of the widest
 * stretch inside. Used to put a new witness into an unseen part.
 */
export function pointInside(polygon: Ring[]): Point {
  const heights = [...new Set(polygon.flatMap((ring) => ring.map((p) => p[1])))].sort((a, b) => a - b);
  const slabs: [number, number][] = [];
  for (let i = 0; i + 1 < heights.length; i++) slabs.push([heights[i], heights[i + 1]]);
  slabs.sort((a, b) => b[1] - b[0] - (a[1] - a[0]));
  let best: Point = polygon[0][0];
  let bestScore = -1;
  for (const [low, high] of slabs.slice(0, 20)) {
    const y = (low + high) / 2;
    const crossings: number[] = [];
    for (const ring of polygon) {
      for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
        const [x1, y1] = ring[j], [x2, y2] = ring[i];
        if (y1 > y !== y2 > y) crossings.push(x1 + ((y - y1) * (x2 - x1)) / (y2 - y1));
      }
    }
    crossings.sort((a, b) => a - b);
    for (let k = 0; k + 1 < crossings.length; k += 2) {
      const width = crossings[k + 1] - crossings[k];
      const score = Math.min(width, high - low);
      if (score > bestScore) {
        bestScore = score;
        best = [(crossings[k] + crossings[k + 1]) / 2, y];
      }
    }
  }
  return best;
}
