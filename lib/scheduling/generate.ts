// Invented scenarios for tests and benchmarks (demo data only): a museum week with n posts and m guards.
import type { Scenario } from "./scenario";
import { scenarioSchema } from "./scenario";

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
    })),
    rules: { paidBreaks: o.paidBreaks ?? false, slotMinutes: o.slotMinutes ?? 60 },
  });
}
