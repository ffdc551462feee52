// What a wall change costs, in Chromium: a room with an approved one-post plan for a running
// exhibition gets walls that need two posts; its page shows "+1 post" with the post-hours and money
// difference and says the approval is stale; operations sees the stale approval on Staffing and on
// Exhibitions. A scratch floor, room and exhibition of its own, removed afterwards.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { signedIn, type Caller } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let roomId: number;
const FLOOR = `Cost floor ${process.pid}`;
const EXHIBITION = `Cost exhibition ${process.pid}`;
const ROOM = `Cost Room ${process.pid}`;

async function shown(locator: Locator, timeout = 20_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

async function json(who: Caller, path: string, method: string, body: unknown) {
  const response = await who.request(path, { method, json: body });
  const parsed = (await response.json()) as Record<string, any>;
  if (response.status >= 300) throw new Error(`${method} ${path}: ${response.status} ${JSON.stringify(parsed)}`);
  return parsed;
}

beforeAll(async () => {
  browser = await launchBrowser();
  const site = await db.selectFrom("sites").select(["id", "time_zone"]).orderBy("id").executeTakeFirstOrThrow();
  await db.deleteFrom("exhibitions").where("name", "=", EXHIBITION).execute();
  await db.deleteFrom("floors").where("name", "=", FLOOR).execute();
  const curator = (await signedIn("curator@example.org", DEMO_PASSWORD)).who;
  const operations = (await signedIn("operations@example.org", DEMO_PASSWORD)).who;
  const floor = await json(curator, "/api/floors", "POST", { siteId: site.id, name: FLOOR, level: 41 });
  const room = await json(curator, "/api/rooms", "POST", { floorId: floor.floor.id, name: ROOM, width: 10, depth: 8 });
  roomId = room.room.id;
  const today = new Intl.DateTimeFormat("en-CA", { timeZone: site.time_zone }).format(new Date());
  const later = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
  const exhibition = await json(operations, "/api/exhibitions", "POST", { siteId: site.id, name: EXHIBITION, startsOn: today, endsOn: later, rooms: [{ roomId, riskLevel: "standard", sightRange: null, doubleCover: false }] });
  const plan = await json(operations, `/api/rooms/${roomId}/post-plans`, "POST", { roomVersion: 1, exhibitionId: exhibition.exhibition.id, method: "fewest" });
  expect(plan.plan.posts).toHaveLength(1);
  await json(operations, `/api/post-plans/${plan.plan.id}/approve`, "POST", {});
  // A U-shaped room: from no single point can a guard see into both arms.
  await json(curator, `/api/rooms/${roomId}`, "PUT", { outline: [[0, 0], [10, 0], [10, 10], [7, 10], [7, 3], [3, 3], [3, 10], [0, 10]], obstacles: [], version: 1 });
});

afterAll(async () => {
  await db.deleteFrom("exhibitions").where("name", "=", EXHIBITION).execute();
  await db.deleteFrom("floors").where("name", "=", FLOOR).execute();
  await browser?.close();
  await db.destroy();
});

describe("the cost of a wall change", () => {
  it("shows +1 post with the money difference, and the approval as stale to the curator and to operations", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "curator@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto(`/galleries/${roomId}`);
      const panel = page.getByTestId("cost-of-change");
      await shown(panel.getByTestId("cost-difference").filter({ hasText: /^\+1 post · \+[\d.,]+ post-hours a week · \+[\d.,]+ FTE · \+.+ a week$/ }), 60_000);
      await shown(panel.getByTestId("stale-approval").filter({ hasText: /Approval stale\..*approved for version 1 of the walls, which are at version 2 now/ }));
    } finally {
      await context.close();
    }
    const ops = await newContext(browser);
    const opsPage = await ops.newPage();
    try {
      await signInThroughForm(opsPage, "operations@example.org", DEMO_PASSWORD);
      await opsPage.waitForURL((url) => url.pathname === "/");
      await opsPage.goto("/staffing");
      await shown(opsPage.getByTestId("stale-approvals").getByRole("listitem").filter({ hasText: ROOM }));
      expect(await opsPage.getByTestId("stale-approvals").innerText()).toMatch(/compute a new plan for the room and approve it/);
      await opsPage.goto("/exhibitions");
      const row = opsPage.getByRole("row", { name: new RegExp(ROOM) });
      await shown(row.getByText("approval stale"));
    } finally {
      await ops.close();
    }
  }, 120_000);
});
