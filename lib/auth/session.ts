import "server-only";
import { cache } from "react";
import { getServerSession } from "next-auth";
import { forbidden, redirect } from "next/navigation";
import { db } from "@/db";
import { authOptions } from "@/lib/auth/options";
import { can, isRole, type Permission, type Role } from "@/lib/auth/roles";

export interface SignedInUser {
  id: number;
  email: string;
  name: string;
  role: Role;
}

/** The session's person as the token says, without touching the database (for the shell). */
export const sessionUser = cache(async (): Promise<SignedInUser | null> => {
  const session = await getServerSession(authOptions);
  const user = session?.user;
  if (!user || typeof user.id !== "number" || !isRole(user.role)) return null;
  return { id: user.id, email: user.email, name: user.name, role: user.role };
});

/** The signed-in person as the database has them now, so a changed role or removed account counts at once. */
export const currentUser = cache(async (): Promise<SignedInUser | null> => {
  const fromToken = await sessionUser();
  if (!fromToken) return null;
  const row = await db
    .selectFrom("users")
    .select(["id", "email", "name", "role", "disabled_at"])
    .where("id", "=", fromToken.id)
    .executeTakeFirst();
  // A disabled account reads as signed out: its session ends at the next request.
  if (!row || !isRole(row.role) || row.disabled_at) return null;
  return { id: row.id, email: row.email, name: row.name, role: row.role };
});

/** For pages: signed out goes to /sign-in, a role without the permission gets our 403 page. */
export async function requirePageUser(permission?: Permission): Promise<SignedInUser> {
  const user = await currentUser();
  if (!user) redirect("/sign-in");
  if (permission && !can(user.role, permission)) forbidden();
  return user;
}
