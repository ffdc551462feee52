// One room's answer for the `posts` command and the plan preview, from the one planning pipeline
// (plan-room.ts): validation, triangulation, the guaranteed plan and (unless --guaranteed-only) the
// fewest plan under the museum's conditions, with timings. The JSON shape is the contract of
// scripts/README.md.
import type { Point } from "../geometry/types";
import type { NamedRoom } from "../geometry/geojson";
import type { RoomProblem } from "../geometry/room";
import { fewestReport } from "./fewest";
import { planRoom, type PlanProgress, type PlanStage, type StoppedBecause } from "./plan-room";

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

function errorEntry(name: string, problem: RoomProblem): RoomErrorEntry {
  return { room: name, code: problem.code, message: problem.message, ...(problem.at ? { at: problem.at } : {}) };
}
