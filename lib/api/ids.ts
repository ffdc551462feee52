// Row ids as the API accepts them. PostgreSQL's `integer` holds 1 … 2,147,483,647 (the
// PostgreSQL manual, "Numeric Types"); anything beyond can name no row, so it is refused here
// with a message instead of reaching the database as "integer out of range". Pure zod: the
// browser side may import these schemas too.
import { z } from "zod";

/** The largest value of a PostgreSQL `integer` (2^31 - 1). */
export const MAX_ID = 2_147_483_647;

/** A path segment such as [id]: decimal digits only (no "1e3", "0x10", " 7" or "+7"), 1 … 2^31-1. */
export function idParam(name: string) {
  return z
    .string({ error: `${name} must be a number` })
    .regex(/^\d+$/, `${name} must be a whole number written with digits, e.g. 12`)
    .refine((value) => value.length <= 10 && Number(value) <= MAX_ID, `${name} is too large: ids go up to ${MAX_ID}`)
    .transform(Number)
    .refine((value) => value >= 1, `${name} must be positive`);
}

/** An id inside a JSON body: a whole number 1 … 2^31-1. */
export function bodyId(name: string) {
  return z
    .number({ error: `${name} must be a number` })
    .int(`${name} must be a whole number`)
    .positive(`${name} must be positive`)
    .max(MAX_ID, `${name} is too large: ids go up to ${MAX_ID}`);
}

/** A version or revision counter inside a JSON body (stored as `integer` too). */
export function counter(name: string) {
  return bodyId(name);
}
