// Several rooms at once from a GeoJSON FeatureCollection (each Feature a room, named by its `name`
// property): read and checked whole before anything is saved, so a file with one bad room saves
// nothing and names the room and its problem. Pure: the browser's preview and the route share it.
import { roomsFromGeoJson, type NamedRoom } from "../geometry/geojson";
import { normaliseRoom, validateRoom } from "../geometry/room";

/** The largest file the upload takes (5 MB) and the most corners in it, all rooms together. */
export const UPLOAD_BYTE_LIMIT = 5 * 1024 * 1024;
export const UPLOAD_CORNER_LIMIT = 20_000;

export interface UploadProblem {
  room: string;
  message: string;
}

export type ReadUpload = { ok: true; rooms: NamedRoom[] } | { ok: false; problems: UploadProblem[] };

export function readRoomUpload(geojson: unknown): ReadUpload {
  const parsed = roomsFromGeoJson(geojson, "room");
  const problems: UploadProblem[] = parsed.errors.map((e) => ({ room: e.room, message: e.message }));
  if (problems.length === 0 && parsed.rooms.length === 0) problems.push({ room: "(file)", message: "the file holds no room polygon; send a FeatureCollection with one Feature per room" });
  const corners = parsed.rooms.reduce((sum, r) => sum + r.room.outline.length + r.room.obstacles.reduce((s, o) => s + o.length, 0), 0);
  if (corners > UPLOAD_CORNER_LIMIT) {
    problems.push({ room: "(file)", message: `the file has ${corners.toLocaleString("en")} corners; at most ${UPLOAD_CORNER_LIMIT.toLocaleString("en")} in one upload, split it` });
    return { ok: false, problems };
  }
  const seen = new Set<string>();
  const rooms: NamedRoom[] = [];
  for (const named of parsed.rooms) {
    const name = named.name.trim();
    if (!name || name.length > 120 || name.includes("\u0000")) {
      problems.push({ room: name || "(unnamed)", message: "give every room a name of 1 to 120 characters (the Feature's name property)" });
      continue;
    }
    if (seen.has(name.toLowerCase())) {
      problems.push({ room: name, message: "the file names this room twice; each room once" });
      continue;
    }
    seen.add(name.toLowerCase());
    const found = validateRoom(named.room);
    if (found.length > 0) {
      problems.push({ room: name, message: found[0]!.message });
      continue;
    }
    rooms.push({ ...named, name, room: normaliseRoom(named.room) });
  }
  return problems.length > 0 ? { ok: false, problems } : { ok: true, rooms };
}
