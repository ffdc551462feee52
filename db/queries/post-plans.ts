// Post plans: proposing one for a room (computed here with the real planner from lib/guarding, so
// the API and the seed store the same thing), listing, approving under the rules, and the posts
// staffing counts (the latest approved plan per exhibition and room).
import type { Kysely } from "kysely";
import { db as appDb } from "../index";
import { toJson, type Database, type PostPlanMethod, type PostPlanOptions, type PostPlanRow } from "../schema";
import type { Point, Ring, Room } from "../../lib/geometry/types";
import { prepareRoom } from "../../lib/geometry/room";
import { triangulate } from "../../lib/geometry/triangulate";
import { createSightlines } from "../../lib/geometry/visibility";
import { clipToSightRange } from "../../lib/geometry/visibility-range";
import { certifyCoverage, type Region } from "../../lib/geometry/coverage";
import { planGuaranteed, type GuaranteedPlan } from "../../lib/guarding/guaranteed";
import { allowedPost, checkConstraints } from "../../lib/guarding/constraints";
import { planFewest } from "../../lib/guarding/fewest";

/** A problem with the room or the conditions, with where it shows on the drawing. */
export interface PlanProblem {
  code: string;
  message: string;
  at?: Point;
}

export interface ComputedPostPlan {
  method: PostPlanMethod;
  posts: Point[];
  lowerBound: number | null;
  proven: boolean;
  covered: number;
  uncovered: Region;
}

export interface PlanRequest {
  options: PostPlanOptions;
  /** "fewest" (default) or "guaranteed". */
  method?: PostPlanMethod;
  /** Seconds the fewest plan may take. */
  timeLimit?: number;
}

/**
 * Plans a room under the conditions. The fewest plan (set cover over witnesses, with a lower-bound
 * proof) by default; the guaranteed plan (triangulation and 3-colouring) on request, with pinned
 * posts added and posts in forbidden zones left out, and its coverage certified all the same.
 */
export async function computePostPlan(
  input: Room,
  request: PlanRequest,
): Promise<{ ok: true; plan: ComputedPostPlan } | { ok: false; problems: PlanProblem[] }> {
  const prepared = prepareRoom(input);
  if (!prepared.ok) return { ok: false, problems: prepared.problems };
  const room = prepared.room;
  const triangulation = triangulate(room);
  const guaranteed = planGuaranteed(room, triangulation);
  const constraints = {
    pinned: request.options.pinned,
    forbidden: request.options.forbidden,
    sightRange: request.options.sightRange ?? undefined,
    doubleCover: request.options.doubleCover,
  };
  const sightlines = createSightlines(room, triangulation);
  const problems = checkConstraints(room, sightlines, constraints);
  if (problems.length > 0) return { ok: false, problems };

  if ((request.method ?? "fewest") === "fewest") {
    const fewest = planFewest(room, {
      ...constraints,
      timeLimit: request.timeLimit ?? 10,
      triangulation,
      guaranteedPosts: guaranteed.posts,
    });
    // Out of time before every point was seen (often under double cover): the guaranteed plan
    // (two colour classes for double cover) still covers, so answer that instead.
    if (fewest.covered < 1) {
      const fallback = await computePostPlan(input, { ...request, method: "guaranteed" });
      if (fallback.ok && fallback.plan.covered === 1) return fallback;
    }
    return {
      ok: true,
      plan: {
        method: "fewest",
        posts: fewest.posts,
        lowerBound: fewest.lowerBound,
        proven: fewest.proven,
        covered: fewest.covered,
        uncovered: fewest.uncovered,
      },
    };
  }

  const key = (p: Point) => `${p[0]},${p[1]}`;
  const posts = [...request.options.pinned];
  const taken = new Set(posts.map(key));
  for (const post of request.options.doubleCover ? twoColourPosts(guaranteed) : guaranteed.posts) {
    if (!taken.has(key(post)) && allowedPost(post, constraints)) {
      posts.push(post);
      taken.add(key(post));
    }
  }
  const range = constraints.sightRange;
  const regions: Region[] = posts.map((post) => {
    const answer = sightlines.regionOf(post);
    if (!answer.ok || answer.region.length < 3) return [];
    return range ? clipToSightRange(answer.region, post, range) : [[answer.region]];
  });
  const certificate = certifyCoverage(room, regions, request.options.doubleCover ? 2 : 1);
  return {
    ok: true,
    plan: { method: "guaranteed", posts, lowerBound: null, proven: false, covered: certificate.covered, uncovered: certificate.uncovered },
  };
}

/**
 * Posts at the corners of two colour classes: every triangle has one corner of each colour and a
 * corner sees its whole triangle, so two classes see every point twice (double cover). The two
 * classes with the fewest distinct corners are taken.
 */
function twoColourPosts(plan: GuaranteedPlan): Point[] {
  const pointsOf: Set<number>[] = [new Set(), new Set(), new Set()];
  plan.triangles.forEach((triangle, i) => triangle.forEach((v, k) => pointsOf[plan.cornerColours[i][k]].add(v)));
  const [largest] = [0, 1, 2].sort((a, b) => pointsOf[b].size - pointsOf[a].size);
  const chosen = new Set<number>();
  for (let c = 0; c < 3; c++) if (c !== largest) for (const v of pointsOf[c]) chosen.add(v);
  return [...chosen].sort((a, b) => a - b).map((i) => [plan.points[i][0], plan.points[i][1]] as Point);
}

export interface PostPlanView {
  id: number;
  room_id: number;
  exhibition_id: number | null;
  room_version: number;
  method: PostPlanMethod;
  posts: Point[];
  lower_bound: number | null;
  proven: boolean;
  covered: number;
  options: PostPlanOptions;
  status: "proposed" | "approved";
  approved_by: number | null;
  approved_by_name: string | null;
  approved_at: string | null;
  created_at: string;
}

function view(row: PostPlanRow & { approved_by_name?: string | null }): PostPlanView {
  return {
    id: row.id,
    room_id: row.room_id,
    exhibition_id: row.exhibition_id,
    room_version: row.room_version,
    method: row.method,
    posts: row.posts,
    lower_bound: row.lower_bound,
    proven: row.proven,
    covered: row.covered,
    options: row.options,
    status: row.status,
    approved_by: row.approved_by,
    approved_by_name: row.approved_by_name ?? null,
    approved_at: row.approved_at ? row.approved_at.toISOString() : null,
    created_at: row.created_at.toISOString(),
  };
}

/** Stores a computed plan as 'proposed' for the room at `roomVersion`. */
export async function insertProposedPlan(
  plan: { roomId: number; exhibitionId: number | null; roomVersion: number; options: PostPlanOptions; computed: ComputedPostPlan },
  db: Kysely<Database> = appDb,
): Promise<PostPlanView> {
  const row = await db
    .insertInto("post_plans")
    .values({
      room_id: plan.roomId,
      exhibition_id: plan.exhibitionId,
      room_version: plan.roomVersion,
      method: plan.computed.method,
      posts: toJson(plan.computed.posts),
      lower_bound: plan.computed.lowerBound,
      proven: plan.computed.proven,
      covered: plan.computed.covered,
      options: toJson(plan.options),
    })
    .returningAll()
    .executeTakeFirstOrThrow();
  return view(row);
}

/** A room's plans, newest first (optionally only one exhibition's). */
export async function postPlansForRoom(roomId: number, exhibitionId?: number | null, db: Kysely<Database> = appDb): Promise<PostPlanView[]> {
  let query = db
    .selectFrom("post_plans")
    .leftJoin("users", "users.id", "post_plans.approved_by")
    .selectAll("post_plans")
    .select("users.name as approved_by_name")
    .where("post_plans.room_id", "=", roomId);
  if (exhibitionId !== undefined) {
    query = exhibitionId === null ? query.where("post_plans.exhibition_id", "is", null) : query.where("post_plans.exhibition_id", "=", exhibitionId);
  }
  return (await query.orderBy("post_plans.created_at", "desc").orderBy("post_plans.id", "desc").execute()).map(view);
}

/** Every plan of an exhibition with its room's name and current version, newest first. */
export async function postPlansForExhibition(exhibitionId: number, db: Kysely<Database> = appDb) {
  const rows = await db
    .selectFrom("post_plans")
    .innerJoin("rooms", "rooms.id", "post_plans.room_id")
    .leftJoin("users", "users.id", "post_plans.approved_by")
    .selectAll("post_plans")
    .select(["rooms.name as room_name", "rooms.version as current_room_version", "users.name as approved_by_name"])
    .where("post_plans.exhibition_id", "=", exhibitionId)
    .orderBy("rooms.name")
    .orderBy("post_plans.created_at", "desc")
    .orderBy("post_plans.id", "desc")
    .execute();
  return rows.map((row) => ({ ...view(row), room_name: row.room_name, current_room_version: row.current_room_version }));
}

export async function postPlanById(planId: number, db: Kysely<Database> = appDb): Promise<PostPlanView | null> {
  const row = await db
    .selectFrom("post_plans")
    .leftJoin("users", "users.id", "post_plans.approved_by")
    .selectAll("post_plans")
    .select("users.name as approved_by_name")
    .where("post_plans.id", "=", planId)
    .executeTakeFirst();
  return row ? view(row) : null;
}

export type Approval =
  | { ok: true; plan: PostPlanView; alreadyApproved: boolean }
  | { ok: false; reason: "not-found"; message: string }
  | { ok: false; reason: "stale"; message: string; roomVersion: number; planRoomVersion: number }
  | { ok: false; reason: "not-covered"; message: string; covered: number };

/**
 * Approves a plan when it was computed for the room's current walls and sees the whole floor; in
 * one transaction with the plan and room rows locked, so a concurrent wall edit cannot slip between
 * the check and the approval. Approving an approved plan again changes nothing.
 */
export async function approvePostPlan(planId: number, userId: number, db: Kysely<Database> = appDb): Promise<Approval> {
  return db.transaction().execute(async (trx) => {
    const plan = await trx.selectFrom("post_plans").selectAll().where("id", "=", planId).forUpdate().executeTakeFirst();
    if (!plan) return { ok: false, reason: "not-found", message: `There is no post plan ${planId}.` };
    const room = await trx.selectFrom("rooms").select(["version", "name"]).where("id", "=", plan.room_id).forShare().executeTakeFirstOrThrow();
    if (plan.room_version !== room.version) {
      return {
        ok: false,
        reason: "stale",
        message: `This plan was computed for version ${plan.room_version} of ${room.name}, but the room is now at version ${room.version}: someone changed its walls. Compute a new plan and approve that.`,
        roomVersion: room.version,
        planRoomVersion: plan.room_version,
      };
    }
    if (plan.covered < 1) {
      const percent = (plan.covered * 100).toFixed(1);
      return {
        ok: false,
        reason: "not-covered",
        message: `This plan sees ${percent}% of the floor${plan.options.doubleCover ? " twice" : ""}; only a plan that covers the whole room can be approved. Add or unpin posts, widen the sight range or shrink forbidden zones, then compute again.`,
        covered: plan.covered,
      };
    }
    if (plan.status === "approved") {
      return { ok: true, plan: (await postPlanById(planId, trx))!, alreadyApproved: true };
    }
    await trx.updateTable("post_plans").set({ status: "approved", approved_by: userId, approved_at: new Date() }).where("id", "=", planId).execute();
    return { ok: true, plan: (await postPlanById(planId, trx))!, alreadyApproved: false };
  });
}

/** A post as staffing and rosters know it. */
export interface ApprovedPost {
  /** Stable id for rosters: "R<room id>-P<n>". */
  id: string;
  /** The room's name. */
  room: string;
  /** Display label: "<room name> · post <n>". */
  label: string;
  /** ['high-value'] in a high-risk exhibition room, else []. */
  skills: string[];
  roomId: number;
  exhibitionId: number;
  planId: number;
  at: Point;
  /** False when the room's walls changed after the plan was approved (re-plan and approve again). */
  current: boolean;
}

/**
 * The posts staffing counts on `onDate` (YYYY-MM-DD) at a site: for each room of each exhibition
 * running that day, the posts of the latest approved plan. A room in two running exhibitions counts
 * once, with the latest approval.
 */
export async function approvedPostsForSite(siteId: number, onDate: string, db: Kysely<Database> = appDb): Promise<ApprovedPost[]> {
  const rows = await db
    .selectFrom("post_plans")
    .innerJoin("exhibitions", "exhibitions.id", "post_plans.exhibition_id")
    .innerJoin("exhibition_rooms", (join) =>
      join.onRef("exhibition_rooms.exhibition_id", "=", "post_plans.exhibition_id").onRef("exhibition_rooms.room_id", "=", "post_plans.room_id"),
    )
    .innerJoin("rooms", "rooms.id", "post_plans.room_id")
    .innerJoin("floors", "floors.id", "rooms.floor_id")
    .select([
      "post_plans.id",
      "post_plans.room_id",
      "post_plans.exhibition_id",
      "post_plans.posts",
      "post_plans.room_version",
      "rooms.name as room_name",
      "rooms.version as room_current_version",
      "exhibition_rooms.risk_level",
      "floors.level",
    ])
    .distinctOn("post_plans.room_id")
    .where("exhibitions.site_id", "=", siteId)
    .where("exhibitions.starts_on", "<=", onDate)
    .where("exhibitions.ends_on", ">=", onDate)
    .where("post_plans.status", "=", "approved")
    .orderBy("post_plans.room_id")
    .orderBy("post_plans.approved_at", "desc")
    .orderBy("post_plans.id", "desc")
    .execute();
  rows.sort((a, b) => a.level - b.level || a.room_name.localeCompare(b.room_name));
  return rows.flatMap((row) =>
    row.posts.map((at, index) => ({
      id: `R${row.room_id}-P${index + 1}`,
      room: row.room_name,
      label: `${row.room_name} · post ${index + 1}`,
      skills: row.risk_level === "high" ? ["high-value"] : [],
      roomId: row.room_id,
      exhibitionId: row.exhibition_id!,
      planId: row.id,
      at,
      current: row.room_version === row.room_current_version,
    })),
  );
}

export type { PostPlanOptions, Ring };

