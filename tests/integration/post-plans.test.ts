// Post plans against the real PostgreSQL: seeding approved plans (idempotent), storing proposals,
// the approval rules (current room version, whole floor covered), the staffing view
// approvedPostsForSite, and the version-checked save of walls. One scratch database for the file.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql, type Kysely } from "kysely";
import { migrateToLatest } from "@/db/migrator";
import type { Database } from "@/db/schema";
import { EXHIBITION, FLOORS, seedDemoMuseum } from "@/db/seed";
import { SEED_APPROVER } from "@/db/seed/post-plans";
import { approvePostPlan, approvedPostsForSite, insertProposedPlan, postPlanById, postPlansForRoom } from "@/db/queries/post-plans";
import { planPostPlan } from "@/lib/guarding/plan-room";
import { roomDetail, saveRoomWalls } from "@/db/queries/rooms";
import type { Point, Ring, Room } from "@/lib/geometry/types";
import { createDb } from "@/db";
import { requireDatabaseUrl, urlForDatabase } from "./support/database";

// A scratch database kept for the whole file (the seed with plans takes a few seconds).
const name = `sightward_scratch_postplans_${process.pid}`;
let admin: Kysely<Database>;
let db: Kysely<Database>;

async function planRows() {
  const { rows } = await sql<{ digest: string | null; count: string }>`
    select count(*) as count, md5(string_agg(p::text, '|' order by p.id)) as digest from post_plans p`.execute(db);
  return { count: Number(rows[0].count), digest: rows[0].digest ?? "" };
}

async function roomId(roomName: string): Promise<number> {
  return (await db.selectFrom("rooms").select("id").where("name", "=", roomName).executeTakeFirstOrThrow()).id;
}

// ── An independent check of coverage: line of sight by segment tests written here ───────────────

/** Proper or touching intersection of segments ab and cd, by orientation signs. */
function crosses(a: Point, b: Point, c: Point, d: Point): boolean {
  const o = (p: Point, q: Point, r: Point) => Math.sign((q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0]));
  return o(a, b, c) * o(a, b, d) < 0 && o(c, d, a) * o(c, d, b) < 0;
}

function insideRing(p: Point, ring: Ring): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > p[1] !== yj > p[1] && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** Posts that see p: no wall properly crosses the sightline, and within the sight range. */
function postsSeeing(room: Room, posts: Point[], p: Point, range: number | null): number {
  const walls: [Point, Point][] = [];
  for (const ring of [room.outline, ...room.obstacles]) ring.forEach((a, i) => walls.push([a, ring[(i + 1) % ring.length]]));
  return posts.filter((post) => {
    if (range !== null && Math.hypot(post[0] - p[0], post[1] - p[1]) > range) return false;
    return !walls.some(([a, b]) => crosses(post, p, a, b));
  }).length;
}

/** Grid points strictly inside the floor, kept a little away from walls (sightlines graze corners). */
function samplePoints(room: Room, step: number): Point[] {
  const xs = room.outline.map((p) => p[0]);
  const ys = room.outline.map((p) => p[1]);
  const points: Point[] = [];
  for (let x = Math.min(...xs) + step / 2; x < Math.max(...xs); x += step) {
    for (let y = Math.min(...ys) + step / 3; y < Math.max(...ys); y += step) {
      const p: Point = [x, y];
      if (insideRing(p, room.outline) && !room.obstacles.some((o) => insideRing(p, o))) points.push(p);
    }
  }
  return points;
}

beforeAll(async () => {
  const url = requireDatabaseUrl();
  admin = createDb(url, { max: 1 });
  await sql`drop database if exists ${sql.id(name)} with (force)`.execute(admin);
  await sql`create database ${sql.id(name)}`.execute(admin);
  db = createDb(urlForDatabase(url, name), { max: 4 });
  await migrateToLatest(db);
}, 120_000);

afterAll(async () => {
  await db?.destroy();
  if (!admin) return;
  // Closed connections leave the server a moment later; dropping by force before that would kill
  // them mid-goodbye (an uncaught "terminating connection" in this process).
  for (let attempt = 0; ; attempt++) {
    try {
      await sql`drop database if exists ${sql.id(name)}`.execute(admin);
      break;
    } catch (error) {
      if (attempt >= 20) throw error;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  }
  await admin.destroy();
});

describe("seeded post plans", () => {
  it("the seed approves one covering plan per exhibition room, and seeding again changes nothing", async () => {
    const first = await seedDemoMuseum(db, { postPlans: true });
    expect(first?.postPlans).toBe(EXHIBITION.rooms.length);
    const before = await planRows();
    expect(before.count).toBe(EXHIBITION.rooms.length);
    const second = await seedDemoMuseum(db, { postPlans: true });
    expect(second?.postPlans).toBe(0);
    expect(await planRows()).toEqual(before);
  }, 120_000);

  it("each seeded plan is approved by operations, for the room's current version, within the published bound", async () => {
    const approver = await db.selectFrom("users").select("id").where("email", "=", SEED_APPROVER).executeTakeFirstOrThrow();
    for (const entry of EXHIBITION.rooms) {
      const id = await roomId(entry.room);
      const [plan] = await postPlansForRoom(id, undefined, db);
      const room = FLOORS.flatMap((f) => f.rooms).find((r) => r.name === entry.room)!;
      expect(plan.status).toBe("approved");
      expect(plan.approved_by).toBe(approver.id);
      expect(plan.room_version).toBe(1);
      expect(plan.covered).toBe(1);
      expect(plan.options).toMatchObject({ sightRange: entry.sight_range, doubleCover: entry.double_cover });
      const n = room.outline.length + room.obstacles.reduce((s, o) => s + o.length, 0);
      const h = room.obstacles.length;
      // Without double cover or a sight range no plan needs more than floor((n + 2h) / 3) posts
      // (O'Rourke, Art Gallery Theorems and Algorithms, 1987, Thm 5.1, as recalled).
      if (!entry.double_cover && entry.sight_range === null) expect(plan.posts.length).toBeLessThanOrEqual(Math.floor((n + 2 * h) / 3));
      // Checked here by sightlines on a 0.5 m grid: every sample sees one post (two for double cover).
      const missed = samplePoints(room, 0.5).filter((p) => postsSeeing(room, plan.posts, p, entry.sight_range) < (entry.double_cover ? 2 : 1));
      expect(missed, `${entry.room}: points no post sees`).toEqual([]);
    }
  });
});

describe("approvedPostsForSite", () => {
  it("lists each approved post with a stable id, the room and the skills its risk level asks for", async () => {
    const site = await db.selectFrom("sites").select("id").executeTakeFirstOrThrow();
    const posts = await approvedPostsForSite(site.id, EXHIBITION.starts_on, db);
    const expected = await Promise.all(
      EXHIBITION.rooms.map(async (entry) => {
        const id = await roomId(entry.room);
        const [plan] = await postPlansForRoom(id, undefined, db);
        return plan.posts.map((_, i) => ({
          id: `R${id}-P${i + 1}`,
          room: entry.room,
          label: `${entry.room} · post ${i + 1}`,
          skills: entry.risk_level === "high" ? ["high-value"] : [],
        }));
      }),
    );
    const simplify = (list: { id: string; room: string; label: string; skills: string[] }[]) =>
      list.map(({ id, room, label, skills }) => ({ id, room, label, skills })).sort((a, b) => a.id.localeCompare(b.id));
    expect(simplify(posts)).toEqual(simplify(expected.flat()));
    expect(new Set(posts.map((p) => p.id)).size).toBe(posts.length);
  });

  it("has nothing on a day no exhibition runs", async () => {
    const site = await db.selectFrom("sites").select("id").executeTakeFirstOrThrow();
    expect(await approvedPostsForSite(site.id, "2020-01-01", db)).toEqual([]);
    const dayAfter = new Date(Date.parse(EXHIBITION.ends_on + "T00:00:00Z") + 86_400_000).toISOString().slice(0, 10);
    expect(await approvedPostsForSite(site.id, dayAfter, db)).toEqual([]);
  });
});

describe("proposing and approving", () => {
  const options = { sightRange: null, doubleCover: false, pinned: [] as Point[], forbidden: [] as Ring[] };

  it("approves a covering plan for the current walls; the newest approval is the one staffing counts", async () => {
    const id = await roomId("Poster Corridor");
    const room = (await roomDetail(id, db))!;
    const exhibitionId = room.exhibitions[0].id;
    const computed = planPostPlan(room, { options, method: "guaranteed" });
    if (!computed.ok) throw new Error(JSON.stringify(computed.problems));
    const proposal = await insertProposedPlan({ roomId: id, exhibitionId, roomVersion: room.version, options, computed: computed.plan }, db);
    expect(proposal.status).toBe("proposed");
    const operations = await db.selectFrom("users").select("id").where("role", "=", "operations").executeTakeFirstOrThrow();
    const approval = await approvePostPlan(proposal.id, operations.id, db);
    expect(approval).toMatchObject({ ok: true, alreadyApproved: false });
    const again = await approvePostPlan(proposal.id, operations.id, db);
    expect(again).toMatchObject({ ok: true, alreadyApproved: true });

    const site = await db.selectFrom("sites").select("id").executeTakeFirstOrThrow();
    const posts = (await approvedPostsForSite(site.id, EXHIBITION.starts_on, db)).filter((p) => p.roomId === id);
    expect(posts.map((p) => p.at)).toEqual(computed.plan.posts);
    expect(posts.every((p) => p.planId === proposal.id && p.current)).toBe(true);
  });

  it("refuses a plan that does not see the whole floor, and changes nothing", async () => {
    const id = await roomId("Textile Gallery");
    const room = (await roomDetail(id, db))!;
    // One pinned post with a 2 m sight range cannot watch an 18 × 12 m gallery.
    const narrow = { ...options, sightRange: 2, pinned: [[1, 1]] as Point[], forbidden: [[[0, 0], [18, 0], [18, 12], [0, 12]]] as Ring[] };
    const computed = planPostPlan(room, { options: { ...narrow, forbidden: [] }, method: "guaranteed" });
    if (!computed.ok) throw new Error(JSON.stringify(computed.problems));
    const partial = { ...computed.plan, posts: [[1, 1]] as Point[], covered: 0.05 };
    const proposal = await insertProposedPlan({ roomId: id, exhibitionId: null, roomVersion: room.version, options: { ...narrow, forbidden: [] }, computed: partial }, db);
    const before = await planRows();
    const approval = await approvePostPlan(proposal.id, 1, db);
    expect(approval).toMatchObject({ ok: false, reason: "not-covered" });
    if (!approval.ok) expect(approval.message).toMatch(/sees 5\.0% of the floor/);
    expect(await planRows()).toEqual(before);
  });

  it("refuses a plan computed for walls that have changed since (stale room version), and changes nothing", async () => {
    const id = await roomId("Print Room");
    const room = (await roomDetail(id, db))!;
    const computed = planPostPlan(room, { options, method: "guaranteed" });
    if (!computed.ok) throw new Error(JSON.stringify(computed.problems));
    const proposal = await insertProposedPlan({ roomId: id, exhibitionId: null, roomVersion: room.version, options, computed: computed.plan }, db);

    // The curator moves the table: the room moves to the next version.
    const saved = await saveRoomWalls(id, { outline: room.outline, obstacles: [[[4, 3], [4, 5.5], [8, 5.5], [8, 3]]] }, room.version, db);
    expect(saved).toMatchObject({ ok: true, version: room.version + 1 });
    const before = await planRows();
    const approval = await approvePostPlan(proposal.id, 1, db);
    expect(approval).toMatchObject({ ok: false, reason: "stale", roomVersion: room.version + 1, planRoomVersion: room.version });
    expect(await planRows()).toEqual(before);
    expect((await postPlanById(proposal.id, db))!.status).toBe("proposed");
  });

  it("an unknown plan is not found", async () => {
    expect(await approvePostPlan(999_999, 1, db)).toMatchObject({ ok: false, reason: "not-found" });
  });
});

describe("saving walls", () => {
  it("a save over a stale version writes nothing and says which version is current", async () => {
    const id = await roomId("Jewellery Room");
    const room = (await roomDetail(id, db))!;
    const moved = { outline: room.outline.map(([x, y]) => [x + 1, y] as Point), obstacles: room.obstacles };
    expect(await saveRoomWalls(id, moved, room.version, db)).toMatchObject({ ok: true, version: room.version + 1 });
    const stale = await saveRoomWalls(id, { outline: room.outline, obstacles: [] }, room.version, db);
    expect(stale).toEqual({ ok: false, reason: "stale", currentVersion: room.version + 1 });
    const after = (await roomDetail(id, db))!;
    expect(after.outline).toEqual(moved.outline);
    expect(after.obstacles).toEqual(room.obstacles);
    expect(await saveRoomWalls(999_999, moved, 1, db)).toEqual({ ok: false, reason: "not-found" });
  });
});
