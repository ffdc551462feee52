// The roster command's input (scripts/README.md): one zod schema types and validates it, and its errors name the field.
import { z } from "zod";

const clock = z.string().regex(/^([01]\d|2[0-4]):[0-5]\d$/, "expected a time HH:mm");
const localDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "expected a date YYYY-MM-DD");
const localDateTime = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, "expected a local time YYYY-MM-DDTHH:mm");
const openingHours = z.union([z.tuple([clock, clock]), z.null()]);

const timezone = z.string().refine((zone) => {
  try {
    new Intl.DateTimeFormat("en", { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}, "unknown IANA time zone");

export const rulesSchema = z.object({
  slotMinutes: z.union([z.literal(60), z.literal(30)]).default(60),
  minShiftHours: z.number().positive().default(4),
  maxShiftHours: z.number().positive().default(10),
  minRestHours: z.number().nonnegative().default(11),
  breakAfterHours: z.number().positive().default(6),
  breakMinutes: z.number().nonnegative().default(60),
  maxHoursAtOnePost: z.number().positive().default(2),
  overtimeAfterHours: z.number().nonnegative().default(40),
  overtimeFactor: z.number().min(1).default(1.5),
  hourlyRate: z.number().nonnegative().default(22),
  paidBreaks: z.boolean().default(false),
  // Soft-goal weights (extra to the contract): money units per unit of unfairness.
  fairnessWeight: z.number().nonnegative().default(5),
  contractWeight: z.number().nonnegative().default(1),
  preferenceWeight: z.number().nonnegative().default(10),
});

const weekdays = ["mon", "tue", "wed", "thu", "fri", "sat", "sun"] as const;
export type Weekday = (typeof weekdays)[number];

export const scenarioSchema = z
  .object({
    timezone,
    start: localDate,
    days: z.number().int().min(1).max(62).default(7),
    opening: z.object({
      weekly: z.object(Object.fromEntries(weekdays.map((d) => [d, openingHours.default(null)])) as {
        [K in Weekday]: z.ZodDefault<typeof openingHours>;
      }),
      dates: z.record(localDate, openingHours).default({}),
    }),
    posts: z.array(
      z.object({
        id: z.string().min(1),
        room: z.string().default(""),
        skills: z.array(z.string()).default([]),
        // A high-risk room is kept guarded first when not every post can be staffed.
        risk: z.enum(["standard", "high"]).default("standard"),
      }),
    ),
    guards: z.array(
      z.object({
        id: z.string().min(1),
        name: z.string().default(""),
        email: z.string().optional(),
        contractHours: z.number().nonnegative().default(40),
        maxHours: z.number().positive().default(48),
        // Extra hours a week beyond contract the guard accepts; with it, contract + extra is a hard
        // limit beside maxHours (the legal weekly maximum). Absent: only maxHours limits the week.
        extraHours: z.number().nonnegative().optional(),
        skills: z.array(z.string()).default([]),
        unavailable: z
          .array(z.object({ start: localDateTime, end: localDateTime }))
          .default([]),
        // Soft wishes (extra to the contract): weekdays off and no late shifts, honoured when the cost allows.
        prefers: z
          .object({ daysOff: z.array(z.enum(weekdays)).default([]), noLateShifts: z.boolean().default(false) })
          .default({ daysOff: [], noLateShifts: false }),
      }),
    ),
    rules: rulesSchema.default(rulesSchema.parse({})),
  })
  .superRefine((scenario, ctx) => {
    const seen = new Set<string>();
    scenario.posts.forEach((post, i) => {
      if (seen.has(post.id)) ctx.addIssue({ code: "custom", path: ["posts", i, "id"], message: `duplicate post id ${post.id}` });
      seen.add(post.id);
    });
    const seenGuards = new Set<string>();
    scenario.guards.forEach((guard, i) => {
      if (seenGuards.has(guard.id)) ctx.addIssue({ code: "custom", path: ["guards", i, "id"], message: `duplicate guard id ${guard.id}` });
      seenGuards.add(guard.id);
    });
    const r = scenario.rules;
    if (r.minShiftHours > r.maxShiftHours)
      ctx.addIssue({ code: "custom", path: ["rules", "minShiftHours"], message: `minShiftHours ${r.minShiftHours} exceeds maxShiftHours ${r.maxShiftHours}` });
  });

export type Scenario = z.output<typeof scenarioSchema>;
export type Rules = Scenario["rules"];
export type Guard = Scenario["guards"][number];
export type Post = Scenario["posts"][number];

export interface ScenarioError {
  field: string;
  message: string;
}

/** Parses a scenario; on failure returns every problem with the dotted path of its field. */
export function parseScenario(input: unknown): { ok: true; scenario: Scenario } | { ok: false; errors: ScenarioError[] } {
  const result = scenarioSchema.safeParse(input);
  if (result.success) return { ok: true, scenario: result.data };
  return {
    ok: false,
    errors: result.error.issues.map((issue) => ({
      field: issue.path.length ? issue.path.map(String).join(".") : "(scenario)",
      message: issue.message,
    })),
  };
}

export const weekdayNames = weekdays;
