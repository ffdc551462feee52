// An admin reads what the local mail fake caught: a message sent through lib/mail shows up in the
// mail list and opens with its text and attachments; other roles are kept out.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import { listCaughtMail, sendMail } from "@/lib/mail";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";

let browser: Browser;

beforeAll(async () => {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) {
    throw new Error("SMTP_PORT and MAIL_DIR are not set: this test needs the mail fake that `npm test` starts, with the same MAIL_DIR as the app");
  }
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

async function waitForMailTo(address: string) {
  const deadline = Date.now() + 15_000;
  for (;;) {
    const found = await listCaughtMail({ to: address });
    if (found.length > 0) return found[0]!;
    if (Date.now() > deadline) throw new Error(`no caught message to ${address} after 15 s`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

describe("caught mail in the app", () => {
  it("an admin finds a sent message in the list and reads it", async () => {
    const recipient = `mail-view-${randomUUID()}@example.org`;
    const subject = `Roster published ${randomUUID().slice(0, 8)}`;
    await sendMail({
      to: recipient,
      subject,
      text: "Your shifts for the week are attached.\nSee you at the Textile Gallery.",
      html: "<p>Your shifts for the week are attached.</p>",
      attachments: [{ filename: "shifts.ics", content: "BEGIN:VCALENDAR\r\nVERSION:2.0\r\nEND:VCALENDAR\r\n", contentType: "text/calendar" }],
    });
    const caught = await waitForMailTo(recipient);

    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      const admin = DEMO_ACCOUNTS.find((a) => a.role === "admin")!;
      await signInThroughForm(page, admin.email, DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Mail" }).click();
      await page.waitForURL((url) => url.pathname === "/mail");
      await page.getByRole("link", { name: subject }).click();
      await page.waitForURL((url) => url.pathname === `/mail/${caught.id}`);
      await page.getByRole("heading", { level: 1, name: subject }).waitFor();
      const article = await page.getByRole("article").innerText();
      expect(article).toContain(recipient);
      expect(article).toContain("See you at the Textile Gallery.");
      expect(article).toContain("shifts.ics");
    } finally {
      await context.close();
    }
  });

  it("a guard opening the mail pages gets 403", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      const guard = DEMO_ACCOUNTS.find((a) => a.role === "guard")!;
      await signInThroughForm(page, guard.email, DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      expect((await page.goto("/mail"))?.status()).toBe(403);
      expect((await page.goto("/mail/any-message"))?.status()).toBe(403);
    } finally {
      await context.close();
    }
  });
});
