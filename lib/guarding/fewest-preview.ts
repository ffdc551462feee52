// The plan preview behind POST /api/post-plans/preview, kept free of the web framework so it can be
// tested without a server: read the body (zod), then plan it with the one pipeline (planRoomReport)
// in the server's planning pool (previewInPool) and answer the `posts` command's room JSON with the
// fewest plan under the museum's constraints, or a problem a curator can act on.
import { z } from "zod";
import type { Point } from "../geometry/types";
import { roomsFromGeoJson, type NamedRoom } from "../geometry/geojson";
import { planRoomReport, stoppedRoomReport, type RoomReport, type RoomReportOptions } from "./room-report";
import { planPool } from "./plan-pool";

/** The preview answers while the editor waits: at most this many seconds per request. */
export const PREVIEW_MAX_SECONDS = 10;
const PREVIEW_DEFAULT_SECONDS = 2;

const point = z.tuple([z.number().finite(), z.number().finite()]);
const geometry = z.object({ type: z.literal("Polygon"), coordinates: z.array(z.array(z.array(z.number()))) }).passthrough();
const feature = z.object({ type: z.literal("Feature"), geometry, properties: z.record(z.string(), z.unknown()).nullish() }).passthrough();

const constraints = {
  sightRange: z.number().positive().max(1e6).optional(),
  pinned: z.array(point).max(1000).optional(),
  forbidden: z.array(z.array(point).min(3)).max(1000).optional(),
  doubleCover: z.boolean().optional(),
  timeLimit: z.number().positive().max(PREVIEW_MAX_SECONDS).optional(),
};

/** Either { room: Feature | Polygon, ...constraints } or the Feature/Polygon itself with the constraints beside its fields. */
export const previewBodySchema = z.union([
  z.object({ room: z.union([feature, geometry]), ...constraints }),
  feature.extend(constraints),
  geometry.extend(constraints),
]);
export type PreviewBody = z.infer<typeof previewBodySchema>;

export type PreviewAnswer =
  | { status: 200; body: { room: RoomReport } }
  | { status: 422 | 499 | 500 | 503; body: { error: { code: string; message: string; at?: Point; field?: string } } };

function problem(code: string, message: string, extra: { at?: Point; field?: string } = {}): PreviewAnswer {
  return { status: 422, body: { error: { ...extra, code, message } } };
}

/** A preview body read and checked: the room and the planning options, or the answer to give. */
export type PreviewRequest = { ok: true; named: NamedRoom; options: RoomReportOptions } | { ok: false; answer: PreviewAnswer };

/** Reads an API body that is not yet trusted (zod, then GeoJSON); cheap, so the route does it. */
export function readPreviewRequest(input: unknown): PreviewRequest {
  const parsed = previewBodySchema.safeParse(input);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const field = issue.path.length ? issue.path.map(String).join(".") : "(body)";
    const message = issue.path.length
      ? `Invalid input: ${field}: ${issue.message}`
      : "Invalid input: send the room as GeoJSON (a Polygon, or a Feature with one), coordinates in metres, optionally inside { room, sightRange, pinned, forbidden, doubleCover, timeLimit }";
    return { ok: false, answer: problem("invalid-input", message, { field }) };
  }
  const body = parsed.data;
  const geojson = "room" in body && body.room ? body.room : body;
  const read = roomsFromGeoJson(geojson, "room");
  if (read.errors.length) return { ok: false, answer: problem(read.errors[0].code, read.errors[0].message) };
  const named = read.rooms[0];
  if (!named) return { ok: false, answer: problem("too-few-points", "the body holds no room polygon") };
  return {
    ok: true,
    named,
    options: {
      sightRange: body.sightRange ?? named.sightRange,
      pinned: body.pinned as Point[] | undefined,
      forbidden: body.forbidden as Point[][] | undefined,
      doubleCover: body.doubleCover,
      timeLimitSeconds: body.timeLimit ?? PREVIEW_DEFAULT_SECONDS,
    },
  };
}

/** Plans a read preview request (in the server's worker pool): the room JSON or a problem. */
export function answerPreview(named: NamedRoom, options: RoomReportOptions): PreviewAnswer {
  const outcome = planRoomReport(named, options);
  if (!outcome.ok) {
    const first = outcome.errors[0];
    return problem(first.code, first.message, first.at ? { at: first.at } : {});
  }
  return { status: 200, body: { room: outcome.report } };
}

/** Plans one room from an API body that is not yet trusted, on the calling thread. */
export function previewPostPlan(input: unknown): PreviewAnswer {
  const request = readPreviewRequest(input);
  return request.ok ? answerPreview(request.named, request.options) : request.answer;
}

/**
 * Seconds a pool job may run beyond the fewest plan's own time limit (validation, triangulation,
 * the guaranteed plan, sight and certificate); SIGHTWARD_PLAN_OVERHEAD_SECONDS, else `fallback`
 * (5 in the server, where someone waits; the `posts` command allows more).
 */
export function planOverheadSeconds(fallback = 5): number {
  const value = Number(process.env.SIGHTWARD_PLAN_OVERHEAD_SECONDS);
  return process.env.SIGHTWARD_PLAN_OVERHEAD_SECONDS !== undefined && Number.isFinite(value) && value >= 0 ? value : fallback;
}

/**
 * Plans a read preview request in the server's planning pool. A job ended at its deadline (or by
 * the memory limit) still answers the best plan then known with `stoppedBecause`; one ended before
 * the guaranteed plan existed answers 503. Throws PlanPoolFull when every planner is busy.
 */
export async function previewInPool(named: NamedRoom, options: RoomReportOptions, signal?: AbortSignal): Promise<PreviewAnswer> {
  const seconds = (options.timeLimitSeconds ?? PREVIEW_DEFAULT_SECONDS) + planOverheadSeconds();
  const transferable = { ...options, onProgress: undefined, signal: undefined, deadline: undefined };
  const answer = await planPool().run({ kind: "report", named, options: transferable }, { seconds, signal });
  if (answer.status === "done") {
    if (answer.result.kind !== "report") throw new Error("the planner answered another kind of job");
    const outcome = answer.result.outcome;
    if (!outcome.ok) {
      const first = outcome.errors[0];
      return problem(first.code, first.message, first.at ? { at: first.at } : {});
    }
    return { status: 200, body: { room: outcome.report } };
  }
  if (answer.status === "failed") {
    console.error(`[planner] preview of ${named.name} failed: ${answer.message}`);
    return { status: 500, body: { error: { code: "planner-failed", message: "The planner failed on this room; it has been logged. Try again, or simplify the outline." } } };
  }
  if (answer.reason === "cancelled") {
    return { status: 499, body: { error: { code: "cancelled", message: "The preview was cancelled before it finished." } } };
  }
  if (answer.reason === "shutdown") {
    return { status: 503, body: { error: { code: "server-stopping", message: "The server is restarting; ask for the plan again in a moment." } } };
  }
  const report = stoppedRoomReport(named, options, answer.progress, answer.reason);
  if (report) return { status: 200, body: { room: report } };
  const why = answer.reason === "memory-limit" ? "ran out of its memory allowance" : `reached its ${Math.round(seconds)} s deadline`;
  return {
    status: 503,
    body: {
      error: {
        code: answer.reason === "memory-limit" ? "planning-memory-limit" : "planning-deadline",
        message: `The planner ${why} before even the guaranteed plan of ${named.name} was ready; split the room into smaller rooms or simplify its outline, then try again.`,
      },
    },
  };
}
