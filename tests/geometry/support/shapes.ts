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

// Families with random variation for the benchmark and its unit test: each call draws its own
// proportions from `random`, so seeds give different rooms of one kind.

/** A star-shaped room whose corners alternate between an outer and an inner radius, both drawn at random. */
export function alternatingStarRoom(random: () => number, n: number): PlainRoom {
  const m = 2 * Math.max(2, Math.round(n / 2));
  const depth = 0.05 + 0.85 * random();
  const outline: P[] = [];
  for (let i = 0; i < m; i++) {
    const a = (2 * Math.PI * (i + 0.8 * (random() - 0.5))) / m;
    const r = i % 2 === 0 ? 100 * (1 - 0.05 * random()) : 100 * (1 - depth * (0.5 + 0.5 * random()));
    outline.push([r * Math.cos(a), r * Math.sin(a)]);
  }
  return { outline, obstacles: [] };
}

/**
 * A comb of about n corners with teeth of random width, height and valley depth, turned by
 * `turn` radians (0: teeth point up, the outline is x-monotone).
 */
export function unevenCombRoom(random: () => number, n: number, turn = 0): PlainRoom {
  const k = Math.max(1, Math.floor((n - 1) / 3));
  const teeth: P[] = [];
  let x = 0;
  for (let i = 0; i < k; i++) {
    const width = 0.5 + 2 * random();
    const gap = 0.3 + 1.5 * random();
    if (i > 0) teeth.push([x, 1 + random()]);
    teeth.push([x + width * (0.2 + 0.6 * random()), 4 + 12 * random()]);
    teeth.push([x + width, 1 + random()]);
    x += width + gap;
  }
  teeth[teeth.length - 1] = [teeth[teeth.length - 1][0], 0];
  // Counter-clockwise: along the floor, then back over the teeth from the right.
  const outline: P[] = [[0, 0], ...teeth.reverse()];
  const c = Math.cos(turn);
  const s = Math.sin(turn);
  return { outline: turn === 0 ? outline : outline.map(([px, py]) => [c * px - s * py, s * px + c * py] as P), obstacles: [] };
}

/** An orthogonal room (see orthogonalRoom) whose corners are each moved by up to `jitter` metres. */
export function jitteredOrthogonalRoom(random: () => number, n: number, jitter = 0.2): PlainRoom {
  let columns = Math.max(2, Math.round(n / 3));
  let room = orthogonalRoom(random, columns);
  // About 3 corners per column; widen until the outline has n or so.
  while (room.outline.length < 0.9 * n) room = orthogonalRoom(random, (columns = Math.ceil(columns * 1.2)));
  return { outline: room.outline.map(([x, y]) => [x + jitter * (random() - 0.5), y + jitter * (random() - 0.5)] as P), obstacles: [] };
}

/** A nearly convex ring: n corners around a circle, angles and radii shaken a little. */
export function nearConvexRoom(random: () => number, n: number): PlainRoom {
  const wobble = 0.005 + 0.03 * random();
  const outline: P[] = [];
  for (let i = 0; i < n; i++) {
    const a = (2 * Math.PI * (i + 0.4 * (random() - 0.5))) / n;
    const r = 100 * (1 + wobble * (random() - 0.5));
    outline.push([r * Math.cos(a), r * Math.sin(a)]);
  }
  return { outline, obstacles: [] };
}
