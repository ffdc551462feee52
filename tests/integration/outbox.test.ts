// The outbox through the route handlers in-process, on the real PostgreSQL and the local mail fake:
// an invitation sent while the mail server is away is recorded as failed with the server's reason
// (its link masked in the record), a resend once the server is back goes out on the same row with
// a new link that works (the first link is retired); the list filters by kind and status;
// only admins read or resend, and bad ids are named without touching anything.
import { vi } from "vitest";
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { POST as invite } from "@/app/api/users/route";
import { GET as listMail } from "@/app/api/mail/route";
import { GET as readMail } from "@/app/api/mail/[id]/route";
import { POST as resend } from "@/app/api/mail/[id]/resend/route";
import { POST as setPassword } from "@/app/api/auth/set-password/route";
import { listCaughtMail, readCaughtMail } from "@/lib/mail";
import { requireDatabaseUrl } from "./support/database";
// A port nothing listens on: the mail server is away.
import { freePort } from "../e2e/support/second-app";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

let db: Kysely<Database>;
let admin: SignedUser;
let operations: SignedUser;
const EMAIL = `outbox.${process.pid}@example.org`;
const json = async (response: Response) => ({ status: response.status, body: (await response.json()) as Record<string, any> });
const ctx = (id: string | number) => ({ params: Promise.resolve({ id: String(id) }) });
const none = { params: Promise.resolve({}) };

async function tokenFromMail(to: string): Promise<string> {
  for (let attempt = 0; attempt < 50; attempt++) {
    const mails = await listCaughtMail({ to });
    if (mails.length > 0) {
      const token = /\/set-password\?token=([A-Za-z0-9_-]+)/.exec((await readCaughtMail(mails[0]!.id))!.text)?.[1];
      if (token) return token;
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`no set-password mail reached ${to}`);
}

beforeAll(async () => {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) throw new Error("SMTP_PORT and MAIL_DIR are not set: run this through npm test (it starts the mail fake)");
  db = createDb(requireDatabaseUrl(), { max: 2 });
  [admin, operations] = await Promise.all([userByEmail(db, "admin@example.org"), userByEmail(db, "operations@example.org")]);
  await db.deleteFrom("outbox").where("recipient", "=", EMAIL).execute();
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
});

afterAll(async () => {
  await db.deleteFrom("outbox").where("recipient", "=", EMAIL).execute();
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
  await db.destroy();
});

describe("the outbox", () => {
  let outboxId: number;

  it("records an invitation the mail server did not take, with the reason and the link masked", async () => {
    const realPort = process.env.SMTP_PORT;
    process.env.SMTP_PORT = String(await freePort());
    let answer;
    try {
      answer = await json(await invite(await signedRequest(admin, "http://127.0.0.1/api/users", { name: "Otto Outbox", email: EMAIL, role: "guard" }), none));
    } finally {
      process.env.SMTP_PORT = realPort;
    }
    expect(answer.status).toBe(201);
    expect(answer.body.invitation.mailed).toBe(false);
    expect(answer.body.warning).toMatch(/outbox/);
    const row = await db.selectFrom("outbox").selectAll().where("recipient", "=", EMAIL).executeTakeFirstOrThrow();
    outboxId = row.id;
    expect(row).toMatchObject({ kind: "invitation", status: "failed", attempts: 1, sent_at: null });
    expect(row.last_error).toMatch(/ECONNREFUSED|connect/i);
    // The record holds no working link (only the token's hash is in account_links).
    expect(row.body).toMatch(/\/set-password\?token=••••••/);
    expect(await listCaughtMail({ to: EMAIL })).toEqual([]);

    const failed = await json(await listMail(await signedRequest(admin, "http://127.0.0.1/api/mail?status=failed&kind=invitation"), none));
    expect(failed.status).toBe(200);
    expect(failed.body.messages.map((m: { id: number }) => m.id)).toContain(outboxId);
    expect(failed.body.messages.every((m: { status: string; kind: string }) => m.status === "failed" && m.kind === "invitation")).toBe(true);
    const sent = await json(await listMail(await signedRequest(admin, "http://127.0.0.1/api/mail?status=sent"), none));
    expect(sent.body.messages.map((m: { id: number }) => m.id)).not.toContain(outboxId);
  });

  it("refuses other roles, bad ids and unknown messages, changing nothing", async () => {
    const before = await db.selectFrom("outbox").selectAll().where("id", "=", outboxId).executeTakeFirstOrThrow();
    expect((await resend(await signedRequest(operations, `http://127.0.0.1/api/mail/${outboxId}/resend`, {}), ctx(outboxId))).status).toBe(403);
    expect((await resend(await signedRequest(null, `http://127.0.0.1/api/mail/${outboxId}/resend`, {}), ctx(outboxId))).status).toBe(401);
    expect((await readMail(await signedRequest(operations, `http://127.0.0.1/api/mail/${outboxId}`), ctx(outboxId))).status).toBe(403);
    const bad = await json(await resend(await signedRequest(admin, "http://127.0.0.1/api/mail/x/resend", {}), ctx("2147483648")));
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe("id");
    expect((await resend(await signedRequest(admin, "http://127.0.0.1/api/mail/2147483000/resend", {}), ctx(2147483000))).status).toBe(404);
    const badQuery = await json(await listMail(await signedRequest(admin, "http://127.0.0.1/api/mail?status=lost"), none));
    expect(badQuery.status).toBe(400);
    expect(badQuery.body.error.field).toBe("status");
    expect(await db.selectFrom("outbox").selectAll().where("id", "=", outboxId).executeTakeFirstOrThrow()).toEqual(before);
  });

  it("resends on the same row once the server answers; the new link works, and reading shows it masked", async () => {
    const answer = await json(await resend(await signedRequest(admin, `http://127.0.0.1/api/mail/${outboxId}/resend`, {}), ctx(outboxId)));
    expect(answer.status).toBe(200);
    expect(answer.body.message).toMatchObject({ id: outboxId, status: "sent", attempts: 2, last_error: null });
    expect(await db.selectFrom("outbox").select((eb) => eb.fn.countAll<string>().as("n")).where("recipient", "=", EMAIL).executeTakeFirstOrThrow()).toEqual({ n: "1" });
    const read = await json(await readMail(await signedRequest(admin, `http://127.0.0.1/api/mail/${outboxId}`), ctx(outboxId)));
    expect(read.body.message.body).toContain("/set-password?token=••••••");
    expect(read.body.message.body).not.toMatch(/token=[A-Za-z0-9_-]{20,}/);

    const user = await db.selectFrom("users").select("id").where("email", "=", EMAIL).executeTakeFirstOrThrow();
    const links = await db.selectFrom("account_links").select(["used_at"]).where("user_id", "=", user.id).execute();
    expect(links).toHaveLength(2);
    expect(links.filter((l) => l.used_at === null)).toHaveLength(1);
    const token = await tokenFromMail(EMAIL);
    const set = await setPassword(await signedRequest(null, "http://127.0.0.1/api/auth/set-password", { token, password: "a long enough outbox password" }), none);
    expect(set.status).toBe(200);
    // An invitation already used: a second resend is refused with what to do instead.
    const again = await json(await resend(await signedRequest(admin, `http://127.0.0.1/api/mail/${outboxId}/resend`, {}), ctx(outboxId)));
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already chosen a password/);
  });
});
