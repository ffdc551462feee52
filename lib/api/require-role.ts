import "server-only";
import type { NextRequest } from "next/server";
import { getToken } from "next-auth/jwt";
import { db } from "@/db";
import { ApiProblem } from "@/lib/api/problem";
import { can, isRole, type Permission } from "@/lib/auth/roles";
import type { SignedInUser } from "@/lib/auth/session";

/**
 * The caller of a route handler, checked on the server: 401 when signed out, 403 when the role
 * (as the database has it now, not as the token remembers it) lacks the permission.
 */
export async function requireRole(request: NextRequest, permission: Permission): Promise<SignedInUser> {
  const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
  if (!token || typeof token.uid !== "number") {
    throw new ApiProblem(401, "signed-out", "Sign in first: this needs a signed-in user.");
  }
  const user = await db
    .selectFrom("users")
    .select(["id", "email", "name", "role"])
    .where("id", "=", token.uid)
    .executeTakeFirst();
  if (!user || !isRole(user.role)) {
    throw new ApiProblem(401, "signed-out", "This account no longer exists; sign in again.");
  }
  if (!can(user.role, permission)) {
    throw new ApiProblem(403, "forbidden", `The ${user.role} role may not do this (needs ${permission}).`, {
      permission,
    });
  }
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}
