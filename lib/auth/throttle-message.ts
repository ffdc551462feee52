// The words of a throttled or refused sign-in, shared by the server (lib/auth/throttle.ts,
// lib/auth/options.ts) and the sign-in form.

/** Start of the error next-auth hands back to the sign-in form when a sign-in is throttled. */
export const THROTTLED_PREFIX = "Too many failed sign-ins";

/** The message a person sees while locked out, with the time to try again. */
export function throttledMessage(until: Date, now = new Date()): string {
  const minutes = Math.max(1, Math.ceil((until.getTime() - now.getTime()) / 60000));
  return `${THROTTLED_PREFIX}. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}, or ask an administrator to reset the password.`;
}

/** The whole message a disabled account's sign-in is refused with. */
export const DISABLED_MESSAGE = "This account is disabled; ask an administrator to enable it again.";
