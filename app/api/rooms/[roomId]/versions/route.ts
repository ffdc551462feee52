// GET: every kept outline of a room, newest first: version, who saved it and when, corners n,
// obstacles h and floor area.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { roomBasics, roomVersions } from "@/db/queries/galleries";
import { roomIdParams } from "@/lib/api/plan-input";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";

type Context = { params: Promise<{ roomId: string }> };

export const dynamic = "force-dynamic";

export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "galleries:view");
  const { roomId } = parseParams(await context.params, roomIdParams);
  const room = await roomBasics(db, roomId);
  if (!room) throw new ApiProblem(404, "not-found", `There is no room ${roomId}.`);
  return NextResponse.json({ current: room.version, versions: await roomVersions(db, roomId) });
});
