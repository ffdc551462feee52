// The comb: Chvátal's (1975) lower-bound family for the art gallery theorem. A room of k narrow
// prongs has 3k vertices and needs k posts, because no point sees the tips of two prongs; it is
// the worst case the guaranteed plan's floor(n/3) bound is tight for, and a demo of it.
import type { Room } from "../geometry/types";

export interface CombOptions {
  /** Height of the prongs' tips, metres (default 10); must exceed 3 x valleyHeight. */
  tipHeight?: number;
  /** Height of the valleys between prongs, metres (default 1). */
  valleyHeight?: number;
  /** Horizontal spacing unit, metres (default 1): prong i spans x in [3i, 3i + 2] units. */
  unit?: number;
}

/**
 * A comb with k prongs pointing up from a strip along y = 0, outline counter-clockwise, 3k vertices.
 * Prong i has its tip at (3i + 1, tipHeight) and feet at (3i, valleyHeight) and (3i + 2,
 * valleyHeight); the outermost feet drop to the floor line y = 0 to close the room. With
 * tipHeight > 3 x valleyHeight the regions that see two neighbouring tips do not overlap.
 */
export function comb(k: number, options: CombOptions = {}): Room {
  if (!Number.isInteger(k) || k < 1) throw new Error(`comb: the number of prongs must be a whole number ≥ 1, got ${k}`);
  const tip = options.tipHeight ?? 10;
  const valley = options.valleyHeight ?? 1;
  const unit = options.unit ?? 1;
  if (!(tip > 3 * valley && valley > 0)) throw new Error("comb: tipHeight must exceed 3 x valleyHeight > 0");
  const outline: [number, number][] = [
    [0, 0],
    [(3 * k - 1) * unit, 0],
  ];
  for (let i = k - 1; i >= 0; i--) {
    outline.push([(3 * i + 1) * unit, tip]);
    if (i > 0) {
      outline.push([3 * i * unit, valley]);
      outline.push([(3 * i - 1) * unit, valley]);
    }
  }
  return { outline, obstacles: [] };
}
