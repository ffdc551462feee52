// Each demo role signs in through our form in Chromium and lands on its home with real seeded data;
// a wrong password is refused; a guard meets our 403 on a manager page; an unknown address our 404.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, sessionCookie, signInThroughForm } from "./support/browser";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let siteName: string;

beforeAll(async () => {
  browser = await launchBrowser();
  const site = await db.selectFrom("sites").select("name").orderBy("id").limit(1).executeTakeFirstOrThrow();
  siteName = site.name;
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

/** Waits until the element is on screen (fails the test after the timeout when it never is). */
async function shown(locator: Locator): Promise<void> {
  await locator.waitFor({ state: "visible", timeout: 15_000 });
}

function account(role: string) {
  const found = DEMO_ACCOUNTS.find((a) => a.role === role);
  if (!found) throw new Error(`no demo account for ${role}`);
  return found;
}

const HOMES = [
  { role: "admin", heading: "Administration", nav: ["Galleries", "Settings", "Users", "Mail"], notNav: ["Staffing", "My shifts"] },
  { role: "operations", heading: "Operations overview", nav: ["Galleries", "Exhibitions", "Staffing", "People"], notNav: ["Users", "My shifts"] },
  { role: "curator", heading: "Curator's desk", nav: ["Galleries"], notNav: ["Staffing", "People", "Users"] },
  { role: "guard", heading: "My next shift", nav: ["My shifts"], notNav: ["Galleries", "People", "Users"] },
] as const;

describe("each demo role signs in and lands on its home", () => {
  for (const home of HOMES) {
    it(`${home.role} sees "${home.heading}", the museum and its own navigation`, async () => {
      const context = await newContext(browser);
      const page = await context.newPage();
      try {
        const { email, name } = account(home.role);
        await signInThroughForm(page, email, DEMO_PASSWORD);
        await page.waitForURL((url) => url.pathname === "/");
        await shown(page.getByRole("heading", { level: 1, name: home.heading }));
        // Real data from the database: the site's name and the signed-in person's name.
        await shown(page.getByText(siteName).first());
        await shown(page.getByText(name).first());
        const nav = page.getByRole("navigation", { name: "Main" });
        for (const entry of home.nav) await expect(nav.getByRole("link", { name: entry }).count()).resolves.toBe(1);
        for (const entry of home.notNav) await expect(nav.getByRole("link", { name: entry }).count()).resolves.toBe(0);
        // The cautions README.md asks for are on every signed-in page.
        await shown(page.getByText("A post plan is a sightline aid, not a security risk assessment"));
        await shown(page.getByText("Posts must never block exits"));
        await shown(page.getByText("Labour rules are defaults"));
      } finally {
        await context.close();
      }
    });
  }

  it("the operations home names the current exhibition and today's rooms from the database", async () => {
    const today = new Date().toISOString().slice(0, 10);
    const exhibition = await db
      .selectFrom("exhibitions")
      .select(["name", "starts_on", "ends_on"])
      .where("ends_on", ">=", today)
      .orderBy("starts_on")
      .limit(1)
      .executeTakeFirst();
    const room = await db.selectFrom("rooms").select("name").orderBy("id").limit(1).executeTakeFirstOrThrow();
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, account("operations").email, DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      if (exhibition) await shown(page.getByText(exhibition.name).first());
      const today = page.getByRole("region", { name: /^Today at/ });
      const text = await today.innerText();
      // Either the site is open today and lists its rooms, or it says it is closed.
      expect(text.includes(room.name) || text.includes("closed today")).toBe(true);
    } finally {
      await context.close();
    }
  });

  it("the guard home shows the next published shift from the shifts table, or \"None yet\"", async () => {
    const guardAccount = account("guard");
    const next = await db
      .selectFrom("shifts")
      .innerJoin("rosters", "rosters.id", "shifts.roster_id")
      .innerJoin("guards", "guards.id", "shifts.guard_id")
      .innerJoin("users", "users.id", "guards.user_id")
      .select("shifts.starts_at")
      .where("users.email", "=", guardAccount.email)
      .where("rosters.status", "=", "published")
      .where("shifts.ends_at", ">", new Date())
      .orderBy("shifts.starts_at")
      .limit(1)
      .executeTakeFirst();
    const context = await newContext(browser, { phone: true });
    const page = await context.newPage();
    try {
      await signInThroughForm(page, guardAccount.email, DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      const panel = page.getByRole("region", { name: "Next shift" });
      const text = await panel.innerText();
      if (next) expect(text).not.toContain("None yet");
      else expect(text).toContain("None yet");
      // On a phone the guard reaches their shifts and the calendar.
      await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "My shifts" }).click();
      await page.waitForURL((url) => url.pathname === "/my-shifts");
      await shown(page.getByRole("heading", { level: 1, name: "My shifts" }));
      await page.locator(".fc-timegrid").waitFor();
    } finally {
      await context.close();
    }
  });
});

describe("nothing leaves the machine", () => {
  it("every request the pages make (fonts, scripts, styles, data) goes to the app itself", async () => {
    const origin = new URL(process.env.E2E_BASE_URL!).origin;
    const elsewhere: string[] = [];
    for (const [role, paths] of [
      ["operations", ["/", "/galleries", "/exhibitions", "/staffing", "/people"]],
      ["guard", ["/", "/my-shifts"]],
      ["admin", ["/users", "/mail", "/settings"]],
    ] as const) {
      const context = await newContext(browser);
      const page = await context.newPage();
      page.on("request", (request) => {
        const url = request.url();
        if (!url.startsWith(origin) && !url.startsWith("data:") && !url.startsWith("blob:")) elsewhere.push(url);
      });
      try {
        await signInThroughForm(page, account(role).email, DEMO_PASSWORD);
        await page.waitForURL((url) => url.pathname === "/");
        for (const path of paths) {
          await page.goto(path);
          await page.waitForLoadState("networkidle");
        }
      } finally {
        await context.close();
      }
    }
    expect(elsewhere).toEqual([]);
  });
});

describe("refusals", () => {
  it("a wrong password is refused with a clear message and no session", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, account("admin").email, "not-the-password");
      // Our message, not the router's empty live region (which also has role alert).
      const alert = page.getByRole("alert").filter({ hasText: "do not match" });
      await shown(alert);
      expect(await alert.innerText()).toContain("do not match an account");
      expect(new URL(page.url()).pathname).toBe("/sign-in");
      expect(await sessionCookie(context)).toBeUndefined();
      const session = await (await page.request.get("/api/auth/session")).json();
      expect(session).toEqual({});
      // And a protected page still sends the browser back to sign in.
      await page.goto("/users");
      expect(new URL(page.url()).pathname).toBe("/sign-in");
    } finally {
      await context.close();
    }
  });

  it("a guard who opens a manager page gets our 403 page, answered with status 403", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, account("guard").email, DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      for (const path of ["/staffing", "/people", "/users", "/mail"]) {
        const response = await page.goto(path);
        expect(response?.status(), path).toBe(403);
        await shown(page.getByRole("heading", { level: 1, name: "Not for your role" }));
        expect(new URL(page.url()).pathname).toBe(path);
      }
    } finally {
      await context.close();
    }
  });

  it("an unknown address shows our own 404 page", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, account("curator").email, DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      const response = await page.goto("/no-such-gallery-here");
      expect(response?.status()).toBe(404);
      await shown(page.getByRole("heading", { level: 1, name: "No such page" }));
    } finally {
      await context.close();
    }
  });
});
