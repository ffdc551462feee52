// Exhibitions through the route handlers in-process on the real PostgreSQL: operations creates and
// edits one with rooms and their risk, sight range and double cover; bad input (a closing before
// the opening, a sight range under 0.5 m, a room listed twice, a room of another site) gets 422
// naming the field and writes nothing; a name the site uses gets 409; guards and curators get 403.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the modules.
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { POST } from "@/app/api/exhibitions/route";
import { GET, PUT } from "@/app/api/exhibitions/[id]/route";
import { createSite, createFloor, createRoom } from "@/db/queries/galleries";
import { requireDatabaseUrl } from "./support/database";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

let db: Kysely<Database>;
let siteId: number;
let otherRoom: number;
let rooms: number[];
let operations: SignedUser;
let curator: SignedUser;
let guard: SignedUser;
const NAME = `Integration exhibition ${process.pid}`;

async function create(user: SignedUser, body: unknown) {
  const response = await POST(await signedRequest(user, "http://127.0.0.1/api/exhibitions", body), { params: Promise.resolve({}) });
  return { status: response.status, body: (await response.json()) as Record<string, any> };
}
async function update(user: SignedUser, id: number, body: unknown) {
  const response = await PUT(await signedRequest(user, `http://127.0.0.1/api/exhibitions/${id}`, body, "PUT"), { params: Promise.resolve({ id: String(id) }) });
  return { status: response.status, body: (await response.json()) as Record<string, any> };
}
const count = async () => Number((await db.selectFrom("exhibitions").select((eb) => eb.fn.countAll<string>().as("n")).where("site_id", "=", siteId).executeTakeFirstOrThrow()).n);

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  [operations, curator, guard] = await Promise.all([userByEmail(db, "operations@example.org"), userByEmail(db, "curator@example.org"), userByEmail(db, "guard@example.org")]);
  await db.deleteFrom("sites").where("name", "in", ["Exhibitions test site", "Exhibitions other site"]).execute();
  siteId = (await createSite(db, { name: "Exhibitions test site", time_zone: "Europe/Berlin", currency: "EUR", hourly_rate: 22 })).id;
  const other = (await createSite(db, { name: "Exhibitions other site", time_zone: "Europe/Berlin", currency: "EUR", hourly_rate: 22 })).id;
  const square = [[0, 0], [6, 0], [6, 6], [0, 6]] as [number, number][];
  const floor = await createFloor(db, { site_id: siteId, name: "Ground", level: 0 });
  const otherFloor = await createFloor(db, { site_id: other, name: "Ground", level: 0 });
  rooms = [];
  await db.transaction().execute(async (trx) => {
    for (const name of ["North", "South"]) rooms.push((await createRoom(trx, { floor_id: floor.id, name, outline: square, obstacles: [] }, null)).id);
    otherRoom = (await createRoom(trx, { floor_id: otherFloor.id, name: "Elsewhere", outline: square, obstacles: [] }, null)).id;
  });
});

afterAll(async () => {
  await db.deleteFrom("sites").where("name", "in", ["Exhibitions test site", "Exhibitions other site"]).execute();
  await db.destroy();
});

describe("exhibitions API", () => {
  const good = () => ({
    siteId,
    name: NAME,
    startsOn: "2099-01-04",
    endsOn: "2099-03-01",
    rooms: [
      { roomId: rooms[0]!, riskLevel: "high", sightRange: 12, doubleCover: false },
      { roomId: rooms[1]!, riskLevel: "standard", sightRange: null, doubleCover: true },
    ],
  });

  it("refuses other roles and bad input, writing nothing", async () => {
    expect((await create(curator, good())).status).toBe(403);
    expect((await create(guard, good())).status).toBe(403);
    for (const [change, field, pattern] of [
      [{ endsOn: "2098-12-31" }, "endsOn", /cannot close before it opens/],
      [{ startsOn: "2099-02-30" }, "startsOn", /day of the calendar/],
      [{ rooms: [{ roomId: rooms[0], riskLevel: "high", sightRange: 0.2, doubleCover: false }] }, "rooms.0.sightRange", /at least 0.5 m/],
      [{ rooms: [{ roomId: rooms[0], riskLevel: "severe", sightRange: null, doubleCover: false }] }, "rooms.0.riskLevel", /standard or high/],
      [{ rooms: [good().rooms[0], good().rooms[0]] }, "rooms", /listed twice/],
      [{ name: "  " }, "name", /give the exhibition a name/],
    ] as const) {
      const answer = await create(operations, { ...good(), ...change });
      expect(answer.status, JSON.stringify(change)).toBe(422);
      expect(answer.body.error.field).toBe(field);
      expect(answer.body.error.message).toMatch(pattern);
    }
    const foreign = await create(operations, { ...good(), rooms: [{ roomId: otherRoom, riskLevel: "standard", sightRange: null, doubleCover: false }] });
    expect(foreign.status).toBe(422);
    expect(foreign.body.error.message).toMatch(/not a room of this site/);
    expect(await count()).toBe(0);
  });

  it("creates, reads and edits an exhibition with its rooms; a taken name gets 409", async () => {
    const created = await create(operations, good());
    expect(created.status).toBe(201);
    const id = created.body.exhibition.id as number;
    expect(created.body.exhibition).toMatchObject({ name: NAME, startsOn: "2099-01-04", endsOn: "2099-03-01" });
    expect(created.body.exhibition.rooms).toEqual([
      { roomId: rooms[0], riskLevel: "high", sightRange: 12, doubleCover: false },
      { roomId: rooms[1], riskLevel: "standard", sightRange: null, doubleCover: true },
    ]);
    expect((await create(operations, good())).status).toBe(409);
    const edited = await update(operations, id, { name: NAME, startsOn: "2099-01-04", endsOn: "2099-02-01", rooms: [{ roomId: rooms[1], riskLevel: "high", sightRange: 8.5, doubleCover: false }] });
    expect(edited.status).toBe(200);
    const read = await GET(await signedRequest(operations, `http://127.0.0.1/api/exhibitions/${id}`), { params: Promise.resolve({ id: String(id) }) });
    const body = (await read.json()) as { exhibition: Record<string, unknown> };
    expect(body.exhibition).toMatchObject({ endsOn: "2099-02-01", rooms: [{ roomId: rooms[1], riskLevel: "high", sightRange: 8.5, doubleCover: false }] });
    expect((await update(curator, id, { name: "x", startsOn: "2099-01-04", endsOn: "2099-02-01", rooms: [] })).status).toBe(403);
    expect((await update(operations, 2_000_000_000, { name: "x", startsOn: "2099-01-04", endsOn: "2099-02-01", rooms: [] })).status).toBe(404);
  });
});
