// Route handlers check the role on the server: against the built app with real next-auth sign-ins
// (GET /api/auth/csrf, POST /api/auth/callback/credentials, cookie jar), and the real database.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import type { Role } from "@/db/schema";
import { caller, signedIn, type Caller } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
const as: Partial<Record<Role, Caller>> = {};
let targetId: number;
let targetRole: Role;

beforeAll(async () => {
  for (const account of DEMO_ACCOUNTS) {
    const { who, status } = await signedIn(account.email, DEMO_PASSWORD);
    if (status !== 200 || !who.jar.has("next-auth.session-token")) throw new Error(`demo sign-in failed for ${account.email} (${status})`);
    as[account.role] = who;
  }
  // A seeded guard account other than the demo guard: the role-change tests edit it and put it back.
  const target = await db
    .selectFrom("users")
    .select(["id", "role"])
    .where("role", "=", "guard")
    .where("email", "not in", DEMO_ACCOUNTS.map((a) => a.email))
    .orderBy("id")
    .limit(1)
    .executeTakeFirstOrThrow();
  targetId = target.id;
  targetRole = target.role;
});

afterAll(async () => {
  if (targetId) await db.updateTable("users").set({ role: targetRole }).where("id", "=", targetId).execute();
  await db.destroy();
});

function who(role: Role): Caller {
  const c = as[role];
  if (!c) throw new Error(`not signed in as ${role}`);
  return c;
}

async function errorOf(response: Response) {
  const body = (await response.json()) as { error?: { code?: string; message?: string; field?: string; issues?: { field: string; reason: string }[] } };
  expect(body.error, "error body").toBeDefined();
  expect(typeof body.error!.code).toBe("string");
  expect(typeof body.error!.message).toBe("string");
  expect(JSON.stringify(body)).not.toMatch(/\bat .+\.(js|ts):\d+/); // no stack trace
  return body.error!;
}

async function roleInDb(id: number): Promise<Role> {
  return (await db.selectFrom("users").select("role").where("id", "=", id).executeTakeFirstOrThrow()).role;
}

describe("sign-in through next-auth's credentials callback", () => {
  it("a wrong password gets 401 and no session cookie", async () => {
    const { who: stranger, status } = await signedIn(DEMO_ACCOUNTS[0]!.email, "wrong-password");
    expect(status).toBe(401);
    expect(stranger.jar.has("next-auth.session-token")).toBe(false);
    expect(await (await stranger.request("/api/auth/session")).json()).toEqual({});
  });

  it("a signed-in session carries the user's id and role", async () => {
    const session = (await (await who("curator").request("/api/auth/session")).json()) as { user: { id: number; role: string; email: string } };
    const row = await db.selectFrom("users").select(["id", "role"]).where("email", "=", session.user.email).executeTakeFirstOrThrow();
    expect(session.user).toMatchObject({ id: row.id, role: row.role });
  });
});

describe("GET /api/users (users:manage)", () => {
  it("refuses signed-out callers with 401", async () => {
    const response = await caller().request("/api/users");
    expect(response.status).toBe(401);
    expect((await errorOf(response)).code).toBe("signed-out");
  });

  for (const role of ["operations", "curator", "guard"] as const) {
    it(`refuses the ${role} role with 403`, async () => {
      const response = await who(role).request("/api/users");
      expect(response.status).toBe(403);
      expect((await errorOf(response)).code).toBe("forbidden");
    });
  }

  it("answers an admin with every account", async () => {
    const response = await who("admin").request("/api/users");
    expect(response.status).toBe(200);
    const { users } = (await response.json()) as { users: { email: string }[] };
    const count = await db.selectFrom("users").select((eb) => eb.fn.countAll<string>().as("n")).executeTakeFirstOrThrow();
    expect(users.length).toBe(Number(count.n));
  });
});

describe("PATCH /api/users/[id] (users:manage)", () => {
  it("refuses signed-out callers with 401 and each wrong role with 403, writing nothing", async () => {
    const before = await roleInDb(targetId);
    const anonymous = await caller().request(`/api/users/${targetId}`, { method: "PATCH", json: { role: "curator" } });
    expect(anonymous.status).toBe(401);
    for (const role of ["operations", "curator", "guard"] as const) {
      const response = await who(role).request(`/api/users/${targetId}`, { method: "PATCH", json: { role: "admin" } });
      expect(response.status, role).toBe(403);
      await errorOf(response);
    }
    expect(await roleInDb(targetId)).toBe(before);
  });

  it("answers 422 naming the field and the reason for an unknown role, writing nothing", async () => {
    const before = await roleInDb(targetId);
    const response = await who("admin").request(`/api/users/${targetId}`, { method: "PATCH", json: { role: "night-watch" } });
    expect(response.status).toBe(422);
    const error = await errorOf(response);
    expect(error.field).toBe("role");
    expect(error.issues?.[0]?.field).toBe("role");
    expect(error.issues?.[0]?.reason).toMatch(/admin, operations, curator, guard/);
    expect(await roleInDb(targetId)).toBe(before);
  });

  it("answers 422 for a missing role and 400 for a body that is not JSON", async () => {
    const missing = await who("admin").request(`/api/users/${targetId}`, { method: "PATCH", json: {} });
    expect(missing.status).toBe(422);
    expect((await errorOf(missing)).field).toBe("role");
    const garbled = await who("admin").request(`/api/users/${targetId}`, { method: "PATCH", body: "{role:", headers: { "content-type": "application/json" } });
    expect(garbled.status).toBe(400);
    expect((await errorOf(garbled)).code).toBe("invalid-json");
  });

  it("answers 400 naming the id for an address that is not a number, and 404 for an unknown user", async () => {
    const bad = await who("admin").request("/api/users/abc", { method: "PATCH", json: { role: "guard" } });
    expect(bad.status).toBe(400);
    expect((await errorOf(bad)).field).toBe("id");
    const unknown = await who("admin").request("/api/users/987654321", { method: "PATCH", json: { role: "guard" } });
    expect(unknown.status).toBe(404);
  });

  it("lets an admin change a role, which counts from that user's next request", async () => {
    const target = await db.selectFrom("users").select("email").where("id", "=", targetId).executeTakeFirstOrThrow();
    const { who: targetUser, status } = await signedIn(target.email, DEMO_PASSWORD);
    expect(status).toBe(200);
    expect((await targetUser.request("/api/users")).status).toBe(403);

    const promote = await who("admin").request(`/api/users/${targetId}`, { method: "PATCH", json: { role: "admin" } });
    expect(promote.status).toBe(200);
    expect(((await promote.json()) as { user: { role: string } }).user.role).toBe("admin");
    expect(await roleInDb(targetId)).toBe("admin");
    // The same session cookie, but the server reads the role from the database.
    expect((await targetUser.request("/api/users")).status).toBe(200);

    const back = await who("admin").request(`/api/users/${targetId}`, { method: "PATCH", json: { role: targetRole } });
    expect(back.status).toBe(200);
    expect(await roleInDb(targetId)).toBe(targetRole);
    expect((await targetUser.request("/api/users")).status).toBe(403);
  });

  it("pages follow a role change too: a promotion opens them, a demotion closes them (403)", async () => {
    const target = await db.selectFrom("users").select("email").where("id", "=", targetId).executeTakeFirstOrThrow();
    const { who: targetUser } = await signedIn(target.email, DEMO_PASSWORD);
    expect((await targetUser.request("/people")).status).toBe(403);

    expect((await who("admin").request(`/api/users/${targetId}`, { method: "PATCH", json: { role: "operations" } })).status).toBe(200);
    // The token still says guard; the proxy asks the database before refusing.
    expect((await targetUser.request("/people")).status).toBe(200);
    const { who: promotedUser } = await signedIn(target.email, DEMO_PASSWORD);

    expect((await who("admin").request(`/api/users/${targetId}`, { method: "PATCH", json: { role: targetRole } })).status).toBe(200);
    // This token says operations; the page re-reads the role and refuses.
    expect((await promotedUser.request("/people")).status).toBe(403);
    expect((await targetUser.request("/people")).status).toBe(403);
  });

  it("refuses to demote the only administrator (409), writing nothing", async () => {
    const admins = await db.selectFrom("users").select("id").where("role", "=", "admin").execute();
    if (admins.length !== 1) throw new Error(`expected the seed's single admin, found ${admins.length}`);
    const response = await who("admin").request(`/api/users/${admins[0]!.id}`, { method: "PATCH", json: { role: "guard" } });
    expect(response.status).toBe(409);
    expect((await errorOf(response)).code).toBe("last-admin");
    expect(await roleInDb(admins[0]!.id)).toBe("admin");
  });
});

describe("GET /api/mail (mail:read)", () => {
  it("refuses signed-out callers (401) and every role but admin (403)", async () => {
    expect((await caller().request("/api/mail")).status).toBe(401);
    for (const role of ["operations", "curator", "guard"] as const) {
      expect((await who(role).request("/api/mail")).status, role).toBe(403);
      expect((await who(role).request("/api/mail/1")).status, role).toBe(403);
      expect((await who(role).request("/api/mail/1/resend", { method: "POST", json: {} })).status, role).toBe(403);
    }
  });

  it("answers an admin with a list, and 400 naming the field for a bad query", async () => {
    const ok = await who("admin").request("/api/mail?limit=5");
    expect(ok.status).toBe(200);
    const { messages } = (await ok.json()) as { messages: unknown[] };
    expect(Array.isArray(messages)).toBe(true);
    expect(messages.length).toBeLessThanOrEqual(5);
    const bad = await who("admin").request("/api/mail?limit=0");
    expect(bad.status).toBe(400);
    expect((await errorOf(bad)).field).toBe("limit");
    const missing = await who("admin").request("/api/mail/2147483000");
    expect(missing.status).toBe(404);
    const malformed = await who("admin").request("/api/mail/no-such-message");
    expect(malformed.status).toBe(400);
  });
});
