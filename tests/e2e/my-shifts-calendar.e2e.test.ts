// The guard's week view in Chromium: our toolbar, not the library's; it opens on the week (or, on a
// phone, the day) of the guard's next shift from the database; a shift card shows its time and
// room; Enter on a card shows the details with breaks and the other guards on the same floor.
// Screenshots at 390x844 and 1440x900 land in the system's temporary folder for a person to look at.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Browser, Locator, Page } from "playwright-core";
import { TZDate } from "@date-fns/tz";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { currentShiftsOfGuard } from "@/db/queries/rosters";
import { formatDate, formatDay, formatTimeRange, siteDate, siteFormat, type SiteFormat } from "@/lib/format";
import { postOf, publishWeek } from "../integration/support/published-week";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { baseUrl, testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let f: SiteFormat;
let maraId: number;
let colleague: { id: number; name: string };
let elsewhere: { id: number; name: string };
let seeded: { id: number; date: string; start: Date; end: Date; breakStart: Date; breakEnd: Date };
let rooms: { textile: string; furniture: string; glass: string };

const addDays = (date: string, days: number) => new Date(Date.parse(`${date}T12:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
const mondayOf = (date: string) => addDays(date, -((new Date(`${date}T12:00:00Z`).getUTCDay() + 6) % 7));
const weekTitle = (date: string) => `Week of ${formatDate(f, mondayOf(date))}`;

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

async function room(name: string) {
  return db.selectFrom("rooms").innerJoin("floors", "floors.id", "rooms.floor_id").select(["rooms.id", "rooms.name", "floors.name as floor"]).where("rooms.name", "=", name).executeTakeFirstOrThrow();
}

/** The site date of Mara's next (or current) shift in the latest published versions, as the page should open on it. */
async function nextShiftDate(): Promise<string> {
  const [next] = await currentShiftsOfGuard(db, maraId, new Date());
  return next ? siteDate(f, next.starts_at) : siteDate(f, new Date());
}

async function openMyShifts(page: Page): Promise<Locator> {
  await signInThroughForm(page, "guard@example.org", DEMO_PASSWORD);
  await page.waitForURL((url) => url.pathname === "/");
  await page.goto("/my-shifts");
  const calendar = page.getByTestId("shift-calendar");
  await shown(calendar.locator(".fc-timegrid"));
  return calendar;
}

const title = (page: Page) => page.getByTestId("calendar-title");

async function titleBecomes(page: Page, expected: string): Promise<void> {
  await page.waitForFunction((text) => document.querySelector('[data-testid="calendar-title"]')?.textContent === text, expected, { timeout: 10_000 });
}

/** The whole page from its top (the calendar's day headers stick to the top of the window when scrolled). */
async function screenshot(page: Page, name: string): Promise<void> {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: join(tmpdir(), name), fullPage: true });
}

beforeAll(async () => {
  browser = await launchBrowser();
  const mara = await db.selectFrom("guards").innerJoin("users", "users.id", "guards.user_id").select(["guards.id", "guards.site_id"]).where("users.email", "=", "guard@example.org").executeTakeFirstOrThrow();
  maraId = mara.id;
  const site = await db.selectFrom("sites").selectAll().where("id", "=", mara.site_id).executeTakeFirstOrThrow();
  f = siteFormat(site);
  const guards = await db.selectFrom("guards").select(["id", "name"]).where("site_id", "=", mara.site_id).where("id", "!=", maraId).orderBy("id").limit(2).execute();
  [colleague, elsewhere] = [guards[0]!, guards[1]!];
  // Textile and Furniture Gallery share the ground floor; the Glass Gallery is upstairs (db/seed/museum.ts).
  const [textile, furniture, glass] = [await room("Textile Gallery"), await room("Furniture Gallery"), await room("Glass Gallery")];
  expect(textile.floor).toBe(furniture.floor);
  expect(glass.floor).not.toBe(textile.floor);
  rooms = { textile: textile.name, furniture: furniture.name, glass: glass.name };

  // Wednesday of the week two to three weeks ahead (site dates), clear of the roster test's week.
  const today = siteDate(f, new Date());
  let week = addDays(today, 14);
  while (new Date(`${week}T12:00:00Z`).getUTCDay() !== 1) week = addDays(week, 1);
  const date = addDays(week, 2);
  const [y, m, d] = date.split("-").map(Number) as [number, number, number];
  const local = (hh: number, mm = 0) => new Date(new TZDate(y, m - 1, d, hh, mm, site.time_zone).getTime());
  const iso = (at: Date) => at.toISOString();
  const previous = await db.selectFrom("rosters").select(["id", "version"]).where("site_id", "=", site.id).where("starts_on", "=", week).where("status", "=", "published").orderBy("version", "desc").executeTakeFirst();
  const rosterId = await publishWeek(
    db,
    {
      siteId: site.id,
      startsOn: week,
      version: (previous?.version ?? 0) + 1,
      supersedes: previous?.id ?? null,
      posts: [textile, furniture, glass].flatMap((r) => [1, 2].map((n) => ({ id: postOf(r.id, n), room: r.name }))),
    },
    [
      {
        guardId: maraId,
        starts_at: local(10),
        ends_at: local(18),
        segments: [
          { post: postOf(textile.id), start: iso(local(10)), end: iso(local(13)) },
          { post: postOf(furniture.id), start: iso(local(13, 30)), end: iso(local(18)) },
        ],
        breaks: [{ start: iso(local(13)), end: iso(local(13, 30)) }],
      },
      { guardId: colleague.id, starts_at: local(9), ends_at: local(17), segments: [{ post: postOf(furniture.id, 2), start: iso(local(9)), end: iso(local(17)) }], breaks: [] },
      { guardId: elsewhere.id, starts_at: local(10), ends_at: local(18), segments: [{ post: postOf(glass.id), start: iso(local(10)), end: iso(local(18)) }], breaks: [] },
    ],
  );
  const own = await db.selectFrom("shifts").select("id").where("roster_id", "=", rosterId).where("guard_id", "=", maraId).executeTakeFirstOrThrow();
  seeded = { id: own.id, date, start: local(10), end: local(18), breakStart: local(13), breakEnd: local(13, 30) };
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

describe("My shifts: the week view", () => {
  it("on a wide screen: our toolbar, the week of the next shift, a readable card and its details by keyboard", async () => {
    const context = await browser.newContext({ baseURL: baseUrl(), viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    try {
      const calendar = await openMyShifts(page);
      // The library's own toolbar and buttons are gone; ours is there.
      await expect(calendar.locator(".fc-toolbar, .fc-header-toolbar, .fc-button").count()).resolves.toBe(0);
      await expect(page.getByRole("button", { name: "today", exact: true }).count()).resolves.toBe(0);
      const toolbar = page.getByTestId("calendar-toolbar");
      for (const name of ["Previous week", "Next week", "This week", "Next shift", "Week", "Day"]) await shown(toolbar.getByRole("button", { name, exact: true }));

      // It opens on the week of the next shift in the database, whatever today is.
      const opening = await nextShiftDate();
      await titleBecomes(page, weekTitle(opening));
      await expect(calendar.locator(`.fc-col-header-cell[data-date="${opening}"]`).count()).resolves.toBe(1);
      await expect(toolbar.getByRole("button", { name: "Week", exact: true }).getAttribute("aria-pressed")).resolves.toBe("true");
      await expect(toolbar.getByRole("button", { name: "Day", exact: true }).getAttribute("aria-pressed")).resolves.toBe("false");

      // Next and Previous move the title a week at a time.
      await toolbar.getByRole("button", { name: "Next week" }).click();
      await titleBecomes(page, weekTitle(addDays(opening, 7)));
      await toolbar.getByRole("button", { name: "Previous week" }).click();
      await titleBecomes(page, weekTitle(opening));

      // Every toolbar button is at least 44 px high.
      for (const button of await toolbar.getByRole("button").all()) expect((await button.boundingBox())!.height, await button.innerText()).toBeGreaterThanOrEqual(44);

      // On to the seeded shift's week; its card shows the time on its own line and the rooms.
      for (let step = 0; step < 6 && (await title(page).textContent()) !== weekTitle(seeded.date); step++) {
        const before = await title(page).textContent();
        await toolbar.getByRole("button", { name: "Next week" }).click();
        await page.waitForFunction((text) => document.querySelector('[data-testid="calendar-title"]')?.textContent !== text, before);
      }
      await titleBecomes(page, weekTitle(seeded.date));
      const card = calendar.locator(`[data-shift-id="${seeded.id}"]`);
      await shown(card);
      const time = formatTimeRange(f, seeded.start, seeded.end);
      await expect(card.locator(".shift-card-time").innerText()).resolves.toBe(time);
      const cardText = await card.innerText();
      expect(cardText).toContain(rooms.textile);
      expect(cardText).toContain(rooms.furniture);
      expect(cardText).toContain(`Break ${formatTimeRange(f, seeded.breakStart, seeded.breakEnd)}`);
      await expect(card.getAttribute("tabindex")).resolves.toBe("0");

      // Tab from the toolbar's last button reaches the card (the week's only shift); Enter shows the
      // details and moves the focus there.
      await toolbar.getByRole("button", { name: "Day", exact: true }).focus();
      await page.keyboard.press("Tab");
      await expect(page.evaluate(() => (document.activeElement as HTMLElement | null)?.dataset.shiftId)).resolves.toBe(String(seeded.id));
      await page.keyboard.press("Enter");
      const details = page.getByTestId("shift-details");
      await shown(details);
      await expect(details.getByRole("heading", { level: 3 }).innerText()).resolves.toBe(`Shift on ${formatDay(f, seeded.start)}`);
      await expect(page.evaluate(() => document.activeElement?.id)).resolves.toBe("shift-details-title");
      const detailsText = await details.innerText();
      expect(detailsText).toContain(time);
      expect(detailsText).toContain(`${formatTimeRange(f, seeded.start, seeded.breakStart)} ${rooms.textile} · post 1`);
      await expect(details.getByTestId("shift-breaks").innerText()).resolves.toContain(formatTimeRange(f, seeded.breakStart, seeded.breakEnd));
      const floor = await details.getByTestId("also-on-floor").innerText();
      expect(floor).toContain(colleague.name);
      expect(floor).toContain(`${formatTimeRange(f, seeded.start, new Date(seeded.start.getTime() + 7 * 3_600_000))} ${rooms.furniture} · post 2`);
      expect(floor).not.toContain(elsewhere.name);
      await expect(card.evaluate((el) => el.classList.contains("is-chosen"))).resolves.toBe(true);
      await screenshot(page, "sightward-my-shifts-1440.png");

      // Closing returns the focus to the card; the Day switch shows that day.
      await details.getByRole("button", { name: "Close details" }).click();
      await expect(page.evaluate(() => (document.activeElement as HTMLElement | null)?.dataset.shiftId)).resolves.toBe(String(seeded.id));
      await toolbar.getByRole("button", { name: "Day", exact: true }).click();
      await titleBecomes(page, formatDay(f, seeded.date));
      await expect(toolbar.getByRole("button", { name: "Day", exact: true }).getAttribute("aria-pressed")).resolves.toBe("true");
      await shown(toolbar.getByRole("button", { name: "Next day" }));
      // This week, with today marked.
      await toolbar.getByRole("button", { name: "Week", exact: true }).click();
      await toolbar.getByRole("button", { name: "This week" }).click();
      await titleBecomes(page, weekTitle(siteDate(f, new Date())));
      await expect(calendar.locator(".fc-col-header-cell.fc-day-today").getAttribute("data-date")).resolves.toBe(siteDate(f, new Date()));
      await screenshot(page, "sightward-my-shifts-1440-this-week.png");
    } finally {
      await context.close();
    }
  });

  it("on a phone: the day of the next shift, day steps, and Next shift opens its details", async () => {
    const context = await newContext(browser, { phone: true });
    const page = await context.newPage();
    try {
      const calendar = await openMyShifts(page);
      const opening = await nextShiftDate();
      await titleBecomes(page, formatDay(f, opening));
      await expect(calendar.locator(`.fc-col-header-cell[data-date="${opening}"]`).count()).resolves.toBe(1);
      const toolbar = page.getByTestId("calendar-toolbar");
      await toolbar.getByRole("button", { name: "Next day" }).click();
      await titleBecomes(page, formatDay(f, addDays(opening, 1)));
      await toolbar.getByRole("button", { name: "Previous day" }).click();
      await titleBecomes(page, formatDay(f, opening));
      // Nothing is wider than the phone.
      const overflow = await page.evaluate(() => ({
        width: document.documentElement.scrollWidth,
        // What sticks out, to name it when this fails.
        wide: [...document.querySelectorAll("body *")]
          .filter((el) => el.getBoundingClientRect().right > 391)
          .slice(0, 5)
          .map((el) => `${el.tagName.toLowerCase()}.${(el.getAttribute("class") ?? "").split(" ").slice(0, 3).join(".")} "${(el.textContent ?? "").slice(0, 60)}"`),
      }));
      expect(overflow.width, overflow.wide.join(" | ")).toBeLessThanOrEqual(390);
      for (const button of await toolbar.getByRole("button").all()) expect((await button.boundingBox())!.height, await button.innerText()).toBeGreaterThanOrEqual(44);
      await screenshot(page, "sightward-my-shifts-390-day.png");

      await toolbar.getByRole("button", { name: "Next shift" }).click();
      const details = page.getByTestId("shift-details");
      await shown(details);
      await titleBecomes(page, formatDay(f, opening));
      await screenshot(page, "sightward-my-shifts-390-details.png");
    } finally {
      await context.close();
    }
  });
});
