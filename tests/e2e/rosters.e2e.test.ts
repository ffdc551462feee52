// Rosters in the built app: route handlers check roles on the server and answer our error JSON;
// operations builds and publishes a week in Chromium (the build and the e-mail run as jobs in the
// server process); a guard sees their own shifts; the personal feed; time off asked and decided.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { sql } from "kysely";
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { enGB } from "date-fns/locale";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { caller, signedIn, type Caller } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let operations: Caller;
let guard: Caller;
let curator: Caller;
let maraGuardId: number;

/** A Monday one to two weeks ahead, in the museum's zone (the integration tests take one four or more weeks ahead). */
function upcomingMonday(): string {
  const today = new Date(new Date().toLocaleString("en-US", { timeZone: "Europe/Berlin" }));
  const date = new Date(Date.UTC(today.getFullYear(), today.getMonth(), today.getDate() + 7));
  while (date.getUTCDay() !== 1) date.setUTCDate(date.getUTCDate() + 1);
  return date.toISOString().slice(0, 10);
}
const WEEK = upcomingMonday();

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

async function errorOf(response: Response) {
  const body = (await response.json()) as { error?: { code?: string; message?: string; field?: string } };
  expect(body.error, "error body").toBeDefined();
  expect(typeof body.error!.code).toBe("string");
  expect(typeof body.error!.message).toBe("string");
  return body.error!;
}

async function signIn(email: string): Promise<Caller> {
  const { who, status } = await signedIn(email, DEMO_PASSWORD);
  if (status !== 200) throw new Error(`demo sign-in failed for ${email} (${status})`);
  return who;
}

beforeAll(async () => {
  browser = await launchBrowser();
  [operations, guard, curator] = await Promise.all([signIn("operations@example.org"), signIn("guard@example.org"), signIn("curator@example.org")]);
  const mara = await db.selectFrom("guards").innerJoin("users", "users.id", "guards.user_id").select("guards.id").where("users.email", "=", "guard@example.org").executeTakeFirstOrThrow();
  maraGuardId = mara.id;
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

describe("the roster API checks who asks", () => {
  it("answers signed-out callers 401 and guards and curators 403, with our error JSON", async () => {
    const requests: [string, { method?: string; json?: unknown }][] = [
      [`/api/rosters?startsOn=${WEEK}`, {}],
      ["/api/rosters/build", { method: "POST", json: { startsOn: WEEK } }],
      ["/api/rosters/1", {}],
      ["/api/rosters/1/publish", { method: "POST", json: { revision: 1 } }],
      ["/api/rosters/1/reassign", { method: "POST", json: {} }],
      ["/api/jobs/1", {}],
    ];
    for (const [path, init] of requests) {
      const anonymous = await caller().request(path, init);
      expect(anonymous.status, `signed out ${path}`).toBe(401);
      expect((await errorOf(anonymous)).code).toBe("signed-out");
      for (const who of [guard, curator]) {
        const refused = await who.request(path, init);
        expect(refused.status, path).toBe(403);
        expect((await errorOf(refused)).code).toBe("forbidden");
      }
    }
  });

  it("refuses a week that does not start on a Monday (422 naming the field) and a body that is not JSON (400), queueing nothing", async () => {
    const before = await db.selectFrom("jobs").select((eb) => eb.fn.countAll<string>().as("n")).executeTakeFirstOrThrow();
    const tuesday = await operations.request("/api/rosters/build", { method: "POST", json: { startsOn: "2027-01-19" } });
    expect(tuesday.status).toBe(422);
    const error = await errorOf(tuesday);
    expect(error.field).toBe("startsOn");
    expect(error.message).toMatch(/Monday/);
    const garbled = await operations.request("/api/rosters/build", { method: "POST", body: "{startsOn:", headers: { "content-type": "application/json" } });
    expect(garbled.status).toBe(400);
    const badQuery = await operations.request("/api/rosters?startsOn=next-week");
    expect(badQuery.status).toBe(400);
    const after = await db.selectFrom("jobs").select((eb) => eb.fn.countAll<string>().as("n")).executeTakeFirstOrThrow();
    expect(after.n).toBe(before.n);
  });
});

describe("time off", () => {
  it("a guard asks, operations approves once; bad input and other roles write nothing", async () => {
    const count = async () => Number((await db.selectFrom("time_off").select((eb) => eb.fn.countAll<string>().as("n")).where("guard_id", "=", maraGuardId).executeTakeFirstOrThrow()).n);
    const before = await count();
    const backwards = await guard.request("/api/time-off", { method: "POST", json: { startsOn: "2027-06-10", endsOn: "2027-06-08", note: "" } });
    expect(backwards.status).toBe(422);
    expect((await errorOf(backwards)).field).toBe("endsOn");
    expect((await operations.request("/api/time-off", { method: "POST", json: { startsOn: "2027-06-08", endsOn: "2027-06-09" } })).status).toBe(403);
    expect(await count()).toBe(before);

    const asked = await guard.request("/api/time-off", { method: "POST", json: { startsOn: "2027-06-08", endsOn: "2027-06-09", note: "family, e2e test" } });
    expect(asked.status).toBe(201);
    const { request } = (await asked.json()) as { request: { id: number; status: string } };
    expect(request.status).toBe("requested");
    const own = (await (await guard.request("/api/time-off")).json()) as { requests: { id: number }[] };
    expect(own.requests.map((r) => r.id)).toContain(request.id);

    expect((await guard.request(`/api/time-off/${request.id}`, { method: "PATCH", json: { status: "approved" } })).status).toBe(403);
    const approved = await operations.request(`/api/time-off/${request.id}`, { method: "PATCH", json: { status: "approved" } });
    expect(approved.status).toBe(200);
    const again = await operations.request(`/api/time-off/${request.id}`, { method: "PATCH", json: { status: "declined" } });
    expect(again.status).toBe(409);
    expect((await db.selectFrom("time_off").select("status").where("id", "=", request.id).executeTakeFirstOrThrow()).status).toBe("approved");
  });
});

describe("operations builds and publishes a week; the guard sees it", () => {
  let publishedId: number;

  it("builds the week in the browser, sees progress, the draft with no violations, and publishes it", async () => {
    const previous = await db.selectFrom("rosters").select((eb) => eb.fn.max("version").as("v")).where("starts_on", "=", WEEK).where("status", "=", "published").executeTakeFirst();
    const expectedVersion = Number(previous?.v ?? 0) + 1;
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "operations@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto(`/staffing?week=${WEEK}`);
      await shown(page.getByRole("heading", { name: "Roster", exact: true }));
      // The demo site reads en-GB: the field shows the Monday day first, dd/mm/yyyy (Unicode CLDR date patterns).
      await expect(page.getByLabel("Week starting (Monday)").inputValue()).resolves.toBe(WEEK.split("-").reverse().join("/"));
      const build = page.getByRole("button", { name: /^(Build|Rebuild) roster$/ });
      await build.waitFor({ state: "visible" });
      await page.waitForFunction(() => !document.querySelector("button[disabled]")?.textContent?.match(/Build roster/), null, { timeout: 15_000 });
      await build.click();
      await shown(page.getByText(/^Building the roster:/));
      // The engine needs a few seconds for the demo week; the page polls the job.
      await shown(page.getByText("Building the roster: done"), 120_000);
      const revision = await db.selectFrom("rosters").select("revision").where("starts_on", "=", WEEK).where("status", "=", "draft").executeTakeFirstOrThrow();
      await shown(page.getByTestId("roster-status").getByText(`Showing the draft (revision ${revision.revision})`, { exact: true }), 30_000);
      await shown(page.getByTestId("draft-state").getByText(new RegExp(`revision ${revision.revision}\\)`)));
      await shown(page.getByTestId("violations").getByText("None: every shift keeps every rule."));
      await shown(page.getByTestId("roster-grid"));
      await page.getByRole("button", { name: "Publish…", exact: true }).click();
      // The review comes first: the demo week keeps a guard in every open room.
      const review = page.getByTestId("publish-review");
      await shown(review.getByText("Every room open to visitors has a guard in every open hour."), 30_000);
      await review.getByRole("button", { name: "Publish and e-mail guards" }).click();
      await shown(page.getByText(`Published version ${expectedVersion}; e-mailing every guard on it.`), 30_000);
      await shown(page.getByRole("button", { name: `Version ${expectedVersion} (current)` }), 30_000);
      // The header says which version counts now, and that the draft holds nothing newer.
      await shown(page.getByTestId("published-version").getByText(new RegExp(`^Published version ${expectedVersion} on `)), 30_000);
      await shown(page.getByTestId("draft-state").getByText(`The draft (revision ${revision.revision}) is what version ${expectedVersion} holds.`, { exact: true }));
      await expect(page.getByRole("button", { name: "Publish…", exact: true }).isDisabled()).resolves.toBe(true);
      // The roster list holds the week once, its draft and versions beneath it.
      await page.reload();
      const listed = page.getByTestId(`roster-week-${WEEK}`);
      await shown(listed);
      await expect(page.locator(`[data-testid="roster-week-${WEEK}"]`).count()).resolves.toBe(1);
      await shown(listed.getByText(`version ${expectedVersion} is current`));
      await shown(listed.getByRole("link", { name: `Version ${expectedVersion}`, exact: true }));
      await shown(listed.getByRole("link", { name: `Draft, revision ${revision.revision}`, exact: true }));
    } finally {
      await context.close();
    }
    const published = await db.selectFrom("rosters").selectAll().where("starts_on", "=", WEEK).where("status", "=", "published").where("version", "=", expectedVersion).executeTakeFirstOrThrow();
    expect(published.violations).toEqual([]);
    publishedId = published.id;
    // The same draft revision again through the API: 409 naming the version, nothing written.
    const draft = await db.selectFrom("rosters").select(["id", "revision"]).where("starts_on", "=", WEEK).where("status", "=", "draft").executeTakeFirstOrThrow();
    const again = await operations.request(`/api/rosters/${draft.id}/publish`, { method: "POST", json: { revision: draft.revision } });
    expect(again.status).toBe(409);
    const error = await errorOf(again);
    expect(error.code).toBe("already-published");
    expect(error.message).toContain(`version ${expectedVersion}`);
    const versions = await db.selectFrom("rosters").select("id").where("starts_on", "=", WEEK).where("status", "=", "published").where("version", ">", expectedVersion).execute();
    expect(versions).toEqual([]);
  });

  it("prints the day's sign-in sheet from the published version: every guard on duty, with a line to sign", async () => {
    const tuesday = new Date(`${WEEK}T12:00:00Z`);
    tuesday.setUTCDate(tuesday.getUTCDate() + 1);
    const date = tuesday.toISOString().slice(0, 10);
    const onDuty = await db
      .selectFrom("shifts")
      .innerJoin("guards", "guards.id", "shifts.guard_id")
      .select(["guards.name", "shifts.starts_at"])
      .where("shifts.roster_id", "=", publishedId)
      .execute();
    const names = [...new Set(onDuty.filter((s) => new Date(s.starts_at).toLocaleDateString("en-CA", { timeZone: "Europe/Berlin" }) === date).map((s) => s.name))].sort();
    expect(names.length).toBeGreaterThan(0);
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "operations@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto(`/staffing/sheet?date=${date}`);
      const sheet = page.getByTestId("sign-in-sheet");
      await shown(sheet);
      const listed = (await sheet.locator("tbody tr td:first-child").allInnerTexts()).map((t) => t.trim());
      expect([...new Set(listed)].sort()).toEqual(names);
      // Printed, the page drops the navigation and keeps the sheet.
      await page.emulateMedia({ media: "print" });
      await expect(page.getByRole("navigation", { name: "Main" }).isVisible()).resolves.toBe(false);
      await expect(sheet.isVisible()).resolves.toBe(true);
    } finally {
      await context.close();
    }
  });

  it("the server's job worker e-mails the guards", async () => {
    const deadline = Date.now() + 90_000;
    let status = "queued";
    while (Date.now() < deadline) {
      const job = await db
        .selectFrom("jobs")
        .select(["status", "message"])
        .where("kind", "=", "roster-publish-mail")
        .where(sql<boolean>`payload @> ${JSON.stringify({ rosterId: publishedId })}::jsonb`)
        .executeTakeFirst();
      status = job?.status ?? "missing";
      if (status === "done" || status === "failed") break;
      await new Promise((resolve) => setTimeout(resolve, 500));
    }
    expect(status).toBe("done");
  });

  it("the guard sees exactly their own shifts of the latest version on My shifts, on a phone", async () => {
    const mine = await db
      .selectFrom("shifts")
      .select(["starts_at", "ends_at"])
      .where("roster_id", "=", publishedId)
      .where("guard_id", "=", maraGuardId)
      .execute();
    expect(mine.length).toBeGreaterThan(0);
    const context = await newContext(browser, { phone: true });
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "guard@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto("/my-shifts");
      await shown(page.getByRole("heading", { level: 1, name: "My shifts" }));
      const list = page.getByTestId("my-shifts");
      await shown(list);
      const items = await list.locator("li").allTextContents();
      // Each of her shifts in the museum's time, exactly once: no other guard's, no superseded copy.
      // Written as date-fns's en-GB locale writes the same day (the demo site's locale).
      const day = (at: Date) => format(new TZDate(at, "Europe/Berlin"), "EEE, d MMM yyyy, HH:mm", { locale: enGB });
      for (const shift of mine) {
        const when = `${day(shift.starts_at)}–${format(new TZDate(shift.ends_at, "Europe/Berlin"), "HH:mm")}`;
        expect(items.filter((text) => text.startsWith(when)), when).toHaveLength(1);
      }
      const others = await db.selectFrom("shifts").select(["starts_at"]).where("roster_id", "=", publishedId).where("guard_id", "!=", maraGuardId).execute();
      const ownStarts = new Set(mine.map((s) => s.starts_at.getTime()));
      const foreign = others.filter((s) => !ownStarts.has(s.starts_at.getTime())).map((s) => day(s.starts_at));
      for (const when of foreign) expect(items.some((text) => text.startsWith(when)), when).toBe(false);
      await shown(page.getByLabel("Feed address"));
    } finally {
      await context.close();
    }
  });

  it("serves the guard's calendar feed by its secret address only, and a reset retires the old one", async () => {
    const { calendar_token: token } = await db.selectFrom("guards").select("calendar_token").where("id", "=", maraGuardId).executeTakeFirstOrThrow();
    const feed = await caller().request(`/api/calendar/${token}`);
    expect(feed.status).toBe(200);
    expect(feed.headers.get("content-type")).toMatch(/^text\/calendar/);
    const ics = await feed.text();
    expect(ics.startsWith("BEGIN:VCALENDAR\r\n")).toBe(true);
    const uids = ics.split("\r\n").filter((line) => line.startsWith("UID:"));
    expect(uids.length).toBeGreaterThan(0);
    for (const uid of uids) expect(uid.startsWith(`UID:shift-${maraGuardId}-`)).toBe(true);

    expect((await caller().request("/api/calendar/not-a-token")).status).toBe(400);
    expect((await caller().request(`/api/calendar/${"0".repeat(64)}`)).status).toBe(404);
    expect((await operations.request("/api/calendar/reset", { method: "POST", json: {} })).status).toBe(403);
    const reset = await guard.request("/api/calendar/reset", { method: "POST", json: {} });
    expect(reset.status).toBe(200);
    const { path } = (await reset.json()) as { path: string };
    expect(path).not.toContain(token);
    expect((await caller().request(`/api/calendar/${token}`)).status).toBe(404);
    expect((await caller().request(path)).status).toBe(200);
  });
});
