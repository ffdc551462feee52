// GET /api/rosters/[id]/csv in-process against the real PostgreSQL: a published roster downloads
// as a CSV attachment that papaparse (an independent parser from npm) reads back row for row,
// with guard names from the database and formula-like room names made text (OWASP CSV
// injection guidance); guards and signed-out callers are refused; bad ids are named.
import { vi } from "vitest";
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import Papa from "papaparse";
import type { Kysely } from "kysely";
import { sql } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { GET } from "@/app/api/rosters/[id]/csv/route";
import { localToInstant } from "@/lib/scheduling/time";
import { requireDatabaseUrl } from "./support/database";
import { mondayAhead } from "./support/rosters";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

const WEEK = mondayAhead(175);
let db: Kysely<Database>;
let rosterId: number;
let operations: SignedUser;
let guardUser: SignedUser;
let guards: { id: number; name: string }[];
let zone: string;

const download = async (user: SignedUser | null, id: string) => {
  const response = await GET(await signedRequest(user, `http://127.0.0.1/api/rosters/${id}/csv`), { params: Promise.resolve({ id }) });
  return response;
};

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  operations = await userByEmail(db, "operations@example.org");
  guardUser = await userByEmail(db, "guard@example.org");
  const site = await db.selectFrom("sites").select(["id", "time_zone"]).orderBy("id").executeTakeFirstOrThrow();
  zone = site.time_zone;
  guards = await db.selectFrom("guards").select(["id", "name"]).where("site_id", "=", site.id).orderBy("id").limit(2).execute();
  const t = (clock: string) => new Date(localToInstant(zone, WEEK, clock)).toISOString();
  const scenario = {
    timezone: zone,
    start: WEEK,
    opening: { weekly: { mon: ["09:00", "17:00"] } },
    posts: [
      { id: "R1-P1", room: "Textile Gallery" },
      { id: "R2-P1", room: "@Sculpture, east" },
    ],
    guards: guards.map((g) => ({ id: `G${g.id}` })),
  };
  rosterId = await db.transaction().execute(async (trx) => {
    const { id } = await trx
      .insertInto("rosters")
      .values({ site_id: site.id, starts_on: WEEK, days: 7, status: "published", version: 1, published_at: sql<Date>`now()`, scenario: JSON.stringify(scenario), unfilled: "[]", violations: "[]" })
      .returning("id")
      .executeTakeFirstOrThrow();
    await trx
      .insertInto("shifts")
      .values([
        {
          roster_id: id,
          guard_id: guards[0]!.id,
          starts_at: new Date(t("09:00")),
          ends_at: new Date(t("15:00")),
          segments: JSON.stringify([
            { post: "R1-P1", start: t("09:00"), end: t("11:00") },
            { post: "R2-P1", start: t("11:00"), end: t("12:00") },
            { post: "R1-P1", start: t("13:00"), end: t("15:00") },
          ]),
          breaks: JSON.stringify([{ start: t("12:00"), end: t("13:00") }]),
        },
        {
          roster_id: id,
          guard_id: guards[1]!.id,
          starts_at: new Date(t("10:00")),
          ends_at: new Date(t("14:00")),
          segments: JSON.stringify([{ post: "R2-P1", start: t("10:00"), end: t("14:00") }]),
          breaks: "[]",
        },
      ])
      .execute();
    return id;
  });
});

afterAll(async () => {
  await db?.destroy();
});

describe("GET /api/rosters/[id]/csv", () => {
  it("downloads a CSV attachment that papaparse reads back, one row per assignment", async () => {
    const response = await download(operations, String(rosterId));
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(response.headers.get("content-disposition")).toBe(`attachment; filename="roster-${WEEK}-v1.csv"`);
    const parsed = Papa.parse<Record<string, string>>(await response.text(), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual(["date", "start", "end", "guard", "post", "room", "break"]);
    const [first, second] = guards.map((g) => g.name);
    expect(parsed.data.map((r) => [r.date, r.start, r.end, r.guard, r.room, r.break])).toEqual([
      [WEEK, "09:00", "11:00", first, "Textile Gallery", "no"],
      [WEEK, "10:00", "14:00", second, "'@Sculpture, east", "no"],
      [WEEK, "11:00", "12:00", first, "'@Sculpture, east", "no"],
      [WEEK, "12:00", "13:00", first, "", "yes"],
      [WEEK, "13:00", "15:00", first, "Textile Gallery", "no"],
    ]);
    expect(parsed.data[0]!.post).toBe("Textile Gallery · post 1");
  });

  it("refuses signed-out callers (401) and guards (403)", async () => {
    expect((await download(null, String(rosterId))).status).toBe(401);
    const refused = await download(guardUser, String(rosterId));
    expect(refused.status).toBe(403);
    expect(((await refused.json()) as { error: { message: string } }).error.message).toMatch(/staffing:view/);
  });

  it("names a bad id (400) and an unknown roster (404)", async () => {
    const bad = await download(operations, "abc");
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { field: string } }).error.field).toBe("id");
    expect((await download(operations, "987654321")).status).toBe(404);
  });
});
