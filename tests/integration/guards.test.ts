// People through the route handlers in-process on the real PostgreSQL and the mail fake:
// operations adds a guard, who gets an account and an invitation mail; bad input gets 422 naming the
// field and writes nothing; an address already on the staff gets 409; an edit changes contract,
// limits and skills; a guard taken off the staff is no longer among those a roster staffs; curators
// and guards get 403. A scratch site of its own keeps the demo staff as it is.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the modules.
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { POST } from "@/app/api/guards/route";
import { PUT } from "@/app/api/guards/[id]/route";
import { POST as importStaff } from "@/app/api/guards/import/route";
import { createSite } from "@/db/queries/galleries";
import { activeGuardsOfSite } from "@/db/queries/rosters";
import { NO_PASSWORD } from "@/db/queries/accounts";
import { listCaughtMail } from "@/lib/mail";
import { requireDatabaseUrl } from "./support/database";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

let db: Kysely<Database>;
let siteId: number;
let operations: SignedUser;
let curator: SignedUser;
const EMAIL = `new.guard.${process.pid}@example.org`;
const IMPORTED = [`import.one.${process.pid}@example.org`, `import.two.${process.pid}@example.org`];

const json = async (response: Response) => ({ status: response.status, body: (await response.json()) as Record<string, any> });
const add = async (user: SignedUser, body: unknown) => json(await POST(await signedRequest(user, "http://127.0.0.1/api/guards", body), { params: Promise.resolve({}) }));
const edit = async (user: SignedUser, id: number, body: unknown) => json(await PUT(await signedRequest(user, `http://127.0.0.1/api/guards/${id}`, body, "PUT"), { params: Promise.resolve({ id: String(id) }) }));
const guardCount = async () => Number((await db.selectFrom("guards").select((eb) => eb.fn.countAll<string>().as("n")).where("site_id", "=", siteId).executeTakeFirstOrThrow()).n);

beforeAll(async () => {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) throw new Error("SMTP_PORT and MAIL_DIR are not set: run this through npm test (it starts the mail fake)");
  db = createDb(requireDatabaseUrl(), { max: 2 });
  [operations, curator] = await Promise.all([userByEmail(db, "operations@example.org"), userByEmail(db, "curator@example.org")]);
  await db.deleteFrom("sites").where("name", "=", "People test site").execute();
  await db.deleteFrom("users").where("email", "=", EMAIL).execute();
  siteId = (await createSite(db, { name: "People test site", time_zone: "Europe/Berlin", currency: "EUR", hourly_rate: 22 })).id;
});

afterAll(async () => {
  await db.deleteFrom("sites").where("id", "=", siteId).execute();
  await db.deleteFrom("users").where("email", "in", [EMAIL, ...IMPORTED]).execute();
  await db.destroy();
});

describe("People", () => {
  const good = () => ({ siteId, name: "Noor Example", email: EMAIL, contractHours: 32, maxHours: 48, acceptedExtraHours: 4, skills: ["High-Value", "first-aid", "high-value"] });
  let guardId: number;

  it("refuses other roles and bad input, writing nothing", async () => {
    expect((await add(curator, good())).status).toBe(403);
    for (const [change, field, pattern] of [
      [{ contractHours: 50, maxHours: 48 }, "contractHours", /cannot exceed the maximum/],
      [{ maxHours: 0 }, "maxHours", /more than 0/],
      [{ acceptedExtraHours: -1 }, "acceptedExtraHours", /cannot be negative/],
      [{ email: "nope" }, "email", /e-mail address/],
      [{ skills: ["first aid!"] }, "skills.0", /short word/],
    ] as const) {
      const answer = await add(operations, { ...good(), ...change });
      expect(answer.status, JSON.stringify(change)).toBe(422);
      expect(answer.body.error.field).toBe(field);
      expect(answer.body.error.message).toMatch(pattern);
    }
    expect(await guardCount()).toBe(0);
  });

  it("adds a guard with an account and mails the invitation; the same address again gets 409", async () => {
    const answer = await add(operations, good());
    expect(answer.status).toBe(201);
    expect(answer.body.invitation.mailed).toBe(true);
    guardId = answer.body.guard.id;
    const row = await db.selectFrom("guards").innerJoin("users", "users.id", "guards.user_id").select(["guards.skills", "guards.contract_hours", "users.role", "users.password_hash"]).where("guards.id", "=", guardId).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ skills: ["high-value", "first-aid"], role: "guard", password_hash: NO_PASSWORD });
    expect(Number(row.contract_hours)).toBe(32);
    await expect.poll(async () => (await listCaughtMail({ to: EMAIL })).map((m) => m.subject)).toContain("Your Sightward account");
    expect((await add(operations, good())).status).toBe(409);
  });

  it("edits a guard, and one taken off the staff is no longer rostered", async () => {
    const { siteId: _site, ...fields } = good();
    const changed = await edit(operations, guardId, { ...fields, contractHours: 20, skills: ["evening"], active: true });
    expect(changed.status).toBe(200);
    expect((await activeGuardsOfSite(db, siteId)).map((g) => [g.id, Number(g.contract_hours), g.skills])).toEqual([[guardId, 20, ["evening"]]]);
    const left = await edit(operations, guardId, { ...fields, active: false });
    expect(left.status).toBe(200);
    expect(await activeGuardsOfSite(db, siteId)).toEqual([]);
    expect(await guardCount()).toBe(1);
    expect((await edit(curator, guardId, { ...fields, active: true })).status).toBe(403);
    expect((await edit(operations, 2_000_000_000, { ...fields, active: true })).status).toBe(404);
  });

  it("imports staff from CSV: a bad file saves nothing; a good one adds every guard, previewed first", async () => {
    const ask = async (csv: string, dryRun: boolean) => json(await importStaff(await signedRequest(operations, "http://127.0.0.1/api/guards/import", { siteId, csv, dryRun }), { params: Promise.resolve({}) }));
    const before = await guardCount();
    const bad = await ask(`name,email,contract_hours\nOne,${IMPORTED[0]},30\nTwo,${IMPORTED[1]},99\n`, false);
    expect(bad.status).toBe(422);
    expect(bad.body.error.problems).toContainEqual({ line: 3, column: "contract_hours", message: expect.stringMatching(/at most 60/) });
    expect(bad.body.error.problems.every((p: { line: number }) => p.line === 3)).toBe(true);
    expect(await guardCount()).toBe(before);
    // An address already on the staff is a problem of the file too.
    const taken = await ask(`name,email,contract_hours\nAgain,${EMAIL},30\n`, true);
    expect(taken.status).toBe(422);
    expect(taken.body.error.problems[0]).toMatchObject({ line: 2, column: "email" });
    const good = `name,email,contract_hours,skills\nOne,${IMPORTED[0]},30,first-aid\nTwo,${IMPORTED[1]},20,\n`;
    const preview = await ask(good, true);
    expect(preview.status).toBe(200);
    expect(preview.body.preview.map((r: { email: string }) => r.email)).toEqual(IMPORTED);
    expect(await guardCount()).toBe(before);
    const done = await ask(good, false);
    expect(done.status).toBe(201);
    expect(done.body.imported).toHaveLength(2);
    expect(await guardCount()).toBe(before + 2);
    const accounts = await db.selectFrom("users").select(["email", "role"]).where("email", "in", IMPORTED).orderBy("email").execute();
    expect(accounts).toEqual(IMPORTED.map((email) => ({ email, role: "guard" })).sort((a, b) => a.email.localeCompare(b.email)));
    expect((await importStaff(await signedRequest(curator, "http://127.0.0.1/api/guards/import", { siteId, csv: good }), { params: Promise.resolve({}) })).status).toBe(403);
  });
});
