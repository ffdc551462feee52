// Guards every page before it renders: signed out goes to /sign-in, a wrong role sees our 403 page.
// Route handlers under /api check on their own (lib/api/require-role.ts) and answer JSON.
import { NextResponse, type NextRequest } from "next/server";
import { getToken } from "next-auth/jwt";
import { db } from "@/db";
import { can, isRole, permissionForPath, type Role } from "@/lib/auth/roles";

const PUBLIC_PATHS = ["/sign-in", "/forbidden"];

// The token remembers the role at sign-in; before refusing, ask the database whether an admin has
// since granted more. Pages re-check from the database too, so a withdrawn role is caught there.
async function roleNow(userId: number | undefined, remembered: Role): Promise<Role> {
  if (typeof userId !== "number") return remembered;
  try {
    const row = await db.selectFrom("users").select("role").where("id", "=", userId).executeTakeFirst();
    return row && isRole(row.role) ? row.role : remembered;
  } catch {
    // Database down: keep the token's answer; the page itself will say the database is unavailable.
    return remembered;
  }
}

export default async function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  if (PUBLIC_PATHS.includes(pathname)) return NextResponse.next();

  const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
  if (!token || !isRole(token.role)) {
    const signIn = new URL("/sign-in", request.url);
    if (pathname !== "/") signIn.searchParams.set("callbackUrl", pathname + search);
    return NextResponse.redirect(signIn);
  }

  const permission = permissionForPath(pathname);
  if (permission && !can(token.role, permission) && !can(await roleNow(token.uid, token.role), permission)) {
    // The /forbidden page calls forbidden(), so the answer carries status 403 and keeps the address.
    return NextResponse.rewrite(new URL("/forbidden", request.url));
  }
  return NextResponse.next();
}

export const config = {
  // Everything except route handlers, Next.js assets and files such as /icon.svg.
  matcher: ["/((?!api/|_next/|[^/]+\\.(?:svg|ico|png|txt|xml|webmanifest)$).*)"],
};
