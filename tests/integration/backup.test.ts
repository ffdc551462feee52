// npm run backup / npm run restore (scripts/backup.ts): a dump of the test database restored into a
// fresh database holds the same museum; a file that is not a dump is refused and changes nothing.
// The tools are PostgreSQL's pg_dump and pg_restore (custom format, PostgreSQL documentation).
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { sql, type Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { requireDatabaseUrl, withScratchDatabase } from "./support/database";

const folder = mkdtempSync(join(tmpdir(), "sightward-backup-"));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function npmRun(command: "backup" | "restore", url: string, file?: string) {
  const result = spawnSync("npx", ["tsx", "scripts/backup.ts", command, ...(file ? [file] : [])], {
    encoding: "utf8",
    env: { ...process.env, DATABASE_URL: url },
    timeout: 120_000,
  });
  return { status: result.status, stderr: result.stderr };
}

async function counts(db: Kysely<Database>) {
  const one = async (table: string) => Number((await sql<{ n: string }>`select count(*) as n from ${sql.table(table)}`.execute(db)).rows[0].n);
  return { users: await one("users"), rooms: await one("rooms"), guards: await one("guards"), postPlans: await one("post_plans") };
}

describe("backups", () => {
  it("restores a dump into a fresh database and finds the museum there", async () => {
    const source = requireDatabaseUrl();
    const file = join(folder, "museum.dump");
    const dumped = npmRun("backup", source, file);
    expect(dumped.stderr).toMatch(/wrote/);
    expect(dumped.status).toBe(0);

    const live = createDb(source, { max: 1 });
    const before = await counts(live);
    const someRoom = await live.selectFrom("rooms").select(["id", "name"]).orderBy("id").limit(1).executeTakeFirstOrThrow();
    await live.destroy();
    expect(before.users).toBeGreaterThan(0);
    expect(before.rooms).toBeGreaterThan(0);

    await withScratchDatabase("restore", async (scratch, scratchUrl) => {
      const restored = npmRun("restore", scratchUrl, file);
      expect(restored.stderr).toMatch(/now holds/);
      expect(restored.status).toBe(0);
      expect(await counts(scratch)).toEqual(before);
      const room = await scratch.selectFrom("rooms").select(["id", "name"]).where("id", "=", someRoom.id).executeTakeFirst();
      expect(room).toEqual(someRoom);
    });
  }, 240_000);

  it("refuses a file that is not a dump, or no file, and changes nothing", async () => {
    const bogus = join(folder, "not-a-dump.dump");
    writeFileSync(bogus, "id,name\n1,=HYPERLINK(\"x\")\n");
    await withScratchDatabase("badrestore", async (scratch, scratchUrl) => {
      await sql`create table keep_me (x int)`.execute(scratch);
      await sql`insert into keep_me values (1)`.execute(scratch);
      const refused = npmRun("restore", scratchUrl, bogus);
      expect(refused.status).toBe(2);
      expect(refused.stderr).toMatch(/not a dump written by npm run backup.*nothing was changed/);
      const missing = npmRun("restore", scratchUrl, join(folder, "absent.dump"));
      expect(missing.status).toBe(2);
      expect(missing.stderr).toMatch(/does not exist/);
      const none = npmRun("restore", scratchUrl);
      expect(none.status).toBe(2);
      expect(none.stderr).toMatch(/say which dump/);
      expect((await sql<{ x: number }>`select x from keep_me`.execute(scratch)).rows).toEqual([{ x: 1 }]);
    });
  }, 240_000);
});
