// Guards every page before it renders: signed out goes to /sign-in, a wrong role sees our 403 page.
// Every page answer carries the Content-Security-Policy with a fresh nonce (lib/security/csp.ts),
// and a working session's idle expiry is renewed. Route handlers under /api check on their own
// (lib/api/require-role.ts, lib/api/route.ts) and answer JSON.
import { NextResponse, type NextRequest } from "next/server";
import type { JWT } from "next-auth/jwt";
import { db } from "@/db";
import { can, isRole, permissionForPath, type Role } from "@/lib/auth/roles";
import { renewSession, sessionToken } from "@/lib/auth/token";
import { newNonce, pagePolicy } from "@/lib/security/csp";

const PUBLIC_PATHS = ["/sign-in", "/forbidden", "/set-password"];

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

function isTls(request: NextRequest): boolean {
  return request.nextUrl.protocol === "https:" || request.headers.get("x-forwarded-proto") === "https";
}

async function decide(request: NextRequest, token: JWT | null, requestHeaders: Headers): Promise<NextResponse> {
  const { pathname, search } = request.nextUrl;
  const next = () => NextResponse.next({ request: { headers: requestHeaders } });
  if (PUBLIC_PATHS.includes(pathname)) return next();

  if (!token || !isRole(token.role)) {
    const signIn = new URL("/sign-in", request.url);
    if (pathname !== "/") signIn.searchParams.set("callbackUrl", pathname + search);
    return NextResponse.redirect(signIn);
  }

  const permission = permissionForPath(pathname);
  if (permission && !can(token.role, permission) && !can(await roleNow(token.uid, token.role), permission)) {
    // The /forbidden page calls forbidden(), so the answer carries status 403 and keeps the address.
    return NextResponse.rewrite(new URL("/forbidden", request.url), { request: { headers: requestHeaders } });
  }
  return next();
}

export default async function proxy(request: NextRequest) {
  const nonce = newNonce();
  const policy = pagePolicy(nonce, { development: process.env.NODE_ENV === "development", tls: isTls(request) });
  // Next.js reads the nonce from the request's CSP header while it renders the page.
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("content-security-policy", policy);
  requestHeaders.set("x-nonce", nonce);

  const token = await sessionToken(request);
  const response = await decide(request, token, requestHeaders);
  response.headers.set("content-security-policy", policy);
  if (token) await renewSession(request, response, token);
  return response;
}

export const config = {
  // Everything except route handlers, Next.js assets and files such as /icon.svg.
  matcher: ["/((?!api/|_next/|[^/]+\\.(?:svg|ico|png|txt|xml|webmanifest)$).*)"],
};
