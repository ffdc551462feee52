// The publish mail job: every guard with shifts in a published roster gets an e-mail listing them
// in the site's locale and time zone, with the shifts as an iCalendar attachment. A version that replaces an
// earlier one mails only the guards whose shifts changed (a guard with none left is told so), and
// says what changed. Guards already mailed by an earlier attempt of the same job (recorded in its
// result) are not mailed twice.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { formatDate, siteFormat } from "@/lib/format";
import { rosterById, shiftsOfRoster, siteById } from "@/db/queries/rosters";
import { calendarText } from "@/lib/calendar/ics";
import { RetryLater } from "@/lib/jobs/retry";
import { smtpSettings } from "@/lib/mail/transport";
import { MailNotSent, sendRecorded } from "@/lib/mail/outbox";
import { roomsOfScenario, shiftEvents, shiftPlan, shiftWhen, type ShiftForPeople } from "./shift-events";

export interface MailProgress {
  sent: number[];
}

type Progress = (fraction: number, message: string, partial?: MailProgress) => Promise<void>;

/** The personal feed address, when the app knows its own address (NEXTAUTH_URL). */
export function feedUrl(token: string): string | null {
  const base = process.env.NEXTAUTH_URL;
  return base ? `${base.replace(/\/$/, "")}/api/calendar/${token}` : null;
}

export async function mailPublishedRoster(
  db: Kysely<Database>,
  rosterId: number,
  alreadySent: readonly number[] = [],
  progress: Progress = async () => {},
): Promise<{ sent: number[]; summary: string }> {
  const roster = await rosterById(db, rosterId);
  if (!roster || roster.status !== "published") throw new Error(`roster ${rosterId} is not a published roster; nothing to mail`);
  const site = await siteById(db, roster.site_id);
  if (!site) throw new Error(`the site of roster ${rosterId} no longer exists`);
  const zone = site.time_zone;
  const shown = siteFormat(site);
  const rooms = roomsOfScenario(roster.scenario);
  const shifts = await shiftsOfRoster(db, roster.id);
  // The version this one replaces: only the guards whose shifts differ are mailed.
  const before = roster.supersedes ? await shiftsOfRoster(db, roster.supersedes) : null;
  const plan = (list: typeof shifts, guard: number) =>
    JSON.stringify(list.filter((s) => s.guard_id === guard).map((s) => [s.starts_at.getTime(), s.ends_at.getTime(), s.segments, s.breaks]));
  const everyone = [...new Set([...shifts.map((s) => s.guard_id), ...(before ?? []).map((s) => s.guard_id)])];
  const guardIds = before ? everyone.filter((id) => plan(shifts, id) !== plan(before, id)) : everyone;
  const guards = guardIds.length
    ? await db.selectFrom("guards").select(["id", "name", "email", "calendar_token"]).where("id", "in", guardIds).orderBy("id").execute()
    : [];
  const sent = [...alreadySent];
  const week = formatDate(shown, roster.starts_on);
  let done = 0;
  for (const guard of guards) {
    done++;
    if (sent.includes(guard.id)) continue;
    const own: ShiftForPeople[] = shifts
      .filter((s) => s.guard_id === guard.id)
      .map((s) => ({ ...s, roster_version: roster.version }));
    const lines = own.map((s) => `${shiftWhen(s, shown)}\n${shiftPlan(s, shown, rooms).map((line) => `  ${line}`).join("\n")}`);
    const feed = feedUrl(guard.calendar_token);
    // What changed since the replaced version: shifts gone and shifts new, by their times.
    const key = (s: { starts_at: Date; ends_at: Date }) => `${s.starts_at.getTime()}-${s.ends_at.getTime()}`;
    const old = (before ?? []).filter((s) => s.guard_id === guard.id);
    const gone = old.filter((s) => !own.some((n) => key(n) === key(s)));
    const added = own.filter((s) => !old.some((o) => key(o) === key(s)));
    const changed = before
      ? [
          "What changed since the earlier version:",
          ...gone.map((s) => `  no longer: ${shiftWhen(s, shown)}`),
          ...added.map((s) => `  new: ${shiftWhen(s, shown)}`),
          ...(gone.length === 0 && added.length === 0 ? ["  the same times, with other posts or breaks (see below)"] : []),
          "",
        ]
      : [];
    const text = [
      `Hello ${guard.name},`,
      "",
      `the roster for the week of ${week} at ${site.name} is published (version ${roster.version}${roster.supersedes ? ", replacing the earlier version" : ""}).`,
      ...changed,
      ...(own.length > 0 ? [`Your shifts (times in ${zone}):`, "", ...lines, "", "The attached shifts.ics adds them to your calendar."] : ["You have no shifts in this week any more."]),
      ...(feed ? [`Your personal calendar feed stays current with every new version: ${feed}`] : []),
      "",
      "Sightward",
    ].join("\n");
    const ics = calendarText(shiftEvents(own, shown, site.name, rooms), {
      name: `${site.name} shifts`,
      timeZone: zone,
      method: "PUBLISH",
    });
    try {
      await sendRecorded(db, {
        kind: "roster",
        to: guard.email,
        subject: `${before ? "Changed shifts" : "Your shifts"}, week of ${week} (version ${roster.version})`,
        text,
        attachments: own.length > 0 ? [{ filename: "shifts.ics", content: ics, contentType: "text/calendar; charset=utf-8; method=PUBLISH" }] : [],
        siteId: roster.site_id,
        guardId: guard.id,
        rosterId: roster.id,
      });
    } catch (thrown) {
      const error = thrown instanceof MailNotSent ? thrown.cause : thrown;
      if (!isPassingMailFailure(error)) throw error;
      const { host, port } = smtpSettings();
      throw new RetryLater(
        `the mail server at ${host}:${port} did not take the message (${(error as Error).message}); ${sent.length} of ${guards.length} guards mailed so far, the rest follow`,
      );
    }
    sent.push(guard.id);
    await progress(done / guards.length, `mailed ${sent.length} of ${guards.length} guards`, { sent });
  }
  const unchanged = before ? everyone.length - guardIds.length : 0;
  return { sent, summary: `mailed ${guards.length} guards their shifts of version ${roster.version}${before ? ` (${unchanged} with unchanged shifts not mailed)` : ""}` };
}

/**
 * A failure that will likely pass: no connection, a timeout, a dropped socket, or an SMTP 4xx
 * answer ("transient negative completion", RFC 5321 section 4.2.1). A 5xx answer is permanent.
 */
export function isPassingMailFailure(error: unknown): boolean {
  const { code, responseCode } = (error ?? {}) as { code?: string; responseCode?: number };
  if (typeof responseCode === "number") return responseCode >= 400 && responseCode < 500;
  return ["ECONNECTION", "ETIMEDOUT", "ESOCKET", "EDNS", "ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEOUT"].includes(code ?? "");
}
