// Sign-in throttling per account and per client address, kept in PostgreSQL so it holds across
// restarts and across several app processes. An account is keyed by the e-mail as typed (trimmed,
// lower case), whether or not it exists, so known and unknown accounts are throttled alike and
// answer alike. NIST SP 800-63B, section 5.2.2 (as recalled): limit consecutive failed attempts on
// an account; the figures below are common practice, stricter than that guidance's ceiling of 100.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { THROTTLED_PREFIX, throttledMessage } from "./throttle-message";
import { activeSignInLock, clearSignInFailures, recordSignInFailure } from "@/db/queries/sign-in-throttle";

export { THROTTLED_PREFIX, throttledMessage };

export const ACCOUNT_RULE = { limit: 5, windowSeconds: 15 * 60, lockSeconds: 15 * 60 } as const;
export const ADDRESS_RULE = { limit: 30, windowSeconds: 15 * 60, lockSeconds: 15 * 60 } as const;


export const accountKey = (email: string) => `account:${email.trim().toLowerCase()}`;
export const addressKey = (address: string) => `address:${address}`;

/** The client's address: the first X-Forwarded-For hop (set by a reverse proxy), else X-Real-IP, else "local". */
export function clientAddress(headers: Record<string, string | string[] | undefined> | Headers | undefined): string {
  const read = (name: string): string | undefined => {
    if (!headers) return undefined;
    if (headers instanceof Headers) return headers.get(name) ?? undefined;
    const value = headers[name];
    return Array.isArray(value) ? value[0] : value;
  };
  const forwarded = read("x-forwarded-for")?.split(",")[0]?.trim();
  const address = forwarded || read("x-real-ip")?.trim() || "local";
  return address.slice(0, 64);
}


/** The lock in force for this e-mail or this address, or null. */
export function signInLock(db: Kysely<Database>, email: string, address: string): Promise<Date | null> {
  return activeSignInLock(db, [accountKey(email), addressKey(address)]);
}

/** Counts a failed sign-in against the account and the address. */
export async function noteSignInFailure(db: Kysely<Database>, email: string, address: string): Promise<void> {
  await recordSignInFailure(db, accountKey(email), ACCOUNT_RULE);
  await recordSignInFailure(db, addressKey(address), ADDRESS_RULE);
}

export function noteSignInSuccess(db: Kysely<Database>, email: string): Promise<void> {
  return clearSignInFailures(db, accountKey(email));
}
