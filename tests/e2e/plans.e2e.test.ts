// Rooms and post plans against the built app and the real database: the room API's roles,
// optimistic concurrency (409, nothing changes), validation (422 with the problem), computing and
// approving plans; then in Chromium a curator moves a vertex and saves, and operations computes
// and approves a plan. Print Room and Jewellery Room (in no exhibition) take the wall edits, so the
// seeded exhibition plans that rosters use stay as they are.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator, Page } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import type { Role } from "@/db/schema";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { caller, signedIn, type Caller } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
const as: Partial<Record<Role, Caller>> = {};
let browser: Browser | undefined;

function who(role: Role): Caller {
  const c = as[role];
  if (!c) throw new Error(`not signed in as ${role}`);
  return c;
}

async function room(name: string) {
  return db.selectFrom("rooms").select(["id", "name", "outline", "obstacles", "version"]).where("name", "=", name).executeTakeFirstOrThrow();
}

async function errorOf(response: Response) {
  const body = (await response.json()) as { error?: { code: string; message: string; problems?: { code: string; message: string; at?: [number, number] }[] } };
  expect(body.error, "error body").toBeDefined();
  expect(typeof body.error!.message).toBe("string");
  return body.error!;
}

beforeAll(async () => {
  for (const account of DEMO_ACCOUNTS) {
    const { who: signed, status } = await signedIn(account.email, DEMO_PASSWORD);
    if (status !== 200) throw new Error(`demo sign-in failed for ${account.email} (${status})`);
    as[account.role] = signed;
  }
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

describe("the room API", () => {
  it("answers 401 to a signed-out caller and 403 to a guard who tries to change walls", async () => {
    const printRoom = await room("Print Room");
    const body = { outline: printRoom.outline, obstacles: printRoom.obstacles, version: printRoom.version };
    const signedOut = await caller().request(`/api/rooms/${printRoom.id}`, { method: "PUT", json: body });
    expect(signedOut.status).toBe(401);
    expect((await errorOf(signedOut)).code).toBe("signed-out");
    expect((await caller().request(`/api/rooms/${printRoom.id}`)).status).toBe(401);

    const guard = await who("guard").request(`/api/rooms/${printRoom.id}`, { method: "PUT", json: body });
    expect(guard.status).toBe(403);
    expect((await errorOf(guard)).code).toBe("forbidden");
    // Operations may look at rooms but not change their walls.
    expect((await who("operations").request(`/api/rooms/${printRoom.id}`, { method: "PUT", json: body })).status).toBe(403);
    expect((await who("operations").request(`/api/rooms/${printRoom.id}`)).status).toBe(200);
    expect((await room("Print Room")).version).toBe(printRoom.version);
  });

  it("saves a moved vertex for the curator and bumps the version", async () => {
    const before = await room("Jewellery Room");
    const outline = before.outline.map(([x, y], i) => (i === 1 ? [x + 0.5, y] : [x, y]));
    const response = await who("curator").request(`/api/rooms/${before.id}`, {
      method: "PUT",
      json: { outline, obstacles: before.obstacles, version: before.version },
    });
    expect(response.status).toBe(200);
    const { room: saved } = (await response.json()) as { room: { version: number; outline: number[][] } };
    expect(saved.version).toBe(before.version + 1);
    const after = await room("Jewellery Room");
    expect(after.version).toBe(before.version + 1);
    expect(after.outline).toContainEqual(outline[1]);
  });

  it("answers 409 to a save over a stale version, and nothing changes", async () => {
    const before = await room("Jewellery Room");
    const stale = await who("curator").request(`/api/rooms/${before.id}`, {
      method: "PUT",
      json: { outline: [[0, 0], [9, 0], [9, 9], [0, 9]], obstacles: [], version: before.version - 1 },
    });
    expect(stale.status).toBe(409);
    const error = await errorOf(stale);
    expect(error.code).toBe("stale-version");
    expect(error.message).toMatch(/Someone else saved this room first/);
    expect(await room("Jewellery Room")).toEqual(before);
  });

  it("answers 422 with the problem and where it is for walls that cross, and nothing changes", async () => {
    const before = await room("Jewellery Room");
    // A bow tie: walls 1-2 and 3-4 cross at (5, 4).
    const response = await who("curator").request(`/api/rooms/${before.id}`, {
      method: "PUT",
      json: { outline: [[0, 0], [10, 8], [10, 0], [0, 8]], obstacles: [], version: before.version },
    });
    expect(response.status).toBe(422);
    const error = await errorOf(response);
    expect(error.code).toBe("invalid-room");
    expect(error.problems?.[0]).toMatchObject({ code: "self-intersection", at: [5, 4] });
    expect(error.message).toMatch(/walls 1-2 and 3-4 of the outline cross at \(5\.0, 4\.0\)/);
    // Bad input (not numbers) is a 422 from the schema, also without a write.
    const garbage = await who("curator").request(`/api/rooms/${before.id}`, { method: "PUT", json: { outline: "square", obstacles: [], version: before.version } });
    expect(garbage.status).toBe(422);
    expect(await room("Jewellery Room")).toEqual(before);
  });

  it("answers 404 for a room that does not exist", async () => {
    expect((await who("curator").request("/api/rooms/987654")).status).toBe(404);
    expect((await who("curator").request("/api/rooms/abc")).status).toBe(400);
  });
});

describe("post plans over HTTP", () => {
  it("operations computes a plan on the server and approves it; a curator may not", async () => {
    const corridor = await room("Poster Corridor");
    const exhibition = await db
      .selectFrom("exhibition_rooms")
      .select("exhibition_id")
      .where("room_id", "=", corridor.id)
      .executeTakeFirstOrThrow();
    const body = { exhibitionId: exhibition.exhibition_id, roomVersion: corridor.version };
    expect((await who("curator").request(`/api/rooms/${corridor.id}/post-plans`, { method: "POST", json: body })).status).toBe(403);

    const created = await who("operations").request(`/api/rooms/${corridor.id}/post-plans`, { method: "POST", json: body });
    expect(created.status).toBe(201);
    const { plan } = (await created.json()) as { plan: { id: number; status: string; covered: number; posts: number[][]; room_version: number } };
    expect(plan).toMatchObject({ status: "proposed", covered: 1, room_version: corridor.version });
    // No single point sees both far ends of the Z-shaped corridor, so it needs two posts or more.
    expect(plan.posts.length).toBeGreaterThanOrEqual(2);

    expect((await who("curator").request(`/api/post-plans/${plan.id}/approve`, { method: "POST" })).status).toBe(403);
    expect((await caller().request(`/api/post-plans/${plan.id}/approve`, { method: "POST" })).status).toBe(401);
    const approved = await who("operations").request(`/api/post-plans/${plan.id}/approve`, { method: "POST" });
    expect(approved.status).toBe(200);
    const row = await db.selectFrom("post_plans").selectAll().where("id", "=", plan.id).executeTakeFirstOrThrow();
    expect(row.status).toBe("approved");
    expect(row.approved_at).not.toBeNull();
  });

  it("refuses to approve a plan for walls that changed since (409) or one that leaves floor unseen (422)", async () => {
    const printRoom = await room("Print Room");
    const created = await who("operations").request(`/api/rooms/${printRoom.id}/post-plans`, {
      method: "POST",
      json: { roomVersion: printRoom.version, method: "guaranteed" },
    });
    expect(created.status).toBe(201);
    const { plan } = (await created.json()) as { plan: { id: number } };

    // A 1 m sight range leaves most of a 12 × 9 m room unseen.
    const narrow = await who("operations").request(`/api/rooms/${printRoom.id}/post-plans`, {
      method: "POST",
      json: { roomVersion: printRoom.version, method: "guaranteed", sightRange: 1 },
    });
    expect(narrow.status).toBe(201);
    const { plan: partial } = (await narrow.json()) as { plan: { id: number; covered: number } };
    expect(partial.covered).toBeLessThan(1);
    const refused = await who("operations").request(`/api/post-plans/${partial.id}/approve`, { method: "POST" });
    expect(refused.status).toBe(422);
    expect((await errorOf(refused)).code).toBe("plan-not-covering");

    // The curator moves the table; the first plan was computed for the old walls.
    const obstacles = [[[4, 3], [4, 5.5], [8, 5.5], [8, 3]]];
    const moved = await who("curator").request(`/api/rooms/${printRoom.id}`, {
      method: "PUT",
      json: { outline: printRoom.outline, obstacles, version: printRoom.version },
    });
    expect(moved.status).toBe(200);
    const stale = await who("operations").request(`/api/post-plans/${plan.id}/approve`, { method: "POST" });
    expect(stale.status).toBe(409);
    const error = await errorOf(stale);
    expect(error.code).toBe("stale-plan");
    expect(error.message).toMatch(/version/);
    const rows = await db.selectFrom("post_plans").select(["id", "status"]).where("id", "in", [plan.id, partial.id]).execute();
    expect(rows.every((r) => r.status === "proposed")).toBe(true);

    // And a plan computed against a version the room has left is refused before any work.
    const late = await who("operations").request(`/api/rooms/${printRoom.id}/post-plans`, { method: "POST", json: { roomVersion: printRoom.version } });
    expect(late.status).toBe(409);
  });
});

// ── In the browser ───────────────────────────────────────────────────────────────────────────────

async function shown(locator: Locator, timeout = 20_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

async function signedInPage(role: Role): Promise<Page> {
  browser ??= await launchBrowser();
  const context = await newContext(browser);
  const page = await context.newPage();
  const account = DEMO_ACCOUNTS.find((a) => a.role === role)!;
  await signInThroughForm(page, account.email, DEMO_PASSWORD);
  await page.waitForURL((url) => url.pathname === "/");
  return page;
}

describe("the room page in Chromium", () => {
  it("a curator opens a room from the galleries, sees its posts, drags a vertex and saves", async () => {
    const before = await room("Print Room");
    const page = await signedInPage("curator");
    try {
      await page.goto("/galleries");
      await page.getByRole("link", { name: "Print Room" }).click();
      await shown(page.getByRole("heading", { level: 1, name: "Print Room" }));
      // The guaranteed plan comes from the Web Worker: its posts are drawn and counted.
      await shown(page.getByTestId("guaranteed-post").first());
      const count = await page.getByTestId("guaranteed-count").textContent();
      expect(Number(count)).toBeGreaterThanOrEqual(1);
      await shown(page.getByText("A post plan is a sightline aid").first());

      await page.getByRole("button", { name: "Edit walls" }).click();
      const corner = page.locator('[data-vertex="0-2"]');
      await shown(corner);
      const box = (await corner.boundingBox())!;
      const x = box.x + box.width / 2;
      const y = box.y + box.height / 2;
      await page.mouse.move(x, y);
      await page.mouse.down();
      await page.mouse.move(x + 20, y - 10, { steps: 5 });
      await page.mouse.up();
      await page.getByRole("button", { name: "Save room" }).click();
      await shown(page.getByText(`Saved: the room is now at version ${before.version + 1}.`));
      const after = await room("Print Room");
      expect(after.version).toBe(before.version + 1);
      expect(after.outline).not.toEqual(before.outline);
    } finally {
      await page.context().close();
    }
  });

  it("shows a crossing wall on the drawing while the curator edits", async () => {
    const page = await signedInPage("curator");
    try {
      const jewellery = await room("Jewellery Room");
      await page.goto(`/galleries/${jewellery.id}`);
      await shown(page.getByTestId("guaranteed-post").first());
      await page.getByRole("button", { name: "Edit walls" }).click();
      // Drag corner 3 past corner 4 and beyond the opposite wall: the outline folds over itself.
      const from = (await page.locator('[data-vertex="0-2"]').boundingBox())!;
      const to = (await page.locator('[data-vertex="0-0"]').boundingBox())!;
      await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
      await page.mouse.down();
      await page.mouse.move(to.x - 40, to.y + 30, { steps: 5 });
      await page.mouse.up();
      await shown(page.getByTestId("problem-marker").first());
      await shown(page.getByTestId("room-problems"));
      await expect(page.getByTestId("room-problems").textContent()).resolves.toMatch(/cross|touch|outside/);
      await expect(page.getByRole("button", { name: "Save room" }).isDisabled()).resolves.toBe(true);
    } finally {
      await page.context().close();
    }
  });

  it("a curator uploads a room file: a bad CSV row is named, a good file is drawn for saving", async () => {
    const page = await signedInPage("curator");
    try {
      const jewellery = await room("Jewellery Room");
      await page.goto(`/galleries/${jewellery.id}`);
      await shown(page.getByTestId("guaranteed-post").first());
      const input = page.locator('input[type="file"]');
      await input.setInputFiles({ name: "hall.csv", mimeType: "text/csv", buffer: Buffer.from("ring,x,y\n0,0,0\n0,ten,0\n0,10,8\n") });
      await shown(page.getByTestId("import-problems"));
      await expect(page.getByTestId("import-problems").textContent()).resolves.toContain('row 3: x is not a number ("ten")');
      // An L-shaped hall with one pillar: n = 10, h = 1.
      const csv = "ring,x,y\n0,0,0\n0,14,0\n0,14,6\n0,6,6\n0,6,12\n0,0,12\n1,2,2\n1,2,3\n1,3,3\n1,3,2\n";
      await input.setInputFiles({ name: "hall.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });
      await shown(page.getByText("Read hall.csv (CSV): 6 outline corners, 1 obstacle."));
      await expect.poll(() => page.getByTestId("plan-figures").getByText("10", { exact: true }).count(), { timeout: 15_000 }).toBeGreaterThan(0);
      await expect(page.getByRole("button", { name: "Save room" }).isEnabled()).resolves.toBe(true);
      // Nothing is stored until the curator saves.
      expect((await room("Jewellery Room")).version).toBe(jewellery.version);
    } finally {
      await page.context().close();
    }
  });

  it("operations computes a plan for the exhibition room and approves it", async () => {
    const corridor = await room("Poster Corridor");
    const page = await signedInPage("operations");
    try {
      await page.goto(`/galleries/${corridor.id}`);
      await shown(page.getByTestId("post-plans"));
      const plans = page.getByTestId("post-plan");
      const before = await plans.count();
      await page.getByRole("button", { name: "Compute and save plan" }).click();
      await shown(page.getByText(/Plan \d+ proposed:/), 60_000);
      // The proposal is drawn with its posts so the manager sees what they approve.
      await shown(page.getByText(/Showing stored plan \d+ \(proposed/));
      await shown(page.getByTestId("fewest-post").first());
      await expect.poll(() => plans.count(), { timeout: 20_000 }).toBe(before + 1);
      const newest = await db
        .selectFrom("post_plans")
        .select("id")
        .where("room_id", "=", corridor.id)
        .orderBy("id", "desc")
        .executeTakeFirstOrThrow();
      await page.getByRole("button", { name: `Approve plan ${newest.id}` }).click();
      await shown(page.getByText(`Plan ${newest.id} approved`));
      const row = await db.selectFrom("post_plans").select(["status", "approved_by"]).where("id", "=", newest.id).executeTakeFirstOrThrow();
      expect(row.status).toBe("approved");
      const operations = await db.selectFrom("users").select("id").where("email", "=", "operations@example.org").executeTakeFirstOrThrow();
      expect(row.approved_by).toBe(operations.id);
    } finally {
      await page.context().close();
    }
  });
});
