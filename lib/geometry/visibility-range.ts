// A guard watches well only up to a sight range: the visibility region clipped to a disc, the disc
// drawn as a regular polygon whose chords stray at most 1 cm from the true circle.
import polygonClipping from "polygon-clipping";
import type { Point, Ring } from "./types";

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
export function sightDisc(centre: Point, radius: number, fit: "inscribed" | "circumscribed" = "inscribed"): Ring {
  const k = discCorners(radius);
  const reach = fit === "inscribed" ? radius : radius / Math.cos(Math.PI / k);
  const ring: Ring = [];
  for (let i = 0; i < k; i++) {
    const angle = (2 * Math.PI * i) / k;
    ring.push([centre[0] + reach * Math.cos(angle), centre[1] + reach * Math.sin(angle)]);
  }
  return ring;
}

/** A visibility region limited to the sight range: zero or more polygons (outer ring, then holes). */
export function clipToSightRange(region: Ring, post: Point, radius: number, fit: "inscribed" | "circumscribed" = "inscribed"): Ring[][] {
  if (region.length < 3) return [];
  const disc = sightDisc(post, radius, fit);
  // Skip the boolean operation when the whole region already lies within reach.
  const reach = fit === "inscribed" ? radius * Math.cos(Math.PI / disc.length) : radius;
  if (region.every(([x, y]) => Math.hypot(x - post[0], y - post[1]) <= reach)) return [[region]];
  return polygonClipping.intersection([region], [disc]).map((polygon) => polygon.map(openRing));
}

/** polygon-clipping repeats the first point at the end of each ring; our rings do not. */
export function openRing(ring: Ring): Ring {
  const last = ring[ring.length - 1];
  return ring.length > 1 && last[0] === ring[0][0] && last[1] === ring[0][1] ? ring.slice(0, -1) : ring;
}
