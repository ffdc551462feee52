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
      // By keyboard: a corner takes the focus, Enter selects it, an arrow key nudges it 10 cm, and a
      // button adds a corner on its next wall; Undo takes both back.
      await page.locator('[data-vertex="0-1"]').focus();
      await page.keyboard.press("Enter");
      const keyed = page.getByTestId("corner-panel");
      await shown(keyed.getByRole("heading", { name: "Selected corner 2" }));
      await page.locator('[data-vertex="0-1"]').press("ArrowRight");
      await expect.poll(() => keyed.getByLabel("x (m)").inputValue()).toBe("10.10");
      await keyed.getByRole("button", { name: "Add a corner in the middle of the next wall" }).click();
      await expect.poll(() => page.locator('[data-vertex^="0-"]').count()).toBe(5);
      await page.getByRole("button", { name: "Undo" }).click();
      await page.getByRole("button", { name: "Undo" }).click();
      await expect.poll(() => page.locator('[data-vertex^="0-"]').count()).toBe(4);
      await expect.poll(() => drawing.getAttribute("aria-label")).toBe("Drawing of the room, 10.0 by 8.0 metres");
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

      // An obstacle of any shape typed by its corners (the keyboard way to draw one).
      await page.getByRole("button", { name: "Add obstacle" }).first().click();
      const typed = page.getByRole("form", { name: "Type an obstacle" });
      await typed.getByLabel(/Obstacle corners/).fill("2 3");
      await typed.getByRole("button", { name: "Add obstacle" }).click();
      await shown(typed.getByRole("alert").filter({ hasText: "an obstacle needs at least 3 corners" }));
      await typed.getByLabel(/Obstacle corners/).fill("7, 1; 9, 1; 8, 2.5");
      await typed.getByRole("button", { name: "Add obstacle" }).click();

      // An obstacle drawn corner by corner with the pointer, closed by a double-click.
      await page.getByRole("button", { name: "Draw obstacle" }).click();
      const area = (await drawing.boundingBox())!;
      const at = (fx: number, fy: number) => ({ x: area.x + area.width * fx, y: area.y + area.height * fy });
      for (const [fx, fy] of [[0.3, 0.3], [0.45, 0.3]] as const) await page.mouse.click(at(fx, fy).x, at(fx, fy).y);
      // Two corners so far: the sketch line is there (flat, so not "visible" by its box).
      await expect.poll(async () => drawing.getByTestId("sketch").count()).toBe(1);
      await page.mouse.dblclick(at(0.38, 0.4).x, at(0.38, 0.4).y);
      await expect.poll(async () => drawing.getByTestId("sketch").count()).toBe(0);

      // Zoom and pan move the view, not the room.
      const fitted = (await drawing.getAttribute("viewBox"))!.split(" ").map(Number);
      await page.getByRole("button", { name: "Zoom in" }).click();
      const zoomed = (await drawing.getAttribute("viewBox"))!.split(" ").map(Number);
      expect(zoomed[2]!).toBeCloseTo(fitted[2]! / 1.5, 6);
      await page.getByRole("button", { name: "Pan right" }).click();
      expect(Number((await drawing.getAttribute("viewBox"))!.split(" ")[0])).toBeGreaterThan(zoomed[0]!);
      await page.getByRole("button", { name: "Whole room" }).click();
      expect((await drawing.getAttribute("viewBox"))!.split(" ").map(Number)).toEqual(fitted);

      // While a corner is dragged, its two walls' lengths show beside it.
      await page.getByRole("button", { name: "Edit walls" }).click();
      const corner = (await page.locator('[data-vertex="0-0"]').boundingBox())!;
      await page.mouse.move(corner.x + corner.width / 2, corner.y + corner.height / 2);
      await page.mouse.down();
      await page.mouse.move(corner.x + corner.width / 2 + 3, corner.y + corner.height / 2, { steps: 2 });
      await shown(drawing.getByTestId("drag-lengths"));
      expect(await drawing.getByTestId("drag-lengths").textContent()).toMatch(/^\d+\.\d{2} m · \d+\.\d{2} m$/);
      await page.mouse.up();

      await page.getByRole("button", { name: "Save room" }).click();
      await shown(page.getByText("Saved: the room is now at version 2."));
      const saved = await db.selectFrom("rooms").select(["outline", "obstacles"]).where("id", "=", roomId).executeTakeFirstOrThrow();
      expect(saved.obstacles).toHaveLength(3);
      expect(saved.obstacles[2]).toHaveLength(3);
      const ys = saved.obstacles[0]!.map((p) => p[1]);
      // Stored clockwise (the server settles the orientation): the same three corners.
      expect([...saved.obstacles[1]!].sort()).toEqual([[7, 1], [8, 2.5], [9, 1]]);
      expect(Math.max(...ys) - Math.min(...ys)).toBeCloseTo(0.2, 2);
      const xs = saved.outline.map((p) => p[0]);
      expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(14, 6);
    } finally {
      await context.close();
    }
  });
});
