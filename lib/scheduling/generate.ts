// Invented scenarios for tests and benchmarks (demo data only): a museum week with n posts and m guards.
import type { Scenario } from "./scenario";
import { scenarioSchema } from "./scenario";
import { addLocalDays } from "./time";

export interface GeneratedOptions {
  posts: number;
  guards: number;
  open?: [string, string];
  start?: string;
  days?: number;
  skilledPosts?: number;
  skilledGuards?: number;
  paidBreaks?: boolean;
  slotMinutes?: 30 | 60;
  timezone?: string;
  /** Every n-th guard is on leave for one day of the week (a different day for each). */
  leaveEvery?: number;
}

export function generateScenario(o: GeneratedOptions): Scenario {
  const open = o.open ?? ["09:00", "21:00"];
  const skilledPosts = o.skilledPosts ?? 0;
  const skilledGuards = o.skilledGuards ?? 0;
  return scenarioSchema.parse({
    timezone: o.timezone ?? "Europe/Berlin",
    start: o.start ?? "2027-03-22",
    days: o.days ?? 7,
    opening: { weekly: { mon: open, tue: open, wed: open, thu: open, fri: open, sat: open, sun: open } },
    posts: Array.from({ length: o.posts }, (_, i) => ({ id: `P${i + 1}`, room: `Room ${Math.floor(i / 3) + 1}`, skills: i < skilledPosts ? ["high-value"] : [] })),
    guards: Array.from({ length: o.guards }, (_, i) => ({
      id: `G${String(i + 1).padStart(3, "0")}`,
      name: `Guard ${i + 1}`,
      email: `guard${i + 1}@example.org`,
      contractHours: 40,
      maxHours: 48,
      skills: i < skilledGuards ? ["high-value"] : [],
      unavailable: o.leaveEvery && i % o.leaveEvery === 0 ? [leaveDay(o, Math.floor(i / o.leaveEvery) % (o.days ?? 7))] : [],
    })),
    rules: { paidBreaks: o.paidBreaks ?? false, slotMinutes: o.slotMinutes ?? 60 },
  });
}

function leaveDay(o: GeneratedOptions, day: number): { start: string; end: string } {
  const zone = o.timezone ?? "Europe/Berlin";
  const start = o.start ?? "2027-03-22";
  return { start: `${addLocalDays(zone, start, day)}T00:00`, end: `${addLocalDays(zone, start, day + 1)}T00:00` };
}
