// What a post plan costs in people and money: post-hours per week from the site's opening hours, the
// full-time equivalents (FTE) they need, and the wage bill at the site's hourly rate. Pure maths, so
// the room page, the server and the tests agree. Times are "HH:mm" local wall-clock times.

export type Weekday = "mon" | "tue" | "wed" | "thu" | "fri" | "sat" | "sun";
export const WEEKDAYS: readonly Weekday[] = ["mon", "tue", "wed", "thu", "fri", "sat", "sun"];

/** One day's opening, ["10:00", "18:00"], or null when closed. */
export type DayOpening = readonly [string, string] | null;
/** The weekly pattern of a site's opening hours (dated exceptions are left out of a typical week). */
export type WeeklyOpening = Partial<Record<Weekday, DayOpening>>;

/** Hours in a full-time contract week when the site sets none (common practice in the EU and US). */
export const DEFAULT_CONTRACT_HOURS = 40;
/**
 * Paid people per staffed position to cover leave, sickness and training. Common practice puts it
 * around 1.2; there is no published source, so the room page lets the manager set it.
 */
export const DEFAULT_RELIEF_FACTOR = 1.2;
export const WEEKS_PER_YEAR = 52;

/** Minutes after midnight of "HH:mm" ("24:00" is the end of the day); throws on anything else. */
export function minutesOf(time: string): number {
  const match = /^(\d{1,2}):(\d{2})$/.exec(time.trim());
  if (!match) throw new Error(`"${time}" is not a time of day; write it as HH:mm, e.g. "09:30"`);
  const hours = Number(match[1]);
  const minutes = Number(match[2]);
  if (minutes > 59 || hours > 24 || (hours === 24 && minutes > 0)) throw new Error(`"${time}" is not a time of day between 00:00 and 24:00`);
  return hours * 60 + minutes;
}

/**
 * Hours one day's opening lasts. A closing time at or before the opening time means the site
 * closes after midnight (["18:00", "02:00"] is 8 hours).
 */
export function openHoursOfDay(opening: DayOpening): number {
  if (!opening) return 0;
  const open = minutesOf(opening[0]);
  let close = minutesOf(opening[1]);
  if (close <= open) close += 24 * 60;
  return (close - open) / 60;
}

/** Open hours in a typical week: the sum over the weekly pattern (missing days are closed). */
export function weeklyOpenHours(weekly: WeeklyOpening): number {
  return WEEKDAYS.reduce((sum, day) => sum + openHoursOfDay(weekly[day] ?? null), 0);
}

export interface StaffingCostInput {
  /** Posts in the plan; each must be staffed every open hour. */
  posts: number;
  /** Open hours in a week (see weeklyOpenHours). */
  weeklyOpenHours: number;
  /** Site's hourly rate for a guard, in the site's currency. */
  hourlyRate: number;
  /** Hours in a full-time week (default 40). */
  contractHours?: number;
  /** People per staffed position for leave and sickness (default 1.2, common practice). */
  reliefFactor?: number;
}

export interface StaffingCost {
  /** posts × open hours per week. */
  postHoursPerWeek: number;
  /** Full-time equivalents: post-hours / contract hours × relief factor. */
  fte: number;
  /** Hours paid per week including relief: FTE × contract hours = post-hours × relief factor. */
  paidHoursPerWeek: number;
  /** Paid hours × hourly rate. */
  costPerWeek: number;
  /** Cost per week × 52. */
  costPerYear: number;
  contractHours: number;
  reliefFactor: number;
}

/** Staffing cost of a post plan; throws with a plain message on inputs that make no sense. */
export function staffingCost(input: StaffingCostInput): StaffingCost {
  const contractHours = input.contractHours ?? DEFAULT_CONTRACT_HOURS;
  const reliefFactor = input.reliefFactor ?? DEFAULT_RELIEF_FACTOR;
  if (!(Number.isInteger(input.posts) && input.posts >= 0)) throw new Error(`posts must be a whole number from 0, not ${input.posts}`);
  if (!(input.weeklyOpenHours >= 0 && input.weeklyOpenHours <= 168)) throw new Error(`open hours per week must lie between 0 and 168, not ${input.weeklyOpenHours}`);
  if (!(contractHours > 0)) throw new Error(`contract hours must be more than 0, not ${contractHours}`);
  if (!(reliefFactor >= 1)) throw new Error(`the relief factor must be at least 1 (one person per position), not ${reliefFactor}`);
  if (!(input.hourlyRate >= 0)) throw new Error(`the hourly rate must be 0 or more, not ${input.hourlyRate}`);
  const postHoursPerWeek = input.posts * input.weeklyOpenHours;
  const fte = (postHoursPerWeek / contractHours) * reliefFactor;
  const paidHoursPerWeek = fte * contractHours;
  const costPerWeek = paidHoursPerWeek * input.hourlyRate;
  return {
    postHoursPerWeek,
    fte,
    paidHoursPerWeek,
    costPerWeek,
    costPerYear: costPerWeek * WEEKS_PER_YEAR,
    contractHours,
    reliefFactor,
  };
}

/** What one post more or fewer changes: the difference of two plans' costs (b − a). */
export function staffingCostChange(a: StaffingCost, b: StaffingCost): { postHoursPerWeek: number; fte: number; costPerWeek: number } {
  return {
    postHoursPerWeek: b.postHoursPerWeek - a.postHoursPerWeek,
    fte: b.fte - a.fte,
    costPerWeek: b.costPerWeek - a.costPerWeek,
  };
}
