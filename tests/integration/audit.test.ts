// The audit trail through the route handlers in-process on the real PostgreSQL: a curator's new
// floor, new room and saved walls, and an admin's role change, each leave one row naming who,
// what and the before and after; a refused request (a stale save, a bad role) leaves none; the
// admins' API filters the trail, other roles get 403 and bad filters are named; and the database
// itself refuses to change or remove a row.
import { vi } from "vitest";
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql, type Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { createSite } from "@/db/queries/galleries";
import { createInvitedUser } from "@/db/queries/accounts";
import { POST as createFloor } from "@/app/api/floors/route";
import { POST as createRoom } from "@/app/api/rooms/route";
import { PUT as saveRoom } from "@/app/api/rooms/[roomId]/route";
import { PATCH as changeRole } from "@/app/api/users/[id]/route";
import { GET as readAudit } from "@/app/api/audit/route";
import { requireDatabaseUrl } from "./support/database";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

let db: Kysely<Database>;
let siteId: number;
let curator: SignedUser;
let admin: SignedUser;
let operations: SignedUser;
let since: Date;
const SITE = `Audit test site ${process.pid}`;
const EMAIL = `audit.${process.pid}@example.org`;
const none = { params: Promise.resolve({}) };
const json = async (response: Response) => ({ status: response.status, body: (await response.json()) as Record<string, any> });
const trail = () => db.selectFrom("audit_events").selectAll().where("at", ">=", since).orderBy("id").execute();

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  [curator, admin, operations] = await Promise.all([userByEmail(db, "curator@example.org"), userByEmail(db, "admin@example.org"), userByEmail(db, "operations@example.org")]);
  siteId = (await createSite(db, { name: SITE, time_zone: "Europe/Berlin", currency: "EUR", hourly_rate: 20 })).id;
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
  since = (await sql<{ now: Date }>`select now() as now`.execute(db)).rows[0]!.now;
});

afterAll(async () => {
  await db.deleteFrom("sites").where("id", "=", siteId).execute();
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
  await db.destroy();
});

describe("the audit trail", () => {
  let roomId: number;

  it("records a new floor, a new room and saved walls with who and what changed; a stale save adds nothing", async () => {
    const floor = await json(await createFloor(await signedRequest(curator, "http://127.0.0.1/api/floors", { siteId, name: "Audit floor", level: 3 }), none));
    expect(floor.status).toBe(201);
    const room = await json(await createRoom(await signedRequest(curator, "http://127.0.0.1/api/rooms", { floorId: floor.body.floor.id, name: "Audit room", width: 10, depth: 8 }), none));
    expect(room.status).toBe(201);
    roomId = room.body.room.id;
    const ctx = { params: Promise.resolve({ roomId: String(roomId) }) };
    const l = { outline: [[0, 0], [10, 0], [10, 4], [5, 4], [5, 8], [0, 8]], obstacles: [] };
    const saved = await json(await saveRoom(await signedRequest(curator, `http://127.0.0.1/api/rooms/${roomId}`, { ...l, version: 1 }, "PUT"), ctx));
    expect(saved.status).toBe(200);
    const countBefore = (await trail()).length;
    const stale = await saveRoom(await signedRequest(curator, `http://127.0.0.1/api/rooms/${roomId}`, { ...l, version: 1 }, "PUT"), ctx);
    expect(stale.status).toBe(409);
    expect((await trail()).length).toBe(countBefore);

    const rows = (await trail()).filter((r) => r.actor_id === curator.id);
    expect(rows.map((r) => r.action)).toEqual(["floor.create", "room.create", "room.save-walls"]);
    expect(rows.every((r) => r.actor_name === curator.name && r.actor_role === "curator")).toBe(true);
    expect(rows[0]).toMatchObject({ subject_type: "floor", subject_label: "Audit floor", site_id: siteId, changes: { name: "Audit floor", level: 3 } });
    expect(rows[1]).toMatchObject({ subject_type: "room", subject_id: roomId, changes: { corners: 4, obstacles: 0 } });
    expect(rows[2]).toMatchObject({ subject_id: roomId, site_id: siteId, changes: { version: { from: 1, to: 2 }, corners: 6, obstacles: 0 } });
    expect(rows[2]!.summary).toMatch(/saved the walls of Audit room \(version 2\)/);
  });

  it("records a role change with before and after; a refused one adds nothing", async () => {
    const user = await createInvitedUser(db, { email: EMAIL, name: "Audit Person", role: "guard" });
    const ctx = { params: Promise.resolve({ id: String(user.id) }) };
    const before = (await trail()).length;
    expect((await changeRole(await signedRequest(admin, `http://127.0.0.1/api/users/${user.id}`, { role: "wizard" }, "PATCH"), ctx)).status).toBe(422);
    expect((await trail()).length).toBe(before);
    expect((await changeRole(await signedRequest(admin, `http://127.0.0.1/api/users/${user.id}`, { role: "curator" }, "PATCH"), ctx)).status).toBe(200);
    const row = (await trail()).at(-1)!;
    expect(row).toMatchObject({ actor_id: admin.id, action: "user.role", subject_id: user.id, changes: { role: { from: "guard", to: "curator" } } });
  });

  it("answers admins with a filtered trail; other roles get 403 and bad filters are named", async () => {
    const rooms = await json(await readAudit(await signedRequest(admin, `http://127.0.0.1/api/audit?area=room&actor=${curator.id}&from=${since.toISOString()}`), none));
    expect(rooms.status).toBe(200);
    expect(rooms.body.events.map((e: { action: string }) => e.action).sort()).toEqual(["room.create", "room.save-walls"]);
    expect((await readAudit(await signedRequest(operations, "http://127.0.0.1/api/audit"), none)).status).toBe(403);
    expect((await readAudit(await signedRequest(null, "http://127.0.0.1/api/audit"), none)).status).toBe(401);
    for (const [query, field] of [["area=kitchen", "area"], ["from=0000-01-01", "from"], ["to=yesterday", "to"], ["actor=2147483648", "actor"], ["limit=0", "limit"]] as const) {
      const bad = await json(await readAudit(await signedRequest(admin, `http://127.0.0.1/api/audit?${query}`), none));
      expect(bad.status, query).toBe(400);
      expect(bad.body.error.field, query).toBe(field);
    }
  });

  it("cannot be rewritten: the database refuses UPDATE and DELETE on the trail", async () => {
    const row = (await trail())[0]!;
    await expect(db.updateTable("audit_events").set({ summary: "nothing happened" } as never).where("id", "=", row.id).execute()).rejects.toThrow(/append-only/);
    await expect(db.deleteFrom("audit_events").where("id", "=", row.id).execute()).rejects.toThrow(/append-only/);
    expect((await db.selectFrom("audit_events").select("summary").where("id", "=", row.id).executeTakeFirstOrThrow()).summary).toBe(row.summary);
  });
});
