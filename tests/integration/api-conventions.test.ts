// The API conventions of lib/api and the role table of lib/auth/roles, checked in-process against
// the real PostgreSQL that npm test starts (DATABASE_URL): the seeded users sign the requests.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the modules.
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { NextRequest } from "next/server";
import { encode } from "next-auth/jwt";
import { z } from "zod";
import { createDb } from "@/db";
import type { Role } from "@/db/schema";
import { ApiProblem, apiError, isDatabaseUnavailable } from "@/lib/api/problem";
import { parseBody, parseParams, parseQuery } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { can, navigationFor, permissionForPath, ROLE_NAMES } from "@/lib/auth/roles";
import { requireDatabaseUrl } from "./support/database";

const SECRET = "api-conventions-test-secret";
let db: ReturnType<typeof createDb>;
const userOf: Partial<Record<Role, { id: number; email: string; name: string }>> = {};

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  process.env.NEXTAUTH_SECRET ??= SECRET;
  for (const role of ROLE_NAMES) {
    const row = await db.selectFrom("users").select(["id", "email", "name"]).where("role", "=", role).orderBy("id").limit(1).executeTakeFirst();
    if (!row) throw new Error(`the seed has no ${role} account; run npm test (it seeds the demo museum)`);
    userOf[role] = row;
  }
});

afterAll(async () => {
  await db?.destroy();
});

async function requestAs(role: Role | null, init: { body?: string; url?: string; token?: string } = {}): Promise<NextRequest> {
  const headers = new Headers({ "content-type": "application/json" });
  if (init.token !== undefined) {
    headers.set("cookie", `next-auth.session-token=${init.token}`);
  } else if (role) {
    const user = userOf[role]!;
    const token = await encode({ token: { uid: user.id, role, email: user.email, name: user.name, signedInAt: Math.floor(Date.now() / 1000) }, secret: process.env.NEXTAUTH_SECRET! });
    headers.set("cookie", `next-auth.session-token=${token}`);
  }
  return new NextRequest(init.url ?? "http://127.0.0.1/api/test", { method: init.body ? "POST" : "GET", headers, body: init.body });
}

async function statusOf(promise: Promise<unknown>): Promise<number | "ok"> {
  try {
    await promise;
    return "ok";
  } catch (error) {
    if (error instanceof ApiProblem) return error.status;
    throw error;
  }
}

describe("roles: who may do what", () => {
  // Navigation per role as README.md lists it; admins also read caught mail.
  it("gives each role the navigation the foundation issue lists", () => {
    const labels = (role: Role) => navigationFor(role).map((entry) => entry.label);
    expect(labels("curator")).toEqual(["Galleries"]);
    expect(labels("operations")).toEqual(["Galleries", "Exhibitions", "Staffing", "People"]);
    expect(labels("guard")).toEqual(["My shifts"]);
    expect(labels("admin")).toEqual(["Galleries", "Settings", "Users", "Mail", "Audit trail"]);
  });

  // README.md's table: curators edit rooms, operations approve plans and publish rosters, guards see their own shifts.
  it("grants the actions of README.md's table and nothing across", () => {
    expect(can("curator", "rooms:edit")).toBe(true);
    expect(can("operations", "plans:approve")).toBe(true);
    expect(can("operations", "rosters:publish")).toBe(true);
    expect(can("guard", "shifts:own")).toBe(true);
    expect(can("admin", "users:manage")).toBe(true);
    expect(can("guard", "rosters:publish")).toBe(false);
    expect(can("guard", "people:view")).toBe(false);
    expect(can("curator", "plans:approve")).toBe(false);
    expect(can("operations", "users:manage")).toBe(false);
    expect(can(null, "shifts:own")).toBe(false);
  });

  it("maps page paths, including nested ones, to the permission they need", () => {
    expect(permissionForPath("/people")).toBe("people:view");
    expect(permissionForPath("/mail/abc")).toBe("mail:read");
    expect(permissionForPath("/my-floors/3")).toBe("shifts:own");
    expect(permissionForPath("/peoplex")).toBeNull();
    expect(permissionForPath("/")).toBeNull();
  });
});

describe("requireRole against the real users table", () => {
  it("answers 401 without a session and for a token not signed with our secret", async () => {
    expect(await statusOf(requireRole(await requestAs(null), "users:manage"))).toBe(401);
    const forged = await encode({ token: { uid: userOf.admin!.id, role: "admin" }, secret: "someone-elses-secret" });
    expect(await statusOf(requireRole(await requestAs(null, { token: forged }), "users:manage"))).toBe(401);
  });

  it("answers 403 for each role without the permission and passes the one with it", async () => {
    for (const role of ROLE_NAMES) {
      const expected = can(role, "users:manage") ? "ok" : 403;
      expect(await statusOf(requireRole(await requestAs(role), "users:manage")), role).toBe(expected);
    }
  });

  it("trusts the database over the token: a token claiming admin for a guard gets 403", async () => {
    const guard = userOf.guard!;
    const token = await encode({ token: { uid: guard.id, role: "admin", email: guard.email, signedInAt: Math.floor(Date.now() / 1000) }, secret: process.env.NEXTAUTH_SECRET! });
    expect(await statusOf(requireRole(await requestAs(null, { token }), "users:manage"))).toBe(403);
  });

  it("answers 401 for a token of an account that no longer exists", async () => {
    const token = await encode({ token: { uid: 2_000_000_000, role: "admin", signedInAt: Math.floor(Date.now() / 1000) }, secret: process.env.NEXTAUTH_SECRET! });
    expect(await statusOf(requireRole(await requestAs(null, { token }), "users:manage"))).toBe(401);
  });
});

describe("zod parsing answers with the field and the reason", () => {
  const schema = z.object({ role: z.enum(["admin", "guard"]), hours: z.number().min(0, "hours cannot be negative") });

  it("answers 400 for a body that is not JSON", async () => {
    const problem = await parseBody(await requestAs(null, { body: "{oops" }), schema).catch((e: unknown) => e);
    expect(problem).toBeInstanceOf(ApiProblem);
    expect((problem as ApiProblem).status).toBe(400);
  });

  it("answers 422 naming each bad field", async () => {
    const problem = (await parseBody(await requestAs(null, { body: JSON.stringify({ role: "boss", hours: -2 }) }), schema).catch((e: unknown) => e)) as ApiProblem;
    expect(problem.status).toBe(422);
    const issues = problem.details?.issues as { field: string; reason: string }[];
    expect(issues.map((issue) => issue.field).sort()).toEqual(["hours", "role"]);
    expect(issues.find((issue) => issue.field === "hours")?.reason).toBe("hours cannot be negative");
    expect(problem.message).toContain(problem.details?.field as string);
  });

  it("parses a good body, a query and route segments", async () => {
    await expect(parseBody(await requestAs(null, { body: JSON.stringify({ role: "guard", hours: 8 }) }), schema)).resolves.toEqual({ role: "guard", hours: 8 });
    expect(parseQuery("http://x/api?limit=5", z.object({ limit: z.coerce.number().int() }))).toEqual({ limit: 5 });
    expect(() => parseQuery("http://x/api?limit=five", z.object({ limit: z.coerce.number().int() }))).toThrow(ApiProblem);
    expect(() => parseParams({ id: "abc" }, z.object({ id: z.coerce.number().int() }))).toThrow(/id/);
  });
});

describe("route(): every failure becomes our JSON error", () => {
  const context = { params: Promise.resolve({}) };

  it("answers an ApiProblem with its status and the { error: { code, message } } shape", async () => {
    const handler = route(async () => {
      throw new ApiProblem(409, "last-admin", "make another user admin first", { field: "role" });
    });
    const response = await handler(await requestAs(null), context);
    expect(response.status).toBe(409);
    expect(await response.json()).toEqual({ error: { code: "last-admin", message: "make another user admin first", field: "role" } });
    const direct = apiError(404, "not-found", "No user with id 7.");
    expect(await direct.json()).toEqual({ error: { code: "not-found", message: "No user with id 7." } });
  });

  it("answers 500 without the message or stack of an unexpected error", async () => {
    const original = console.error;
    console.error = () => {};
    try {
      const handler = route(async () => {
        throw new TypeError("secret internals at /srv/app/lib/x.ts:12");
      });
      const response = await handler(await requestAs(null), context);
      expect(response.status).toBe(500);
      const text = await response.text();
      expect(text).not.toContain("secret internals");
      expect(text).not.toContain("x.ts:12");
      expect(JSON.parse(text).error.code).toBe("internal");
    } finally {
      console.error = original;
    }
  });

  it("answers 503 database-unavailable when PostgreSQL cannot be reached", async () => {
    // A real connection attempt to a port nothing listens on (port 9 is the discard service, closed here).
    const unreachable = createDb("postgres://sightward@127.0.0.1:9/sightward", { connectionTimeoutMillis: 2000, max: 1 });
    try {
      const failure = await unreachable.selectFrom("users").select("id").execute().catch((e: unknown) => e);
      expect(isDatabaseUnavailable(failure)).toBe(true);
      expect(isDatabaseUnavailable(new TypeError("x is undefined"))).toBe(false);
      const handler = route(async () => {
        throw failure;
      });
      const response = await handler(await requestAs(null), context);
      expect(response.status).toBe(503);
      expect((await response.json()).error.code).toBe("database-unavailable");
    } finally {
      await unreachable.destroy();
    }
  });
});
