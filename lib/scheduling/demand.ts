// Demand = posts x open slots, from the weekly opening pattern plus dated exceptions, in the site's zone.
import { weekdayNames, type Guard, type Post, type Scenario } from "./scenario";
import { addLocalDays, localToInstant, MINUTE, parseLocal, weekdayIndex } from "./time";

export interface Slot {
  /** Index into Demand.slots. */
  index: number;
  /** Day number from the scenario start (0-based). */
  day: number;
  start: number;
  end: number;
}

export interface OpenDay {
  day: number;
  date: string;
  /** Real instants of opening and closing; null when closed. */
  open: number | null;
  close: number | null;
  /** Indices into Demand.slots. */
  slots: number[];
}

export interface Demand {
  zone: string;
  days: OpenDay[];
  slots: Slot[];
  posts: Post[];
  /** Guard availability as real intervals. */
  unavailable: Map<string, { start: number; end: number }[]>;
  /** Start of each scenario day (local midnight) as an instant, plus one more for the end. */
  dayStarts: number[];
  /** Posts closed for part of the period (a room closing early): no demand there. */
  closed: Map<string, { start: number; end: number }[]>;
}

/** True when a post is closed at any moment of [start, end). */
export function isPostClosed(demand: Demand, post: string, start: number, end: number): boolean {
  return (demand.closed.get(post) ?? []).some((c) => c.start < end && start < c.end);
}

/** Opening hours of one date: a dated exception wins over the weekly pattern. */
export function openingOf(scenario: Scenario, date: string): [string, string] | null {
  if (Object.prototype.hasOwnProperty.call(scenario.opening.dates, date)) return scenario.opening.dates[date] ?? null;
  return scenario.opening.weekly[weekdayNames[weekdayIndex(scenario.timezone, date)]] ?? null;
}

export function buildDemand(scenario: Scenario): Demand {
  const zone = scenario.timezone;
  const slotMs = scenario.rules.slotMinutes * MINUTE;
  const days: OpenDay[] = [];
  const slots: Slot[] = [];
  const dayStarts: number[] = [];
  for (let day = 0; day <= scenario.days; day++) {
    dayStarts.push(localToInstant(zone, addLocalDays(zone, scenario.start, day)));
  }
  let previousClose = -Infinity;
  for (let day = 0; day < scenario.days; day++) {
    const date = addLocalDays(zone, scenario.start, day);
    const hours = openingOf(scenario, date);
    const opensAt = hours ? localToInstant(zone, date, hours[0]) : 0;
    // A day still open from the night before starts where that opening ends (no slot is demanded twice).
    if (!hours || Math.max(opensAt, previousClose) >= closingOf(zone, date, hours, opensAt)) {
      days.push({ day, date, open: null, close: null, slots: [] });
      continue;
    }
    const open = Math.max(opensAt, previousClose);
    const close = closingOf(zone, date, hours, opensAt);
    previousClose = close;
    const indices: number[] = [];
    for (let t = open; t < close; t += slotMs) {
      indices.push(slots.length);
      slots.push({ index: slots.length, day, start: t, end: Math.min(t + slotMs, close) });
    }
    days.push({ day, date, open, close, slots: indices });
  }
  const unavailable = new Map<string, { start: number; end: number }[]>();
  for (const guard of scenario.guards) unavailable.set(guard.id, guardUnavailability(zone, guard));
  return { zone, days, slots, posts: scenario.posts, unavailable, dayStarts, closed: new Map() };
}

/** Closing instant; a closing at or before the opening time means past midnight. */
function closingOf(zone: string, date: string, hours: [string, string], opensAt: number): number {
  const close = localToInstant(zone, date, hours[1]);
  return close <= opensAt ? localToInstant(zone, addLocalDays(zone, date, 1), hours[1]) : close;
}

function guardUnavailability(zone: string, guard: Guard): { start: number; end: number }[] {
  return guard.unavailable
    .map((u) => ({ start: parseLocal(zone, u.start), end: parseLocal(zone, u.end) }))
    .filter((u) => u.end > u.start)
    .sort((a, b) => a.start - b.start);
}

/** Post-hours of demand (every post is open every open slot). */
export function demandPostHours(demand: Demand): number {
  let ms = 0;
  for (const post of demand.posts) for (const s of demand.slots) if (!isPostClosed(demand, post.id, s.start, s.end)) ms += s.end - s.start;
  return ms / 3_600_000;
}

/** True when a guard is unavailable at any moment of [start, end). */
export function isUnavailable(demand: Demand, guard: string, start: number, end: number): boolean {
  return (demand.unavailable.get(guard) ?? []).some((u) => u.start < end && start < u.end);
}

export function hasSkills(guardSkills: readonly string[], postSkills: readonly string[]): boolean {
  return postSkills.every((s) => guardSkills.includes(s));
}

/** Week block (0-based, 7 scenario days each) that an instant falls in; overtime counts per block. */
export function weekOf(demand: Demand, instant: number): number {
  let day = 0;
  while (day + 1 < demand.dayStarts.length && demand.dayStarts[day + 1] <= instant) day++;
  return Math.floor(day / 7);
}
