import type { NextRequest } from "next/server";
import { NextResponse } from "next/server";
import { db } from "@/db";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";

/** GET /api/users: every account with its role (admins only). */
export const GET = route(async (request: NextRequest) => {
  await requireRole(request, "users:manage");
  const users = await db.selectFrom("users").select(["id", "email", "name", "role", "created_at"]).orderBy("name").execute();
  return NextResponse.json({ users });
});
