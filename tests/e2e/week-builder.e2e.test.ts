// The week builder in Chromium: operations chooses a segment of the draft by keyboard (Tab to it,
// Enter), sets an earlier end in the form, the browser's own rule check says it keeps every rule,
// it is saved and the totals on the page change with the database; giving a segment to a guard it
// would put past a labour rule is refused on the page with the rule named, and nothing is written.
// Screenshots at 1440x900 and 390x844 go to the system's temporary folder.
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator, Page } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { guardsOfSite, shiftsOfRoster } from "@/db/queries/rosters";
import { wallClock } from "@/components/calendar/wall-clock";
import { rosterScenario } from "@/lib/rosters/edit";
import { checkAdjust, editCheckContext, overridable, type AdjustChange } from "@/lib/rosters/edit-check";
import { postLabels } from "@/lib/rosters/shift-events";
import { engineRoster } from "@/lib/rosters/stored";
import { paidMs } from "@/lib/scheduling/roster";
import { launchBrowser, signInThroughForm } from "./support/browser";
import { signedIn } from "./support/http";
import { baseUrl, testDb } from "./support/server";

const db = testDb();
let browser: Browser;
const HOUR = 3_600_000;

/** A Monday 18 weeks ahead: no other browser or integration test builds it. */
function mondayAhead(days: number): string {
  const now = new Date();
  const day = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + days));
  while (day.getUTCDay() !== 1) day.setUTCDate(day.getUTCDate() + 1);
  return day.toISOString().slice(0, 10);
}
const WEEK = mondayAhead(126);
const iso = (ms: number) => new Date(ms).toISOString();
const blockId = (c: AdjustChange) => `seg|${c.from.guardId}|${c.from.post}|${c.from.start}`;

async function draft() {
  const roster = await db.selectFrom("rosters").selectAll().where("starts_on", "=", WEEK).where("status", "=", "draft").executeTakeFirstOrThrow();
  const [rows, guards, site] = await Promise.all([shiftsOfRoster(db, roster.id), guardsOfSite(db, roster.site_id), db.selectFrom("sites").select("time_zone").where("id", "=", roster.site_id).executeTakeFirstOrThrow()]);
  const edit = editCheckContext(rosterScenario(roster), engineRoster({ shifts: rows, unfilled: roster.unfilled }), new Map(guards.map((g) => [g.id, g.name])), postLabels(roster.scenario));
  return { roster, edit, zone: site.time_zone };
}

function keepingMove(edit: Awaited<ReturnType<typeof draft>>["edit"]): AdjustChange {
  const slot = edit.scenario.rules.slotMinutes * 60_000;
  for (const shift of edit.before.shifts) {
    const last = [...shift.segments].sort((a, b) => b.start - a.start)[0]!;
    if (last.end - last.start < 2 * slot || shift.end - shift.start < (edit.scenario.rules.minShiftHours + 1) * HOUR) continue;
    const guardId = Number(shift.guard.slice(1));
    const change = { from: { guardId, post: last.post, start: iso(last.start) }, start: iso(last.start), end: iso(last.end - slot), toGuardId: guardId };
    if (checkAdjust(edit, change).ok) return change;
  }
  throw new Error("no segment of the demo week can be shortened within the rules");
}

function breakingMove(edit: Awaited<ReturnType<typeof draft>>["edit"]): { change: AdjustChange; rules: string[] } {
  const paid = new Map<string, number>();
  for (const s of edit.before.shifts) paid.set(s.guard, (paid.get(s.guard) ?? 0) + paidMs(s, edit.scenario.rules.paidBreaks));
  const busiest = [...edit.scenario.guards].sort((a, b) => (paid.get(b.id) ?? 0) - (paid.get(a.id) ?? 0));
  for (const to of busiest.slice(0, 6))
    for (const shift of edit.before.shifts) {
      if (shift.guard === to.id) continue;
      for (const s of shift.segments) {
        const change = { from: { guardId: Number(shift.guard.slice(1)), post: s.post, start: iso(s.start) }, start: iso(s.start), end: iso(s.end), toGuardId: Number(to.id.slice(1)) };
        const check = checkAdjust(edit, change);
        if (!check.ok && check.code === "breaks-rule" && overridable(check.violations)) return { change, rules: [...new Set(check.violations.map((v) => v.rule))] };
      }
    }
  throw new Error("no change of the demo week breaks a labour rule a note may override");
}

/** What the viewport shows once `near` is scrolled into it (the page itself is too tall to read whole). */
async function screenshot(page: Page, name: string, near: Locator): Promise<void> {
  await near.scrollIntoViewIfNeeded();
  await page.screenshot({ path: join(tmpdir(), name) });
}

async function openBuilder(page: Page): Promise<void> {
  await signInThroughForm(page, "operations@example.org", DEMO_PASSWORD);
  await page.waitForURL((url) => url.pathname === "/");
  await page.goto(`/staffing?week=${WEEK}`);
  await page.getByTestId("week-builder-calendar").locator("[data-block]").first().waitFor({ state: "visible", timeout: 30_000 });
}

beforeAll(async () => {
  browser = await launchBrowser();
  const { who: operations, status } = await signedIn("operations@example.org", DEMO_PASSWORD);
  if (status !== 200) throw new Error("demo sign-in failed for operations@example.org");
  await db.deleteFrom("rosters").where("starts_on", "=", WEEK).execute();
  const started = await operations.request("/api/rosters/build", { method: "POST", json: { startsOn: WEEK } });
  if (started.status >= 300) throw new Error(`build answered ${started.status}: ${await started.text()}`);
  const { job } = (await started.json()) as { job: { id: number } };
  const deadline = Date.now() + 120_000;
  for (;;) {
    const state = (await (await operations.request(`/api/jobs/${job.id}`)).json()) as { job: { status: string; message: string } };
    if (state.job.status === "done") break;
    if (state.job.status === "failed" || Date.now() > deadline) throw new Error(`the build did not finish: ${state.job.message}`);
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

describe("the week builder", () => {
  it("moves a segment by keyboard, the totals follow; a change against a rule is refused naming it (1440x900)", async () => {
    const context = await browser.newContext({ baseURL: baseUrl(), viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    try {
      await openBuilder(page);
      const { roster, edit, zone } = await draft();
      const change = keepingMove(edit);
      const paidBefore = await page.getByTestId("total-paid-hours").textContent();
      await page.getByTestId("week-builder").getByLabel("Post", { exact: true }).selectOption(change.from.post);
      const block = page.locator(`[data-block="${blockId(change)}"]`);
      await screenshot(page, "sightward-week-builder-1440.png", page.getByTestId("week-builder-calendar"));
      await block.focus();
      await page.keyboard.press("Enter");
      const panel = page.getByTestId("adjust-panel");
      await panel.waitFor({ state: "visible" });
      await expect(page.evaluate(() => document.activeElement?.id)).resolves.toBe("adjust-heading");
      await panel.getByLabel("Ends").selectOption(wallClock(change.end, zone).slice(11, 16));
      await panel.getByText("This change keeps every rule.").waitFor({ state: "visible" });
      await screenshot(page, "sightward-week-builder-form-1440.png", panel);
      await panel.getByRole("button", { name: "Save change" }).click();
      await page.getByTestId("adjust-saved").waitFor({ state: "visible", timeout: 30_000 });
      await page.waitForFunction((before) => document.querySelector('[data-testid="total-paid-hours"]')?.textContent !== before, paidBefore, { timeout: 30_000 });
      const after = await draft();
      expect(after.roster.revision).toBe(roster.revision + 1);
      expect(after.roster.totals!.paidHours).toBeCloseTo(roster.totals!.paidHours - edit.scenario.rules.slotMinutes / 60, 5);

      // Against a rule: the browser's check names it and offers no plain save; the database keeps its revision.
      const { change: bad, rules } = breakingMove(after.edit);
      await page.getByTestId("week-builder").getByLabel("Post", { exact: true }).selectOption(bad.from.post);
      await page.locator(`[data-block="${blockId(bad)}"]`).waitFor({ state: "attached", timeout: 30_000 });
      await page.locator(`[data-block="${blockId(bad)}"]`).focus();
      await page.keyboard.press("Enter");
      await panel.waitFor({ state: "visible" });
      await panel.getByLabel("Guard").selectOption(String(bad.toGuardId));
      const check = panel.getByTestId("adjust-check");
      await check.getByText(`Breaks ${rules.length === 1 ? "the rule" : "the rules"}: ${rules.join(", ")}`).waitFor({ state: "visible" });
      await expect(check.textContent()).resolves.toContain(`(rule ${rules[0]})`);
      await expect(panel.getByRole("button", { name: "Save change" }).count()).resolves.toBe(0);
      await expect(panel.getByRole("button", { name: "Keep with this note" }).isDisabled()).resolves.toBe(true);
      await screenshot(page, "sightward-week-builder-refused-1440.png", panel);
      expect((await draft()).roster.revision).toBe(after.roster.revision);

      // By mouse: dragging the block an hour down opens the same form with the new start.
      await panel.getByRole("button", { name: "Cancel" }).click();
      const dragged = page.locator(`[data-block="${blockId(bad)}"]`);
      await dragged.scrollIntoViewIfNeeded();
      const box = (await dragged.boundingBox())!;
      const hourPx = await page.evaluate(() => 2 * (document.querySelector(".week-builder .fc-timegrid-slot")?.getBoundingClientRect().height ?? 24));
      await page.mouse.move(box.x + box.width / 2, box.y + 8);
      await page.mouse.down();
      await page.mouse.move(box.x + box.width / 2, box.y + 8 + hourPx / 2, { steps: 4 });
      await page.mouse.move(box.x + box.width / 2, box.y + 8 + hourPx + 2, { steps: 4 });
      await page.mouse.up();
      await panel.waitFor({ state: "visible" });
      const oldStart = wallClock(bad.from.start, zone).slice(11, 16);
      const newStart = await panel.getByLabel("Starts").inputValue();
      expect(Number(newStart.slice(0, 2))).toBe(Number(oldStart.slice(0, 2)) + 1);
      // Buttons of the builder are at least 44 px high.
      const heights = await page.getByTestId("week-builder").locator("button").evaluateAll((els) => els.map((el) => [el.textContent, el.getBoundingClientRect().height] as const));
      for (const [label, height] of heights) expect(height, label ?? "").toBeGreaterThanOrEqual(44);
    } finally {
      await context.close();
    }
  }, 120_000);

  it("works on a phone: the day view, the view switch and a segment's form by keyboard (390x844)", async () => {
    const context = await browser.newContext({ baseURL: baseUrl(), viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    try {
      await openBuilder(page);
      await page.getByRole("button", { name: "By guard" }).click();
      await expect(page.getByRole("button", { name: "By guard" }).getAttribute("aria-pressed")).resolves.toBe("true");
      await screenshot(page, "sightward-week-builder-lane-390.png", page.getByTestId("week-builder-calendar"));
      await page.getByLabel("Guard's lane").selectOption("");
      const first = page.getByTestId("week-builder-calendar").locator('[data-block^="seg|"]').first();
      await first.focus();
      await page.keyboard.press("Enter");
      await page.getByTestId("adjust-panel").waitFor({ state: "visible" });
      const width = await page.evaluate(() => document.documentElement.scrollWidth);
      expect(width).toBeLessThanOrEqual(390);
      await screenshot(page, "sightward-week-builder-390.png", page.getByTestId("adjust-panel"));
    } finally {
      await context.close();
    }
  }, 90_000);
});
