// Running the galleries in Chromium: a curator adds a floor and a room (the editor opens on it),
// renames and reorders rooms, deletes an unused room, and is told what depends on a room in an
// exhibition before anything is deleted; bad input is named on the form. Operations sees the
// galleries without the editing controls. At desktop and phone widths, by keyboard where it counts.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator, Page } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { signedIn } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
const FLOOR = `E2E floor ${process.pid}`;

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

async function signedInPage(role: string, phone = false): Promise<Page> {
  const context = await newContext(browser, { phone });
  const page = await context.newPage();
  await signInThroughForm(page, `${role}@example.org`, DEMO_PASSWORD);
  await page.waitForURL((url) => url.pathname === "/");
  return page;
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

describe("running the galleries", () => {
  for (const phone of [false, true]) {
    it(`a curator adds a floor and a room, renames, reorders and deletes (${phone ? "phone" : "desktop"})`, async () => {
      const page = await signedInPage("curator", phone);
      try {
        await db.deleteFrom("floors").where("name", "=", FLOOR).execute();
        await page.goto("/galleries");
        await page.waitForLoadState("networkidle");
        const newFloor = page.getByRole("form", { name: "New floor" }).first();
        await shown(newFloor);
        // A floor without a name is named as the problem, and nothing is added.
        await newFloor.getByRole("button", { name: "Add floor" }).click();
        await shown(newFloor.getByText("give the floor a name"));
        await newFloor.getByLabel("New floor").fill(FLOOR);
        await newFloor.getByLabel("Level").fill("7");
        await newFloor.getByLabel("Level").press("Enter");
        const floorHeading = page.getByRole("heading", { name: new RegExp(`^${FLOOR} \\(level 7\\)$`) });
        await shown(floorHeading);
        const floor = await db.selectFrom("floors").select("id").where("name", "=", FLOOR).executeTakeFirstOrThrow();
        const section = page.getByTestId(`floor-${floor.id}`);

        // A room: a zero width is refused on the form; a good one opens the editor.
        const newRoom = page.getByRole("form", { name: `New room on ${FLOOR}` });
        await newRoom.getByLabel(`New room on ${FLOOR}`).fill("Sketch Room");
        await newRoom.getByLabel("Width (m)").fill("0");
        await newRoom.getByRole("button", { name: "Add room and draw it" }).click();
        await shown(newRoom.getByText("the width is more than 0 m"));
        await newRoom.getByLabel("Width (m)").fill("12");
        await newRoom.getByRole("button", { name: "Add room and draw it" }).click();
        await shown(page.getByRole("heading", { level: 1, name: "Sketch Room" }), 30_000);

        await page.goto("/galleries");
        await page.waitForLoadState("networkidle");
        const second = page.getByRole("form", { name: `New room on ${FLOOR}` });
        await second.getByLabel(`New room on ${FLOOR}`).fill("Annex");
        await second.getByRole("button", { name: "Add room and draw it" }).click();
        await shown(page.getByRole("heading", { level: 1, name: "Annex" }), 30_000);
        await page.goto("/galleries");
        await page.waitForLoadState("networkidle");
        await shown(section.getByRole("link", { name: "Annex" }));

        // Rename the first room by keyboard.
        const sketch = section.locator("li", { has: page.getByRole("link", { name: "Sketch Room" }) });
        await sketch.getByRole("button", { name: "Rename room" }).click();
        const rename = sketch.getByLabel("New name of the room");
        await rename.fill("Drawing Room");
        await rename.press("Enter");
        await shown(section.getByRole("link", { name: "Drawing Room" }));

        // Move Annex before Drawing Room.
        await section.getByRole("button", { name: "Move Annex earlier" }).click();
        await expect
          .poll(async () => (await db.selectFrom("rooms").select(["name"]).where("floor_id", "=", floor.id).orderBy("position").orderBy("id").execute()).map((r) => r.name))
          .toEqual(["Annex", "Drawing Room"]);

        // Delete Annex (unused: a browser confirm).
        page.once("dialog", (dialog) => void dialog.accept());
        await section.locator("li", { has: page.getByRole("link", { name: "Annex" }) }).getByRole("button", { name: "Delete room" }).click();
        await expect.poll(async () => (await db.selectFrom("rooms").select("name").where("floor_id", "=", floor.id).execute()).map((r) => r.name)).toEqual(["Drawing Room"]);
      } finally {
        await page.context().close();
      }
    }, 90_000);
  }

  it("lists a room's versions, draws one beside the current walls, and restores it as a new version", async () => {
    const curator = (await signedIn("curator@example.org", DEMO_PASSWORD)).who;
    await db.deleteFrom("floors").where("name", "=", FLOOR).execute();
    const site = await db.selectFrom("sites").select("id").orderBy("id").executeTakeFirstOrThrow();
    const floorAnswer = await curator.request("/api/floors", { method: "POST", json: { siteId: site.id, name: FLOOR, level: 7 } });
    const { floor } = (await floorAnswer.json()) as { floor: { id: number } };
    const created = await curator.request("/api/rooms", { method: "POST", json: { floorId: floor.id, name: "History Room", width: 10, depth: 6 } });
    const { room } = (await created.json()) as { room: { id: number } };
    const lShape = [[0, 0], [10, 0], [10, 6], [4, 6], [4, 3], [0, 3]];
    const saved = await curator.request(`/api/rooms/${room.id}`, { method: "PUT", json: { outline: lShape, obstacles: [], version: 1 } });
    expect(saved.status).toBe(200);
    const page = await signedInPage("curator");
    try {
      await page.goto(`/galleries/${room.id}`);
      await page.waitForLoadState("networkidle");
      const versions = page.getByTestId("room-versions");
      await versions.locator("summary").click();
      await shown(versions.getByRole("cell", { name: "2 (current)" }));
      const first = versions.getByRole("row").filter({ has: page.getByRole("cell", { name: "1", exact: true }) });
      await first.getByRole("button", { name: "Compare" }).click();
      await shown(page.getByTestId("version-compare").getByRole("img", { name: "History Room, version 1" }));
      await shown(page.getByTestId("version-compare").getByRole("img", { name: "History Room, version 2 (current)" }));
      await first.getByRole("button", { name: "Restore" }).click();
      await shown(versions.getByText(/^Version 1 restored as a new version/));
      await expect.poll(async () => (await db.selectFrom("rooms").select("version").where("id", "=", room.id).executeTakeFirstOrThrow()).version).toBe(3);
      const now = await db.selectFrom("rooms").select("outline").where("id", "=", room.id).executeTakeFirstOrThrow();
      expect(now.outline).toHaveLength(4);
      // Restoring over a version someone else replaced meanwhile is refused, naming both versions.
      const stale = await curator.request(`/api/rooms/${room.id}/versions/2/restore`, { method: "POST", json: { currentVersion: 2 } });
      expect(stale.status).toBe(409);
    } finally {
      await page.context().close();
    }
  }, 90_000);

  it("says what depends on a room in an exhibition before deleting it, and keeps it when told", async () => {
    const page = await signedInPage("curator");
    try {
      await page.goto("/galleries");
      await page.waitForLoadState("networkidle");
      const card = page.locator("li", { has: page.getByRole("link", { name: "Exhibition Hall East", exact: true }) });
      await card.getByRole("button", { name: "Delete room" }).click();
      const ask = card.getByRole("alertdialog");
      await shown(ask);
      await shown(ask.getByText(/Woven Futures/));
      await ask.getByRole("button", { name: "Keep it" }).click();
      const still = await db.selectFrom("rooms").select("id").where("name", "=", "Exhibition Hall East").executeTakeFirst();
      expect(still).toBeDefined();
    } finally {
      await page.context().close();
    }
  });

  it("operations sees the galleries without editing controls", async () => {
    const page = await signedInPage("operations");
    try {
      await page.goto("/galleries");
      await page.waitForLoadState("networkidle");
      await shown(page.getByRole("link", { name: "Exhibition Hall East", exact: true }));
      await expect(page.getByRole("button", { name: /^(Rename|Delete) / }).count()).resolves.toBe(0);
      await expect(page.getByRole("form", { name: "New floor" }).count()).resolves.toBe(0);
    } finally {
      await page.context().close();
    }
  });
});
