// GET: a room's post plans, newest first. POST (operations): plan the room's current walls on the
// server with the real planner under the exhibition's conditions and store the plan as 'proposed'.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { roomDetail } from "@/db/queries/rooms";
import { insertProposedPlan, postPlansForRoom } from "@/db/queries/post-plans";
import { planPostPlan } from "@/lib/guarding/plan-room";
import { ApiProblem } from "@/lib/api/problem";
import { ROOM_BODY_LIMIT, parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { postPlanRequestSchema, roomIdParams } from "@/lib/api/plan-input";

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
  await requireRole(request, "plans:approve");
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
  const outcome = planPostPlan(
    { outline: room.outline, obstacles: room.obstacles },
    { options, method: body.method ?? "fewest", timeLimit: FEWEST_SECONDS },
  );
  if (!outcome.ok) {
    throw new ApiProblem(422, "invalid-plan-request", `No plan can be computed: ${outcome.problems[0].message}.`, { problems: outcome.problems });
  }
  const plan = await insertProposedPlan({ roomId, exhibitionId, roomVersion: room.version, options, computed: outcome.plan }, db);
  return NextResponse.json({ plan, uncovered: outcome.plan.uncovered }, { status: 201 });
});
