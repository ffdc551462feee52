// The fewest plan: iterative set cover in the spirit of Tozoni, de Rezende & de Souza, "Algorithm
// 966: a practical iterative algorithm for the art gallery problem using integer linear
// programming" (ACM TOMS 43(2), 2016). Witnesses are points that must be seen; candidate posts are
// the room's corners, the pinned posts and points in the witnesses' regions; an integer program
// (HiGHS, after the set-cover reductions of fewest-reduce.ts) picks the fewest candidates that see
// every witness; the coverage certificate then checks the whole room, and each unseen part adds a
// witness, until nothing is unseen.
// Lower bound: the pinned posts plus the witness problem solved exactly over the overlay of a
// subset S of the witnesses' regions (lower-bound-arrangement.ts; each witness seen twice for
// double cover), S holding only witnesses no pinned post sees. S grows by row generation: the
// witnesses the bound's posts (a point in each chosen cell) miss join it; when the posts see every
// witness they are certified, and if they see the room the plan meets the bound (Tozoni et al.'s
// loop). Anytime: at the time limit the best certified plan so far is returned with its bound.
import type { Point, Ring, Room, Triangulation } from "../geometry/types";
import { createSightlines, type Sightlines } from "../geometry/visibility";
import { clipToSightRange, discCorners } from "../geometry/visibility-range";
import { certifyCoverage, pointInside, regionArea, ringArea, roomRegion, type CoverageCertificate, type Region } from "../geometry/coverage";
import { createWitnessCells } from "./lower-bound-arrangement";
import { allowedPost, checkConstraints, type ConstraintProblem, type PostConstraints } from "./constraints";
import { solveCover } from "./fewest-reduce";

export interface FewestOptions extends PostConstraints {
  /** Seconds to spend on the room (default 10); the best certified plan so far is returned. */
  timeLimit?: number;
}

export interface FewestPlan {
  posts: Point[];
  /** No plan meeting the constraints has fewer posts (witness cells; see lower-bound-arrangement.ts). */
  lowerBound: number;
  /** lowerBound equals the number of posts and the certificate says the room is covered. */
  proven: boolean;
  /** Seen share of the room's area (seen twice, for double cover), from the certificate. */
  covered: number;
  /** Unseen parts, each an outer ring then its holes. */
  uncovered: Ring[][];
  /** Witnesses that prove the lower bound. */
  boundWitnesses: Point[];
  witnesses: number;
  rounds: number;
  /** Why the search stopped: the bound was met, time ran out, or the witnesses were all seen. */
  stoppedBy: "proven" | "time-limit" | "covered";
  problems: ConstraintProblem[];
  /** How the plan was proven: the kernel fast path (fewest.ts) or the witness cells (default). */
  proof?: "kernel" | "witness-cells";
  /**
   * What says the posts see the room: the coverage certificate, or (when the answer is the starting
   * plan given as covered, see `startingCovered`) the theorem behind that plan.
   */
  coveredBy?: "certificate" | "theorem";
}

const key = (p: Point) => `${p[0]},${p[1]}`;

/**
 * Deterministic work limits. They, not the clock, normally end each step of the search, so the same
 * room gives the same plan on any machine that finishes them within the time limit; the time limit
 * stays as a safety net (and then the answer depends on where the clock cut it).
 */
export const WORK_LIMITS = {
  /** Cover rounds (integer program + certificate) in the first search. */
  firstRounds: 150,
  /** Cover rounds after each batch of new candidate posts. */
  laterRounds: 40,
  /** Branch-and-bound nodes per integer program (HiGHS mip_max_nodes). */
  solverNodes: 20000,
  /** Boolean operations (Clipper calls on cells a region boundary crosses) per growth of the overlay. */
  cellClips: 40000,
  /** Rounds of the witness-cell loop: bound, missed witnesses join the overlay, posts certified. */
  cellRounds: 100,
};

/**
 * Whether p lies in the closed ring: the same answer as insideClosedRing (constraints.ts: on an
 * edge within a nanometre counts as inside), with the distance to an edge computed only when p is
 * within a nanometre of that edge's box. The incidence of candidates and witnesses calls this most.
 */
function insideOrOnRing(p: Point, ring: Ring): boolean {
  const x = p[0], y = p[1];
  const near = 1e-9;
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const xi = ring[i][0], yi = ring[i][1], xj = ring[j][0], yj = ring[j][1];
    if (x >= Math.min(xi, xj) - near && x <= Math.max(xi, xj) + near && y >= Math.min(yi, yj) - near && y <= Math.max(yi, yj) + near) {
      const ex = xi - xj, ey = yi - yj;
      const length2 = ex * ex + ey * ey;
      const t = length2 > 0 ? Math.max(0, Math.min(1, ((x - xj) * ex + (y - yj) * ey) / length2)) : 0;
      if (Math.hypot(x - (xj + t * ex), y - (yj + t * ey)) <= near) return true;
    }
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** Whether p lies outside the ring and farther than `margin` from every edge of it. */
function clearlyOutside(p: Point, ring: Ring, margin: number): boolean {
  const x = p[0], y = p[1];
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const xi = ring[i][0], yi = ring[i][1], xj = ring[j][0], yj = ring[j][1];
    const ex = xi - xj, ey = yi - yj;
    const length2 = ex * ex + ey * ey;
    const t = length2 > 0 ? Math.max(0, Math.min(1, ((x - xj) * ex + (y - yj) * ey) / length2)) : 0;
    if (Math.hypot(x - (xj + t * ex), y - (yj + t * ey)) <= margin) return false;
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return !inside;
}

/** Corners of the room where the floor turns less than 180°: the hardest places to see. */
function convexCorners(room: Room): Point[] {
  const corners: Point[] = [];
  for (const ring of [room.outline, ...room.obstacles]) {
    for (let i = 0; i < ring.length; i++) {
      const a = ring[(i + ring.length - 1) % ring.length], b = ring[i], c = ring[(i + 1) % ring.length];
      // Outline counter-clockwise and obstacles clockwise: the floor is on the left of every wall.
      if ((b[0] - a[0]) * (c[1] - b[1]) - (b[1] - a[1]) * (c[0] - b[0]) > 0) corners.push(b);
    }
  }
  return corners;
}

function wallMidpoints(room: Room): Point[] {
  const points: Point[] = [];
  for (const ring of [room.outline, ...room.obstacles]) {
    for (let i = 0; i < ring.length; i++) {
      const a = ring[i], b = ring[(i + 1) % ring.length];
      points.push([(a[0] + b[0]) / 2, (a[1] + b[1]) / 2]);
    }
  }
  return points;
}

function roomScale(room: Room): number {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const [x, y] of room.outline) {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  }
  return Math.max(maxX - minX, maxY - minY, 1);
}

/** Plans the fewest posts for a normalised, valid room over a given triangulation. */
export function planFewestOver(
  room: Room,
  triangulation: Triangulation,
  options: FewestOptions & {
    startingPlan?: Point[];
    /**
     * The starting plan (with the pinned posts) is known to see the whole room without a
     * certificate: the guaranteed plan with no sight range and no corner left out (every triangle
     * has a post at a corner, Fisk 1978). Its certificate, the costliest in a large hall, is skipped.
     */
    startingCovered?: boolean;
  } = {},
): FewestPlan {
  const started = performance.now();
  const deadline = started + 1000 * (options.timeLimit ?? 10);
  const secondsLeft = () => Math.max(0, (deadline - performance.now()) / 1000);
  // The search for posts stops at 75% of the time limit so the lower bound always gets its turn.
  const searchDeadline = started + 750 * (options.timeLimit ?? 10);
  const searchSecondsLeft = () => Math.max(0, (searchDeadline - performance.now()) / 1000);
  const sightlines: Sightlines = createSightlines(room, triangulation);
  const problems = checkConstraints(room, sightlines, options);
  const range = options.sightRange && options.sightRange > 0 ? options.sightRange : undefined;
  const demand: 1 | 2 = options.doubleCover ? 2 : 1;
  const pinned = problems.some((p) => p.code.startsWith("pinned")) ? [] : (options.pinned ?? []);
  const scale = roomScale(room);
  // A candidate sees a witness within the disc polygon's inner radius, as the certificate draws it.
  const safeReach = range ? range * Math.cos(Math.PI / discCorners(range)) : Infinity;

  const walls: [Point, Point][] = [];
  for (const ring of [room.outline, ...room.obstacles]) ring.forEach((a, i) => walls.push([a, ring[(i + 1) % ring.length]]));
  const wallNear = 1e-9 * scale;
  function onWall(p: Point): boolean {
    for (const [a, b] of walls) {
      if (p[0] < Math.min(a[0], b[0]) - wallNear || p[0] > Math.max(a[0], b[0]) + wallNear) continue;
      if (p[1] < Math.min(a[1], b[1]) - wallNear || p[1] > Math.max(a[1], b[1]) + wallNear) continue;
      const ex = b[0] - a[0], ey = b[1] - a[1];
      const length = Math.hypot(ex, ey);
      if (length > 0 && Math.abs(ex * (p[1] - a[1]) - ey * (p[0] - a[0])) / length <= wallNear) return true;
    }
    return false;
  }
  const sightOf = new Map<string, Ring | null>();
  function sight(p: Point): Ring | null {
    const k = key(p);
    if (!sightOf.has(k)) {
      const answer = sightlines.regionOf(p);
      sightOf.set(k, answer.ok && answer.region.length >= 3 ? answer.region : null);
    }
    return sightOf.get(k)!;
  }
  const postRegions = new Map<string, Region>();
  function postRegion(p: Point): Region {
    const k = key(p);
    if (!postRegions.has(k)) {
      const ring = sight(p);
      postRegions.set(k, !ring ? [] : range ? clipToSightRange(ring, p, range) : [[ring]]);
    }
    return postRegions.get(k)!;
  }
  function certify(posts: Point[]): CoverageCertificate {
    return certifyCoverage(room, posts.map(postRegion), demand);
  }

  // Witnesses and candidates grow together; column j of the cover lists the witnesses candidate j sees.
  const witnesses: { point: Point; ring: Ring; minX: number; minY: number; maxX: number; maxY: number }[] = [];
  const candidates: Point[] = [];
  const candidateKeys = new Map<string, number>();
  const seenBy: number[][] = []; // seenBy[w] = candidates that see witness w
  function addCandidate(p: Point) {
    if (candidateKeys.has(key(p)) || !allowedPost(p, options) || !sight(p)) return;
    candidateKeys.set(key(p), candidates.length);
    candidates.push(p);
    const c = candidates.length - 1;
    witnesses.forEach((w, i) => {
      if (sees(w, p)) seenBy[i].push(c);
    });
  }
  function sees(w: (typeof witnesses)[number], p: Point): boolean {
    if (p[0] < w.minX - 1e-9 || p[0] > w.maxX + 1e-9 || p[1] < w.minY - 1e-9 || p[1] > w.maxY + 1e-9) return false;
    if (range && Math.hypot(p[0] - w.point[0], p[1] - w.point[1]) > safeReach) return false;
    return insideOrOnRing(p, w.ring);
  }
  const witnessKeys = new Set<string>();
  function boxed(point: Point, ring: Ring) {
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
    for (const [x, y] of ring) {
      minX = Math.min(minX, x);
      minY = Math.min(minY, y);
      maxX = Math.max(maxX, x);
      maxY = Math.max(maxY, y);
    }
    return { point, ring, minX, minY, maxX, maxY };
  }
  function addWitness(p: Point) {
    if (witnessKeys.has(key(p))) return;
    const ring = sight(p);
    if (!ring) return;
    witnessKeys.add(key(p));
    const w = boxed(p, ring);
    witnesses.push(w);
    seenBy.push(candidates.flatMap((c, j) => (sees(w, c) ? [j] : [])));
  }

  for (const p of pinned) addCandidate(p);
  for (const p of room.outline) addCandidate(p);
  for (const obstacle of room.obstacles) for (const p of obstacle) addCandidate(p);
  for (const p of convexCorners(room)) addWitness(p);
  for (const p of wallMidpoints(room)) addWitness(p);
  for (const w of [...witnesses]) addCandidate(w.point);

  // The starting plan (the guaranteed plan when it obeys the constraints) is the first upper bound.
  let best: { posts: Point[]; certificate: CoverageCertificate } | null = null;
  const starting = [...pinned, ...(options.startingPlan ?? []).filter((p) => allowedPost(p, options))];
  let theoremBest: { posts: Point[]; certificate: CoverageCertificate } | null = null;
  if (options.startingPlan && starting.length) {
    if (options.startingCovered && demand === 1) {
      const whole = regionArea(roomRegion(room));
      best = theoremBest = { posts: starting, certificate: { covered: 1, uncovered: [], uncoveredArea: 0, roomArea: whole, demand } };
    } else {
      const certificate = certify(starting);
      if (certificate.covered === 1) best = { posts: starting, certificate };
    }
  }
  let lastTry: { posts: Point[]; certificate: CoverageCertificate } | null = best;

  // The best lower bound so far, and the witnesses whose cells prove it.
  // Every plan has its pinned posts, and at least one post (two for double cover): the floor has area.
  let proof: { bound: number; witnesses: Point[] } = { bound: Math.max(pinned.length, demand), witnesses: [] };
  let rounds = 0;
  let stoppedBy: FewestPlan["stoppedBy"] = "time-limit";
  const pinnedIndex = pinned.map((p) => candidateKeys.get(key(p))!).filter((i) => i !== undefined);
  // Rounds of set cover and certificate until the room is covered, time is up or nothing improves.
  function coverRounds(maxRounds: number, timeLeft = searchSecondsLeft) {
    for (let round = 0; round < maxRounds && timeLeft() > 0; round++) {
      rounds++;
      const answer = solveCover({
        columns: candidates.length,
        rows: seenBy.map((items) => ({ items, need: Math.min(demand, items.length) })),
        fixed: pinnedIndex,
        // Only plans better than the best certified one are of use (the cut-off speeds HiGHS up).
        atMostColumns: best ? best.posts.length - 1 : undefined,
        seconds: timeLeft(),
        nodes: WORK_LIMITS.solverNodes,
      });
      if (answer.status === "infeasible") {
        // No plan over these candidates beats the best certified one.
        if (best) stoppedBy = "covered";
        break;
      }
      if (answer.status === "stopped" && answer.chosen.length === 0) break;
      const posts = answer.chosen.map((j) => candidates[j]);
      if (best && posts.length >= best.posts.length && answer.status === "optimal") {
        // The witnesses already force as many posts as the best certified plan: it cannot improve here.
        stoppedBy = "covered";
        break;
      }
      const certificate = certify(posts);
      lastTry = { posts, certificate };
      if (certificate.covered === 1) {
        if (!best || posts.length < best.posts.length) best = { posts, certificate };
        stoppedBy = "covered";
        break;
      }
      // Each unseen part gets a witness, which is also a candidate post (it surely sees itself).
      const before = witnesses.length;
      for (const polygon of certificate.uncovered) {
        const p = pointInside(polygon);
        addWitness(p);
        addCandidate(p);
      }
      // No new witness (an unseen part too thin to hold a fresh point): more rounds would repeat this one.
      if (witnesses.length === before) break;
    }
  }

  coverRounds(WORK_LIMITS.firstRounds);
  // The bound: witness cells (lower-bound-arrangement.ts), which subsume any packing of the same
  // witnesses.
  const planSize = () => best?.posts.length ?? Infinity; // no limit while no plan is certified
  // Tozoni et al.'s loop over one overlay that grows with the witnesses it needs (row generation):
  // the bound over a subset S of the witnesses is a proof by itself, since every witness set gives
  // one. The bound's posts (a point in each chosen cell) are checked against all witnesses; those
  // they miss join S, because with them the bound may rise. When the posts see every witness, S
  // gives the bound of all of them; then the posts are certified: if they see the room the plan
  // meets the bound, else their gaps become witnesses and posts, and the cover rounds go again.
  // Pinned posts are in every plan; the others must see every witness no pinned post sees (twice
  // for double cover). A witness joins S only when every pinned post stands clearly outside its
  // region (farther than 1e-9 of the room's size, or beyond the sight range), so it surely needs
  // `demand` other posts, and the bound is the pinned count plus the cell bound over S.
  const margin = 1e-9 * scale;
  const eligible = new Map<number, boolean>();
  const unseenByPinned = (i: number): boolean => {
    if (!eligible.has(i)) {
      const w = witnesses[i];
      eligible.set(i, pinned.every((p) => (range && Math.hypot(p[0] - w.point[0], p[1] - w.point[1]) > range * (1 + 1e-9) + margin) || clearlyOutside(p, w.ring, margin)));
    }
    return eligible.get(i)!;
  };
  const overlay = createWitnessCells(room);
  const inOverlay: Point[] = [];
  const inS = new Set<string>();
  const regionAt = (p: Point, ring: Ring): Region => (range ? clipToSightRange(ring, p, range, "circumscribed") : [[ring]]);
  // Seeds: a greedy packing by the candidates (fewest-seen witnesses first, none sharing a post).
  const words = (candidates.length + 31) >>> 5;
  const taken = new Uint32Array(words);
  let waiting: number[] = [];
  for (const i of witnesses.map((_, i) => i).sort((a, b) => seenBy[a].length - seenBy[b].length || a - b)) {
    if (!unseenByPinned(i)) continue;
    if (seenBy[i].some((c) => (taken[c >>> 5] & (1 << (c & 31))) !== 0)) continue;
    for (const c of seenBy[i]) taken[c >>> 5] |= 1 << (c & 31);
    waiting.push(i);
  }
  let stalls = 0;
  for (let round = 0; round < WORK_LIMITS.cellRounds && proof.bound < planSize() && secondsLeft() > 0; round++) {
    const regions = waiting.map((i) => regionAt(witnesses[i].point, witnesses[i].ring));
    const count = overlay.add(regions, { clips: WORK_LIMITS.cellClips, stopAt: deadline });
    for (const i of waiting.slice(0, count)) {
      inOverlay.push(witnesses[i].point);
      inS.add(key(witnesses[i].point));
    }
    const complete = count === waiting.length;
    const dual = overlay.solve({ seconds: secondsLeft() + 0.5, nodes: WORK_LIMITS.solverNodes, demand });
    // How many of the bound's posts see a witness (a cell chosen twice counts twice).
    const watching = (w: (typeof witnesses)[number]) => dual.posts.reduce((n, p) => n + (sees(w, p) ? 1 : 0), 0);
    if (pinned.length + dual.bound > proof.bound) {
      proof = { bound: pinned.length + dual.bound, witnesses: [...inOverlay] };
    }
    if (proof.bound >= planSize() || dual.posts.length === 0 || !complete) break;
    // Row generation: the witnesses the bound's posts miss.
    const missed = witnesses.flatMap((w, i) => (!inS.has(key(w.point)) && unseenByPinned(i) && watching(w) < demand ? [i] : []));
    if (missed.length > 0) {
      // Smallest regions first; each area computed once, not in every comparison.
      const area = new Map(missed.map((i) => [i, Math.abs(ringArea(witnesses[i].ring))]));
      waiting = missed.sort((a, b) => area.get(a)! - area.get(b)! || a - b);
      continue;
    }
    // The posts see every witness: certify them against the whole room.
    for (const p of dual.posts) addCandidate(p);
    // When this keeps failing, more candidates: the corners of the witnesses' regions (the ends
    // of their shadow edges, where optimal posts of orthogonal rooms stand), later the middles
    // of their shadow edges (edges along a wall add nothing a corner does not).
    stalls++;
    if (stalls === 2 || stalls === 4) {
      for (const w of [...witnesses]) {
        for (let i = 0; i < w.ring.length; i++) {
          const a = w.ring[i], b = w.ring[(i + 1) % w.ring.length];
          if (stalls === 2) addCandidate(a);
          else {
            const middle: Point = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
            if (!onWall(middle)) addCandidate(middle);
          }
        }
      }
    }
    // Tozoni et al.'s candidates: a point in every light cell of the overlay.
    for (const p of dual.lightPosts()) addCandidate(p);
    // (A cell chosen twice gives one point: such posts are candidates, but not a plan to certify.)
    const cellPosts = [...new Map(dual.posts.map((p) => [key(p), p])).values()].filter((p) => candidateKeys.has(key(p)));
    const witnessesBefore = witnesses.length;
    if (cellPosts.length === dual.posts.length && pinned.length + cellPosts.length < planSize()) {
      const certificate = certify([...pinned, ...cellPosts]);
      if (certificate.covered === 1) {
        best = { posts: [...pinned, ...cellPosts], certificate };
        break;
      }
      for (const polygon of certificate.uncovered) {
        const p = pointInside(polygon);
        addWitness(p);
        addCandidate(p);
      }
    }
    // The plan's search goes again on the first failure, after each batch of new candidates and
    // then on every third failure: in between the gaps' witnesses mostly lift the bound, and a
    // cover program that finds nothing costs most.
    if (stalls <= 2 || stalls === 4 || stalls % 3 === 0) coverRounds(WORK_LIMITS.laterRounds, secondsLeft);
    waiting = witnesses.flatMap((w, i) => (!inS.has(key(w.point)) && unseenByPinned(i) && watching(w) < demand ? [i] : []));
    // Nothing new to learn: stop once the candidate steps are spent.
    if (waiting.length === 0 && witnesses.length === witnessesBefore && stalls >= 4) break;
  }

  const chosen = best ?? lastTry;
  const certificate = chosen?.certificate ?? certifyCoverage(room, [], demand);
  const posts = chosen?.posts ?? [];
  const proven = certificate.covered === 1 && proof.bound >= posts.length;
  return {
    posts,
    lowerBound: Math.min(proof.bound, certificate.covered === 1 ? posts.length : Infinity),
    proven,
    covered: certificate.covered,
    uncovered: certificate.uncovered,
    boundWitnesses: proof.witnesses,
    witnesses: witnesses.length,
    rounds,
    stoppedBy: proven ? "proven" : stoppedBy,
    problems,
    proof: "witness-cells",
    coveredBy: chosen !== null && chosen === theoremBest ? "theorem" : "certificate",
  };
}

export { roomRegion };
