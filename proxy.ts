// Guards every page before it renders: signed out goes to /sign-in, a wrong role sees our 403 page.
// Route handlers under /api check on their own (lib/api/require-role.ts) and answer JSON.
import { NextResponse, type NextRequest } from "next/server";
import { getToken } from "next-auth/jwt";
import { can, isRole, permissionForPath } from "@/lib/auth/roles";

const PUBLIC_PATHS = ["/sign-in", "/forbidden"];

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
  if (permission && !can(token.role, permission)) {
    // The /forbidden page calls forbidden(), so the answer carries status 403 and keeps the address.
    return NextResponse.rewrite(new URL("/forbidden", request.url));
  }
  return NextResponse.next();
}

export const config = {
  // Everything except route handlers, Next.js assets and files such as /icon.svg.
  matcher: ["/((?!api/|_next/|[^/]+\\.(?:svg|ico|png|txt|xml|webmanifest)$).*)"],
};
