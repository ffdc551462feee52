// One room's answer for the `posts` command and the plan preview, from the one planning pipeline
// (plan-room.ts): validation, triangulation, the guaranteed plan and (unless --guaranteed-only) the
// fewest plan under the museum's conditions, with timings. The JSON shape is the contract of
// scripts/README.md.
import type { Point } from "../geometry/types";
import type { NamedRoom } from "../geometry/geojson";
import type { RoomProblem } from "../geometry/room";
import { fewestReport } from "./fewest";
import { planRoom, type ComputedPostPlan, type PlanProgress, type PlanStage, type StoppedBecause } from "./plan-room";

export interface RoomReportOptions {
  /** Skip the fewest plan (the guaranteed plan only). */
  guaranteedOnly?: boolean;
  /** Metres a guard can watch well; a room's own sightRange wins over this default. */
  sightRange?: number;
  /** Seconds the fewest plan may take per room (default 10). */
  timeLimitSeconds?: number;
  /** Largest vertex count accepted (default CORNER_LIMIT, see validateRoom). */
  maxVertices?: number;
  /** The preview's conditions: posts that stay, zones where no post may stand, double cover. */
  pinned?: Point[];
  forbidden?: Point[][];
  doubleCover?: boolean;
  /** Epoch milliseconds after which planning stops (the worker pool's hard deadline). */
  deadline?: number;
  onProgress?: (progress: PlanProgress) => void;
  signal?: { readonly aborted: boolean };
}

/** The room object of the `posts` command's output. Extra fields are allowed by the contract. */
export interface RoomReport {
  name: string;
  vertices: number;
  obstacles: number;
  area: number;
  triangles: number;
  bound: number;
  guaranteed: { posts: Point[] };
  /** Filled by the fewest plan; absent with --guaranteed-only. */
  fewest?: {
    posts: Point[];
    lowerBound: number;
    proven: boolean;
    covered: number;
    uncovered: Point[][];
    [extra: string]: unknown;
  };
  sightRange?: number;
  /** Why planning ended: finished, the fewest plan's time limit, or the server's deadline. */
  stoppedBecause?: StoppedBecause;
  /**
   * Only when planning was stopped before the fewest plan (deadline, cancel, memory): the best plan
   * known then, the guaranteed plan at least, with what is known of its coverage.
   */
  best?: Pick<ComputedPostPlan, "method" | "posts" | "lowerBound" | "proven" | "covered" | "coveredBy">;
  ms: { validate: number; triangulate: number; guaranteed: number; fewest?: number };
}

/** An `errors` entry of the `posts` command: the room's name plus one validation problem. */
export interface RoomErrorEntry {
  room: string;
  code: string;
  message: string;
  at?: Point;
}

export type RoomOutcome = { ok: true; report: RoomReport } | { ok: false; errors: RoomErrorEntry[] };

/** Plan one named room; invalid rooms come back as `errors` entries a curator can act on. */
export function planRoomReport(named: NamedRoom, options: RoomReportOptions = {}): RoomOutcome {
  const sightRange = named.sightRange ?? options.sightRange;
  const outcome = planRoom(named.room, {
    method: options.guaranteedOnly ? "guaranteed" : "fewest",
    certify: !options.guaranteedOnly,
    maxVertices: options.maxVertices,
    sightRange,
    pinned: options.pinned,
    forbidden: options.forbidden,
    doubleCover: options.doubleCover,
    timeLimit: options.timeLimitSeconds ?? 10,
    deadline: options.deadline,
    onProgress: options.onProgress,
    signal: options.signal,
  });
  if (!outcome.ok) return { ok: false, errors: outcome.problems.map((problem) => errorEntry(named.name, problem)) };
  const planned = outcome.planned;
  const time = (stage: PlanStage) => planned.ms[stage] ?? 0;
  const report: RoomReport = {
    name: named.name,
    vertices: planned.vertices,
    obstacles: planned.obstacles,
    area: planned.area,
    triangles: planned.triangles,
    bound: planned.guaranteed.bound,
    guaranteed: { posts: planned.guaranteed.posts },
    ...(sightRange !== undefined ? { sightRange } : {}),
    stoppedBecause: planned.stoppedBecause,
    ms: { validate: time("validate"), triangulate: time("triangulate"), guaranteed: time("guaranteed") },
  };
  if (planned.fewest) {
    report.fewest = fewestReport(planned.fewest);
    report.ms.fewest = time("fewest");
  }
  return { ok: true, report };
}

/**
 * The answer for a room whose planning was ended from outside (the pool's deadline, a cancelled
 * request, the thread's memory limit) after the guaranteed stage: the room's counts, the guaranteed
 * plan, the best plan then known and why it stopped. Null when planning ended before that stage.
 */
export function stoppedRoomReport(
  named: NamedRoom,
  options: Pick<RoomReportOptions, "sightRange">,
  progress: PlanProgress | undefined,
  reason: Exclude<StoppedBecause, "finished" | "time-limit">,
): RoomReport | null {
  const facts = progress?.facts;
  if (!progress || !facts || !progress.best) return null;
  const sightRange = named.sightRange ?? options.sightRange;
  const { method, posts, lowerBound, proven, covered, coveredBy } = progress.best;
  const time = (stage: PlanStage) => progress.stages[stage] ?? 0;
  return {
    name: named.name,
    vertices: facts.vertices,
    obstacles: facts.obstacles,
    area: facts.area,
    triangles: facts.triangles,
    bound: facts.bound,
    guaranteed: { posts: facts.guaranteedPosts },
    ...(sightRange !== undefined ? { sightRange } : {}),
    stoppedBecause: reason,
    best: { method, posts, lowerBound, proven, covered, coveredBy },
    ms: { validate: time("validate"), triangulate: time("triangulate"), guaranteed: time("guaranteed") },
  };
}

function errorEntry(name: string, problem: RoomProblem): RoomErrorEntry {
  return { room: name, code: problem.code, message: problem.message, ...(problem.at ? { at: problem.at } : {}) };
}
