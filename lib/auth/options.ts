import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import bcrypt from "bcryptjs";
import { z } from "zod";
import { db } from "@/db";
import { isRole } from "@/lib/auth/roles";

const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().email().max(254),
  password: z.string().min(1).max(200),
});

// Compared against when the e-mail is unknown, so a wrong address costs as long as a wrong password.
const UNKNOWN_USER_HASH = "$2b$10$/s4UyAKEtnB7in2d0fZSbeYkc4Df5gC6l0cwVge9/mZQ.WarKycya";

/** Checks an e-mail and password against users.password_hash; null when they do not match. */
export async function verifyCredentials(email: string, password: string) {
  const user = await db
    .selectFrom("users")
    .select(["id", "email", "name", "role", "password_hash"])
    .where("email", "=", email)
    .executeTakeFirst();
  const matches = await bcrypt.compare(password, user?.password_hash ?? UNKNOWN_USER_HASH);
  if (!user || !matches || !isRole(user.role)) return null;
  return { id: String(user.id), email: user.email, name: user.name, role: user.role };
}

export const authOptions: NextAuthOptions = {
  secret: process.env.NEXTAUTH_SECRET,
  // A signed JWT in a cookie: no session table, and the proxy can read it without the database.
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
  pages: { signIn: "/sign-in", error: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "e-mail and password",
      credentials: {
        email: { label: "E-mail", type: "email" },
        password: { label: "Password", type: "password" },
      },
      async authorize(credentials) {
        const parsed = credentialsSchema.safeParse(credentials ?? {});
        if (!parsed.success) return null;
        return verifyCredentials(parsed.data.email, parsed.data.password);
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.uid = Number(user.id);
        token.role = user.role;
      }
      return token;
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
