// Site settings in Chromium: an admin changes the default accepted extra hours and the currency,
// a bad currency is named on the form and nothing is saved, a good one is saved and kept after a
// reload; a special day typed day first is stored as a calendar date; the form works at phone
// width. The demo values are put back at the end.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let siteId: number;
let before: { name: string; mail_sender: string | null; currency: string; labour_rules: unknown; opening_hours: unknown };

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

beforeAll(async () => {
  browser = await launchBrowser();
  const site = await db.selectFrom("sites").select(["id", "name", "mail_sender", "currency", "labour_rules", "opening_hours"]).orderBy("id").executeTakeFirstOrThrow();
  siteId = site.id;
  before = { name: site.name, mail_sender: site.mail_sender, currency: site.currency, labour_rules: site.labour_rules, opening_hours: site.opening_hours };
});

afterAll(async () => {
  await db
    .updateTable("sites")
    .set({ name: before.name, mail_sender: before.mail_sender, currency: before.currency, labour_rules: JSON.stringify(before.labour_rules), opening_hours: JSON.stringify(before.opening_hours) })
    .where("id", "=", siteId)
    .execute();
  await browser?.close();
  await db.destroy();
});

describe("site settings", () => {
  it("names a bad currency and saves nothing, then saves good values that stay after a reload (phone width)", async () => {
    const context = await newContext(browser, { phone: true });
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "admin@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto("/settings");
      await page.waitForLoadState("networkidle");
      const form = page.getByRole("form", { name: `Settings of site ${siteId}` });
      await shown(form);
      // The form fills its fields once the page is interactive: wait for that before typing.
      await expect.poll(() => form.getByLabel("Currency").inputValue(), { timeout: 15_000 }).toBe(before.currency);
      await form.getByLabel("Currency").fill("EURO");
      await form.getByLabel("Extra hours a week a guard accepts").fill("6");
      await form.getByRole("button", { name: "Save settings" }).click();
      await shown(form.getByText("use an ISO 4217 currency code such as EUR or GBP"));
      const unchanged = await db.selectFrom("sites").select(["currency", "labour_rules"]).where("id", "=", siteId).executeTakeFirstOrThrow();
      expect(unchanged.currency).toBe(before.currency);
      await form.getByLabel("Currency").fill("gbp");
      await form.getByRole("button", { name: "Save settings" }).click();
      await shown(form.getByText(/^Settings saved\./));
      const saved = await db.selectFrom("sites").select(["currency", "labour_rules"]).where("id", "=", siteId).executeTakeFirstOrThrow();
      expect(saved.currency).toBe("GBP");
      expect((saved.labour_rules as { acceptedExtraHours?: number }).acceptedExtraHours).toBe(6);
      await page.reload();
      await page.waitForLoadState("networkidle");
      const again = page.getByRole("form", { name: `Settings of site ${siteId}` });
      await expect.poll(() => again.getByLabel("Currency").inputValue(), { timeout: 15_000 }).toBe("GBP");
      // Opening hours: Sunday closes at 19:00 now.
      await again.getByLabel("Sunday closes").fill("19:00");
      await again.getByRole("button", { name: "Save settings" }).click();
      await shown(again.getByText(/^Settings saved\./));
      const hours = await db.selectFrom("sites").select("opening_hours").where("id", "=", siteId).executeTakeFirstOrThrow();
      expect(hours.opening_hours.weekly.sun).toEqual(["11:00", "19:00"]);
      // A special day typed the demo site's en-GB way, day first (Unicode CLDR date patterns), is stored as YYYY-MM-DD.
      const kept = Object.keys(hours.opening_hours.dates ?? {}).length;
      await again.getByRole("button", { name: "Add a special day" }).click();
      await again.getByLabel(`Special day ${kept + 1} (dd/mm/yyyy)`).fill("01/12/2099");
      await again.getByRole("button", { name: "Save settings" }).click();
      const special = async () => (await db.selectFrom("sites").select("opening_hours").where("id", "=", siteId).executeTakeFirstOrThrow()).opening_hours.dates ?? {};
      await expect.poll(async () => Object.hasOwn(await special(), "2099-12-01"), { timeout: 15_000 }).toBe(true);
      expect((await special())["2099-12-01"]).toBeNull();
    } finally {
      await context.close();
    }
  }, 60_000);

  it("renames the site and sets its mail sender (a malformed sender is named, nothing saved); longer opening hours show on Staffing", async () => {
    const admin = await newContext(browser);
    const operations = await newContext(browser);
    try {
      const ops = await operations.newPage();
      await signInThroughForm(ops, "operations@example.org", DEMO_PASSWORD);
      await ops.waitForURL((url) => url.pathname === "/");
      const postHours = async () => {
        await ops.goto("/staffing");
        const text = await ops.getByText(/One post staffed through every opening hour needs/).innerText();
        return Number(/needs ([\d.,]+) post-hours/.exec(text)![1]!.replace(",", ""));
      };
      const hoursBefore = await postHours();

      const page = await admin.newPage();
      await signInThroughForm(page, "admin@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto("/settings");
      await page.waitForLoadState("networkidle");
      const form = page.getByRole("form", { name: `Settings of site ${siteId}` });
      await expect.poll(() => form.getByLabel("Name of the site").inputValue(), { timeout: 15_000 }).toBe(before.name);
      await form.getByLabel("Mail sender").fill("Security <security>");
      await form.getByRole("button", { name: "Save settings" }).click();
      await shown(form.getByText(/use an address such as security@example.org/));
      expect((await db.selectFrom("sites").select("mail_sender").where("id", "=", siteId).executeTakeFirstOrThrow()).mail_sender).toBe(before.mail_sender);

      await form.getByLabel("Name of the site").fill(`${before.name} (renamed)`);
      await form.getByLabel("Mail sender").fill("Museum Security <security@example.org>");
      // Monday opens an hour earlier than before (or 09:00–18:00 when it was closed).
      const monday = (before.opening_hours as { weekly: Record<string, [string, string] | null> }).weekly.mon;
      const closedBox = form.getByLabel("Monday closed");
      if (monday === null && (await closedBox.count()) > 0) await closedBox.uncheck();
      const opens = monday ? `${String(Number(monday[0].slice(0, 2)) - 1).padStart(2, "0")}${monday[0].slice(2)}` : "09:00";
      await form.getByLabel("Monday opens").fill(opens);
      if (!monday) await form.getByLabel("Monday closes").fill("18:00");
      await form.getByRole("button", { name: "Save settings" }).click();
      await shown(form.getByText(/^Settings saved\./));
      const row = await db.selectFrom("sites").select(["name", "mail_sender", "opening_hours"]).where("id", "=", siteId).executeTakeFirstOrThrow();
      expect(row).toMatchObject({ name: `${before.name} (renamed)`, mail_sender: "Museum Security <security@example.org>" });
      expect(row.opening_hours.weekly.mon?.[0]).toBe(opens);
      await shown(page.getByRole("heading", { level: 2, name: `${before.name} (renamed)` }));

      // One more opening hour a week (nine when Monday was closed) means as many more post-hours per post.
      expect(await postHours()).toBeCloseTo(hoursBefore + (monday ? 1 : 9), 5);
    } finally {
      await admin.close();
      await operations.close();
    }
  }, 90_000);
});
