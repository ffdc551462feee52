// Accounts in Chromium: an admin invites a person from the Users page; the person opens the link
// from the mail (the local mail fake), chooses a password and signs in; the admin disables the
// account and the person is refused at sign-in with the reason; enabled again, they get back in.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { listCaughtMail, readCaughtMail } from "@/lib/mail";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
const EMAIL = `e2e.invite.${process.pid}@example.org`;
const PASSWORD = "a long enough password";

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

async function linkFromMail(to: string): Promise<string> {
  const deadline = Date.now() + 20_000;
  for (;;) {
    const found = await listCaughtMail({ to });
    if (found.length > 0) {
      const mail = (await readCaughtMail(found[0]!.id))!;
      const link = /https?:\/\/\S+\/set-password\?token=[A-Za-z0-9_-]+/.exec(mail.text)?.[0];
      if (link) return link;
    }
    if (Date.now() > deadline) throw new Error(`no invitation reached ${to}`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

beforeAll(async () => {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) throw new Error("SMTP_PORT and MAIL_DIR are not set: run this through npm test (it starts the mail fake)");
  browser = await launchBrowser();
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
});

afterAll(async () => {
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
  await browser?.close();
  await db.destroy();
});

describe("inviting and disabling", () => {
  it("an invited person sets a password from the mail and signs in; disabled, they are refused", async () => {
    const adminContext = await newContext(browser);
    const admin = await adminContext.newPage();
    try {
      await signInThroughForm(admin, "admin@example.org", DEMO_PASSWORD);
      await admin.waitForURL((url) => url.pathname === "/");
      await admin.goto("/users");
      await admin.waitForLoadState("networkidle");
      const form = admin.getByRole("form", { name: "Invite a person" });
      await form.getByLabel("Name").fill("Edda Example");
      await form.getByLabel("E-mail").fill(EMAIL);
      await form.getByLabel("Role").selectOption("guard");
      await form.getByRole("button", { name: "Send invitation" }).click();
      await shown(form.getByText(`Invitation sent to ${EMAIL}; the link works once, for 7 days.`));
      await shown(admin.getByRole("row", { name: /Edda Example/ }).getByText("invited"));

      const link = await linkFromMail(EMAIL);
      const personContext = await newContext(browser, { phone: true });
      const person = await personContext.newPage();
      try {
        await person.goto(link.replace(/^https?:\/\/[^/]+/, ""));
        await person.waitForLoadState("networkidle");
        await person.getByLabel("New password").fill(PASSWORD);
        await person.getByLabel("The same password again").fill("a different password");
        await person.getByRole("button", { name: "Set password" }).click();
        await shown(person.getByText("the two passwords differ; type the same one twice"));
        await person.getByLabel("The same password again").fill(PASSWORD);
        await person.getByRole("button", { name: "Set password" }).click();
        await shown(person.getByText(`Your password is set for ${EMAIL}.`));
        await signInThroughForm(person, EMAIL, PASSWORD);
        await person.waitForURL((url) => url.pathname === "/");
        await shown(person.getByRole("heading", { level: 1, name: "My next shift" }));
      } finally {
        await personContext.close();
      }

      await admin.reload();
      await admin.waitForLoadState("networkidle");
      const row = admin.getByRole("row", { name: /Edda Example/ });
      await row.getByRole("button", { name: "Disable Edda Example" }).click();
      await shown(row.getByText("Edda Example can no longer sign in."));
      const refusedContext = await newContext(browser);
      const refused = await refusedContext.newPage();
      try {
        await signInThroughForm(refused, EMAIL, PASSWORD);
        await shown(refused.getByText(/This account is disabled; ask an administrator to enable it again\./));
        expect(new URL(refused.url()).pathname).toBe("/sign-in");
      } finally {
        await refusedContext.close();
      }
      await admin.reload();
      await admin.waitForLoadState("networkidle");
      await admin.getByRole("row", { name: /Edda Example/ }).getByRole("button", { name: "Enable Edda Example" }).click();
      await expect.poll(async () => (await db.selectFrom("users").select("disabled_at").where("email", "=", EMAIL).executeTakeFirstOrThrow()).disabled_at).toBeNull();
    } finally {
      await adminContext.close();
    }
  }, 90_000);
});
