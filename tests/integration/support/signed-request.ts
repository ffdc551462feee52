// Requests signed as a seeded user, for calling route handlers in-process (next-auth's JWT cookie,
// as a browser sends it after signing in).
import { NextRequest } from "next/server";
import { encode } from "next-auth/jwt";
import type { Kysely } from "kysely";
import type { Database, Role } from "@/db/schema";

const SECRET = "signed-request-test-secret";

export interface SignedUser {
  id: number;
  email: string;
  name: string;
  role: Role;
}

export async function userByEmail(db: Kysely<Database>, email: string): Promise<SignedUser> {
  const row = await db.selectFrom("users").select(["id", "email", "name", "role"]).where("email", "=", email).executeTakeFirst();
  if (!row) throw new Error(`the seed has no account ${email}; run npm test (it seeds the demo museum)`);
  return row;
}

/** A GET (or JSON POST, PUT, PATCH …) request signed as `user`, or unsigned for null. */
export async function signedRequest(user: SignedUser | null, url: string, body?: unknown, method?: string): Promise<NextRequest> {
  process.env.NEXTAUTH_SECRET ??= SECRET;
  const headers = new Headers({ "content-type": "application/json" });
  if (user) {
    const token = await encode({ token: { uid: user.id, role: user.role, email: user.email, name: user.name, signedInAt: Math.floor(Date.now() / 1000) }, secret: process.env.NEXTAUTH_SECRET });
    headers.set("cookie", `next-auth.session-token=${token}`);
  }
  return new NextRequest(url, body === undefined ? { method: method ?? "GET", headers } : { method: method ?? "POST", headers, body: JSON.stringify(body) });
}
