// The role matrix walked cell by cell: every route.ts under app/api and every HTTP method it
// exports must have an entry in lib/auth/route-matrix.ts (a new route without one fails here), and
// every entry must name a route on disk. Each handler is then called in-process, signed out and as
// each role (the seeded accounts, real PostgreSQL), with ids that name no row and an empty body:
// signed out gets 401 unless the entry is public; a role without the entry's permission gets 403;
// a role with it gets past the check (any answer but 401 and 403). No request may write a row.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the modules.
vi.mock("server-only", () => ({}));

import { readdirSync, statSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql, type Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database, Role } from "@/db/schema";
import { ROUTE_MATRIX } from "@/lib/auth/route-matrix";
import { can, ROLE_NAMES, type Permission } from "@/lib/auth/roles";
import { requireDatabaseUrl } from "./support/database";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
const API = path.resolve("app/api");

function routeFiles(folder: string): string[] {
  return readdirSync(folder).flatMap((name) => {
    const full = path.join(folder, name);
    if (statSync(full).isDirectory()) return routeFiles(full);
    return name === "route.ts" ? [full] : [];
  });
}

const routePath = (file: string) => "/api/" + path.relative(API, path.dirname(file)).split(path.sep).join("/");

/** Params for a path: every [param] gets a value that names no row ("999999999"). */
function paramsOf(route: string): Record<string, string> {
  const params: Record<string, string> = {};
  for (const match of route.matchAll(/\[(?:\.\.\.)?([A-Za-z]+)\]/g)) params[match[1]!] = match[1] === "token" ? "0".repeat(64) : "999999999";
  return params;
}

let db: Kysely<Database>;
const users: Partial<Record<Role, SignedUser>> = {};
let files: string[];

async function rowCounts(): Promise<Record<string, number>> {
  const tables = ["users", "sites", "floors", "rooms", "exhibitions", "post_plans", "rosters", "shifts", "time_off", "guards", "jobs", "account_links", "outbox", "audit_events"];
  const counts: Record<string, number> = {};
  for (const table of tables) counts[table] = Number((await sql<{ n: string }>`select count(*) as n from ${sql.table(table)}`.execute(db)).rows[0]!.n);
  return counts;
}

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  for (const role of ROLE_NAMES) users[role] = await userByEmail(db, `${role}@example.org`);
  files = routeFiles(API);
});

afterAll(async () => {
  await db.destroy();
});

describe("the role matrix", () => {
  it("has an entry for every method of every route on disk, and no entry without a route", async () => {
    const found: string[] = [];
    for (const file of files) {
      const module = (await import(file)) as Record<string, unknown>;
      for (const method of METHODS) if (typeof module[method] === "function") found.push(`${method} ${routePath(file)}`);
    }
    expect(found.filter((key) => !(key in ROUTE_MATRIX)), "routes without an entry in lib/auth/route-matrix.ts").toEqual([]);
    expect(Object.keys(ROUTE_MATRIX).filter((key) => !found.includes(key)), "entries without a route").toEqual([]);
  });

  it("every handler answers as the matrix says, signed out and for each role, writing nothing", async () => {
    const before = await rowCounts();
    const trailStart = (await sql<{ id: string | null }>`select max(id)::text as id from audit_events`.execute(db)).rows[0]!.id ?? "0";
    const wrong: string[] = [];
    for (const file of files) {
      const route = routePath(file);
      if (route.includes("[...nextauth]")) continue; // next-auth's own handler
      const module = (await import(file)) as Record<string, (request: unknown, context: unknown) => Promise<Response>>;
      for (const method of METHODS) {
        const handler = module[method];
        if (typeof handler !== "function") continue;
        const access = ROUTE_MATRIX[`${method} ${route}`];
        const url = `http://127.0.0.1${route.replace(/\[(?:\.\.\.)?([A-Za-z]+)\]/g, (_, name: string) => paramsOf(route)[name]!)}`;
        const body = method === "GET" || method === "DELETE" ? undefined : {};
        for (const who of [null, ...ROLE_NAMES] as const) {
          const request = await signedRequest(who ? users[who]! : null, url, body, method);
          const response = await handler(request, { params: Promise.resolve(paramsOf(route)) });
          const status = response.status;
          const allowed = access === "public" || (who !== null && can(who, access as Permission));
          const expected = who === null && access !== "public" ? [401] : allowed ? null : [403];
          const ok = expected ? expected.includes(status) : status !== 401 && status !== 403;
          if (!ok) wrong.push(`${method} ${route} as ${who ?? "signed out"}: ${status} (matrix: ${access})`);
        }
      }
    }
    expect(wrong).toEqual([]);
    // The one request here that changes something with an empty body: the guard resets their own
    // calendar address, and the audit trail says so; every other count stays.
    const trail = await db.selectFrom("audit_events").select("action").where("id", ">", trailStart).execute();
    expect(trail.map((row) => row.action)).toEqual(["calendar.reset"]);
    expect({ ...(await rowCounts()), audit_events: 0 }).toEqual({ ...before, audit_events: 0 });
  }, 120_000);
});
