// Reads and renews the session token for the proxy and route handlers, applying the session
// policy (lib/auth/session-policy.ts) the same way in both.
import type { NextRequest, NextResponse } from "next/server";
import { encode, getToken, type JWT } from "next-auth/jwt";
import { SESSION_IDLE_SECONDS, SESSION_RENEW_SECONDS, nowSeconds, withinAbsoluteLimit } from "@/lib/auth/session-policy";

function secureCookies(): boolean {
  return (process.env.NEXTAUTH_URL ?? "").startsWith("https://");
}

/** next-auth 4's session cookie name (the __Secure- prefix when served over TLS). */
export function sessionCookieName(): string {
  return `${secureCookies() ? "__Secure-" : ""}next-auth.session-token`;
}

// One decryption per request: the role check and the renewal read the same cookie.
const decoded = new WeakMap<NextRequest, Promise<JWT | null>>();

/** The signed-in token, or null when signed out, expired (idle) or past the absolute limit. */
export function sessionToken(request: NextRequest): Promise<JWT | null> {
  let found = decoded.get(request);
  if (!found) {
    found = getToken({ req: request, secret: process.env.NEXTAUTH_SECRET }).then((token) =>
      !token || typeof token.uid !== "number" || !withinAbsoluteLimit(token) ? null : token,
    );
    decoded.set(request, found);
  }
  return found;
}

/**
 * Renews the idle expiry while the person works: when the token was issued more than
 * SESSION_RENEW_SECONDS ago, the response carries the same token signed again with a fresh
 * expiry. The absolute limit still holds, since signedInAt travels unchanged.
 */
export async function renewSession(request: NextRequest, response: NextResponse | Response, token?: JWT | null): Promise<void> {
  const current = token === undefined ? await sessionToken(request) : token;
  if (!current || typeof current.iat !== "number") return;
  if (nowSeconds() - current.iat < SESSION_RENEW_SECONDS) return;
  const secret = process.env.NEXTAUTH_SECRET;
  if (!secret) return;
  const { iat: _iat, exp: _exp, jti: _jti, ...claims } = current as JWT & { iat?: number; exp?: number; jti?: string };
  const value = await encode({ token: claims, secret, maxAge: SESSION_IDLE_SECONDS });
  const parts = [
    `${sessionCookieName()}=${value}`,
    "Path=/",
    "HttpOnly",
    "SameSite=Lax",
    `Max-Age=${SESSION_IDLE_SECONDS}`,
    `Expires=${new Date(Date.now() + SESSION_IDLE_SECONDS * 1000).toUTCString()}`,
  ];
  if (secureCookies()) parts.push("Secure");
  try {
    response.headers.append("set-cookie", parts.join("; "));
  } catch {
    // Some responses (a redirect made by the platform) have read-only headers: renew next time.
  }
}
