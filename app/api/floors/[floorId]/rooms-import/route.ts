// POST /api/floors/[floorId]/rooms-import { geojson, dryRun, versions? }: rooms from a GeoJSON
// FeatureCollection, matched to the floor's rooms by name. dryRun (the default) answers what would
// change; without it every room is created or its walls saved in one transaction, only over the
// versions the preview showed (409 when a room changed since). A file with one bad room saves
// nothing (422 naming the room); at most 5 MB and 20,000 corners.
import { NextResponse, type NextRequest } from "next/server";
import { z } from "zod";
import { db } from "@/db";
import { createRoom, floorById, roomsOfFloorByName } from "@/db/queries/galleries";
import { writeRoomWalls } from "@/db/queries/rooms";
import { floorIdParams } from "@/lib/api/galleries";
import { counter } from "@/lib/api/ids";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit/record";
import { readRoomUpload, UPLOAD_BYTE_LIMIT } from "@/lib/galleries/room-upload";

type Context = { params: Promise<{ floorId: string }> };

const uploadSchema = z.object({
  geojson: z.unknown().refine((v) => typeof v === "object" && v !== null && !Array.isArray(v), "geojson must be a GeoJSON object such as a FeatureCollection"),
  dryRun: z.boolean({ error: "dryRun is true (preview) or false (save)" }).default(true),
  /** The version of each room the preview showed, by name. */
  versions: z.record(z.string().max(120), counter("version")).optional(),
});

export const POST = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "rooms:edit");
  const { floorId } = parseParams(await context.params, floorIdParams);
  // The file's 5 MB plus room for the wrapping object.
  const body = await parseBody(request, uploadSchema, { limit: UPLOAD_BYTE_LIMIT + 64 * 1024 });
  const floor = await floorById(db, floorId);
  if (!floor) throw new ApiProblem(404, "not-found", `There is no floor ${floorId}; reload the page.`);
  const read = readRoomUpload(body.geojson);
  if (!read.ok) {
    const first = read.problems[0]!;
    throw new ApiProblem(422, "bad-room-file", `Nothing was saved: ${read.problems.length === 1 ? "1 problem" : `${read.problems.length} problems`}; ${first.room}: ${first.message}.`, { problems: read.problems });
  }
  const existing = new Map((await roomsOfFloorByName(db, floorId)).map((r) => [r.name.toLowerCase(), r]));
  const preview = read.rooms.map((r) => {
    const found = existing.get(r.name.toLowerCase());
    const obstacles = r.room.obstacles.length;
    return found
      ? { name: found.name, action: "update" as const, roomId: found.id, version: found.version, corners: r.room.outline.length, obstacles }
      : { name: r.name, action: "create" as const, corners: r.room.outline.length, obstacles };
  });
  if (body.dryRun) return NextResponse.json({ floor: { id: floor.id, name: floor.name }, preview });

  const saved = await db.transaction().execute(async (trx) => {
    const current = new Map((await roomsOfFloorByName(trx, floorId)).map((r) => [r.name.toLowerCase(), r]));
    let created = 0;
    let updated = 0;
    for (const room of read.rooms) {
      const found = current.get(room.name.toLowerCase());
      const shown = body.versions?.[room.name] ?? body.versions?.[found?.name ?? ""];
      if (found) {
        if (shown === undefined || shown !== found.version) {
          throw new ApiProblem(409, "stale-version", `${found.name} changed since the preview (now version ${found.version}); nothing was saved. Preview the file again.`, { room: found.name });
        }
        await writeRoomWalls(trx, found.id, room.room, found.version, user.id);
        updated++;
      } else {
        if (shown !== undefined) throw new ApiProblem(409, "stale-version", `${room.name} was removed since the preview; nothing was saved. Preview the file again.`, { room: room.name });
        await createRoom(trx, { floor_id: floorId, name: room.name, ...room.room }, user.id);
        created++;
      }
    }
    await recordAudit(trx, user, {
      action: "room.upload",
      subject: { type: "floor", id: floorId, label: floor.name },
      siteId: floor.site_id,
      summary: `uploaded ${read.rooms.length} room(s) to ${floor.name}: ${created} new, ${updated} with new walls`,
      changes: { rooms: preview.map((p) => ({ name: p.name, action: p.action, corners: p.corners, obstacles: p.obstacles })) },
    });
    return { created, updated };
  });
  return NextResponse.json({ ...saved, preview }, { status: 201 });
});
