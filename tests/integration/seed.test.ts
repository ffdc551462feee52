// The demo seed fills an empty database with the demo museum, and seeding again (or twice at
// once) changes nothing.
import { describe, expect, it } from "vitest";
import bcrypt from "bcryptjs";
import { sql, type Kysely } from "kysely";
import { migrateToLatest } from "@/db/migrator";
import type { Database } from "@/db/schema";
import { DEMO_ACCOUNTS, DEMO_PASSWORD, EXHIBITION, FLOORS, GUARDS, SITE, seedDemoMuseum } from "@/db/seed";
import { withScratchDatabase } from "./support/database";

const TABLES = ["users", "sites", "floors", "rooms", "exhibitions", "exhibition_rooms", "guards"] as const;

/** Row count and a digest of every row's content, per table: equal snapshots = nothing changed. */
async function snapshot(db: Kysely<Database>): Promise<Record<string, { count: number; digest: string }>> {
  const result: Record<string, { count: number; digest: string }> = {};
  for (const table of TABLES) {
    const { rows } = await sql<{ count: string; digest: string | null }>`
      select count(*) as count, md5(string_agg(t::text, '|' order by t::text)) as digest from ${sql.table(table)} t`.execute(db);
    result[table] = { count: Number(rows[0].count), digest: rows[0].digest ?? "" };
  }
  return result;
}

describe("demo seed", () => {
  it("fills an empty database, and a second seed changes nothing", async () => {
    await withScratchDatabase("seed", async (db) => {
      await migrateToLatest(db);
      const first = await seedDemoMuseum(db);
      const rooms = FLOORS.reduce((n, f) => n + f.rooms.length, 0);
      const people = new Set([...DEMO_ACCOUNTS.map((a) => a.email), ...GUARDS.map((g) => g.email)]).size;
      expect(first).toEqual({
        users: people, sites: 1, floors: FLOORS.length, rooms, exhibitions: 1, exhibitionRooms: EXHIBITION.rooms.length, guards: GUARDS.length,
      });
      const before = await snapshot(db);
      expect(before.users.count).toBe(people);
      expect(before.rooms.count).toBe(rooms);

      const second = await seedDemoMuseum(db);
      expect(second).toEqual({ users: 0, sites: 0, floors: 0, rooms: 0, exhibitions: 0, exhibitionRooms: 0, guards: 0 });
      expect(await snapshot(db)).toEqual(before);

      // --if-empty leaves a database with users alone.
      expect(await seedDemoMuseum(db, { ifEmpty: true })).toBeNull();
      expect(await snapshot(db)).toEqual(before);
    });
  });

  it("stores what the seed data says, and the demo accounts sign in with the demo password", async () => {
    await withScratchDatabase("seedcontent", async (db) => {
      await migrateToLatest(db);
      await seedDemoMuseum(db);
      const site = await db.selectFrom("sites").selectAll().executeTakeFirstOrThrow();
      expect(site).toMatchObject({ name: SITE.name, time_zone: "Europe/Berlin", hourly_rate: 22 });
      expect(site.opening_hours).toEqual(SITE.opening_hours);

      const stored = await db
        .selectFrom("rooms")
        .innerJoin("floors", "floors.id", "rooms.floor_id")
        .select(["floors.name as floor", "rooms.name", "rooms.outline", "rooms.obstacles", "rooms.version"])
        .execute();
      for (const floor of FLOORS) {
        for (const room of floor.rooms) {
          const row = stored.find((r) => r.floor === floor.name && r.name === room.name);
          expect(row, `${floor.name} / ${room.name}`).toBeDefined();
          expect(row!.outline).toEqual(room.outline);
          expect(row!.obstacles).toEqual(room.obstacles);
          expect(row!.version).toBe(1);
        }
      }

      const exhibition = await db.selectFrom("exhibitions").selectAll().executeTakeFirstOrThrow();
      expect(exhibition).toMatchObject({ starts_on: EXHIBITION.starts_on, ends_on: EXHIBITION.ends_on });

      for (const account of DEMO_ACCOUNTS) {
        const user = await db.selectFrom("users").selectAll().where("email", "=", account.email).executeTakeFirstOrThrow();
        expect(user.role).toBe(account.role);
        expect(await bcrypt.compare(DEMO_PASSWORD, user.password_hash)).toBe(true);
        expect(await bcrypt.compare("wrong-password", user.password_hash)).toBe(false);
      }
      // Every guard has a guard account of its own; guard@example.org is one of them.
      const guards = await db
        .selectFrom("guards")
        .innerJoin("users", "users.id", "guards.user_id")
        .select(["guards.email", "users.email as user_email", "users.role"])
        .execute();
      expect(guards).toHaveLength(GUARDS.length);
      for (const g of guards) {
        expect(g.user_email).toBe(g.email);
        expect(g.role).toBe("guard");
      }
      expect(guards.map((g) => g.email)).toContain("guard@example.org");
    });
  });

  it("two seeds at once still give one museum", async () => {
    await withScratchDatabase("seedrace", async (db) => {
      await migrateToLatest(db);
      await Promise.all([seedDemoMuseum(db), seedDemoMuseum(db)]);
      const counts = await snapshot(db);
      expect(counts.sites.count).toBe(1);
      expect(counts.guards.count).toBe(GUARDS.length);
      expect(counts.rooms.count).toBe(FLOORS.reduce((n, f) => n + f.rooms.length, 0));
    });
  });
});
