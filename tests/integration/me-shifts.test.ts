// GET /api/me/shifts in-process against the real PostgreSQL: a guard reads their own shifts of
// the latest published version only (never a draft, never a superseded version, never another
// guard's), the range is zod-checked (dates, order, at most 93 days) and no guard id is accepted.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the modules.
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { GET } from "@/app/api/me/shifts/route";
import { requireDatabaseUrl } from "./support/database";
import { mondayAhead, publishRosterDirectly } from "./support/rosters";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

// A week far ahead that no other test of this database builds or publishes.
const WEEK = mondayAhead(161);
const day = (n: number) => new Date(Date.parse(`${WEEK}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
let db: Kysely<Database>;
let mara: SignedUser;
let other: SignedUser;
let operations: SignedUser;
let maraGuard: number;
let otherGuard: number;
let zone: string;

const ask = async (user: SignedUser | null, query: string) => {
  const response = await GET(await signedRequest(user, `http://127.0.0.1/api/me/shifts?${query}`), { params: Promise.resolve({}) });
  return { status: response.status, body: (await response.json()) as Record<string, any> };
};
const at = (date: string, hour: number) => new Date(`${date}T${String(hour).padStart(2, "0")}:00:00Z`);

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  mara = await userByEmail(db, "guard@example.org");
  operations = await userByEmail(db, "operations@example.org");
  const guards = await db.selectFrom("guards").innerJoin("users", "users.id", "guards.user_id").select(["guards.id", "guards.site_id", "users.email"]).orderBy("guards.id").execute();
  const maraRow = guards.find((g) => g.email === "guard@example.org")!;
  const otherRow = guards.find((g) => g.email !== "guard@example.org" && g.site_id === maraRow.site_id)!;
  maraGuard = maraRow.id;
  otherGuard = otherRow.id;
  other = await userByEmail(db, otherRow.email);
  zone = (await db.selectFrom("sites").select("time_zone").where("id", "=", maraRow.site_id).executeTakeFirstOrThrow()).time_zone;
  // Version 1 gives Mara Monday; version 2 (current) gives her Tuesday and Thursday, the other guard Tuesday.
  const v1 = await publishRosterDirectly(db, { siteId: maraRow.site_id, startsOn: WEEK, version: 1 }, [{ guardId: maraGuard, starts_at: at(day(0), 9), ends_at: at(day(0), 17) }]);
  await publishRosterDirectly(db, { siteId: maraRow.site_id, startsOn: WEEK, version: 2, supersedes: v1 }, [
    { guardId: maraGuard, starts_at: at(day(1), 9), ends_at: at(day(1), 17) },
    { guardId: otherGuard, starts_at: at(day(1), 10), ends_at: at(day(1), 18) },
    { guardId: maraGuard, starts_at: at(day(3), 9), ends_at: at(day(3), 17) },
  ]);
  // A draft of the week after: drafts may still change, so guards never see them.
  const draft = await db
    .insertInto("rosters")
    .values({ site_id: maraRow.site_id, starts_on: day(7), days: 7, status: "draft", unfilled: "[]", violations: "[]" })
    .returning("id")
    .executeTakeFirstOrThrow();
  await db.insertInto("shifts").values({ roster_id: draft.id, guard_id: maraGuard, starts_at: at(day(8), 9), ends_at: at(day(8), 17), segments: "[]", breaks: "[]" }).execute();
});

afterAll(async () => {
  await db?.destroy();
});

describe("GET /api/me/shifts", () => {
  it("answers the guard's own shifts of the latest published version, not drafts or superseded ones", async () => {
    const { status, body } = await ask(mara, `from=${day(0)}&to=${day(13)}`);
    expect(status).toBe(200);
    expect(body.guard.id).toBe(maraGuard);
    expect(body.timeZone).toBe(zone);
    const starts = body.shifts.map((s: { start: string }) => s.start);
    expect(starts).toEqual([at(day(1), 9).toISOString(), at(day(3), 9).toISOString()]);
    expect(body.shifts.every((s: { rosterVersion: number }) => s.rosterVersion === 2)).toBe(true);
  });

  it("gives another guard only their own shift of the same week", async () => {
    const { status, body } = await ask(other, `from=${day(0)}&to=${day(6)}`);
    expect(status).toBe(200);
    expect(body.guard.id).toBe(otherGuard);
    expect(body.shifts.map((s: { start: string }) => s.start)).toEqual([at(day(1), 10).toISOString()]);
  });

  it("keeps to the asked dates", async () => {
    const { body } = await ask(mara, `from=${day(3)}&to=${day(3)}`);
    expect(body.shifts.map((s: { start: string }) => s.start)).toEqual([at(day(3), 9).toISOString()]);
  });

  it("refuses a guard id in the query: nobody reads another guard's shifts here", async () => {
    const { status, body } = await ask(mara, `from=${day(0)}&to=${day(6)}&guardId=${otherGuard}`);
    expect(status).toBe(400);
    expect(body.error.message).toMatch(/own shifts/);
    expect(JSON.stringify(body)).not.toContain(at(day(1), 10).toISOString());
  });

  it("accepts 93 days and refuses 94, naming the field", async () => {
    expect((await ask(mara, `from=${day(0)}&to=${day(92)}`)).status).toBe(200);
    const { status, body } = await ask(mara, `from=${day(0)}&to=${day(93)}`);
    expect(status).toBe(400);
    expect(body.error.field).toBe("to");
    expect(body.error.message).toMatch(/at most 93 days/);
  });

  it("refuses a missing, malformed or reversed range with the field", async () => {
    const missing = await ask(mara, `to=${day(3)}`);
    expect([missing.status, missing.body.error.field]).toEqual([400, "from"]);
    const malformed = await ask(mara, `from=${day(0)}&to=2027-02-30`);
    expect([malformed.status, malformed.body.error.field]).toEqual([400, "to"]);
    const reversed = await ask(mara, `from=${day(3)}&to=${day(0)}`);
    expect([reversed.status, reversed.body.error.field]).toEqual([400, "to"]);
    expect(reversed.body.error.message).toMatch(/before from/);
  });

  it("answers 401 signed out and 403 for a manager role", async () => {
    expect((await ask(null, `from=${day(0)}&to=${day(6)}`)).status).toBe(401);
    const refused = await ask(operations, `from=${day(0)}&to=${day(6)}`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/shifts:own/);
  });
});
