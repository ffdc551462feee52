// fast-check fuzzes every zod-validated route handler in-process on the real PostgreSQL: random
// JSON bodies (and, for GET routes with a query, random query strings) sent by a role that may
// call the route, with ids of real demo rows. Each must be answered 4xx with a readable JSON error,
// never 2xx or 5xx, and nothing may be written.
import { vi } from "vitest";
vi.mock("server-only", () => ({}));

import path from "node:path";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql, type Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database, Role } from "@/db/schema";
import { ROUTE_MATRIX } from "@/lib/auth/route-matrix";
import { can, ROLE_NAMES, type Permission } from "@/lib/auth/roles";
import { requireDatabaseUrl } from "./support/database";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

// Routes that take no body (or none that could be wrong), or next-auth's own.
const NO_BODY = new Set(["POST /api/auth/[...nextauth]", "POST /api/calendar/reset", "POST /api/post-plans/[planId]/approve", "POST /api/mail/[id]/resend", "POST /api/users/[id]/reset"]);
const WITH_QUERY = ["GET /api/rosters", "GET /api/me/shifts", "GET /api/mail", "GET /api/audit", "GET /api/rosters/[id]/reassign"];
const TABLES = ["users", "sites", "floors", "rooms", "room_versions", "exhibitions", "exhibition_rooms", "guards", "rosters", "shifts", "time_off", "post_plans", "jobs", "account_links", "outbox", "audit_events"];

let db: Kysely<Database>;
const users: Partial<Record<Role, SignedUser>> = {};
const ids: Record<string, number> = {};

async function counts(): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const table of TABLES) out[table] = (await sql<{ n: string }>`select count(*)::text as n from ${sql.table(table)}`.execute(db)).rows[0]!.n;
  return out;
}

function paramsFor(route: string): Record<string, string> {
  const idOf = route.startsWith("/api/exhibitions") ? ids.exhibition : route.startsWith("/api/guards") ? ids.guard : route.startsWith("/api/users") ? ids.user : route.startsWith("/api/rosters") ? ids.roster : route.startsWith("/api/time-off") ? ids.timeOff : 2147483000;
  const values: Record<string, number | undefined> = { siteId: ids.site, floorId: ids.floor, roomId: ids.room, version: 1, planId: ids.plan, id: idOf };
  const params: Record<string, string> = {};
  for (const match of route.matchAll(/\[(?:\.\.\.)?([A-Za-z]+)\]/g)) params[match[1]!] = String(values[match[1]!] ?? 2147483000);
  return params;
}

async function callerFor(access: string): Promise<SignedUser | null> {
  if (access === "public") return null;
  const role = ROLE_NAMES.find((r) => can(r, access as Permission));
  return role ? users[role]! : null;
}

async function handlerOf(route: string, method: string) {
  const file = path.resolve("app", route.slice(1), "route.ts");
  return ((await import(file)) as Record<string, (request: unknown, context: unknown) => Promise<Response>>)[method]!;
}

async function expectRefused(response: Response, what: string): Promise<void> {
  const text = await response.text();
  expect(response.status, `${what}: ${text.slice(0, 300)}`).toBeGreaterThanOrEqual(400);
  expect(response.status, `${what}: ${text.slice(0, 300)}`).toBeLessThan(500);
  const body = JSON.parse(text) as { error?: { message?: unknown } };
  expect(typeof body.error?.message, what).toBe("string");
}

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  for (const role of ROLE_NAMES) users[role] = await userByEmail(db, `${role}@example.org`);
  const first = async (table: "sites" | "floors" | "rooms" | "exhibitions" | "guards" | "rosters" | "time_off" | "post_plans") =>
    (await db.selectFrom(table).select("id").orderBy("id").executeTakeFirst())?.id ?? 2147483000;
  Object.assign(ids, {
    site: await first("sites"),
    floor: await first("floors"),
    room: await first("rooms"),
    exhibition: await first("exhibitions"),
    guard: await first("guards"),
    roster: await first("rosters"),
    timeOff: await first("time_off"),
    plan: await first("post_plans"),
    user: users.guard!.id,
  });
});

afterAll(async () => {
  await db.destroy();
});

describe("fuzzing the zod-validated handlers", () => {
  const bodyRoutes = Object.entries(ROUTE_MATRIX).filter(([key]) => /^(POST|PUT|PATCH) /.test(key) && !NO_BODY.has(key));

  it("covers every route that takes a body", () => {
    expect(bodyRoutes.length).toBeGreaterThanOrEqual(28);
  });

  it("answers random JSON bodies with 4xx and writes nothing", async () => {
    const before = await counts();
    for (const [key, access] of bodyRoutes) {
      const [method, route] = key.split(" ") as [string, string];
      const handler = await handlerOf(route, method);
      const user = await callerFor(access);
      const params = paramsFor(route);
      const url = `http://127.0.0.1${route.replace(/\[(?:\.\.\.)?([A-Za-z]+)\]/g, (_, name: string) => params[name]!)}`;
      await fc.assert(
        fc.asyncProperty(fc.jsonValue({ maxDepth: 3 }), async (body) => {
          const response = await handler(await signedRequest(user, url, body, method), { params: Promise.resolve(params) });
          await expectRefused(response, `${key} with ${JSON.stringify(body).slice(0, 200)}`);
        }),
        { numRuns: 15, seed: 20261204 },
      );
    }
    expect(await counts()).toEqual(before);
  }, 180_000);

  it("answers random query strings with 4xx (or the list, when no filter was given) and writes nothing", async () => {
    const before = await counts();
    for (const key of WITH_QUERY) {
      const [method, route] = key.split(" ") as [string, string];
      const handler = await handlerOf(route, method);
      const user = await callerFor(ROUTE_MATRIX[key]!);
      const params = paramsFor(route);
      const base = `http://127.0.0.1${route.replace(/\[(?:\.\.\.)?([A-Za-z]+)\]/g, (_, name: string) => params[name]!)}`;
      // Keys the route knows, with random values, so the values reach the schema.
      const known = fc.constantFrom("startsOn", "from", "to", "limit", "kind", "status", "area", "actor", "post", "start", "guardId");
      await fc.assert(
        fc.asyncProperty(fc.dictionary(known, fc.string({ maxLength: 30 }), { minKeys: 1, maxKeys: 4 }), async (query) => {
          const url = `${base}?${new URLSearchParams(query).toString()}`;
          const response = await handler(await signedRequest(user, url), { params: Promise.resolve(params) });
          // A random string is occasionally a valid value for a filter (an empty one, a small limit): then a list, never a 5xx.
          if (response.status === 200) return;
          await expectRefused(response, `${key}?${new URLSearchParams(query).toString()}`);
        }),
        { numRuns: 20, seed: 20261204 },
      );
    }
    expect(await counts()).toEqual(before);
  }, 120_000);
});
