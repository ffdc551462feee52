// Sign-in throttling (lib/auth/throttle.ts) against the real PostgreSQL that npm test starts: per
// account and per client address, stored in the database, the same for known and unknown accounts.
// Addresses are from TEST-NET-3 (RFC 5737, 203.0.113.0/24), reserved for documentation.
import { vi } from "vitest";
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "kysely";
import { createDb } from "@/db";
import { signInWithThrottle } from "@/lib/auth/options";
import { ACCOUNT_RULE, ADDRESS_RULE, accountKey, addressKey, clientAddress, signInLock } from "@/lib/auth/throttle";
import { hashPassword } from "@/lib/auth/passwords";
import { requireDatabaseUrl } from "./support/database";

const db = createDb(requireDatabaseUrl(), { max: 2 });
const tag = `${process.pid}-${Date.now()}`;
const known = `throttle-known-${tag}@example.org`;
const PASSWORD = "Correct horse 42";
let address = 1;
const nextAddress = () => `203.0.113.${address++}`;

beforeAll(async () => {
  await db.insertInto("users").values({ email: known, name: "Throttle Test", role: "curator", password_hash: await hashPassword(PASSWORD) }).execute();
});

afterAll(async () => {
  await db.deleteFrom("sign_in_throttle").where((eb) => eb.or([eb("key", "like", `account:throttle-%-${tag}@example.org`), eb("key", "like", "address:203.0.113.%")])).execute();
  await db.deleteFrom("users").where("email", "=", known).execute();
  await db.destroy();
});

async function attempt(email: string, password: string, from: string): Promise<string> {
  try {
    return (await signInWithThrottle(email, password, from)) ? "signed in" : "wrong";
  } catch (error) {
    return (error as Error).message;
  }
}

describe("sign-in throttling", () => {
  it(`locks an account after ${ACCOUNT_RULE.limit} wrong passwords, even against the right one, and says when to retry`, async () => {
    const from = nextAddress();
    for (let i = 0; i < ACCOUNT_RULE.limit; i++) expect(await attempt(known, "wrong password", from)).toBe("wrong");
    const refused = await attempt(known, PASSWORD, from);
    expect(refused).toMatch(/^Too many failed sign-ins\. Try again in 15 minutes/);
    // The lock is a row in PostgreSQL: a second connection (another process, or after a restart) sees it.
    const other = createDb(requireDatabaseUrl(), { max: 1 });
    try {
      const until = await signInLock(other, known, nextAddress());
      expect(until).not.toBeNull();
      const minutes = (until!.getTime() - Date.now()) / 60000;
      expect(minutes).toBeGreaterThan(14);
      expect(minutes).toBeLessThanOrEqual(15.1);
    } finally {
      await other.destroy();
    }
  }, 60_000);

  it("answers an unknown account exactly as a known one", async () => {
    const unknown = `throttle-unknown-${tag}@example.org`;
    const from = nextAddress();
    const answers: string[] = [];
    for (let i = 0; i <= ACCOUNT_RULE.limit; i++) answers.push(await attempt(unknown, "whatever it is", from));
    expect(answers.slice(0, ACCOUNT_RULE.limit)).toEqual(Array(ACCOUNT_RULE.limit).fill("wrong"));
    expect(answers[ACCOUNT_RULE.limit]).toMatch(/^Too many failed sign-ins\. Try again in 15 minutes/);
  }, 60_000);

  it("a right password clears the account's count; an old window starts afresh", async () => {
    const email = `throttle-clear-${tag}@example.org`;
    await db.insertInto("users").values({ email, name: "Throttle Clear", role: "curator", password_hash: await hashPassword(PASSWORD) }).execute();
    try {
      const from = nextAddress();
      for (let i = 0; i < ACCOUNT_RULE.limit - 1; i++) expect(await attempt(email, "nope", from)).toBe("wrong");
      expect(await attempt(email, PASSWORD, from)).toBe("signed in");
      for (let i = 0; i < ACCOUNT_RULE.limit - 1; i++) expect(await attempt(email, "nope", from)).toBe("wrong");
      // Move the window back past its length: the next failure counts as the first.
      await sql`update sign_in_throttle set window_started_at = now() - interval '16 minutes' where key = ${accountKey(email)}`.execute(db);
      expect(await attempt(email, "nope", from)).toBe("wrong");
      const row = await db.selectFrom("sign_in_throttle").select(["failures", "locked_until"]).where("key", "=", accountKey(email)).executeTakeFirstOrThrow();
      expect(row.failures).toBe(1);
      expect(row.locked_until).toBeNull();
      expect(await attempt(email, PASSWORD, from)).toBe("signed in");
    } finally {
      await db.deleteFrom("users").where("email", "=", email).execute();
    }
  }, 60_000);

  it(`locks a client address after ${ADDRESS_RULE.limit} failures over many accounts; other addresses still sign in`, async () => {
    const from = nextAddress();
    for (let i = 0; i < ADDRESS_RULE.limit; i++) expect(await attempt(`throttle-spray${i}-${tag}@example.org`, "guess", from)).toBe("wrong");
    const email = `throttle-fresh-${tag}@example.org`;
    await db.insertInto("users").values({ email, name: "Throttle Fresh", role: "curator", password_hash: await hashPassword(PASSWORD) }).execute();
    try {
      expect(await attempt(email, PASSWORD, from)).toMatch(/^Too many failed sign-ins/);
      expect(await attempt(email, PASSWORD, nextAddress())).toBe("signed in");
      const row = await db.selectFrom("sign_in_throttle").select("locked_until").where("key", "=", addressKey(from)).executeTakeFirstOrThrow();
      expect(row.locked_until).not.toBeNull();
    } finally {
      await db.deleteFrom("users").where("email", "=", email).execute();
    }
  }, 120_000);

  it("reads the client address from a reverse proxy's headers", () => {
    expect(clientAddress({ "x-forwarded-for": "203.0.113.9, 10.0.0.1" })).toBe("203.0.113.9");
    expect(clientAddress(new Headers({ "x-real-ip": "203.0.113.10" }))).toBe("203.0.113.10");
    expect(clientAddress({})).toBe("local");
    expect(clientAddress(undefined)).toBe("local");
  });
});
