// Room generators for property tests and benchmarks: star-shaped rooms (sorted angles, random
// radii), orthogonal rooms with every metre marked (collinear runs, equal coordinates), spirals
// and small obstacles dropped into triangles far from the walls.
import type { P, PlainRoom } from "./oracle";

/**
 * A star-shaped room: n corners at sorted random angles and random radii around the origin.
 * With an angular gap over half a turn, or after snapping to a grid, it may be invalid: check.
 */
export function starRoom(random: () => number, n: number, options: { grid?: number; minRadius?: number } = {}): PlainRoom {
  const angles = Array.from({ length: n }, () => random() * 2 * Math.PI).sort((a, b) => a - b);
  const minRadius = options.minRadius ?? 0.2;
  const outline: P[] = angles.map((a) => {
    const r = minRadius + (1 - minRadius) * random();
    let p: P = [100 * r * Math.cos(a), 100 * r * Math.sin(a)];
    if (options.grid) p = [Math.round(p[0] / options.grid) * options.grid, Math.round(p[1] / options.grid) * options.grid];
    return p;
  });
  return { outline, obstacles: [] };
}

/**
 * An x-monotone orthogonal room on a unit grid: per column a floor and a ceiling height, consecutive
 * columns overlapping; with `everyMetre`, every lattice point on a wall is a corner (long collinear
 * runs and many equal y). `transpose` swaps x and y (then it is y-monotone: a different sweep case).
 */
export function orthogonalRoom(
  random: () => number,
  columns: number,
  options: { everyMetre?: boolean; transpose?: boolean; height?: number } = {},
): PlainRoom {
  const height = options.height ?? 12;
  const low: number[] = [];
  const high: number[] = [];
  for (let c = 0; c < columns; c++) {
    for (;;) {
      const a = Math.floor(random() * (height - 1));
      const b = a + 1 + Math.floor(random() * (height - a - 1)) + 1;
      if (c === 0 || (Math.max(a, low[c - 1]) < Math.min(b, high[c - 1]))) {
        low.push(a);
        high.push(Math.min(b, height));
        break;
      }
    }
  }
  // Walk: along the floors left to right, up the right end, along the ceilings right to left.
  const corners: P[] = [];
  for (let c = 0; c < columns; c++) {
    if (c === 0) corners.push([0, low[0]]);
    else if (low[c] !== low[c - 1]) corners.push([c, low[c - 1]], [c, low[c]]);
  }
  corners.push([columns, low[columns - 1]], [columns, high[columns - 1]]);
  for (let c = columns - 1; c >= 0; c--) {
    if (c === 0) corners.push([0, high[0]]);
    else if (high[c] !== high[c - 1]) corners.push([c, high[c]], [c, high[c - 1]]);
  }
  let outline = corners;
  if (options.everyMetre) {
    outline = [];
    for (let i = 0; i < corners.length; i++) {
      const a = corners[i];
      const b = corners[(i + 1) % corners.length];
      const steps = Math.abs(b[0] - a[0]) + Math.abs(b[1] - a[1]);
      for (let s = 0; s < steps; s++) outline.push([a[0] + ((b[0] - a[0]) * s) / steps, a[1] + ((b[1] - a[1]) * s) / steps]);
    }
  }
  if (options.transpose) outline = outline.map(([x, y]) => [y, x] as P).reverse();
  return { outline, obstacles: [] };
}

/**
 * A spiral corridor of n corners (n even): out along one arm, back along the other; a hard case
 * for ear clipping (every ear test scans a long reflex chain).
 */
export function spiralRoom(n: number, turns = 6): PlainRoom {
  const half = Math.max(3, Math.floor(n / 2));
  const outer: P[] = [];
  const inner: P[] = [];
  // At least 20 corners per turn keep the chords close enough to the arcs to stay apart.
  const total = Math.min(turns, (half - 1) / 20) * 2 * Math.PI;
  for (let i = 0; i < half; i++) {
    const t = 0.5 + (total * i) / (half - 1);
    const r = 10 + 10 * (t / (2 * Math.PI));
    outer.push([(r + 3) * Math.cos(t), (r + 3) * Math.sin(t)]);
    inner.push([(r - 3) * Math.cos(t), (r - 3) * Math.sin(t)]);
  }
  const outline = [...outer, ...inner.reverse()];
  return { outline, obstacles: [] };
}

/**
 * Small triangular obstacles, one in each chosen triangle of a triangulation, shrunk to a fifth
 * about the triangle's centroid so they stay far from every wall and from each other.
 */
export function obstaclesInTriangles(points: P[], triangles: [number, number, number][], picks: number[], shrink = 0.2): P[][] {
  return picks.map((k) => {
    const [a, b, c] = triangles[k].map((i) => points[i]);
    const g: P = [(a[0] + b[0] + c[0]) / 3, (a[1] + b[1] + c[1]) / 3];
    return [a, b, c].map((p) => [g[0] + shrink * (p[0] - g[0]), g[1] + shrink * (p[1] - g[1])] as P);
  });
}
