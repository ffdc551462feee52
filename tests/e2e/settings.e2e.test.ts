// Site settings in Chromium: an admin changes the default accepted extra hours and the currency,
// a bad currency is named on the form and nothing is saved, a good one is saved and kept after a
// reload; the form works at phone width. The demo values are put back at the end.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let siteId: number;
let before: { currency: string; labour_rules: unknown; opening_hours: unknown };

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

beforeAll(async () => {
  browser = await launchBrowser();
  const site = await db.selectFrom("sites").select(["id", "currency", "labour_rules", "opening_hours"]).orderBy("id").executeTakeFirstOrThrow();
  siteId = site.id;
  before = { currency: site.currency, labour_rules: site.labour_rules, opening_hours: site.opening_hours };
});

afterAll(async () => {
  await db
    .updateTable("sites")
    .set({ currency: before.currency, labour_rules: JSON.stringify(before.labour_rules), opening_hours: JSON.stringify(before.opening_hours) })
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
    } finally {
      await context.close();
    }
  }, 60_000);
});
