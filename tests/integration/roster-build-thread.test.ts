// Building a week's draft (the roster-build job) against the real PostgreSQL that npm test starts
// (DATABASE_URL): the staffing engine runs in a worker thread, so while it computes, the process
// that runs the job keeps answering. Checked without any clock: a chain of sequential database
// round trips, started when the job reports "staffing", all complete before the job reports
// "storing the draft". With the engine on the main thread, none of them could (its computation is
// synchronous once HiGHS is loaded, and HiGHS is loaded beforehand here). The draft must also be
// the very roster the engine gives in-process: the engine is deterministic ("the same input gives
// the same roster", lib/scheduling/engine.ts).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql, type Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { buildDraftRoster, scenarioForWeek } from "@/lib/rosters/build";
import { storedRoster } from "@/lib/rosters/stored";
import { buildRoster } from "@/lib/scheduling/engine";
import { loadHighs } from "@/lib/solver/highs";
import { requireDatabaseUrl } from "./support/database";
import { mondayAhead } from "./support/rosters";

// A week inside the seeded exhibition (which runs 26 weeks past the seeding day) that no other test
// builds: the Monday ten to eleven weeks ahead (the other tests take weeks one to about eight ahead).
const WEEK = mondayAhead(70);
const ROUND_TRIPS = 20;
let db: Kysely<Database>;
let siteId: number;

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 4 });
  siteId = (await db.selectFrom("sites").select("id").orderBy("id").executeTakeFirstOrThrow()).id;
  await db.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "=", WEEK).execute();
  // HiGHS loaded on this thread now, so an in-process engine would have no await left to yield at.
  await loadHighs();
});

afterAll(async () => {
  await db?.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "=", WEEK).execute();
  await db?.destroy();
});

describe("building a week's draft in the engine's own thread", () => {
  it("keeps answering database queries while the engine computes, and stores the engine's roster", async () => {
    const messages: string[] = [];
    let roundTripsDone = 0;
    let roundTripsAtStoring: number | null = null;
    let chain: Promise<void> = Promise.resolve();
    const progress = async (_fraction: number, message: string) => {
      messages.push(message);
      if (message.startsWith("staffing") && messages.filter((m) => m.startsWith("staffing")).length === 1) {
        chain = (async () => {
          for (let i = 0; i < ROUND_TRIPS; i++) {
            await sql`select 1`.execute(db);
            roundTripsDone++;
          }
        })();
      }
      if (message === "storing the draft") roundTripsAtStoring = roundTripsDone;
    };

    const outcome = await buildDraftRoster(db, { siteId, startsOn: WEEK, userId: null }, progress);
    await chain;
    expect(messages[0]).toBe("reading posts, guards and time off");
    expect(roundTripsAtStoring).toBe(ROUND_TRIPS);

    const { scenario } = await scenarioForWeek(db, siteId, WEEK);
    const expected = storedRoster((await buildRoster(scenario)).roster).shifts;
    const draft = await db
      .selectFrom("shifts")
      .select(["guard_id", "starts_at", "ends_at", "segments", "breaks"])
      .where("roster_id", "=", outcome.rosterId)
      .orderBy("starts_at")
      .orderBy("guard_id")
      .orderBy("id")
      .execute();
    expect(draft.length).toBe(outcome.shifts);
    const key = (s: { guard_id: number; starts_at: Date; ends_at: Date }) => `${s.starts_at.toISOString()} ${s.guard_id} ${s.ends_at.toISOString()}`;
    expect(draft.map(key).sort()).toEqual(expected.map(key).sort());
  });
});
