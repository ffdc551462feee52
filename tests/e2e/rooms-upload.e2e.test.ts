// Uploading rooms in Chromium: a curator picks a two-room GeoJSON FeatureCollection for a floor,
// sees the preview (one new room, one with new walls), saves, and both are on the floor; a file
// with one crossing room is refused naming that room, and nothing changes.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { signedIn } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let floorId: number;
const FLOOR = `Upload floor ${process.pid}`;
const ring = (points: number[][]) => [...points, points[0]];
const feature = (name: string, points: number[][]) => ({ type: "Feature", properties: { name }, geometry: { type: "Polygon", coordinates: [ring(points)] } });
const file = (name: string, ...features: unknown[]) => ({ name, mimeType: "application/geo+json", buffer: Buffer.from(JSON.stringify({ type: "FeatureCollection", features })) });

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

beforeAll(async () => {
  browser = await launchBrowser();
  const site = await db.selectFrom("sites").select("id").orderBy("id").executeTakeFirstOrThrow();
  await db.deleteFrom("floors").where("name", "=", FLOOR).execute();
  const { who } = await signedIn("curator@example.org", DEMO_PASSWORD);
  const floor = (await (await who.request("/api/floors", { method: "POST", json: { siteId: site.id, name: FLOOR, level: 40 } })).json()) as { floor: { id: number } };
  floorId = floor.floor.id;
  expect((await who.request("/api/rooms", { method: "POST", json: { floorId, name: "Print Room", width: 8, depth: 6 } })).status).toBe(201);
});

afterAll(async () => {
  await db.deleteFrom("floors").where("name", "=", FLOOR).execute();
  await browser?.close();
  await db.destroy();
});

describe("uploading rooms", () => {
  it("previews, saves a two-room file, and refuses a file with a crossing room", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "curator@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto("/galleries");
      await page.waitForLoadState("networkidle");
      const section = page.getByTestId(`floor-${floorId}`);
      const input = section.getByLabel(`Upload rooms to ${FLOOR}`);

      await input.setInputFiles(file("bad.geojson", feature("Map Room", [[0, 0], [9, 0], [9, 7], [0, 7]]), feature("Crossed", [[0, 0], [10, 10], [10, 0], [0, 10]])));
      await shown(section.getByRole("alert").filter({ hasText: /Nothing was saved: 1 problem; Crossed:/ }));
      expect((await db.selectFrom("rooms").select("name").where("floor_id", "=", floorId).execute()).map((r) => r.name)).toEqual(["Print Room"]);

      await input.setInputFiles(file("rooms.geojson", feature("Map Room", [[0, 0], [9, 0], [9, 7], [0, 7]]), feature("Print Room", [[0, 0], [12, 0], [12, 5], [5, 5], [5, 10], [0, 10]])));
      const preview = page.getByTestId(`upload-preview-${floorId}`);
      await shown(preview.getByRole("row", { name: /Map Room new room 4 0/ }));
      await shown(preview.getByRole("row", { name: /Print Room new walls \(now version 1\) 6 0/ }));
      await section.getByRole("button", { name: "Save 2 rooms" }).click();
      await shown(section.getByText(`Saved: 1 new room, 1 with new walls on ${FLOOR}.`));
      const rooms = await db.selectFrom("rooms").select(["name", "version"]).where("floor_id", "=", floorId).orderBy("name").execute();
      expect(rooms).toEqual([{ name: "Map Room", version: 1 }, { name: "Print Room", version: 2 }]);
      await shown(section.getByRole("link", { name: /Map Room/ }));
    } finally {
      await context.close();
    }
  });
});
