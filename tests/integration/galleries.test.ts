// Sites, floors, rooms and outline versions through the route handlers, in-process, against the
// real PostgreSQL npm test starts: each role on every new route, create/rename/reorder/delete,
// refusals that leave the database as it was, versions kept by the trigger (who, n, h, area)
// with restore as a new version, and 409 on a stale save. Works on its own site, so the seeded
// museum other tests read stays as it is.
import { vi } from "vitest";
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { NextRequest } from "next/server";
import { encode } from "next-auth/jwt";
import earcut from "earcut";
import { createDb } from "@/db";
import { toJson, type Role } from "@/db/schema";
import { ROLE_NAMES } from "@/lib/auth/roles";
import * as sites from "@/app/api/sites/route";
import * as siteOrder from "@/app/api/sites/order/route";
import * as siteOne from "@/app/api/sites/[siteId]/route";
import * as floorOrder from "@/app/api/sites/[siteId]/floor-order/route";
import * as floors from "@/app/api/floors/route";
import * as floorOne from "@/app/api/floors/[floorId]/route";
import * as roomOrder from "@/app/api/floors/[floorId]/room-order/route";
import * as rooms from "@/app/api/rooms/route";
import * as roomOne from "@/app/api/rooms/[roomId]/route";
import * as versions from "@/app/api/rooms/[roomId]/versions/route";
import * as versionOne from "@/app/api/rooms/[roomId]/versions/[version]/route";
import * as restore from "@/app/api/rooms/[roomId]/versions/[version]/restore/route";
import { roomArea } from "@/lib/geometry/room";
import { agplibPolygons, asRoom } from "../geometry/support/agplib";
import { requireDatabaseUrl } from "./support/database";

const SECRET = "galleries-test-secret";
let db: ReturnType<typeof createDb>;
const userOf: Partial<Record<Role, { id: number; email: string; name: string }>> = {};
const tag = `T${process.pid}-${Date.now().toString(36)}`;

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  process.env.NEXTAUTH_SECRET ??= SECRET;
  for (const role of ROLE_NAMES) {
    const row = await db.selectFrom("users").select(["id", "email", "name"]).where("role", "=", role).orderBy("id").limit(1).executeTakeFirst();
    if (!row) throw new Error(`the seed has no ${role} account; run npm test (it seeds the demo museum)`);
    userOf[role] = row;
  }
});

afterAll(async () => {
  await db.deleteFrom("sites").where("name", "like", `${tag}%`).execute();
  await db?.destroy();
});

type Handler = (request: NextRequest, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

async function call(
  handler: unknown,
  role: Role | null,
  init: { method?: string; path?: string; params?: Record<string, string>; json?: unknown; body?: string } = {},
): Promise<{ status: number; body: any }> {
  const headers = new Headers({ "content-type": "application/json" });
  if (role) {
    const user = userOf[role]!;
    const token = await encode({ token: { uid: user.id, role, email: user.email, name: user.name, signedInAt: Math.floor(Date.now() / 1000) }, secret: process.env.NEXTAUTH_SECRET! });
    headers.set("cookie", `next-auth.session-token=${token}`);
  }
  const body = init.body ?? (init.json !== undefined ? JSON.stringify(init.json) : undefined);
  const request = new NextRequest(`http://127.0.0.1${init.path ?? "/api/test"}`, { method: init.method ?? (body ? "POST" : "GET"), headers, body });
  const response = await (handler as Handler)(request, { params: Promise.resolve(init.params ?? {}) });
  const text = await response.text();
  return { status: response.status, body: text ? JSON.parse(text) : null };
}

// An L-shaped gallery, 8 m × 6 m less a 4 m × 3 m corner: 48 − 12 = 36 m², 6 corners.
const L_SHAPE: [number, number][] = [
  [0, 0],
  [8, 0],
  [8, 3],
  [4, 3],
  [4, 6],
  [0, 6],
];

async function newSite(label: string) {
  const site = await call(sites.POST, "curator", { json: { name: `${tag} ${label}`, timeZone: "Europe/Berlin", currency: "EUR", hourlyRate: 21.5 } });
  expect(site.status).toBe(201);
  const floor = await call(floors.POST, "curator", { json: { siteId: site.body.site.id, name: "Ground floor", level: 0 } });
  expect(floor.status).toBe(201);
  return { siteId: site.body.site.id as number, floorId: floor.body.floor.id as number };
}

async function newRoom(floorId: number, name: string, outline: [number, number][] = L_SHAPE) {
  const room = await call(rooms.POST, "curator", { json: { floorId, name, outline, obstacles: [] } });
  expect(room.status, JSON.stringify(room.body)).toBe(201);
  return room.body.room as { id: number; version: number };
}

async function snapshot(siteId: number) {
  const floorRows = await db.selectFrom("floors").selectAll().where("site_id", "=", siteId).orderBy("id").execute();
  const roomRows = floorRows.length
    ? await db.selectFrom("rooms").selectAll().where("floor_id", "in", floorRows.map((f) => f.id)).orderBy("id").execute()
    : [];
  const versionRows = roomRows.length ? await db.selectFrom("room_versions").selectAll().where("room_id", "in", roomRows.map((r) => r.id)).orderBy("id").execute() : [];
  const site = await db.selectFrom("sites").selectAll().where("id", "=", siteId).executeTakeFirst();
  return JSON.stringify({ site, floorRows, roomRows, versionRows });
}

describe("who may use the galleries routes", () => {
  it("answers 401 signed out, 403 to guards on every route, 403 to operations on every change, and lets curators and admins change", async () => {
    const { siteId, floorId } = await newSite("roles");
    const room = await newRoom(floorId, "Role Room");
    const before = await snapshot(siteId);
    const writes: { name: string; handler: unknown; init: Parameters<typeof call>[2] }[] = [
      { name: "POST /api/sites", handler: sites.POST, init: { json: { name: `${tag} x`, timeZone: "Europe/Berlin", currency: "EUR", hourlyRate: 20 } } },
      { name: "PUT /api/sites/order", handler: siteOrder.PUT, init: { method: "PUT", json: { ids: [siteId] } } },
      { name: "PATCH /api/sites/[id]", handler: siteOne.PATCH, init: { method: "PATCH", params: { siteId: String(siteId) }, json: { name: "x" } } },
      { name: "DELETE /api/sites/[id]", handler: siteOne.DELETE, init: { method: "DELETE", params: { siteId: String(siteId) } } },
      { name: "PUT floor-order", handler: floorOrder.PUT, init: { method: "PUT", params: { siteId: String(siteId) }, json: { ids: [floorId] } } },
      { name: "POST /api/floors", handler: floors.POST, init: { json: { siteId, name: "Attic", level: 3 } } },
      { name: "PATCH /api/floors/[id]", handler: floorOne.PATCH, init: { method: "PATCH", params: { floorId: String(floorId) }, json: { name: "x" } } },
      { name: "DELETE /api/floors/[id]", handler: floorOne.DELETE, init: { method: "DELETE", params: { floorId: String(floorId) } } },
      { name: "PUT room-order", handler: roomOrder.PUT, init: { method: "PUT", params: { floorId: String(floorId) }, json: { ids: [room.id] } } },
      { name: "POST /api/rooms", handler: rooms.POST, init: { json: { floorId, name: "New", width: 5, depth: 4 } } },
      { name: "PATCH /api/rooms/[id]", handler: roomOne.PATCH, init: { method: "PATCH", params: { roomId: String(room.id) }, json: { name: "x" } } },
      { name: "DELETE /api/rooms/[id]", handler: roomOne.DELETE, init: { method: "DELETE", params: { roomId: String(room.id) } } },
      { name: "POST restore", handler: restore.POST, init: { params: { roomId: String(room.id), version: "1" }, json: { currentVersion: 1 } } },
    ];
    const reads: { name: string; handler: unknown; init: Parameters<typeof call>[2] }[] = [
      { name: "GET /api/sites", handler: sites.GET, init: {} },
      { name: "GET versions", handler: versions.GET, init: { params: { roomId: String(room.id) } } },
      { name: "GET version", handler: versionOne.GET, init: { params: { roomId: String(room.id), version: "1" } } },
    ];
    for (const { name, handler, init } of [...writes, ...reads]) {
      const out = await call(handler, null, init);
      expect(out.status, `${name} signed out`).toBe(401);
      expect(out.body.error.code).toBe("signed-out");
      const guard = await call(handler, "guard", init);
      expect(guard.status, `${name} as guard`).toBe(403);
      expect(guard.body.error.message).toMatch(/guard role may not/);
    }
    for (const { name, handler, init } of writes) {
      const ops = await call(handler, "operations", init);
      expect(ops.status, `${name} as operations`).toBe(403);
      expect(ops.body.error.permission).toBe("rooms:edit");
    }
    expect(await snapshot(siteId)).toBe(before);
    for (const { name, handler, init } of reads) {
      expect((await call(handler, "operations", init)).status, `${name} as operations`).toBe(200);
      expect((await call(handler, "curator", init)).status, `${name} as curator`).toBe(200);
      expect((await call(handler, "admin", init)).status, `${name} as admin`).toBe(200);
    }
    // Admins edit as curators do.
    const renamed = await call(roomOne.PATCH, "admin", { method: "PATCH", params: { roomId: String(room.id) }, json: { name: "Admin Named" } });
    expect(renamed.status).toBe(200);
    expect((await db.selectFrom("rooms").select("name").where("id", "=", room.id).executeTakeFirstOrThrow()).name).toBe("Admin Named");
  });
});

describe("sites, floors and rooms", () => {
  it("creates, renames and reorders, and the galleries tree shows them in order", async () => {
    const { siteId, floorId } = await newSite("tree");
    const upper = await call(floors.POST, "curator", { json: { siteId, name: "Upper floor", level: 1 } });
    expect(upper.status).toBe(201);
    const a = await newRoom(floorId, "Room A");
    const b = await call(rooms.POST, "curator", { json: { floorId, name: "Room B", width: 6, depth: 4 } });
    expect(b.status).toBe(201);
    const c = await newRoom(floorId, "Room C");
    // A rectangle room from width × depth: 24 m² and 4 corners in version 1.
    const bVersions = await call(versions.GET, "curator", { params: { roomId: String(b.body.room.id) } });
    expect(bVersions.body.versions).toHaveLength(1);
    expect(bVersions.body.versions[0]).toMatchObject({ version: 1, corners: 4, holes: 0, area: 24 });

    expect((await call(floorOne.PATCH, "curator", { method: "PATCH", params: { floorId: String(floorId) }, json: { name: "Street level", level: 0 } })).status).toBe(200);
    expect((await call(siteOne.PATCH, "curator", { method: "PATCH", params: { siteId: String(siteId) }, json: { name: `${tag} tree renamed` } })).status).toBe(200);
    const order = [c.id, a.id, b.body.room.id];
    expect((await call(roomOrder.PUT, "curator", { method: "PUT", params: { floorId: String(floorId) }, json: { ids: order } })).status).toBe(200);
    expect((await call(floorOrder.PUT, "curator", { method: "PUT", params: { siteId: String(siteId) }, json: { ids: [upper.body.floor.id, floorId] } })).status).toBe(200);

    const tree = await call(sites.GET, "operations");
    const site = tree.body.sites.find((s: { id: number }) => s.id === siteId);
    expect(site.name).toBe(`${tag} tree renamed`);
    expect(site.currency).toBe("EUR");
    expect(site.floors.map((f: { name: string }) => f.name)).toEqual(["Upper floor", "Street level"]);
    expect(site.floors[1].rooms.map((r: { id: number }) => r.id)).toEqual(order);

    // Moving a room to another floor of the site puts it last there.
    const moved = await call(roomOne.PATCH, "curator", { method: "PATCH", params: { roomId: String(a.id) }, json: { floorId: upper.body.floor.id } });
    expect(moved.status).toBe(200);
    expect(moved.body.room.floor_id).toBe(upper.body.floor.id);
  });

  it("refuses bad input with the field named and changes nothing", async () => {
    const { siteId, floorId } = await newSite("bad input");
    const room = await newRoom(floorId, "Kept Room");
    const other = await newSite("other");
    const before = await snapshot(siteId);
    const cases: { handler: unknown; init: Parameters<typeof call>[2]; status: number; field?: string; message: RegExp }[] = [
      { handler: floors.POST, init: { json: { siteId, name: "  ", level: 0 } }, status: 422, field: "name", message: /name/ },
      { handler: floors.POST, init: { json: { siteId, name: "Half", level: 0.5 } }, status: 422, field: "level", message: /whole number/ },
      { handler: floors.POST, init: { json: { siteId, name: "Ground floor", level: 0 } }, status: 409, field: "name", message: /already has a floor called Ground floor/ },
      { handler: sites.POST, init: { json: { name: "S", timeZone: "Mars/Olympus", currency: "EUR", hourlyRate: 20 } }, status: 422, field: "timeZone", message: /IANA/ },
      { handler: sites.POST, init: { json: { name: "S", timeZone: "Europe/Berlin", currency: "EURO", hourlyRate: 20 } }, status: 422, field: "currency", message: /ISO 4217/ },
      { handler: rooms.POST, init: { json: { floorId, name: "Kept Room", width: 3, depth: 3 } }, status: 409, field: "name", message: /already has a room called Kept Room/ },
      { handler: rooms.POST, init: { json: { floorId, name: "No walls" } }, status: 422, field: "width", message: /outline, or a width and depth/ },
      {
        // A bow-tie: its walls cross (lib/geometry names where).
        handler: rooms.POST,
        init: { json: { floorId, name: "Bow tie", outline: [[0, 0], [4, 4], [4, 0], [0, 4]], obstacles: [] } },
        status: 422,
        message: /cannot be saved/,
      },
      { handler: rooms.POST, init: { body: "{not json" }, status: 400, message: /must be JSON/ },
      { handler: roomOne.PATCH, init: { method: "PATCH", params: { roomId: String(room.id) }, json: { floorId: other.floorId } }, status: 422, field: "floorId", message: /not a floor of this room's site/ },
      { handler: roomOne.PATCH, init: { method: "PATCH", params: { roomId: "abc" }, json: { name: "x" } }, status: 400, field: "roomId", message: /roomId/ },
      { handler: roomOrder.PUT, init: { method: "PUT", params: { floorId: String(floorId) }, json: { ids: [room.id, room.id] } }, status: 422, field: "ids", message: /twice/ },
      { handler: roomOrder.PUT, init: { method: "PUT", params: { floorId: String(floorId) }, json: { ids: [room.id + 100000] } }, status: 422, field: "ids", message: /not one of these rooms/ },
      { handler: floorOne.DELETE, init: { method: "DELETE", path: "/api/floors/1?confirm=maybe", params: { floorId: String(floorId) } }, status: 400, field: "confirm", message: /confirm/ },
      { handler: versionOne.GET, init: { params: { roomId: String(room.id), version: "99" } }, status: 404, message: /has no version 99/ },
    ];
    for (const { handler, init, status, field, message } of cases) {
      const answer = await call(handler, "curator", init);
      expect(answer.status, JSON.stringify(init)).toBe(status);
      expect(answer.body.error.message).toMatch(message);
      if (field) expect(answer.body.error.field).toBe(field);
    }
    expect(await snapshot(siteId)).toBe(before);
  });

  it("refuses to delete a room in an exhibition or with an approved plan, naming it, unless confirmed", async () => {
    const { siteId, floorId } = await newSite("delete");
    const shown = await newRoom(floorId, "Shown Room");
    const planned = await newRoom(floorId, "Planned Room");
    const free = await newRoom(floorId, "Free Room");
    const exhibition = await db
      .insertInto("exhibitions")
      .values({ site_id: siteId, name: `${tag} Bronzes`, starts_on: "2026-01-01", ends_on: "2027-12-31" })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db.insertInto("exhibition_rooms").values({ exhibition_id: exhibition.id, room_id: shown.id, risk_level: "high" }).execute();
    await db
      .insertInto("post_plans")
      .values({
        room_id: planned.id,
        exhibition_id: null,
        room_version: 1,
        method: "fewest",
        posts: toJson([[2, 2]]),
        proven: true,
        covered: 1,
        options: toJson({ sightRange: null, pinned: [], forbidden: [], doubleCover: false }),
        status: "approved",
        approved_by: userOf.operations!.id,
        approved_at: new Date(),
      })
      .execute();
    const before = await snapshot(siteId);

    const inShow = await call(roomOne.DELETE, "curator", { method: "DELETE", params: { roomId: String(shown.id) } });
    expect(inShow.status).toBe(409);
    expect(inShow.body.error.code).toBe("in-use");
    expect(inShow.body.error.message).toContain(`Shown Room is in ${tag} Bronzes`);
    const withPlan = await call(roomOne.DELETE, "curator", { method: "DELETE", params: { roomId: String(planned.id) } });
    expect(withPlan.status).toBe(409);
    expect(withPlan.body.error.message).toContain("Planned Room has an approved post plan");
    const floor = await call(floorOne.DELETE, "curator", { method: "DELETE", params: { floorId: String(floorId) } });
    expect(floor.status).toBe(409);
    expect(floor.body.error.rooms.map((r: { name: string }) => r.name).sort()).toEqual(["Planned Room", "Shown Room"]);
    const site = await call(siteOne.DELETE, "curator", { method: "DELETE", params: { siteId: String(siteId) } });
    expect(site.status).toBe(409);
    expect(await snapshot(siteId)).toBe(before);

    // A room nothing holds goes at once; a held one goes when the curator confirms.
    expect((await call(roomOne.DELETE, "curator", { method: "DELETE", params: { roomId: String(free.id) } })).status).toBe(200);
    const confirmed = await call(roomOne.DELETE, "curator", { method: "DELETE", path: "/api/rooms/x?confirm=yes", params: { roomId: String(shown.id) } });
    expect(confirmed.status).toBe(200);
    expect(await db.selectFrom("rooms").select("id").where("id", "in", [free.id, shown.id]).execute()).toEqual([]);
    expect(await db.selectFrom("exhibition_rooms").select("room_id").where("room_id", "=", shown.id).execute()).toEqual([]);
    expect(await db.selectFrom("room_versions").select("id").where("room_id", "=", shown.id).execute()).toEqual([]);
    expect((await call(siteOne.DELETE, "curator", { method: "DELETE", path: "/api/sites/x?confirm=yes", params: { siteId: String(siteId) } })).status).toBe(200);
    expect(await db.selectFrom("floors").select("id").where("id", "=", floorId).execute()).toEqual([]);
  });
});

describe("outline versions", () => {
  it("keeps every save with who, n, h and area; 409 on a stale save; restore saves a new version", async () => {
    const { floorId } = await newSite("versions");
    const room = await newRoom(floorId, "L Gallery");
    const first = await call(versions.GET, "operations", { params: { roomId: String(room.id) } });
    expect(first.body.current).toBe(1);
    // L-shape: 8×6 less 4×3 (hand computed, as the fixture comment says) = 36 m², 6 corners.
    expect(first.body.versions).toEqual([
      expect.objectContaining({ version: 1, corners: 6, holes: 0, area: 36, saved_by: { id: userOf.curator!.id, name: userOf.curator!.name } }),
    ]);

    // Version 2: a 1 m × 1 m plinth, by the admin.
    const plinth: [number, number][] = [[1, 1], [2, 1], [2, 2], [1, 2]];
    const saved = await call(roomOne.PUT, "admin", { method: "PUT", params: { roomId: String(room.id) }, json: { outline: L_SHAPE, obstacles: [plinth], version: 1 } });
    expect(saved.status).toBe(200);
    expect(saved.body.room.version).toBe(2);

    // A save over version 1 now is stale: 409 with both versions, nothing written.
    const stale = await call(roomOne.PUT, "curator", {
      method: "PUT",
      params: { roomId: String(room.id) },
      json: { outline: [[0, 0], [5, 0], [5, 5], [0, 5]], obstacles: [], version: 1 },
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatchObject({ code: "stale-version", currentVersion: 2, yourVersion: 1 });
    const list = await call(versions.GET, "curator", { params: { roomId: String(room.id) } });
    expect(list.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(list.body.versions[0]).toMatchObject({ corners: 10, holes: 1, area: 35, saved_by: { id: userOf.admin!.id } });

    const two = await call(versionOne.GET, "operations", { params: { roomId: String(room.id), version: "2" } });
    expect(two.body.version.obstacles).toHaveLength(1);

    // Restore version 1 over version 2: version 3 has version 1's walls.
    const staleRestore = await call(restore.POST, "curator", { params: { roomId: String(room.id), version: "1" }, json: { currentVersion: 1 } });
    expect(staleRestore.status).toBe(409);
    expect((await db.selectFrom("rooms").select("version").where("id", "=", room.id).executeTakeFirstOrThrow()).version).toBe(2);
    const restored = await call(restore.POST, "curator", { params: { roomId: String(room.id), version: "1" }, json: { currentVersion: 2 } });
    expect(restored.status).toBe(200);
    expect(restored.body.room.version).toBe(3);
    expect(restored.body.room.obstacles).toEqual([]);
    const three = await call(versionOne.GET, "curator", { params: { roomId: String(room.id), version: "3" } });
    const one = await call(versionOne.GET, "curator", { params: { roomId: String(room.id), version: "1" } });
    expect(three.body.version.outline).toEqual(one.body.version.outline);
    expect(three.body.version).toMatchObject({ corners: 6, holes: 0, area: 36, saved_by: { id: userOf.curator!.id } });

    // A rename does not make a version.
    await call(roomOne.PATCH, "curator", { method: "PATCH", params: { roomId: String(room.id) }, json: { name: "L Gallery East" } });
    expect((await call(versions.GET, "curator", { params: { roomId: String(room.id) } })).body.versions).toHaveLength(3);
  });

  it("stores the floor area of AGPLIB polygons with holes as earcut's triangles add up", async () => {
    const { floorId } = await newSite("agplib");
    // AGPLIB benchmark polygons (tests/fixtures/agplib/SOURCE.md); earcut (mapbox) as the reference triangulation.
    const polygons = agplibPolygons().filter((p) => p.rings.length > 1).slice(0, 3);
    expect(polygons.length).toBe(3);
    for (const [i, polygon] of polygons.entries()) {
      const rings = polygon.rings.map((ring) => ring.slice(0, -1));
      const { outline, obstacles } = asRoom(rings);
      const room = await newRoom(floorId, `AGPLIB ${i}`, outline);
      // Obstacles go in through a save, as a curator adds them.
      const saved = await call(roomOne.PUT, "curator", { method: "PUT", params: { roomId: String(room.id) }, json: { outline, obstacles, version: 1 } });
      expect(saved.status, JSON.stringify(saved.body).slice(0, 300)).toBe(200);
      const kept = await db.selectFrom("room_versions").selectAll().where("room_id", "=", room.id).where("version", "=", 2).executeTakeFirstOrThrow();
      const flat = [...kept.outline, ...kept.obstacles.flat()].flat();
      const holes: number[] = [];
      let at = kept.outline.length;
      for (const o of kept.obstacles) {
        holes.push(at);
        at += o.length;
      }
      const triangles = earcut(flat, holes);
      let area = 0;
      for (let t = 0; t < triangles.length; t += 3) {
        const [a, b, c] = [triangles[t], triangles[t + 1], triangles[t + 2]].map((k) => [flat[2 * k], flat[2 * k + 1]]);
        area += Math.abs((b[0] - a[0]) * (c[1] - a[1]) - (c[0] - a[0]) * (b[1] - a[1])) / 2;
      }
      expect(kept.area).toBeCloseTo(area, 6);
      expect(kept.area).toBeCloseTo(roomArea({ outline: kept.outline, obstacles: kept.obstacles }), 6);
      expect(kept.corners).toBe(kept.outline.length + kept.obstacles.reduce((n, o) => n + o.length, 0));
      expect(kept.holes).toBe(obstacles.length);
    }
  });
});
