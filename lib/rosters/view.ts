// What the staffing page shows: a week's draft and published versions, and one roster in full
// (shifts by guard name, posts by room, unfilled hours with reasons, totals, violations).
import type { Kysely } from "kysely";
import type { Database, RosterTotals, RosterUnfilled, RosterViolation, ShiftBreak, ShiftSegment } from "@/db/schema";
import { latestJobMatching } from "@/db/queries/jobs";
import { draftOfWeek, guardsOfSite, publishedVersionsOfWeek, rosterById, shiftsOfRoster, siteById } from "@/db/queries/rosters";
import { openingOf } from "@/lib/scheduling/demand";
import { addLocalDays } from "@/lib/scheduling/time";
import { rosterScenario } from "./edit";
import { ROSTER_BUILD_JOB } from "./publish";
import { guardIdOfKey, guardKey } from "./scenario";
import type { PublishReview } from "./review";
import { postLabel, roomsOfScenario } from "./shift-events";
import { buildDemand } from "@/lib/scheduling/demand";
import { emptyRoomStretches, guardWeeks, type GuardWeek } from "@/lib/scheduling/safety";
import { engineRoster } from "./stored";

export interface RosterView {
  id: number;
  siteId: number;
  siteName: string;
  timeZone: string;
  startsOn: string;
  days: { date: string; opening: [string, string] | null }[];
  status: "draft" | "published";
  version: number;
  revision: number;
  publishedAt: string | null;
  supersedes: number | null;
  /** For a published version: the draft revision it was made from. */
  draftRevision: number | null;
  /** For a published version: the review shown when it was published, the typed confirmation and the note. */
  publishReview: PublishReview | null;
  publishConfirmation: string | null;
  publishNote: string | null;
  posts: { id: string; label: string; room: string; skills: string[] }[];
  guards: { id: number; name: string; skills: string[] }[];
  shifts: { id: number; guardId: number; guardName: string; start: string; end: string; segments: ShiftSegment[]; breaks: ShiftBreak[] }[];
  unfilled: (RosterUnfilled & { label: string })[];
  totals: RosterTotals | null;
  violations: RosterViolation[];
  /** Rooms open to visitors with no guard at any of their posts, by stretch (propose closing them). */
  emptyRooms: { room: string; risk: "standard" | "high"; start: string; end: string }[];
  /** Every guard on the roster: contract, planned hours, overtime, late shifts, weekend days, run, flags. */
  guardWeeks: (Omit<GuardWeek, "guard"> & { guardId: number; name: string })[];
}

export async function rosterView(db: Kysely<Database>, rosterId: number): Promise<RosterView | null> {
  const roster = await rosterById(db, rosterId);
  if (!roster) return null;
  const [site, shifts, guards] = await Promise.all([siteById(db, roster.site_id), shiftsOfRoster(db, roster.id), guardsOfSite(db, roster.site_id)]);
  if (!site) return null;
  const scenario = rosterScenario(roster);
  const rooms = roomsOfScenario(scenario);
  const onStaff = new Set(scenario.guards.map((g) => g.id));
  const demand = buildDemand(scenario);
  const engine = engineRoster({ shifts, unfilled: roster.unfilled });
  const names = new Map(guards.map((g) => [g.id, g.name]));
  const iso = (instant: number) => new Date(instant).toISOString();
  return {
    id: roster.id,
    siteId: site.id,
    siteName: site.name,
    timeZone: site.time_zone,
    startsOn: roster.starts_on,
    days: Array.from({ length: roster.days }, (_, day) => {
      const date = addLocalDays(site.time_zone, roster.starts_on, day);
      return { date, opening: openingOf(scenario, date) };
    }),
    status: roster.status,
    version: roster.version,
    revision: roster.revision,
    publishedAt: roster.published_at?.toISOString() ?? null,
    supersedes: roster.supersedes,
    draftRevision: roster.draft_revision,
    publishReview: roster.publish_review,
    publishConfirmation: roster.publish_confirmation,
    publishNote: roster.publish_note,
    posts: scenario.posts.map((p) => ({ id: p.id, label: postLabel(p.id, rooms), room: rooms.get(p.id) ?? "", skills: p.skills })),
    guards: guards.filter((g) => onStaff.has(guardKey(g.id))).map((g) => ({ id: g.id, name: g.name, skills: g.skills })),
    shifts: shifts.map((s) => ({
      id: s.id,
      guardId: s.guard_id,
      guardName: s.guard_name,
      start: s.starts_at.toISOString(),
      end: s.ends_at.toISOString(),
      segments: s.segments,
      breaks: s.breaks,
    })),
    unfilled: roster.unfilled.map((u) => ({ ...u, label: postLabel(u.post, rooms) })),
    totals: roster.totals,
    violations: roster.violations,
    emptyRooms: emptyRoomStretches(scenario, engine, demand).map((e) => ({ room: e.room, risk: e.risk, start: iso(e.start), end: iso(e.end) })),
    guardWeeks: guardWeeks(scenario, engine, demand).map(({ guard, ...week }) => {
      const guardId = guardIdOfKey(guard) ?? 0;
      return { ...week, guardId, name: names.get(guardId) ?? guard };
    }),
  };
}

export interface WeekOverview {
  startsOn: string;
  draft: { id: number; revision: number; createdAt: string; totals: RosterTotals | null; violations: number } | null;
  published: { id: number; version: number; publishedAt: string | null; supersedes: number | null; draftRevision: number | null; note: string | null }[];
  /** The current published version, and whether the draft holds changes it does not have. */
  status: { current: { id: number; version: number; publishedAt: string | null } | null; draftIsNewer: boolean };
  build: { id: number; status: string; progress: number; message: string } | null;
}

export async function weekOverview(db: Kysely<Database>, siteId: number, startsOn: string): Promise<WeekOverview> {
  const [draft, published, build] = await Promise.all([
    draftOfWeek(db, siteId, startsOn),
    publishedVersionsOfWeek(db, siteId, startsOn),
    latestJobMatching(db, ROSTER_BUILD_JOB, { siteId, startsOn }),
  ]);
  return {
    startsOn,
    draft: draft
      ? { id: draft.id, revision: draft.revision, createdAt: draft.created_at.toISOString(), totals: draft.totals, violations: draft.violations.length }
      : null,
    published: published.map((p) => ({
      id: p.id,
      version: p.version,
      publishedAt: p.published_at?.toISOString() ?? null,
      supersedes: p.supersedes,
      draftRevision: p.draft_revision,
      note: p.publish_note,
    })),
    status: weekStatus(draft, published),
    build: build ? { id: build.id, status: build.status, progress: build.progress, message: build.message } : null,
  };
}


/**
 * The week's current version (the newest published) and whether the draft is newer: it is when it
 * exists and the current version was not made from its present revision.
 */
export function weekStatus(
  draft: { revision: number } | null,
  published: readonly { id: number; version: number; published_at: Date | null; draft_revision: number | null; revision: number }[],
): WeekOverview["status"] {
  const newest = published.reduce<(typeof published)[number] | null>((best, p) => (best === null || p.version > best.version ? p : best), null);
  return {
    current: newest ? { id: newest.id, version: newest.version, publishedAt: newest.published_at?.toISOString() ?? null } : null,
    // Versions from before draft revisions were recorded carry the revision they copied.
    draftIsNewer: draft !== null && (newest === null || (newest.draft_revision ?? newest.revision) !== draft.revision),
  };
}
