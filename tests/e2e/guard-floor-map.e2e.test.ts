// A guard's floor maps in Chromium: with a published shift at a post of a room that has an
// approved plan, My shifts links the map of that floor, which marks the guard's own post; a floor
// where the guard has no shift is not theirs to open (404).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { ownPostsAndFloors } from "@/lib/galleries/own-posts";
import { postOf, publishWeek } from "../integration/support/published-week";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let floor: { id: number; name: string };
let otherFloorId: number;

beforeAll(async () => {
  browser = await launchBrowser();
  const mara = await db.selectFrom("guards").innerJoin("users", "users.id", "guards.user_id").select(["guards.id", "guards.site_id"]).where("users.email", "=", "guard@example.org").executeTakeFirstOrThrow();
  const today = new Date().toISOString().slice(0, 10);
  const approved = await db
    .selectFrom("post_plans")
    .innerJoin("rooms", "rooms.id", "post_plans.room_id")
    .innerJoin("floors", "floors.id", "rooms.floor_id")
    .innerJoin("exhibitions", "exhibitions.id", "post_plans.exhibition_id")
    .select(["rooms.id as room_id", "rooms.name as room", "floors.id", "floors.name"])
    .where("post_plans.status", "=", "approved")
    .where("exhibitions.starts_on", "<=", today)
    .where("exhibitions.ends_on", ">=", today)
    .orderBy("post_plans.id")
    .executeTakeFirstOrThrow();
  floor = { id: approved.id, name: approved.name };
  // A week about thirty weeks ahead that no other test publishes: one shift at the room's first post.
  const monday = new Date(Date.now() + 210 * 86_400_000);
  while (monday.getUTCDay() !== 1) monday.setUTCDate(monday.getUTCDate() + 1);
  const week = monday.toISOString().slice(0, 10);
  const previous = await db.selectFrom("rosters").select(["id", "version"]).where("site_id", "=", mara.site_id).where("starts_on", "=", week).where("status", "=", "published").orderBy("version", "desc").executeTakeFirst();
  const start = new Date(`${week}T09:00:00Z`);
  const end = new Date(`${week}T15:00:00Z`);
  await publishWeek(
    db,
    { siteId: mara.site_id, startsOn: week, version: (previous?.version ?? 0) + 1, supersedes: previous?.id ?? null, posts: [{ id: postOf(approved.room_id, 1), room: approved.room }] },
    [{ guardId: mara.id, starts_at: start, ends_at: end, segments: [{ post: postOf(approved.room_id, 1), start: start.toISOString(), end: end.toISOString() }], breaks: [] }],
  );
  // A floor where none of her current or coming published shifts puts her.
  const hers = (await ownPostsAndFloors(db, mara.id)).floors.map((f) => f.id);
  const floors = await db.selectFrom("floors").select("id").where("site_id", "=", mara.site_id).orderBy("id").execute();
  otherFloorId = floors.find((f) => !hers.includes(f.id))?.id ?? 2147483000;
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

describe("a guard's floor maps", () => {
  it("links the floor of a coming shift, marks the guard's own post, and keeps other floors closed", async () => {
    const context = await newContext(browser, { phone: true });
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "guard@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto("/my-shifts");
      const maps = page.getByRole("region", { name: "Floor maps" });
      await maps.getByRole("link", { name: floor.name }).click();
      await page.waitForURL((url) => url.pathname === `/my-floors/${floor.id}`);
      const map = page.getByTestId("floor-map");
      await map.locator("svg").waitFor();
      expect(await map.locator('[data-own="true"]').count()).toBeGreaterThanOrEqual(1);
      expect((await page.goto(`/my-floors/${otherFloorId}`))?.status()).toBe(404);
    } finally {
      await context.close();
    }
  });
});
