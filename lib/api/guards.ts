// A guard as People's form and the API accept them (pure zod, shared).
import { z } from "zod";
import { idParam } from "@/lib/api/ids";

const hours = (what: string, max: number) =>
  z.number({ error: `${what} must be a number` }).min(0, `${what} cannot be negative`).max(max, `${what} is at most ${max} h a week`);

const fields = {
  name: z.string({ error: "give the guard's name" }).trim().min(1, "give the guard's name").max(120, "keep the name under 120 characters"),
  email: z.string().trim().toLowerCase().email("give an e-mail address such as name@example.org").max(254),
  contractHours: hours("contract hours", 60),
  /** The legal weekly maximum the site applies to this guard (48 h under EU Directive 2003/88/EC, Art. 6). */
  maxHours: hours("maximum hours", 60).refine((h) => h > 0, "maximum hours must be more than 0"),
  /** Extra hours a week beyond contract the guard accepts; null = the site's default. */
  acceptedExtraHours: hours("accepted extra hours", 40).nullable(),
  skills: z
    .array(z.string().trim().toLowerCase().regex(/^[a-z][a-z0-9-]{0,39}$/, "a skill is a short word such as first-aid"))
    .max(12, "at most 12 skills")
    .transform((list) => [...new Set(list)]),
};

const contractWithinMax = (v: { contractHours: number; maxHours: number }) => v.contractHours <= v.maxHours;
const contractMessage = { message: "contract hours cannot exceed the maximum hours", path: ["contractHours"] };

export const guardCreateSchema = z.object({ siteId: z.number().int().positive().max(2_147_483_647), ...fields }).refine(contractWithinMax, contractMessage);
export const guardUpdateSchema = z.object({ ...fields, active: z.boolean() }).refine(contractWithinMax, contractMessage);
export type GuardUpdate = z.infer<typeof guardUpdateSchema>;

export const guardIdParams = z.object({ id: idParam("id") });

/** "first-aid, evening" → ["first-aid", "evening"] (the form's skills field). */
export function skillsFromText(text: string): string[] {
  return text.split(/[,;\s]+/).map((s) => s.trim()).filter(Boolean);
}
