import "server-only";
import type { NextRequest } from "next/server";
import { db } from "@/db";
import { ApiProblem } from "@/lib/api/problem";
import { can, isRole, type Permission } from "@/lib/auth/roles";
import type { SignedInUser } from "@/lib/auth/session";
import { sessionToken } from "@/lib/auth/token";

/**
 * The caller of a route handler, checked on the server: 401 when signed out, 403 when the role
 * (as the database has it now, not as the token remembers it) lacks the permission.
 */
export async function requireRole(request: NextRequest, permission: Permission): Promise<SignedInUser> {
  const token = await sessionToken(request);
  if (!token || typeof token.uid !== "number") {
    throw new ApiProblem(401, "signed-out", "Sign in first: this needs a signed-in user (sessions end after an hour without use or 12 hours after sign-in).");
  }
  const user = await db
    .selectFrom("users")
    .select(["id", "email", "name", "role", "disabled_at"])
    .where("id", "=", token.uid)
    .executeTakeFirst();
  if (!user || !isRole(user.role)) {
    throw new ApiProblem(401, "signed-out", "This account no longer exists; sign in again.");
  }
  if (user.disabled_at) {
    throw new ApiProblem(401, "account-disabled", "This account is disabled; ask an administrator to enable it again.");
  }
  if (!can(user.role, permission)) {
    throw new ApiProblem(403, "forbidden", `The ${user.role} role may not do this (needs ${permission}).`, {
      permission,
    });
  }
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}
