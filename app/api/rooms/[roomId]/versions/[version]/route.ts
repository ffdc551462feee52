// GET: one kept outline of a room with its walls, for the side-by-side drawing.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { roomVersion } from "@/db/queries/galleries";
import { roomVersionParams } from "@/lib/api/galleries";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";

type Context = { params: Promise<{ roomId: string; version: string }> };

export const dynamic = "force-dynamic";

export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "galleries:view");
  const { roomId, version } = parseParams(await context.params, roomVersionParams);
  const kept = await roomVersion(db, roomId, version);
  if (!kept) throw new ApiProblem(404, "not-found", `Room ${roomId} has no version ${version}; pick one from its list of versions.`);
  return NextResponse.json({ version: kept });
});
