// From the database's rows to the staffing engine's scenario (scripts/README.md roster input): the
// site's zone, opening hours and hourly rate, the approved posts, the guards with their contracts
// and skills, approved time off as unavailability, and the default rules.
import { parseScenario, type Scenario } from "@/lib/scheduling/scenario";
import { addLocalDays } from "@/lib/scheduling/time";
import type { GuardRow, OpeningHours, SiteLabourRules } from "@/db/schema";
import { LABOUR_DEFAULT_KEYS } from "@/lib/scheduling/labour-defaults";
import { isTimeZone } from "@/lib/format";

export const ROSTER_DAYS = 7;

export interface SiteRow {
  id: number;
  time_zone: string;
  hourly_rate: number;
  opening_hours: OpeningHours;
  labour_rules?: SiteLabourRules | null;
}

/**
 * Extra hours a week beyond contract a guard accepts when neither the guard nor the site says
 * (a default of this product, not a legal figure: contracts and local law govern).
 */
export const DEFAULT_ACCEPTED_EXTRA_HOURS = 8;

/** The engine rules a site sets in Settings (numbers only; anything else in labour_rules is ignored). */
function siteRules(rules: SiteLabourRules | null | undefined): Record<string, number> {
  const out: Record<string, number> = {};
  for (const key of LABOUR_DEFAULT_KEYS) {
    const value = rules?.[key];
    if (typeof value === "number" && Number.isFinite(value)) out[key] = value;
  }
  return out;
}

/** The guard's own accepted extra hours, else the site's default, else DEFAULT_ACCEPTED_EXTRA_HOURS. */
export function acceptedExtraHours(guard: Pick<GuardRow, "accepted_extra_hours">, site: Pick<SiteRow, "labour_rules">): number {
  const own = guard.accepted_extra_hours;
  if (own !== null && own !== undefined && Number.isFinite(Number(own))) return Number(own);
  const siteDefault = site.labour_rules?.acceptedExtraHours;
  return typeof siteDefault === "number" && Number.isFinite(siteDefault) && siteDefault >= 0 ? siteDefault : DEFAULT_ACCEPTED_EXTRA_HOURS;
}

export interface PostRow {
  id: string;
  room: string;
  skills: string[];
  risk?: "standard" | "high";
}


export interface TimeOffRow {
  guard_id: number;
  /** First and last day off, inclusive, as the site's calendar dates. */
  starts_on: string;
  ends_on: string;
}

export interface ScenarioRows {
  site: SiteRow;
  startsOn: string;
  days?: number;
  posts: PostRow[];
  guards: GuardRow[];
  timeOff: TimeOffRow[];
}

/** The engine's id of a guard: "G" and the database id, so messages and output name guards uniquely. */
export function guardKey(guardId: number): string {
  return `G${guardId}`;
}

/** The database id behind an engine guard id, or null when it is not one of ours. */
export function guardIdOfKey(key: string): number | null {
  const match = /^G(\d+)$/.exec(key);
  return match ? Number(match[1]) : null;
}

/** True when `date` (YYYY-MM-DD) is a Monday: rosters run Monday to Sunday. */
export function isMonday(date: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(date)) return false;
  const [y, m, d] = date.split("-").map(Number);
  const day = new Date(Date.UTC(y!, m! - 1, d!));
  return day.getUTCFullYear() === y && day.getUTCMonth() === m! - 1 && day.getUTCDate() === d && day.getUTCDay() === 1;
}

/** The calendar date `days` days after `date` (both YYYY-MM-DD; negative goes back). */
export function addCalendarDays(date: string, days: number): string {
  const day = new Date(`${date}T12:00:00Z`);
  day.setUTCDate(day.getUTCDate() + days);
  return day.toISOString().slice(0, 10);
}

/** The Monday that starts the roster week holding `date` (YYYY-MM-DD). */
export function mondayOf(date: string): string {
  return addCalendarDays(date, -((new Date(`${date}T12:00:00Z`).getUTCDay() + 6) % 7));
}

/**
 * Assembles and validates the scenario. Time off from day A to day B (inclusive) makes the guard
 * unavailable from A 00:00 to the midnight after B, in the site's zone; requests outside the
 * period are left out. Throws with the engine's field messages when a row breaks the scenario.
 */
export function assembleScenario(rows: ScenarioRows): Scenario {
  const zone = rows.site.time_zone;
  if (!isTimeZone(zone)) throw new Error(`the roster scenario is not valid: timezone: unknown IANA time zone ${JSON.stringify(zone)}; set the site's time zone`);
  const days = rows.days ?? ROSTER_DAYS;
  const periodEnd = addLocalDays(zone, rows.startsOn, days);
  const input = {
    timezone: zone,
    start: rows.startsOn,
    days,
    opening: { weekly: rows.site.opening_hours.weekly, dates: rows.site.opening_hours.dates ?? {} },
    posts: rows.posts.map((post) => ({ id: post.id, room: post.room, skills: [...post.skills], risk: post.risk ?? "standard" })),
    guards: [...rows.guards]
      .sort((a, b) => a.id - b.id)
      .map((guard) => ({
        id: guardKey(guard.id),
        name: guard.name,
        email: guard.email,
        contractHours: Number(guard.contract_hours),
        maxHours: Number(guard.max_hours),
        extraHours: acceptedExtraHours(guard, rows.site),
        skills: [...guard.skills],
        unavailable: rows.timeOff
          .filter((off) => off.guard_id === guard.id && off.starts_on < periodEnd && off.ends_on >= rows.startsOn)
          .sort((a, b) => a.starts_on.localeCompare(b.starts_on))
          .map((off) => ({ start: `${off.starts_on}T00:00`, end: `${addLocalDays(zone, off.ends_on, 1)}T00:00` })),
      })),
    // The site's labour-rule defaults (set in Settings) over the engine's own; local law governs.
    rules: { ...siteRules(rows.site.labour_rules), hourlyRate: Number(rows.site.hourly_rate) },
  };
  const parsed = parseScenario(input);
  if (!parsed.ok) {
    throw new Error(`the roster scenario is not valid: ${parsed.errors.map((e) => `${e.field}: ${e.message}`).join("; ")}`);
  }
  return parsed.scenario;
}
