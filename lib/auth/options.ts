import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { z } from "zod";
import { db } from "@/db";
import { recordSignIn } from "@/db/queries/accounts";
import { isRole } from "@/lib/auth/roles";
import { decoyHash, hashPassword, needsRehash, verifyPassword } from "@/lib/auth/passwords";
import { safeRedirect } from "@/lib/auth/callback-url";
import { clientAddress, noteSignInFailure, noteSignInSuccess, signInLock, throttledMessage } from "@/lib/auth/throttle";
import { SESSION_IDLE_SECONDS, SESSION_RENEW_SECONDS, nowSeconds, withinAbsoluteLimit } from "@/lib/auth/session-policy";
import { DISABLED_MESSAGE } from "@/lib/auth/throttle-message";

const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().email().max(254),
  password: z.string().min(1).max(200),
});


/** Checks an e-mail and password against users.password_hash; null when they do not match. */
export async function verifyCredentials(email: string, password: string) {
  const user = await db
    .selectFrom("users")
    .select(["id", "email", "name", "role", "password_hash", "disabled_at"])
    .where("email", "=", email)
    .executeTakeFirst();
  // An unknown address is compared against a decoy hash, so it costs as long as a wrong password.
  const matches = await verifyPassword(password, user?.password_hash ?? (await decoyHash()));
  if (!user || !matches || !isRole(user.role)) return null;
  if (user.disabled_at) throw new Error(DISABLED_MESSAGE);
  await recordSignIn(db, user.id);
  if (needsRehash(user.password_hash)) {
    // A seeded (cheaper) hash becomes a full-cost one with a fresh salt at its first sign-in.
    await db.updateTable("users").set({ password_hash: await hashPassword(password) }).where("id", "=", user.id).execute();
  }
  return { id: String(user.id), email: user.email, name: user.name, role: user.role };
}

/**
 * Checks the password unless the account or the address is locked out (lib/auth/throttle.ts).
 * A locked sign-in throws, and next-auth hands the message to the sign-in form; it skips the
 * password check for known and unknown accounts alike.
 */
export async function signInWithThrottle(email: string, password: string, address: string) {
  const lockedUntil = await signInLock(db, email, address);
  if (lockedUntil) throw new Error(throttledMessage(lockedUntil));
  const user = await verifyCredentials(email, password);
  if (user) await noteSignInSuccess(db, email);
  else await noteSignInFailure(db, email, address);
  return user;
}

export const authOptions: NextAuthOptions = {
  secret: process.env.NEXTAUTH_SECRET,
  // A signed JWT in a cookie: no session table, and the proxy can read it without the database.
  // maxAge is the idle expiry: the proxy and route() renew the cookie while the person works, and
  // the jwt callback ends every session at the absolute limit (lib/auth/session-policy.ts).
  session: { strategy: "jwt", maxAge: SESSION_IDLE_SECONDS, updateAge: SESSION_RENEW_SECONDS },
  pages: { signIn: "/sign-in", error: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "e-mail and password",
      credentials: {
        email: { label: "E-mail", type: "email" },
        password: { label: "Password", type: "password" },
      },
      async authorize(credentials, req) {
        const parsed = credentialsSchema.safeParse(credentials ?? {});
        if (!parsed.success) return null;
        return signInWithThrottle(parsed.data.email, parsed.data.password, clientAddress(req?.headers));
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.uid = Number(user.id);
        token.role = user.role;
        token.signedInAt = nowSeconds();
        return token;
      }
      // Past the absolute limit the token keeps no person: the session reads as signed out.
      if (!withinAbsoluteLimit(token)) return { signedInAt: token.signedInAt };
      return token;
    },
    async redirect({ url, baseUrl }) {
      return safeRedirect(url, baseUrl);
    },
    async session({ session, token }) {
      if (token.uid != null && token.role) {
        session.user = {
          ...session.user,
          id: token.uid,
          role: token.role,
          name: token.name ?? "",
          email: token.email ?? "",
        };
      }
      return session;
    },
  },
};
