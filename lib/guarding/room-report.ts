// One room's answer for the `posts` command and the plan preview: validate, triangulate, plan the
// guaranteed posts (and, where marked below, the fewest posts), with timings. The JSON shape is the
// contract of scripts/README.md.
import type { Point } from "../geometry/types";
import type { NamedRoom } from "../geometry/geojson";
import { prepareRoom, roomArea, roomCounts, type RoomProblem } from "../geometry/room";
import { triangulate } from "../geometry/triangulate";
import { planGuaranteed } from "./guaranteed";
import { fewestReport, planFewest } from "./fewest";

export interface RoomReportOptions {
  /** Skip the fewest plan (the guaranteed plan only). */
  guaranteedOnly?: boolean;
  /** Metres a guard can watch well; a room's own sightRange wins over this default. */
  sightRange?: number;
  /** Seconds the fewest plan may take per room (default 10). */
  timeLimitSeconds?: number;
  /** Largest vertex count accepted (default 50,000, see validateRoom). */
  maxVertices?: number;
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

const now = () => performance.now();
const elapsed = (since: number) => Math.round((now() - since) * 1000) / 1000;

/** Plan one named room; invalid rooms come back as `errors` entries a curator can act on. */
export function planRoomReport(named: NamedRoom, options: RoomReportOptions = {}): RoomOutcome {
  const validateStarted = now();
  const prepared = prepareRoom(named.room, { maxVertices: options.maxVertices });
  const validateMs = elapsed(validateStarted);
  if (!prepared.ok) return { ok: false, errors: prepared.problems.map((problem) => errorEntry(named.name, problem)) };
  const room = prepared.room;
  const { vertices, obstacles } = roomCounts(room);

  const triangulateStarted = now();
  const triangulation = triangulate(room);
  const triangulateMs = elapsed(triangulateStarted);

  const guaranteedStarted = now();
  const guaranteed = planGuaranteed(room, triangulation);
  const guaranteedMs = elapsed(guaranteedStarted);

  const sightRange = named.sightRange ?? options.sightRange;
  const report: RoomReport = {
    name: named.name,
    vertices,
    obstacles,
    area: roomArea(room),
    triangles: triangulation.triangles.length,
    bound: guaranteed.bound,
    guaranteed: { posts: guaranteed.posts },
    ...(sightRange !== undefined ? { sightRange } : {}),
    ms: { validate: validateMs, triangulate: triangulateMs, guaranteed: guaranteedMs },
  };

  // ── FEWEST PLAN ────────────────────────────────────
  if (!options.guaranteedOnly) {
    const fewestStarted = now();
    const plan = planFewest(room, {
      triangulation,
      guaranteedPosts: guaranteed.posts,
      sightRange,
      timeLimit: options.timeLimitSeconds ?? 10,
    });
    report.fewest = fewestReport(plan);
    report.ms.fewest = elapsed(fewestStarted);
  }
  // ─────────────────────────────────────────────────────────────────────────────────────────────

  return { ok: true, report };
}

function errorEntry(name: string, problem: RoomProblem): RoomErrorEntry {
  return { room: name, code: problem.code, message: problem.message, ...(problem.at ? { at: problem.at } : {}) };
}
