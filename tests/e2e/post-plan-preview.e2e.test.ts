// POST /api/post-plans/preview against the built app with real next-auth sign-ins: 401 signed out,
// 403 for a guard, 200 with the `posts` command's room JSON (scripts/README.md) for a
// curator and for operations, 422 with the reason for a bad room, and nothing stored.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import type { Role } from "@/db/schema";
import { caller, signedIn, type Caller } from "./support/http";
import { testDb } from "./support/server";

const db = testDb();
const as: Partial<Record<Role, Caller>> = {};
const PATH = "/api/post-plans/preview";
// An L-shaped room: one post at the reflex corner sees it all (the classic example).
const lShaped = {
  type: "Feature",
  properties: { name: "preview-l" },
  geometry: { type: "Polygon", coordinates: [[[0, 0], [8, 0], [8, 3], [3, 3], [3, 9], [0, 9], [0, 0]]] },
};

function who(role: Role): Caller {
  const c = as[role];
  if (!c) throw new Error(`not signed in as ${role}`);
  return c;
}

async function storedPlans(): Promise<number> {
  const row = await db.selectFrom("post_plans").select((eb) => eb.fn.countAll<string>().as("n")).executeTakeFirstOrThrow();
  return Number(row.n);
}

beforeAll(async () => {
  for (const account of DEMO_ACCOUNTS) {
    const { who: signed, status } = await signedIn(account.email, DEMO_PASSWORD);
    if (status !== 200) throw new Error(`demo sign-in failed for ${account.email} (${status})`);
    as[account.role] = signed;
  }
});

afterAll(async () => {
  await db.destroy();
});

describe("plan preview API", () => {
  it("answers 401 signed out and 403 to a guard", async () => {
    const signedOut = await caller().request(PATH, { method: "POST", json: { room: lShaped } });
    expect(signedOut.status).toBe(401);
    const guard = await who("guard").request(PATH, { method: "POST", json: { room: lShaped } });
    expect(guard.status).toBe(403);
    expect(((await guard.json()) as { error: { code: string } }).error.code).toBe("forbidden");
  });

  it("answers the room JSON with a proven one-post plan to a curator and to operations, storing nothing", async () => {
    const before = await storedPlans();
    for (const role of ["curator", "operations"] as const) {
      const response = await who(role).request(PATH, { method: "POST", json: { room: lShaped, timeLimit: 2 } });
      expect(response.status, role).toBe(200);
      const { room } = (await response.json()) as { room: { name: string; vertices: number; fewest: { posts: number[][]; proven: boolean; covered: number } } };
      expect(room.name).toBe("preview-l");
      expect(room.vertices).toBe(6);
      expect(room.fewest.posts).toHaveLength(1);
      expect(room.fewest.proven).toBe(true);
      expect(room.fewest.covered).toBe(1);
    }
    expect(await storedPlans()).toBe(before);
  });

  it("refuses a bow-tie room with 422, the crossing walls and where, storing nothing", async () => {
    const before = await storedPlans();
    const bowTie = { type: "Polygon", coordinates: [[[0, 0], [4, 4], [4, 0], [0, 4], [0, 0]]] };
    const response = await who("curator").request(PATH, { method: "POST", json: bowTie });
    expect(response.status).toBe(422);
    const { error } = (await response.json()) as { error: { code: string; message: string; at?: number[] } };
    expect(error.message).toMatch(/cross|touch/);
    expect(error.at).toHaveLength(2);
    expect(await storedPlans()).toBe(before);
  });
});
