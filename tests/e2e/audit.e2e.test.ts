// The audit trail in Chromium: an admin changes a person's role on Users, then finds the change
// on the Audit trail page by filtering to "Users and roles" and to themselves, with the role's
// before and after; operations cannot open the page (403).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
const EMAIL = `audit.e2e.${process.pid}@example.org`;

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

beforeAll(async () => {
  browser = await launchBrowser();
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
  await db.insertInto("users").values({ email: EMAIL, name: "Aude Trail", role: "guard", password_hash: "!no-password-set" }).execute();
});

afterAll(async () => {
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
  await browser?.close();
  await db.destroy();
});

describe("the audit trail page", () => {
  it("shows an admin's role change with before and after, filtered by part and person", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "admin@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto("/users");
      await page.waitForLoadState("networkidle");
      const row = page.getByRole("row", { name: /Aude Trail/ });
      await row.getByLabel("Role of Aude Trail").selectOption("curator");
      await row.getByRole("button", { name: "Save" }).click();
      await shown(row.getByText("Saved"));

      await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Audit trail" }).click();
      await page.waitForURL((url) => url.pathname === "/audit");
      await page.waitForLoadState("networkidle");
      await page.getByLabel("Part").selectOption("user");
      const admin = await db.selectFrom("users").select("name").where("email", "=", "admin@example.org").executeTakeFirstOrThrow();
      await page.getByLabel("Who").selectOption(admin.name);
      await page.getByLabel("Search").fill("Aude Trail");
      const entry = page.getByTestId("audit").getByRole("row", { name: /changed the role of Aude Trail from guard to curator/ });
      await shown(entry);
      expect(await entry.innerText()).toMatch(/role: guard → curator/);
      // Another part of the product hides it.
      await page.getByLabel("Part").selectOption("room");
      await shown(page.getByText("No changes match."));
    } finally {
      await context.close();
    }
  });

  it("is for admins only: operations gets 403", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "operations@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      expect((await page.goto("/audit"))?.status()).toBe(403);
    } finally {
      await context.close();
    }
  });
});
