// One date format on every page: with the main site set to de-DE (in the database, put back at the
// end), each demo role's pages, the day's sign-in sheet and a room page show dates only the German
// way: no ISO dates, no English months, no month-first digits. The German text expected is built
// here with the platform's Intl for de-DE (Unicode CLDR date patterns), not with lib/format. A
// guard also types a time-off request in the German digit order (dd.mm.yyyy) and the database
// holds the "YYYY-MM-DD" dates.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import { can, navigationFor } from "@/lib/auth/roles";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let siteId: number;
let previousLocale: string;
let zone: string;
let roomId: number;
let sheetDate: string;
/** Time off the guard asks for below: far ahead, so no roster of the other tests meets it. */
const OFF = { from: "2099-01-18", to: "2099-01-19" };

// Unicode CLDR date patterns through Intl: de-DE writes "18. Jan. 2099", "Mo., 18. Jan. 2099".
const german = (options: Intl.DateTimeFormatOptions, timeZone: string) => new Intl.DateTimeFormat("de-DE", { ...options, timeZone });
const germanDate = (date: string) => german({ day: "numeric", month: "short", year: "numeric" }, "UTC").format(new Date(`${date}T12:00:00Z`));
const germanDay = (date: string) => german({ weekday: "short", day: "numeric", month: "short", year: "numeric" }, "UTC").format(new Date(`${date}T12:00:00Z`));
/** The site's calendar date of an instant, "YYYY-MM-DD" (en-CA writes ISO order). */
const localDate = (at: Date) => new Intl.DateTimeFormat("en-CA", { timeZone: zone, year: "numeric", month: "2-digit", day: "2-digit" }).format(at);

/** A German date with its year, as CLDR's de-DE medium date reads: "2. Dez. 2026", "9. Mai 2027". */
const GERMAN_DATE = /\d{1,2}\. [A-ZÄÖÜ][a-zä]{2,3}\.? \d{4}/;
const EN_MONTH = "(?:Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)";
/** Dates written a second way: ISO, English day-month and month-day, English weekday first, any slashed digits. */
const SECOND_FORMATS: [string, RegExp][] = [
  ["an ISO date", /\b\d{4}-\d{2}-\d{2}\b/],
  ["an English day and month", new RegExp(`\\b\\d{1,2} ${EN_MONTH}\\b`)],
  ["an English month and day", new RegExp(`\\b${EN_MONTH} \\d{1,2}\\b`)],
  ["an English weekday and day", /\b(?:Mon|Tue|Wed|Thu|Fri|Sat|Sun),? \d{1,2}\b/],
  ["a slashed numeric date", /\b\d{1,2}\/\d{1,2}\/\d{4}\b/],
];

beforeAll(async () => {
  browser = await launchBrowser();
  const site = await db.selectFrom("sites").select(["id", "locale", "time_zone"]).orderBy("id").executeTakeFirstOrThrow();
  siteId = site.id;
  previousLocale = site.locale;
  zone = site.time_zone;
  roomId = (await db.selectFrom("rooms").innerJoin("floors", "floors.id", "rooms.floor_id").select("rooms.id").where("floors.site_id", "=", siteId).orderBy("rooms.id").executeTakeFirstOrThrow()).id;
  // The sheet of a day with published shifts when there is one, so shift times are on it too.
  const published = await db
    .selectFrom("shifts")
    .innerJoin("rosters", "rosters.id", "shifts.roster_id")
    .select("shifts.starts_at")
    .where("rosters.site_id", "=", siteId)
    .where("rosters.status", "=", "published")
    .orderBy("shifts.starts_at", "desc")
    .limit(1)
    .executeTakeFirst();
  sheetDate = published ? localDate(published.starts_at) : "2027-01-18";
  await deleteTimeOff();
  await db.updateTable("sites").set({ locale: "de-DE" }).where("id", "=", siteId).execute();
});

afterAll(async () => {
  await db.updateTable("sites").set({ locale: previousLocale }).where("id", "=", siteId).execute();
  await deleteTimeOff();
  await browser?.close();
  await db.destroy();
});

async function deleteTimeOff() {
  await db.deleteFrom("time_off").where("starts_on", "=", OFF.from).where("ends_on", "=", OFF.to).execute();
}

/** Columns that show text kept as it was written (a mail's subject, a change's summary and values), by page. */
const STORED_COLUMNS: Record<string, string[]> = {
  "/mail": ["Subject", "Status"],
  "/audit": ["What", "Changes"],
};

/** What the page shows a person, without the stored text of STORED_COLUMNS. */
async function visibleText(page: Page, path: string): Promise<string> {
  await page.goto(path);
  await page.waitForLoadState("networkidle");
  return page.evaluate((dropped) => {
    for (const table of document.querySelectorAll("table")) {
      const headers = [...table.querySelectorAll("thead th")].map((th) => th.textContent?.trim() ?? "");
      const columns = headers.flatMap((header, i) => (dropped.some((name) => header.startsWith(name)) ? [i] : []));
      for (const row of table.querySelectorAll("tbody tr")) for (const i of columns) row.children[i]?.replaceChildren();
    }
    return document.body.innerText;
  }, STORED_COLUMNS[path] ?? []);
}

function expectOneFormat(text: string, path: string) {
  for (const [what, pattern] of SECOND_FORMATS) {
    const found = pattern.exec(text);
    expect(found?.[0] ?? null, `${path} shows ${what}`).toBeNull();
  }
}

describe("one date format on every page (site locale de-DE)", () => {
  for (const account of DEMO_ACCOUNTS) {
    it(`${account.role}: every page of the navigation shows dates only the German way`, async () => {
      const context = await newContext(browser);
      const page = await context.newPage();
      try {
        await signInThroughForm(page, account.email, DEMO_PASSWORD);
        await page.waitForURL((url) => url.pathname === "/");
        const today = localDate(new Date());
        // Pages that always show a date, with one German date each of them must hold.
        const dated = new Map<string, string | RegExp>([["/", germanDay(today)]]);
        if (can(account.role, "exhibitions:view")) dated.set("/exhibitions", GERMAN_DATE);
        if (can(account.role, "staffing:view")) dated.set(`/staffing/sheet?date=${sheetDate}`, germanDay(sheetDate));
        if (can(account.role, "galleries:view")) {
          const room = await db.selectFrom("rooms").select("updated_at").where("id", "=", roomId).executeTakeFirstOrThrow();
          dated.set(`/galleries/${roomId}`, germanDate(localDate(room.updated_at)));
        }
        const paths = [...new Set([...dated.keys(), ...navigationFor(account.role).map((entry) => entry.href)])];
        for (const path of paths) {
          const text = await visibleText(page, path);
          expectOneFormat(text, path);
          const expected = dated.get(path);
          if (typeof expected === "string") expect(text, `${path} shows ${expected}`).toContain(expected);
          else if (expected) expect(text, `${path} shows a German date`).toMatch(expected);
        }
      } finally {
        await context.close();
      }
    }, 180_000);
  }

  it("a guard types time off in the German order (dd.mm.yyyy); the database holds YYYY-MM-DD and the list shows German dates", async () => {
    const context = await newContext(browser, { phone: true });
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "guard@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto("/my-shifts");
      await page.waitForLoadState("networkidle");
      // de-DE writes a numeric date day first with dots: 18.01.2099 (Unicode CLDR date patterns).
      await expect(page.getByLabel("First day off").getAttribute("placeholder")).resolves.toBe("dd.mm.yyyy");
      await page.getByLabel("First day off").fill("18.01.2099");
      await page.getByLabel("Last day off").fill("19.01.2099");
      await page.getByLabel("Note for operations").fill("one-format e2e test");
      await page.getByRole("button", { name: "Ask for time off" }).click();
      await page.getByText("Asked; operations will decide.").waitFor({ state: "visible", timeout: 15_000 });
      const saved = await db.selectFrom("time_off").select(["starts_on", "ends_on", "note"]).where("note", "=", "one-format e2e test").executeTakeFirstOrThrow();
      expect([saved.starts_on, saved.ends_on]).toEqual([OFF.from, OFF.to]);
      await page.reload();
      await page.waitForLoadState("networkidle");
      const text = await page.evaluate(() => document.body.innerText);
      expect(text).toContain(germanDate(OFF.from));
      expect(text).toContain(germanDate(OFF.to));
      expectOneFormat(text, "/my-shifts");
    } finally {
      await context.close();
    }
  }, 60_000);
});
