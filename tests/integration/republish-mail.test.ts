// Republishing mails only the guards whose shifts changed, on the real PostgreSQL and the mail fake:
// version 1 of a week mails every guard on it; version 2, after one stretch went from one guard to
// another, mails exactly those two, with what changed; the job's summary counts the others as
// unchanged.
import { vi } from "vitest";
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { buildDraftRoster } from "@/lib/rosters/build";
import { reassignInDraft, reassignOptions } from "@/lib/rosters/edit";
import { mailPublishedRoster } from "@/lib/rosters/mail";
import { publishDraft } from "@/lib/rosters/publish";
import { listCaughtMail, readCaughtMail } from "@/lib/mail";
import { requireDatabaseUrl } from "./support/database";
import { mondayAhead, runQueuedJob } from "./support/rosters";

/** Twenty-one weeks ahead: clear of the other roster tests' weeks. */
const WEEK = mondayAhead(147);
let db: Kysely<Database>;
let siteId: number;
let draftId: number;

async function mailsFor(subject: string) {
  const all = await listCaughtMail({ limit: 5000 });
  return all.filter((m) => m.subject === subject);
}

beforeAll(async () => {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) throw new Error("SMTP_PORT and MAIL_DIR are not set: run this through npm test (it starts the mail fake)");
  db = createDb(requireDatabaseUrl(), { max: 3 });
  siteId = (await db.selectFrom("sites").select("id").orderBy("id").executeTakeFirstOrThrow()).id;
  await db.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "=", WEEK).execute();
  draftId = (await buildDraftRoster(db, { siteId, startsOn: WEEK, userId: null })).rosterId;
}, 120_000);

afterAll(async () => {
  await db?.destroy();
});

describe("republishing", () => {
  it("mails everyone on version 1, then only the two guards a reassignment touched", async () => {
    const week = format(new TZDate(`${WEEK}T12:00:00Z`, "Europe/Berlin"), "d MMM yyyy");
    const rev1 = (await db.selectFrom("rosters").select("revision").where("id", "=", draftId).executeTakeFirstOrThrow()).revision;
    const v1 = await publishDraft(db, { rosterId: draftId, revision: rev1, userId: null });
    const first = (await runQueuedJob(db, v1.mailJobId, () => mailPublishedRoster(db, v1.roster.id))) as { sent: number[] };
    const onV1 = await db.selectFrom("shifts").select("guard_id").distinct().where("roster_id", "=", v1.roster.id).execute();
    expect(first.sent.sort()).toEqual(onV1.map((r) => r.guard_id).sort());

    // Move one stretch to a guard the rules allow.
    const shifts = await db.selectFrom("shifts").select(["guard_id", "segments"]).where("roster_id", "=", draftId).execute();
    let moved: { from: number; to: number } | null = null;
    for (const shift of shifts) {
      for (const segment of shift.segments) {
        const from = { guardId: shift.guard_id, post: segment.post, start: segment.start };
        const option = (await reassignOptions(db, draftId, from)).find((o) => o.ok);
        if (!option) continue;
        await reassignInDraft(db, { rosterId: draftId, revision: rev1, from, toGuardId: option.guardId });
        moved = { from: shift.guard_id, to: option.guardId };
        break;
      }
      if (moved) break;
    }
    expect(moved, "no stretch of the demo week could be given to another guard").not.toBeNull();
    const rev2 = (await db.selectFrom("rosters").select("revision").where("id", "=", draftId).executeTakeFirstOrThrow()).revision;
    const v2 = await publishDraft(db, { rosterId: draftId, revision: rev2, userId: null });
    const second = (await runQueuedJob(db, v2.mailJobId, () => mailPublishedRoster(db, v2.roster.id))) as { sent: number[]; summary: string };
    expect(second.sent.sort()).toEqual([moved!.from, moved!.to].sort());
    expect(second.summary).toMatch(/with unchanged shifts not mailed/);
    const guards = await db.selectFrom("guards").select(["id", "email"]).where("id", "in", [moved!.from, moved!.to]).execute();
    const mails = await mailsFor(`Changed shifts, week of ${week} (version 2)`);
    expect(mails.flatMap((m) => m.to).sort()).toEqual(guards.map((g) => g.email).sort());
    const text = (await readCaughtMail(mails[0]!.id))!.text;
    expect(text).toMatch(/What changed since the earlier version:/);
  }, 120_000);
});
