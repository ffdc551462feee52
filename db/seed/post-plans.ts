// Approved post plans for every room of the demo exhibition, computed at seed time by the real
// planner (the fewest plan with a short time limit; the guaranteed plan if that does not cover), so
// a roster can be built in the demo. Idempotent: a room of the exhibition that already has an
// approved plan is left alone, so seeding again never replaces a plan someone approved.
import { sql, type Kysely } from "kysely";
import type { Database } from "../schema";
import { insertProposedPlan } from "../queries/post-plans";
import { planPostPlan } from "../../lib/guarding/plan-room";
import { EXHIBITION, SITE } from "./museum";

/** Solver seconds per room: four rooms stay well under the seed's budget of ~20 s. */
export const SEED_PLAN_SECONDS = 1.5;
/** The demo account that approves the seeded plans. */
export const SEED_APPROVER = "operations@example.org";

/** Seeds the plans; returns how many it approved (0 when every room already had one). */
export async function seedPostPlans(db: Kysely<Database>): Promise<number> {
  return db.transaction().execute(async (trx) => {
    await sql`select pg_advisory_xact_lock(hashtext('sightward demo post plans'))`.execute(trx);
    const exhibition = await trx
      .selectFrom("exhibitions")
      .innerJoin("sites", "sites.id", "exhibitions.site_id")
      .select("exhibitions.id")
      .where("sites.name", "=", SITE.name)
      .where("exhibitions.name", "=", EXHIBITION.name)
      .executeTakeFirst();
    // A database that is not the demo museum (seeded with --if-empty over real data) gets no plans.
    if (!exhibition) return 0;
    const approver = await trx.selectFrom("users").select("id").where("email", "=", SEED_APPROVER).executeTakeFirst();
    const rooms = await trx
      .selectFrom("exhibition_rooms")
      .innerJoin("rooms", "rooms.id", "exhibition_rooms.room_id")
      .select(["rooms.id", "rooms.name", "rooms.outline", "rooms.obstacles", "rooms.version", "exhibition_rooms.sight_range", "exhibition_rooms.double_cover"])
      .where("exhibition_rooms.exhibition_id", "=", exhibition.id)
      .where((eb) =>
        eb.not(
          eb.exists(
            eb
              .selectFrom("post_plans")
              .select("post_plans.id")
              .whereRef("post_plans.room_id", "=", "rooms.id")
              .where("post_plans.exhibition_id", "=", exhibition.id)
              .where("post_plans.status", "=", "approved"),
          ),
        ),
      )
      .orderBy("rooms.id")
      .execute();
    let approved = 0;
    for (const room of rooms) {
      const options = { sightRange: room.sight_range, doubleCover: room.double_cover, pinned: [], forbidden: [] };
      const walls = { outline: room.outline, obstacles: room.obstacles };
      let outcome = planPostPlan(walls, { options, method: "fewest", timeLimit: SEED_PLAN_SECONDS });
      if (!outcome.ok || outcome.plan.covered < 1) outcome = planPostPlan(walls, { options, method: "guaranteed" });
      if (!outcome.ok || outcome.plan.covered < 1) {
        console.error(`seed: no covering post plan for ${room.name}; approve one on its room page`);
        continue;
      }
      const plan = await insertProposedPlan({ roomId: room.id, exhibitionId: exhibition.id, roomVersion: room.version, options, computed: outcome.plan }, trx);
      await trx
        .updateTable("post_plans")
        .set({ status: "approved", approved_by: approver?.id ?? null, approved_at: new Date() })
        .where("id", "=", plan.id)
        .execute();
      approved++;
    }
    return approved;
  });
}
