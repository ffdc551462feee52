// The single-cover lower bound: the witness problem solved exactly (Tozoni, de Rezende & de Souza,
// ACM TOMS 2016, the "discretised dual"). Overlay the visibility regions of witnesses w1..wk into
// cells; every point of a cell sees the same witnesses. Any post stands in some cell, so the fewest
// cells whose witness sets together contain all k witnesses (an integer program, after the
// reductions of fewest-reduce.ts, solved to optimality) is a number of posts no plan can beat: a
// plan that sees the room sees these witnesses. Any subset of the witnesses gives such a bound, so
// the planner adds only the witnesses it needs (row generation, fewest-core.ts).
//
// Rounding: regions are grown by GROW_CELLS grid cells before the overlay, so a point on the
// touching boundary of two regions (which sees both) falls into a thin cell holding both, and
// rounding on the grid cannot drop a witness from a cell that should hold it. Growing only adds
// witnesses to cells, which can only lower the bound, so it stays a proof. Witnesses are added
// one at a time; when a limit cuts, the overlay of the witnesses added so far is complete and used.
// Most cells are found wholly inside or outside a region by a window clip (clipToWindow, against)
// and need no Clipper call; tests/sightlines/witness-cells.test.ts checks the cells' labels against
// an independent sampler.
import type { Point, Room } from "../geometry/types";
import { pointInside, type Region } from "../geometry/coverage";
import { clipPaths, gridScale, growPaths, toPaths, type IntPoint } from "../geometry/coverage-clipper";
import { solveCover } from "./fewest-reduce";

/** How far regions are grown, in grid cells (a grid cell is 2^-25 of the room's largest coordinate). */
export const GROW_CELLS = 64;

interface Cell {
  paths: IntPoint[][];
  sees: number[];
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

function bounds(paths: IntPoint[][]) {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const path of paths) {
    for (const p of path) {
      if (p.X < minX) minX = p.X;
      if (p.Y < minY) minY = p.Y;
      if (p.X > maxX) maxX = p.X;
      if (p.Y > maxY) maxY = p.Y;
    }
  }
  return { minX, minY, maxX, maxY };
}

/** How far beyond a cell's bounding box its window reaches, in grid cells (see clipToWindow). */
const WINDOW_MARGIN = 4;

/**
 * One ring clipped to an axis-parallel window (Sutherland & Hodgman 1974), crossing points rounded
 * to the grid. Inside the window it has the ring's winding number up to the rounding, which moves
 * an edge by at most half a grid cell, and only near the window's sides. The cells of the overlay
 * lie WINDOW_MARGIN cells inside the window and the regions are grown by GROW_CELLS first, so the
 * clipped ring still holds every point of the witness's true region that lies in the cell.
 */
function clipToWindow(path: IntPoint[], x0: number, y0: number, x1: number, y1: number): IntPoint[] {
  let points = path;
  for (let side = 0; side < 4 && points.length > 0; side++) {
    // Sides: x >= x0, x <= x1, y >= y0, y <= y1; `level` is the side's line, `sign` faces inside.
    const alongX = side < 2;
    const level = side === 0 ? x0 : side === 1 ? x1 : side === 2 ? y0 : y1;
    const sign = side % 2 === 0 ? 1 : -1;
    const out: IntPoint[] = [];
    let a = points[points.length - 1];
    let aIn = sign * ((alongX ? a.X : a.Y) - level) >= 0;
    for (let i = 0; i < points.length; i++) {
      const b = points[i];
      const bIn = sign * ((alongX ? b.X : b.Y) - level) >= 0;
      if (aIn !== bIn) {
        // The crossing with the side's line, rounded to the grid along the line.
        out.push(
          alongX
            ? { X: level, Y: Math.round(a.Y + ((level - a.X) * (b.Y - a.Y)) / (b.X - a.X)) }
            : { X: Math.round(a.X + ((level - a.Y) * (b.X - a.X)) / (b.Y - a.Y)), Y: level },
        );
      }
      if (bIn) out.push(b);
      a = b;
      aIn = bIn;
    }
    points = out;
  }
  return points;
}

/**
 * Where a grown region stands against a cell: "outside" and "inside" need no boolean operation;
 * otherwise the region's rings clipped to the cell's window, for Clipper.
 */
function against(grown: IntPoint[][], cell: Cell): "outside" | "inside" | IntPoint[][] {
  const x0 = cell.minX - WINDOW_MARGIN, y0 = cell.minY - WINDOW_MARGIN, x1 = cell.maxX + WINDOW_MARGIN, y1 = cell.maxY + WINDOW_MARGIN;
  const pieces: IntPoint[][] = [];
  for (const path of grown) {
    const piece = clipToWindow(path, x0, y0, x1, y1);
    if (piece.length >= 3) pieces.push(piece);
  }
  if (pieces.length === 0) return "outside";
  if (grown.length === 1 && pieces.length === 1) {
    // A ring that only runs along the window's sides either holds the whole window or nothing of it.
    const piece = pieces[0];
    let alongSides = true;
    let twice = 0;
    for (let i = 0, j = piece.length - 1; i < piece.length; j = i++) {
      const a = piece[j], b = piece[i];
      const sameSide = (a.X === x0 && b.X === x0) || (a.X === x1 && b.X === x1) || (a.Y === y0 && b.Y === y0) || (a.Y === y1 && b.Y === y1);
      if (!sameSide) {
        alongSides = false;
        break;
      }
      twice += (a.X - x0) * (b.Y - y0) - (b.X - x0) * (a.Y - y0);
    }
    if (alongSides) return Math.abs(twice) / 2 > 0.5 * (x1 - x0) * (y1 - y0) ? "inside" : "outside";
  }
  return pieces;
}

export interface WitnessCells {
  /** Witnesses whose regions are in the overlay, in the order added. */
  readonly witnesses: number;
  /**
   * Adds witnesses' regions to the overlay in order, until one would pass `clips` more boolean
   * operations or the clock passes `stopAt` (ms); a witness cut off midway is left out whole.
   * Returns how many were added.
   */
  add(regions: Region[], limits: { clips?: number; stopAt?: number }): number;
  /**
   * The fewest posts in cells that see every witness added so far, each witness from `demand`
   * posts (two posts may share a cell), 0 unless solved to optimality; with a point in each chosen
   * cell (twice for a cell chosen twice). `lightPosts` gives a point in every cell whose witness
   * set no other cell's contains (Tozoni et al.'s light faces), candidate posts for the plan.
   */
  solve(limits: { seconds: number; nodes?: number; demand?: 1 | 2 }): { bound: number; witnesses: number; posts: Point[]; lightPosts: () => Point[] };
  /** The witnesses (by order added) of the cell holding a point of the room, or null outside. */
  labelAt(point: Point): number[] | null;
}

/** Even-odd point-in-paths on the grid (a cell's rings from Clipper never overlap). */
function insidePaths(x: number, y: number, paths: IntPoint[][]): boolean {
  let inside = false;
  for (const path of paths) {
    for (let i = 0, j = path.length - 1; i < path.length; j = i++) {
      const a = path[i], b = path[j];
      if (a.Y > y !== b.Y > y && x < ((b.X - a.X) * (y - a.Y)) / (b.Y - a.Y) + a.X) inside = !inside;
    }
  }
  return inside;
}

/**
 * An overlay that grows witness by witness, so later rounds of the planner pay only for their new
 * witnesses (the cells of the earlier ones are kept).
 */
export function createWitnessCells(room: Room): WitnessCells {
  let size = 1;
  for (const ring of [room.outline, ...room.obstacles]) for (const [x, y] of ring) size = Math.max(size, Math.abs(x), Math.abs(y));
  const scale = gridScale(size);
  const roomPaths = toPaths([[room.outline, ...room.obstacles]], scale);
  let cells: Cell[] = [{ paths: roomPaths, sees: [], ...bounds(roomPaths) }];
  let used = 0;

  function add(regions: Region[], limits: { clips?: number; stopAt?: number }): number {
    const maxClips = limits.clips ?? Infinity;
    const stopAt = limits.stopAt ?? Infinity;
    let clips = 0;
    let added = 0;
    for (const region of regions) {
      const k = used;
      const grown = growPaths(toPaths(region, scale), GROW_CELLS);
      const box = bounds(grown);
      const next: Cell[] = [];
      let finished = true;
      for (const cell of cells) {
        if (clips >= maxClips || performance.now() > stopAt) {
          finished = false;
          break;
        }
        if (cell.maxX < box.minX || cell.minX > box.maxX || cell.maxY < box.minY || cell.minY > box.maxY) {
          next.push(cell);
          continue;
        }
        const where = against(grown, cell);
        if (where === "outside") {
          next.push(cell);
          continue;
        }
        if (where === "inside") {
          next.push({ ...cell, sees: [...cell.sees, k] });
          continue;
        }
        clips++;
        const inside = clipPaths("intersection", cell.paths, where);
        if (inside.length === 0) {
          next.push(cell);
          continue;
        }
        next.push({ paths: inside, sees: [...cell.sees, k], ...bounds(inside) });
        const outside = clipPaths("difference", cell.paths, where);
        if (outside.length) next.push({ paths: outside, sees: cell.sees, ...bounds(outside) });
      }
      if (!finished) break;
      cells = next;
      used = k + 1;
      added++;
    }
    return added;
  }

  function solve(limits: { seconds: number; nodes?: number; demand?: 1 | 2 }) {
    const demand = limits.demand ?? 1;
    if (used === 0) return { bound: 0, witnesses: 0, posts: [], lightPosts: () => [] };
    // Only cells whose witness set no other cell's set contains matter to the minimum (a post in
    // the smaller cell can move to the larger one and see no less).
    const byKey = new Map(cells.map((c) => [c.sees.join(","), c]));
    const sets = [...byKey.values()].filter((c) => c.sees.length > 0).sort((a, b) => b.sees.length - a.sees.length);
    const words = (used + 31) >>> 5;
    const maximalCells: Cell[] = [];
    const maximalBits: Uint32Array[] = [];
    const holdingMaximal: number[][] = Array.from({ length: used }, () => []);
    for (const cell of sets) {
      const bits = new Uint32Array(words);
      for (const w of cell.sees) bits[w >>> 5] |= 1 << (w & 31);
      // A larger set holding this one holds its rarest witness.
      let rarest = cell.sees[0];
      for (const w of cell.sees) if (holdingMaximal[w].length < holdingMaximal[rarest].length) rarest = w;
      const within = holdingMaximal[rarest].some((m) => {
        const other = maximalBits[m];
        for (let i = 0; i < words; i++) if ((bits[i] & ~other[i]) !== 0) return false;
        return true;
      });
      if (within) continue;
      const m = maximalCells.length;
      maximalCells.push(cell);
      maximalBits.push(bits);
      for (const w of cell.sees) holdingMaximal[w].push(m);
    }
    if (holdingMaximal.some((h) => h.length === 0)) return { bound: 0, witnesses: used, posts: [], lightPosts: () => [] };
    // Double cover: two posts may stand in one cell, so each cell is offered twice (columns j and
    // j + M), and each witness needs two of the columns holding it.
    const count = maximalCells.length;
    const answer = solveCover({
      columns: demand * count,
      rows: holdingMaximal.map((items) => ({ items: demand === 2 ? [...items, ...items.map((j) => j + count)] : items, need: demand })),
      seconds: Math.max(0.1, limits.seconds),
      nodes: limits.nodes,
    });
    // Only a proven optimum is a bound; an unfinished search only gives an upper value.
    const pointOf = (cell: Cell) => pointInside(cell.paths.map((path) => path.map((p) => [p.X / scale, p.Y / scale] as Point)));
    const posts = answer.chosen.map((j) => pointOf(maximalCells[j % count]));
    return { bound: answer.status === "optimal" ? answer.chosen.length : 0, witnesses: used, posts, lightPosts: () => maximalCells.map(pointOf) };
  }

  function labelAt(point: Point): number[] | null {
    const x = point[0] * scale, y = point[1] * scale;
    for (const cell of cells) {
      if (x < cell.minX || x > cell.maxX || y < cell.minY || y > cell.maxY) continue;
      if (insidePaths(x, y, cell.paths)) return cell.sees;
    }
    return null;
  }

  return {
    get witnesses() {
      return used;
    },
    add,
    solve,
    labelAt,
  };
}

/**
 * The fewest posts that can see the given witnesses (in the order given, as many as the limits
 * allow), or 0 when not even the integer program could be solved to optimality; with a point in
 * each chosen cell, which the planner tries as posts.
 */
export function arrangementBound(
  room: Room,
  regions: Region[],
  limits: { seconds: number; clips?: number; nodes?: number; demand?: 1 | 2 },
): { bound: number; witnesses: number; posts: Point[] } {
  const stopAt = performance.now() + 1000 * limits.seconds;
  const overlay = createWitnessCells(room);
  overlay.add(regions, { clips: limits.clips, stopAt });
  return overlay.solve({ seconds: (stopAt - performance.now()) / 1000 + 0.5, nodes: limits.nodes, demand: limits.demand });
}
