// The curator's whole flow in Chromium: a new floor and a room from the galleries page; in the
// editor two corners are added on a wall and three corners typed so the rectangle becomes an L, for
// which the plan needs one post (an L-shaped room is star-shaped: its reflex corner sees it all);
// saved as version 2; then version 1 is restored, which saves the rectangle again as version 3;
// a save over walls someone else saved meanwhile shows both and reloads theirs.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { signedIn } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
const FLOOR = `Curator flow floor ${process.pid}`;

async function shown(locator: Locator, timeout = 20_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

beforeAll(async () => {
  browser = await launchBrowser();
  await db.deleteFrom("floors").where("name", "=", FLOOR).execute();
});

afterAll(async () => {
  await db.deleteFrom("floors").where("name", "=", FLOOR).execute();
  await browser?.close();
  await db.destroy();
});

describe("a curator's room from nothing", () => {
  it("creates a floor and a room, draws an L (one post), saves, and restores version 1", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "curator@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto("/galleries");
      await page.waitForLoadState("networkidle");
      const newFloor = page.getByRole("form", { name: "New floor" }).first();
      await newFloor.getByLabel("New floor").fill(FLOOR);
      await newFloor.getByLabel("Level").fill("43");
      await newFloor.getByRole("button", { name: "Add floor" }).click();
      const newRoom = page.getByRole("form", { name: `New room on ${FLOOR}` });
      await shown(newRoom);
      await newRoom.getByLabel(`New room on ${FLOOR}`).fill("L Room");
      await newRoom.getByLabel("Width (m)").fill("10");
      await newRoom.getByLabel("Depth (m)").fill("8");
      await newRoom.getByRole("button", { name: "Add room and draw it" }).click();
      await shown(page.getByRole("heading", { level: 1, name: "L Room" }), 30_000);
      await page.waitForLoadState("networkidle");

      await page.getByRole("button", { name: "Edit walls" }).click();
      const drawing = page.getByTestId("room-drawing");
      // Two corners on the top wall, from (10, 8) to (0, 8): double-clicks near its middle.
      const top = async (fx: number) => {
        const a = (await page.locator('[data-vertex="0-2"]').boundingBox())!;
        const b = (await page.locator(`[data-vertex="0-${(await page.locator('[data-vertex^="0-"]').count()) - 1}"]`).boundingBox())!;
        return { x: a.x + (b.x - a.x) * fx + a.width / 2, y: a.y + a.height / 2 };
      };
      for (const fx of [0.3, 0.6]) {
        const at = await top(fx);
        await page.mouse.dblclick(at.x, at.y);
      }
      await expect.poll(() => page.locator('[data-vertex^="0-"]').count()).toBe(6);
      // Corners 3, 4, 5 become (10, 4), (5, 4), (5, 8): an L.
      for (const [index, x, y] of [[2, 10, 4], [3, 5, 4], [4, 5, 8]] as const) {
        await page.locator(`[data-vertex="0-${index}"]`).click();
        const panel = page.getByTestId("corner-panel");
        await panel.getByLabel("x (m)").fill(String(x));
        await panel.getByLabel("y (m)").fill(String(y));
        await panel.getByRole("button", { name: "Move corner" }).click();
      }
      await expect.poll(() => page.getByTestId("fewest-count").textContent(), { timeout: 30_000 }).toBe("1");
      await page.getByRole("button", { name: "Save room" }).click();
      await shown(page.getByText("Saved: the room is now at version 2."));
      const room = await db.selectFrom("rooms").innerJoin("floors", "floors.id", "rooms.floor_id").select(["rooms.id", "rooms.outline", "rooms.version"]).where("floors.name", "=", FLOOR).executeTakeFirstOrThrow();
      expect(room.version).toBe(2);
      expect(room.outline).toHaveLength(6);

      await page.getByTestId("room-versions").locator("summary").click();
      const versions = page.getByRole("table", { name: /Kept outlines of L Room/ });
      await shown(versions.getByRole("row", { name: /^2 \(current\)/ }));
      await versions.getByRole("row", { name: /^1 / }).getByRole("button", { name: "Restore" }).click();
      await expect.poll(async () => (await db.selectFrom("rooms").select(["version", "outline"]).where("id", "=", room.id).executeTakeFirstOrThrow()).version, { timeout: 15_000 }).toBe(3);
      const restored = await db.selectFrom("rooms").select("outline").where("id", "=", room.id).executeTakeFirstOrThrow();
      expect(restored.outline).toHaveLength(4);
      await expect.poll(() => drawing.getAttribute("aria-label")).toBe("Drawing of the room, 10.0 by 8.0 metres");

      // A stale save: someone else saves version 4 while this page edits version 3.
      await page.locator('[data-vertex="0-2"]').click();
      const panel = page.getByTestId("corner-panel");
      await panel.getByLabel("x (m)").fill("11");
      await panel.getByRole("button", { name: "Move corner" }).click();
      const { who } = await signedIn("curator@example.org", DEMO_PASSWORD);
      const theirs = { outline: [[0, 0], [9, 0], [9, 9], [0, 9]], obstacles: [], version: 3 };
      expect((await who.request(`/api/rooms/${room.id}`, { method: "PUT", json: theirs })).status).toBe(200);
      await page.getByRole("button", { name: "Save room" }).click();
      const conflict = page.getByTestId("save-conflict");
      await shown(conflict.getByRole("heading", { name: "Someone else saved version 4 meanwhile" }));
      expect(await conflict.getByRole("img").count()).toBe(2);
      await conflict.getByRole("button", { name: "Reload version 4" }).click();
      await expect.poll(() => drawing.getAttribute("aria-label")).toBe("Drawing of the room, 9.0 by 9.0 metres");
      expect((await db.selectFrom("rooms").select("version").where("id", "=", room.id).executeTakeFirstOrThrow()).version).toBe(4);
    } finally {
      await context.close();
    }
  }, 120_000);
});
