// The home page's "Next shift" panel against the real PostgreSQL that npm test starts
// (DATABASE_URL): once version 2 of a week is published, a shift only version 1 had must not show
// any more, so home agrees with My shifts (currentShiftsOfGuard), which goes by the latest version.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the module.
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb, db as appDb } from "@/db";
import type { Database } from "@/db/schema";
import { currentShiftsOfGuard } from "@/db/queries/rosters";
import { nextShiftOfGuard, shiftsOfGuard } from "@/app/(signed-in)/_queries/shifts";
import { requireDatabaseUrl } from "./support/database";
import { publishRosterDirectly } from "./support/rosters";

// A past week of its own (the other tests publish weeks ahead of today) and a guard of its own (no other shifts).
const WEEK = "2026-03-09";
const GUARD_EMAIL = "next-shift-test@example.org";
const BEFORE_WEEK = new Date("2026-03-08T00:00:00Z");
let db: Kysely<Database>;
let siteId: number;
let guardId: number;

/** Publishes a version of WEEK holding this test's guard's shifts. */
function publishVersion(version: number, supersedes: number | null, shifts: { starts_at: Date; ends_at: Date }[]) {
  return publishRosterDirectly(db, { siteId, startsOn: WEEK, version, supersedes }, shifts.map((s) => ({ ...s, guardId })));
}

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  const site = await db.selectFrom("sites").select(["id"]).orderBy("id").executeTakeFirstOrThrow();
  siteId = site.id;
  // A re-run on the same database starts clean (published rows may be deleted, never changed).
  await db.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "=", WEEK).execute();
  await db.deleteFrom("guards").where("email", "=", GUARD_EMAIL).execute();
  const guard = await db
    .insertInto("guards")
    .values({ site_id: siteId, name: "Next-shift test guard", email: GUARD_EMAIL, contract_hours: 30, max_hours: 40 })
    .returning("id")
    .executeTakeFirstOrThrow();
  guardId = guard.id;
});

afterAll(async () => {
  await db?.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "=", WEEK).execute();
  await db?.deleteFrom("guards").where("email", "=", GUARD_EMAIL).execute();
  await db?.destroy();
  await appDb.destroy();
});

describe("the home page's next shift", () => {
  it("follows the latest published version of the week, like My shifts", async () => {
    const monday = { starts_at: new Date("2026-03-09T09:00:00Z"), ends_at: new Date("2026-03-09T17:00:00Z") };
    const tuesday = { starts_at: new Date("2026-03-10T09:00:00Z"), ends_at: new Date("2026-03-10T17:00:00Z") };

    const v1 = await publishVersion(1, null, [monday, tuesday]);
    const fromV1 = await nextShiftOfGuard(guardId, BEFORE_WEEK);
    expect(fromV1).toMatchObject({ starts_at: monday.starts_at, roster_version: 1 });

    // Version 2 drops Monday's shift; version 1 stays in the table exactly as it was.
    await publishVersion(2, v1, [tuesday]);
    const next = await nextShiftOfGuard(guardId, BEFORE_WEEK);
    expect(next).toMatchObject({ starts_at: tuesday.starts_at, ends_at: tuesday.ends_at, roster_version: 2 });

    const listed = await shiftsOfGuard(guardId, BEFORE_WEEK);
    expect(listed.map((s) => [s.starts_at.toISOString(), s.roster_version])).toEqual([[tuesday.starts_at.toISOString(), 2]]);

    // Home and My shifts agree shift for shift.
    const myShifts = await currentShiftsOfGuard(db, guardId, BEFORE_WEEK);
    expect(listed.map((s) => s.id)).toEqual(myShifts.map((s) => s.id));
  });
});
