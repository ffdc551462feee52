// Seeds the demo museum. Idempotent: every row is found by its natural key (site name; floor,
// room and exhibition name within their parent; e-mail for users and guards) and inserted only
// when missing, so seeding twice changes nothing and never overwrites an edit.
import { SEED_PASSWORD_COST, hashPassword } from "../../lib/auth/passwords";
import { sql, type Kysely, type Transaction } from "kysely";
import { toJson, type Database, type Role } from "../schema";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "./accounts";
import { EXHIBITION, FLOORS, GUARDS, SITE } from "./museum";
import { seedPostPlans } from "./post-plans";

export { DEMO_ACCOUNTS, DEMO_PASSWORD } from "./accounts";
export { SITE, FLOORS, EXHIBITION, GUARDS, SKILLS } from "./museum";

/** How many rows of each kind this run inserted (all zero on a second run). */
export interface SeedReport {
  users: number;
  sites: number;
  floors: number;
  rooms: number;
  exhibitions: number;
  exhibitionRooms: number;
  guards: number;
  /** Approved post plans added (only with the postPlans option). */
  postPlans?: number;
}

async function findOrInsert<T>(find: () => Promise<T | undefined>, insert: () => Promise<T>): Promise<[T, boolean]> {
  const found = await find();
  return found !== undefined ? [found, false] : [await insert(), true];
}

async function seedIn(trx: Transaction<Database>, passwordHash: () => Promise<string>): Promise<SeedReport> {
  const report: SeedReport = { users: 0, sites: 0, floors: 0, rooms: 0, exhibitions: 0, exhibitionRooms: 0, guards: 0 };

  const [site, siteAdded] = await findOrInsert(
    () => trx.selectFrom("sites").select("id").where("name", "=", SITE.name).orderBy("id").executeTakeFirst(),
    () =>
      trx
        .insertInto("sites")
        .values({ ...SITE, opening_hours: toJson(SITE.opening_hours) })
        .returning("id")
        .executeTakeFirstOrThrow(),
  );
  report.sites += Number(siteAdded);

  const roomIds = new Map<string, number>();
  for (const floor of FLOORS) {
    const [floorRow, floorAdded] = await findOrInsert(
      () =>
        trx.selectFrom("floors").select("id").where("site_id", "=", site.id).where("name", "=", floor.name).executeTakeFirst(),
      () =>
        trx
          .insertInto("floors")
          .values({ site_id: site.id, name: floor.name, level: floor.level })
          .returning("id")
          .executeTakeFirstOrThrow(),
    );
    report.floors += Number(floorAdded);
    for (const room of floor.rooms) {
      const [roomRow, roomAdded] = await findOrInsert(
        () =>
          trx.selectFrom("rooms").select("id").where("floor_id", "=", floorRow.id).where("name", "=", room.name).executeTakeFirst(),
        () =>
          trx
            .insertInto("rooms")
            .values({ floor_id: floorRow.id, name: room.name, outline: toJson(room.outline), obstacles: toJson(room.obstacles) })
            .returning("id")
            .executeTakeFirstOrThrow(),
      );
      report.rooms += Number(roomAdded);
      roomIds.set(room.name, roomRow.id);
    }
  }

  const [exhibition, exhibitionAdded] = await findOrInsert(
    () =>
      trx.selectFrom("exhibitions").select("id").where("site_id", "=", site.id).where("name", "=", EXHIBITION.name).executeTakeFirst(),
    () =>
      trx
        .insertInto("exhibitions")
        .values({ site_id: site.id, name: EXHIBITION.name, starts_on: EXHIBITION.starts_on, ends_on: EXHIBITION.ends_on })
        .returning("id")
        .executeTakeFirstOrThrow(),
  );
  report.exhibitions += Number(exhibitionAdded);
  for (const entry of EXHIBITION.rooms) {
    const roomId = roomIds.get(entry.room);
    if (roomId === undefined) throw new Error(`exhibition room "${entry.room}" is not among the seeded rooms`);
    const added = await trx
      .insertInto("exhibition_rooms")
      .values({
        exhibition_id: exhibition.id,
        room_id: roomId,
        risk_level: entry.risk_level,
        sight_range: entry.sight_range,
        double_cover: entry.double_cover,
      })
      .onConflict((oc) => oc.columns(["exhibition_id", "room_id"]).doNothing())
      .executeTakeFirst();
    report.exhibitionRooms += Number(added.numInsertedOrUpdatedRows ?? 0n);
  }

  // Demo accounts first, then one guard account per seeded guard (guard@example.org is both).
  const people = new Map<string, { name: string; role: Role }>();
  for (const account of DEMO_ACCOUNTS) people.set(account.email, { name: account.name, role: account.role });
  for (const g of GUARDS) if (!people.has(g.email)) people.set(g.email, { name: g.name, role: "guard" });
  const known = new Set((await trx.selectFrom("users").select("email").execute()).map((row) => row.email));
  const newPeople = [...people].filter(([email]) => !known.has(email));
  const hashes = await Promise.all(newPeople.map(() => passwordHash()));
  const addedUsers = newPeople.length === 0 ? [] : await trx
    .insertInto("users")
    .values(newPeople.map(([email, person], i) => ({ email, name: person.name, role: person.role, password_hash: hashes[i] })))
    .onConflict((oc) => oc.column("email").doNothing())
    .returning("id")
    .execute();
  report.users += addedUsers.length;

  const userIds = new Map(
    (await trx.selectFrom("users").select(["id", "email"]).where("email", "in", GUARDS.map((g) => g.email)).execute()).map(
      (u) => [u.email, u.id] as const,
    ),
  );
  const existingGuards = new Set(
    (await trx.selectFrom("guards").select("email").where("site_id", "=", site.id).execute()).map((g) => g.email),
  );
  const linkedUsers = new Set(
    (await trx.selectFrom("guards").select("user_id").where("user_id", "is not", null).execute()).map((g) => g.user_id),
  );
  const newGuards = GUARDS.filter((g) => !existingGuards.has(g.email));
  if (newGuards.length > 0) {
    await trx
      .insertInto("guards")
      .values(
        newGuards.map((g) => {
          const userId = userIds.get(g.email) ?? null;
          return {
            site_id: site.id,
            user_id: userId !== null && !linkedUsers.has(userId) ? userId : null,
            name: g.name,
            email: g.email,
            contract_hours: g.contract_hours,
            max_hours: g.max_hours,
            skills: g.skills,
          };
        }),
      )
      .execute();
    report.guards += newGuards.length;
  }
  return report;
}

/**
 * Seeds the demo museum in one transaction (all or nothing), serialised by an advisory lock so
 * two seeders never race. With `ifEmpty`, does nothing when any user exists.
 */
export async function seedDemoMuseum(
  db: Kysely<Database>,
  options: { ifEmpty?: boolean; postPlans?: boolean } = {},
): Promise<SeedReport | null> {
  // Each account its own hash and salt; cost SEED_PASSWORD_COST (lib/auth/passwords.ts) keeps the
  // seed quick, and a seeded hash is upgraded to the full cost at the account's first sign-in.
  const passwordHash = () => hashPassword(DEMO_PASSWORD, SEED_PASSWORD_COST);
  const report = await db.transaction().execute(async (trx) => {
    await sql`select pg_advisory_xact_lock(hashtext('sightward demo seed'))`.execute(trx);
    if (options.ifEmpty) {
      const anyUser = await trx.selectFrom("users").select("id").limit(1).executeTakeFirst();
      if (anyUser) return null;
    }
    return seedIn(trx, passwordHash);
  });
  // Post plans run the planner (seconds), so they come after the museum, in their own transaction.
  if (options.postPlans) {
    const added = await seedPostPlans(db);
    if (report) report.postPlans = added;
  }
  return report;
}
