// The one planning pipeline: validation → triangulation → guaranteed plan → fewest plan → sight
// regions → certificate. The room editor's worker, the plan preview, saved plans and the `posts`
// command all call planRoom; each takes the parts of the answer it shows. Synchronous and pure, so
// it runs the same in a browser worker, a server worker thread, the command line and the tests.
import type { Point, Ring, Room } from "../geometry/types";
import { CORNER_LIMIT, prepareRoom, roomArea, roomCounts } from "../geometry/room";
import { triangulate } from "../geometry/triangulate";
import { createSightlines } from "../geometry/visibility";
import { clipToSightRange } from "../geometry/visibility-range";
import { certifyCoverage, type Region } from "../geometry/coverage";
import { planGuaranteed, type GuaranteedPlan } from "./guaranteed";
import { allowedPost, checkConstraints, type PostConstraints } from "./constraints";
import { planFewest, type FewestPlan } from "./fewest";

/** A problem with the room or the conditions, with where it shows on the drawing. */
export interface PlanProblem {
  code: string;
  message: string;
  at?: Point;
}

/**
 * What to plan: "fewest" (set cover with a lower-bound proof, falling back to the guaranteed plan
 * when it runs out of time before the floor is seen), "guaranteed" (triangulation and
 * 3-colouring), or "shown" (certify `shownPosts` as given: the editor drawing a stored plan).
 */
export type PlanMethod = "fewest" | "guaranteed" | "shown";

export type PlanStage = "validate" | "triangulate" | "guaranteed" | "fewest" | "sight" | "certificate";

/** Why planning ended: it finished, the fewest plan's own time limit cut it, or a hard stop came first. */
export type StoppedBecause = "finished" | "time-limit" | "deadline" | "cancelled" | "memory-limit";

/** The plan a room is given: what the API stores and the panel shows. */
export interface ComputedPostPlan {
  method: PlanMethod;
  posts: Point[];
  lowerBound: number | null;
  proven: boolean;
  /** Seen share of the floor (seen twice for double cover); null when not checked yet. */
  covered: number | null;
  /** How `covered` is known: the certificate (exact union of regions), or the theorem behind the guaranteed plan. */
  coveredBy: "certificate" | "theorem" | null;
  uncovered: Region;
}

/** What is known of the room once the guaranteed plan exists: enough to answer if planning stops there. */
export interface PlannedFacts {
  vertices: number;
  obstacles: number;
  area: number;
  triangles: number;
  /** floor((n + 2h) / 3), the guaranteed plan's bound. */
  bound: number;
  guaranteedPosts: Point[];
}

export interface PlanProgress {
  stage: PlanStage;
  /** Milliseconds since planning began. */
  ms: number;
  /** The best plan known at this point (the guaranteed plan once it exists). */
  best?: ComputedPostPlan;
  /** The room's counts and guaranteed plan, from the guaranteed stage on. */
  facts?: PlannedFacts;
  /** Milliseconds each finished stage took. */
  stages: Partial<Record<PlanStage, number>>;
}

export interface PlanRoomOptions extends PostConstraints {
  method?: PlanMethod;
  /** Posts to certify for method "shown" (and to draw the sight of). */
  shownPosts?: Point[];
  /** Seconds the fewest plan may take (default 10); the best certified plan so far is kept. */
  timeLimit?: number;
  /** Largest corner count accepted (default CORNER_LIMIT). */
  maxVertices?: number;
  /** Certify the guaranteed plan (default true); the `posts` command's --guaranteed-only skips it. */
  certify?: boolean;
  /** Also answer every post's sight region (the editor draws them). */
  withRegions?: boolean;
  /** With withRegions: draw regions only for plans of at most this many posts (default: no limit). */
  regionLimit?: number;
  /** Called after each stage; a worker thread passes the best plan so far on to the server. */
  onProgress?: (progress: PlanProgress) => void;
  /** Checked between stages: a cancelled job stops at the next one. */
  signal?: { readonly aborted: boolean };
  /** Epoch milliseconds after which no new stage starts; the fewest plan's time limit is cut to fit. */
  deadline?: number;
}

export interface PlannedRoom {
  /** The normalised room (outline counter-clockwise, obstacles clockwise). */
  room: Room;
  vertices: number;
  obstacles: number;
  area: number;
  triangles: number;
  guaranteed: GuaranteedPlan;
  /** The fewest planner's full answer (method "fewest" only). */
  fewest?: FewestPlan;
  plan: ComputedPostPlan;
  /** Sight of the plan's posts, when withRegions. */
  regions?: Region[];
  /** withRegions was asked but the plan has more posts than regionLimit: no regions drawn. */
  regionsOmitted?: boolean;
  stoppedBecause: StoppedBecause;
  ms: Partial<Record<PlanStage, number>>;
}

export type PlanRoomOutcome = { ok: true; planned: PlannedRoom } | { ok: false; problems: PlanProblem[] };

/** Thrown between stages when the job's signal was raised or its deadline passed. */
export class PlanStopped extends Error {
  constructor(readonly reason: "deadline" | "cancelled") {
    super(reason === "deadline" ? "planning reached its deadline" : "planning was cancelled");
  }
}

const round = (ms: number) => Math.round(ms * 1000) / 1000;

/** Plans one room under the conditions; invalid rooms or conditions come back as problems. */
export function planRoom(input: Room, options: PlanRoomOptions = {}): PlanRoomOutcome {
  const began = performance.now();
  const ms: PlannedRoom["ms"] = {};
  let best: ComputedPostPlan | undefined;
  let facts: PlannedFacts | undefined;
  const method = options.method ?? "fewest";
  const checkpoint = () => {
    if (options.signal?.aborted) throw new PlanStopped("cancelled");
    if (options.deadline !== undefined && Date.now() >= options.deadline) throw new PlanStopped("deadline");
  };
  const stage = <T>(name: PlanStage, work: () => T): T => {
    checkpoint();
    const started = performance.now();
    const result = work();
    ms[name] = round(performance.now() - started);
    options.onProgress?.({ stage: name, ms: round(performance.now() - began), best, facts, stages: { ...ms } });
    return result;
  };

  const prepared = stage("validate", () => prepareRoom(input, { maxVertices: options.maxVertices ?? CORNER_LIMIT }));
  if (!prepared.ok) return { ok: false, problems: prepared.problems };
  const room = prepared.room;
  const constraints: PostConstraints = {
    pinned: options.pinned ?? [],
    forbidden: options.forbidden ?? [],
    sightRange: options.sightRange ?? undefined,
    doubleCover: options.doubleCover ?? false,
  };
  const triangulation = stage("triangulate", () => triangulate(room));
  const sightlines = createSightlines(room, triangulation);
  const problems = checkConstraints(room, sightlines, constraints);
  if (problems.length > 0) return { ok: false, problems };

  const guaranteed = stage("guaranteed", () => {
    const plan = planGuaranteed(room, triangulation);
    const posts = guaranteedPosts(plan, constraints);
    best = {
      method: "guaranteed",
      posts,
      lowerBound: null,
      proven: false,
      ...theoremCoverage(plan, posts, constraints),
      uncovered: [],
    };
    const counts = roomCounts(room);
    facts = { ...counts, area: roomArea(room), triangles: triangulation.triangles.length, bound: plan.bound, guaranteedPosts: plan.posts };
    return plan;
  });

  let fewest: FewestPlan | undefined;
  let stoppedBecause: StoppedBecause = "finished";
  let regions: Region[] | undefined;
  let regionsOf: Point[] | undefined;
  const certify = (posts: Point[]): Pick<ComputedPostPlan, "covered" | "coveredBy" | "uncovered"> => {
    regions = stage("sight", () => sightRegions(sightlines, posts, constraints.sightRange));
    regionsOf = posts;
    const certificate = stage("certificate", () => certifyCoverage(room, regions!, constraints.doubleCover ? 2 : 1));
    return { covered: certificate.covered, coveredBy: "certificate", uncovered: certificate.uncovered };
  };

  let plan: ComputedPostPlan;
  if (method === "shown") {
    const posts = options.shownPosts ?? [];
    plan = { method: "shown", posts, lowerBound: null, proven: false, ...certify(posts) };
  } else if (method === "guaranteed") {
    // The theorem already says the guaranteed plan sees the floor (no sight range, no corner left
    // out): no certificate is needed, which at thousands of corners would union thousands of regions.
    plan = options.certify === false ? best! : best!.coveredBy === "theorem" ? { ...best!, uncovered: [] } : { ...best!, ...certify(best!.posts) };
  } else {
    const run = stage("fewest", () => {
      const secondsLeft = options.deadline === undefined ? Infinity : (options.deadline - Date.now()) / 1000;
      const answer = planFewest(room, {
        ...constraints,
        timeLimit: Math.max(0.05, Math.min(options.timeLimit ?? 10, secondsLeft * 0.9)),
        triangulation,
        guaranteedPosts: guaranteed.posts,
        // The theorem already says the guaranteed plan sees the room (no sight range, no corner
        // left out): the fewest planner need not certify it again.
        guaranteedCovered: best!.coveredBy === "theorem" && !constraints.doubleCover,
      });
      // A fewest plan that sees everything is the best plan from here on (progress reports it).
      if (answer.problems.length === 0 && answer.covered === 1) {
        best = { method: "fewest", posts: answer.posts, lowerBound: answer.lowerBound, proven: answer.proven, covered: 1, coveredBy: answer.coveredBy ?? "certificate", uncovered: answer.uncovered };
      }
      return answer;
    });
    fewest = run;
    if (run.problems.length > 0) return { ok: false, problems: run.problems };
    if (run.stoppedBy === "time-limit") stoppedBecause = "time-limit";
    plan = {
      method: "fewest",
      posts: run.posts,
      lowerBound: run.lowerBound,
      proven: run.proven,
      covered: run.covered,
      coveredBy: run.coveredBy ?? "certificate",
      uncovered: run.uncovered,
    };
    // Out of time before every point was seen (often under double cover): the guaranteed plan
    // (two colour classes for double cover) may still cover; answer it when its certificate says so.
    if (run.covered < 1) {
      const fallback: ComputedPostPlan = { ...best!, ...certify(best!.posts) };
      if (fallback.covered === 1) plan = fallback;
    }
  }
  best = plan;
  const drawRegions = options.withRegions === true && plan.posts.length <= (options.regionLimit ?? Infinity);
  if (drawRegions && regionsOf !== plan.posts) regions = stage("sight", () => sightRegions(sightlines, plan.posts, constraints.sightRange));

  const { vertices, obstacles } = roomCounts(room);
  return {
    ok: true,
    planned: {
      room,
      vertices,
      obstacles,
      area: roomArea(room),
      triangles: triangulation.triangles.length,
      guaranteed,
      ...(fewest ? { fewest } : {}),
      plan,
      ...(drawRegions ? { regions } : {}),
      ...(options.withRegions && !drawRegions ? { regionsOmitted: true } : {}),
      stoppedBecause,
      ms,
    },
  };
}

/**
 * The guaranteed plan's posts under the conditions: pinned posts first, then the smallest colour
 * class (two smallest classes for double cover), leaving out corners in forbidden zones.
 */
export function guaranteedPosts(plan: GuaranteedPlan, constraints: PostConstraints): Point[] {
  const key = (p: Point) => `${p[0]},${p[1]}`;
  const posts = [...(constraints.pinned ?? [])];
  const taken = new Set(posts.map(key));
  for (const post of constraints.doubleCover ? twoColourPosts(plan) : plan.posts) {
    if (!taken.has(key(post)) && allowedPost(post, constraints)) {
      posts.push(post);
      taken.add(key(post));
    }
  }
  return posts;
}

/**
 * Coverage known without a certificate: with no sight range and no corner left out for a forbidden
 * zone, every triangle has a post at a corner (one of each colour), and a corner sees its convex
 * triangle (Fisk 1978), twice over with two colour classes.
 */
function theoremCoverage(plan: GuaranteedPlan, posts: Point[], constraints: PostConstraints): Pick<ComputedPostPlan, "covered" | "coveredBy"> {
  const wanted = constraints.doubleCover ? twoColourPosts(plan) : plan.posts;
  const kept = new Set(posts.map((p) => `${p[0]},${p[1]}`));
  const complete = constraints.sightRange === undefined && wanted.every((p) => kept.has(`${p[0]},${p[1]}`));
  return complete ? { covered: 1, coveredBy: "theorem" } : { covered: null, coveredBy: null };
}

/**
 * Posts at the corners of two colour classes: every triangle has one corner of each colour and a
 * corner sees its whole triangle, so two classes see every point twice (double cover). The two
 * classes with the fewest distinct corners are taken.
 */
function twoColourPosts(plan: GuaranteedPlan): Point[] {
  const pointsOf: Set<number>[] = [new Set(), new Set(), new Set()];
  plan.triangles.forEach((triangle, i) => triangle.forEach((v, k) => pointsOf[plan.cornerColours[i][k]].add(v)));
  const [largest] = [0, 1, 2].sort((a, b) => pointsOf[b].size - pointsOf[a].size);
  const chosen = new Set<number>();
  for (let c = 0; c < 3; c++) if (c !== largest) for (const v of pointsOf[c]) chosen.add(v);
  return [...chosen].sort((a, b) => a - b).map((i) => [plan.points[i][0], plan.points[i][1]] as Point);
}

function sightRegions(sightlines: ReturnType<typeof createSightlines>, posts: Point[], range: number | undefined): Region[] {
  return posts.map((post) => {
    const answer = sightlines.regionOf(post);
    if (!answer.ok || answer.region.length < 3) return [];
    return range ? clipToSightRange(answer.region, post, range) : [[answer.region as Ring]];
  });
}

/** The conditions a stored plan is computed under (db/schema.ts PostPlanOptions). */
export interface PostPlanConditions {
  sightRange: number | null;
  pinned: Point[];
  forbidden: Ring[];
  doubleCover: boolean;
}

export interface PostPlanRequest {
  options: PostPlanConditions;
  /** "fewest" (default) or "guaranteed". */
  method?: "fewest" | "guaranteed";
  /** Seconds the fewest plan may take. */
  timeLimit?: number;
  deadline?: number;
  onProgress?: (progress: PlanProgress) => void;
  signal?: { readonly aborted: boolean };
}

/** A plan ready to store: its coverage is known. */
export interface StorablePlan extends ComputedPostPlan {
  method: "fewest" | "guaranteed";
  covered: number;
}

/** Plans a room for storing as a proposed plan (the API's save and the demo seed). */
export function planPostPlan(
  room: Room,
  request: PostPlanRequest,
): { ok: true; plan: StorablePlan; stoppedBecause: StoppedBecause } | { ok: false; problems: PlanProblem[] } {
  const outcome = planRoom(room, {
    method: request.method ?? "fewest",
    sightRange: request.options.sightRange ?? undefined,
    pinned: request.options.pinned,
    forbidden: request.options.forbidden,
    doubleCover: request.options.doubleCover,
    timeLimit: request.timeLimit ?? 10,
    deadline: request.deadline,
    onProgress: request.onProgress,
    signal: request.signal,
  });
  if (!outcome.ok) return outcome;
  return { ok: true, plan: outcome.planned.plan as StorablePlan, stoppedBecause: outcome.planned.stoppedBecause };
}
