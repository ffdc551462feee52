// The audit trail's query (pure zod: the admin page's filters use the same words).
import { z } from "zod";
import { AUDIT_AREAS } from "@/lib/audit/areas";
import { MAX_ID } from "@/lib/api/ids";

const AREAS = Object.keys(AUDIT_AREAS) as [keyof typeof AUDIT_AREAS, ...(keyof typeof AUDIT_AREAS)[]];
const instant = (name: string) =>
  z
    .string()
    .max(40, `${name} is a date or time such as 2027-01-18 or 2027-01-18T09:00:00Z`)
    .refine((v) => /^\d{4}-\d{2}-\d{2}([T ][\d:.]+(Z|[+-]\d{2}:?\d{2})?)?$/.test(v) && !Number.isNaN(Date.parse(v)), `${name} is a date or time such as 2027-01-18 or 2027-01-18T09:00:00Z`)
    .transform((v) => new Date(v))
    .refine((d) => d.getUTCFullYear() >= 2000 && d.getUTCFullYear() <= 2100, `${name} lies between the years 2000 and 2100`);

export const auditQuerySchema = z.object({
  area: z.enum(AREAS, { error: `area is one of ${AREAS.join(", ")}` }).optional(),
  actor: z.coerce.number({ error: "actor is a user id" }).int("actor is a user id").min(1, "actor is a user id").max(MAX_ID, "actor is a user id").optional(),
  from: instant("from").optional(),
  to: instant("to").optional(),
  limit: z.coerce.number().int("limit must be a whole number").min(1, "limit must be at least 1").max(1000, "limit must be at most 1000").optional(),
});
