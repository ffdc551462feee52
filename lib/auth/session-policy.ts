// How long a sign-in lasts. A session ends after SESSION_IDLE_SECONDS without a request (the
// signed token's expiry, renewed at most every SESSION_RENEW_SECONDS while the person works) and
// in any case SESSION_ABSOLUTE_SECONDS after the password was given. Common practice for staff
// tools holding personal data: idle expiry within an hour or two, an absolute limit of one shift.
import type { JWT } from "next-auth/jwt";

export const SESSION_IDLE_SECONDS = 60 * 60;
export const SESSION_RENEW_SECONDS = 5 * 60;
export const SESSION_ABSOLUTE_SECONDS = 12 * 60 * 60;

/** Seconds since the epoch. */
export function nowSeconds(): number {
  return Math.floor(Date.now() / 1000);
}

/** True while the token's sign-in is younger than the absolute limit. */
export function withinAbsoluteLimit(token: Pick<JWT, "signedInAt"> | null | undefined, now = nowSeconds()): boolean {
  const at = token?.signedInAt;
  return typeof at === "number" && now - at < SESSION_ABSOLUTE_SECONDS && at <= now + 60;
}
