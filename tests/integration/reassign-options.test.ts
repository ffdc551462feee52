// Reassign that helps, through the route handlers in-process on the real PostgreSQL: for an
// unfilled high-value hour of a demo week, the list puts the guards who can take it first (each
// with the skill, and the change then goes through), the others after with the rule they would
// break (the change is then refused with that rule); no message names a post by its internal id.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the modules.
vi.mock("server-only", () => ({}));

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { GET as optionsRoute, POST as reassignRoute } from "@/app/api/rosters/[id]/reassign/route";
import { buildDraftRoster } from "@/lib/rosters/build";
import type { ReassignOption } from "@/lib/rosters/edit";
import { requireDatabaseUrl } from "./support/database";
import { mondayAhead } from "./support/rosters";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

/** Sixteen weeks ahead: clear of the other roster tests' weeks. */
const WEEK = mondayAhead(112);
let db: Kysely<Database>;
let draftId: number;
let operations: SignedUser;
let guard: SignedUser;
let slot: { post: string; start: string };

const context = () => ({ params: Promise.resolve({ id: String(draftId) }) });
const INTERNAL_POST_ID = /\bR\d+-P\d+\b/;

async function options(user: SignedUser, query: string) {
  const response = await optionsRoute(await signedRequest(user, `http://127.0.0.1/api/rosters/${draftId}/reassign?${query}`), context());
  return { status: response.status, body: (await response.json()) as { options: ReassignOption[]; error?: { code: string; message: string; field?: string } } };
}

async function reassign(toGuardId: number) {
  const { revision } = await db.selectFrom("rosters").select("revision").where("id", "=", draftId).executeTakeFirstOrThrow();
  const body = { revision, from: { guardId: null, post: slot.post, start: slot.start }, toGuardId };
  const response = await reassignRoute(await signedRequest(operations, `http://127.0.0.1/api/rosters/${draftId}/reassign`, body), context());
  return { status: response.status, body: (await response.json()) as Record<string, any> };
}

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 3 });
  const siteId = (await db.selectFrom("sites").select("id").orderBy("id").executeTakeFirstOrThrow()).id;
  [operations, guard] = await Promise.all([userByEmail(db, "operations@example.org"), userByEmail(db, "guard@example.org")]);
  await db.deleteFrom("rosters").where("site_id", "=", siteId).where("starts_on", "=", WEEK).execute();
  draftId = (await buildDraftRoster(db, { siteId, startsOn: WEEK, userId: operations.id })).rosterId;
  const roster = await db.selectFrom("rosters").select(["unfilled", "scenario"]).where("id", "=", draftId).executeTakeFirstOrThrow();
  const skilled = new Set((roster.scenario as { posts: { id: string; skills: string[] }[] }).posts.filter((p) => p.skills.includes("high-value")).map((p) => p.id));
  const unfilled = roster.unfilled.find((u) => skilled.has(u.post));
  if (!unfilled) throw new Error("the demo week was expected to leave a high-value hour unfilled (8 high-value posts, 8 qualified guards)");
  slot = { post: unfilled.post, start: unfilled.start };
}, 120_000);

afterAll(async () => {
  await db?.destroy();
});

describe("reassign options", () => {
  it("lists the guards who can take the hour first, with hours so far, then the others with the rule", async () => {
    const { status, body } = await options(operations, new URLSearchParams(slot).toString());
    expect(status).toBe(200);
    const list = body.options;
    const guards = await db.selectFrom("guards").select(["id", "skills"]).execute();
    expect(list.length).toBe(guards.length);
    const firstRefused = list.findIndex((o) => !o.ok);
    // Everyone who can take it comes before everyone who cannot.
    expect(list.slice(firstRefused === -1 ? list.length : firstRefused).every((o) => !o.ok)).toBe(true);
    for (const o of list) {
      const skills = guards.find((g) => g.id === o.guardId)!.skills;
      if (o.ok) expect(skills, o.name).toContain("high-value");
      else {
        expect(o.rule).toBeTruthy();
        expect(o.reason).toBeTruthy();
        expect(o.reason!).not.toMatch(INTERNAL_POST_ID);
        // Without the skill the rule is skills, unless the guard stands at another post then.
        if (!skills.includes("high-value")) expect(["skills", "one-place"]).toContain(o.rule);
        expect(o.rules).toContain(o.rule);
      }
      expect(o.hoursSoFar).toBeGreaterThanOrEqual(0);
    }
    const able = list.filter((o) => o.ok);
    for (let i = 1; i < able.length; i++) expect(able[i]!.hoursSoFar).toBeGreaterThanOrEqual(able[i - 1]!.hoursSoFar);

    // A refused guard's change is refused with that rule; then a listed one goes through.
    const refused = list.find((o) => !o.ok && o.rule === "skills")!;
    const no = await reassign(refused.guardId);
    expect(no.status).toBe(422);
    expect(no.body.error.message).toMatch(/rule skills/);
    expect(no.body.error.message).not.toMatch(INTERNAL_POST_ID);
    if (able.length > 0) {
      const yes = await reassign(able[0]!.guardId);
      expect(yes.status).toBe(200);
    }
  }, 60_000);

  it("stores unfilled reasons and violations with rooms and post numbers, never an internal post id", async () => {
    const roster = await db.selectFrom("rosters").select(["unfilled", "violations"]).where("id", "=", draftId).executeTakeFirstOrThrow();
    expect(roster.unfilled.length).toBeGreaterThan(0);
    expect(roster.unfilled.filter((u) => INTERNAL_POST_ID.test(u.reason)).map((u) => u.reason)).toEqual([]);
    expect(roster.violations.filter((v) => INTERNAL_POST_ID.test(v.message))).toEqual([]);
  });

  it("refuses guards (403) and a bad query (400) with a message", async () => {
    expect((await options(guard, new URLSearchParams(slot).toString())).status).toBe(403);
    const missing = await options(operations, `start=${encodeURIComponent(slot.start)}`);
    expect(missing.status).toBe(400);
    expect(missing.body.error?.message).toMatch(/post/);
    const badStart = await options(operations, `post=${slot.post}&start=yesterday`);
    expect(badStart.status).toBe(400);
    expect(badStart.body.error?.message).toMatch(/start must be an ISO date-time/);
  });
});
