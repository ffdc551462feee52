// Triangulation speed: lib/geometry/triangulate.ts against earcut (the npm triangulation package,
// named peer), measured in the same run on the same rings. Families: random star-shaped polygons,
// the AGPLIB benchmark polygons (AGPLIB, Univ. of Campinas), and adversarial shapes (Chvátal combs,
// spirals, orthogonal rooms with every metre marked), plus seeded random families (alternating
// stars, uneven combs, jittered orthogonal and near-convex rings). Reports median time per run, the ratio to
// earcut, and the growth from n to 10n (n log n growth is about 11-13x per 10x; quadratic is 100x).
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { setFlagsFromString } from "node:v8";
import { runInNewContext } from "node:vm";
import earcut, { flatten } from "earcut";
import { prepareRoom } from "../../lib/geometry/room";
import { triangulate } from "../../lib/geometry/triangulate";
import { comb } from "../../lib/guarding/comb";
import type { Room } from "../../lib/geometry/types";
import { seededRandom, type PlainRoom } from "../geometry/support/oracle";
import {
  alternatingStarRoom,
  jitteredOrthogonalRoom,
  nearConvexRoom,
  orthogonalRoom,
  spiralRoom,
  starRoom,
  unevenCombRoom,
} from "../geometry/support/shapes";
import { agplibPolygons, asRoom } from "../geometry/support/agplib";

/** CPU milliseconds of this process (user + system): steadier than wall time on a busy machine. */
function cpuNow(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
}

// A young-generation collection before every round, not timed: a round then does not pay for
// collecting the short-lived garbage of the other contender's round (both leave plenty: earcut a
// node per vertex, we an array per triangle). Not a full collection: right after one, V8 keeps its
// limits low for a while, and code that allocates typed arrays on every call ran 5-20x slower.
setFlagsFromString("--expose-gc");
const gc = runInNewContext("gc") as (options?: { type: "minor" | "major" }) => void;
const collectGarbage = () => gc({ type: "minor" });

interface Timing {
  ours: number;
  theirs: number;
  /** Lowest and highest ratio ours / earcut of a single pair of rounds. */
  low: number;
  high: number;
}

/**
 * Median CPU milliseconds per call of each contender, measured in alternating rounds so both see
 * the same machine load; each round repeats a call until it has used at least 20 ms of CPU.
 */
function timeBoth(ours: () => void, theirs: () => void, rounds = 11): Timing {
  const round = (work: () => void): number => {
    collectGarbage();
    const t0 = cpuNow();
    let calls = 0;
    let used = 0;
    do {
      work();
      calls++;
      used = cpuNow() - t0;
    } while (used < 20);
    return used / calls;
  };
  const a: number[] = [];
  const b: number[] = [];
  for (let r = 0; r < rounds; r++) {
    a.push(round(ours));
    b.push(round(theirs));
    if (a[0] > 2000 || b[0] > 2000) break; // one slow call is measurement enough
  }
  // The other contender still gets all its rounds: its median is then not one call's luck.
  while (a.length < rounds && a[0] <= 2000) a.push(round(ours));
  while (b.length < rounds && b[0] <= 2000) b.push(round(theirs));
  const pairs = Math.min(a.length, b.length);
  const ratios = a.slice(0, pairs).map((x, r) => x / b[r]);
  const median = (xs: number[]) => [...xs].sort((x, y) => x - y)[Math.floor(xs.length / 2)];
  return { ours: median(a), theirs: median(b), low: Math.min(...ratios), high: Math.max(...ratios) };
}

interface Case {
  family: string;
  n: number;
  rooms: Room[];
}

function prepared(input: PlainRoom): Room {
  const result = prepareRoom(input, { maxVertices: 1e7 });
  if (!result.ok) throw new Error(result.problems[0].message);
  return result.room;
}

/** A valid star room of n corners (retry seeds: a gap over half a turn can cross itself). */
function validStar(n: number, seed: number): Room {
  for (let s = seed; ; s++) {
    const result = prepareRoom(starRoom(seededRandom(s), n), { maxVertices: 1e7 });
    if (result.ok) return result.room;
  }
}

function measure(c: Case, rounds = 11): { ours: number; earcut: number; low: number; high: number; triangles: number; earcutTriangles: number } {
  const inputs = c.rooms.map((room) => flatten([room.outline, ...room.obstacles]));
  // Warm up both (JIT) on the same input before timing.
  for (let i = 0; i < (c.n > 20_000 ? 1 : 5); i++) {
    c.rooms.forEach((room) => triangulate(room));
    inputs.forEach((d) => earcut(d.vertices, d.holes, d.dimensions));
  }
  let triangles = 0;
  let earcutTriangles = 0;
  const timing = timeBoth(
    () => {
      triangles = 0;
      for (const room of c.rooms) triangles += triangulate(room).triangles.length;
    },
    () => {
      earcutTriangles = 0;
      for (const d of inputs) earcutTriangles += earcut(d.vertices, d.holes, d.dimensions).length / 3;
    },
    rounds,
  );
  return { ours: timing.ours, earcut: timing.theirs, low: timing.low, high: timing.high, triangles, earcutTriangles };
}

const range = (m: { low: number; high: number }) => (m.low === m.high ? "" : `${m.low.toFixed(2)}-${m.high.toFixed(2)}`);
const fmt = (ms: number) => (ms < 1 ? ms.toFixed(3) : ms < 100 ? ms.toFixed(2) : ms.toFixed(0));

export default async function triangulationBench(): Promise<string> {
  const sizes = [100, 1_000, 10_000, 100_000];
  const families: { family: string; make: (n: number) => Room }[] = [
    { family: "random star polygon", make: (n) => validStar(n, n) },
    { family: "comb (adversarial)", make: (n) => prepared(comb(Math.round(n / 3))) },
    { family: "spiral (adversarial)", make: (n) => prepared(spiralRoom(n, Math.max(2, Math.round(Math.sqrt(n) / 4)))) },
    {
      family: "orthogonal, every metre a corner",
      make: (n) => {
        // Columns chosen so the outline has about n corners.
        for (let columns = Math.max(1, Math.round(n / 10)); ; columns = Math.round(columns * 1.1) + 1) {
          const room = orthogonalRoom(seededRandom(n), columns, { everyMetre: true, height: 8 });
          if (room.outline.length >= n * 0.9) return prepared(room);
        }
      },
    },
  ];
  // Warm the JIT on every family first: process CPU time also counts the compiler's threads.
  for (const { make } of families) {
    const room = make(1000);
    const d = flatten([room.outline, ...room.obstacles]);
    const until = cpuNow() + 300;
    while (cpuNow() < until) {
      triangulate(room);
      earcut(d.vertices, d.holes, d.dimensions);
    }
  }
  const agplibRows: string[] = [];
  // AGPLIB: all 44 polygons in one timed batch, and the 6 with holes separately.
  const polygons = agplibPolygons();
  const all = polygons.map((p) => prepared(asRoom(p.rings)));
  const withHoles = all.filter((r) => r.obstacles.length > 0);
  for (const [label, rooms] of [
    ["AGPLIB, all 44 polygons (20-200 corners)", all],
    ["AGPLIB gB_simple, 6 polygons with 10-20 holes", withHoles],
  ] as const) {
    const n = rooms.reduce((s, r) => s + r.outline.length + r.obstacles.reduce((t, o) => t + o.length, 0), 0);
    const m = measure({ family: label, n, rooms: [...rooms] });
    agplibRows.push(`| ${label} | ${n.toLocaleString("en")} in all | ${fmt(m.ours)} | ${fmt(m.earcut)} | ${(m.ours / m.earcut).toFixed(2)} | ${range(m)} | | ${m.triangles.toLocaleString("en")} / ${m.earcutTriangles.toLocaleString("en")} |`);
  }
  // Small sizes of every family first: the garbage of a 100,000-corner run would otherwise be
  // collected (on CPU time) during the next family's small measurements.
  type Measured = ReturnType<typeof measure> & { actual: number };
  const results = new Map<string, Map<number, Measured>>();
  for (const n of sizes) {
    for (const { family, make } of families) {
      const room = make(n);
      const actual = room.outline.length + room.obstacles.reduce((s, o) => s + o.length, 0);
      const m = measure({ family, n: actual, rooms: [room] });
      if (!results.has(family)) results.set(family, new Map());
      results.get(family)!.set(n, { ...m, actual });
      console.error(`triangulation bench: ${family} n=${actual} ours ${fmt(m.ours)} ms, earcut ${fmt(m.earcut)} ms`);
    }
  }
  const rows: string[] = [];
  for (const { family } of families) {
    let previous: Measured | null = null;
    for (const n of sizes) {
      const m = results.get(family)!.get(n)!;
      const grow = previous ? `${(m.ours / previous.ours).toFixed(1)}x / ${(m.earcut / previous.earcut).toFixed(1)}x` : "";
      rows.push(`| ${family} | ${m.actual.toLocaleString("en")} | ${fmt(m.ours)} | ${fmt(m.earcut)} | ${(m.ours / m.earcut).toFixed(2)} | ${range(m)} | ${grow} | ${m.triangles.toLocaleString("en")} / ${m.earcutTriangles.toLocaleString("en")} |`);
      previous = m;
    }
  }
  const randomRows = randomFamilies(sizes);
  return [
    `Median CPU milliseconds per triangulation on this machine (2 cores, shared with other work; CPU time, 11 alternating rounds of at least 20 ms each, a young-generation garbage collection before each round, not timed) (Node ${process.version}), ours (monotone pieces, exact predicates, validation not included) against earcut ${"3.x"} (which validates nothing) in the same run on the same rings. Ratio = median ours / median earcut (below 1: we are faster); ratio per round = lowest and highest ratio of one pair of rounds. Growth = time at n divided by time at n/10, ours / earcut. Triangles = ours / earcut's (earcut drops collinear corners, so it may make fewer).`,
    "",
    "| shape | corners n | ours ms | earcut ms | ratio | ratio per round | growth from n/10 | triangles |",
    "| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: |",
    ...rows,
    ...agplibRows,
    "",
    `Random families (tests/geometry/support/shapes.ts): each seed draws its own proportions, so no row is one fixed shape. Per seed, ours and earcut ${EARCUT_VERSION} are timed in the same run on the same ring (7 alternating rounds); median ratio = median over the seeds of ours / earcut, worst = the highest seed's ratio and its seed.`,
    "",
    "| family | corners n (about) | seeds | ours ms, median | earcut ms, median | median ratio | worst seed ratio (seed) | peer, same run |",
    "| --- | ---: | ---: | ---: | ---: | ---: | ---: | --- |",
    ...randomRows,
  ].join("\n");
}

// earcut exports no package.json subpath: read it beside the resolved entry file.
const EARCUT_VERSION = (
  JSON.parse(readFileSync(path.join(path.dirname(createRequire(import.meta.url).resolve("earcut")), "..", "package.json"), "utf8")) as {
    version: string;
  }
).version;

/** Seeded generators: the seed fixes the room, so every run times the same rooms. */
const randomFamilySpecs: { family: string; make: (random: () => number, n: number) => PlainRoom }[] = [
  { family: "star, random alternating radii", make: alternatingStarRoom },
  { family: "comb, random tooth widths, heights and valleys", make: (random, n) => unevenCombRoom(random, n) },
  { family: "comb as above, turned 0.3-1.3 rad", make: (random, n) => unevenCombRoom(random, n, 0.3 + random()) },
  { family: "orthogonal, corners jittered ±0.1 m", make: (random, n) => jitteredOrthogonalRoom(random, n) },
  { family: "near-convex ring, radii jittered 0.5-3.5%", make: nearConvexRoom },
];

function randomFamilies(sizes: number[]): string[] {
  const rows: string[] = [];
  for (const { family, make } of randomFamilySpecs) {
    for (const n of sizes) {
      // Fewer seeds where earcut takes seconds per call.
      const seeds = n >= 100_000 ? [1, 2, 3] : [1, 2, 3, 4, 5];
      const per: { seed: number; ours: number; earcut: number; ratio: number; corners: number }[] = [];
      for (const seed of seeds) {
        let room: Room | null = null;
        // A draw that is not a valid room (rare) moves on to the next stream of the same seed.
        for (let attempt = 0; room === null; attempt++) {
          const result = prepareRoom(make(seededRandom(1_000_003 * seed + 7919 * attempt + n), n), { maxVertices: 1e7 });
          if (result.ok) room = result.room;
        }
        const m = measure({ family, n, rooms: [room] }, 7);
        per.push({ seed, ours: m.ours, earcut: m.earcut, ratio: m.ours / m.earcut, corners: room.outline.length });
        console.error(`triangulation bench: ${family} n=${room.outline.length} seed ${seed} ours ${fmt(m.ours)} ms, earcut ${fmt(m.earcut)} ms`);
      }
      const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
      const worst = per.reduce((a, b) => (b.ratio > a.ratio ? b : a));
      rows.push(
        `| ${family} | ${median(per.map((p) => p.corners)).toLocaleString("en")} | ${seeds.length} | ${fmt(median(per.map((p) => p.ours)))} | ${fmt(median(per.map((p) => p.earcut)))} | ${median(per.map((p) => p.ratio)).toFixed(2)} | ${worst.ratio.toFixed(2)} (${worst.seed}) | earcut ${EARCUT_VERSION} |`,
      );
    }
  }
  return rows;
}
