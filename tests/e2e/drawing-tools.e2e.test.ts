// Drawing walls as curators draw them, in Chromium: the drawing has a metre grid and a scale bar;
// a selected corner can be placed by typing its coordinates and its next wall by typing a length;
// Undo and Redo (buttons and Ctrl-Z / Ctrl-Shift-Z) step through the edits; a partition drawn as a
// line becomes an obstacle of its thickness; the walls save.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { signedIn } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let roomId: number;
const FLOOR = `Drawing floor ${process.pid}`;

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

beforeAll(async () => {
  browser = await launchBrowser();
  const site = await db.selectFrom("sites").select("id").orderBy("id").executeTakeFirstOrThrow();
  await db.deleteFrom("floors").where("name", "=", FLOOR).execute();
  const { who } = await signedIn("curator@example.org", DEMO_PASSWORD);
  const floor = (await (await who.request("/api/floors", { method: "POST", json: { siteId: site.id, name: FLOOR, level: 42 } })).json()) as { floor: { id: number } };
  const room = (await (await who.request("/api/rooms", { method: "POST", json: { floorId: floor.floor.id, name: "Drafting Room", width: 10, depth: 8 } })).json()) as { room: { id: number } };
  roomId = room.room.id;
});

afterAll(async () => {
  await db.deleteFrom("floors").where("name", "=", FLOOR).execute();
  await browser?.close();
  await db.destroy();
});

describe("drawing tools", () => {
  it("types a corner and a wall length, undoes and redoes, and saves", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "curator@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto(`/galleries/${roomId}`);
      await page.waitForLoadState("networkidle");
      const drawing = page.getByTestId("room-drawing");
      await shown(drawing);
      expect(await drawing.getByTestId("drawing-grid").locator("line").count()).toBeGreaterThan(10);
      expect(await drawing.getByTestId("scale-bar").textContent()).toMatch(/^\d+ m$/);
      await page.getByRole("button", { name: "Edit walls" }).click();
      await page.locator('[data-vertex="0-2"]').click();
      const panel = page.getByTestId("corner-panel");
      await shown(panel.getByRole("heading", { name: "Selected corner 3" }));
      await panel.getByLabel("x (m)").fill("12");
      await panel.getByLabel("y (m)").fill("8");
      await panel.getByRole("button", { name: "Move corner" }).click();
      await expect.poll(() => drawing.getAttribute("aria-label")).toBe("Drawing of the room, 12.0 by 8.0 metres");
      // The next wall runs from corner 3 to corner 4 at (0, 8): 12 m long; make it 14 m.
      await panel.getByLabel("Next wall length (m)").fill("14");
      await panel.getByRole("button", { name: "Set length" }).click();
      await expect.poll(() => drawing.getAttribute("aria-label")).toBe("Drawing of the room, 14.0 by 8.0 metres");

      await page.getByRole("button", { name: "Undo" }).click();
      await expect.poll(() => drawing.getAttribute("aria-label")).toBe("Drawing of the room, 12.0 by 8.0 metres");
      await drawing.click({ position: { x: 5, y: 5 } });
      await page.keyboard.press("Control+z");
      await expect.poll(() => drawing.getAttribute("aria-label")).toBe("Drawing of the room, 10.0 by 8.0 metres");
      await page.keyboard.press("Control+Shift+z");
      await expect.poll(() => drawing.getAttribute("aria-label")).toBe("Drawing of the room, 12.0 by 8.0 metres");
      await page.getByRole("button", { name: "Redo" }).click();
      await expect.poll(() => drawing.getAttribute("aria-label")).toBe("Drawing of the room, 14.0 by 8.0 metres");

      // A partition wall across the middle: drawn as a line, kept as an obstacle 20 cm thick.
      await page.getByRole("button", { name: "Add partition" }).click();
      const box = (await drawing.boundingBox())!;
      await page.mouse.move(box.x + box.width * 0.35, box.y + box.height * 0.5);
      await page.mouse.down();
      await page.mouse.move(box.x + box.width * 0.65, box.y + box.height * 0.5, { steps: 5 });
      await page.mouse.up();

      await page.getByRole("button", { name: "Save room" }).click();
      await shown(page.getByText("Saved: the room is now at version 2."));
      const saved = await db.selectFrom("rooms").select(["outline", "obstacles"]).where("id", "=", roomId).executeTakeFirstOrThrow();
      expect(saved.obstacles).toHaveLength(1);
      const ys = saved.obstacles[0]!.map((p) => p[1]);
      expect(Math.max(...ys) - Math.min(...ys)).toBeCloseTo(0.2, 2);
      const xs = saved.outline.map((p) => p[0]);
      expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(14, 6);
    } finally {
      await context.close();
    }
  });
});
