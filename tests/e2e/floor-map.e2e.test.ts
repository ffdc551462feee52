// The floor map in Chromium: operations opens the map of the floor whose rooms have approved plans
// in the demo exhibition, sees every approved post numbered; printed (print media) the navigation
// is gone and the map with its legend stays; the SVG export parses as SVG (the browser's own XML
// parser) with the floor's title; guards get 403 for the page and the export.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { signedIn } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let floor: { id: number; name: string };
let approvedPosts: number;

beforeAll(async () => {
  browser = await launchBrowser();
  // The floor with the most approved posts among the rooms of running exhibitions.
  const rows = await db
    .selectFrom("post_plans")
    .innerJoin("rooms", "rooms.id", "post_plans.room_id")
    .innerJoin("floors", "floors.id", "rooms.floor_id")
    .innerJoin("exhibitions", "exhibitions.id", "post_plans.exhibition_id")
    .select(["floors.id", "floors.name", "post_plans.room_id", "post_plans.posts", "post_plans.id as plan_id"])
    .where("post_plans.status", "=", "approved")
    .where("exhibitions.starts_on", "<=", new Date().toISOString().slice(0, 10))
    .where("exhibitions.ends_on", ">=", new Date().toISOString().slice(0, 10))
    .orderBy("post_plans.approved_at", "desc")
    .execute();
  if (rows.length === 0) throw new Error("the demo seed has no approved plan in a running exhibition");
  floor = { id: rows[0]!.id, name: rows[0]!.name };
  const latest = new Map<number, number>();
  for (const row of rows.filter((r) => r.id === floor.id)) if (!latest.has(row.room_id)) latest.set(row.room_id, (row.posts as unknown[]).length);
  approvedPosts = [...latest.values()].reduce((a, b) => a + b, 0);
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

describe("the floor map", () => {
  it("shows the approved posts, prints without the navigation, and exports an SVG that parses", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "operations@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto("/galleries");
      await page.getByRole("link", { name: `Floor map of ${floor.name}` }).click();
      await page.waitForURL((url) => url.pathname === `/galleries/floors/${floor.id}/map`);
      const map = page.getByTestId("floor-map");
      await map.locator("svg").waitFor();
      expect(await map.locator("[data-post]").count()).toBe(approvedPosts);
      expect(await map.locator("title").textContent()).toContain(floor.name);

      await page.emulateMedia({ media: "print" });
      expect(await page.getByRole("navigation", { name: "Main" }).isVisible()).toBe(false);
      expect(await page.getByRole("button", { name: "Print" }).isVisible()).toBe(false);
      expect(await map.isVisible()).toBe(true);
      expect(await map.getByText("seen by no post").isVisible()).toBe(true);
      await page.emulateMedia({ media: "screen" });

      const parsed = await page.evaluate(async (id) => {
        const response = await fetch(`/api/floors/${id}/map`);
        const text = await response.text();
        const doc = new DOMParser().parseFromString(text, "image/svg+xml");
        return {
          status: response.status,
          type: response.headers.get("content-type"),
          disposition: response.headers.get("content-disposition"),
          error: doc.getElementsByTagName("parsererror").length,
          root: doc.documentElement.nodeName,
          title: doc.querySelector("title")?.textContent ?? "",
          posts: doc.querySelectorAll("[data-post]").length,
        };
      }, floor.id);
      expect(parsed).toMatchObject({ status: 200, error: 0, root: "svg", posts: approvedPosts });
      expect(parsed.type).toMatch(/^image\/svg\+xml/);
      expect(parsed.disposition).toMatch(/^attachment; filename=".+\.svg"$/);
      expect(parsed.title).toContain(floor.name);
    } finally {
      await context.close();
    }
  });

  it("is closed to guards (403) for the page and the export", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "guard@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      expect((await page.goto(`/galleries/floors/${floor.id}/map`))?.status()).toBe(403);
    } finally {
      await context.close();
    }
    const { who } = await signedIn("guard@example.org", DEMO_PASSWORD);
    expect((await who.request(`/api/floors/${floor.id}/map`)).status).toBe(403);
  });
});
