// Exhibitions in Chromium: operations creates one with two rooms, one of them high-risk with a
// sight range; a closing before the opening is named on the form and nothing is saved; the room's
// page then plans for the new exhibition and operations approves the plan. A curator cannot. The
// exhibition lies far ahead (2099), so no roster of the other tests counts its rooms.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator, Page } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { signedIn } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
const NAME = `Paper Trails ${process.pid}`;

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

async function signedInPage(role: string): Promise<Page> {
  const context = await newContext(browser);
  const page = await context.newPage();
  await signInThroughForm(page, `${role}@example.org`, DEMO_PASSWORD);
  await page.waitForURL((url) => url.pathname === "/");
  return page;
}

beforeAll(async () => {
  browser = await launchBrowser();
  await db.deleteFrom("exhibitions").where("name", "=", NAME).execute();
});

afterAll(async () => {
  await db.deleteFrom("exhibitions").where("name", "=", NAME).execute();
  await browser?.close();
  await db.destroy();
});

describe("exhibitions", () => {
  it("operations creates an exhibition with two rooms, one high-risk, and approves a plan for it", async () => {
    const page = await signedInPage("operations");
    try {
      await page.goto("/exhibitions");
      await page.waitForLoadState("networkidle");
      await page.getByRole("button", { name: "New exhibition" }).click();
      const form = page.getByRole("form", { name: "New exhibition" });
      await form.getByLabel("Name").fill(NAME);
      // The demo site reads en-GB: dates are typed day first, dd/mm/yyyy (Unicode CLDR date patterns).
      await form.getByLabel("Opens").fill("01/03/2099");
      await form.getByLabel("Closes").fill("04/01/2099");
      await form.getByRole("checkbox", { name: /^Print Room/ }).check();
      await form.getByRole("checkbox", { name: /^Design Lab/ }).check();
      await form.getByLabel("Risk of Print Room").selectOption("high");
      await form.getByLabel("Sight range of Print Room").fill("12");
      await form.getByRole("button", { name: "Create exhibition" }).click();
      await shown(form.getByText("the exhibition cannot close before it opens"));
      expect(await db.selectFrom("exhibitions").select("id").where("name", "=", NAME).executeTakeFirst()).toBeUndefined();
      await form.getByLabel("Opens").fill("04/01/2099");
      await form.getByLabel("Closes").fill("01/03/2099");
      await form.getByRole("button", { name: "Create exhibition" }).click();
      await shown(page.getByRole("heading", { name: NAME }), 30_000);
      const saved = await db.selectFrom("exhibitions").select(["id", "starts_on", "ends_on"]).where("name", "=", NAME).executeTakeFirstOrThrow();
      expect([saved.starts_on, saved.ends_on]).toEqual(["2099-01-04", "2099-03-01"]);
      const rooms = await db
        .selectFrom("exhibition_rooms")
        .innerJoin("rooms", "rooms.id", "exhibition_rooms.room_id")
        .select(["rooms.name", "risk_level", "sight_range", "double_cover"])
        .where("exhibition_id", "=", saved.id)
        .orderBy("rooms.name")
        .execute();
      expect(rooms.map((r) => [r.name, r.risk_level, r.sight_range === null ? null : Number(r.sight_range), r.double_cover])).toEqual([
        ["Design Lab", "standard", null, false],
        ["Print Room", "high", 12, false],
      ]);

      // The Print Room's page plans for the new exhibition (the next to open for this room).
      const printRoom = await db.selectFrom("rooms").select("id").where("name", "=", "Print Room").executeTakeFirstOrThrow();
      await page.goto(`/galleries/${printRoom.id}`);
      await page.waitForLoadState("networkidle");
      await shown(page.getByText(new RegExp(`in ${NAME} \\(high risk\\)`)));
      await page.getByRole("button", { name: "Compute and save plan" }).click();
      await shown(page.getByText(/Plan \d+ proposed:/), 60_000);
      const plan = await db.selectFrom("post_plans").select(["id", "options"]).where("exhibition_id", "=", saved.id).where("room_id", "=", printRoom.id).orderBy("id", "desc").executeTakeFirstOrThrow();
      expect((plan.options as { sightRange: number | null }).sightRange).toBe(12);
      await page.getByRole("button", { name: `Approve plan ${plan.id}` }).click();
      await shown(page.getByText(`Plan ${plan.id} approved`));
      expect((await db.selectFrom("post_plans").select("status").where("id", "=", plan.id).executeTakeFirstOrThrow()).status).toBe("approved");
    } finally {
      await page.context().close();
    }
  }, 120_000);

  it("a curator may not create or change exhibitions (403), and sees no editing controls", async () => {
    const curator = (await signedIn("curator@example.org", DEMO_PASSWORD)).who;
    const site = await db.selectFrom("sites").select("id").orderBy("id").executeTakeFirstOrThrow();
    const refused = await curator.request("/api/exhibitions", { method: "POST", json: { siteId: site.id, name: "Nope", startsOn: "2099-05-01", endsOn: "2099-06-01", rooms: [] } });
    expect(refused.status).toBe(403);
    expect(await db.selectFrom("exhibitions").select("id").where("name", "=", "Nope").executeTakeFirst()).toBeUndefined();
  });
});
