// POST: bring back an earlier outline. It is saved as a new version (the history only grows),
// over the version the person was looking at: 409 when someone saved since.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { roomDetail, saveRoomWalls } from "@/db/queries/rooms";
import { roomVersion } from "@/db/queries/galleries";
import { restoreSchema, roomVersionParams } from "@/lib/api/galleries";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { validateRoom } from "@/lib/geometry/room";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ roomId: string; version: string }> };

export const POST = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "rooms:edit");
  const { roomId, version } = parseParams(await context.params, roomVersionParams);
  const { currentVersion } = await parseBody(request, restoreSchema);
  const kept = await roomVersion(db, roomId, version);
  if (!kept) throw new ApiProblem(404, "not-found", `Room ${roomId} has no version ${version}; pick one from its list of versions.`);
  // Kept versions were valid when saved; check again, since the rules may have grown stricter.
  const problems = validateRoom({ outline: kept.outline, obstacles: kept.obstacles });
  if (problems.length > 0) {
    throw new ApiProblem(422, "invalid-room", `Version ${version} cannot be restored: ${problems[0].message}. Edit the current walls instead.`, { problems });
  }
  const saved = await saveRoomWalls(roomId, { outline: kept.outline, obstacles: kept.obstacles }, currentVersion, db, user.id);
  if (!saved.ok && saved.reason === "not-found") throw new ApiProblem(404, "not-found", `There is no room ${roomId}.`);
  if (!saved.ok) {
    throw new ApiProblem(
      409,
      "stale-version",
      `Someone else saved this room first: you were looking at version ${currentVersion}, it is now at version ${saved.currentVersion}. Nothing was restored; reload the versions and try again.`,
      { currentVersion: saved.currentVersion, yourVersion: currentVersion },
    );
  }
  const room = await roomDetail(roomId, db);
  await recordAudit(db, user, { action: "room.restore", subject: { type: "room", id: roomId, label: room?.name }, siteId: room?.site.id, summary: `restored version ${version} of the walls of ${room?.name ?? `room ${roomId}`} as version ${saved.version}`, changes: { version: { from: currentVersion, to: saved.version }, restoredFrom: version } });
  return NextResponse.json({ room, restoredFrom: version });
});
