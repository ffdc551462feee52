// What a probe found, each kept as a check against the built app: open redirect, huge ids, NUL,
// dates out of range, non-JSON content-types, oversized bodies, foreign Origin, security headers,
// session lifetime, and no CSP violation in Chromium on the main pages of every role.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, ConsoleMessage } from "playwright-core";
import { encode } from "next-auth/jwt";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { caller, signedIn, type Caller } from "./support/http";
import { baseUrl, testDb } from "./support/server";

const db = testDb();
let browser: Browser;
const who: Record<string, Caller> = {};
let room: { id: number; name: string; version: number; outline: unknown; obstacles: unknown };
let guardId: number;

async function signIn(email: string): Promise<Caller> {
  const { who: c, status } = await signedIn(email, DEMO_PASSWORD);
  if (status !== 200) throw new Error(`demo sign-in failed for ${email} (${status})`);
  return c;
}

async function errorOf(response: Response) {
  expect(response.headers.get("content-type")).toMatch(/application\/json/);
  const body = (await response.json()) as { error?: { code?: string; message?: string; field?: string; stack?: unknown } };
  expect(typeof body.error?.message).toBe("string");
  expect(JSON.stringify(body)).not.toMatch(/at .*\.(js|ts):\d+/);
  return body.error!;
}

const count = async (table: "time_off" | "jobs" | "rooms") =>
  Number((await db.selectFrom(table).select((eb) => eb.fn.countAll<string>().as("n")).executeTakeFirstOrThrow()).n);

beforeAll(async () => {
  browser = await launchBrowser();
  for (const role of ["admin", "operations", "curator", "guard"]) who[role] = await signIn(`${role}@example.org`);
  const row = await db.selectFrom("rooms").select(["id", "name", "version", "outline", "obstacles"]).orderBy("id").limit(1).executeTakeFirstOrThrow();
  room = row as typeof room;
  guardId = (await db.selectFrom("guards").innerJoin("users", "users.id", "guards.user_id").select("guards.id").where("users.email", "=", "guard@example.org").executeTakeFirstOrThrow()).id;
});

afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

describe("the probe's findings", () => {
  it("never redirects a signed-in person to another host from callbackUrl", async () => {
    for (const target of ["/%5Cevil.example", "//evil.example", "/\\evil.example", "https://evil.example/"]) {
      const response = await who.curator.request(`/sign-in?callbackUrl=${encodeURIComponent(target).replace(/%25/g, "%")}`);
      expect(response.status, target).toBe(307);
      const location = new URL(response.headers.get("location")!, baseUrl());
      expect(location.host, target).toBe(new URL(baseUrl()).host);
    }
  });

  it("answers ids past PostgreSQL's integer (2^31 and larger) with 400, never 500", async () => {
    const cases: Array<[string, string, string, unknown?]> = [
      ["curator", "GET", "/api/rooms/2147483648"],
      ["curator", "GET", "/api/rooms/99999999999"],
      ["curator", "PUT", "/api/rooms/2147483648", { outline: [[0, 0], [1, 0], [0, 1]], obstacles: [], version: 1 }],
      ["operations", "GET", "/api/rooms/2147483648/post-plans"],
      ["operations", "GET", "/api/post-plans/2147483648"],
      ["operations", "POST", "/api/post-plans/2147483648/approve"],
      ["operations", "GET", "/api/rosters/2147483648"],
      ["operations", "POST", "/api/rosters/2147483648/publish", { revision: 1 }],
      ["operations", "PATCH", "/api/time-off/2147483648", { status: "approved" }],
      ["operations", "GET", "/api/jobs/2147483648"],
      ["admin", "PATCH", "/api/users/2147483648", { role: "curator" }],
    ];
    for (const [role, method, path, json] of cases) {
      const response = await who[role].request(path, { method, json });
      expect(response.status, `${method} ${path}`).toBe(400);
      expect((await errorOf(response)).message).toMatch(/too large|whole number/);
    }
    const revision = await who.operations.request("/api/rosters/1/publish", { method: "POST", json: { revision: 2147483648 } });
    expect(revision.status).toBe(422);
  });

  it("refuses a room name with a NUL character (400) and keeps the room", async () => {
    const response = await who.curator.request(`/api/rooms/${room.id}`, {
      method: "PUT",
      json: { name: "Hall\u0000A", outline: room.outline, obstacles: room.obstacles, version: room.version },
    });
    expect(response.status).toBe(400);
    expect((await errorOf(response)).field).toBe("name");
    const after = await db.selectFrom("rooms").select(["name", "version"]).where("id", "=", room.id).executeTakeFirstOrThrow();
    expect(after).toEqual({ name: room.name, version: room.version });
  });

  it("refuses time off and roster builds outside 2000-2100 and writes nothing", async () => {
    const [timeOff, jobs] = [await count("time_off"), await count("jobs")];
    for (const [startsOn, endsOn] of [["0000-01-01", "0000-01-02"], ["9999-01-01", "9999-01-02"], ["1970-01-01", "1970-01-01"]]) {
      const response = await who.guard.request("/api/time-off", { method: "POST", json: { startsOn, endsOn, note: "" } });
      expect(response.status, startsOn).toBe(422);
      expect((await errorOf(response)).message).toMatch(/between 2000 and 2100/);
    }
    for (const startsOn of ["1970-01-05", "9999-12-27"]) {
      const response = await who.operations.request("/api/rosters/build", { method: "POST", json: { startsOn } });
      expect(response.status, startsOn).toBe(422);
    }
    expect([await count("time_off"), await count("jobs")]).toEqual([timeOff, jobs]);
  });

  it("refuses non-JSON content-types with 415 (what a cross-site form can send) and writes nothing", async () => {
    const before = await count("time_off");
    const body = JSON.stringify({ startsOn: "2099-06-01", endsOn: "2099-06-02", note: "" });
    for (const type of ["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x"]) {
      const response = await who.guard.request("/api/time-off", { method: "POST", body, headers: { "content-type": type } });
      expect(response.status, type).toBe(415);
      await errorOf(response);
    }
    const put = await who.curator.request(`/api/rooms/${room.id}`, {
      method: "PUT",
      body: JSON.stringify({ outline: room.outline, obstacles: room.obstacles, version: room.version }),
      headers: { "content-type": "text/plain" },
    });
    expect(put.status).toBe(415);
    expect(await count("time_off")).toBe(before);
    expect((await db.selectFrom("rooms").select("version").where("id", "=", room.id).executeTakeFirstOrThrow()).version).toBe(room.version);
  });

  it("answers 413 to a 10 MB JSON body and a 50 MB room, and keeps serving", async () => {
    const ten = JSON.stringify({ startsOn: "2099-06-01", endsOn: "2099-06-02", note: "x".repeat(10 * 1024 * 1024) });
    const response = await who.guard.request("/api/time-off", { method: "POST", body: ten, headers: { "content-type": "application/json" } });
    expect(response.status).toBe(413);
    expect((await errorOf(response)).message).toMatch(/larger than 1 MB/);
    const fifty = JSON.stringify({ outline: [], obstacles: [], version: 1, pad: "x".repeat(50 * 1024 * 1024) });
    const big = await who.curator.request(`/api/rooms/${room.id}`, { method: "PUT", body: fifty, headers: { "content-type": "application/json" } });
    expect(big.status).toBe(413);
    expect((await errorOf(big)).message).toMatch(/larger than 4 MB/);
    expect((await fetch(baseUrl() + "/api/health")).status).toBe(200);
  });
});

describe("a foreign Origin cannot change anything", () => {
  it("refuses time off, a feed reset and a room save sent from another site (403)", async () => {
    const before = await count("time_off");
    const token = async () => (await db.selectFrom("guards").select("calendar_token").where("id", "=", guardId).executeTakeFirstOrThrow()).calendar_token;
    const tokenBefore = await token();
    const evil = { origin: "https://evil.example" };
    const timeOff = await who.guard.request("/api/time-off", { method: "POST", json: { startsOn: "2099-06-01", endsOn: "2099-06-02", note: "" }, headers: evil });
    expect(timeOff.status).toBe(403);
    expect((await errorOf(timeOff)).code).toBe("foreign-origin");
    expect((await who.guard.request("/api/calendar/reset", { method: "POST", headers: evil })).status).toBe(403);
    expect((await who.guard.request("/api/calendar/reset", { method: "POST", headers: { "sec-fetch-site": "cross-site" } })).status).toBe(403);
    const put = await who.curator.request(`/api/rooms/${room.id}`, { method: "PUT", json: { outline: room.outline, obstacles: room.obstacles, version: room.version }, headers: evil });
    expect(put.status).toBe(403);
    expect(await count("time_off")).toBe(before);
    expect(await token()).toBe(tokenBefore);
    // The same request from our own origin goes through.
    const own = await who.guard.request("/api/time-off", { method: "POST", json: { startsOn: "2099-06-01", endsOn: "2099-06-02", note: "" }, headers: { origin: baseUrl() } });
    expect(own.status).toBe(201);
    expect(await count("time_off")).toBe(before + 1);
  });
});

describe("security headers", () => {
  it("pages carry a nonce CSP that every script tag uses, plus the other headers", async () => {
    const response = await caller().request("/sign-in");
    expect(response.status).toBe(200);
    const csp = response.headers.get("content-security-policy")!;
    const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
    expect(nonce).toBeTruthy();
    expect(csp).toContain("frame-ancestors 'none'");
    const html = await response.text();
    const scripts = html.match(/<script\b[^>]*>/g) ?? [];
    expect(scripts.length).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
    expect(response.headers.get("referrer-policy")).toBe("same-origin");
    expect(response.headers.get("x-frame-options")).toBe("DENY");
    expect(response.headers.get("permissions-policy")).toMatch(/camera=\(\)/);
    expect(response.headers.get("strict-transport-security")).toBeNull();
    const again = await caller().request("/sign-in");
    expect(again.headers.get("content-security-policy")).not.toBe(csp);
  });

  it("API answers carry a deny-all CSP, and HSTS when a TLS proxy says so", async () => {
    const health = await caller().request("/api/health");
    expect(health.headers.get("content-security-policy")).toBe("default-src 'none'; frame-ancestors 'none'");
    expect(health.headers.get("x-content-type-options")).toBe("nosniff");
    const tls = await caller().request("/api/health", { headers: { "x-forwarded-proto": "https" } });
    expect(tls.headers.get("strict-transport-security")).toBe("max-age=31536000; includeSubDomains");
  });
});

describe("sessions end", () => {
  const secret = process.env.NEXTAUTH_SECRET!;
  const admin = async () => db.selectFrom("users").select(["id", "email", "name"]).where("email", "=", "admin@example.org").executeTakeFirstOrThrow();
  const withToken = async (claims: Record<string, unknown>, maxAge = 3600) => {
    const value = await encode({ token: claims, secret, maxAge });
    return { cookie: `next-auth.session-token=${value}` };
  };

  it("after an hour idle: the sign-in cookie lives 3600 s", async () => {
    const { who: fresh } = await signedIn("curator@example.org", DEMO_PASSWORD);
    expect(fresh.jar.has("next-auth.session-token")).toBe(true);
    const response = await fresh.request("/api/rooms/" + room.id);
    expect(response.status).toBe(200);
    const expired = await withToken({ uid: (await admin()).id, role: "admin", signedInAt: Math.floor(Date.now() / 1000) }, -120);
    expect((await caller().request("/api/users", { headers: expired })).status).toBe(401);
  });

  it("12 hours after sign-in even while in use, and a working session is renewed", async () => {
    const user = await admin();
    const now = Math.floor(Date.now() / 1000);
    const old = await withToken({ uid: user.id, role: "admin", email: user.email, name: user.name, signedInAt: now - 13 * 3600 });
    const api = await caller().request("/api/users", { headers: old });
    expect(api.status).toBe(401);
    const page = await caller().request("/users", { headers: old });
    expect(page.status).toBe(307);
    expect(page.headers.get("location")).toMatch(/\/sign-in/);
    const young = await withToken({ uid: user.id, role: "admin", email: user.email, name: user.name, signedInAt: now - 60 });
    const ok = await caller().request("/api/users", { headers: young });
    expect(ok.status).toBe(200);
  });
});

describe("no CSP violation in Chromium on the main pages", () => {
  const PAGES: Record<string, string[]> = {
    admin: ["/", "/users", "/settings", "/mail"],
    operations: ["/", "/galleries", "/exhibitions", "/staffing", "/people"],
    curator: ["/", "/galleries"],
    guard: ["/", "/my-shifts"],
  };
  for (const [role, paths] of Object.entries(PAGES)) {
    it(`${role}: ${paths.join(", ")}`, async () => {
      const context = await newContext(browser);
      const page = await context.newPage();
      const violations: string[] = [];
      page.on("console", (message: ConsoleMessage) => {
        if (/Content Security Policy|Refused to (load|execute|apply|connect|create)/i.test(message.text())) violations.push(`${page.url()}: ${message.text()}`);
      });
      page.on("pageerror", (error) => violations.push(`${page.url()}: ${error.message}`));
      try {
        await signInThroughForm(page, `${role}@example.org`, DEMO_PASSWORD);
        await page.waitForURL((url) => url.pathname === "/");
        const extra = role === "curator" ? [`/galleries/${room.id}`] : [];
        for (const path of [...paths, ...extra]) {
          await page.goto(path);
          await page.waitForLoadState("networkidle");
          // The framework's scripts ran under the policy: the App Router's client sets window.next.
          await page.waitForFunction(() => Boolean((window as unknown as { next?: { version?: string } }).next?.version), undefined, { timeout: 15_000 });
        }
      } finally {
        await context.close();
      }
      expect(violations).toEqual([]);
    });
  }
});
