// Migrations run up from an empty database to the latest schema, twice without change, and back
// down to empty; the constraints of the database contract (/tmp/sw/schema.md, README) hold.
import { describe, expect, it } from "vitest";
import { sql, type Kysely } from "kysely";
import { migrateToLatest, migratorFor } from "@/db/migrator";
import { toJson, type Database } from "@/db/schema";
import { requireDatabaseUrl, withScratchDatabase } from "./support/database";

const CONTRACT_TABLES = ["users", "sites", "floors", "rooms", "exhibitions", "exhibition_rooms", "guards", "rosters", "shifts"];

async function tableNames(db: Kysely<Database>): Promise<string[]> {
  const { rows } = await sql<{ table_name: string }>`
    select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE'`.execute(db);
  return rows.map((r) => r.table_name).sort();
}

async function columns(db: Kysely<Database>, table: string): Promise<Record<string, string>> {
  const { rows } = await sql<{ column_name: string; data_type: string }>`
    select column_name, data_type from information_schema.columns where table_schema = 'public' and table_name = ${table}`.execute(db);
  return Object.fromEntries(rows.map((r) => [r.column_name, r.data_type]));
}

describe("migrations", () => {
  it("needs the real database", () => {
    expect(requireDatabaseUrl()).toMatch(/^postgres(ql)?:\/\//);
  });

  it("run up from empty to the contract's tables, then down to empty", async () => {
    await withScratchDatabase("migrations", async (db) => {
      expect(await tableNames(db)).toEqual([]);

      const first = await migrateToLatest(db);
      expect(first.results?.map((r) => r.status)).not.toContain("Error");
      expect(first.results?.[0]?.migrationName).toBe("0001_foundation");
      const tables = await tableNames(db);
      for (const table of CONTRACT_TABLES) expect(tables).toContain(table);

      // Column types as the contract states them.
      expect(await columns(db, "users")).toMatchObject({
        id: "integer", email: "text", name: "text", password_hash: "text", role: "text", created_at: "timestamp with time zone",
      });
      expect(await columns(db, "sites")).toMatchObject({ time_zone: "text", hourly_rate: "numeric", opening_hours: "jsonb" });
      expect(await columns(db, "rooms")).toMatchObject({ outline: "jsonb", obstacles: "jsonb", version: "integer" });
      expect(await columns(db, "exhibitions")).toMatchObject({ starts_on: "date", ends_on: "date" });
      expect(await columns(db, "exhibition_rooms")).toMatchObject({ risk_level: "text", sight_range: "numeric", double_cover: "boolean" });
      expect(await columns(db, "guards")).toMatchObject({ contract_hours: "numeric", max_hours: "numeric", skills: "ARRAY" });
      expect(await columns(db, "shifts")).toMatchObject({ starts_at: "timestamp with time zone", segments: "jsonb", breaks: "jsonb" });

      // A second run finds nothing to do.
      const second = await migrateToLatest(db);
      expect(second.results).toEqual([]);

      // Down, one migration at a time, leaves only Kysely's own bookkeeping tables.
      const migrator = migratorFor(db);
      for (let step = 0; step < 100; step++) {
        const { error, results } = await migrator.migrateDown();
        expect(error).toBeUndefined();
        if (!results || results.length === 0) break;
      }
      expect((await tableNames(db)).filter((t) => !t.startsWith("kysely_"))).toEqual([]);
    });
  });

  it("enforce the contract's rules in the database itself", async () => {
    await withScratchDatabase("constraints", async (db) => {
      await migrateToLatest(db);
      const user = { name: "Test Person", password_hash: "x" };
      await expect(db.insertInto("users").values({ ...user, email: "boss@example.org", role: "boss" as never }).execute()).rejects.toThrow(/check constraint/);
      await expect(db.insertInto("users").values({ ...user, email: "Mixed@Example.org", role: "admin" }).execute()).rejects.toThrow(/check constraint/);
      const inserted = await db.insertInto("users").values({ ...user, email: "one@example.org", role: "curator" }).returningAll().executeTakeFirstOrThrow();
      expect(inserted.id).toBeGreaterThan(0);
      expect(inserted.created_at).toBeInstanceOf(Date);
      await expect(db.insertInto("users").values({ ...user, email: "one@example.org", role: "admin" }).execute()).rejects.toThrow(/unique/);
      // Identity columns are generated always: a given id is refused.
      await expect(
        sql`insert into users (id, email, name, password_hash, role) values (999, 'two@example.org', 'x', 'x', 'admin')`.execute(db),
      ).rejects.toThrow(/generated always|cannot insert/i);

      const site = await db
        .insertInto("sites")
        .values({ name: "Scratch Site", time_zone: "Europe/Berlin", hourly_rate: "22.50", opening_hours: toJson({ weekly: {}, dates: {} }) })
        .returningAll()
        .executeTakeFirstOrThrow();
      // numeric reads back as a number, dates as YYYY-MM-DD text (db/index.ts type parsers).
      expect(site.hourly_rate).toBe(22.5);
      const exhibition = await db
        .insertInto("exhibitions")
        .values({ site_id: site.id, name: "E", starts_on: "2026-10-15", ends_on: "2027-02-28" })
        .returningAll()
        .executeTakeFirstOrThrow();
      expect(exhibition.starts_on).toBe("2026-10-15");
      await expect(
        db.insertInto("exhibitions").values({ site_id: site.id, name: "Backwards", starts_on: "2027-01-02", ends_on: "2027-01-01" }).execute(),
      ).rejects.toThrow(/check constraint/);

      const floor = await db.insertInto("floors").values({ site_id: site.id, name: "G", level: 0 }).returning("id").executeTakeFirstOrThrow();
      const room = await db
        .insertInto("rooms")
        .values({ floor_id: floor.id, name: "R", outline: toJson([[0, 0], [4, 0], [4, 3]]) })
        .returningAll()
        .executeTakeFirstOrThrow();
      expect(room.version).toBe(1);
      expect(room.obstacles).toEqual([]);
      expect(room.outline).toEqual([[0, 0], [4, 0], [4, 3]]);
      await expect(
        db.insertInto("exhibition_rooms").values({ exhibition_id: exhibition.id, room_id: room.id, risk_level: "extreme" as never }).execute(),
      ).rejects.toThrow(/check constraint/);

      // Deleting a roster deletes its shifts.
      const guard = await db
        .insertInto("guards")
        .values({ site_id: site.id, name: "G. Uard", email: "g@example.org", contract_hours: 40 })
        .returningAll()
        .executeTakeFirstOrThrow();
      expect(guard.max_hours).toBe(48);
      expect(guard.skills).toEqual([]);
      const roster = await db.insertInto("rosters").values({ site_id: site.id, starts_on: "2027-03-22", days: 7 }).returningAll().executeTakeFirstOrThrow();
      expect(roster.status).toBe("draft");
      await db
        .insertInto("shifts")
        .values({ roster_id: roster.id, guard_id: guard.id, starts_at: "2027-03-23T09:00:00Z", ends_at: "2027-03-23T17:00:00Z" })
        .execute();
      await db.deleteFrom("rosters").where("id", "=", roster.id).execute();
      const { count } = await db.selectFrom("shifts").select((eb) => eb.fn.countAll<string>().as("count")).executeTakeFirstOrThrow();
      expect(Number(count)).toBe(0);
    });
  });
});
