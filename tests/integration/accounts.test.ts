// Accounts through the route handlers in-process, on the real PostgreSQL and the local mail fake:
// an admin invites a person, who sets a password through the mailed link (single-use; a newer link
// retires the older; an expired one is refused) and can then sign in; a disabled account is refused
// at sign-in and by every route; the last active administrator and one's own account cannot be
// disabled; only admins invite.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the modules.
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { POST as invite } from "@/app/api/users/route";
import { PUT as access } from "@/app/api/users/[id]/access/route";
import { POST as reset } from "@/app/api/users/[id]/reset/route";
import { POST as setPassword } from "@/app/api/auth/set-password/route";
import { PATCH as changeRole } from "@/app/api/users/[id]/route";
import { NO_PASSWORD } from "@/db/queries/accounts";
import { verifyCredentials } from "@/lib/auth/options";
import { requireRole } from "@/lib/api/require-role";
import { listCaughtMail, readCaughtMail } from "@/lib/mail";
import { requireDatabaseUrl } from "./support/database";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

let db: Kysely<Database>;
let admin: SignedUser;
let operations: SignedUser;
const EMAIL = `invited.${process.pid}@example.org`;
const PASSWORD = "correct horse battery staple";

const json = async (response: Response) => ({ status: response.status, body: (await response.json()) as Record<string, any> });
const ctx = (id: number) => ({ params: Promise.resolve({ id: String(id) }) });

async function linkFromMail(to: string, subject: RegExp): Promise<string> {
  for (let attempt = 0; attempt < 50; attempt++) {
    const mails = (await listCaughtMail({ to })).filter((m) => subject.test(m.subject));
    if (mails.length > 0) {
      const newest = mails.sort((a, b) => b.receivedAt.localeCompare(a.receivedAt))[0]!;
      const mail = (await readCaughtMail(newest.id))!;
      const token = /\/set-password\?token=([A-Za-z0-9_-]+)/.exec(mail.text)?.[1];
      if (token) return token;
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`no mail "${subject}" reached ${to}`);
}

beforeAll(async () => {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) throw new Error("SMTP_PORT and MAIL_DIR are not set: run this through npm test (it starts the mail fake)");
  db = createDb(requireDatabaseUrl(), { max: 2 });
  [admin, operations] = await Promise.all([userByEmail(db, "admin@example.org"), userByEmail(db, "operations@example.org")]);
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
});

afterAll(async () => {
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
  await db.destroy();
});

describe("invitations and access", () => {
  let userId: number;

  it("only admins invite; a bad address is named", async () => {
    expect((await json(await invite(await signedRequest(operations, "http://127.0.0.1/api/users", { name: "X", email: EMAIL, role: "guard" }), { params: Promise.resolve({}) }))).status).toBe(403);
    const bad = await json(await invite(await signedRequest(admin, "http://127.0.0.1/api/users", { name: "X", email: "not-an-address", role: "guard" }), { params: Promise.resolve({}) }));
    expect(bad.status).toBe(422);
    expect(bad.body.error.field).toBe("email");
    expect(await db.selectFrom("users").select("id").where("email", "=", EMAIL).executeTakeFirst()).toBeUndefined();
  });

  it("invites by mail; the link sets the password once, and the person signs in", async () => {
    const answer = await json(await invite(await signedRequest(admin, "http://127.0.0.1/api/users", { name: "Ida Invited", email: EMAIL.toUpperCase(), role: "guard" }), { params: Promise.resolve({}) }));
    expect(answer.status).toBe(201);
    expect(answer.body.invitation.mailed).toBe(true);
    userId = answer.body.user.id;
    const row = await db.selectFrom("users").select(["email", "password_hash"]).where("id", "=", userId).executeTakeFirstOrThrow();
    expect(row).toEqual({ email: EMAIL, password_hash: NO_PASSWORD });
    // Nobody can sign in before the password is chosen.
    expect(await verifyCredentials(EMAIL, NO_PASSWORD)).toBeNull();
    const token = await linkFromMail(EMAIL, /Your Sightward account/);
    // Only the token's SHA-256 is stored.
    const links = await db.selectFrom("account_links").select(["token_hash"]).where("user_id", "=", userId).execute();
    expect(links.some((l) => l.token_hash === token)).toBe(false);
    const short = await json(await setPassword(await signedRequest(null, "http://127.0.0.1/api/auth/set-password", { token, password: "short" }), { params: Promise.resolve({}) }));
    expect(short.status).toBe(422);
    expect(short.body.error.message).toMatch(/at least 12 characters/);
    const set = await json(await setPassword(await signedRequest(null, "http://127.0.0.1/api/auth/set-password", { token, password: PASSWORD }), { params: Promise.resolve({}) }));
    expect(set).toEqual({ status: 200, body: { email: EMAIL } });
    const again = await json(await setPassword(await signedRequest(null, "http://127.0.0.1/api/auth/set-password", { token, password: "another long password" }), { params: Promise.resolve({}) }));
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe("link-used");
    expect(await verifyCredentials(EMAIL, PASSWORD)).toMatchObject({ email: EMAIL, role: "guard" });
    expect((await db.selectFrom("users").select("last_sign_in_at").where("id", "=", userId).executeTakeFirstOrThrow()).last_sign_in_at).not.toBeNull();
    // The same address again: 409.
    expect((await invite(await signedRequest(admin, "http://127.0.0.1/api/users", { name: "Ida", email: EMAIL, role: "guard" }), { params: Promise.resolve({}) })).status).toBe(409);
  });

  it("a reset link retires the older one, and an expired link is refused", async () => {
    expect((await json(await reset(await signedRequest(admin, `http://127.0.0.1/api/users/${userId}/reset`, {}), ctx(userId)))).status).toBe(200);
    const first = await linkFromMail(EMAIL, /Set a new Sightward password/);
    expect((await json(await reset(await signedRequest(admin, `http://127.0.0.1/api/users/${userId}/reset`, {}), ctx(userId)))).status).toBe(200);
    let second = await linkFromMail(EMAIL, /Set a new Sightward password/);
    for (let i = 0; second === first && i < 20; i++) second = await linkFromMail(EMAIL, /Set a new Sightward password/);
    const older = await json(await setPassword(await signedRequest(null, "http://127.0.0.1/api/auth/set-password", { token: first, password: "older link password" }), { params: Promise.resolve({}) }));
    expect(older.body.error.code).toBe("link-used");
    await db.updateTable("account_links").set({ expires_at: new Date(Date.now() - 1000) }).where("user_id", "=", userId).where("used_at", "is", null).execute();
    const expired = await json(await setPassword(await signedRequest(null, "http://127.0.0.1/api/auth/set-password", { token: second, password: "expired link password" }), { params: Promise.resolve({}) }));
    expect(expired.status).toBe(410);
    expect(expired.body.error.code).toBe("link-expired");
    // The password set through the invitation still works.
    expect(await verifyCredentials(EMAIL, PASSWORD)).not.toBeNull();
  });

  it("disables an account: refused at sign-in and by routes; enabling lets them back", async () => {
    const off = await json(await access(await signedRequest(admin, `http://127.0.0.1/api/users/${userId}/access`, { disabled: true }, "PUT"), ctx(userId)));
    expect(off.status).toBe(200);
    await expect(verifyCredentials(EMAIL, PASSWORD)).rejects.toThrow(/disabled/);
    const self = { id: userId, email: EMAIL, name: "Ida Invited", role: "guard" as const };
    await expect(requireRole(await signedRequest(self, "http://127.0.0.1/api/me/shifts"), "shifts:own")).rejects.toMatchObject({ status: 401, code: "account-disabled" });
    const on = await json(await access(await signedRequest(admin, `http://127.0.0.1/api/users/${userId}/access`, { disabled: false }, "PUT"), ctx(userId)));
    expect(on.status).toBe(200);
    expect(await verifyCredentials(EMAIL, PASSWORD)).not.toBeNull();
  });

  it("keeps one's own account enabled, and an administrator cannot be demoted while the other is disabled", async () => {
    const own = await json(await access(await signedRequest(admin, `http://127.0.0.1/api/users/${admin.id}/access`, { disabled: true }, "PUT"), ctx(admin.id)));
    expect(own.status).toBe(409);
    expect(own.body.error.code).toBe("own-account");
    // The invitee becomes a second admin, then is disabled: the seeded admin is the only active one.
    await db.updateTable("users").set({ role: "admin" }).where("id", "=", userId).execute();
    try {
      const offAdmin = await json(await access(await signedRequest(admin, `http://127.0.0.1/api/users/${userId}/access`, { disabled: true }, "PUT"), ctx(userId)));
      expect(offAdmin.status).toBe(200);
      const demote = await json(await changeRole(await signedRequest(admin, `http://127.0.0.1/api/users/${admin.id}`, { role: "operations" }, "PATCH"), ctx(admin.id)));
      expect(demote.status).toBe(409);
      expect(demote.body.error.code).toBe("last-admin");
      expect((await db.selectFrom("users").select("role").where("id", "=", admin.id).executeTakeFirstOrThrow()).role).toBe("admin");
    } finally {
      await db.updateTable("users").set({ role: "guard", disabled_at: null }).where("id", "=", userId).execute();
    }
  });
});
