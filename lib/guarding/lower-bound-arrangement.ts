// A stronger lower bound for rooms where independent witnesses fall short: the witness problem
// solved exactly (Tozoni, de Rezende & de Souza, ACM TOMS 2016, the "discretised dual"). Overlay the
// visibility regions of witnesses w1..wk into cells; every point of a cell sees the same witnesses.
// Any post stands in some cell, so the fewest cells whose witness sets together contain all k
// witnesses (an integer program, HiGHS, solved to optimality) is a number of posts no plan can
// beat: a plan that sees the room sees these witnesses.
//
// Rounding: regions are grown by GROW_CELLS grid cells before the overlay, so a point on the
// touching boundary of two regions (which sees both) falls into a thin cell holding both, and
// rounding on the grid cannot drop a witness from a cell that should hold it. Growing only adds
// witnesses to cells, which can only lower the bound, so it stays a proof. Witnesses are added
// one at a time; when time runs out the overlay of the witnesses added so far is complete and used.
import type { Point, Room } from "../geometry/types";
import { pointInside, type Region } from "../geometry/coverage";
import { clipPaths, gridScale, growPaths, toPaths, type IntPoint } from "../geometry/coverage-clipper";
import { solveBinaryProgram } from "./fewest-solver";

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

export interface WitnessCells {
  /** Witnesses whose regions are in the overlay, in the order added. */
  readonly witnesses: number;
  /**
   * Adds witnesses' regions to the overlay in order, until one would pass `clips` more boolean
   * operations or the clock passes `stopAt` (ms); a witness cut off midway is left out whole.
   * Returns how many were added.
   */
  add(regions: Region[], limits: { clips?: number; stopAt?: number }): number;
  /** The fewest cells that see every witness added so far (0 unless solved to optimality), with a point in each. */
  solve(limits: { seconds: number; nodes?: number }): { bound: number; witnesses: number; posts: Point[] };
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
        clips++;
        const inside = clipPaths("intersection", cell.paths, grown);
        if (inside.length === 0) {
          next.push(cell);
          continue;
        }
        next.push({ paths: inside, sees: [...cell.sees, k], ...bounds(inside) });
        const outside = clipPaths("difference", cell.paths, grown);
        if (outside.length) next.push({ paths: outside, sees: cell.sees, ...bounds(outside) });
      }
      if (!finished) break;
      cells = next;
      used = k + 1;
      added++;
    }
    return added;
  }

  function solve(limits: { seconds: number; nodes?: number }) {
    if (used === 0) return { bound: 0, witnesses: 0, posts: [] };
    // Only cells whose witness set no other cell's set contains matter to the minimum.
    const byKey = new Map(cells.map((c) => [c.sees.join(","), c]));
    const sets = [...byKey.values()].sort((a, b) => b.sees.length - a.sees.length);
    const maximalCells: Cell[] = [];
    for (const cell of sets) {
      if (cell.sees.length === 0) continue;
      if (!maximalCells.some((m) => cell.sees.every((w) => m.sees.includes(w)))) maximalCells.push(cell);
    }
    const maximal = maximalCells.map((c) => c.sees);
    const holding: number[][] = Array.from({ length: used }, () => []);
    maximal.forEach((set, j) => set.forEach((w) => holding[w].push(j)));
    if (holding.some((h) => h.length === 0)) return { bound: 0, witnesses: used, posts: [] };
    const answer = solveBinaryProgram({
      sense: "minimise",
      weights: maximal.map(() => 1),
      atLeast: holding.map((items) => ({ items, need: 1 })),
      seconds: Math.max(0.1, limits.seconds),
      nodes: limits.nodes,
    });
    // Only a proven optimum is a bound; an unfinished search only gives an upper value.
    const posts = answer.chosen.map((j) => pointInside(maximalCells[j].paths.map((path) => path.map((p) => [p.X / scale, p.Y / scale] as Point))));
    return { bound: answer.status === "optimal" ? answer.chosen.length : 0, witnesses: used, posts };
  }

  return {
    get witnesses() {
      return used;
    },
    add,
    solve,
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
  limits: { seconds: number; clips?: number; nodes?: number },
): { bound: number; witnesses: number; posts: Point[] } {
  const stopAt = performance.now() + 1000 * limits.seconds;
  const overlay = createWitnessCells(room);
  overlay.add(regions, { clips: limits.clips, stopAt });
  return overlay.solve({ seconds: (stopAt - performance.now()) / 1000 + 0.5, nodes: limits.nodes });
}
