// A roster mail is written in its site's locale: on a scratch site reading de-DE (Europe/Berlin),
// the mail of a published week names the week and the shift the German way, never in the English
// or ISO form, while the attached .ics keeps the machine form of RFC 5545 (UTC DATE-TIME, §3.3.5).
// Against the real PostgreSQL and the mail fake that npm test starts. The German text expected is
// built here with the platform's Intl for de-DE (Unicode CLDR date patterns).
import { vi } from "vitest";
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import { toJson, type Database } from "@/db/schema";
import { listCaughtMail, readCaughtMail } from "@/lib/mail";
import { mailPublishedRoster } from "@/lib/rosters/mail";
import { requireDatabaseUrl } from "./support/database";
import { publishRosterDirectly } from "./support/rosters";

const SITE = `Mail locale test site ${process.pid}`;
const EMAIL = `mail-locale-${process.pid}@example.org`;
/** A Monday (2027-03-22) in the site's own scratch calendar: no other test's site. */
const WEEK = "2027-03-22";
const START = new Date("2027-03-23T09:00:00Z"); // 10:00 in Berlin (CET, +01:00, before the 28 March change)
const END = new Date("2027-03-23T17:00:00Z");
let db: Kysely<Database>;
let siteId: number;
let rosterId: number;

beforeAll(async () => {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) throw new Error("SMTP_PORT and MAIL_DIR are not set: run this through npm test (it starts the mail fake)");
  db = createDb(requireDatabaseUrl(), { max: 2 });
  await db.deleteFrom("sites").where("name", "=", SITE).execute();
  const site = await db
    .insertInto("sites")
    .values({ name: SITE, time_zone: "Europe/Berlin", hourly_rate: 22, opening_hours: toJson({ weekly: {}, dates: {} }), locale: "de-DE", currency: "EUR", position: 9_999 })
    .returning("id")
    .executeTakeFirstOrThrow();
  siteId = site.id;
  const guard = await db
    .insertInto("guards")
    .values({ site_id: siteId, name: "Greta Beispiel", email: EMAIL, contract_hours: 30, max_hours: 40 })
    .returning("id")
    .executeTakeFirstOrThrow();
  rosterId = await publishRosterDirectly(db, { siteId, startsOn: WEEK, version: 1 }, [{ guardId: guard.id, starts_at: START, ends_at: END }]);
});

afterAll(async () => {
  // The site's rosters, shifts and guards go with it (on delete cascade).
  await db?.deleteFrom("rosters").where("site_id", "=", siteId).execute();
  await db?.deleteFrom("sites").where("id", "=", siteId).execute();
  await db?.destroy();
});

describe("a roster mail in the site's locale", () => {
  it("names the week and the shift the de-DE way; the .ics keeps UTC times", async () => {
    const since = new Date(Date.now() - 1000).toISOString();
    const { sent } = await mailPublishedRoster(db, rosterId);
    expect(sent).toHaveLength(1);
    const caught = (await listCaughtMail({ to: EMAIL })).filter((m) => m.receivedAt >= since);
    expect(caught).toHaveLength(1);
    const mail = (await readCaughtMail(caught[0]!.id))!;

    // Unicode CLDR date patterns through Intl: "22. März 2027" and "Di., 23. März 2027, 10:00".
    const week = new Intl.DateTimeFormat("de-DE", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" }).format(new Date(`${WEEK}T12:00:00Z`));
    const day = new Intl.DateTimeFormat("de-DE", { weekday: "short", day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", timeZone: "Europe/Berlin" }).format(START);
    const until = new Intl.DateTimeFormat("de-DE", { hour: "2-digit", minute: "2-digit", timeZone: "Europe/Berlin" }).format(END);
    expect(week).toBe("22. März 2027");
    expect(mail.subject).toBe(`Your shifts, week of ${week} (version 1)`);
    expect(mail.text).toContain(`the roster for the week of ${week} at ${SITE}`);
    expect(mail.text).toContain(`${day}–${until}`);
    // No second way of writing the same dates: not en-GB's, not ISO.
    expect(mail.text).not.toMatch(/\b22 Mar 2027\b|\bTue 23 Mar\b|\b2027-03-2[23]\b/);

    const ics = mail.attachments.find((a) => a.filename === "shifts.ics");
    expect(ics?.content).toBeTruthy();
    const calendar = Buffer.from(ics!.content!, "base64").toString("utf8");
    expect(calendar).toContain("DTSTART:20270323T090000Z");
    expect(calendar).toContain("DTEND:20270323T170000Z");
  });
});
