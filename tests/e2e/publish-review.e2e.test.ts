// The publish review in Chromium: a draft that leaves rooms empty (its first day's shifts taken
// off in the database) shows Exhibition Hall East as an empty high-risk room with its hours;
// "Publish anyway" without the typed room name and a note is refused on the page and nothing is
// published; with both the week is published and the version keeps them. Checked at desktop and
// phone widths, by keyboard.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { signedIn, type Caller } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
let browser: Browser;
let operations: Caller;

/** A Monday about 17 weeks ahead: no other browser or integration test builds it. */
function mondayAhead(days: number): string {
  const now = new Date();
  const day = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + days));
  while (day.getUTCDay() !== 1) day.setUTCDate(day.getUTCDate() + 1);
  return day.toISOString().slice(0, 10);
}
const WEEK = mondayAhead(119);

async function shown(locator: Locator, timeout = 15_000): Promise<void> {
  await locator.waitFor({ state: "visible", timeout });
}

async function published() {
  return db.selectFrom("rosters").selectAll().where("starts_on", "=", WEEK).where("status", "=", "published").execute();
}

beforeAll(async () => {
  browser = await launchBrowser();
  const signed = await signedIn("operations@example.org", DEMO_PASSWORD);
  if (signed.status !== 200) throw new Error("demo sign-in failed for operations@example.org");
  operations = signed.who;
  await db.deleteFrom("rosters").where("starts_on", "=", WEEK).execute();
  // Build the week through the API and wait for the job.
  const started = await operations.request("/api/rosters/build", { method: "POST", json: { startsOn: WEEK } });
  if (started.status !== 202 && started.status !== 200 && started.status !== 201) throw new Error(`build answered ${started.status}: ${await started.text()}`);
  const { job } = (await started.json()) as { job: { id: number } };
  const deadline = Date.now() + 120_000;
  for (;;) {
    const state = (await (await operations.request(`/api/jobs/${job.id}`)).json()) as { job: { status: string; message: string } };
    if (state.job.status === "done") break;
    if (state.job.status === "failed" || Date.now() > deadline) throw new Error(`the build did not finish: ${state.job.message}`);
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
  const draft = await db.selectFrom("rosters").select("id").where("starts_on", "=", WEEK).where("status", "=", "draft").executeTakeFirstOrThrow();
  const first = await db.selectFrom("shifts").select("starts_at").where("roster_id", "=", draft.id).orderBy("starts_at").executeTakeFirstOrThrow();
  await db.deleteFrom("shifts").where("roster_id", "=", draft.id).where("starts_at", "<", new Date(first.starts_at.getTime() + 20 * 3_600_000)).execute();
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

describe("the publish review", () => {
  for (const phone of [false, true]) {
    it(`lists the empty high-risk room and refuses without the typed confirmation (${phone ? "phone" : "desktop"})`, async () => {
      const context = await newContext(browser, { phone });
      const page = await context.newPage();
      try {
        await signInThroughForm(page, "operations@example.org", DEMO_PASSWORD);
        await page.waitForURL((url) => url.pathname === "/");
        await page.goto(`/staffing?week=${WEEK}`);
        const publish = page.getByRole("button", { name: "Publish…", exact: true });
        await shown(publish, 30_000);
        await page.waitForFunction(() => [...document.querySelectorAll("button")].some((b) => b.textContent === "Publish…" && !b.disabled), null, { timeout: 30_000 });
        // The staffing page says which rooms stand empty, and proposes closing them.
        const emptyList = page.getByTestId("empty-rooms");
        await shown(emptyList.getByText("Exhibition Hall East").first());
        await shown(emptyList.getByText(/Proposal: close these rooms to visitors/));
        // By keyboard: focus the button and press Enter.
        await publish.focus();
        await page.keyboard.press("Enter");
        const review = page.getByTestId("publish-review");
        const empty = review.getByTestId("review-empty-rooms");
        await shown(empty.getByText("Exhibition Hall East", { exact: true }), 30_000);
        await shown(empty.locator("li", { hasText: "Exhibition Hall East" }).getByText("high risk"));
        await expect(page.evaluate(() => document.activeElement?.id)).resolves.toBe("publish-review-heading");
        await review.getByRole("button", { name: "Publish anyway" }).click();
        await shown(review.getByText("Type Exhibition Hall East to confirm."));
        await shown(review.getByText("Say why the week is published this way; the note is kept with the version."));
        await review.getByLabel(/To publish anyway, type/).fill("Textile Gallery");
        await review.getByLabel("Note (kept with the version)").fill("e2e: wrong room typed");
        await review.getByRole("button", { name: "Publish anyway" }).click();
        await shown(review.getByText("Type Exhibition Hall East to confirm."));
        expect(await published()).toEqual([]);
        await review.getByRole("button", { name: "Back to the draft" }).click();
        await expect(review.count()).resolves.toBe(0);
      } finally {
        await context.close();
      }
    }, 90_000);
  }

  it("reassign lists the guards who can take a stretch first, the others with the rule they would break", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "operations@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto(`/staffing?week=${WEEK}`);
      const grid = page.getByTestId("roster-grid");
      await shown(grid, 30_000);
      // The second open day still has its shifts: choose Exhibition Hall West's first post at its first hour.
      await page.getByRole("tab").nth(1).click();
      await grid.getByRole("button", { name: /^Exhibition Hall West · post 1 at \d\d:\d\d: .*Reassign$/ }).first().click();
      const panel = page.getByRole("form", { name: "Reassign" });
      const select = panel.getByLabel("Give this stretch to");
      await shown(select, 30_000);
      const groups = await select.evaluate((el) =>
        [...el.querySelectorAll("optgroup")].map((g) => ({ label: g.label, options: [...g.querySelectorAll("option")].map((o) => o.textContent ?? "") })),
      );
      expect(groups[0]!.label).toMatch(/^(Can take it \(\d+\)|Nobody can take it without breaking a rule)$/);
      for (const option of groups[0]!.options) expect(option).toMatch(/^.+ — [\d.]+ h of [\d.]+ h so far$/);
      expect(groups[1]!.label).toMatch(/^Would break a rule \(\d+\)$/);
      for (const option of groups[1]!.options) expect(option).toMatch(/ so far — [a-z-]+$/);
      // No message on the panel names a post by an internal id.
      await expect(panel.innerText()).resolves.not.toMatch(/\bR\d+-P\d+\b/);
      await panel.getByRole("button", { name: "Cancel" }).click();
    } finally {
      await context.close();
    }
  }, 90_000);

  it("publishes with the room's name typed and a note, and keeps both with the version", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await signInThroughForm(page, "operations@example.org", DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto(`/staffing?week=${WEEK}`);
      await page.waitForFunction(() => [...document.querySelectorAll("button")].some((b) => b.textContent === "Publish…" && !b.disabled), null, { timeout: 30_000 });
      await page.getByRole("button", { name: "Publish…", exact: true }).click();
      const review = page.getByTestId("publish-review");
      await shown(review.getByLabel(/To publish anyway, type/), 30_000);
      await review.getByLabel(/To publish anyway, type/).fill("Exhibition Hall East");
      await review.getByLabel("Note (kept with the version)").fill("Hall East closed on the first day; front desk told.");
      await review.getByRole("button", { name: "Publish anyway" }).click();
      await shown(page.getByText(/^Published version 1; e-mailing every guard on it\.$/), 30_000);
      // The version's history keeps what was confirmed and why.
      await page.getByRole("button", { name: /^Version 1/ }).first().click();
      const kept = page.getByTestId("publish-confirmation");
      await shown(kept.getByText("Confirmed by typing “Exhibition Hall East”. Note: Hall East closed on the first day; front desk told."), 30_000);
    } finally {
      await context.close();
    }
    const [version] = await published();
    expect(version?.publish_confirmation).toBe("Exhibition Hall East");
    expect(version?.publish_note).toBe("Hall East closed on the first day; front desk told.");
    expect(version?.publish_review?.needsConfirmation).toBe(true);
  }, 90_000);
});
