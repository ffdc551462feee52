// The words of a throttled sign-in, shared by the server (lib/auth/throttle.ts) and the sign-in form.

/** Start of the error next-auth hands back to the sign-in form when a sign-in is throttled. */
export const THROTTLED_PREFIX = "Too many failed sign-ins";

/** The message a person sees while locked out, with the time to try again. */
export function throttledMessage(until: Date, now = new Date()): string {
  const minutes = Math.max(1, Math.ceil((until.getTime() - now.getTime()) / 60000));
  return `${THROTTLED_PREFIX}. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}, or ask an administrator to reset the password.`;
}
