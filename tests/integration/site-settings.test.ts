// Site settings through the route handler in-process on the real PostgreSQL: an admin saves the
// time zone, locale, currency (ISO 4217, checked against the platform's Intl list), hourly rate and
// the default accepted extra hours; other roles get 403; a bad value gets 422 naming the field and
// changes nothing; a save over values someone else changed meanwhile gets 409 and changes nothing;
// a roster scenario then gives guards without their own value the site's default. A scratch site of
// its own, so the demo site's settings never change under the other tests.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the modules.
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { GET, PUT } from "@/app/api/sites/[siteId]/settings/route";
import { siteSettings, type SiteSettings } from "@/db/queries/site-settings";
import { createSite } from "@/db/queries/galleries";
import { acceptedExtraHours } from "@/lib/rosters/scenario";
import { sendRecorded, senderFor } from "@/lib/mail/outbox";
import { listCaughtMail, readCaughtMail } from "@/lib/mail";
import { requireDatabaseUrl } from "./support/database";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

let db: Kysely<Database>;
let siteId: number;
let admin: SignedUser;
let operations: SignedUser;
let original: SiteSettings;

const context = () => ({ params: Promise.resolve({ siteId: String(siteId) }) });
async function put(user: SignedUser, body: unknown) {
  const response = await PUT(await signedRequest(user, `http://127.0.0.1/api/sites/${siteId}/settings`, body, "PUT"), context());
  return { status: response.status, body: (await response.json()) as Record<string, any> };
}

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  await db.deleteFrom("sites").where("name", "=", "Settings test site").execute();
  siteId = (await createSite(db, { name: "Settings test site", time_zone: "Europe/Berlin", currency: "EUR", hourly_rate: 22 })).id;
  [admin, operations] = await Promise.all([userByEmail(db, "admin@example.org"), userByEmail(db, "operations@example.org")]);
  const current = (await siteSettings(db, siteId))!;
  original = { timeZone: current.timeZone, locale: current.locale, currency: current.currency, hourlyRate: current.hourlyRate, acceptedExtraHours: current.acceptedExtraHours };
});

afterAll(async () => {
  await db.deleteFrom("sites").where("id", "=", siteId).execute();
  await db.destroy();
});

describe("opening hours, special days and labour-rule defaults", () => {
  it("saves them over the values shown, refuses a day that closes before it opens, and names no week to rebuild", async () => {
    const shown = (await siteSettings(db, siteId))!;
    const previous = { timeZone: shown.timeZone, locale: shown.locale, currency: shown.currency, hourlyRate: shown.hourlyRate, acceptedExtraHours: shown.acceptedExtraHours, opening: shown.opening, rules: shown.rules };
    const bad = await put(admin, { previous, settings: { ...previous, opening: { ...shown.opening!, weekly: { ...shown.opening!.weekly, tue: ["18:00", "10:00"] } } } });
    expect(bad.status).toBe(422);
    expect(bad.body.error.field).toBe("settings.opening.weekly.tue");
    expect(bad.body.error.message).toMatch(/closes after it opens/);
    const next = {
      ...previous,
      opening: { weekly: { ...shown.opening!.weekly, tue: ["10:00", "20:00"], mon: null }, dates: { "2099-12-24": null, "2099-12-31": ["10:00", "15:00"] } },
      rules: { ...shown.rules!, minRestHours: 12, breakMinutes: 45 },
    };
    const saved = await put(admin, { previous, settings: next });
    expect(saved.status).toBe(200);
    expect(saved.body.settings.opening).toEqual(next.opening);
    expect(saved.body.settings.rules).toMatchObject({ minRestHours: 12, breakMinutes: 45, maxShiftHours: 10 });
    expect(saved.body.rebuild).toEqual([]);
    // The stale copy of the opening hours is refused.
    const stale = await put(admin, { previous, settings: { ...previous, hourlyRate: 99 } });
    expect(stale.status).toBe(409);
  });
});

describe("site settings", () => {
  it("reads them for admins only", async () => {
    const ok = await GET(await signedRequest(admin, `http://127.0.0.1/api/sites/${siteId}/settings`), context());
    expect(ok.status).toBe(200);
    expect(((await ok.json()) as { settings: SiteSettings }).settings).toMatchObject(original);
    expect((await GET(await signedRequest(operations, `http://127.0.0.1/api/sites/${siteId}/settings`), context())).status).toBe(403);
  });

  it("refuses other roles and bad values, changing nothing", async () => {
    const next = { ...original, acceptedExtraHours: 5 };
    expect((await put(operations, { previous: original, settings: next })).status).toBe(403);
    for (const [field, value, pattern] of [
      ["currency", "EURO", /ISO 4217/],
      ["currency", "XYZ", /ISO 4217/],
      ["timeZone", "Mars/Olympus", /IANA time zone/],
      ["hourlyRate", -3, /cannot be negative/],
      ["acceptedExtraHours", 60, /at most 40/],
    ] as const) {
      const answer = await put(admin, { previous: original, settings: { ...original, [field]: value } });
      expect(answer.status, `${field}=${value}`).toBe(422);
      expect(answer.body.error.field).toBe(`settings.${field}`);
      expect(answer.body.error.message).toMatch(pattern);
    }
    expect(await siteSettings(db, siteId)).toMatchObject(original);
  });

  it("saves over the values shown, refuses a stale save with 409, and rosters use the default", async () => {
    const saved = await put(admin, { previous: original, settings: { ...original, currency: "gbp", hourlyRate: 24.5, acceptedExtraHours: 3 } });
    expect(saved.status).toBe(200);
    expect(saved.body.settings).toMatchObject({ currency: "GBP", hourlyRate: 24.5, acceptedExtraHours: 3 });
    // A second admin still looking at the old values.
    const stale = await put(admin, { previous: original, settings: { ...original, hourlyRate: 30 } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("settings-changed");
    expect(stale.body.error.current).toMatchObject({ hourlyRate: 24.5 });
    expect(await siteSettings(db, siteId)).toMatchObject({ currency: "GBP", hourlyRate: 24.5, acceptedExtraHours: 3 });
    // A guard without a value of their own now accepts the site's 3 extra hours; one with a value keeps it.
    const site = await db.selectFrom("sites").select(["labour_rules"]).where("id", "=", siteId).executeTakeFirstOrThrow();
    expect(acceptedExtraHours({ accepted_extra_hours: null }, site)).toBe(3);
    expect(acceptedExtraHours({ accepted_extra_hours: 5 }, site)).toBe(5);
  });
});

describe("the site's name and mail sender", () => {
  it("refuses a malformed sender naming the field, saves a good one, and the site's mail goes from it", async () => {
    const shown = (await siteSettings(db, siteId))!;
    const previous = { timeZone: shown.timeZone, locale: shown.locale, currency: shown.currency, hourlyRate: shown.hourlyRate, acceptedExtraHours: shown.acceptedExtraHours, name: shown.name, mailSender: shown.mailSender };
    expect(previous.mailSender).toBeNull();
    for (const bad of ["security", "Security <security>", "a@b", "Two <a@example.org> <b@example.org>"]) {
      const answer = await put(admin, { previous, settings: { ...previous, mailSender: bad } });
      expect(answer.status, bad).toBe(422);
      expect(answer.body.error.field).toBe("settings.mailSender");
    }
    const blank = await put(admin, { previous, settings: { ...previous, name: "  " } });
    expect(blank.status).toBe(422);
    expect(blank.body.error.field).toBe("settings.name");
    expect(await siteSettings(db, siteId)).toMatchObject({ name: "Settings test site", mailSender: null });

    const sender = "Settings Test Security <security@example.org>";
    const saved = await put(admin, { previous, settings: { ...previous, name: "Settings test site", mailSender: sender } });
    expect(saved.status).toBe(200);
    expect(saved.body.settings).toMatchObject({ mailSender: sender });
    expect(await senderFor(db, siteId)).toBe(sender);
    // The main site keeps its own (default) sender.
    expect(await senderFor(db)).not.toBe(sender);

    const to = `sender.${process.pid}@example.org`;
    const { outboxId } = await sendRecorded(db, { kind: "notice", to, subject: "From the site's sender", text: "A note.", siteId });
    try {
      expect((await db.selectFrom("outbox").select("sender").where("id", "=", outboxId).executeTakeFirstOrThrow()).sender).toBe(sender);
      let caught = await listCaughtMail({ to });
      for (let i = 0; caught.length === 0 && i < 50; i++) {
        await new Promise((resolve) => setTimeout(resolve, 100));
        caught = await listCaughtMail({ to });
      }
      expect((await readCaughtMail(caught[0]!.id))!.from).toContain("security@example.org");
    } finally {
      await db.deleteFrom("outbox").where("id", "=", outboxId).execute();
    }
  });
});
