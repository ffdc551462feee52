// A guard watches well only up to a sight range: the visibility region clipped to a disc, the disc
// drawn as a regular polygon whose chords stray at most 1 cm from the true circle. The clipping is
// Clipper's integer sweep (coverage-clipper.ts, the engine's one clipping library), so a disc that
// touches a wall, a corner or another disc is an ordinary input, never a failure. To stay on the
// safe side of the grid's rounding, the inscribed disc is shrunk and the circumscribed one grown by
// two grid cells before the clip.
import type { Point, Ring } from "./types";
import { clip, gridScale } from "./coverage-clipper";

/** Largest gap, in metres, allowed between a disc polygon's chord and the true circle. */
export const CHORD_ERROR = 0.01;

/** Corners a disc polygon of radius r needs so that r(1 − cos(π/k)) ≤ CHORD_ERROR. */
export function discCorners(radius: number): number {
  if (radius <= CHORD_ERROR) return 8;
  return Math.max(8, Math.ceil(Math.PI / Math.acos(1 - CHORD_ERROR / radius)));
}

/**
 * The sight-range disc as a counter-clockwise polygon. `inscribed` (corners on the circle) lies
 * inside the true disc, so coverage claimed with it holds for the true disc; `circumscribed`
 * (edges touching the circle) contains it, which a lower bound needs to stay a proof.
 */
export function sightDisc(centre: Point, radius: number, fit: "inscribed" | "circumscribed" = "inscribed", margin = 0): Ring {
  const k = discCorners(radius);
  const reach = fit === "inscribed" ? Math.max(0, radius - margin) : radius / Math.cos(Math.PI / k) + margin;
  const ring: Ring = [];
  for (let i = 0; i < k; i++) {
    const angle = (2 * Math.PI * i) / k;
    ring.push([centre[0] + reach * Math.cos(angle), centre[1] + reach * Math.sin(angle)]);
  }
  return ring;
}

/** A visibility region limited to the sight range: zero or more polygons (outer ring, then holes). */
export function clipToSightRange(region: Ring, post: Point, radius: number, fit: "inscribed" | "circumscribed" = "inscribed"): Ring[][] {
  if (region.length < 3 || !(radius > 0)) return [];
  const k = discCorners(radius);
  // Skip the boolean operation when the whole region already lies within reach.
  const reach = fit === "inscribed" ? radius * Math.cos(Math.PI / k) : radius;
  if (region.every(([x, y]) => Math.hypot(x - post[0], y - post[1]) <= reach)) return [[region]];
  let size = Math.abs(post[0]) + Math.abs(post[1]) + radius * 2;
  for (const [x, y] of region) size = Math.max(size, Math.abs(x), Math.abs(y));
  const scale = gridScale(size);
  const disc = sightDisc(post, radius, fit, 2 / scale);
  if (disc.length < 3 || (fit === "inscribed" && radius <= 2 / scale)) return [];
  return clip("intersection", [[[region]]], [[[disc]]], scale);
}
