// People in Chromium: operations adds a guard (a bad contract is named on the form and nothing is
// saved), the guard gets an invitation mail, operations edits their contract hours and takes them
// off the staff; the table says so. The guard is removed again at the end.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { listCaughtMail } from "@/lib/mail";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
const EMAIL = `e2e.guard.${process.pid}@example.org`;

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

beforeAll(async () => {
  browser = await launchBrowser();
  await db.deleteFrom("guards").where("email", "=", EMAIL).execute();
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
});

afterAll(async () => {
  await db.deleteFrom("guards").where("email", "=", EMAIL).execute();
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
  await browser?.close();
  await db.destroy();
});

describe("People", () => {
  it("operations adds, edits and retires a guard; the guard is invited by mail", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "operations@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto("/people");
      await page.waitForLoadState("networkidle");
      // Hours this week come from the week's published roster, or the table says there is none.
      await shown(page.getByRole("columnheader", { name: /Hours this week/ }));
      const today = new Date().toLocaleDateString("en-CA", { timeZone: "Europe/Berlin" });
      const d = new Date(`${today}T12:00:00Z`);
      d.setUTCDate(d.getUTCDate() - ((d.getUTCDay() + 6) % 7));
      const published = await db.selectFrom("rosters").select("id").where("starts_on", "=", d.toISOString().slice(0, 10)).where("status", "=", "published").executeTakeFirst();
      const amira = page.getByRole("row", { name: /Amira Haddad/ });
      if (published) await shown(amira.getByText(/^\d+(\.\d+)? h$/).first());
      else await shown(amira.getByText("not published"));
      await page.getByRole("button", { name: "Add a guard" }).click();
      const form = page.getByRole("form", { name: "Add a guard" });
      await form.getByLabel("Name").fill("Wren Example");
      await form.getByLabel("E-mail").fill(EMAIL);
      await form.getByLabel("Contract hours a week").fill("60");
      await form.getByLabel("Maximum hours a week").fill("48");
      await form.getByLabel("Skills").fill("first-aid, evening");
      await form.getByRole("button", { name: "Add guard" }).click();
      await shown(form.getByText("contract hours cannot exceed the maximum hours"));
      expect(await db.selectFrom("guards").select("id").where("email", "=", EMAIL).executeTakeFirst()).toBeUndefined();
      await form.getByLabel("Contract hours a week").fill("24");
      await form.getByRole("button", { name: "Add guard" }).click();
      const row = page.getByRole("row", { name: /Wren Example/ });
      await shown(row, 30_000);
      await expect.poll(async () => (await listCaughtMail({ to: EMAIL })).length, { timeout: 20_000 }).toBeGreaterThan(0);

      await row.getByRole("button", { name: "Edit Wren Example" }).click();
      const editForm = page.getByRole("form", { name: "Edit Wren Example" });
      await editForm.getByLabel("Contract hours a week").fill("20");
      await editForm.getByLabel(/On the staff/).uncheck();
      await editForm.getByRole("button", { name: "Save guard" }).click();
      // Saved: the form closes and the row carries the "left" tag.
      await editForm.waitFor({ state: "detached", timeout: 15_000 });
      await shown(page.getByRole("row", { name: /Wren Example/ }).getByText("left", { exact: true }));
      const saved = await db.selectFrom("guards").select(["contract_hours", "active", "skills"]).where("email", "=", EMAIL).executeTakeFirstOrThrow();
      expect([Number(saved.contract_hours), saved.active, saved.skills]).toEqual([20, false, ["first-aid", "evening"]]);
    } finally {
      await context.close();
    }
  }, 90_000);
});
