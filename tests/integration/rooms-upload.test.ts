// Uploading several rooms to a floor from a GeoJSON FeatureCollection, through the route handler
// in-process on the real PostgreSQL: a preview says which rooms are new and which get new walls;
// saving creates and updates them in one go, over the versions the preview showed (a room changed
// since answers 409); a file with one bad room, a room named twice, more than 20,000 corners or
// more than 5 MB saves nothing; only curators and admins upload. A scratch site of its own.
import { vi } from "vitest";
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { createFloor, createSite } from "@/db/queries/galleries";
import { POST as upload } from "@/app/api/floors/[floorId]/rooms-import/route";
import { POST as createRoom } from "@/app/api/rooms/route";
import { requireDatabaseUrl } from "./support/database";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

let db: Kysely<Database>;
let siteId: number;
let floorId: number;
let curator: SignedUser;
let operations: SignedUser;
let guard: SignedUser;
const SITE = `Upload test site ${process.pid}`;

const feature = (name: string, ring: number[][], holes: number[][][] = []) => ({ type: "Feature", properties: { name }, geometry: { type: "Polygon", coordinates: [[...ring, ring[0]], ...holes.map((h) => [...h, h[0]])] } });
const L = [[0, 0], [12, 0], [12, 5], [5, 5], [5, 10], [0, 10]];
const square = [[0, 0], [8, 0], [8, 8], [0, 8]];
const collection = (...features: unknown[]) => ({ type: "FeatureCollection", features });
const ctx = () => ({ params: Promise.resolve({ floorId: String(floorId) }) });
const send = async (user: SignedUser, body: unknown) => {
  const response = await upload(await signedRequest(user, `http://127.0.0.1/api/floors/${floorId}/rooms-import`, body), ctx());
  return { status: response.status, body: (await response.json()) as Record<string, any> };
};
const roomsNow = () => db.selectFrom("rooms").select(["name", "version", "outline"]).where("floor_id", "=", floorId).orderBy("name").execute();

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  [curator, operations, guard] = await Promise.all([userByEmail(db, "curator@example.org"), userByEmail(db, "operations@example.org"), userByEmail(db, "guard@example.org")]);
  siteId = (await createSite(db, { name: SITE, time_zone: "Europe/Berlin", currency: "EUR", hourly_rate: 20 })).id;
  floorId = (await createFloor(db, { site_id: siteId, name: "Upload floor", level: 0 })).id;
  const made = await createRoom(await signedRequest(curator, "http://127.0.0.1/api/rooms", { floorId, name: "West Hall", width: 10, depth: 6 }), { params: Promise.resolve({}) });
  expect(made.status).toBe(201);
});

afterAll(async () => {
  await db.deleteFrom("sites").where("id", "=", siteId).execute();
  await db.destroy();
});

describe("uploading rooms from a FeatureCollection", () => {
  it("previews which rooms are new and which get new walls, saving nothing", async () => {
    const before = await roomsNow();
    const answer = await send(curator, { geojson: collection(feature("East Hall", L), feature("west hall", square, [[[3, 3], [5, 3], [5, 5], [3, 5]]])), dryRun: true });
    expect(answer.status).toBe(200);
    expect(answer.body.preview).toEqual([
      { name: "East Hall", action: "create", corners: 6, obstacles: 0 },
      { name: "West Hall", action: "update", roomId: expect.any(Number), version: 1, corners: 4, obstacles: 1 },
    ]);
    expect(await roomsNow()).toEqual(before);
  });

  it("saves nothing from a file with one bad room, naming the room and the problem", async () => {
    const before = await roomsNow();
    const bowTie = [[0, 0], [10, 10], [10, 0], [0, 10]];
    const bad = await send(curator, { geojson: collection(feature("East Hall", L), feature("Crossed Room", bowTie)), dryRun: false, versions: {} });
    expect(bad.status).toBe(422);
    expect(bad.body.error.message).toMatch(/^Nothing was saved: 1 problem; Crossed Room: /);
    expect(bad.body.error.problems[0].room).toBe("Crossed Room");
    const twice = await send(curator, { geojson: collection(feature("East Hall", L), feature("east hall", square)), dryRun: true });
    expect(twice.status).toBe(422);
    expect(twice.body.error.message).toMatch(/names this room twice/);
    const empty = await send(curator, { geojson: collection(), dryRun: true });
    expect(empty.status).toBe(422);
    expect(await roomsNow()).toEqual(before);
  });

  it("refuses more than 20,000 corners (422) and more than 5 MB (413), saving nothing", async () => {
    const before = await roomsNow();
    const circle = (n: number, r: number) => Array.from({ length: n }, (_, i) => [Math.round(r * Math.cos((2 * Math.PI * i) / n) * 1000) / 1000, Math.round(r * Math.sin((2 * Math.PI * i) / n) * 1000) / 1000]);
    const many = await send(curator, { geojson: collection(feature("Big A", circle(10_001, 100)), feature("Big B", circle(10_000, 100))), dryRun: true });
    expect(many.status).toBe(422);
    expect(many.body.error.message).toMatch(/has 20,\d{3} corners; at most 20,000 in one upload/);
    const huge = await send(curator, { geojson: { ...collection(feature("Padded", L)), note: "x".repeat(5 * 1024 * 1024 + 100_000) }, dryRun: true });
    expect(huge.status).toBe(413);
    expect(await roomsNow()).toEqual(before);
  });

  it("creates and updates over the versions the preview showed; a room changed since answers 409", async () => {
    const file = collection(feature("East Hall", L), feature("West Hall", square));
    const preview = await send(curator, { geojson: file, dryRun: true });
    const versions = Object.fromEntries(preview.body.preview.filter((r: { version?: number }) => r.version).map((r: { name: string; version: number }) => [r.name, r.version]));
    const saved = await send(curator, { geojson: file, dryRun: false, versions });
    expect(saved.status).toBe(201);
    expect(saved.body).toMatchObject({ created: 1, updated: 1 });
    const rooms = await roomsNow();
    expect(rooms.map((r) => [r.name, r.version])).toEqual([["East Hall", 1], ["West Hall", 2]]);
    // The same stale preview again: West Hall is at version 2 now.
    const stale = await send(curator, { geojson: file, dryRun: false, versions });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/(East Hall|West Hall) changed since the preview/);
    expect(await roomsNow()).toEqual(rooms);
    const trail = await db.selectFrom("audit_events").select(["action", "actor_id"]).where("action", "=", "room.upload").where("subject_id", "=", floorId).execute();
    expect(trail).toEqual([{ action: "room.upload", actor_id: curator.id }]);
  });

  it("is for curators and admins only", async () => {
    const before = await roomsNow();
    expect((await send(operations, { geojson: collection(feature("Ops Room", L)), dryRun: false })).status).toBe(403);
    expect((await send(guard, { geojson: collection(feature("Guard Room", L)), dryRun: true })).status).toBe(403);
    expect(await roomsNow()).toEqual(before);
  });
});
