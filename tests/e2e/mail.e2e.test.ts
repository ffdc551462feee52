// The admin's Mail page is the outbox: a message that did not go out is listed as failed with its
// reason, filters find it, "Resend" sends it through the local mail fake and the row turns sent;
// an invitation shows with its set-password link masked; other roles are kept out.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import { listCaughtMail } from "@/lib/mail";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
const RECIPIENT = `outbox-e2e-${randomUUID()}@example.org`;
const SUBJECT = `Notice ${randomUUID().slice(0, 8)}`;

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

beforeAll(async () => {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) {
    throw new Error("SMTP_PORT and MAIL_DIR are not set: this test needs the mail fake that `npm test` starts, with the same MAIL_DIR as the app");
  }
  browser = await launchBrowser();
  // A message an earlier attempt could not hand over (as the app records one when the mail server is away).
  await db
    .insertInto("outbox")
    .values({
      kind: "notice",
      sender: "Sightward <no-reply@example.org>",
      recipient: RECIPIENT,
      subject: SUBJECT,
      body: "The staff entrance is closed on Monday; use the north door.\nYour feed: http://127.0.0.1/api/calendar/abcdefghijklmnop",
      status: "failed",
      attempts: 1,
      last_error: "connect ECONNREFUSED 127.0.0.1:2526",
    })
    .execute();
});

afterAll(async () => {
  await db.deleteFrom("outbox").where("recipient", "=", RECIPIENT).execute();
  await browser?.close();
  await db.destroy();
});

describe("the outbox in the app", () => {
  it("an admin finds a failed message with its reason, resends it, and it goes out", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      const admin = DEMO_ACCOUNTS.find((a) => a.role === "admin")!;
      await signInThroughForm(page, admin.email, DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Mail" }).click();
      await page.waitForURL((url) => url.pathname === "/mail");
      await page.waitForLoadState("networkidle");
      await page.getByLabel("Status").selectOption("failed");
      await page.getByLabel("Search").fill(RECIPIENT);
      const row = page.getByTestId("outbox").getByRole("row", { name: new RegExp(SUBJECT) });
      await shown(row.getByText("connect ECONNREFUSED 127.0.0.1:2526"));
      await shown(row.getByText("failed", { exact: true }));

      await row.getByRole("link", { name: SUBJECT }).click();
      await page.waitForURL((url) => /^\/mail\/\d+$/.test(url.pathname));
      const article = page.getByRole("article");
      await shown(article.getByText("connect ECONNREFUSED 127.0.0.1:2526"));
      const text = await article.innerText();
      expect(text).toContain(RECIPIENT);
      expect(text).toContain("/api/calendar/••••••");
      expect(text).not.toContain("abcdefghijklmnop");
      await page.waitForLoadState("networkidle");
      await article.getByRole("button", { name: `Resend this message to ${RECIPIENT}` }).click();
      await shown(article.getByText("Sent again"));
      await shown(article.getByText("2 attempts"));

      const stored = await db.selectFrom("outbox").select(["status", "attempts", "last_error", "sent_at"]).where("recipient", "=", RECIPIENT).executeTakeFirstOrThrow();
      expect(stored).toMatchObject({ status: "sent", attempts: 2, last_error: null });
      const deadline = Date.now() + 15_000;
      while ((await listCaughtMail({ to: RECIPIENT })).length === 0) {
        if (Date.now() > deadline) throw new Error(`the resent message did not reach ${RECIPIENT}`);
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
      expect((await listCaughtMail({ to: RECIPIENT }))[0]!.subject).toBe(SUBJECT);
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
      expect((await page.goto("/mail/1"))?.status()).toBe(403);
    } finally {
      await context.close();
    }
  });
});
