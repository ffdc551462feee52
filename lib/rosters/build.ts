// The roster-build job: the week's scenario from the database, the staffing engine, the result
// stored as the week's draft (replacing an earlier draft of the same week).
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { approvedPostsForSite } from "@/db/queries/post-plans";
import { approvedTimeOff, activeGuardsOfSite, replaceDraft, siteById } from "@/db/queries/rosters";
import { formatDate, siteFormat } from "@/lib/format";
import type { Scenario } from "@/lib/scheduling/scenario";
import { addLocalDays } from "@/lib/scheduling/time";
import { buildRosterOffThread } from "./engine-thread";
import { assembleScenario, ROSTER_DAYS, type PostRow } from "./scenario";
import { storedRoster, storedTotals, storedViolations, withGuardNames } from "./stored";
import { postLabels } from "./shift-events";

export interface BuildRequest {
  siteId: number;
  /** The Monday the week starts on (YYYY-MM-DD, the site's calendar). */
  startsOn: string;
  userId: number | null;
}

export interface BuildOutcome {
  rosterId: number;
  revision: number;
  shifts: number;
  unfilledSlots: number;
  violations: number;
  summary: string;
}

type Progress = (fraction: number, message: string) => Promise<void>;

/**
 * The posts of every exhibition running on some day of the week (each post once): the engine
 * staffs one post list for the whole period, so a room that opens mid-week is staffed all week.
 */
export async function postsForWeek(db: Kysely<Database>, siteId: number, timeZone: string, startsOn: string, days = ROSTER_DAYS): Promise<PostRow[]> {
  const posts = new Map<string, PostRow>();
  for (let day = 0; day < days; day++) {
    const date = addLocalDays(timeZone, startsOn, day);
    for (const post of await approvedPostsForSite(siteId, date, db)) {
      if (!posts.has(post.id)) posts.set(post.id, { id: post.id, room: post.room, skills: post.skills, risk: post.risk });
    }
  }
  return [...posts.values()];
}

/** Reads everything the engine needs for a site's week. */
export async function scenarioForWeek(db: Kysely<Database>, siteId: number, startsOn: string): Promise<{ scenario: Scenario; guardNames: Map<number, string> }> {
  const site = await siteById(db, siteId);
  if (!site) throw new Error(`site ${siteId} does not exist`);
  const lastDay = addLocalDays(site.time_zone, startsOn, ROSTER_DAYS - 1);
  const [posts, guards, timeOff] = await Promise.all([
    postsForWeek(db, siteId, site.time_zone, startsOn),
    activeGuardsOfSite(db, siteId),
    approvedTimeOff(db, siteId, startsOn, lastDay),
  ]);
  if (posts.length === 0) {
    throw new Error(`no approved post plans for an exhibition running in the week of ${formatDate(siteFormat(site), startsOn)}; approve the rooms' post plans first`);
  }
  if (guards.length === 0) throw new Error(`${site.name} has no guards to staff the week`);
  const scenario = assembleScenario({ site, startsOn, posts, guards, timeOff });
  return { scenario, guardNames: new Map(guards.map((g) => [g.id, g.name])) };
}

export async function buildDraftRoster(db: Kysely<Database>, request: BuildRequest, progress: Progress = async () => {}): Promise<BuildOutcome> {
  await progress(0.05, "reading posts, guards and time off");
  const { scenario, guardNames } = await scenarioForWeek(db, request.siteId, request.startsOn);
  await progress(0.15, `staffing ${scenario.posts.length} posts with ${scenario.guards.length} guards`);
  // The engine computes for seconds: in its own thread, so the server keeps answering meanwhile,
  // and the job's progress moves every few seconds (a job without progress counts as stale).
  const result = await buildRosterOffThread(scenario, {
    onWorking: (seconds) => progress(Math.min(0.85, 0.15 + seconds / 60), `staffing ${scenario.posts.length} posts with ${scenario.guards.length} guards (${seconds} s)`),
  });
  await progress(0.9, "storing the draft");
  const labels = postLabels(scenario);
  const stored = storedRoster(result.roster, (text) => withGuardNames(text, guardNames, labels));
  const roster = await db.transaction().execute((trx) =>
    replaceDraft(trx, {
      siteId: request.siteId,
      startsOn: request.startsOn,
      days: scenario.days,
      scenario,
      shifts: stored.shifts,
      unfilled: stored.unfilled,
      totals: storedTotals(result.totals),
      violations: storedViolations(result.violations, guardNames, postLabels(scenario)),
      createdBy: request.userId,
    }),
  );
  const unfilledHours = result.totals.unfilledPostHours;
  return {
    rosterId: roster.id,
    revision: roster.revision,
    shifts: stored.shifts.length,
    unfilledSlots: stored.unfilled.length,
    violations: result.violations.length,
    summary: `draft built: ${stored.shifts.length} shifts, ${unfilledHours} post-hours unfilled, ${result.violations.length} rule violations`,
  };
}
