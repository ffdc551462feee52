// GET: a room's post plans, newest first. POST (operations): plan the room's current walls in the
// server's planning pool under the exhibition's conditions and store the plan as 'proposed'. A job
// ended at its deadline stores the guaranteed plan when its coverage is known (the theorem), and
// says so; otherwise nothing is stored and the answer says why.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { roomDetail } from "@/db/queries/rooms";
import { insertProposedPlan, postPlansForRoom } from "@/db/queries/post-plans";
import type { StorablePlan, StoppedBecause } from "@/lib/guarding/plan-room";
import { planPool } from "@/lib/guarding/plan-pool";
import { planOverheadSeconds } from "@/lib/guarding/fewest-preview";
import { ApiProblem } from "@/lib/api/problem";
import { ROOM_BODY_LIMIT, parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { postPlanRequestSchema, roomIdParams } from "@/lib/api/plan-input";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ roomId: string }> };

export const dynamic = "force-dynamic";
// The fewest plan gets a few seconds of solver time; allow for it.
export const maxDuration = 60;

/** Seconds of solver time a request may spend on the fewest plan. */
const FEWEST_SECONDS = 5;

export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "galleries:view");
  const { roomId } = parseParams(await context.params, roomIdParams);
  const room = await roomDetail(roomId, db);
  if (!room) throw new ApiProblem(404, "not-found", `There is no room ${roomId}.`);
  return NextResponse.json({ plans: await postPlansForRoom(roomId, undefined, db) });
});

export const POST = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "plans:approve");
  const { roomId } = parseParams(await context.params, roomIdParams);
  const body = await parseBody(request, postPlanRequestSchema, { limit: ROOM_BODY_LIMIT });
  const room = await roomDetail(roomId, db);
  if (!room) throw new ApiProblem(404, "not-found", `There is no room ${roomId}.`);
  if (body.roomVersion !== room.version) {
    throw new ApiProblem(
      409,
      "stale-version",
      `The room changed while you were looking at it: you saw version ${body.roomVersion}, it is now at version ${room.version}. Reload the room, then compute the plan again.`,
      { currentVersion: room.version },
    );
  }
  const exhibitionId = body.exhibitionId ?? null;
  const exhibition = exhibitionId === null ? null : room.exhibitions.find((e) => e.id === exhibitionId);
  if (exhibitionId !== null && !exhibition) {
    throw new ApiProblem(422, "not-in-exhibition", `${room.name} is not part of exhibition ${exhibitionId}; choose one of its exhibitions.`, {
      field: "exhibitionId",
    });
  }
  const options = {
    sightRange: body.sightRange !== undefined ? body.sightRange : (exhibition?.sight_range ?? null),
    doubleCover: body.doubleCover ?? exhibition?.double_cover ?? false,
    pinned: body.pinned,
    forbidden: body.forbidden,
  };
  const answer = await planPool().run(
    {
      kind: "storable",
      room: { outline: room.outline, obstacles: room.obstacles },
      request: { options, method: body.method ?? "fewest", timeLimit: FEWEST_SECONDS },
    },
    { seconds: FEWEST_SECONDS + planOverheadSeconds(), signal: request.signal },
  );
  let computed: StorablePlan;
  let stoppedBecause: StoppedBecause;
  if (answer.status === "done") {
    if (answer.result.kind !== "storable") throw new Error("the planner answered another kind of job");
    const outcome = answer.result.outcome;
    if (!outcome.ok) {
      throw new ApiProblem(422, "invalid-plan-request", `No plan can be computed: ${outcome.problems[0].message}.`, { problems: outcome.problems });
    }
    computed = outcome.plan;
    stoppedBecause = outcome.stoppedBecause;
  } else if (answer.status === "failed") {
    throw new Error(`planning ${room.name} failed: ${answer.message}`);
  } else if (answer.reason === "cancelled") {
    throw new ApiProblem(499, "cancelled", "The plan was cancelled before it finished; nothing was stored.");
  } else if (answer.reason === "shutdown") {
    throw new ApiProblem(503, "server-stopping", "The server is restarting; nothing was stored. Compute the plan again in a moment.", undefined, { "Retry-After": "10" });
  } else {
    const best = answer.progress?.best;
    if (!best || best.covered !== 1) {
      throw new ApiProblem(
        503,
        answer.reason === "memory-limit" ? "planning-memory-limit" : "planning-deadline",
        `The planner stopped (${answer.reason === "memory-limit" ? "memory limit" : "deadline"}) before a plan with known coverage of ${room.name} was ready; nothing was stored. Try the guaranteed method, or split the room.`,
      );
    }
    computed = { ...best, method: "guaranteed", covered: 1 };
    stoppedBecause = answer.reason;
  }
  const plan = await insertProposedPlan({ roomId, exhibitionId, roomVersion: room.version, options, computed }, db);
  await recordAudit(db, user, {
    action: "post-plan.compute",
    subject: { type: "post-plan", id: plan.id, label: room.name },
    siteId: room.site.id,
    summary: `computed a ${computed.method} plan of ${computed.posts.length} post(s) for ${room.name}${exhibition ? ` (${exhibition.name})` : ""}`,
    changes: { roomId, roomVersion: room.version, exhibitionId, posts: computed.posts.length, method: computed.method, options },
  });
  return NextResponse.json({ plan, uncovered: computed.uncovered, stoppedBecause }, { status: 201 });
});
