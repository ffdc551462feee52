// Where sign-in may send a person (lib/auth/callback-url.ts), which requests may change state
// (lib/api/origin.ts), the page policy (lib/security/csp.ts) and the headers next.config.mjs sets.
import { describe, expect, it } from "vitest";
import { safeCallbackPath, safeRedirect } from "@/lib/auth/callback-url";
import { foreignOriginReason } from "@/lib/api/origin";
import { API_POLICY, newNonce, pagePolicy } from "@/lib/security/csp";
import type { NextConfig } from "next";

const CONFIG_PATH = "@/next.config.mjs";
const nextConfig = ((await import(/* @vite-ignore */ CONFIG_PATH)) as { default: NextConfig }).default;

const SITE = "https://museum.example.org";

describe("callbackUrl only ever leads to our own pages", () => {
  // Each is resolved the way a browser does (Node's URL implements the WHATWG URL standard).
  it.each([
    "/\\evil.example",
    "/%5Cevil.example",
    "/%5cevil.example",
    "//evil.example",
    "///evil.example",
    "/\t/evil.example",
    "/\n/evil.example",
    "https://evil.example/",
    "http:evil.example",
    "javascript:alert(1)",
    "evil.example",
    "/%2F%2Fevil.example",
    "\\\\evil.example",
    "",
  ])("refuses %j", (value) => {
    expect(safeCallbackPath(value)).toBe("/");
  });

  it("the probe's address really leads away without the check (WHATWG URL)", () => {
    expect(new URL("/\\evil.example", SITE).host).toBe("evil.example");
  });

  it.each(["/", "/staffing", "/galleries/12?tab=plans", "/my-shifts#today", "/people?q=Mara%20L"])("keeps %j", (value) => {
    expect(safeCallbackPath(value)).toBe(value);
    expect(new URL(safeCallbackPath(value), SITE).host).toBe("museum.example.org");
  });

  it("keeps next-auth's redirects on our own origin", () => {
    expect(safeRedirect(`${SITE}/staffing`, SITE)).toBe(`${SITE}/staffing`);
    expect(safeRedirect("/users", SITE)).toBe(`${SITE}/users`);
    expect(safeRedirect("https://evil.example/", SITE)).toBe(`${SITE}/`);
    expect(safeRedirect(`${SITE}.evil.example/`, SITE)).toBe(`${SITE}/`);
    expect(safeRedirect(`${SITE}/\\evil.example`, SITE)).toBe(`${SITE}/`);
    expect(new URL(safeRedirect("/\\evil.example", SITE)).host).toBe("museum.example.org");
  });
});

describe("state-changing requests from another site are refused", () => {
  const request = (method: string, headers: Record<string, string>) =>
    new Request("http://127.0.0.1:3000/api/time-off", { method, headers: { host: "127.0.0.1:3000", ...headers } });

  it("lets our own pages and non-browser callers through", () => {
    expect(foreignOriginReason(request("POST", { origin: "http://127.0.0.1:3000" }))).toBeNull();
    expect(foreignOriginReason(request("POST", { "sec-fetch-site": "same-origin" }))).toBeNull();
    expect(foreignOriginReason(request("PUT", {}))).toBeNull();
    expect(foreignOriginReason(request("GET", { origin: "https://evil.example" }))).toBeNull();
  });

  it.each([
    ["POST", { origin: "https://evil.example" }],
    ["PUT", { origin: "http://127.0.0.1:3001" }],
    ["PATCH", { origin: "http://127.0.0.1.evil.example:3000" }],
    ["DELETE", { origin: "null" }],
    ["POST", { origin: "not a url" }],
    ["POST", { "sec-fetch-site": "cross-site" }],
    ["POST", { "sec-fetch-site": "same-site" }],
  ] as const)("refuses %s with %j", (method, headers) => {
    expect(foreignOriginReason(request(method, headers))).toMatch(/.+/);
  });

  it("accepts the configured public address behind a reverse proxy", () => {
    const previous = process.env.NEXTAUTH_URL;
    process.env.NEXTAUTH_URL = SITE;
    try {
      expect(foreignOriginReason(request("POST", { origin: SITE }))).toBeNull();
      expect(foreignOriginReason(request("POST", { origin: "https://evil.example" }))).not.toBeNull();
    } finally {
      process.env.NEXTAUTH_URL = previous;
    }
  });
});

describe("the Content-Security-Policy (CSP Level 3)", () => {
  it("draws a fresh nonce of 128 bits each time", () => {
    const a = newNonce();
    expect(atob(a)).toHaveLength(16);
    expect(newNonce()).not.toBe(a);
  });

  it("allows scripts by nonce only, never inline or eval in production, and no framing", () => {
    const policy = pagePolicy("abc");
    const script = policy.split("; ").find((d) => d.startsWith("script-src "))!;
    expect(script).toContain("'nonce-abc'");
    expect(script).not.toContain("'unsafe-inline'");
    expect(script).not.toContain("'unsafe-eval'");
    expect(policy).toContain("frame-ancestors 'none'");
    expect(policy).toContain("object-src 'none'");
    expect(policy).toContain("base-uri 'self'");
    expect(policy).not.toContain("upgrade-insecure-requests");
    expect(pagePolicy("abc", { tls: true })).toContain("upgrade-insecure-requests");
    // style-src lists no nonce: a nonce would switch 'unsafe-inline' off (CSP3, source list matching).
    expect(policy.split("; ").find((d) => d.startsWith("style-src "))).toBe("style-src 'self' 'unsafe-inline'");
    expect(API_POLICY).toBe("default-src 'none'; frame-ancestors 'none'");
  });
});

describe("next.config.mjs headers", () => {
  it("sets nosniff, referrer, permissions and frame headers everywhere and HSTS over TLS only", async () => {
    const rules = await nextConfig.headers!();
    const all = rules.find((rule) => rule.source === "/:path*" && !rule.has)!;
    const names = Object.fromEntries(all.headers.map((h) => [h.key.toLowerCase(), h.value]));
    expect(names["x-content-type-options"]).toBe("nosniff");
    expect(names["referrer-policy"]).toBe("same-origin");
    expect(names["x-frame-options"]).toBe("DENY");
    expect(names["permissions-policy"]).toMatch(/camera=\(\)/);
    expect(names["strict-transport-security"]).toBeUndefined();
    const tls = rules.find((rule) => rule.has?.some((h) => h.key === "x-forwarded-proto" && h.value === "https"))!;
    expect(tls.headers[0]).toEqual({ key: "Strict-Transport-Security", value: "max-age=31536000; includeSubDomains" });
    const api = rules.find((rule) => rule.source === "/api/:path*")!;
    expect(api.headers[0].value).toBe(API_POLICY);
  });
});
