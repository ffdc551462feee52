// An admin changes a user's role through the users page (react-hook-form, PATCH /api/users/[id]);
// the database holds the new role, and the page says so. The role is put back afterwards.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import type { Role } from "@/db/schema";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let target: { id: number; name: string; role: Role };

beforeAll(async () => {
  browser = await launchBrowser();
  target = await db
    .selectFrom("users")
    .select(["id", "name", "role"])
    .where("role", "=", "guard")
    .where("email", "not in", DEMO_ACCOUNTS.map((a) => a.email))
    .orderBy("id", "desc")
    .limit(1)
    .executeTakeFirstOrThrow();
});

afterAll(async () => {
  if (target) await db.updateTable("users").set({ role: target.role }).where("id", "=", target.id).execute();
  await browser?.close();
  await db.destroy();
});

describe("users page", () => {
  it("an admin changes a guard to curator and back with the role form", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      const admin = DEMO_ACCOUNTS.find((a) => a.role === "admin")!;
      await signInThroughForm(page, admin.email, DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto("/users");
      const select = page.getByLabel(`Role of ${target.name}`, { exact: true });
      const row = page.getByRole("row").filter({ has: select });
      // Save is enabled once the page is interactive: only then does the form see the choice.
      await row.getByRole("button", { name: "Save" }).click({ trial: true });
      await select.selectOption("curator");
      await row.getByRole("button", { name: "Save" }).click();
      await row.getByRole("status").filter({ hasText: "Saved" }).waitFor({ timeout: 15_000 });
      const afterChange = await db.selectFrom("users").select("role").where("id", "=", target.id).executeTakeFirstOrThrow();
      expect(afterChange.role).toBe("curator");

      await select.selectOption(target.role);
      await row.getByRole("button", { name: "Save" }).click();
      await row.getByRole("status").filter({ hasText: "Saved" }).waitFor({ timeout: 15_000 });
      const afterRevert = await db.selectFrom("users").select("role").where("id", "=", target.id).executeTakeFirstOrThrow();
      expect(afterRevert.role).toBe(target.role);
    } finally {
      await context.close();
    }
  });
});
